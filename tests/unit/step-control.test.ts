// The step controller's retry rule (sim/time/step-control.ts), worked by hand. The first retry is the textbook one for
// an embedded pair of order 2, h·max(shrink, 0.9·err^(−1/3)) (Hairer & Wanner, Solving ODEs II, §IV.8); later retries
// in a chain use the exponent observed between the last two trials, held to [1, 3] (our own rule, no source).

import { describe, expect, it } from 'vitest';
import type { RejectedTrial } from '../../sim/time/step-control.ts';
import { noRejectedTrial, retryStepS } from '../../sim/time/step-control.ts';
import type { StepOutcome } from '../../sim/time/tr-bdf2.ts';
import { evolveDefaults } from '../../sim/time/evolve.ts';
import { assertClose } from '../support/assert-close.ts';

const rejected = (errorNorm: number): StepOutcome => ({ status: 'ok', errorNorm, newtonIterations: 3 });
const SAME = { rel: 1e-15 };

/** Trials until a step is accepted (err ≤ 1), from h = 1, on a model error err(h) = c·h^p, with or without a chain. */
function trialsUntilAccepted(c: number, p: number, chained: boolean): number {
  const chain: RejectedTrial | undefined = chained ? noRejectedTrial() : undefined;
  let h = 1;
  for (let trials = 1; trials < 100; trials++) {
    const err = c * h ** p;
    if (err <= 1) return trials;
    h = retryStepS(h, rejected(err), evolveDefaults, chain);
  }
  return Infinity;
}

describe('retryStepS(): the next trial after a rejected step', () => {
  it('the first retry is h·0.9·err^(−1/3), bounded below by h·0.2 (Hairer & Wanner II §IV.8)', () => {
    // 0.9 · 8^(−1/3) = 0.45; 0.9 · 1000^(−1/3) = 0.09 < 0.2
    assertClose(retryStepS(2, rejected(8), evolveDefaults, noRejectedTrial()), 0.9, SAME, 'err 8');
    assertClose(retryStepS(2, rejected(1000), evolveDefaults, noRejectedTrial()), 0.4, SAME, 'err 1000: the bound');
  });

  it('the second retry in a chain uses the exponent observed between the two trials', () => {
    const chain = noRejectedTrial();
    retryStepS(1, rejected(4), evolveDefaults, chain);
    // halving h halved the error: q = ln 2 / ln 2 = 1, so the next trial is 0.5 · 0.9 / 2 = 0.225
    assertClose(retryStepS(0.5, rejected(2), evolveDefaults, chain), 0.225, { rel: 1e-12 }, 'q = 1');
  });

  it('an observed exponent above 3 is held at 3, and an error that did not fall is met with q = 1', () => {
    const fast = noRejectedTrial();
    retryStepS(1, rejected(64), evolveDefaults, fast);
    // ln(64 / 1.5) / ln 2 = 5.4 → 3: 0.5 · 0.9 · 1.5^(−1/3)
    assertClose(retryStepS(0.5, rejected(1.5), evolveDefaults, fast), 0.5 * 0.9 * 1.5 ** (-1 / 3), { rel: 1e-12 }, 'q held at 3');
    const flat = noRejectedTrial();
    retryStepS(1, rejected(2), evolveDefaults, flat);
    // the error rose as h fell: 0.5 · 0.9 / 2.5 = 0.18 (above the bound 0.5 · 0.2)
    assertClose(retryStepS(0.5, rejected(2.5), evolveDefaults, flat), 0.18, { rel: 1e-12 }, 'q = 1');
  });

  it('a Newton failure cuts by newtonCut and starts a fresh chain', () => {
    const chain = noRejectedTrial();
    retryStepS(1, rejected(4), evolveDefaults, chain);
    assertClose(retryStepS(0.5, { status: 'newton-failed', errorNorm: 0, newtonIterations: 12 }, evolveDefaults, chain), 0.125, SAME, 'cut');
    expect(chain.stepS).toBe(0);
    // the next error rejection is a first retry again: 0.125 · 0.9 · 8^(−1/3)
    assertClose(retryStepS(0.125, rejected(8), evolveDefaults, chain), 0.05625, { rel: 1e-12 }, 'fresh chain');
  });

  it('on an error that falls as h³ every retry is the textbook one; on one that falls as h^0.3 (a kink in the step) the chain needs fewer trials', () => {
    for (const c of [1.5, 4, 30, 500]) {
      // q observed = 3 exactly (up to rounding), so the chain and the plain rule take the same trials
      expect(trialsUntilAccepted(c, 3, true)).toBe(trialsUntilAccepted(c, 3, false));
    }
    // err = 1.6·h^0.3 (the demo's chains fell as h^0.2–0.5), worked by hand (four digits):
    //   plain, ×0.9·err^(−1/3) a trial: h = 1, .7697, .6078, .4915, .4060, .3419, .2931, .2552, .2251, .2011
    //     (err 1.6, 1.479, 1.378, 1.293, 1.221, 1.160, 1.107, 1.062, 1.023, 0.989): accepted at trial 10;
    //   chain: h = 1, .7697 (first retry as above), then q observed = ln(1.6/1.479)/ln(1/.7697) = 0.30 → 1, so ×0.9/err:
    //     .4684, .3308, .2593, .2187, .1940 (err 1.274, 1.148, 1.067, 1.014, 0.978): accepted at trial 7
    expect(trialsUntilAccepted(1.6, 0.3, false)).toBe(10);
    expect(trialsUntilAccepted(1.6, 0.3, true)).toBe(7);
  });
});
