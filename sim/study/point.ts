/**
 * One run of a window search, boiled down to what the search and the operating chart read: the smallest margin to
 * any limit (and which layer and limit it is, and when that layer peaks), whether the separator became fully molten
 * (as a continuous indicator, so a crossing can be found by interpolation), and the usable window after removal.
 *
 * Definitions (README, "The safe operating duration"):
 *   margin_K      the smallest limit − peak over every limit of every layer (the binding layer's margin_K).
 *   molten        whether every separator cell was fully liquid at some time (molten_at_s is not null).
 *   melt_reach    how far the separator got towards fully molten, one number that moves continuously with the varied
 *                 input: short of molten, its largest volume-mean liquid fraction less 1 (−1 to just below 0); once
 *                 molten, how far its least-melted cell rose above its liquidus at most, in spans of its melt's
 *                 enthalpy (≥ 0; record-trace.ts: the latent heat, or 1 K of sensible heat if that is larger). ≥ 0
 *                 exactly when molten_at_s is not null.
 *   window_s      half_frozen_at_s − heat_off_s (the usable window, whatever the margins: the search judges those).
 *   until_liquid_s  from heat-off until the separator's mean liquid fraction first falls below the chosen F.
 *   solidifying_s   from heat-off until the first separator cell starts to solidify (after being fully molten).
 */
import type { LimitKind } from '../physics/material.ts';
import type { Problem } from '../physics/problem.ts';
import { runProblem, stopSentence } from '../run.ts';
import type { StopReason } from '../time/drive.ts';
import { firstCrossing, type Summary, type WindowStatus } from '../observe/verdict.ts';
import type { SeparatorTrace } from '../observe/record-trace.ts';

export interface Binding {
  readonly layer: string;
  readonly kind: LimitKind;
  readonly limit_C: number;
  readonly peak_C: number;
  /** When the layer peaks (the time the limit binds), s. */
  readonly at_s: number;
  readonly margin_K: number;
}

export interface WindowPoint {
  /** The varied input, SI (s, K, W/m², W/m³). */
  readonly value: number;
  readonly heat_off_s: number | null;
  /** Smallest margin to any limit, K; null when no layer has a limit. */
  readonly margin_K: number | null;
  readonly binding: Binding | null;
  readonly molten_at_s: number | null;
  /** How far the separator got towards fully molten (see above); null without a separator. */
  readonly melt_reach: number | null;
  readonly half_frozen_at_s: number | null;
  readonly window_s: number | null;
  readonly until_liquid_s: number | null;
  readonly solidifying_s: number | null;
  readonly status: WindowStatus;
  /** The separator layer's id, if there is one. */
  readonly separator: string | null;
}

/** Whether a run keeps more than the required margin (K) below every limit; a layer without limits keeps any. */
export const keepsMargin = (p: Pick<WindowPoint, 'margin_K'>, requiredK: number): boolean => p.margin_K === null || p.margin_K > requiredK;

/**
 * A run that did not finish: the search cannot judge this value, so it stops and says where; `stop` is why and when
 * the run stopped (none for a cancelled run).
 */
export class SolveFailure extends Error {
  /** `at`: the value of the knob (hold in s, or the heat input's strength) whose run failed. */
  constructor(message: string, readonly stop?: { readonly reason: StopReason; readonly tS: number; readonly message: string },
    readonly at?: number) {
    super(message);
  }
}

function bindingOf(summary: Summary): Binding | null {
  let best: Binding | null = null;
  for (const [layer, v] of Object.entries(summary.layers)) {
    for (const l of v.limits) {
      if (best === null || l.margin_K < best.margin_K) {
        best = { layer, kind: l.kind, limit_C: l.at_C, peak_C: v.peak_C, at_s: v.peak_at_s, margin_K: l.margin_K };
      }
    }
  }
  return best;
}

/**
 * melt_reach (see above). Its sign is the molten verdict's by construction: a mean liquid fraction that rounds to 1
 * while a cell is still short of its liquidus reads just below 0, and a margin that could only be below 0 on a molten
 * run (none: the verdict reads the same points) would read 0.
 */
function meltReach(molten: boolean, trace: SeparatorTrace): number {
  return molten ? Math.max(trace.peakMeltMargin, 0) : Math.min(trace.peakMeanLiquid - 1, -Number.MIN_VALUE);
}

/**
 * Runs the problem once and boils it down. `untilLiquid` is the liquid fraction F, or null. Without F the run keeps
 * only what the verdicts read (detail 'summary': every event time is exact there, record-trace.ts); the crossing of
 * another level F needs every recorded point, so then the run keeps its full detail.
 */
export function evaluatePoint(problem: Problem, value: number, untilLiquid: number | null): WindowPoint {
  const out = runProblem(problem, { detail: untilLiquid === null ? 'summary' : 'full' });
  if (out.status !== 'ok') {
    throw out.status === 'failed' ? new SolveFailure(`at ${value}, ${stopSentence(out)}`, out, value) : new SolveFailure(`the run at ${value} was cancelled`, undefined, value);
  }
  const { summary, record } = out;
  const sep = record.separator;
  const off = summary.heat_off_s;
  const since = (t: number | null) => (t === null || off === null ? null : t - off);
  const molten = summary.separator.molten_at_s;
  const half = summary.separator.half_frozen_at_s;
  const binding = bindingOf(summary);
  return {
    value,
    heat_off_s: off,
    margin_K: binding ? binding.margin_K : null,
    binding,
    molten_at_s: molten,
    melt_reach: sep ? meltReach(molten !== null, sep) : null,
    half_frozen_at_s: half,
    window_s: molten !== null ? since(half) : null,
    until_liquid_s: sep && molten !== null && off !== null && untilLiquid !== null
      ? since(firstCrossing(sep.tS, sep.meanLiquid, untilLiquid, off, 'fall-below')) : null,
    solidifying_s: sep && molten !== null && off !== null ? since(firstCrossing(sep.tS, sep.meltMargin, 0, off, 'fall-below')) : null,
    status: summary.safe_window_status,
    separator: problem.layers.find((l) => l.separator)?.id ?? null,
  };
}
