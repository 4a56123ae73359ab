/**
 * Goal seeking: the smallest (or largest) value of one input, in [min, max], for which a run meets a target.
 * Method: a coarse scan of evenly spaced values (both ends included), then the bracket where the target changes from
 * unmet to met is narrowed until it is narrower than the tolerance (bracket.ts narrow): by regula falsi with Anderson
 * and Björck's scaling on how far the reading is from the target, when both of its ends have a numeric reading, and
 * by bisection otherwise (a target in words, a verdict missing at an end). The answer is the bracket's met end, so it
 * meets the target by construction. Either method assumes the response is monotonic inside that bracket: when the
 * scan shows the target met on more than one stretch, the result says the response is not monotonic and lists every
 * stretch seen, so the user knows the answer is the edge of the first (or last) one. Measured on eight seeks of the examples: the four narrowed by slope took 12, 14, 13 and 11
 * runs where halving took 16 each (README's margin_K>=100 on the plate temperature: 12, its bracket 0.16 K where
 * halving left 0.31 K); the other four halve or find no met value, as before: 100 runs in all instead of 114.
 * A target met nowhere in the scan is reported as not met, with the value that came closest.
 */
import type { Summary } from '../observe/verdict.ts';
import type { Resolved } from './scenario-path.ts';
import { parseScenario } from '../scenario/scenario.ts';
import { formatFieldError } from '../scenario/field-errors.ts';
import { setAt } from './scenario-path.ts';
import { runSummary } from './sweep.ts';
import { evaluateTarget, shortfall, type Target } from './target.ts';
import { narrow, type Sample } from './bracket.ts';

export const seekDefaults = {
  /** Scan points (ends included): fine enough to see a second met stretch, cheap next to the narrowing. */
  scanCount: 9,
  /** Narrowing stops when the bracket is narrower than this share of the range (unless a tolerance is given). */
  relativeTolerance: 1e-3,
} as const;

/** One run at one value of the input. */
export interface Probe {
  readonly value: number;
  readonly met: boolean;
  /** What the target reads there (a number, a word, or null when the verdict does not exist). */
  readonly reading: number | string | null;
  /** How far the reading is from the target (≤ 0 met), null for words and missing verdicts: ranks a miss. */
  readonly shortfall: number | null;
  readonly summary: (Summary & { readonly warnings: readonly string[] }) | null;
  readonly error: string | null;
}

export interface SeekOptions {
  readonly min: number;
  readonly max: number;
  readonly largest: boolean;
  readonly scanCount?: number;
  /** Width of the final bracket, in the input's unit. */
  readonly tolerance?: number;
}

export interface SeekResult {
  /** The smallest (largest) value found to meet the target; null when it is met nowhere. */
  readonly value: number | null;
  readonly met: boolean;
  /** Runs made. */
  readonly solves: number;
  /** The run at `value`, or at the closest value when the target is not met. */
  readonly summary: Probe['summary'];
  /** False when the scan found the target met on more than one stretch of the range. */
  readonly monotonic: boolean;
  /** Stretches of the scan where the target is met, [first, last] scan value of each. */
  readonly met_intervals: readonly (readonly [number, number])[];
  /** The answer's uncertainty: width of the last bracket (0 when it is an end of the range). */
  readonly bracket: number;
  /** When not met: the value that came closest and what the target read there. */
  readonly best: { readonly value: number; readonly reading: number | string | null } | null;
  /**
   * The runs that did not finish (a stop, or a value the scenario refuses), in the order run, with why: each counts as
   * not meeting the target, so a search that met it nowhere because its runs stopped says so instead of "not met".
   */
  readonly unfinished: readonly { readonly value: number; readonly error: string }[];
}

export function seek(probeAt: (value: number) => Probe, opts: SeekOptions): SeekResult {
  const n = opts.scanCount ?? seekDefaults.scanCount;
  const tol = opts.tolerance ?? seekDefaults.relativeTolerance * (opts.max - opts.min);
  let solves = 0;
  const unfinished: { value: number; error: string }[] = [];
  const at = (v: number) => {
    solves++;
    const p = probeAt(v);
    if (p.error !== null) unfinished.push({ value: p.value, error: p.error });
    return p;
  };
  const scan = Array.from({ length: n }, (_, i) => at(i === n - 1 ? opts.max : opts.min + ((opts.max - opts.min) * i) / (n - 1)));
  const intervals: [number, number][] = [];
  scan.forEach((p, i) => {
    if (!p.met) return;
    if (i > 0 && scan[i - 1]!.met) intervals[intervals.length - 1]![1] = p.value;
    else intervals.push([p.value, p.value]);
  });
  const monotonic = intervals.length <= 1;
  if (intervals.length === 0) {
    const best = scan.reduce<Probe | null>((b, p) => (p.shortfall !== null && (b === null || p.shortfall < b.shortfall!) ? p : b), null);
    return { value: null, met: false, solves, summary: best?.summary ?? null, monotonic, met_intervals: [], bracket: 0, best: best ? { value: best.value, reading: best.reading } : null, unfinished };
  }
  const metAt = scan.flatMap((p, i) => (p.met ? [i] : []));
  const edge = opts.largest ? metAt[metAt.length - 1]! : metAt[0]!;
  const outer = opts.largest ? edge + 1 : edge - 1;
  let good = scan[edge]!;
  if (outer < 0 || outer >= n) {
    return { value: good.value, met: true, solves, summary: good.summary, monotonic, met_intervals: intervals, bracket: 0, best: null, unfinished };
  }
  const bad = scan[outer]!;
  // a numeric reading at both ends is narrowed by its slope (regula falsi); otherwise (a target in words, a verdict
  // missing at an end) by halving. An end reading exactly the target is the edge itself, or a hair beside it for a
  // strict comparison: the secant lands there and the bracket closes in a run or two
  const bySlope = bad.shortfall !== null && good.shortfall !== null;
  const sampleOf = (p: Probe): Sample<Probe> => ({ x: p.value, y: slopeY(p), point: p });
  const [lo, hi] = good.value < bad.value ? [good, bad] : [bad, good];
  const found = narrow(sampleOf(lo), sampleOf(hi), (y) => y >= 0, (x) => sampleOf(at(x)), tol, bySlope ? 'regula-falsi' : 'bisection');
  good = found.inside.point;
  return { value: good.value, met: true, solves, summary: good.summary, monotonic, met_intervals: intervals, bracket: Math.abs(good.value - found.outside.x), best: null, unfinished };
}

/**
 * The response regula falsi follows: how far past the target a probe is (−shortfall), with its side always the side
 * `met` gives: a met probe reads ≥ 0, one not met < 0 (a reading exactly at a strict target reads just short of it).
 * A probe with no numeric reading reads 0 if met (a target in words) and NaN if not: a bracket with such an end is
 * halved (bySlope), and narrow() draws no secant through a NaN met inside a bracket narrowed by slope.
 */
function slopeY(p: Probe): number {
  if (p.shortfall === null) return p.met ? 0 : Number.NaN;
  return p.met ? Math.max(-p.shortfall, 0) : Math.min(-p.shortfall, -Number.MIN_VALUE);
}

/** A probe that sets one place of a scenario file, runs it summary-only and checks the target. */
export function scenarioProbe(doc: unknown, place: Resolved, target: Target): (value: number) => Probe {
  return (value) => {
    const parsed = parseScenario(setAt(doc, place, value));
    if (!parsed.ok) return { value, met: false, reading: null, summary: null, shortfall: null, error: parsed.errors.map(formatFieldError).join('; ') };
    const run = runSummary(parsed.problem);
    if (!run.summary) return { value, met: false, reading: null, shortfall: null, summary: null, error: run.error };
    const check = evaluateTarget(target, run.summary);
    return { value, met: check.met, reading: check.value, shortfall: shortfall(target, check.value), summary: run.summary, error: null };
  };
}
