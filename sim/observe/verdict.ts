/**
 * Verdicts from a run: when the heat ends, when the separator is molten, half-frozen and frozen, each layer's peak
 * against its limits, and the safe window. Event times are found where an indicator crosses its level between two
 * recorded points (step ends and TR-BDF2 stage points) and interpolated linearly there, never rounded to a step.
 *
 * Definitions (also in the README):
 *   heat_off_s       the end of the last heat input: a held plate, a held face temperature, a positive imposed flux
 *                    or heater power, or a positive volumetric source. 0 when there is none; null when one lasts
 *                    to the end of the run.
 *   molten_at_s      first time every separator cell is fully liquid.
 *   half_frozen_at_s first time after heat_off_s that the separator's volume-mean liquid fraction falls below 0.5.
 *   frozen_at_s      first time after half_frozen_at_s that every separator cell is fully solid.
 *   peak_C           the layer's hottest point over the run; peak_at_s the first time it came within
 *                    recordDefaults.peakReachedWithinK (0.05 K) of it (record.ts).
 *   margin_K         limit temperature − peak temperature of the layer, for its binding (smallest-margin) limit.
 *   safe_window_s    half_frozen_at_s − heat_off_s, when the separator was fully molten at some time, it half-froze
 *                    within the run, and no layer reached any of its limits; null otherwise (safe_window_status says why).
 */
import { isHeatInput } from '../physics/faces.ts';
import type { LimitKind } from '../physics/material.ts';
import type { Problem } from '../physics/problem.ts';
import type { RunRecord } from './record.ts';
import { kToC } from '../physics/units.ts';

export interface LayerVerdict {
  readonly peak_C: number;
  readonly peak_at_s: number;
  readonly limit: { readonly kind: LimitKind; readonly at_C: number } | null;
  readonly margin_K: number | null;
  /** Every limit of the layer's material with its margin (an addition to the contract). */
  readonly limits: readonly { readonly kind: LimitKind; readonly at_C: number; readonly margin_K: number }[];
}

export type WindowStatus = 'ok' | 'limit-crossed' | 'never-molten' | 'no-separator' | 'heat-never-off' | 'still-molten-at-end';

export interface Summary {
  readonly heat_off_s: number | null;
  readonly separator: { readonly molten_at_s: number | null; readonly half_frozen_at_s: number | null; readonly frozen_at_s: number | null };
  readonly layers: Readonly<Record<string, LayerVerdict>>;
  readonly safe_window_s: number | null;
  readonly safe_window_status: WindowStatus;
  /** The layer with the smallest margin, if any layer has a limit. */
  readonly binding_layer: string | null;
  readonly energy: {
    readonly in_J_m2: number; readonly out_J_m2: number; readonly stored_J_m2: number; readonly imbalance_rel: number;
    /** Heat in and out through the side walls (edge losses; present only when the scenario has them), J/m². */
    readonly edge_in_J_m2?: number; readonly edge_out_J_m2?: number;
    /** Electric heat into the heater plates (part of in_J_m2; present only with a heater), J/m². */
    readonly heater_J_m2?: number;
  };
  /**
   * The heater (an addition to the contract; present only with a heater face): its electric energy, J; its duty cycle,
   * that energy over what full power would have given while it was under the stack; that time, s; the hottest plate.
   */
  readonly heater?: { readonly energy_J: number; readonly duty_cycle: number; readonly under_stack_s: number; readonly plate_peak_C: number };
}

/**
 * Where a heat input ends, so a study can move that end: a face segment that is a heat input ends where the next
 * segment starts (`next` is that segment's index; absent when it lasts to the end), a positive source interval ends
 * at its `to_s`.
 */
export type HeatInput =
  | { readonly kind: 'face'; readonly side: 'bottom' | 'top'; readonly segment: number; readonly next: number | undefined; readonly fromS: number; readonly endS: number }
  | { readonly kind: 'source'; readonly layer: number; readonly interval: number; readonly fromS: number; readonly endS: number };

/** Every heat input of the problem (the rule of `heat_off_s`: faces by sim/physics/faces.ts `isHeatInput`, positive sources). */
export function heatInputs(problem: Problem): HeatInput[] {
  const found: HeatInput[] = [];
  for (const side of ['bottom', 'top'] as const) {
    const segments = problem[side];
    segments.forEach((seg, i) => {
      if (!isHeatInput(seg.condition)) return;
      const next = segments[i + 1];
      found.push({ kind: 'face', side, segment: i, next: next ? i + 1 : undefined, fromS: seg.fromS, endS: next?.fromS ?? Infinity });
    });
  }
  problem.layers.forEach((layer, li) => {
    layer.sources.forEach((s, k) => {
      if (s.value > 0) found.push({ kind: 'source', layer: li, interval: k, fromS: s.fromS, endS: s.toS });
    });
  });
  return found;
}

/** The heat input that ends last (the first of equals), or undefined when there is none. */
export function lastHeatInput(problem: Problem): HeatInput | undefined {
  return heatInputs(problem).reduce<HeatInput | undefined>((best, h) => (best === undefined || h.endS > best.endS ? h : best), undefined);
}

/** The end of the last heat input (s), 0 if there is none, null if one lasts until the end. */
export function heatOffTime(problem: Problem): number | null {
  const last = lastHeatInput(problem)?.endS ?? 0;
  return last >= problem.durationS ? null : last;
}

/**
 * First time ≥ fromS at which `values` reaches `level` ('rise-to': ≥, 'fall-to': ≤) or crosses it downwards
 * ('fall-below': from ≥ to <, so a series already below the level at fromS must first come back up), interpolated
 * linearly between recorded points. null if it never happens.
 */
export function firstCrossing(tS: Float64Array, values: Float64Array, level: number, fromS: number,
  kind: 'rise-to' | 'fall-below' | 'fall-to'): number | null {
  const n = tS.length;
  const reached = (v: number) => (kind === 'rise-to' ? v >= level : v <= level);
  if (n === 1) return kind !== 'fall-below' && tS[0]! >= fromS && reached(values[0]!) ? tS[0]! : null;
  for (let j = 1; j < n; j++) {
    const t0 = tS[j - 1]!;
    const t1 = tS[j]!;
    if (t1 < fromS) continue;
    const v0 = values[j - 1]!;
    const v1 = values[j]!;
    const at = () => (v1 === v0 ? t1 : t0 + ((t1 - t0) * (level - v0)) / (v1 - v0));
    if (kind === 'fall-below') {
      if (v0 >= level && v1 < level) {
        const tc = at();
        if (tc >= fromS) return tc;
      }
      continue;
    }
    if (reached(v0)) {
      if (t0 >= fromS) return t0;
      if (reached(v1)) return fromS;
      continue;
    }
    if (reached(v1)) return Math.max(fromS, at());
  }
  return null;
}

function layerVerdict(problem: Problem, record: RunRecord, li: number): LayerVerdict {
  const series = record.layers[li]!;
  let peak = -Infinity;
  for (const v of series.maxC) if (v > peak) peak = v;
  const limits = problem.layers[li]!.material.limits.map((l) => ({ kind: l.kind, at_C: kToC(l.atK), margin_K: kToC(l.atK) - peak }));
  const binding = limits.reduce<(typeof limits)[number] | null>((best, l) => (best === null || l.margin_K < best.margin_K ? l : best), null);
  return {
    peak_C: peak,
    peak_at_s: series.peakReachedS,
    limit: binding ? { kind: binding.kind, at_C: binding.at_C } : null,
    margin_K: binding ? binding.margin_K : null,
    limits,
  };
}

export function summarize(problem: Problem, record: RunRecord): Summary {
  const heatOff = heatOffTime(problem);
  const sep = record.separator;
  let molten: number | null = null;
  let half: number | null = null;
  let frozen: number | null = null;
  if (sep) {
    molten = firstCrossing(sep.tS, sep.meltMargin, 0, 0, 'rise-to');
    if (heatOff !== null) half = firstCrossing(sep.tS, sep.meanLiquid, 0.5, heatOff, 'fall-below');
    if (half !== null) frozen = firstCrossing(sep.tS, sep.freezeMargin, 0, half, 'fall-to');
  }
  const verdicts = problem.layers.map((l, li) => [l.id, layerVerdict(problem, record, li)] as const);
  // keyed by layer id with own properties (Object.fromEntries): an id such as "__proto__" stays an ordinary key
  const layers: Record<string, LayerVerdict> = Object.fromEntries(verdicts);
  let binding: string | null = null;
  let bindingMargin = Infinity;
  let crossed = false;
  for (const [id, v] of verdicts) {
    if (v.margin_K !== null && v.margin_K < bindingMargin) { bindingMargin = v.margin_K; binding = id; }
    if (v.margin_K !== null && v.margin_K <= 0) crossed = true;
  }
  const status: WindowStatus = !sep ? 'no-separator'
    : crossed ? 'limit-crossed'
    : molten === null ? 'never-molten'
    : heatOff === null ? 'heat-never-off'
    : half === null ? 'still-molten-at-end'
    : 'ok';
  const e = record.energy;
  const edgeIn = e.edgeInJ ?? 0;
  const edgeOut = e.edgeOutJ ?? 0;
  const heaterJ = e.heaterJ ?? 0;
  const inJ = e.bottomInJ + e.topInJ + Math.max(e.sourceJ, 0) + edgeIn + heaterJ;
  const outJ = e.bottomOutJ + e.topOutJ + Math.max(-e.sourceJ, 0) + edgeOut;
  const edges = e.edgeInJ === undefined ? {} : { edge_in_J_m2: edgeIn, edge_out_J_m2: edgeOut };
  const scale = Math.max(inJ, outJ, Math.abs(e.storedJ), Number.MIN_VALUE);
  return {
    heat_off_s: heatOff,
    separator: { molten_at_s: molten, half_frozen_at_s: half, frozen_at_s: frozen },
    layers,
    safe_window_s: status === 'ok' && half !== null && heatOff !== null ? half - heatOff : null,
    safe_window_status: status,
    binding_layer: binding,
    energy: {
      in_J_m2: inJ, out_J_m2: outJ, stored_J_m2: e.storedJ, imbalance_rel: Math.abs(e.storedJ - (inJ - outJ)) / scale, ...edges,
      ...(e.heaterJ === undefined ? {} : { heater_J_m2: heaterJ }),
    },
    ...(record.heater ? { heater: heaterVerdict(problem, record.heater, heaterJ) } : {}),
  };
}

/** The heater's energy (J, over the footprint), duty cycle and hottest plate, from the record (record-heater.ts). */
function heaterVerdict(problem: Problem, h: NonNullable<RunRecord['heater']>, heaterJPerM2: number): NonNullable<Summary['heater']> {
  const area = problem.footprint?.areaM2 ?? 0;
  return {
    energy_J: heaterJPerM2 * area,
    duty_cycle: h.fullPowerJ > 0 ? heaterJPerM2 / h.fullPowerJ : 0,
    under_stack_s: h.attachedS,
    plate_peak_C: Number.isFinite(h.plateMaxK) ? kToC(h.plateMaxK) : kToC(problem.initialK),
  };
}
