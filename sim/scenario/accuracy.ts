/**
 * Accuracy asked in seconds: `numerics.event_accuracy_s` → the grid and the step tolerances the run uses.
 *
 * The verdict times (molten, half-frozen, frozen) carry a spatial error, first order in Δx (the enthalpy method
 * resolves a front to a cell: a cell turns fully liquid or solid as the front leaves it), and a time error that
 * the step tolerances set. A refinement level ℓ halves the cells' width (grid × 2^ℓ) and divides both tolerances by
 * 3^ℓ (the global error of TR-BDF2 with local error control falls about as tol^(2/3), so ÷3 halves it too): each level
 * about halves the event-time error. The error at level 0 (the defaults) is modelled as a share of the run's
 * duration, which stands for the time scales of its events; the share is calibrated by refinement on examples/
 * (DEVELOPERS.md, "Accuracy"). The level is the smallest that brings the modelled error within the accuracy asked.
 * It is a rule, not a run-time check: no second run estimates the error of this one (the tests check the rule by
 * refinement on the examples and on a seeded scan).
 *
 * Levels above 0 also smooth the melt's kinks (physics/melt-ramp.ts) over ±δ, δ shrinking with the accuracy asked, so
 * the ramp's own model error stays a small share of it; level 0 keeps the curve exactly as written (the defaults'
 * verified behaviour is unchanged). Expert keys win: tolerances given in the file are used as given (not divided),
 * a grid given in the file (cells_per_mm, min_cells_per_layer, separator_cells_per_mm, min_separator_cells, or any
 * layer's `cells`) is used as given (not refined), and with both given the accuracy is stated but not pursued.
 */
import { cellsInLayer } from '../grid/mesh.ts';
import type { AccuracyPlan, Numerics } from '../physics/problem.ts';
import { mmToM } from '../physics/units.ts';
import type { FieldError } from './field-errors.ts';
import { scenarioLimitDefaults } from './scenario-limits.ts';
import type { ScenarioFile } from './scenario-schema.ts';

export type { AccuracyPlan };

export const accuracyDefaults = {
  /**
   * Floor of the default of numerics.event_accuracy_s, s. Without the key a run keeps the default grid and tolerances
   * (as before the key existed) and states their modelled accuracy, max(0.5 s, errorShareAtDefaults × duration):
   * 2 s for a one-hour run. Asking for 0.5 s of a one-hour run costs two levels (cells × 4, tolerances ÷ 9).
   */
  eventAccuracyS: 0.5,
  /** Smallest accuracy one may ask, s: below it the grid a one-hour run needs passes the cell limit anyway. */
  minEventAccuracyS: 1e-3,
  /**
   * Modelled event-time error at level 0 as a share of the duration (1/s · s), from the event-time changes of the
   * examples between level 0 and level 2 (tests/convergence/event-accuracy.test.ts): largest 1.08 s of 2400 s
   * (sleeved-square-cell, molten), 1.38 s of 5400 s (insulated-pellet-stack, frozen), 0.74 s of 3600 s (cold-morning,
   * molten), i.e. ≤ 4.5e-4 of the duration; 5.5e-4 leaves a 20 % margin. The first-order molten and frozen times
   * ("every cell") bind; half-frozen (a mean) is 5–10× better.
   */
  errorShareAtDefaults: 5.5e-4,
  /** Grid factor and tolerance divisor per level (see above). */
  gridPerLevel: 2,
  tolerancePerLevel: 3,
  /** Highest level: grid × 64; beyond it the cell limit (scenarioLimitDefaults.maxCells) binds first anyway. */
  maxLevel: 6,
  /**
   * Half-width of the melt ramp at the default accuracy, K, scaled down in proportion to a finer accuracy asked
   * (0.02 K at 0.1 s). Measured at 0.1 K on the demo, 1600 cells: event times move ≤ 0.04 s (molten), 0.004 s
   * (half-frozen), 0.001 s (frozen) against no ramp, and the Newton work falls by half.
   */
  meltRampK: 0.1,
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
}

/**
 * The smallest level whose modelled event-time error is within the accuracy asked, and its settings; or, for an
 * accuracy asked that no level within maxLevel and the cell limit reaches, the reason (for numerics.event_accuracy_s).
 * Without an accuracy asked the default is the defaults' own: 0.5 s, or the modelled error at level 0 when that is
 * larger (runs longer than about an hour), so a file without the key runs exactly as before.
 */
export function accuracyPlan(ask: AccuracyAsk): AccuracyPlan | { readonly error: string } {
  const d = accuracyDefaults;
  const atDefaults = d.errorShareAtDefaults * ask.durationS;
  const asked = ask.eventAccuracyS ?? Math.max(d.eventAccuracyS, atDefaults);
  const free = ask.eventAccuracyS !== undefined && !(ask.ownGrid && ask.ownTolerances);
  let level = 0;
  while (free && atDefaults / 2 ** level > asked) level++;
  const fits = (l: number) => ask.ownGrid || ask.baseCells * d.gridPerLevel ** l <= ask.maxCells;
  if (level > d.maxLevel || !fits(level)) {
    return {
      error: `needs about ${(d.gridPerLevel ** level).toFixed(0)}× the default cells (modelled error ${atDefaults.toPrecision(2)} s at the defaults, ` +
        `halved per doubling), beyond ${level > d.maxLevel ? `the finest level (${d.gridPerLevel ** d.maxLevel}×)` : `the limit of ${ask.maxCells} cells`}: ` +
        `ask for ${(atDefaults / 2 ** Math.min(d.maxLevel, maxFittingLevel(fits))).toPrecision(2)} s or more, or set the grid and tolerances yourself, got ${asked}`,
    };
  }
  const ramp = level === 0 ? 0 : d.meltRampK * Math.min(1, asked / d.eventAccuracyS);
  return {
    eventAccuracyS: asked,
    level,
    gridRefine: ask.ownGrid ? 1 : d.gridPerLevel ** level,
    toleranceDivisor: ask.ownTolerances ? 1 : d.tolerancePerLevel ** level,
    meltRampK: ask.ownTolerances ? 0 : ramp,
    expectedErrorS: atDefaults / 2 ** level,
    ownGrid: ask.ownGrid,
    ownTolerances: ask.ownTolerances,
  };
}

function maxFittingLevel(fits: (level: number) => boolean): number {
  let l = 0;
  while (l < accuracyDefaults.maxLevel && fits(l + 1)) l++;
  return l;
}

/**
 * The file's numerics (defaults filled in) with the accuracy plan applied: tolerances divided, and the plan recorded
 * for runProblem() (grid factor, melt ramp); or the field error of an accuracy no level reaches.
 */
export function applyAccuracy(s: ScenarioFile, numerics: Numerics): Numerics | FieldError {
  const num = s.numerics ?? {};
  const ownGrid = num.cells_per_mm !== undefined || num.min_cells_per_layer !== undefined ||
    num.separator_cells_per_mm !== undefined || num.min_separator_cells !== undefined || s.layers.some((l) => l.cells !== undefined);
  const ownTolerances = num.tolerance_K !== undefined || num.liquid_fraction_tolerance !== undefined;
  const baseCells = s.layers.reduce((sum, l) => sum + cellsInLayer(mmToM(l.thickness_mm), l.cells,
    l.separator ? numerics.separatorCellsPerMm : numerics.cellsPerMm,
    l.separator ? numerics.minSeparatorCells : numerics.minCellsPerLayer), 0);
  const plan = accuracyPlan({
    eventAccuracyS: num.event_accuracy_s, durationS: s.duration_s, ownGrid, ownTolerances,
    baseCells, maxCells: scenarioLimitDefaults.maxCells,
  });
  if ('error' in plan) return { path: 'numerics.event_accuracy_s', message: plan.error };
  return {
    ...numerics,
    toleranceK: numerics.toleranceK / plan.toleranceDivisor,
    liquidFractionTolerance: numerics.liquidFractionTolerance / plan.toleranceDivisor,
    accuracy: plan,
  };
}

/** One line for the terminal table: the accuracy asked and what was chosen for it. */
export function accuracyLine(plan: AccuracyPlan | undefined): string {
  if (plan === undefined) return 'accuracy: grid and tolerances as given (no accuracy asked)';
  const asked = `event times to ${Number(plan.eventAccuracyS.toPrecision(3))} s`;
  const expected = `modelled error about ${Number(plan.expectedErrorS.toPrecision(2))} s`;
  if (plan.ownGrid && plan.ownTolerances) return `accuracy: grid and tolerances as set in the file (${asked} not pursued)`;
  if (plan.level === 0) {
    const what = plan.ownGrid ? 'grid as given, default tolerances' : plan.ownTolerances ? 'default grid, tolerances as given' : 'default grid and tolerances';
    return `accuracy: ${asked}, ${what} (${expected})`;
  }
  const how = [
    plan.gridRefine > 1 ? `cells ×${plan.gridRefine}` : 'grid as given',
    plan.toleranceDivisor > 1 ? `tolerances ÷${plan.toleranceDivisor}` : 'tolerances as given',
    ...(plan.meltRampK > 0 ? [`melt kinks smoothed over ±${Number(plan.meltRampK.toPrecision(2))} K`] : []),
  ];
  return `accuracy: ${asked}, ${how.join(', ')} (${expected})`;
}
