// The run-time ceiling (issue 9, "Run time has a stated ceiling per cell and simulated second"): work that can be
// bounded before a run (cells × the steps max_step_s forces, cells × the steps the tolerances need as accuracy.ts
// models them, with the accuracy plan's grid factor counted) is refused at validation naming the field, the value and
// the limit; a run that meets the ceiling mid-way ends with a message naming it. The limits are ours
// (scenario-limits.ts, step-guards.ts); what the tests hold is that the three numbers agree with each other and that
// each refusal and stop states the limit in force and the value given. No wall time is measured here.

import { describe, expect, it } from 'vitest';
import { accuracyDefaults } from '../../sim/scenario/accuracy.ts';
import { parseScenario, scenarioDefaults } from '../../sim/scenario/scenario.ts';
import { scenarioLimitDefaults as LIMIT } from '../../sim/scenario/scenario-limits.ts';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { runProblem, stopSentence } from '../../sim/run.ts';
import { heldThermostatDefaults as HELD } from '../../sim/physics/heater.ts';
import { evolveDefaults } from '../../sim/time/evolve.ts';
import { budgetMessage, budgetSpent, heldBackSentence, switchingSentence, stepGuardDefaults as GUARD } from '../../sim/time/step-guards.ts';
import demo from '../../examples/bench-coupon.json' with { type: 'json' };
import heaterDemo from '../../examples/heater-plate-lift-off.json' with { type: 'json' };
import { parseOk, PLAIN, scenario } from '../support/scenarios.ts';

/** One 10 mm layer of an invented material (40 cells at the default 4 cells/mm), held hot below, cooled above. */
const plate = (numerics: ScenarioFile['numerics'] = {}): ScenarioFile => scenario({
  duration_s: 1000, materials: { m: PLAIN },
  layers: [{ id: 'slab', material: 'm', thickness_mm: 10 }],
  bottom: [{ from_s: 0, fixed_C: 200 }], top: [{ from_s: 0, convection_W_m2K: 10 }],
  numerics,
});

function onlyError(s: ScenarioFile): { path: string; message: string } {
  const parsed = parseScenario(s);
  expect(parsed.ok, 'the scenario was accepted').toBe(false);
  const errors = parsed.ok ? [] : parsed.errors;
  expect(errors, JSON.stringify(errors)).toHaveLength(1);
  return errors[0]!;
}

describe('run-time ceiling: the limits agree', () => {
  it('max_step_s may not force more cell-steps than the ceiling in cell-sweeps allows at the fewest sweeps a step takes', () => {
    expect(LIMIT.maxForcedCellSteps * GUARD.minSweepsPerStep).toBeLessThanOrEqual(GUARD.maxCellSweeps);
    expect(LIMIT.maxForcedCellSteps).toBeLessThanOrEqual(GUARD.maxCellSteps);
  });

  it('the modelled-steps limit is the budget accuracy.ts plans against', () => {
    expect(LIMIT.maxModelledCellSteps).toBe(accuracyDefaults.workBudgetCellSteps);
  });
});

describe('parseScenario() refuses work beyond the ceiling', () => {
  it('accepts the plate at its defaults and at max_step_s that forces 1e5 steps of its 40 cells', () => {
    expect(parseScenario(plate()).ok).toBe(true);
    // 40 cells × 1e5 steps = 4e6 cell-steps, within 2e7
    expect(parseScenario(plate({ max_step_s: 0.01 })).ok).toBe(true);
  });

  it('counts the cells of the accuracy plan\'s refined grid in cells × forced steps, naming max_step_s and the step that fits', () => {
    // 0.03 s of 1000 s: the plan is cells ×8, tolerances ÷243 (accuracy.ts; 0.0225 + 0.0041 s modelled)
    const planned = parseScenario(plate({ event_accuracy_s: 0.03 }));
    expect(planned.ok).toBe(true);
    const refine = planned.ok ? planned.problem.numerics.accuracy!.gridRefine : 0;
    const cells = 40 * refine;
    // 1e5 forced steps: the level-0 grid (40 cells, 4e6 cell-steps) fits; the refined one must not
    expect(40 * 1e5).toBeLessThan(LIMIT.maxForcedCellSteps);
    expect(cells * 1e5).toBeGreaterThan(LIMIT.maxForcedCellSteps);
    const e = onlyError(plate({ event_accuracy_s: 0.03, max_step_s: 0.01 }));
    expect(e.path).toBe('numerics.max_step_s');
    expect(e.message).toContain(`${cells} cells × 100000 forced steps`);
    expect(e.message).toContain('the limit is 2e+7 (scenarioLimitDefaults.maxForcedCellSteps');
    // the smallest max_step_s that fits: duration × cells / limit
    expect(e.message).toContain(`raise max_step_s to ≥ ${((1000 * cells) / LIMIT.maxForcedCellSteps).toPrecision(3)} s`);
    expect(e.message).toMatch(/got 0\.01$/);
  });

  it('refuses a file\'s own tolerance whose modelled steps times the cells pass the budget, naming the tolerance that sets them', () => {
    // 1e-6 K is 2e5× tighter than the default 0.2 K: 11.1 levels of ÷3, 1500 × 1.5^11.1 ≈ 1.35e5 steps modelled;
    // × 400 cells (cells: 400) = 5.4e7 cell-steps, past 5e7
    const tightK = plate({ tolerance_K: 1e-6 });
    tightK.layers[0]!.cells = 400;
    const levels = Math.log(scenarioDefaults.toleranceK / 1e-6) / Math.log(3);
    const steps = accuracyDefaults.trialsAtDefaults * accuracyDefaults.trialsPerToleranceLevel ** levels;
    expect(400 * steps).toBeGreaterThan(LIMIT.maxModelledCellSteps);
    const e = onlyError(tightK);
    expect(e.path).toBe('numerics.tolerance_K');
    expect(e.message).toBe(`400 cells × ${Math.round(steps)} steps (as modelled for this tolerance) = ${(400 * steps).toPrecision(3)} cell-steps; ` +
      'the limit is 5e+7 (scenarioLimitDefaults.maxModelledCellSteps): loosen it or use fewer cells, got 0.000001');
    // the same tolerance on 40 cells fits
    expect(parseScenario(plate({ tolerance_K: 1e-6 })).ok).toBe(true);
    // the liquid-fraction tolerance is named when it is the tighter of the two (1e-8 is 4e5× the default 0.004)
    const tightF = plate({ liquid_fraction_tolerance: 1e-8 });
    tightF.layers[0]!.cells = 400;
    expect(onlyError(tightF).path).toBe('numerics.liquid_fraction_tolerance');
  });
});

describe('the ceiling mid-run', () => {
  it('budgetSpent() binds at cells × sweeps = maxCellSweeps, or at cells × steps tried = maxCellSteps', () => {
    const cells = 1000;
    expect(budgetSpent(cells, 10, GUARD.maxCellSweeps / cells - 1)).toBe(false);
    expect(budgetSpent(cells, 10, GUARD.maxCellSweeps / cells)).toBe(true);
    expect(budgetSpent(cells, GUARD.maxCellSteps / cells, 0)).toBe(true);
  });

  it('budgetMessage() names the time reached, the work spent, the limit and what to change', () => {
    expect(budgetMessage(2000, 4000, 125_000, 8.75, 78)).toBe('the run reached its work budget at t = 8.75 of 78 s: 2000 cells × 125000 Newton ' +
      'sweeps; the limit is 2.5e+8 cell-sweeps (stepGuardDefaults.maxCellSweeps, about 25 s). Use fewer cells, loosen numerics.tolerance_K ' +
      'or numerics.liquid_fraction_tolerance, or shorten duration_s');
    expect(budgetMessage(10, 1.3e7, 1e6, 1e6, 3e6)).toContain('10 cells × 13000000 steps tried; the limit is 1.25e+8 cell-steps (stepGuardDefaults.maxCellSteps)');
  });

  it('heldBackSentence() names the layer on whose error at least half of the rejected steps failed, and whether it melted', () => {
    const ids = ['collector', 'separator', 'anode'];
    const cells = [4, 24, 8];
    expect(heldBackSentence(ids, cells, Uint32Array.of(1, 7, 2), Uint32Array.of(0, 6, 0), 10))
      .toBe('7 of the 10 rejected steps were held back by layer "separator" (24 cells) while a melt front crossed it. ');
    // melting over fewer than half of its own rejections: no front named
    expect(heldBackSentence(ids, cells, Uint32Array.of(1, 7, 2), Uint32Array.of(0, 3, 0), 10)).toBe('7 of the 10 rejected steps were held back by layer "separator" (24 cells). ');
    // exactly half still names it; less than half of all rejections (the rest on Newton failures, or spread) does not
    expect(heldBackSentence(ids, cells, Uint32Array.of(5, 0, 0), Uint32Array.of(0, 0, 0), 10)).toBe('5 of the 10 rejected steps were held back by layer "collector" (4 cells). ');
    expect(heldBackSentence(ids, cells, Uint32Array.of(4, 3, 3), Uint32Array.of(4, 3, 3), 10)).toBe('');
    expect(heldBackSentence(ids, cells, Uint32Array.of(0, 0, 0), Uint32Array.of(0, 0, 0), 0)).toBe('');
    expect(budgetMessage(2000, 4000, 125_000, 8.75, 78, GUARD.maxCellSweeps, 'X. ')).toContain('about 25 s). X. Use fewer cells');
  });

  it('switchingSentence() names frequent switching only when the events are many and a fifth of the steps or more', () => {
    expect(switchingSentence(GUARD.switchingEvents, 5 * GUARD.switchingEvents, 50)).toBe(`The heat switched ${GUARD.switchingEvents} times before ` +
      'then (a thermostat crossing its band), every 0.01 s on average: widen band_K, give the heater a heavier plate or less power_W, or use ' +
      'control kind "pi". ');
    expect(switchingSentence(GUARD.switchingEvents - 1, GUARD.switchingEvents, 50)).toBe('');
    expect(switchingSentence(GUARD.switchingEvents, 5 * GUARD.switchingEvents + 1, 50)).toBe('');
  });
});

describe('the ceiling mid-run, lowered for a test (EvolveOptions.maxCellSweeps)', () => {
  it('runProblem() stops a run at the ceiling it is given, naming it, with cells × sweeps within one step of it', () => {
    const parsed = parseScenario(plate());
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    // the plate's 40 cells at a ceiling of 4000 cell-sweeps: 100 sweeps, a few tens of steps of a 1000 s run
    const out = runProblem(parsed.problem, { maxCellSweeps: 4000 });
    expect(out.status).toBe('failed');
    if (out.status !== 'failed') return;
    expect(out.message).toMatch(/^the run reached its work budget at t = [0-9.e+]+ of 1000 s: 40 cells × \d+ Newton sweeps; the limit is 4e\+3 cell-sweeps \(set by the caller\)\. /);
    // a stop at the ceiling is its own kind (the CLI exits 4, not 1), in its own words
    expect(out.reason).toBe('work-budget');
    expect(stopSentence(out)).toBe(out.message);
    expect(40 * out.stats.newtonIterations).toBeGreaterThanOrEqual(4000);
    // the check is made before each trial; one TR-BDF2 trial takes at most 2 × maxNewtonIterations sweeps
    expect(out.stats.newtonIterations).toBeLessThanOrEqual(100 + 2 * evolveDefaults.maxNewtonIterations);
    // the same run without the lowered ceiling finishes
    expect(runProblem(parsed.problem).status).toBe('ok');
  });

  it('runProblem() stopped at a ceiling while the demo\'s separator melts names it as what held the steps back', () => {
    // the demo at 20 000 cell-sweeps (of the 66 000 it takes) stops at t ≈ 56 s, while its salt melts (molten at
    // 85 s): measured, 31 of its 34 rejected steps failed on the separator's error, each while the layer was melting
    const out = runProblem(parseOk(demo as unknown as ScenarioFile), { maxCellSweeps: 20_000 });
    expect(out.status).toBe('failed');
    if (out.status !== 'failed') return;
    const held = /(\d+) of the (\d+) rejected steps were held back by layer "separator" \(24 cells\) while a melt front crossed it\. Use fewer cells/.exec(out.message);
    expect(held, out.message).not.toBeNull();
    expect(Number(held![2])).toBe(out.stats.rejected);
    expect(2 * Number(held![1])).toBeGreaterThanOrEqual(out.stats.rejected);
  });

  it('runProblem() stopped at a ceiling while a thermostat with a 0.001 K band switches says so, with how often', () => {
    // heater-plate-lift-off.json with its 5 K band narrowed to 0.001 K: its 11.8 J/K stainless plate (8000 kg/m³ ×
    // 500 J/(kg·K) × 6 mm × 491 mm²) crosses the band in 0.08 ms at 150 W, so the thermostat switches every few
    // milliseconds once at its set-point (measured: 167 958 switches in the hour, which it finishes in 8.6 s); followed
    // switch by switch (not held in its band, time/plates.ts), a ceiling of 4e6 cell-sweeps stops it among them
    const file = structuredClone(heaterDemo) as unknown as ScenarioFile;
    const heater = file.bottom[0]!.heater!;
    (heater.control as { band_K: number }).band_K = 0.001;
    const out = runProblem(parseOk(file), { maxCellSweeps: 4e6, holdFastThermostats: false });
    expect(out.status).toBe('failed');
    if (out.status !== 'failed') return;
    expect(out.stats.events).toBeGreaterThanOrEqual(GUARD.switchingEvents);
    const said = /The heat switched (\d+) times before then \(a thermostat crossing its band\), every ([0-9.e-]+) s on average: widen band_K/.exec(out.message);
    expect(said, out.message).not.toBeNull();
    expect(Number(said![1])).toBe(out.stats.events);
    expect(Number(said![2])).toBeLessThan(0.1);
    // held in its band (the default) the same run finishes within that ceiling, and says the thermostat was held
    const held = runProblem(parseOk(file), { maxCellSweeps: 4e6 });
    expect(held.status).toBe('ok');
    if (held.status !== 'ok') return;
    expect(held.record.warnings.some((w) => w.startsWith(`the heater's thermostat switched ${HELD.heldSwitches} times within ${HELD.heldWithinS} s by t = `))).toBe(true);
  });
});
