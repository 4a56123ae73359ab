// The scan-and-narrow machinery of the window search (sim/study/bracket.ts) on closed-form functions whose edges are
// known exactly: a line, a cubic, a step (bisection only), and a function with two intervals.

import { describe, expect, it } from 'vitest';
import { completeEdges, crossings, intervals, narrow, scanValues, type Sample } from '../../sim/study/bracket.ts';
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

describe('completeEdges()', () => {
  /** Two responses over one shared set of runs (as the window search's margin and melt share its cache). */
  function shared(f: (x: number) => number, g: (x: number) => number) {
    const runs = new Set<number>();
    let calls = 0;
    const run = (x: number) => { if (!runs.has(x)) { runs.add(x); calls++; } };
    const sampleF = (x: number): Sample<null> => { run(x); return { x, y: f(x), point: null }; };
    const sampleG = (x: number): Sample<null> => { run(x); return { x, y: g(x), point: null }; };
    return { runs, sampleF, sampleG, calls: () => calls, values: () => [...runs].sort((p, q) => p - q) };
  }

  it('completeEdges() narrows each response\'s change between scan values to the tolerance, the ends neighbouring runs', () => {
    // f inside above 3, g inside above 7, a scan of 0, 5, 10
    const s = shared((x) => x - 3, (x) => x - 7);
    for (const x of [0, 5, 10]) s.sampleF(x);
    const [ef, eg] = completeEdges(s.values, [
      { sample: s.sampleF, inside: positive, method: 'regula-falsi' },
      { sample: s.sampleG, inside: positive, method: 'bisection' },
    ], 0.25);
    expect(ef).toHaveLength(1);
    expect(eg).toHaveLength(1);
    expect(ef![0]!.direction).toBe('enter');
    expect(ef![0]!.outside.x).toBeLessThanOrEqual(3);
    expect(ef![0]!.inside.x).toBeGreaterThan(3);
    expect(ef![0]!.inside.x - ef![0]!.outside.x).toBeLessThanOrEqual(0.25);
    expect(eg![0]!.outside.x).toBeLessThanOrEqual(7);
    expect(eg![0]!.inside.x).toBeGreaterThan(7);
    expect(eg![0]!.inside.x - eg![0]!.outside.x).toBeLessThanOrEqual(0.25);
    // neighbours: no run lies strictly between an edge's two ends
    for (const c of [ef![0]!, eg![0]!]) {
      const [lo, hi] = [Math.min(c.inside.x, c.outside.x), Math.max(c.inside.x, c.outside.x)];
      expect(s.values().filter((x) => x > lo && x < hi)).toEqual([]);
    }
  });

  it('completeEdges() finds and narrows a stretch narrower than the scan that the other response\'s narrowing ran into', () => {
    // f inside on (4, 6) only, which the scan 0, 10 misses (outside at both); g inside above 5: g's bisection from
    // (0, 10) runs 5 first, inside f's stretch, and f's two edges are then narrowed from there
    const s = shared((x) => (x > 4 && x < 6 ? 1 : -1), (x) => x - 5);
    for (const x of [0, 10]) s.sampleF(x);
    const [ef, eg] = completeEdges(s.values, [
      { sample: s.sampleF, inside: positive, method: 'bisection' },
      { sample: s.sampleG, inside: (y) => y >= 0, method: 'bisection' },
    ], 0.1);
    expect(eg).toHaveLength(1);
    expect(ef!.map((c) => c.direction)).toEqual(['enter', 'leave']);
    assertClose(ef![0]!.inside.x, 4, { abs: 0.1 }, 'stretch start');
    assertClose(ef![1]!.inside.x, 6, { abs: 0.1 }, 'stretch end');
    const set = intervals(s.values().map((x) => ({ x, y: (x > 4 && x < 6 ? 1 : -1), point: null })), ef!, positive);
    expect(set).toHaveLength(1);
    expect(set[0]!.from).toBe(ef![0]!.inside.x);
    expect(set[0]!.to).toBe(ef![1]!.inside.x);
  });
});

