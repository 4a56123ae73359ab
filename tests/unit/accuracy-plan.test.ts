// What a run states about the accuracy it was solved to (sim/scenario/accuracy.ts, sim/observe/result.ts,
// sim/cli/table.ts). Expected values are the rule of accuracyDefaults worked by hand: the demo runs 3600 s, so the
// modelled error at the defaults is 7.5e-4 × 3600 = 2.7 s from the grid plus 3e-4 × 3600 = 1.08 s from the tolerances;
// asking 1 s: (grid level, tolerance level) (2, 2) gives 2.7/4 + 1.08/4 = 0.945 s ≤ 1 at a modelled work of
// 4 × 1.5² × 1.5² = 20.25 × level 0, and the only cheaper pairs miss it ((2, 1): 0.675 + 0.54 = 1.215 s; (1, k): 1.35 s
// from the grid alone); (3, 1) reaches 0.8775 s but costs 8 × 1.5³ × 1.5 = 40.5. So cells × 4, tolerances ÷ 9
// (0.2 K → 0.0222 K, 4e-3 → 4.44e-4), melt ramp 0.1 K × min(1, 1 / 0.5) = 0.1 K.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summaryTable } from '../../sim/cli/table.ts';
import { accuracyDefaults, accuracyPlan } from '../../sim/scenario/accuracy.ts';
import { stepGuardDefaults } from '../../sim/time/step-guards.ts';
import { resultDocument } from '../../sim/observe/result.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { assertClose } from '../support/assert-close.ts';

const demo = JSON.parse(readFileSync(new URL('../../examples/bench-coupon.json', import.meta.url), 'utf8')) as Record<string, unknown>;

function solved(numerics?: object) {
  const parsed = parseScenario(numerics ? { ...demo, numerics } : demo);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  const out = runProblem(parsed.problem, { detail: 'summary' });
  if (out.status !== 'ok') throw new Error(out.status);
  return { problem: parsed.problem, out };
}

describe('the accuracy a run states', () => {
  it('resultDocument() gives numerics with the level, grid factor, tolerances and ramp chosen for event_accuracy_s 1', () => {
    const base = solved();
    const { problem, out } = solved({ event_accuracy_s: 1 });
    const doc = resultDocument(problem, out.grid, out.record, out.summary, out.stats);
    expect(doc.numerics.event_accuracy_s).toBe(1);
    expect([doc.numerics.level, doc.numerics.grid_refine, doc.numerics.tolerance_divisor]).toEqual([2, 4, 9]);
    // exact divisions and products of round numbers: round-off only
    assertClose(doc.numerics.tolerance_K, 0.2 / 9, { rel: 1e-15 }, 'tolerance_K');
    assertClose(doc.numerics.liquid_fraction_tolerance, 4e-3 / 9, { rel: 1e-15 }, 'liquid_fraction_tolerance');
    assertClose(doc.numerics.melt_ramp_K, 0.1, { rel: 1e-15 }, 'melt_ramp_K');
    assertClose(doc.numerics.expected_error_s!, 0.945, { rel: 1e-12 }, 'expected_error_s');
    expect(out.grid.n).toBe(4 * base.out.grid.n);
  });

  it('summaryTable() prints the accuracy line: what was asked and what was chosen', () => {
    const { problem, out } = solved({ event_accuracy_s: 1 });
    const table = summaryTable(problem, out.summary, out.record, {});
    expect(table).toContain('accuracy: event times to 1 s, cells ×4, tolerances ÷9, melt kinks smoothed over ±0.1 K (modelled error about 0.95 s)');
  });

  it('resultDocument() says the settings were the file\'s own when it sets both grid and tolerances', () => {
    const { problem, out } = solved({ event_accuracy_s: 0.1, tolerance_K: 0.2, cells_per_mm: 4 });
    const doc = resultDocument(problem, out.grid, out.record, out.summary, out.stats);
    expect([doc.numerics.level, doc.numerics.grid_refine, doc.numerics.tolerance_divisor, doc.numerics.melt_ramp_K]).toEqual([0, 1, 1, 0]);
    expect(summaryTable(problem, out.summary, out.record, {})).toContain('accuracy: grid and tolerances as set in the file (event times to 0.1 s not pursued)');
  });

  it('accuracyPlan() models the work against the solver\'s own budget (step-guards.ts), which scenario/ may not import', () => {
    expect(accuracyDefaults.workBudgetCellSteps).toBe(stepGuardDefaults.maxCellSteps);
  });

  it('accuracyPlan() refuses an accuracy whose cheapest plan exceeds the work budget, naming the budget and what it reaches', () => {
    // 600 s, 32 cells: 0.01 s needs grid level 6 and tolerance level 6 (0.45/64 + 0.18/64 = 0.0098 s), whose modelled
    // work 32 × 64 × 1500 × 1.5⁶ × 1.5⁶ = 4.0e8 is beyond 5e7 cells × steps; the cell limit (2048 ≤ 20000) is not
    const ask = { eventAccuracyS: 0.01, durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000 };
    const plan = accuracyPlan(ask);
    expect('error' in plan && plan.error).toMatch(/work budget of 5e\+7 cells × steps.*ask for [0-9.]+ s or more.*got 0\.01$/);
    // what it says is reachable is reachable
    const reach = Number(/ask for ([0-9.]+) s/.exec('error' in plan ? plan.error : '')![1]);
    expect('error' in accuracyPlan({ ...ask, eventAccuracyS: reach })).toBe(false);
  });

  it('accuracyPlan() takes the cheapest pair in modelled work: 0.1 s of a 600 s run on 32 cells is cells ×8, tolerances ÷27', () => {
    // S = 0.45 s, T = 0.18 s; (3, 3): 0.05625 + 0.0225 = 0.079 s at work 8 × 1.5⁶ = 91; (4, 2): 0.028 + 0.045 = 0.073 s at
    // 16 × 1.5⁶ = 182; (3, 2): 0.101 s misses; (2, k): 0.1125 s from the grid alone misses
    const plan = accuracyPlan({ eventAccuracyS: 0.1, durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000 });
    if ('error' in plan) throw new Error(plan.error);
    expect([plan.level, plan.gridRefine, plan.toleranceDivisor]).toEqual([3, 8, 27]);
    assertClose(plan.expectedErrorS, 0.45 / 8 + 0.18 / 8, { rel: 1e-12 }, 'expected_error_s');
  });
});
