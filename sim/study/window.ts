/**
 * The safe operating duration of a scenario, by many summary-only runs (definitions in the README, "The safe
 * operating duration"):
 *
 *   longest hold    the latest heater removal for which every layer keeps more than the required margin below every
 *                   one of its limits (a margin exactly equal to it counts as reaching it, as a zero margin counts as
 *                   reaching the limit in the verdicts);
 *   shortest hold   the earliest removal for which the separator becomes fully molten at some time;
 *   usable window   after removal at a chosen hold (the longest, else the scenario's own): to half-frozen, to a chosen
 *                   liquid fraction, and until solidification first starts.
 *
 * Method: a coarse scan over the range of the varied input (knob.ts), then each change of side between scan
 * neighbours narrowed to the tolerance (bracket.ts): the safe edge by regula falsi on the margin; the molten edge of a
 * hold by regula falsi on how far the separator got towards molten (point.ts melt_reach), from a first trial at the
 * time the molten end became molten (heldUntilMolten). With `vary: 'power'` the same is done over the strength of the
 * heat input at the scenario's own hold, its molten edge by bisection. Every run is counted in `solves`.
 * Measured on the eight searches of the examples (the demo also on an 800 °C plate): 159 solves where bisection of
 * the molten edge took 191 (the demo 23 → 19); on the demo's plate at 650–900 °C, 143 where it took 162. Reach by
 * regula falsi without the first trial took 188 on the eight (the response is flat at −1 for holds that melt
 * nothing), and with a power knob it took 33–34 solves per search where bisection takes 27–28, so that edge is halved.
 */
import type { Problem } from '../physics/problem.ts';
import type { WindowStatus } from '../observe/verdict.ts';
import { completeEdges, crossings, intervals, scanValues, type Crossing, type FirstTrial, type Interval, type Sample } from './bracket.ts';
import { holdKnob, powerKnob, type Knob, type Vary } from './knob.ts';
import { windowStatusWords } from '../observe/wording.ts';
import { showValue } from './words.ts';
import { evaluatePoint, keepsMargin, type Binding, type WindowPoint } from './point.ts';

export const windowDefaults = {
  /** Required margin below every limit, K (the default; README cautions: a few tens of K is no margin). */
  marginK: 25,
  /** Coarse scan points over the range: enough to see a thermostat's ups and downs, few enough for ≤ 40 solves. */
  scanPoints: 12,
  /** Hold tolerance, s: the accuracy of the run's event times (DEVELOPERS.md, accuracy promise: 0.5 s). */
  holdToleranceS: 0.5,
  /** Power tolerance as a share of its range: 0.07 K on a 700 K plate range, below the run's 0.2 K tolerance. */
  powerToleranceShare: 1e-4,
  /** The hottest layer has "settled" when its margin moves less than this between the last two scan points, K. */
  settleK: 1,
} as const;

export interface WindowOptions {
  readonly vary?: Vary;
  readonly marginK?: number;
  /** Liquid fraction F for the extra window "until the mean liquid fraction falls below F"; null for none. */
  readonly untilLiquid?: number | null;
  /** The value (SI) at which the usable window is reported; default the longest hold, else the scenario's own. */
  readonly at?: number;
  readonly scanPoints?: number;
  readonly tolerance?: number;
}

export interface NoLimit {
  readonly layer: string;
  readonly kind: Binding['kind'];
  /** The binding layer's peak at the top of the range, °C, and its margin there, K. */
  readonly settles_C: number;
  readonly margin_K: number;
  /** Whether it had settled (moved less than `settleK` over the last scan step); if not, the range may be too short. */
  readonly settled: boolean;
}

export interface WindowAt {
  readonly value: number;
  readonly chosen: 'longest' | 'own' | 'given';
  readonly point: WindowPoint;
  /** Whether this value keeps the required margin. */
  readonly safe: boolean;
  /** Why there is no window (null when there is one). */
  readonly reason: string | null;
}

export interface WindowReport {
  readonly knob: Omit<Knob, 'apply' | 'show' | 'fields'>;
  readonly margin_K: number;
  readonly until_liquid: number | null;
  readonly tolerance: number;
  readonly scan_spacing: number;
  /** Where every margin exceeds the required one; where the separator becomes fully molten. */
  readonly safe: readonly Interval[];
  readonly molten: readonly Interval[];
  /** False when either set has more than one edge (e.g. a thermostat): every interval is reported. */
  readonly monotonic: boolean;
  readonly longest: { readonly value: number; readonly binding: Binding | null } | null;
  readonly no_limit: NoLimit | null;
  readonly longest_reason: string | null;
  readonly shortest: { readonly value: number; readonly layer: string; readonly molten_at_s: number | null } | null;
  readonly shortest_reason: string | null;
  readonly window: WindowAt | null;
  /** Every run made, sorted by the varied value: the operating chart. */
  readonly points: readonly WindowPoint[];
  readonly solves: number;
}

export type WindowResult = { readonly ok: true; readonly report: WindowReport } | { readonly ok: false; readonly reason: string };

/**
 * The status that explains why a run has no usable window. A window is measured whatever the margins (the search
 * judges those), so a run whose status is 'limit-crossed' is explained by the separator's own events instead.
 */
function missingWindow(p: WindowPoint): WindowStatus {
  if (p.status !== 'ok' && p.status !== 'limit-crossed') return p.status;
  return p.molten_at_s === null ? 'never-molten' : p.heat_off_s === null ? 'heat-never-off' : 'still-molten-at-end';
}

/**
 * The first trial of a hold search's molten edge: the time at which the bracket's molten end became molten, when that
 * lies inside the bracket (it melted while still heated). Every hold from that time on heats the stack the same way up
 * to it, so it is molten too, and the edge lies a little below it (heat already in the stack finishes the melt).
 */
const heldUntilMolten: FirstTrial<WindowPoint> = (molten) => molten.point.molten_at_s ?? undefined;

export function searchWindow(problem: Problem, options: WindowOptions = {}): WindowResult {
  const knob = options.vary === 'power' ? powerKnob(problem) : holdKnob(problem);
  if (typeof knob === 'string') return { ok: false, reason: knob };
  const required = options.marginK ?? windowDefaults.marginK;
  const untilLiquid = options.untilLiquid ?? null;
  const count = options.scanPoints ?? windowDefaults.scanPoints;
  const tol = options.tolerance ?? (knob.vary === 'time' ? windowDefaults.holdToleranceS : (knob.hi - knob.lo) * windowDefaults.powerToleranceShare);
  const at = options.at;
  if (at !== undefined && !(at >= knob.lo && at <= knob.hi)) {
    return { ok: false, reason: `the value asked for (${showValue({ knob }, at)}) is outside the range of ${knob.path}: ${showValue({ knob }, knob.lo)} to ${showValue({ knob }, knob.hi)}` };
  }

  const cache = new Map<number, WindowPoint>();
  const pointAt = (x: number): WindowPoint => {
    let p = cache.get(x);
    if (!p) { p = evaluatePoint(knob.apply(x), x, untilLiquid); cache.set(x, p); }
    return p;
  };
  const marginY = (p: WindowPoint) => (p.margin_K === null ? Infinity : p.margin_K - required);
  // the molten edge follows how far the separator got towards molten (point.ts melt_reach, ≥ 0 exactly when molten)
  const meltY = (p: WindowPoint) => p.melt_reach ?? -1;
  const isSafe = (y: number) => y > 0;
  const isMolten = (y: number) => y >= 0;
  const samplesOf = (f: (p: WindowPoint) => number) => (x: number): Sample<WindowPoint> => {
    const p = pointAt(x);
    return { x, y: f(p), point: p };
  };

  const scan = scanValues(knob.lo, knob.hi, count, [knob.own]).map(pointAt);
  // the value asked for is run first, so the intervals below account for it like every other run
  if (at !== undefined) pointAt(at);
  const marginScan = scan.map((p) => samplesOf(marginY)(p.value));
  const meltScan = scan.map((p) => samplesOf(meltY)(p.value));
  crossings(marginScan, isSafe, samplesOf(marginY), tol);
  if (knob.vary === 'time') crossings(meltScan, isMolten, samplesOf(meltY), tol, 'regula-falsi', heldUntilMolten);
  else crossings(meltScan, isMolten, samplesOf(meltY), tol, 'bisection');
  // every change between neighbouring runs is an edge: one that a narrowing ran into between two scan values that
  // agree (a stretch narrower than the scan spacing) is narrowed too, until every edge is within the tolerance, so
  // the intervals agree with every run made (bracket.ts completeEdges)
  const runs = () => [...cache.keys()].sort((a, b) => a - b);
  const [safeEdges, meltEdges] = completeEdges(
    runs,
    [
      { sample: samplesOf(marginY), inside: isSafe, method: 'regula-falsi' },
      { sample: samplesOf(meltY), inside: isMolten, method: knob.vary === 'time' ? 'regula-falsi' : 'bisection' },
    ],
    tol,
  ) as [Crossing<WindowPoint>[], Crossing<WindowPoint>[]];
  const safe = intervals(runs().map(samplesOf(marginY)), safeEdges, isSafe);
  const molten = intervals(runs().map(samplesOf(meltY)), meltEdges, isMolten);

  const first = scan[0]!;
  const top = scan[scan.length - 1]!;
  const show = (v: number) => showValue({ knob }, v);
  let longest: WindowReport['longest'] = null;
  let noLimit: NoLimit | null = null;
  let longestReason: string | null = null;
  const lastSafe = safe[safe.length - 1];
  const noLimits = scan.every((p) => p.margin_K === null);
  if (noLimits) {
    longestReason = 'no layer has a limit on file, so none limits the hold';
  } else if (!lastSafe) {
    const b = first.binding!;
    longestReason = `even at ${show(first.value)} ${b.layer} comes within ${b.margin_K.toFixed(1)} K of its ${b.kind} limit (at ${b.at_s.toFixed(0)} s), not more than the ${required} K asked for`;
  } else if (lastSafe.toRangeEnd) {
    const below = scan[scan.length - 2];
    const b = top.binding!;
    noLimit = {
      layer: b.layer, kind: b.kind, settles_C: b.peak_C, margin_K: b.margin_K,
      settled: below?.margin_K != null && Math.abs(below.margin_K - b.margin_K) < windowDefaults.settleK,
    };
    longestReason = `no limit for any ${knob.vary === 'time' ? 'hold' : 'value'} up to ${show(knob.hi)}`;
  } else {
    longest = { value: lastSafe.to, binding: pointAt(lastSafe.to).binding };
  }

  const firstMolten = molten[0];
  const sepId = first.separator;
  const shortest = firstMolten && sepId !== null ? { value: firstMolten.from, layer: sepId, molten_at_s: pointAt(firstMolten.from).molten_at_s } : null;
  const run = knob.vary === 'time' ? 'this hold' : `this ${knob.label}`;
  const shortestReason = shortest ? null : sepId === null ? windowStatusWords['no-separator'].at(run)
    : `the separator does not become fully molten for any value up to ${show(knob.hi)}`;

  let window: WindowAt | null = null;
  const chosen: WindowAt['chosen'] | null = at !== undefined ? 'given' : longest ? 'longest' : lastSafe || noLimits ? 'own' : null;
  if (chosen !== null) {
    const value = at ?? longest?.value ?? knob.own;
    const point = pointAt(value);
    const why = point.window_s !== null ? null : windowStatusWords[missingWindow(point)].at(run);
    window = { value, chosen, point, safe: keepsMargin(point, required), reason: why };
  }

  const points = [...cache.values()].sort((a, b) => a.value - b.value);
  return {
    ok: true,
    report: {
      knob: { vary: knob.vary, path: knob.path, label: knob.label, unit: knob.unit, lo: knob.lo, hi: knob.hi, own: knob.own },
      margin_K: required, until_liquid: untilLiquid, tolerance: tol,
      scan_spacing: count > 1 ? (knob.hi - knob.lo) / (count - 1) : knob.hi - knob.lo,
      safe, molten, monotonic: safeEdges.length <= 1 && meltEdges.length <= 1,
      longest, no_limit: noLimit, longest_reason: longestReason, shortest, shortest_reason: shortestReason,
      window, points, solves: cache.size,
    },
  };
}
