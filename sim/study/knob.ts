/**
 * The input a window search varies, at the Problem level (SI): a function value → Problem over a range.
 *
 *   time   the hold: when the heat ends. Every heat input that ends at heat off moves together (sim/observe/verdict.ts
 *          `heatInputs`, the rule of `heat_off_s`): for a face the `from_s` of the segment after the heating segment,
 *          for a volumetric source the `to_s` of its interval. The range runs from the start of the heating face
 *          segments (or the end of any heat input that ends earlier, if later: below it the heat off would not move)
 *          to the next face segment or the end of the run. At the start the heating segment is dropped (immediate
 *          removal); a source interval that would end before it starts is dropped. The run is lengthened when needed
 *          so that it always follows the cell for as long after removal as the scenario itself does.
 *   power  the strength of the same heat input: a plate's or a held face's temperature (K), else the imposed flux
 *          (W/m², heater power included) or the source (W/m³), from nothing to `powerDefaults.stretch` times its own.
 *
 * Working on the Problem rather than the scenario JSON keeps units out of the search (everything here is SI) and
 * needs no second pass through validation: only one number changes, inside the range checked here.
 */
import type { FaceCondition, FaceSegment, Layer, Problem } from '../physics/problem.ts';
import { kToC } from '../physics/units.ts';
import { heatInputs, lastHeatInput, type HeatInput } from '../observe/verdict.ts';

export type Vary = 'time' | 'power';

export interface Knob {
  readonly vary: Vary;
  /** The scenario field that is varied, e.g. `bottom[1].from_s`, `bottom[0].plate.temperature_C`. */
  readonly path: string;
  /** The entries of `path` one by one (several for a hold that moves several inputs; `path` is them joined by ", "). */
  readonly fields: readonly string[];
  /** In words, for a reader: "heater hold", "plate temperature". */
  readonly label: string;
  /** Unit of the values as shown (°C for temperatures, held in K inside). */
  readonly unit: 's' | '°C' | 'W' | 'W/m²' | 'W/m³';
  /** Range and the scenario's own value, SI (s, K, W/m², W/m³). */
  readonly lo: number;
  readonly hi: number;
  readonly own: number;
  /** The problem with the input set to `value` (lo ≤ value ≤ hi). */
  readonly apply: (value: number) => Problem;
  /** SI value → the unit shown. */
  readonly show: (value: number) => number;
}

export const powerDefaults = {
  /** A flux or source is varied from 0 to this multiple of its own value: a designer's "up to three times". */
  stretch: 3,
  /** A plate or held face is varied from the ambient up to this much above the highest limit of any layer, K. */
  aboveLimitK: 50,
} as const;

/** The file field a source interval came from (a pellet, Joule heat and W/kg are sources of the Problem too). */
const sourceField = (problem: Problem, h: Extract<HeatInput, { kind: 'source' }>): string =>
  problem.layers[h.layer]!.sources[h.interval]?.origin ?? `source_W_m3[${h.interval}]`;

/** Where a source's end is set in the file: a pellet's end is from_s plus its burn time, not a key of its own. */
const sourceEnd = (problem: Problem, h: Extract<HeatInput, { kind: 'source' }>): string => {
  const field = sourceField(problem, h);
  return field === 'pellet' ? `layers[${h.layer}].pellet (its end, from_s + burn time)` : `layers[${h.layer}].${field}.to_s`;
};

const where = (h: HeatInput, problem: Problem): string =>
  (h.kind === 'face' ? `${h.side}[${h.segment}]` : `layers[${h.layer}] (${problem.layers[h.layer]!.id}).${sourceField(problem, h)}`);

function lastOrError(problem: Problem): HeatInput | string {
  const last = lastHeatInput(problem);
  if (!last) return 'the scenario has no heat input (no plate, held face, positive flux or source): there is nothing to hold or remove';
  if (last.endS >= problem.durationS) {
    return `the heat input ${where(last, problem)} lasts to the end of the run: give the face condition that follows the heater's removal (a later segment) so its start can be varied`;
  }
  return last;
}

const withSegments = (problem: Problem, side: 'bottom' | 'top', segments: readonly FaceSegment[]): Problem =>
  (side === 'bottom' ? { ...problem, bottom: segments } : { ...problem, top: segments });

const withLayer = (problem: Problem, li: number, layer: Layer): Problem =>
  ({ ...problem, layers: problem.layers.map((l, i) => (i === li ? layer : l)) });

/** The hold knob, or a sentence saying why there is none. */
export function holdKnob(problem: Problem): Knob | string {
  const last = lastOrError(problem);
  if (typeof last === 'string') return last;
  // every heat input that ends at heat off moves with it ("the heat is removed"); the others bound the range below
  const all = heatInputs(problem);
  const group = all.filter((h) => h.endS === last.endS);
  const faces = group.filter((h): h is Extract<HeatInput, { kind: 'face' }> => h.kind === 'face');
  const sources = group.filter((h): h is Extract<HeatInput, { kind: 'source' }> => h.kind === 'source');
  const lo = Math.max(0, ...all.filter((h) => h.endS !== last.endS).map((h) => h.endS), ...faces.map((h) => h.fromS));
  const hi = Math.min(problem.durationS, ...faces.map((h) => problem[h.side][h.next! + 1]?.fromS ?? problem.durationS));
  const afterS = problem.durationS - last.endS;
  const fields = [
    ...faces.map((h) => `${h.side}[${h.next!}].from_s`),
    ...sources.map((h) => sourceEnd(problem, h)),
  ];
  const path = fields.join(', ');
  const apply = (value: number): Problem => {
    let p = problem;
    for (const f of faces) {
      const moved = p[f.side].map((s, i) => (i === f.next ? { ...s, fromS: value } : s));
      // removal at the very start: the heating segment never acts, so it is dropped (two segments may not share a start)
      p = withSegments(p, f.side, value <= f.fromS ? moved.filter((_, i) => i !== f.segment) : moved);
    }
    for (const li of new Set(sources.map((h) => h.layer))) {
      const moving = new Set(sources.filter((h) => h.layer === li).map((h) => h.interval));
      const layer = p.layers[li]!;
      // an interval that would end before it starts never acts: it is dropped
      const kept = layer.sources.flatMap((s, k) => (!moving.has(k) ? [s] : value <= s.fromS ? [] : [{ ...s, toS: value }]));
      p = withLayer(p, li, { ...layer, sources: kept });
    }
    return value + afterS > p.durationS ? { ...p, durationS: value + afterS } : p;
  };
  // hi > lo always: segments start in strict order and the heat ends before the run does (lastOrError)
  return {
    vary: 'time', path, fields, label: 'heater hold', unit: 's', lo, hi, own: last.endS, show: (v) => v,
    apply: (value) => {
      if (!(value >= lo && value <= hi)) throw new RangeError(`hold: must be within [${lo}, ${hi}] s, got ${value}`);
      return apply(value);
    },
  };
}

/** A knob that varies one field: its fields are its path. */
const withFields = (knob: Omit<Knob, 'fields'>): Knob => ({ ...knob, fields: [knob.path] });

/** The power knob (plate or held-face temperature, flux, or source), or a sentence saying why there is none. */
export function powerKnob(problem: Problem): Knob | string {
  const last = lastOrError(problem);
  if (typeof last === 'string') return last;
  const checked = (lo: number, hi: number, apply: (v: number) => Problem) => (value: number): Problem => {
    if (!(value >= lo && value <= hi)) throw new RangeError(`power: must be within [${lo}, ${hi}], got ${value}`);
    return apply(value);
  };
  if (last.kind === 'source') {
    const layer = problem.layers[last.layer]!;
    const own = layer.sources[last.interval]!.value;
    const hi = own * powerDefaults.stretch;
    const apply = (value: number) => withLayer(problem, last.layer,
      { ...layer, sources: layer.sources.map((s, k) => (k === last.interval ? { ...s, value } : s)) });
    return withFields({ vary: 'power', path: `layers[${last.layer}].${sourceField(problem, last)}${layer.sources[last.interval]!.origin === undefined ? '.value' : ' (as W/m³)'}`, label: 'heat source', unit: 'W/m³', lo: 0, hi, own, show: (v) => v, apply: checked(0, hi, apply) });
  }
  const segments = problem[last.side];
  const c = segments[last.segment]!.condition;
  const set = (condition: FaceCondition) =>
    withSegments(problem, last.side, segments.map((s, i) => (i === last.segment ? { ...s, condition } : s)));
  const base = `${last.side}[${last.segment}]`;
  const hottestLimit = Math.max(...problem.layers.flatMap((l) => l.material.limits.map((m) => m.atK)));
  const coldest = Math.min(problem.ambientK, problem.initialK);
  const tempRange = (own: number) => ({ lo: coldest, hi: Math.max(own, Number.isFinite(hottestLimit) ? hottestLimit : own) + powerDefaults.aboveLimitK });
  if (c.kind === 'fixed') {
    const { lo, hi } = tempRange(c.tK);
    return withFields({ vary: 'power', path: `${base}.fixed_C`, label: 'held face temperature', unit: '°C', lo, hi, own: c.tK, show: kToC,
      apply: checked(lo, hi, (tK) => set({ kind: 'fixed', tK })) });
  }
  if (c.kind === 'heater') {
    const heater = c.heater;
    const hi = heater.powerW * powerDefaults.stretch;
    return withFields({ vary: 'power', path: `${base}.heater.power_W`, label: 'heater power', unit: 'W', lo: 0, hi, own: heater.powerW, show: (v) => v,
      apply: checked(0, hi, (powerW) => set({ kind: 'heater', heater: { ...heater, powerW, powerWPerM2: powerW / heater.areaM2 } })) });
  }
  // a bench is never a heat input (physics/faces.ts isHeatInput), so lastOrError never picks one
  if (c.kind === 'bench') return `${base}: a bench surface is not a heat input`;
  if (c.plate) {
    const plate = c.plate;
    const { lo, hi } = tempRange(plate.tK);
    return withFields({ vary: 'power', path: `${base}.plate.temperature_C`, label: 'plate temperature', unit: '°C', lo, hi, own: plate.tK, show: kToC,
      apply: checked(lo, hi, (tK) => set({ ...c, plate: { ...plate, tK } })) });
  }
  const hi = c.fluxWPerM2 * powerDefaults.stretch;
  return withFields({ vary: 'power', path: `${base}.flux_W_m2`, label: 'heater flux (power over the footprint)', unit: 'W/m²', lo: 0, hi, own: c.fluxWPerM2, show: (v) => v,
    apply: checked(0, hi, (fluxWPerM2) => set({ ...c, fluxWPerM2 })) });
}
