// The lumped network (one node per layer, odex) seen through the same solver-neutral observation as the grid
// (sim/physics/observation.ts) and summarised by the same recorder and verdicts (sim/run.ts runLumpedProblem).
// References: the first law (the stored heat changes by what the face and generation channels carry in; odex's
// extrapolated midpoint steps are linear combinations of rate evaluations, so this linear invariant holds to round-off:
// Hairer, Lubich & Wanner, Geometric Numerical Integration, §IV.1, from memory); the network's own trace (runLumped,
// the same equations without the ledger components); and the grid within the lumped model's Biot error (Incropera
// §5.1–5.2, as in lumped-cross-check.test.ts).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runLumped } from '../../sim/lumped/lumped.ts';
import { firstCrossing, heatOffTime } from '../../sim/observe/verdict.ts';
import { runLumpedProblem, runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { assertClose } from '../support/assert-close.ts';

const example = (file: string) => {
  const parsed = parseScenario(JSON.parse(readFileSync(new URL(`../../examples/${file}`, import.meta.url), 'utf8')));
  if (!parsed.ok) throw new Error(`${file} does not parse`);
  return parsed.problem;
};

describe('runLumpedProblem() on the bench coupon', () => {
  const problem = example('bench-coupon.json');
  const full = runLumpedProblem(problem);
  const summary = runLumpedProblem(problem, { detail: 'summary' });
  if (full.status !== 'ok' || summary.status !== 'ok') throw new Error('the lumped network failed on the bench coupon');

  it('books the heat of its channels exactly: the ledger closes to 1e-12 (measured 2e-14)', () => {
    expect(full.summary.energy.imbalance_rel).toBeLessThan(1e-12);
    expect(full.summary.energy.in_J_m2).toBeGreaterThan(0);
    expect(full.record.energy.edgeInJ).toBeUndefined();
  });

  it('gives the same summary with detail "summary" as with the full record', () => {
    expect(summary.summary).toEqual(full.summary);
    expect(summary.record.tS.length).toBeLessThanOrEqual(problem.layers.length + 2);
  });

  it('half-freezes where the network\'s own trace does (runLumped), within 0.5 s (measured 0.08 s: the ledger components join the step control)', () => {
    const trace = runLumped(problem);
    const heatOff = heatOffTime(problem)!;
    const own = firstCrossing(Float64Array.from(trace.tS), Float64Array.from(trace.separatorLiquid), 0.5, heatOff, 'fall-below')!;
    assertClose(full.summary.separator.half_frozen_at_s!, own, { abs: 0.5 }, 'half-frozen time, s');
  });

  it('agrees with the grid on the time from heat-off to half-frozen within the Biot error (15 %)', () => {
    const grid = runProblem(problem, { detail: 'summary' });
    if (grid.status !== 'ok') throw new Error(grid.status);
    const heatOff = heatOffTime(problem)!;
    assertClose(full.summary.separator.half_frozen_at_s! - heatOff, grid.summary.separator.half_frozen_at_s! - heatOff, { rel: 0.15 }, 'time from heat-off to half-frozen, s');
  });

  it('refuses what the network does not model, naming it, through either entry: a heater face, side-wall terms', () => {
    expect(() => runLumpedProblem(example('heater-plate-lift-off.json'))).toThrow(/heater/);
    expect(() => runLumpedProblem(example('sleeved-square-cell.json'))).toThrow(/cell terms/);
    // runLumped() alone once returned a trace that left the side-wall terms out, silently.
    expect(() => runLumped(example('sleeved-square-cell.json'))).toThrow(/cell terms/);
  });
});
