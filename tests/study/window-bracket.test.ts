// The scan-and-narrow machinery of the window search (sim/study/bracket.ts) on closed-form functions whose edges are
// known exactly: a line, a cubic, a step (bisection only), and a function with two intervals.

import { describe, expect, it } from 'vitest';
import { crossings, intervals, narrow, scanValues, tighten, type Sample } from '../../sim/study/bracket.ts';
import { assertClose } from '../support/assert-close.ts';

/** A sampler of f that counts its calls. */
function sampler(f: (x: number) => number) {
  let calls = 0;
  const sample = (x: number): Sample<null> => { calls++; return { x, y: f(x), point: null }; };
  return { sample, calls: () => calls };
}
const positive = (y: number) => y > 0;

describe('scanValues()', () => {
  it('scanValues() spaces the values evenly with both ends, adds extras inside the range, sorted and without repeats', () => {
    expect(scanValues(0, 10, 6)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(scanValues(0, 10, 3, [5, 7, 11, -1])).toEqual([0, 5, 7, 10]);
    expect(scanValues(2, 4, 1)).toEqual([2]);
    expect(scanValues(2, 10, 5)).toEqual([2, 4, 6, 8, 10]);
  });

  it('scanValues() ends on hi itself where the evenly spaced last value rounds past it', () => {
    // a plate's range from 57.7 °C to 900 °C, in kelvin: lo + (hi − lo)·11/11 = 1173.1500000000003 in double precision,
    // which the power knob refused as outside its range (an internal error from `window --vary power`)
    const lo = 330.84999999999997;
    const hi = 1173.15;
    expect(lo + ((hi - lo) * 11) / 11).toBeGreaterThan(hi);
    const xs = scanValues(lo, hi, 12);
    expect(xs[0]).toBe(lo);
    expect(xs[xs.length - 1]).toBe(hi);
    expect(xs).toHaveLength(12);
  });
});

describe('narrow()', () => {
  it('narrow() brackets the root of a line to the tolerance in a few calls (regula falsi is exact on a line)', () => {
    const s = sampler((x) => 3 - x); // inside (> 0) below x = 3
    const c = narrow(s.sample(0), s.sample(10), positive, s.sample, 0.5);
    expect(c.direction).toBe('leave');
    expect(c.inside.x).toBeLessThanOrEqual(3);
    expect(c.outside.x).toBeGreaterThanOrEqual(3);
    expect(c.outside.x - c.inside.x).toBeLessThanOrEqual(0.5);
    // two for the ends; the secant of a line lands on its root (3, outside); the next secant lands there again and
    // the tol/2 guard moves it to 3 − 0.25, inside, which closes the bracket: four calls in all
    expect(s.calls()).toBe(4);
    assertClose(c.inside.x, 2.75, { abs: 1e-12 }, 'inside end');
  });

  it('narrow() finds where a cubic enters the set, from either end, within the tolerance', () => {
    const root = Math.cbrt(20); // x³ − 20 = 0
    const s = sampler((x) => x ** 3 - 20);
    const c = narrow(s.sample(0), s.sample(5), positive, s.sample, 1e-3);
    expect(c.direction).toBe('enter');
    assertClose(c.inside.x, root, { abs: 1e-3 }, 'edge');
    expect(c.inside.x).toBeGreaterThanOrEqual(root);
    expect(c.outside.x).toBeLessThanOrEqual(root);
    // bisection alone would need log2(5/1e-3) ≈ 13 calls; regula falsi must beat it. With Anderson and Björck's
    // scaling of the end that stays put it takes 7 (measured; Illinois' halving took 9)
    expect(s.calls() - 2).toBeLessThanOrEqual(7);
  });

  it('narrow() scales whichever end stays put: a curve whose secants all fall on the right-hand side', () => {
    // 1/x − 0.3, root 10/3: convex and falling, so its secants land right of the root and the left end is the one kept
    // (the cubic above keeps its right end). Anderson and Björck's scaling of that end (BIT 13, 1973) takes 16 calls
    // to 1e-6 (measured); without it on this side, 24
    const s = sampler((x) => 1 / x - 0.3);
    const c = narrow(s.sample(0.1), s.sample(10), positive, s.sample, 1e-6);
    expect(c.direction).toBe('leave');
    expect(c.inside.x).toBeLessThanOrEqual(10 / 3);
    expect(c.outside.x).toBeGreaterThanOrEqual(10 / 3);
    expect(c.outside.x - c.inside.x).toBeLessThanOrEqual(1e-6);
    expect(s.calls() - 2).toBeLessThanOrEqual(16);
  });

  it('narrow() by bisection on a step (no slope to follow) halves to the tolerance and keeps the edge inside the bracket', () => {
    const s = sampler((x) => (x >= 1.234 ? 1 : -1));
    const c = narrow(s.sample(0), s.sample(8), (y) => y >= 0, s.sample, 0.01, 'bisection');
    expect(c.inside.x).toBeGreaterThanOrEqual(1.234);
    expect(c.outside.x).toBeLessThan(1.234);
    expect(c.inside.x - c.outside.x).toBeLessThanOrEqual(0.01);
    // halving 8 to 0.01 takes ⌈log2(800)⌉ = 10 calls; the tol/2 guard may save one
    expect(s.calls() - 2).toBeLessThanOrEqual(10);
  });

  it('narrow() takes a caller\'s first trial when it lies more than tol/2 inside the bracket, and ignores it otherwise', () => {
    const f = (x: number) => x - 3.3; // inside (> 0) above 3.3; the bracket [0, 10], tol 0.5
    const trace = (first: number | undefined) => {
      const xs: number[] = [];
      const sample = (x: number): Sample<null> => { xs.push(x); return { x, y: f(x), point: null }; };
      const c = narrow(sample(0), sample(10), positive, sample, 0.5, 'regula-falsi', () => first);
      return { xs: xs.slice(2), c };
    };
    const none = trace(undefined);
    // taken: either side of the edge, and just beyond tol/2 from either end (0.5 and 9.6 with tol/2 = 0.25)
    for (const first of [3.4, 3.0, 0.5, 9.6]) {
      const { xs, c } = trace(first);
      expect(xs[0]).toBe(first);
      // f(3.3) = 0 is outside (f > 0 is inside): a secant of the line may land on it exactly
      expect(c.inside.x).toBeGreaterThan(3.3);
      expect(c.outside.x).toBeLessThanOrEqual(3.3);
      expect(c.inside.x - c.outside.x).toBeLessThanOrEqual(0.5);
    }
    // ignored: within tol/2 of an end, outside the bracket, or none; the narrowing is then the method's own
    expect(none.xs[0]).not.toBe(3.4);
    for (const first of [0.1, 9.9, -1, 11]) expect(trace(first).xs).toEqual(none.xs);
  });

  it('narrow() refuses two ends on the same side', () => {
    const s = sampler((x) => x);
    expect(() => narrow(s.sample(1), s.sample(2), positive, s.sample, 0.1)).toThrow(/same side/);
  });
});

describe('crossings() and intervals()', () => {
  // inside (> 0) on (1, 2) and (4, 6): f = −(x − 1)(x − 2)(x − 4)(x − 6)
  const f = (x: number) => -(x - 1) * (x - 2) * (x - 4) * (x - 6);
  it('crossings() refines every change between scan neighbours and intervals() pairs them up', () => {
    const s = sampler(f);
    const scan = scanValues(0, 7, 15).map(s.sample); // every 0.5: each edge has its own scan step
    const found = crossings(scan, positive, s.sample, 1e-3);
    expect(found.map((c) => c.direction)).toEqual(['enter', 'leave', 'enter', 'leave']);
    const got = intervals(scan, found, positive);
    expect(got).toHaveLength(2);
    [[1, 2], [4, 6]].forEach(([a, b], i) => {
      assertClose(got[i]!.from, a!, { abs: 1e-3 }, `interval ${i} start`);
      assertClose(got[i]!.to, b!, { abs: 1e-3 }, `interval ${i} end`);
      expect(got[i]!.fromRangeEnd || got[i]!.toRangeEnd).toBe(false);
    });
  });

  it('intervals() marks an interval that reaches an end of the range, and is empty when nothing is inside', () => {
    const line = (x: number): Sample<null> => ({ x, y: 5 - x, point: null });
    const scan = [0, 2, 4, 6, 8].map(line);
    const found = crossings(scan, positive, line, 0.01);
    expect(intervals(scan, found, positive)).toEqual([{ from: found[0]!.inside.x, to: found[0]!.inside.x, fromRangeEnd: true, toRangeEnd: false }].map((i) => ({ ...i, from: 0 })));
    const all = [0, 1, 2].map((x) => ({ x, y: 1, point: null }));
    expect(intervals(all, [], positive)).toEqual([{ from: 0, to: 2, fromRangeEnd: true, toRangeEnd: true }]);
    const none = [0, 1, 2].map((x) => ({ x, y: -1, point: null }));
    expect(intervals(none, [], positive)).toEqual([]);
    expect(intervals([], [], positive)).toEqual([]);
  });
});

describe('tighten()', () => {
  it('tighten() closes a crossing onto the nearest known values on either side of a step edge, without a run', () => {
    // a yes/no step at x = 3 (inside above): narrowing from (0, 10) to 0.5 leaves some bracket around 3; values known
    // from elsewhere at 2.9 (outside) and 3.05 (inside) are closer to the edge than its ends, 1 and 5 (outside, inside)
    // are not
    const step = (x: number) => (x >= 3 ? 1 : -1);
    const s = sampler(step);
    const c = narrow(s.sample(0), s.sample(10), positive, s.sample, 0.5, 'bisection');
    const known = [1, 2.9, 3.05, 5].map((x) => ({ x, y: step(x), point: null }));
    const calls = s.calls();
    const [t] = tighten([c], known, positive);
    expect(s.calls()).toBe(calls);
    expect(t!.direction).toBe('enter');
    expect(t!.inside.x).toBe(Math.min(c.inside.x, 3.05));
    expect(t!.outside.x).toBe(Math.max(c.outside.x, 2.9));
    expect(t!.outside.x).toBeLessThan(3);
    expect(t!.inside.x).toBeGreaterThanOrEqual(3);
    // the same values in any order; and a known value beyond the bracket's inside end is not the edge
    const [r] = tighten([c], [...known].reverse(), positive);
    expect([r!.outside.x, r!.inside.x]).toEqual([t!.outside.x, t!.inside.x]);
    const [v] = tighten([c], [5, 2.9].map((x) => ({ x, y: step(x), point: null })), positive);
    expect(v!.inside.x).toBe(c.inside.x);
    expect(v!.outside.x).toBe(Math.max(c.outside.x, 2.9));
  });

  it('tighten() walks a leaving edge from its outside end, and keeps a crossing with no known value inside its bracket', () => {
    // inside below x = 4; bracket (inside 3.8, outside 4.3); known 4.1 (outside), 3.9 (inside)
    const f = (x: number) => 4 - x;
    const at = (x: number): Sample<null> => ({ x, y: f(x), point: null });
    const [t] = tighten([{ inside: at(3.8), outside: at(4.3), direction: 'leave' }], [at(3.9), at(4.1), at(7)], positive);
    expect(t!.inside.x).toBe(3.9);
    expect(t!.outside.x).toBe(4.1);
    const [u] = tighten([{ inside: at(3.8), outside: at(4.3), direction: 'leave' }], [at(0), at(7)], positive);
    expect(u!.inside.x).toBe(3.8);
    expect(u!.outside.x).toBe(4.3);
  });
});
