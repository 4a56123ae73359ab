// Locating a state event inside a step (sim/time/events.ts): the parabola whose root is the first trial, worked on
// closed forms, and the regula falsi that follows it, with Anderson and Björck's scaling of the kept end (BIT 13 (1973)
// 253–264), on model event functions g(s) given in closed form, where each trial is a call, not a step.

import { describe, expect, it } from 'vitest';
import { locateRise, parabolaRoot } from '../../sim/time/events.ts';
import { assertClose } from '../support/assert-close.ts';

/** Locates g's rise on (0, sB] with the first trial `firstS` (or regula falsi's), counting trials. */
function locate(g: (s: number) => number, sB: number, tolS: number, firstS?: number) {
  const tried: number[] = [];
  const found = locateRise((s) => { tried.push(s); return g(s); }, g(0), sB, g(sB), tolS, 40, firstS);
  return { ...found, tried };
}

describe('parabolaRoot(): the root of the parabola through the start, the stage point and the end', () => {
  it('is exact on a parabola: g = (s − 0.3)(s + 2) through s = 0, 0.586, 1 gives 0.3', () => {
    const g = (s: number) => (s - 0.3) * (s + 2);
    const m = 2 - Math.SQRT2;
    // the roots are 0.3 and −2; the formula without cancellation gives 0.3 to round-off
    assertClose(parabolaRoot(g(0), m, g(m), 1, g(1))!, 0.3, { rel: 1e-14 }, 'root');
  });

  it('is exact on a line, where the parabola degenerates: g = 4s − 1 gives 0.25', () => {
    const g = (s: number) => 4 * s - 1;
    assertClose(parabolaRoot(g(0), 0.5, g(0.5), 2, g(2))!, 0.25, { rel: 1e-14 }, 'root');
  });

  it('takes the smaller root when both lie in (0, b): g = 0.01 − (s − 0.2)(s − 0.7) on (0, 1)', () => {
    // g = −s² + 0.9s − 0.13: roots 0.45 ∓ √0.0725 = 0.1807… and 0.7193…; the event is the first, where g rises
    const g = (s: number) => 0.01 - (s - 0.2) * (s - 0.7);
    assertClose(parabolaRoot(g(0), 0.5, g(0.5), 1, g(1))!, 0.45 - Math.sqrt(0.0725), { rel: 1e-13 }, 'the rise, not the fall');
  });

  it('gives undefined where the parabola has no root in (0, b), or a value is not finite', () => {
    // (0, −1), (0.5, −2), (1, −1): a parabola wholly below zero
    expect(parabolaRoot(-1, 0.5, -2, 1, -1)).toBeUndefined();
    expect(parabolaRoot(-1, 0.5, Number.NaN, 1, 1)).toBeUndefined();
  });
});

describe('locateRise(): the step that ends just past the crossing', () => {
  const tolS = 1e-3;
  // a rise at s = 0.7 through a curved g (e^s − e^0.7), on a step of 1 s
  const g = (s: number) => Math.exp(s) - Math.exp(0.7);

  it('keeps a step that ends past the crossing by at most the tolerance, with or without a first guess', () => {
    for (const firstS of [undefined, 0.69, 0.71, 0.05]) {
      const found = locate(g, 1, tolS, firstS);
      expect(g(found.s), `first ${firstS}: g at the kept end`).toBeGreaterThanOrEqual(0);
      expect(found.s - 0.7, `first ${firstS}: how late`).toBeLessThanOrEqual(tolS);
    }
  });

  it('takes the first guess as its first trial, held half the tolerance inside the bracket', () => {
    expect(locate(g, 1, tolS, 0.69).tried[0]).toBe(0.69);
    expect(locate(g, 1, tolS, 1).tried[0]).toBe(1 - 0.5 * tolS);
  });

  it('closes in fewer trials from the parabola through the stage point than from regula falsi alone', () => {
    const m = 2 - Math.SQRT2;
    const guess = parabolaRoot(g(0), m, g(m), 1, g(1));
    const plain = locate(g, 1, tolS).trials;
    const guided = locate(g, 1, tolS, guess).trials;
    // measured: 4 trials without the guess, 3 with it (the parabola's root is 0.6965, 3.5 ms early; Illinois took 5
    // without it)
    expect(guided).toBeLessThan(plain);
  });

  it('locates a g that kinks at its root in a handful of trials, from either side of the kink', () => {
    // the separator's melt and freeze: the last cell's enthalpy moves ~10× more slowly on one side of its plateau
    // (measured on the demo: slopes 0.68 and 0.04 per second either side). Illinois creeps from the shallow side: 12–14
    // trials here; Anderson–Björck: 6–7 (measured)
    const r = 0.3836;
    for (const [before, after] of [[0.68, 0.04], [1, 0.1], [0.1, 1]] as const) {
      const g = (s: number) => (s < r ? before * (s - r) : after * (s - r));
      const found = locate(g, 1.094, tolS);
      expect(found.s - r, `slopes ${before}, ${after}: how late`).toBeGreaterThanOrEqual(0);
      expect(found.s - r, `slopes ${before}, ${after}: how late`).toBeLessThanOrEqual(tolS);
      expect(found.trials, `slopes ${before}, ${after}: trials`).toBeLessThanOrEqual(8);
    }
  });
});
