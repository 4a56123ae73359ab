/**
 * The step controller's two rules, for TR-BDF2 on any stage system: the stack's time loop (evolve.ts) and the plain
 * loop of drive.ts use the same ones. It is the usual controller for an embedded pair of order p = 2 (Hairer & Wanner,
 * Solving ODEs II, §IV.8): h_new = h·clamp(safety·err^(−1/(p+1)), shrink, grow), no growth right after a rejection,
 * and a Newton failure cuts the step by a fixed factor. The constants are evolveDefaults' (one definition).
 */
import type { StepOutcome } from './tr-bdf2.ts';

/** The controller's constants (evolveDefaults has them, each with its reason). */
export interface ControllerSettings {
  readonly safety: number;
  readonly shrink: number;
  readonly grow: number;
  readonly newtonCut: number;
}

/** The next trial after a rejected step of length stepS: from its error norm, or cut after a Newton failure. */
export function retryStepS(stepS: number, outcome: StepOutcome, c: ControllerSettings): number {
  return outcome.status === 'ok'
    ? stepS * Math.max(c.shrink, c.safety * outcome.errorNorm ** (-1 / 3))
    : stepS * c.newtonCut;
}

/** The factor by which the step grows after an accepted step with error norm errorNorm. */
export function growthFactor(errorNorm: number, rejectedLast: boolean, c: ControllerSettings): number {
  const ratio = errorNorm > 0 ? c.safety * errorNorm ** (-1 / 3) : c.grow;
  // no growth right after a rejection (Hairer & Wanner II, §IV.8): the step that failed is still near
  const growth = rejectedLast ? 1 : c.grow;
  return Math.min(growth, Math.max(c.shrink, ratio));
}
