/**
 * Finding where a scanned response enters or leaves a set (margin above the required one; separator fully molten):
 * a coarse scan gives bracketing pairs of neighbours on either side; each bracket is narrowed to a tolerance by
 * regula falsi with Anderson and Björck's scaling of the end that stays put (BIT 13 (1973) 253–264; halved, as in the
 * Illinois variant of Dowell & Jarratt, BIT 11 (1971) 168–174, where their factor is not positive) and two
 * safeguards from Brent's zeroin (Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4): a trial point
 * is kept at least tol/2 from the bracket's ends (so a root near an end closes the bracket in one step), and a step
 * that does not halve the bracket is followed by a bisection. Every trial point is a full run, so the count of trials
 * matters.
 *
 * The response need not be monotonic: every sign change between scan neighbours is refined and reported; a set
 * narrower than the scan spacing can be missed (the scan spacing says how fine the search looked).
 */

import { andersonBjorck } from '../time/events.ts';

export interface Sample<P> {
  readonly x: number;
  /** The response; its sign (through `inside`) says whether x is in the set. */
  readonly y: number;
  readonly point: P;
}

export interface Crossing<P> {
  /** The bracket after narrowing: the end inside the set and the end outside it (|inside.x − outside.x| ≤ tol). */
  readonly inside: Sample<P>;
  readonly outside: Sample<P>;
  /** 'enter': the set starts at inside.x (outside lies below); 'leave': the set ends at inside.x. */
  readonly direction: 'enter' | 'leave';
}

export interface Interval {
  /** Ends of the set, both values that were run and found inside. */
  readonly from: number;
  readonly to: number;
  /** Whether the interval reaches the bottom / top of the searched range (so the set may go on beyond it). */
  readonly fromRangeEnd: boolean;
  readonly toRangeEnd: boolean;
}

/** Evenly spaced values from lo to hi, both included, plus extra values; sorted, duplicates removed. */
export function scanValues(lo: number, hi: number, count: number, extra: readonly number[] = []): number[] {
  // the last value is hi itself: lo + (hi − lo)·i/(count − 1) can round past hi (a plate's range in kelvin, 330.85 to
  // 1173.15, ended on 1173.1500000000003), which a knob that checks its range then refuses
  const xs = Array.from({ length: count }, (_, i) => (count === 1 ? lo : i === count - 1 ? hi : lo + ((hi - lo) * i) / (count - 1)));
  return [...new Set([...xs, ...extra.filter((x) => x >= lo && x <= hi)])].sort((a, b) => a - b);
}

/** 'regula-falsi' follows the response's slope (it must be continuous); 'bisection' halves (a yes/no response). */
export type NarrowMethod = 'regula-falsi' | 'bisection';

/**
 * Where a caller knows a better first trial than the method's own (window.ts: the hold at which the bracket's end in
 * the set, molten, became molten), given the bracket's end inside the set and its end outside: x, or undefined for
 * none. Taken only more than tol/2 inside the bracket.
 */
export type FirstTrial<P> = (inside: Sample<P>, outside: Sample<P>) => number | undefined;

/**
 * Narrows one bracket (a and b on opposite sides of the set's edge, a.x < b.x) until the ends are ≤ tol apart.
 * `sample(x)` runs the model at x.
 */
export function narrow<P>(a0: Sample<P>, b0: Sample<P>, inside: (y: number) => boolean, sample: (x: number) => Sample<P>, tol: number,
  method: NarrowMethod = 'regula-falsi', firstTrial?: FirstTrial<P>): Crossing<P> {
  let a = a0;
  let b = b0;
  const aInside = inside(a.y);
  if (aInside === inside(b.y)) throw new RangeError('narrow(): the two ends are on the same side');
  const x0 = firstTrial?.(aInside ? a : b, aInside ? b : a);
  if (x0 !== undefined && x0 > a.x + tol / 2 && x0 < b.x - tol / 2) {
    const s = sample(x0);
    if (inside(s.y) === aInside) a = s;
    else b = s;
  }
  // the end that stays put twice running has its value scaled by Anderson and Björck's m = 1 − f_new/f_replaced (halved
  // where m ≤ 0, as in Illinois), so the next secant moves off it
  let fa = a.y;
  let fb = b.y;
  let kept: 'a' | 'b' | undefined;
  let bisectNext = false;
  while (b.x - a.x > tol) {
    const width = b.x - a.x;
    const secant = fa !== fb && Number.isFinite(fa) && Number.isFinite(fb) ? a.x + (width * fa) / (fa - fb) : Number.NaN;
    let x = method === 'bisection' || bisectNext || !Number.isFinite(secant) ? a.x + width / 2 : secant;
    const guard = Math.min(tol / 2, width / 4);
    x = Math.min(Math.max(x, a.x + guard), b.x - guard);
    const s = sample(x);
    if (inside(s.y) === aInside) {
      if (kept === 'b') fb *= andersonBjorck(s.y, fa);
      a = s;
      fa = s.y;
      kept = 'b';
    } else {
      if (kept === 'a') fa *= andersonBjorck(s.y, fb);
      b = s;
      fb = s.y;
      kept = 'a';
    }
    bisectNext = b.x - a.x > width / 2;
  }
  return aInside ? { inside: a, outside: b, direction: 'leave' } : { inside: b, outside: a, direction: 'enter' };
}

/** Every crossing between neighbours of a sorted scan, each narrowed to tol. */
export function crossings<P>(scan: readonly Sample<P>[], inside: (y: number) => boolean, sample: (x: number) => Sample<P>, tol: number,
  method: NarrowMethod = 'regula-falsi', firstTrial?: FirstTrial<P>): Crossing<P>[] {
  const found: Crossing<P>[] = [];
  for (let i = 1; i < scan.length; i++) {
    const a = scan[i - 1]!;
    const b = scan[i]!;
    if (inside(a.y) !== inside(b.y)) found.push(narrow(a, b, inside, sample, tol, method, firstTrial));
  }
  return found;
}

/** One response for completeEdges(): how a run becomes a sample, which samples are in the set, how to narrow. */
export interface EdgeResponse<P> {
  readonly sample: (x: number) => Sample<P>;
  readonly inside: (y: number) => boolean;
  readonly method: NarrowMethod;
}

/**
 * The crossings of each response between neighbouring values run so far (`values()`, sorted, read afresh after each
 * narrowing), every one narrowed to tol: a change between two neighbours further apart than tol (a stretch that one
 * response's narrowing ran into, between scan values where the other agreed) is narrowed, and the values are read
 * again, until none is left. The result has one list per response, in order; each crossing's ends are neighbouring
 * values run, so no run lies between an edge and its other side.
 */
export function completeEdges<P>(values: () => readonly number[], responses: readonly EdgeResponse<P>[], tol: number): Crossing<P>[][] {
  const changes = (r: EdgeResponse<P>): [Sample<P>, Sample<P>][] => {
    const xs = values().map(r.sample);
    const out: [Sample<P>, Sample<P>][] = [];
    for (let i = 1; i < xs.length; i++) if (r.inside(xs[i - 1]!.y) !== r.inside(xs[i]!.y)) out.push([xs[i - 1]!, xs[i]!]);
    return out;
  };
  for (let wide = true; wide;) {
    wide = false;
    for (const r of responses) {
      for (const [a, b] of changes(r)) {
        if (b.x - a.x <= tol) continue;
        narrow(a, b, r.inside, r.sample, tol, r.method);
        wide = true;
      }
    }
  }
  return responses.map((r) => changes(r).map(([a, b]): Crossing<P> => (r.inside(a.y)
    ? { inside: a, outside: b, direction: 'leave' }
    : { inside: b, outside: a, direction: 'enter' })));
}

/** The intervals of the set, from the scan's first and last samples and the crossings between them (in order). */
export function intervals<P>(scan: readonly Sample<P>[], found: readonly Crossing<P>[], inside: (y: number) => boolean): Interval[] {
  const first = scan[0];
  const last = scan[scan.length - 1];
  if (!first || !last) return [];
  const out: Interval[] = [];
  let start: { x: number; rangeEnd: boolean } | undefined = inside(first.y) ? { x: first.x, rangeEnd: true } : undefined;
  for (const c of found) {
    if (c.direction === 'enter') start = { x: c.inside.x, rangeEnd: false };
    else if (start) {
      out.push({ from: start.x, to: c.inside.x, fromRangeEnd: start.rangeEnd, toRangeEnd: false });
      start = undefined;
    }
  }
  if (start) out.push({ from: start.x, to: last.x, fromRangeEnd: start.rangeEnd, toRangeEnd: true });
  return out;
}
