// Maximum principle: without sources or imposed heat (no flux_W_m2, power_W or source_W_m3), every term at a face pulls
// the face towards a temperature of its own (fluid, surroundings, plate, held value), so no temperature may leave the
// range of the initial temperature and those temperatures (Protter & Weinberger, Maximum Principles in Differential
// Equations, 1967, ch. 3; for the implicit scheme, the M-matrix argument of Patankar 1980 §4.3).

import { describe, expect, it } from 'vitest';
import { evolveDefaults } from '../../sim/time/evolve.ts';
import { scenarioDefaults } from '../../sim/scenario/scenario.ts';
import { randomScenario, runOk, seededRandom } from '../support/scenarios.ts';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';

const SEEDS = Array.from({ length: 30 }, (_, i) => i + 1);

/** The coldest and hottest temperature the scenario names (initial, ambient, and every face term's own). */
function bounds(s: ScenarioFile): [number, number] {
  const temps = [s.initial_C ?? s.ambient_C, s.ambient_C];
  for (const seg of [...s.bottom, ...s.top]) {
    for (const t of [seg.fixed_C, seg.fluid_C, seg.surroundings_C, seg.plate?.temperature_C]) if (t !== undefined) temps.push(t);
  }
  return [Math.min(...temps), Math.max(...temps)];
}

describe('maximum principle (random scenarios without heat inputs)', () => {
  it.each(SEEDS)('record temperatures of passive random scenario #%i stay within [min, max] of its own temperatures', (seed) => {
    const scenario = randomScenario(seededRandom(seed * 32452843), { heatInputs: false, natural: true, plainNumbers: false, constantCp: false });
    const { record } = runOk(scenario);
    const [lo, hi] = bounds(scenario);
    // Slack: Newton stops when its update is ≤ newtonShare·tolerance_K (evolveDefaults, scenarioDefaults), so a state
    // may sit that far from the exact discrete solution, which itself obeys the bounds (L-stable steps, M-matrix
    // Jacobian). Twice that, at least 1e-6 K. Measured: ≤ 1e-13 K.
    const slack = Math.max(2 * evolveDefaults.newtonShare * scenarioDefaults.toleranceK, 1e-6);
    const all = [...record.layers.flatMap((l) => [...l.minC, ...l.maxC]), ...record.bottomC, ...record.topC, ...record.probes.tC.flat()];
    const coldest = Math.min(...all);
    const hottest = Math.max(...all);
    expect(coldest, `coldest ${coldest} °C against the bound ${lo} °C`).toBeGreaterThanOrEqual(lo - slack);
    expect(hottest, `hottest ${hottest} °C against the bound ${hi} °C`).toBeLessThanOrEqual(hi + slack);
  });
});
