/**
 * Accuracy asked in seconds: `numerics.event_accuracy_s` → the grid and the step tolerances the run uses.
 *
 * The verdict times (molten, half-frozen, frozen) carry a spatial error, first order in Δx (the enthalpy method
 * resolves a front to a cell: a cell turns fully liquid or solid as the front leaves it), and a time error that the
 * step tolerances set. The two are pursued separately. A grid level ℓ halves the cells' width (grid × 2^ℓ) and about
 * halves the grid's part; a tolerance level k divides both tolerances by 3^k, and each division by 3 about halves the
 * time part (the global error of TR-BDF2 with local error control falls about as tol^(2/3)). The liquid-fraction error
 * of a step is measured per level-0 cell (the error norm, in the grid's stage system, reads the plan's grid factor), so
 * refining the grid does not by itself tighten the time control, nor cost more steps per cell. Each part at level 0 is
 * modelled as a share of the run's duration, which stands for the time scales of its events; the shares are calibrated
 * by refinement on examples/ (DEVELOPERS.md, "Accuracy"). The plan is the pair (ℓ, k) of least modelled work (cells
 * × steps) whose modelled error is within the accuracy asked (k may be −1 or −2 on the default grid, ℓ = 0: tolerances
 * × 3 or × 9 for an accuracy above the defaults' modelled error), within the cell limit and the solver's work budget;
 * an accuracy no pair reaches is refused at validation with the limit that binds and the accuracy that can be had. The
 * rule is calibrated on the worst example, so on most scenarios it refines more than the ask needs; a plan above level
 * (0, 0) asked for in the file is therefore confirmed a posteriori (run.ts runProblem): the run climbs the ladder
 * (0, 0), (1, 1), … up to the plan and stops at the first rung from the second on whose event times, compared with the
 * rungs below, give an estimated error (Roache's grid convergence index, estimatedErrorS) within the ask; the plan
 * itself, the top rung, is taken whatever the estimate, as the rule holds it to the ask. The result states the plan it
 * was solved to, its modelled error and the estimate. The tests check both by refinement on the examples and on a
 * seeded scan (tests/convergence/event-accuracy.test.ts).
 *
 * Every plan solves the enthalpy curve as written: the melt ramp (physics/melt-ramp.ts) that plans above (0, 0) used to
 * smooth the melt's kinks with has a model error the ask does not bound (accuracyDefaults.meltRampK). Expert keys win:
 * tolerances given in the file are used as given (not divided; the grid is then refined at most as many levels as they
 * stand below the defaults, ownToleranceLevel), a grid given in the file (cells_per_mm, min_cells_per_layer,
 * separator_cells_per_mm, min_separator_cells, or any layer's `cells`) is used as given (not refined), and with both
 * given the accuracy is stated but not pursued.
 */
import { cellsOfLayer } from '../grid/mesh.ts';
import type { AccuracyPlan, Numerics } from '../physics/problem.ts';
import { mmToM } from '../physics/units.ts';
import type { FieldError } from './field-errors.ts';
import { scenarioLimitDefaults } from './scenario-limits.ts';
import type { ScenarioFile } from './scenario-schema.ts';

export type { AccuracyPlan };

export const accuracyDefaults = {
  /**
   * Floor of the default of numerics.event_accuracy_s, s. Without the key a run keeps the default grid and tolerances
   * (as before the key existed) and states their modelled accuracy, max(0.5 s, (spaceShare + timeShare) × duration).
   */
  eventAccuracyS: 0.5,
  /** Smallest accuracy one may ask, s: below it the grid a one-hour run needs passes the cell limit anyway. */
  minEventAccuracyS: 1e-3,
  /**
   * Modelled event-time error at level 0 as a share of the duration (1/s · s), in two parts: the grid's (halved by
   * each doubling of the cells) and the step tolerances' (halved by each division by 3; multiplied by
   * timeGrowthPerLooserLevel for each multiplication by 3 of a file's own tolerances looser than the defaults). A plan
   * refines the grid at most as many levels as it divides the tolerances (ℓ ≤ k): at a fixed tolerance level a finer
   * grid lengthened the time error instead (against cells ×8, tolerances ÷27: insulated-pellet-stack frozen 1.0 s at
   * (×1, ÷1), 6.4 s at (×2, ÷1), 2.6 s at (×4, ÷1); the one-phase Stefan problem with its wall 5 K below T_m 1.0, 9.9
   * and 10.9 s: a front crossing more cells, each a kink, with the same allowance per step).
   *
   * Calibrated (2026-12-05, `npm run calibrate`, bench/accuracy-calibration.ts) on examples/, the bench's accuracy
   * scenario, the one-phase Stefan problem with its wall 100 K and 5 K below T_m (against its closed form) and eight
   * random melt-and-freeze stacks (seeds 101–108; the promise's test checks seeds 1–8): runs at
   * (ℓ, k) = (0, −2), (0, −1), (0, 0), (0, 1), (1, 1), (0, 2), (1, 2), (2, 2), (0, 3), (1, 3), each at both
   * tolerances × 0.90, 0.95, 1, 1.05 and 1.10 (one run at one setting scatters by tenths of a second: the last cell to
   * melt or freeze decides an event), against cells ×16, tolerances ÷81. Largest error ÷ duration at each pair, in
   * that order: 5.38e-4, 4.07e-4, 2.04e-4, 1.83e-4, 8.47e-5, 1.17e-4, 3.97e-5, 3.29e-5, 1.22e-4, 4.30e-5. As
   * S/2^ℓ + T/2^k ≥ 1.2 × that, the constraint that binds is sleeved-square-cell's molten time (2400 s, a slow melt),
   * 0.440 s at (0, 1): S + T/2 ≥ 2.20e-4. The pairs with ℓ = 0 do not separate S from T (the grid's part dominates
   * them, and T = 0 would meet them all), so T keeps its value of the calibration before, and S = 1.9e-4 meets the
   * bound with 2 % to spare (1.85e-4 met it only to round-off). The modelled error at the defaults is then 2.6e-4 ×
   * duration: 0.94 s for an hour.
   * Before (2026-12-03): S = 1.3e-4, T = 0.7e-4, fitted with the same margin to single runs at the pairs' own
   * tolerances against cells ×8, tolerances ÷27; over the scan they modelled (0, 1) at 1.65e-4, below the 1.83e-4
   * measured. (Earlier still, before the landing on the separator's events and the band on its molten-thickness
   * error: 1.8e-4 and 1.3e-4; before the events were read inside a step, 7.5e-4 and 3e-4.)
   * The event times converge erratically, so this is a rule checked by tests/convergence/event-accuracy.test.ts,
   * not an error estimate of the run.
   */
  spaceShareAtDefaults: 1.9e-4,
  timeShareAtDefaults: 0.7e-4,
  /**
   * The time part's growth per multiplication by 3 of a file's own tolerances looser than the defaults
   * (ownToleranceLevel below 0). Calibrated with the shares above: at (0, −1) the largest error was
   * sleeved-square-cell's molten time, 0.977 s of 2400 s (4.07e-4), at (0, −2) a random stack's, 0.635 s of 1182 s
   * (5.38e-4); S + T·g ≥ 1.2 × 4.07e-4 and S + T·g² ≥ 1.2 × 5.38e-4 need g ≥ 4.26 and 2.55. Steps long enough to carry
   * a cell through its melt in one go put the events late faster than the halving on the tight side would have it (the
   * rule before took 2 here, and modelled (0, −1) at 2.7e-4). Before the event location kept trying after a failed
   * trial step (time/events.ts), the pellet stack's molten time at (0, −1) was 2.76 s late.
   */
  timeGrowthPerLooserLevel: 4.4,
  /** Grid factor per grid level, tolerance divisor per tolerance level (see above). */
  gridPerLevel: 2,
  tolerancePerLevel: 3,
  /** Highest grid level: grid × 64; beyond it the cell limit (scenarioLimitDefaults.maxCells) binds first anyway. */
  maxLevel: 6,
  /** Highest tolerance level: tolerances ÷ 729. */
  maxToleranceLevel: 6,
  /**
   * How many tolerance levels looser than the defaults a plan may take (tolerances × 3, × 9), for an accuracy asked
   * above the defaults' modelled error, on the default grid: the looser pairs the calibration measured, (0, −1) and
   * (0, −2), with the time part grown timeGrowthPerLooserLevel per level. Looser still is not calibrated, and the
   * step cap (a hundredth of the duration) soon bounds the steps anyway: the demo at its defaults, × 3 and × 9 took
   * 1357, 1003 and 831 Newton sweeps, and at × 27 951 (measured 2026-12-05).
   */
  maxLooserToleranceLevel: 2,
  /**
   * Half-width of the melt ramp (physics/melt-ramp.ts) of a plan above (0, 0) at the default accuracy, K, scaled down in
   * proportion to a finer accuracy asked: 0, no ramp. Until 2026-12-03 it was 0.1 K (0.02 K at 0.1 s), measured on the
   * demo at 1600 cells (event times moved ≤ 0.04 s, Newton work halved). But its model error is not bounded by the
   * accuracy asked: it scales with δ over the temperature difference that drives the freeze, and a liquid cooling to
   * its melting point gives up the hat's upper half ahead of the front. On the one-phase Stefan problem (liquid at
   * T_m, wall 5 K below it, 10 mm, frozen at 4033 s) 0.1 K put the frozen time 63 s early (0.01 K: 7.6 s; none:
   * 0.15 s), and at event_accuracy_s 0.5 the run stated an estimated error of 0.31 s; every rung of the ladder above 0
   * carried the same ramp, so the estimate could not see it. Without it the examples asked for 1 s and 0.5 s are both
   * faster (the ladder stops lower: the ramp's own shift between rung 0 and rung 1 had inflated the estimate; e.g.
   * sleeved-square-cell at 0.5 s 5.3 → 0.46 s) and closer to their references (largest error 0.30 → 0.08 s).
   */
  meltRampK: 0,
  /**
   * The work model that keeps a plan within the solver's budget. The budget, cells × steps (accepted and rejected), is
   * at most stepGuardDefaults.maxCellSteps (time/step-guards.ts, which scenario/ may not import; a unit test holds the
   * order): it was that budget until 2026-12-04, when the solver's rose 2.5× and this one stayed, so a plan keeps a
   * margin for what the model does not see (a front crossing a thick layer cell by cell). Steps tried (accepted and
   * rejected) by a level-0 run: at most 1257 on examples/ (heater-plate-lift-off; the others 291–1116), 1500 with a
   * margin. Per level, from the same calibration runs: ×0.9–1.4 per doubling of the cells and ×1.2–1.4 per division
   * of the tolerances by 3, and ×6.4–7.5 for three grid levels and two tolerance levels with the ramp ÷4 (the ramp
   * narrows with the accuracy, and a narrower ramp costs steps); 1.5 and 1.5 cover that.
   */
  workBudgetCellSteps: 5e7,
  trialsAtDefaults: 1500,
  trialsPerGridLevel: 1.5,
  trialsPerToleranceLevel: 1.5,
  /**
   * The a-posteriori estimate of runProblem()'s ladder (estimatedErrorS): Roache's factors of safety of the grid
   * convergence index, 3 for two runs and 1.25 for three with the observed order (Roache 1998, §5.6), and the formal
   * order of the event times in the refinement of one rung, 1 (the enthalpy method resolves a front to a cell; the
   * time part falls about as fast per rung, see above), the most the observed order may claim.
   */
  /**
   * A rung of the ladder is tried only when its modelled work is at most this share of the plan's (ladderPlans): a rung
   * costs the run its own work besides the plan's when the climb goes on, so a rung about as dear as the plan saves little.
   */
  ladderWorthShare: 0.5,
  safetyTwoRuns: 3,
  safetyThreeRuns: 1.25,
  formalOrder: 1,
} as const;

/** What a file's numerics ask for, and which low-level keys it gave itself. */
export interface AccuracyAsk {
  /** numerics.event_accuracy_s as written, s; undefined: the default. */
  readonly eventAccuracyS: number | undefined;
  readonly durationS: number;
  readonly ownGrid: boolean;
  readonly ownTolerances: boolean;
  /** Cells of the stack at level 0, and the most a run may hold (scenarioLimitDefaults.maxCells). */
  readonly baseCells: number;
  readonly maxCells: number;
  /**
   * With the file's own tolerances, the tolerance level they stand at (ownToleranceLevel()): the modelled time part is
   * taken there, and the grid is refined at most that many levels. 0 when absent.
   */
  readonly ownToleranceLevel?: number | undefined;
}

/**
 * The tolerance level (divisions by tolerancePerLevel, whole, towards the looser side; negative when looser than the
 * defaults) that tolerances `toleranceK`, `liquidFraction` stand at against the defaults `defaultK`, `defaultFraction`:
 * the looser of the two decides, as it does the step.
 */
export function ownToleranceLevel(toleranceK: number, liquidFraction: number, defaultK: number, defaultFraction: number): number {
  const ratio = Math.min(defaultK / toleranceK, defaultFraction / liquidFraction);
  return Math.floor(Math.log(ratio) / Math.log(accuracyDefaults.tolerancePerLevel) + 1e-9);
}

/** Modelled event-time error, s, at grid level `level` and tolerance level `tolLevel`. */
function modelledErrorS(durationS: number, level: number, tolLevel: number): number {
  const d = accuracyDefaults;
  const timeFactor = tolLevel >= 0 ? 2 ** -tolLevel : d.timeGrowthPerLooserLevel ** -tolLevel;
  return (d.spaceShareAtDefaults * durationS) / d.gridPerLevel ** level + d.timeShareAtDefaults * durationS * timeFactor;
}

/** The tolerance level the run's steps stand at under `ask` at rule tolerance level k (the file's own, when given). */
function timeLevelOf(ask: AccuracyAsk, k: number): number {
  return ask.ownTolerances ? (ask.ownToleranceLevel ?? 0) : k;
}

/** Modelled work of a level, cells × steps (accepted and rejected). */
function modelledWork(baseCells: number, level: number, tolLevel: number): number {
  const d = accuracyDefaults;
  return baseCells * d.gridPerLevel ** level * d.trialsAtDefaults * d.trialsPerGridLevel ** level * d.trialsPerToleranceLevel ** tolLevel;
}

/**
 * The cheapest grid and tolerance levels whose modelled event-time error is within the accuracy asked, within the
 * cell limit and the solver's work budget, and their settings; or, for an accuracy no such pair reaches, the reason
 * (for numerics.event_accuracy_s), naming the limit that binds. The grid error and the time error are pursued
 * separately: a level refines the grid, a tolerance level divides the tolerances, and the plan takes only what the
 * accuracy needs of each (the cheapest in modelled work). Without an accuracy asked the default is the defaults'
 * own: 0.5 s, or the modelled error at level 0 when that is larger, so a file without the key runs as before.
 */
export function accuracyPlan(ask: AccuracyAsk): AccuracyPlan | { readonly error: string } {
  const d = accuracyDefaults;
  const D = ask.durationS;
  const atDefaults = modelledErrorS(D, 0, timeLevelOf(ask, 0));
  const asked = ask.eventAccuracyS ?? Math.max(d.eventAccuracyS, atDefaults);
  const free = ask.eventAccuracyS !== undefined && !(ask.ownGrid && ask.ownTolerances);
  const best = free ? cheapestLevels(ask, asked) : { level: 0, tolLevel: 0 };
  if ('error' in best) return best;
  const { level, tolLevel } = best;
  const ramp = level === 0 && tolLevel === 0 ? 0 : d.meltRampK * Math.min(1, asked / d.eventAccuracyS);
  return withConfirm({
    eventAccuracyS: asked,
    level,
    gridRefine: ask.ownGrid ? 1 : d.gridPerLevel ** level,
    toleranceDivisor: ask.ownTolerances ? 1 : d.tolerancePerLevel ** tolLevel,
    meltRampK: ask.ownTolerances ? 0 : ramp,
    expectedErrorS: modelledErrorS(D, level, timeLevelOf(ask, tolLevel)),
    ownGrid: ask.ownGrid,
    ownTolerances: ask.ownTolerances,
  }, free, D);
}

/** The plan of accuracyPlan(), with whether runProblem() is to climb to it: an accuracy asked, and a rung below worth trying. */
function withConfirm(plan: AccuracyPlan, free: boolean, durationS: number): AccuracyPlan {
  return { ...plan, confirm: free && ladderPlans(plan, durationS).length > 1 };
}

/**
 * The rungs runProblem() solves for a plan that asks to be confirmed: rung i is grid level min(i, ℓ) and tolerance
 * level min(i, k) of the plan's (ℓ, k), so each rung halves both modelled parts of the one below until it reaches the
 * plan, the last rung. Rung 0 is the defaults, the others carry the plan's melt ramp (none since meltRampK is 0). Each rung
 * states its own modelled error and does not confirm again. `durationS`: the run's duration (the rule's scale).
 * A rung between 0 and the plan whose modelled work is above ladderWorthShare of the plan's is left out (it would
 * cost about as much as the plan and save little: measured on the benchmark's scenario at 0.3 s, plan (1, 2), the
 * rungs (0, 0) and (1, 1) before it doubled the time), and rung 0 too when no rung is left between it and the plan:
 * then the plan is the only rung, solved as it is.
 */
export function ladderPlans(plan: AccuracyPlan, durationS: number): AccuracyPlan[] {
  const d = accuracyDefaults;
  const K = toleranceLevelOf(plan);
  const top = Math.max(plan.level, K);
  const work = (l: number, k: number) => (d.gridPerLevel * d.trialsPerGridLevel) ** l * d.trialsPerToleranceLevel ** k;
  // with the file's own tolerances every rung keeps them, so the time part of the plan's modelled error
  const ownTimePartS = plan.expectedErrorS - (d.spaceShareAtDefaults * durationS) / d.gridPerLevel ** plan.level;
  const rungs: AccuracyPlan[] = [];
  for (let i = 0; i <= top; i++) {
    const level = Math.min(i, plan.level);
    const tolLevel = Math.min(i, K);
    if (i > 0 && i < top && work(level, tolLevel) > d.ladderWorthShare * work(plan.level, K)) continue;
    rungs.push({
      ...plan,
      level,
      gridRefine: plan.ownGrid ? 1 : d.gridPerLevel ** level,
      toleranceDivisor: plan.ownTolerances ? 1 : d.tolerancePerLevel ** tolLevel,
      meltRampK: level === 0 && tolLevel === 0 ? 0 : plan.meltRampK,
      expectedErrorS: plan.ownTolerances ? (d.spaceShareAtDefaults * durationS) / d.gridPerLevel ** level + ownTimePartS
        : modelledErrorS(durationS, level, tolLevel),
      confirm: false,
    });
  }
  // rung 0 alone below the plan cannot be returned (a rung needs one below it for its estimate): solve the plan only
  return rungs.length === 2 ? rungs.slice(1) : rungs;
}

/** The tolerance level of a plan (its divisor is tolerancePerLevel to that power; 0 with the file's own tolerances). */
function toleranceLevelOf(plan: AccuracyPlan): number {
  return plan.ownTolerances ? 0 : Math.round(Math.log(plan.toleranceDivisor) / Math.log(accuracyDefaults.tolerancePerLevel));
}

/** The separator's event times of one run (null: not reached), in a fixed order. */
export type EventTimes = readonly (number | null)[];

/**
 * The event-time error of the last of a ladder's runs, estimated by Roache's grid convergence index (Roache,
 * Verification and Validation in Computational Science and Engineering, 1998, §5.6; Roache, "Perspective: a method for
 * uniform reporting of grid refinement studies", J. Fluids Eng. 116, 1994) with the refinement ratio 2 of the rungs
 * (each halves both modelled parts), applied to the event times as one vector in the max norm: d₂ is the largest
 * change of an event time between the last two runs and d₁ between the two before; GCI = F_s · d₂ / (2^p − 1). With
 * three runs converging (d₁ > d₂) p is the observed order log₂(d₁/d₂), never above the formal order 1 of the event
 * times (a cell per front), and F_s = 1.25; otherwise (two runs, or d₂ ≥ d₁) p = 1 and F_s = 3. The norm, not each
 * event alone, because one event's change may grow from one rung to the next while the vector's shrinks (the molten
 * time of the benchmark's scenario moves 0.059 s, then 0.076 s, while the largest change falls 0.174 → 0.076 s).
 * Infinity when only one of the last two runs reaches an event (not converged); undefined with fewer than two runs
 * or no event reached by either.
 */
export function estimatedErrorS(runs: readonly EventTimes[]): number | undefined {
  const d = accuracyDefaults;
  const n = runs.length;
  if (n < 2) return undefined;
  const d2 = largestChange(runs[n - 1]!, runs[n - 2]!);
  if (d2 === undefined || !Number.isFinite(d2)) return d2;
  if (d2 === 0) return 0;
  const d1 = n >= 3 ? largestChange(runs[n - 2]!, runs[n - 3]!) : undefined;
  if (d1 !== undefined && d1 > d2) {
    const p = Math.min(d.formalOrder, Math.log2(d1 / d2));
    return (d.safetyThreeRuns * d2) / (2 ** p - 1);
  }
  return (d.safetyTwoRuns * d2) / (2 ** d.formalOrder - 1);
}

/** The largest change of an event time between two runs; Infinity if only one reaches an event; undefined if none does. */
function largestChange(a: EventTimes, b: EventTimes): number | undefined {
  let worst: number | undefined;
  for (let e = 0; e < Math.max(a.length, b.length); e++) {
    const x = a[e] ?? null;
    const y = b[e] ?? null;
    if (x === null && y === null) continue;
    if (x === null || y === null) return Infinity;
    worst = Math.max(worst ?? 0, Math.abs(x - y));
  }
  return worst;
}

/**
 * The cheapest (grid level, tolerance level) in modelled work whose modelled error is within `asked`, with the grid
 * level at most the tolerance level, within the cell limit and the work budget. A file's own grid fixes the grid level
 * at 0; a file's own tolerances fix the tolerance level at the one they stand at (ownToleranceLevel), which then
 * bounds the grid level. When what is left cannot bring the error within the ask, the plan takes the level that
 * brings its own part within half the ask (or the finest that fits) and states the modelled error it reaches, which
 * is then above the ask.
 */
function cheapestLevels(ask: AccuracyAsk, asked: number): { level: number; tolLevel: number } | { readonly error: string } {
  const d = accuracyDefaults;
  const D = ask.durationS;
  const levels = ask.ownGrid ? 0 : d.maxLevel;
  const tolLevels = ask.ownTolerances ? 0 : d.maxToleranceLevel;
  const looserLevels = ask.ownTolerances ? 0 : d.maxLooserToleranceLevel;
  const cellsFit = (l: number) => ask.ownGrid || ask.baseCells * d.gridPerLevel ** l <= ask.maxCells;
  const workFits = (l: number, k: number) => modelledWork(ask.baseCells, l, k) <= d.workBudgetCellSteps;
  let best: { level: number; tolLevel: number; work: number } | undefined;
  let reachable = Infinity; // the finest modelled error within both limits, for the message
  let cellsBind = false;
  let workBinds = false;
  for (let l = 0; l <= levels; l++) {
    for (let k = -looserLevels; k <= tolLevels; k++) {
      const kt = timeLevelOf(ask, k);
      // a finer grid needs finer steps: at a fixed tolerance level a grid level lengthened the time error instead
      // (accuracyDefaults.spaceShareAtDefaults); looser tolerances than the defaults only on the default grid
      if (l > (k < 0 ? 0 : kt)) continue;
      const err = modelledErrorS(D, l, kt);
      const fits = cellsFit(l) && workFits(l, kt);
      if (fits) reachable = Math.min(reachable, err);
      if (err > asked) continue;
      if (!cellsFit(l)) { cellsBind = true; continue; }
      if (!workFits(l, kt)) { workBinds = true; continue; }
      const work = modelledWork(ask.baseCells, l, kt);
      if (best === undefined || work < best.work) best = { level: l, tolLevel: k, work };
    }
  }
  if (best !== undefined) return best;
  if (ask.ownGrid || ask.ownTolerances) {
    // only one part is ours to pursue: bring it within half the ask, or as far as the limits allow
    let l = 0;
    let k = 0;
    const kt = timeLevelOf(ask, 0);
    if (!ask.ownGrid) while (l < d.maxLevel && l + 1 <= kt && cellsFit(l + 1) && workFits(l + 1, kt) && (d.spaceShareAtDefaults * D) / d.gridPerLevel ** l > asked / 2) l++;
    if (!ask.ownTolerances) while (k < d.maxToleranceLevel && workFits(0, k + 1) && (d.timeShareAtDefaults * D) / 2 ** k > asked / 2) k++;
    return { level: l, tolLevel: k };
  }
  const limit = cellsBind ? `the limit of ${ask.maxCells} cells`
    : workBinds ? `the solver's work budget of ${d.workBudgetCellSteps.toExponential(0)} cells × steps (as modelled)`
    : `the finest levels (cells ×${d.gridPerLevel ** d.maxLevel}, tolerances ÷${d.tolerancePerLevel ** d.maxToleranceLevel})`;
  return {
    error: `no grid and tolerances within ${limit} reach it (modelled error ${modelledErrorS(D, 0, 0).toPrecision(2)} s at the defaults: ` +
      `${(d.spaceShareAtDefaults * D).toPrecision(2)} s from the grid, halved per doubling of the cells, and ${(d.timeShareAtDefaults * D).toPrecision(2)} s ` +
      `from the step tolerances, halved per division by ${d.tolerancePerLevel}): ask for ${twoFiguresUp(reachable)} s or more, or set the grid and tolerances yourself, got ${asked}`,
  };
}

/** x rounded up to two significant figures (an accuracy that is then surely reachable). */
function twoFiguresUp(x: number): number {
  const unit = 10 ** (Math.floor(Math.log10(x)) - 1);
  return Number((Math.ceil(x / unit - 1e-9) * unit).toPrecision(2));
}

/**
 * The file's numerics (defaults filled in) with the accuracy plan applied: tolerances divided, and the plan recorded
 * for runProblem() (grid factor, melt ramp); or the field error of an accuracy no level reaches. `defaults`: the
 * default tolerances, against which the file's own are placed (ownToleranceLevel).
 */
export function applyAccuracy(s: ScenarioFile, numerics: Numerics,
  defaults: { readonly toleranceK: number; readonly liquidFractionTolerance: number }): Numerics | FieldError {
  const num = s.numerics ?? {};
  const ownGrid = num.cells_per_mm !== undefined || num.min_cells_per_layer !== undefined ||
    num.separator_cells_per_mm !== undefined || num.min_separator_cells !== undefined || s.layers.some((l) => l.cells !== undefined);
  const ownTolerances = num.tolerance_K !== undefined || num.liquid_fraction_tolerance !== undefined;
  const baseCells = s.layers.reduce((sum, l) => sum + cellsOfLayer(mmToM(l.thickness_mm), l.cells, l.separator === true, numerics), 0);
  const plan = accuracyPlan({
    eventAccuracyS: num.event_accuracy_s, durationS: s.duration_s, ownGrid, ownTolerances,
    baseCells, maxCells: scenarioLimitDefaults.maxCells,
    ownToleranceLevel: ownTolerances ? ownToleranceLevel(numerics.toleranceK, numerics.liquidFractionTolerance, defaults.toleranceK, defaults.liquidFractionTolerance) : 0,
  });
  if ('error' in plan) return { path: 'numerics.event_accuracy_s', message: plan.error };
  return {
    ...numerics,
    toleranceK: numerics.toleranceK / plan.toleranceDivisor,
    liquidFractionTolerance: numerics.liquidFractionTolerance / plan.toleranceDivisor,
    accuracy: plan,
  };
}

/** A plan's tolerances against the defaults, as a factor: "÷3" for a divisor of 3, "×9" for one of 1/9 (loosened). */
export function toleranceFactorText(divisor: number): string {
  return divisor >= 1 ? `÷${divisor}` : `×${Math.round(1 / divisor)}`;
}

/** One line for the terminal table: the accuracy asked and what was chosen for it. */
export function accuracyLine(plan: AccuracyPlan | undefined): string {
  if (plan === undefined) return 'accuracy: grid and tolerances as given (no accuracy asked)';
  const asked = `event times to ${Number(plan.eventAccuracyS.toPrecision(3))} s`;
  const estimate = plan.estimatedErrorS === undefined ? ''
    : `; estimated ${Number.isFinite(plan.estimatedErrorS) ? `${Number(plan.estimatedErrorS.toPrecision(2))} s` : 'unbounded (an event reached on one grid only)'} from the runs below it`;
  const expected = `modelled error about ${Number(plan.expectedErrorS.toPrecision(2))} s${estimate}`;
  if (plan.ownGrid && plan.ownTolerances) return `accuracy: grid and tolerances as set in the file (${asked} not pursued)`;
  if (plan.gridRefine === 1 && plan.toleranceDivisor === 1) {
    const what = plan.ownGrid ? 'grid as given, default tolerances' : plan.ownTolerances ? 'default grid, tolerances as given' : 'default grid and tolerances';
    return `accuracy: ${asked}, ${what} (${expected})`;
  }
  const how = [
    plan.gridRefine > 1 ? `cells ×${plan.gridRefine}` : plan.ownGrid ? 'grid as given' : 'default grid',
    plan.toleranceDivisor === 1 ? 'tolerances as given'
      : `tolerances ${toleranceFactorText(plan.toleranceDivisor)}${plan.toleranceDivisor < 1 ? ' (looser than the defaults)' : ''}`,
    ...(plan.meltRampK > 0 ? [`melt kinks smoothed over ±${Number(plan.meltRampK.toPrecision(2))} K`] : []),
  ];
  return `accuracy: ${asked}, ${how.join(', ')} (${expected})`;
}
