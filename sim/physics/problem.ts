/**
 * The problem as the solver sees it: a validated scenario converted to SI (m, s, K, W). Plain readonly data; built
 * only by scenario.ts. Face conditions are discriminated unions, so a held face can carry no other term.
 */
import type { Bench } from './bench.ts';
import type { CellHeatTerm } from './heat-terms.ts';
import type { Heater } from './heater.ts';
import type { Material } from './material.ts';
import { mmToM } from './units.ts';

export type Convection =
  | { readonly kind: 'none' }
  | { readonly kind: 'fixed'; /** W·m⁻²·K⁻¹ */ readonly coefficient: number }
  | { readonly kind: 'natural' };

export interface Plate {
  readonly tK: number;
  /** W·m⁻²·K⁻¹ */
  readonly conductance: number;
}

/** The terms of a face condition. With none it is adiabatic. */
export type FaceCondition =
  | { readonly kind: 'fixed'; readonly tK: number }
  | {
      readonly kind: 'terms';
      /** Heat into the face, W/m² (flux plus heater power over the footprint). */
      readonly fluxWPerM2: number;
      readonly convection: Convection;
      readonly fluidK: number;
      readonly emissivity: number;
      readonly surroundingsK: number;
      readonly plate: Plate | undefined;
    }
  /** The face on a heater plate with its own thermal mass and control (heater.ts); the face takes no other term. */
  | { readonly kind: 'heater'; readonly heater: Heater }
  /** The face resting on a bench surface, a semi-infinite solid (bench.ts); the face takes no other term. */
  | { readonly kind: 'bench'; readonly bench: Bench };

export interface FaceSegment {
  readonly fromS: number;
  readonly condition: FaceCondition;
}

/** Which way an exposed face looks: it picks the natural-convection correlation. */
export type Facing = 'down' | 'up';

export interface SourceInterval {
  readonly fromS: number;
  readonly toS: number;
  /** W/m³ */
  readonly value: number;
  /**
   * The layer's file field the interval came from, for messages and study labels: `source_W_m3[0]`, `pellet`,
   * `joule`, `heat_W_kg[1]` (absent: `source_W_m3[k]` by its index).
   */
  readonly origin?: string;
}

export interface Layer {
  readonly id: string;
  readonly material: Material;
  readonly thicknessM: number;
  readonly separator: boolean;
  readonly sources: readonly SourceInterval[];
  readonly cells: number | undefined;
  /** Temperature-dependent volumetric terms in every cell of the layer (heat-terms.ts); none when absent. */
  readonly terms?: readonly CellHeatTerm[];
}

export interface Footprint {
  readonly areaM2: number;
  readonly perimeterM: number;
}

/** A footprint as the file gives it, in mm: a disc or a rectangle. */
export type FootprintMm = { readonly diameter_mm: number } | { readonly width_mm: number; readonly length_mm: number };

/** Area (πd²/4 or w·l) and perimeter (πd or 2(w + l)) of a footprint given in mm, in m² and m: the one definition. */
export function footprintGeometry(f: FootprintMm): Footprint {
  if ('diameter_mm' in f) {
    const d = mmToM(f.diameter_mm);
    return { areaM2: (Math.PI * d * d) / 4, perimeterM: Math.PI * d };
  }
  const w = mmToM(f.width_mm);
  const l = mmToM(f.length_mm);
  return { areaM2: w * l, perimeterM: 2 * (w + l) };
}

/**
 * Characteristic length of a horizontal face for natural convection, L = A/P (Goldstein, Sparrow & Jones 1973), m;
 * 0 without a footprint (the scenario check refuses "natural" then, so it is never used).
 */
export const characteristicLengthM = (footprint: Footprint | undefined): number =>
  (footprint ? footprint.areaM2 / footprint.perimeterM : 0);

export interface Numerics {
  /** Local error tolerance per step, in kelvin-equivalent enthalpy (error in H divided by ρc_p). */
  readonly toleranceK: number;
  /** Local error tolerance per step on liquid fractions (a share of the latent heat). */
  readonly liquidFractionTolerance: number;
  readonly cellsPerMm: number;
  readonly minCellsPerLayer: number;
  /** Separator layers get their own, finer count: their melt and freeze times are the verdict. */
  readonly separatorCellsPerMm: number;
  readonly minSeparatorCells: number;
  /**
   * Most cells the per-millimetre rule gives one layer, and one separator layer (mesh.ts, cellsOfLayer); absent: no
   * cap. A layer's own `cells` and a minimum above the cap win over it.
   */
  readonly maxCellsPerLayer?: number | undefined;
  readonly maxSeparatorCells?: number | undefined;
  readonly maxStepS: number;
  /**
   * The accuracy the run is solved to (scenario/accuracy.ts: numerics.event_accuracy_s → grid and tolerances). The
   * tolerances above are already divided for it; the grid factor and the melt ramp are applied by runProblem().
   * Absent for a Problem built by hand: the settings above, as they are.
   */
  readonly accuracy?: AccuracyPlan | undefined;
}

/** The settings chosen for an accuracy asked in seconds (scenario/accuracy.ts). */
export interface AccuracyPlan {
  /** The accuracy asked of the verdict times, s. */
  readonly eventAccuracyS: number;
  /** Refinement level (0 = the defaults). */
  readonly level: number;
  /** Cells multiplied by this (1 when the file gives its own grid). */
  readonly gridRefine: number;
  /**
   * Tolerances divided by this (1 when the file gives its own tolerances): 3^k at tolerance level k, below 1 (1/3,
   * 1/9) for an accuracy asked above the defaults' modelled error, which the run meets with looser tolerances.
   */
  readonly toleranceDivisor: number;
  /** Half-width of the melt ramp, K (physics/melt-ramp.ts; 0: the enthalpy curve as written). */
  readonly meltRampK: number;
  /** The event-time error the rule expects at this level, s (modelled, not measured). */
  readonly expectedErrorS: number;
  /** The file set its own grid / its own tolerances (expert keys win: used as given). */
  readonly ownGrid: boolean;
  readonly ownTolerances: boolean;
  /**
   * runProblem() climbs the ladder of levels below this plan, (0, 0), (1, 1), … (scenario/accuracy.ts ladderPlans),
   * and stops at the first whose estimated event-time error is within the accuracy asked; this plan is the top rung.
   */
  readonly confirm?: boolean | undefined;
  /** The event-time error estimated from the ladder's runs, s (scenario/accuracy.ts estimatedErrorS); absent: none. */
  readonly estimatedErrorS?: number | undefined;
}

export interface Problem {
  readonly name: string;
  readonly ambientK: number;
  readonly initialK: number;
  readonly durationS: number;
  readonly footprint: Footprint | undefined;
  /** Bottom to top. */
  readonly layers: readonly Layer[];
  /** Contact resistance between layer i and layer i+1, m²·K/W (length layers − 1). */
  readonly contactResistances: readonly number[];
  readonly bottom: readonly FaceSegment[];
  readonly top: readonly FaceSegment[];
  readonly outputTimesS: readonly number[];
  readonly probesM: readonly number[];
  /** What each probe marks ("anode mid-plane", "collector | separator"), same order as probesM. */
  readonly probeLabels: readonly string[];
  readonly numerics: Numerics;
}

/** The condition that holds on a face at time t (s): the last segment with fromS ≤ t; adiabatic before the first. */
export function conditionAt(segments: readonly FaceSegment[], tS: number): FaceCondition {
  let found: FaceCondition = ADIABATIC;
  for (const seg of segments) {
    if (seg.fromS <= tS) found = seg.condition;
    else break;
  }
  return found;
}

export const ADIABATIC: FaceCondition = {
  kind: 'terms', fluxWPerM2: 0, convection: { kind: 'none' }, fluidK: 0, emissivity: 0, surroundingsK: 0, plate: undefined,
};

/** Volumetric source of a layer at time t (s), W/m³: the sum of the intervals with fromS ≤ t < toS. */
export function sourceAt(layer: Layer, tS: number): number {
  let sum = 0;
  for (const s of layer.sources) if (s.fromS <= tS && tS < s.toS) sum += s.value;
  return sum;
}

/** Sorted, unique times in (0, duration] at which a step must end. */
export function breakpoints(problem: Problem): number[] {
  const set = new Set<number>([problem.durationS]);
  for (const seg of [...problem.bottom, ...problem.top]) set.add(seg.fromS);
  for (const layer of problem.layers) for (const s of layer.sources) { set.add(s.fromS); set.add(s.toS); }
  for (const t of problem.outputTimesS) set.add(t);
  for (const side of [problem.bottom, problem.top]) {
    side.forEach((seg, i) => {
      const c = seg.condition;
      if (c.kind !== 'heater' || c.heater.control.kind !== 'pi') return;
      // a PI heater's samples: the step lands on each, where the controller reads its sensor (time/plates.ts)
      const end = Math.min(side[i + 1]?.fromS ?? problem.durationS, problem.durationS);
      for (let k = 1, t = seg.fromS + c.heater.control.periodS; t < end; k++, t = seg.fromS + k * c.heater.control.periodS) set.add(t);
    });
  }
  return [...set].filter((t) => t > 0 && t <= problem.durationS).sort((a, b) => a - b);
}
