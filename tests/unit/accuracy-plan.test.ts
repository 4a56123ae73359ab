// What a run states about the accuracy it was solved to (sim/scenario/accuracy.ts, sim/observe/result.ts,
// sim/cli/table.ts). Expected values are the rule of accuracyDefaults worked by hand: the demo runs 3600 s, so the
// modelled error at the defaults is 1.9e-4 × 3600 = 0.684 s from the grid plus 0.7e-4 × 3600 = 0.252 s from the
// tolerances, 0.936 s; a plan refines the grid at most as many levels as it divides the tolerances (ℓ ≤ k). Asking
// 1 s: the defaults reach it, (0, 0). Asking 0.5 s: every (0, k) misses on the grid's 0.684 s alone; (1, 1) gives
// 0.342 + 0.126 = 0.468 s at a modelled work of 2 × 1.5 × 1.5 = 4.5. Asking 0.2 s: (1, k) misses on the grid's
// 0.342 s; (2, 2) gives 0.171 + 0.063 = 0.234 s and (2, 3) 0.171 + 0.0315 = 0.2025 s, both missing; (2, 4) gives
// 0.171 + 0.01575 = 0.18675 s at 4 × 1.5² × 1.5⁴ = 45.56; (3, 3) reaches 0.117 s but costs 8 × 1.5³ × 1.5³ = 91.1.
// So cells × 4, tolerances ÷ 81 (0.2 K → 0.00247 K, 4e-3 → 4.94e-5), the curve as written (no melt ramp).
// runProblem() then climbs the ladder (0, 0), (1, 1), (2, 2), (2, 4) ((2, 3), at 30.4, is above half the plan's work
// and left out) and may stop at (1, 1) or (2, 2) when the estimate from the runs so far is within 0.2 s.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summaryTable } from '../../sim/cli/table.ts';
import { accuracyDefaults, accuracyLine, accuracyPlan, estimatedErrorS, ladderPlans, ownToleranceLevel } from '../../sim/scenario/accuracy.ts';
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
  it('accuracyPlan() plans event_accuracy_s 0.2 on the demo as cells ×4, tolerances ÷81, the curve as written, and asks runProblem() to confirm it', () => {
    const ask = { durationS: 3600, ownGrid: false, ownTolerances: false, baseCells: 40, maxCells: 20_000 };
    const plan = accuracyPlan({ ...ask, eventAccuracyS: 0.2 });
    if ('error' in plan) throw new Error(plan.error);
    expect([plan.level, plan.gridRefine, plan.toleranceDivisor, plan.confirm]).toEqual([2, 4, 81, true]);
    // no melt ramp (accuracyDefaults.meltRampK: its model error is not bounded by the ask)
    expect(plan.meltRampK).toBe(0);
    // exact products of round numbers: round-off only
    assertClose(plan.expectedErrorS, 0.18675, { rel: 1e-12 }, 'expected_error_s');
    // 1 s: the defaults, and no rung below them
    const one = accuracyPlan({ ...ask, eventAccuracyS: 1 });
    if ('error' in one) throw new Error(one.error);
    expect([one.level, one.gridRefine, one.toleranceDivisor, one.confirm]).toEqual([0, 1, 1, false]);
    assertClose(one.expectedErrorS, 0.936, { rel: 1e-12 }, 'expected_error_s at 1 s');
    // 0.5 s: cells ×2, tolerances ÷3
    const half = accuracyPlan({ ...ask, eventAccuracyS: 0.5 });
    if ('error' in half) throw new Error(half.error);
    expect([half.level, half.gridRefine, half.toleranceDivisor]).toEqual([1, 2, 3]);
    assertClose(half.expectedErrorS, 0.468, { rel: 1e-12 }, 'expected_error_s at 0.5 s');
  });

  it('accuracyPlan() meets an accuracy above the defaults\' modelled error with looser tolerances on the default grid, at most × 9', () => {
    // the demo's 3600 s: the time part grows 4.4× per level looser (accuracyDefaults.timeGrowthPerLooserLevel), so
    // (0, −1) models 0.684 + 0.252 × 4.4 = 1.7928 s at work 1.5⁻¹ and (0, −2) 0.684 + 0.252 × 19.36 = 5.56272 s at
    // 1.5⁻²; no grid level goes with a looser tolerance level, and nothing looser than × 9 is taken
    const ask = { durationS: 3600, ownGrid: false, ownTolerances: false, baseCells: 40, maxCells: 20_000 };
    const at = (a: number) => {
      const plan = accuracyPlan({ ...ask, eventAccuracyS: a });
      if ('error' in plan) throw new Error(plan.error);
      return [plan.level, plan.gridRefine, plan.toleranceDivisor, plan.confirm, Number(plan.expectedErrorS.toPrecision(6))];
    };
    expect(at(1.5)).toEqual([0, 1, 1, false, 0.936]);
    expect(at(1.8)).toEqual([0, 1, 1 / 3, false, 1.7928]);
    expect(at(5.5)).toEqual([0, 1, 1 / 3, false, 1.7928]);
    expect(at(5.6)).toEqual([0, 1, 1 / 9, false, 5.56272]);
    expect(at(1e4)).toEqual([0, 1, 1 / 9, false, 5.56272]);
    // the tolerances the run steps at: the defaults × 9, as the calibration ran the pair (0, −2)
    const parsed = parseScenario({ ...demo, numerics: { event_accuracy_s: 10 } });
    if (!parsed.ok) throw new Error('invalid');
    assertClose(parsed.problem.numerics.toleranceK, 0.2 * 9, { rel: 1e-15 }, 'tolerance_K at 10 s');
    assertClose(parsed.problem.numerics.liquidFractionTolerance, 4e-3 * 9, { rel: 1e-15 }, 'liquid_fraction_tolerance at 10 s');
    // a file's own tolerances are never loosened further
    const own = accuracyPlan({ ...ask, eventAccuracyS: 10, ownTolerances: true, ownToleranceLevel: 0 });
    if ('error' in own) throw new Error(own.error);
    expect([own.level, own.toleranceDivisor]).toEqual([0, 1]);
  });

  it('accuracyLine() names looser tolerances as such', () => {
    const plan = accuracyPlan({ eventAccuracyS: 2, durationS: 3600, ownGrid: false, ownTolerances: false, baseCells: 40, maxCells: 20_000 });
    if ('error' in plan) throw new Error(plan.error);
    expect(accuracyLine(plan)).toBe('accuracy: event times to 2 s, default grid, tolerances ×3 (looser than the defaults) (modelled error about 1.8 s)');
  });

  it('resultDocument() gives the numerics of the rung runProblem() stopped at for event_accuracy_s 0.2, and its estimate', () => {
    const base = solved();
    const { problem, out } = solved({ event_accuracy_s: 0.2 });
    const doc = resultDocument({ ...problem, numerics: out.problem.numerics }, out.grid, out.record, out.summary, out.stats);
    expect(doc.numerics.event_accuracy_s).toBe(0.2);
    // a rung of the ladder (0, 0), (1, 1), (2, 2), (2, 4): from the second on, grid ×2^ℓ and tolerances ÷3^k
    const i = doc.numerics.level;
    const k = Math.round(Math.log(doc.numerics.tolerance_divisor) / Math.log(3));
    expect([[1, 1], [2, 2], [2, 4]]).toContainEqual([i, k]);
    expect(doc.numerics.grid_refine).toBe(2 ** i);
    assertClose(doc.numerics.tolerance_K, 0.2 / 3 ** k, { rel: 1e-15 }, 'tolerance_K');
    assertClose(doc.numerics.liquid_fraction_tolerance, 4e-3 / 3 ** k, { rel: 1e-15 }, 'liquid_fraction_tolerance');
    // 0.684 / 2^ℓ + 0.252 / 2^k s: the rule at the rung's levels
    assertClose(doc.numerics.expected_error_s!, 0.684 / 2 ** i + 0.252 / 2 ** k, { rel: 1e-12 }, 'expected_error_s');
    expect(doc.numerics.estimated_error_s).not.toBeNull();
    // below the top rung the climb stopped because the estimate met the ask
    if (k < 4) expect(doc.numerics.estimated_error_s!).toBeLessThanOrEqual(0.2);
    expect(out.grid.n).toBe(2 ** i * base.out.grid.n);
  });

  it('summaryTable() prints the accuracy line: what was asked, what was chosen, the estimate', () => {
    const { problem, out } = solved({ event_accuracy_s: 0.2 });
    // the plan as parsed: what the rule chose, before any run
    expect(summaryTable(problem, out.summary, out.record, {})).toContain('accuracy: event times to 0.2 s, cells ×4, tolerances ÷81 (modelled error about 0.19 s)');
    // the plan as run: the rung, with the estimate from the runs below it
    expect(summaryTable({ ...problem, numerics: out.problem.numerics }, out.summary, out.record, {}))
      .toMatch(/accuracy: event times to 0\.2 s, cells ×[24], tolerances ÷(3|9|81) \(modelled error about [0-9.]+ s; estimated [0-9.]+ s from the runs below it\)/);
  });

  it('resultDocument() says the settings were the file\'s own when it sets both grid and tolerances', () => {
    const { problem, out } = solved({ event_accuracy_s: 0.1, tolerance_K: 0.2, cells_per_mm: 4 });
    const doc = resultDocument(problem, out.grid, out.record, out.summary, out.stats);
    expect([doc.numerics.level, doc.numerics.grid_refine, doc.numerics.tolerance_divisor, doc.numerics.melt_ramp_K]).toEqual([0, 1, 1, 0]);
    expect(summaryTable(problem, out.summary, out.record, {})).toContain('accuracy: grid and tolerances as set in the file (event times to 0.1 s not pursued)');
  });

  it('accuracyPlan() models the work against a budget within the solver\'s own (step-guards.ts), which scenario/ may not import', () => {
    expect(accuracyDefaults.workBudgetCellSteps).toBeLessThanOrEqual(stepGuardDefaults.maxCellSteps);
  });

  it('accuracyPlan() refuses an accuracy whose cheapest plan exceeds the work budget, naming the budget and what it reaches', () => {
    // 600 s, 32 cells (0.114 s from the grid, 0.042 s from the tolerances at level 0): 0.005 s needs (5, 5) at least
    // (0.114/32 + 0.042/32 = 0.004875 s; (4, k) misses on the grid's 0.007125 s), whose modelled work
    // 32 × 32 × 1500 × 1.5⁵ × 1.5⁵ = 8.9e7 is beyond 5e7 cells × steps; the cell limit (1024 ≤ 20000) is not
    const ask = { eventAccuracyS: 0.005, durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000 };
    const plan = accuracyPlan(ask);
    expect('error' in plan && plan.error).toMatch(/work budget of 5e\+7 cells × steps.*ask for [0-9.]+ s or more.*got 0\.005$/);
    // what it says is reachable is reachable
    const reach = Number(/ask for ([0-9.]+) s/.exec('error' in plan ? plan.error : '')![1]);
    expect('error' in accuracyPlan({ ...ask, eventAccuracyS: reach })).toBe(false);
  });

  it('accuracyPlan() takes the cheapest pair in modelled work: 0.01 s of a 600 s run on 32 cells is cells ×16, tolerances ÷81', () => {
    // S = 0.114 s, T = 0.042 s; every (ℓ, k) with ℓ ≤ 3 misses on the grid's 0.01425 s alone; (4, 4): 0.007125 +
    // 0.002625 = 0.00975 s at work 16 × 1.5⁴ × 1.5⁴ = 410; (5, 5) reaches it too at 32 × 1.5¹⁰ = 1845
    const plan = accuracyPlan({ eventAccuracyS: 0.01, durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000 });
    if ('error' in plan) throw new Error(plan.error);
    expect([plan.level, plan.gridRefine, plan.toleranceDivisor]).toEqual([4, 16, 81]);
    assertClose(plan.expectedErrorS, 0.114 / 16 + 0.042 / 16, { rel: 1e-12 }, 'expected_error_s');
  });

  it('accuracyPlan() never refines the grid more levels than it divides the tolerances, nor beyond the file\'s own', () => {
    // S = 0.114 s, T = 0.042 s: 0.1 s is (1, 1), 0.057 + 0.021 = 0.078 s at work 4.5 (every (0, k) misses on the
    // grid's 0.114 s alone); 0.07 s is (1, 2), 0.057 + 0.0105 = 0.0675 s at work 6.75 ((1, 1) misses; (2, 2), 0.039 s,
    // costs 20.25)
    const at = (a: number, own?: { ownTolerances: boolean; ownToleranceLevel: number }) => {
      const plan = accuracyPlan({ eventAccuracyS: a, durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000, ...own });
      if ('error' in plan) throw new Error(plan.error);
      return [plan.level, plan.toleranceDivisor, Number(plan.expectedErrorS.toPrecision(6))];
    };
    expect(at(0.1)).toEqual([1, 3, 0.078]);
    expect(at(0.07)).toEqual([1, 9, 0.0675]);
    for (const a of [0.5, 0.2, 0.1, 0.05, 0.02, 0.01, 0.008]) {
      const [level, divisor] = at(a);
      // (0.5 s is above this run's 0.156 s at the defaults: tolerances × 3 on the default grid, divisor 1/3)
      expect(3 ** level!, `${a} s: grid level within the tolerance level`).toBeLessThanOrEqual(Math.max(divisor!, 1));
    }
    // the file's own tolerances two levels below the defaults: the grid may go two levels, the time part is taken there
    // (0.042/4 = 0.0105 s): (1, own) gives 0.057 + 0.0105 = 0.0675 s, (2, own) 0.0285 + 0.0105 = 0.039 s
    expect(at(0.07, { ownTolerances: true, ownToleranceLevel: 2 })).toEqual([1, 1, 0.0675]);
    expect(at(0.05, { ownTolerances: true, ownToleranceLevel: 2 })).toEqual([2, 1, 0.039]);
    // looser than the defaults (level −1): the grid stays, and the plan states its modelled error, above the ask: the
    // time part grows 4.4× per level looser (accuracyDefaults.timeGrowthPerLooserLevel), 0.114 + 4.4 × 0.042 s
    expect(at(0.05, { ownTolerances: true, ownToleranceLevel: -1 })).toEqual([0, 1, 0.2988]);
    expect(ownToleranceLevel(0.2 / 9, 4e-3 / 9, 0.2, 4e-3)).toBe(2);
    expect(ownToleranceLevel(0.2 / 9, 4e-3, 0.2, 4e-3)).toBe(0);
    expect(ownToleranceLevel(0.3, 4e-3, 0.2, 4e-3)).toBe(-1);
  });
});

describe('the ladder runProblem() climbs for an accuracy asked', () => {
  it('ladderPlans() gives the rungs (0, 0) … up to the plan, each halving both modelled parts, the curve as written at rung 0', () => {
    // 0.01 s of 600 s on 32 cells is (4, 4) (above); modelled 0.114 / 2^ℓ + 0.042 / 2^k s at rung (ℓ, k). Modelled work
    // 3^l × 1.5^k (cells × 2 and steps × 1.5 per grid level, steps × 1.5 per tolerance level) against the plan's,
    // 410: rung 1 (1, 1) 4.5, rung 2 (2, 2) 20.25 and rung 3 (3, 3) 91.1 are within half of it, kept
    const plan = accuracyPlan({ eventAccuracyS: 0.01, durationS: 600, ownGrid: false, ownTolerances: false, baseCells: 32, maxCells: 20_000 });
    if ('error' in plan) throw new Error(plan.error);
    const rungs = ladderPlans(plan, 600);
    expect(rungs.map((r) => [r.level, r.gridRefine, r.toleranceDivisor, r.confirm])).toEqual([[0, 1, 1, false], [1, 2, 3, false], [2, 4, 9, false], [3, 8, 27, false], [4, 16, 81, false]]);
    expect(rungs.map((r) => r.meltRampK)).toEqual([0, 0, 0, 0, 0]);
    [0.156, 0.078, 0.039, 0.0195, 0.00975].forEach((e, i) => assertClose(rungs[i]!.expectedErrorS, e, { rel: 1e-12 }, `rung ${i} modelled error`));
    // (1, 2): 6.75; its rung (1, 1),
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
    expect(confirm({ eventAccuracyS: 1 })).toBe(false); // 0.156 s at level 0 is within 1 s
    expect(confirm({ eventAccuracyS: 0.02 })).toBe(true); // (3, 3), 0.0195 s: the ladder (0, 0), (1, 1), (2, 2), (3, 3)
    // 0.08 s: (1, 1) (0.057 + 0.021 = 0.078 s): only rung 0 below it, which cannot be returned alone
    expect(confirm({ eventAccuracyS: 0.08 })).toBe(false);
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
