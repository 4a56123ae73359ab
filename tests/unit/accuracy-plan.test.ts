// What a run states about the accuracy it was solved to (sim/scenario/accuracy.ts, sim/observe/result.ts,
// sim/cli/table.ts). Expected values are the rule of accuracyDefaults worked by hand: the demo runs 3600 s, so the
// modelled error at the defaults is 7.5e-4 × 3600 = 2.7 s from the grid plus 3e-4 × 3600 = 1.08 s from the tolerances;
// asking 1 s: (grid level, tolerance level) (2, 2) gives 2.7/4 + 1.08/4 = 0.945 s ≤ 1 at a modelled work of
// 4 × 1.5² × 1.5² = 20.25 × level 0, and the only cheaper pairs miss it ((2, 1): 0.675 + 0.54 = 1.215 s; (1, k): 1.35 s
// from the grid alone); (3, 1) reaches 0.8775 s but costs 8 × 1.5³ × 1.5 = 40.5. So cells × 4, tolerances ÷ 9
// (0.2 K → 0.0222 K, 4e-3 → 4.44e-4), the curve as written (no melt ramp). runProblem() then climbs the ladder
// (0, 0), (1, 1), (2, 2) and may stop at (1, 1) when the estimate from the runs so far is within 1 s.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summaryTable } from '../../sim/cli/table.ts';
import { accuracyDefaults, accuracyPlan, estimatedErrorS, ladderPlans } from '../../sim/scenario/accuracy.ts';
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
  it('accuracyPlan() plans event_accuracy_s 1 on the demo as cells ×4, tolerances ÷9, the curve as written, and asks runProblem() to confirm it', () => {
    const plan = accuracyPlan({ eventAccuracyS: 1, durationS: 3600, ownGrid: false, ownTolerances: false, baseCells: 40, maxCells: 20_000 });
    if ('error' in plan) throw new Error(plan.error);
    expect([plan.level, plan.gridRefine, plan.toleranceDivisor, plan.confirm]).toEqual([2, 4, 9, true]);
    // no melt ramp (accuracyDefaults.meltRampK: its model error is not bounded by the ask)
    expect(plan.meltRampK).toBe(0);
    // exact products of round numbers: round-off only
    assertClose(plan.expectedErrorS, 0.945, { rel: 1e-12 }, 'expected_error_s');
  });

  it('resultDocument() gives the numerics of the rung runProblem() stopped at for event_accuracy_s 1, and its estimate', () => {
    const base = solved();
    const { problem, out } = solved({ event_accuracy_s: 1 });
    const doc = resultDocument({ ...problem, numerics: out.problem.numerics }, out.grid, out.record, out.summary, out.stats);
    expect(doc.numerics.event_accuracy_s).toBe(1);
    // a rung of the ladder (0, 0), (1, 1), (2, 2): from the second on, grid ×2^i and tolerances ÷3^i
    const i = doc.numerics.level;
    expect([1, 2]).toContain(i);
    expect([doc.numerics.grid_refine, doc.numerics.tolerance_divisor]).toEqual([2 ** i, 3 ** i]);
    assertClose(doc.numerics.tolerance_K, 0.2 / 3 ** i, { rel: 1e-15 }, 'tolerance_K');
    assertClose(doc.numerics.liquid_fraction_tolerance, 4e-3 / 3 ** i, { rel: 1e-15 }, 'liquid_fraction_tolerance');
    // (2.7 + 1.08) / 2^i s: the rule at the rung's levels
    assertClose(doc.numerics.expected_error_s!, 3.78 / 2 ** i, { rel: 1e-12 }, 'expected_error_s');
    expect(doc.numerics.estimated_error_s).not.toBeNull();
    // below the top rung the climb stopped because the estimate met the ask
    if (i < 2) expect(doc.numerics.estimated_error_s!).toBeLessThanOrEqual(1);
    expect(out.grid.n).toBe(2 ** i * base.out.grid.n);
  });

  it('summaryTable() prints the accuracy line: what was asked, what was chosen, the estimate', () => {
    const { problem, out } = solved({ event_accuracy_s: 1 });
    // the plan as parsed: what the rule chose, before any run
    expect(summaryTable(problem, out.summary, out.record, {})).toContain('accuracy: event times to 1 s, cells ×4, tolerances ÷9 (modelled error about 0.95 s)');
    // the plan as run: the rung, with the estimate from the runs below it
    expect(summaryTable({ ...problem, numerics: out.problem.numerics }, out.summary, out.record, {}))
      .toMatch(/accuracy: event times to 1 s, cells ×[24], tolerances ÷[39] \(modelled error about [0-9.]+ s; estimated [0-9.]+ s from the runs below it\)/);
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

describe('the ladder runProblem() climbs for an accuracy asked', () => {
  it('ladderPlans() gives the rungs (0, 0) … up to the plan, each halving both modelled parts, the curve as written at rung 0', () => {
    // 0.1 s of 600 s on 32 cells is (3, 3) (above); modelled (0.45 + 0.18) / 2^i s at rung i
    const plan = accuracyPlan({ eventAccuracyS: 0.1, durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000 });
    if ('error' in plan) throw new Error(plan.error);
    const rungs = ladderPlans(plan, 600);
    expect(rungs.map((r) => [r.level, r.gridRefine, r.toleranceDivisor, r.confirm])).toEqual([[0, 1, 1, false], [1, 2, 3, false], [2, 4, 9, false], [3, 8, 27, false]]);
    expect(rungs.map((r) => r.meltRampK)).toEqual([0, 0, 0, 0]);
    rungs.forEach((r, i) => assertClose(r.expectedErrorS, 0.63 / 2 ** i, { rel: 1e-12 }, `rung ${i} modelled error`));
    // modelled work 6^l × 1.5^k (cells × 2 and steps × 1.5 per grid level, steps × 1.5 per tolerance level) against
    // the plan's: (3, 3) 91, rung 2 20.25 and rung 1 4.5 are within half of it, kept. (1, 2): 6.75; its rung (1, 1),
    // 4.5, is above half, left out, and rung 0 alone below the plan cannot be returned: the plan is the only rung
    const uneven = ladderPlans({ ...plan, level: 1, gridRefine: 2, toleranceDivisor: 9 }, 600);
    expect(uneven.map((r) => [r.level, r.toleranceDivisor])).toEqual([[1, 9]]);
    // (3, 1): 216 × 1.5 = 324; rung 1 (1, 1) 9, rung 2 (2, 1) 54 are kept, and rung 3 is the plan
    const grid = ladderPlans({ ...plan, level: 3, gridRefine: 8, toleranceDivisor: 3 }, 600);
    expect(grid.map((r) => [r.level, r.toleranceDivisor])).toEqual([[0, 1], [1, 3], [2, 3], [3, 3]]);
  });

  it('accuracyPlan() asks for a confirmation only when an accuracy is asked and the plan refines', () => {
    const ask = { durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000 };
    const confirm = (a: Partial<typeof ask> & { eventAccuracyS: number | undefined }) => {
      const plan = accuracyPlan({ ...ask, ...a });
      if ('error' in plan) throw new Error(plan.error);
      return plan.confirm;
    };
    expect(confirm({ eventAccuracyS: undefined })).toBe(false); // the default: level 0, as before the key
    expect(confirm({ eventAccuracyS: 1 })).toBe(false); // 0.63 s at level 0 is within 1 s
    expect(confirm({ eventAccuracyS: 0.1 })).toBe(true); // (3, 3): the ladder (0, 0) … (3, 3)
    // 0.3 s: (1, 2) (0.225 + 0.045 = 0.27 s; (1, 1) misses at 0.315 s, (2, 1) costs 13.5 against 6.75): no rung worth it
    expect(confirm({ eventAccuracyS: 0.3 })).toBe(false);
    expect(confirm({ eventAccuracyS: 0.1, ownGrid: true, ownTolerances: true })).toBe(false);
  });

  it('estimatedErrorS() is Roache\'s grid convergence index of the event times in the max norm, worked by hand', () => {
    // two runs: d2 = 0.1 s (the frozen time), F_s = 3, p = 1: 3 × 0.1 / (2 − 1) = 0.3 s
    assertClose(estimatedErrorS([[10, 20, 30], [10.05, 20, 29.9]])!, 0.3, { rel: 1e-12 }, 'two runs');
    // three runs, d1 = 0.4, d2 = 0.1: observed order 2, held to the formal 1: 1.25 × 0.1 / 1 = 0.125 s
    assertClose(estimatedErrorS([[10, 20, 30], [10.4, 20, 30], [10.5, 20, 30]])!, 0.125, { rel: 1e-12 }, 'order above 1');
    // d1 = 0.15, d2 = 0.1: p = log2 1.5, 2^p − 1 = 0.5: 1.25 × 0.1 / 0.5 = 0.25 s
    assertClose(estimatedErrorS([[10, 20, 30], [10, 20.15, 30], [10, 20.25, 30]])!, 0.25, { rel: 1e-12 }, 'order log2 1.5');
    // not converging (d1 = 0.05 < d2 = 0.1): the two-run index, 0.3 s
    assertClose(estimatedErrorS([[10, 20, 30], [10.05, 20, 30], [10.15, 20, 30]])!, 0.3, { rel: 1e-12 }, 'not converging');
    // the norm: each event changes less from the second run, its largest change falls 0.4 → 0.1 although the first event's grows 0.05 → 0.1
    assertClose(estimatedErrorS([[10, 20, 30], [10.05, 20.4, 30], [10.15, 20.4, 30]])!, 0.125, { rel: 1e-12 }, 'max norm');
    expect(estimatedErrorS([[10, 20, null], [10, 20, 30.1]])).toBe(Infinity);
    // an event neither run reaches is left out: 3 × 0.1 s
    assertClose(estimatedErrorS([[10, 20, null], [10.1, 20, null]])!, 0.3, { rel: 1e-12 }, 'an event neither reaches');
    expect(estimatedErrorS([[null, null, null], [null, null, null]])).toBeUndefined();
    expect(estimatedErrorS([[10, 20, 30]])).toBeUndefined();
  });
});
