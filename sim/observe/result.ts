/**
 * The result document of `freezeline run FILE --json` (DESIGN.md, "Result"): summary, probes and series, with a few
 * additions (warnings, solver statistics, per-layer limit lists). Every number is finite: a NaN or infinity here is
 * an internal error, reported as such rather than written as null.
 */
import type { Grid } from '../grid/mesh.ts';
import type { Problem } from '../physics/problem.ts';
import type { RunRecord } from './record.ts';
import type { Summary } from './verdict.ts';
import { coefficientTrace, type Coefficient } from './coefficients.ts';

export interface ResultDocument {
  readonly summary: Summary & { readonly warnings: readonly string[] };
  /** `label` (an addition to the contract) says what each probe marks: "bottom face", "anode mid-plane", … */
  readonly probes: { readonly x_mm: readonly number[]; readonly label: readonly string[]; readonly t_s: readonly number[]; readonly T_C: readonly (readonly number[])[] };
  readonly series: {
    readonly t_s: readonly number[];
    readonly layers: Readonly<Record<string, { min_C: number[]; mean_C: number[]; max_C: number[]; liquid_fraction?: number[] }>>;
    readonly faces: { readonly bottom_C: readonly number[]; readonly top_C: readonly number[] };
    /**
     * The heater (an addition; present only with a heater face): the power during the step ending at each time, W,
     * and the plate temperature, °C (null where no heater is under the stack: a lifted-off plate is not followed).
     */
    readonly heater?: { readonly power_W: readonly number[]; readonly plate_C: readonly (number | null)[] };
  };
  readonly solver: { readonly cells: number; readonly steps: number; readonly rejected_steps: number; readonly newton_iterations: number };
  /**
   * The accuracy the run was solved to (an addition to the contract; scenario/accuracy.ts): the accuracy asked of the
   * verdict times, the refinement level chosen for it, its grid factor and tolerance divisor, the tolerances used, the
   * melt ramp, and the event-time error the rule expects there (modelled, not measured). event_accuracy_s is null
   * for a problem built without a scenario file. estimated_error_s: the error estimated from the runs of the levels
   * below it (runProblem's ladder, scenario/accuracy.ts estimatedErrorS); null when none was estimated or the estimate
   * is unbounded (an event reached on one grid only).
   */
  readonly numerics: {
    readonly event_accuracy_s: number | null; readonly level: number; readonly grid_refine: number; readonly tolerance_divisor: number;
    readonly tolerance_K: number; readonly liquid_fraction_tolerance: number; readonly melt_ramp_K: number; readonly expected_error_s: number | null;
    readonly estimated_error_s: number | null;
  };
  /** Every coefficient the solver used, with its source (an addition; observe/coefficients.ts). */
  readonly coefficients: readonly Coefficient[];
}

/** The solver's counters the document prints (time/evolve.ts EvolveStats has them; observe/ does not import time/). */
export interface SolverCounts { readonly steps: number; readonly rejected: number; readonly newtonIterations: number }

export function resultDocument(problem: Problem, grid: Grid, record: RunRecord, summary: Summary, stats: SolverCounts): ResultDocument {
  const doc: ResultDocument = {
    summary: { ...summary, warnings: record.warnings },
    probes: { x_mm: record.probes.xMm, label: problem.probeLabels, t_s: record.probes.tS, T_C: record.probes.tC },
    series: seriesDocument(problem, record),
    solver: { cells: grid.n, steps: stats.steps, rejected_steps: stats.rejected, newton_iterations: stats.newtonIterations },
    numerics: numericsKeys(problem),
    coefficients: coefficientTrace(problem),
  };
  assertFinite(doc, 'result');
  return doc;
}

/** The document's `series`: every recorded time, each layer's min, mean and max (and a separator's liquid fraction), the faces, the heater. */
export function seriesDocument(problem: Problem, record: RunRecord): ResultDocument['series'] {
  // keyed by layer id with own properties (Object.fromEntries), so any id, "__proto__" included, is kept
  const layers = Object.fromEntries(record.layers.map((l, li) => [l.id, {
    min_C: Array.from(l.minC), mean_C: Array.from(l.meanC), max_C: Array.from(l.maxC),
    ...(l.liquidFraction && problem.layers[li]!.separator ? { liquid_fraction: Array.from(l.liquidFraction) } : {}),
  }]));
  return {
    t_s: Array.from(record.tS), layers, faces: { bottom_C: Array.from(record.bottomC), top_C: Array.from(record.topC) },
    ...(record.heater ? { heater: { power_W: Array.from(record.heater.powerW), plate_C: Array.from(record.heater.plateC, (c) => (Number.isNaN(c) ? null : c)) } } : {}),
  };
}

function numericsKeys(problem: Problem): ResultDocument['numerics'] {
  const { accuracy, toleranceK, liquidFractionTolerance } = problem.numerics;
  return {
    event_accuracy_s: accuracy?.eventAccuracyS ?? null, level: accuracy?.level ?? 0, grid_refine: accuracy?.gridRefine ?? 1,
    tolerance_divisor: accuracy?.toleranceDivisor ?? 1, tolerance_K: toleranceK, liquid_fraction_tolerance: liquidFractionTolerance,
    melt_ramp_K: accuracy?.meltRampK ?? 0, expected_error_s: accuracy?.expectedErrorS ?? null,
    estimated_error_s: accuracy?.estimatedErrorS !== undefined && Number.isFinite(accuracy.estimatedErrorS) ? accuracy.estimatedErrorS : null,
  };
}

/** Throws if any number in a JSON-like value is NaN or infinite (null is allowed: it means "never"). */
export function assertFinite(value: unknown, path: string): void {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`internal error: ${path} is ${value}`);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => assertFinite(v, `${path}[${i}]`));
  } else if (typeof value === 'object' && value !== null) {
    for (const [k, v] of Object.entries(value)) assertFinite(v, `${path}.${k}`);
  }
}
