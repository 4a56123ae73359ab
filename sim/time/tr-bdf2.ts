/**
 * One step of TR-BDF2 (Bank, Coughran, Fichtner, Grosse, Rose & Smith 1985; Hosea & Shampine 1996), the default
 * integrator: a trapezoidal stage to t + γh, then a BDF2 stage to t + h, with γ = 2 − √2 so both stages share the
 * implicit coefficient d = γ/2. It is second order, L-stable (no ringing after a heater is switched off) and, as an
 * ESDIRK method with weights b = (√2/4, √2/4, 1 − √2/2), conserves energy exactly in the discrete sense.
 *
 * It sees only a state vector and the stage-system interface (grid/stage-system.ts): each stage is solved by Newton's
 * method with the system's residual, stage operator, linear solve, update rule and linear accept. The local error is
 * estimated from the embedded third-order weights b̂ on the same stage derivatives and filtered through the stage
 * operator (M − d·h·J)⁻¹, Shampine's device for stiff problems (Hosea & Shampine 1996, §3); the system turns it into
 * the norm the step control holds at 1. The 1D stack is grid/line-system.ts, a lumped network grid/node-network.ts.
 *
 * Filtered once, the estimate still misreads a stiff component: on y′ = λy the trapezoidal stage does not damp it
 * (its stability function tends to −1), its rate enters the embedded difference, and the estimate tends to a constant
 * (−1.6·y₀) as z = hλ → −∞, where the step's true local error R(z) − e^z falls as 1/z, being L-stable: 33 times too
 * large at z = −100, 333 at −1000 (computed from the coefficients below; tests/unit/error-filter.test.ts checks it
 * through takeStep).
 * Filtered a second time, (M − d·h·J)⁻¹·M·est, it is within 0.74–1.14 of the true local error for every z from −10⁻³
 * to −10⁶. This is the linearised form of what RADAU5 does when its estimate is ≥ 1 on the first step or after a
 * rejection (Hairer & Wanner, Solving ODEs II, §IV.8: the estimate recomputed with f at y₀ + err, which to first order
 * is (I − hγ₀J)⁻¹ applied to the first estimate once more). Here it costs one more solve with the operator already
 * factored for the estimate, and it is taken whenever the first estimate would reject the step (> 1), whatever came
 * before: an estimate above 1 is the one that costs steps. Taken on every step instead, the smaller estimates of the
 * accepted steps lengthened the next ones too, and a held-thermostat run (tests/verification/thermostat-held.test.ts)
 * put its molten time 0.70 s late, where this rule is 0.01 s off. Measured at the defaults on examples/: Newton sweeps
 * 21 598 → 19 647, the demo 1675 → 1357; at ×0.01 tolerances on 1600 cells 44 521 → 20 016 (DEVELOPERS.md, "The
 * second error filter", with what it costs in accuracy).
 * With backwardEuler: true the step is one backward-Euler stage (first order, for the convergence study).
 */
import type { StageSystem, StepBuffers, UpdateSize } from '../grid/stage-system.ts';

const SQRT2 = Math.SQRT2;
const GAMMA = 2 - SQRT2;
const D = 1 - SQRT2 / 2;
/** BDF2 stage: H₁ = A·H_γ − Bb·H₀ + d·h·f₁ (Bank et al. 1985, eq. 2.3). */
const A = 1 / (GAMMA * (2 - GAMMA));
const BB = ((1 - GAMMA) * (1 - GAMMA)) / (GAMMA * (2 - GAMMA));
/** Quadrature weights of the method and of the embedded third-order formula (order conditions solved for c = 0, γ, 1). */
export const WEIGHTS = [SQRT2 / 4, SQRT2 / 4, 1 - SQRT2 / 2] as const;
const BHAT2 = 1 / (6 * GAMMA * (1 - GAMMA));
const BHAT3 = 0.5 - 1 / (6 * (1 - GAMMA));
const BHAT = [1 - BHAT2 - BHAT3, BHAT2, BHAT3] as const;
const E = [WEIGHTS[0] - BHAT[0], WEIGHTS[1] - BHAT[1], WEIGHTS[2] - BHAT[2]] as const;
/** Where the stage point lies in a step, as a fraction of it (t + γh). */
export const STAGE_FRACTION = GAMMA;

export interface NewtonSettings {
  /**
   * Convergence when every update is below this, in the system's own measure of an update (kelvin for a thermal
   * system: the stack's enthalpy updates divided by ρc_p).
   */
  readonly toleranceK: number;
  readonly maxIterations: number;
}

export type StepStatus = 'ok' | 'newton-failed' | 'singular';

export interface StepOutcome {
  status: StepStatus;
  /** Weighted local error; the step is acceptable when ≤ 1. */
  errorNorm: number;
  newtonIterations: number;
}

/**
 * Newton iterations for U solving the stage M·(U − B) − h·F(U) = 0 (B in buf.B). U holds the guess on entry and the
 * solution on exit; on success the system holds the state at the solution (its acceptUpdate). Overwrites U, buf.res,
 * buf.delta and the system's evaluation.
 */
function solveStage(sys: StageSystem, buf: StepBuffers, U: Float64Array, h: number, newton: NewtonSettings,
  move: UpdateSize, outcome: StepOutcome): StepStatus {
  const { B, res, delta } = buf;
  let previous = Infinity;
  for (let iter = 0; iter < newton.maxIterations; iter++) {
    sys.evaluate(U);
    sys.stageResidual(U, B, h, res);
    sys.assembleStage(h);
    if (!sys.solveStage(res, delta)) return 'singular';
    outcome.newtonIterations++;
    sys.newtonUpdate(U, delta, res, move);
    const worst = move.largest;
    // converged when the update, or the remaining error bound θ/(1−θ)·|δ| of a contracting iteration, is below the
    // tolerance (Hairer & Wanner, Solving ODEs II, §IV.8, eq. 8.10); an update stopped at a kink is never the last
    const theta = iter > 0 ? worst / previous : 1;
    if (!move.stopped && (worst <= newton.toleranceK || (theta < 1 && (theta / (1 - theta)) * worst <= newton.toleranceK))) {
      sys.acceptUpdate(U, delta, res, h);
      return 'ok';
    }
    if (!Number.isFinite(worst)) return 'newton-failed';
    previous = worst;
  }
  return 'newton-failed';
}

/** The Newton update's report, shared by every step (the integrator allocates nothing per step). */
const MOVE: UpdateSize = { largest: 0, stopped: false };

/**
 * Takes one step of size h from buf.U0 (whose rates buf.F0, buf.q0 are current in sys). On 'ok' the end state is in
 * buf.U1/F1/q1 and the stage state in buf.Ug/Fg/qg, and outcome.errorNorm is the system's norm of the local error;
 * buf.U0 is untouched either way.
 */
export function takeStep(sys: StageSystem, buf: StepBuffers, h: number, newton: NewtonSettings, backwardEuler: boolean,
  outcome: StepOutcome): StepOutcome {
  const { U0, Ug, U1, F0, Fg, F1, B } = buf;
  const size = sys.size;
  outcome.newtonIterations = 0;
  outcome.errorNorm = 0;

  if (backwardEuler) {
    B.set(U0);
    sys.beginStage('euler', h, buf, 0, 0);
    U1.set(U0);
    outcome.status = solveStage(sys, buf, U1, h, newton, MOVE, outcome);
    if (outcome.status !== 'ok') return outcome;
    sys.readRates(F1);
    sys.readChannels(buf.q1);
    Ug.set(U1);
    Fg.set(F1);
    buf.qg.set(buf.q1);
    return outcome;
  }

  const hd = D * h;
  // trapezoidal stage to t + γh
  B.set(U0);
  sys.addRates(B, F0, hd);
  sys.beginStage('trapezoid', hd, buf, 0, 0);
  Ug.set(U0);
  outcome.status = solveStage(sys, buf, Ug, hd, newton, MOVE, outcome);
  if (outcome.status !== 'ok') return outcome;
  sys.readRates(Fg);
  sys.readChannels(buf.qg);

  // BDF2 stage to t + h, from a linear extrapolation of the two known states
  const lean = (1 - GAMMA) / GAMMA;
  for (let j = 0; j < size; j++) U1[j] = Ug[j]! + lean * (Ug[j]! - U0[j]!);
  for (let j = 0; j < size; j++) B[j] = A * Ug[j]! - BB * U0[j]!;
  sys.beginStage('bdf2', hd, buf, A, BB);
  outcome.status = solveStage(sys, buf, U1, hd, newton, MOVE, outcome);
  if (outcome.status !== 'ok') return outcome;
  sys.readRates(F1);
  sys.readChannels(buf.q1);

  // error estimate h·Σ(b − b̂)·f, filtered through the stage operator at the end state (rates are 0 on constraints)
  const { res, delta } = buf;
  for (let j = 0; j < size; j++) res[j] = h * (E[0] * F0[j]! + E[1] * Fg[j]! + E[2] * F1[j]!);
  sys.assembleStage(hd);
  if (!sys.solveStage(res, delta)) {
    outcome.status = 'singular';
    return outcome;
  }
  outcome.errorNorm = sys.errorNorm(U0, U1, delta);
  if (outcome.errorNorm > 1) {
    // about to be rejected: filter once more (see the header), and judge the step by that
    sys.massTimes(delta, res);
    if (!sys.solveStage(res, delta)) {
      outcome.status = 'singular';
      return outcome;
    }
    outcome.errorNorm = sys.errorNorm(U0, U1, delta);
  }
  return outcome;
}

/**
 * Energy per unit area (J/m²) that a ledger channel (a face, the cells' generation, their edges) took in over a step
 * of size h, by the method's own quadrature: the same weights that advance the enthalpies, so the ledger closes.
 */
/** Accepts a step: its end state and rates become the start of the next one, and the system marks that start. */
export function acceptStep(sys: StageSystem, buf: StepBuffers): void {
  buf.U0.set(buf.U1);
  buf.F0.set(buf.F1);
  buf.q0.set(buf.q1);
  sys.markStart();
}

export function stepFaceEnergy(buf: StepBuffers, channel: number, h: number, backwardEuler: boolean): number {
  if (backwardEuler) return h * buf.q1[channel]!;
  return h * (WEIGHTS[0] * buf.q0[channel]! + WEIGHTS[1] * buf.qg[channel]! + WEIGHTS[2] * buf.q1[channel]!);
}
