/**
 * The step controller's two rules, for TR-BDF2 on any stage system: the stack's time loop (evolve.ts) and the plain
 * loop of drive.ts use the same ones. It is the usual controller for an embedded pair of order p = 2 (Hairer & Wanner,
 * Solving ODEs II, §IV.8): h_new = h·clamp(safety·err^(−1/(p+1)), shrink, grow), no growth right after a rejection,
 * and a Newton failure cuts the step by a fixed factor; within a chain of rejections the exponent observed between the
 * last two trials replaces p + 1 when smaller (retryStepS). The constants are evolveDefaults' (one definition).
 */
import type { StepOutcome } from './tr-bdf2.ts';

/**
 * A fixed step (s), with no control: for convergence studies, where backward Euler, having no error estimate here,
 * may stand in for TR-BDF2. Both time loops (evolve.ts, drive.ts) take it beside their own adaptive settings, so that
 * backward Euler with adaptive steps cannot be written.
 */
export interface FixedStepping {
  readonly kind: 'fixed';
  readonly stepS: number;
  readonly scheme: 'tr-bdf2' | 'backward-euler';
}

/** The controller's constants (evolveDefaults has them, each with its reason). */
export interface ControllerSettings {
  readonly safety: number;
  readonly shrink: number;
  readonly grow: number;
  readonly newtonCut: number;
}

/**
 * The trial rejected on its error just before this one, in the same chain of rejections (stepS 0: none). Kept by the
 * caller; retryStepS() updates it.
 */
export interface RejectedTrial {
  stepS: number;
  errorNorm: number;
}

/** A fresh chain: no rejected trial before the next one. */
export const noRejectedTrial = (): RejectedTrial => ({ stepS: 0, errorNorm: 0 });

/**
 * The next trial after a rejected step of length stepS: from its error norm, or cut after a Newton failure.
 *
 * The first retry assumes the error falls as h³ (the pair's order p + 1). From the second rejection in a row on, the
 * exponent q observed between the two trials, ln(err₁/err₂)/ln(h₁/h₂), replaces 3 when it is smaller, held at
 * q ≥ 1: where a cell crosses a kink of T(H) within the step the estimate falls only as h^0.2–0.5 (measured on the
 * demo: 67 chains, up to 10 rejections, each shrinking ×0.77–0.9), and h·(0.9/err)^(1/q) gets below the kink's
 * share of the step in fewer trials. An error that does not fall at all (q → 0) is met by q = 1, a shrink of 0.9/err
 * per trial, never the collapse that q → 0 would give. The shrink bound c.shrink holds throughout.
 */
export function retryStepS(stepS: number, outcome: StepOutcome, c: ControllerSettings, last?: RejectedTrial): number {
  if (outcome.status !== 'ok') {
    if (last) last.stepS = 0;
    return stepS * c.newtonCut;
  }
  const err = outcome.errorNorm;
  let q = 3;
  if (last && last.stepS > stepS && last.errorNorm > err) {
    const observed = Math.log(last.errorNorm / err) / Math.log(last.stepS / stepS);
    q = Math.min(3, Math.max(1, observed));
  } else if (last && last.stepS > stepS) {
    q = 1;
  }
  if (last) {
    last.stepS = stepS;
    last.errorNorm = err;
  }
  return stepS * Math.max(c.shrink, c.safety * err ** (-1 / q));
}

/** The factor by which the step grows after an accepted step with error norm errorNorm. */
export function growthFactor(errorNorm: number, rejectedLast: boolean, c: ControllerSettings): number {
  const ratio = errorNorm > 0 ? c.safety * errorNorm ** (-1 / 3) : c.grow;
  // no growth right after a rejection (Hairer & Wanner II, §IV.8): the step that failed is still near
  const growth = rejectedLast ? 1 : c.grow;
  return Math.min(growth, Math.max(c.shrink, ratio));
}
