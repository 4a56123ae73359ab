/**
 * One step of TR-BDF2 (Bank, Coughran, Fichtner, Grosse, Rose & Smith 1985; Hosea & Shampine 1996), the default
 * integrator: a trapezoidal stage to t + γh, then a BDF2 stage to t + h, with γ = 2 − √2 so both stages share the
 * implicit coefficient d = γ/2. It is second order, L-stable (no ringing after a heater is switched off) and, as an
 * ESDIRK method with weights b = (√2/4, √2/4, 1 − √2/2), conserves energy exactly in the discrete sense.
 *
 * Each stage is solved by Newton's method on the enthalpies (tridiagonal Jacobian, Thomas solve). The local error is
 * estimated from the embedded third-order weights b̂ on the same stage derivatives and filtered through the stage
 * matrix (I − d·h·J)⁻¹, Shampine's device for stiff problems (Hosea & Shampine 1996, §3).
 * With backwardEuler: true the step is one backward-Euler stage (first order, for the convergence study).
 */
import type { LedgerChannel, StepConditions, Workspace } from '../grid/discretization.ts';
import { CHANNEL_COUNT, evaluate, linearizeCellTerms, stageJacobian, stageResidual } from '../grid/discretization.ts';
import { solveTridiagonal } from '../grid/tridiagonal.ts';
import { stopAtKink } from './newton-kinks.ts';
import { beginPlateStage } from './plates.ts';

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
  /** Convergence when every update is below this, in kelvin (enthalpy updates divided by ρc_p). */
  readonly toleranceK: number;
  readonly maxIterations: number;
}

/** What the local error is measured in: the quantities a run reports. */
export interface ErrorScale {
  /** Temperature error allowed per step, K. */
  readonly toleranceK: number;
  /** Liquid-fraction error allowed per step (a share of the latent heat). */
  readonly liquidFraction: number;
}

/** Nudge past a kink, in kelvin-equivalent enthalpy: far below any tolerance, far above round-off. */
const KINK_NUDGE_K = 1e-9;

/** State and rates at the three points of a step: 0 (start), g (t + γh), 1 (end). */
export interface StepBuffers {
  readonly U0: Float64Array;
  readonly Ug: Float64Array;
  readonly U1: Float64Array;
  readonly F0: Float64Array;
  readonly Fg: Float64Array;
  readonly F1: Float64Array;
  /** Rates of the ledger channels (CHANNEL: bottom face, top face, generated, edges), W/m², at the three points. */
  readonly q0: Float64Array;
  readonly qg: Float64Array;
  readonly q1: Float64Array;
  /** Node temperatures at the start of the step, K (n+2). */
  readonly T0: Float64Array;
  readonly B: Float64Array;
  readonly res: Float64Array;
  readonly delta: Float64Array;
  readonly work: Float64Array;
}

export function createStepBuffers(n: number): StepBuffers {
  const m = n + 2;
  return {
    U0: new Float64Array(m), Ug: new Float64Array(m), U1: new Float64Array(m),
    F0: new Float64Array(n), Fg: new Float64Array(n), F1: new Float64Array(n),
    q0: new Float64Array(CHANNEL_COUNT), qg: new Float64Array(CHANNEL_COUNT), q1: new Float64Array(CHANNEL_COUNT), T0: new Float64Array(m),
    B: new Float64Array(n), res: new Float64Array(m), delta: new Float64Array(m), work: new Float64Array(m),
  };
}

export type StepStatus = 'ok' | 'newton-failed' | 'singular';

export interface StepOutcome {
  status: StepStatus;
  /** Weighted local error; the step is acceptable when ≤ 1. */
  errorNorm: number;
  newtonIterations: number;
}

/**
 * Newton iterations for U solving Δx·(H − B) − h·F(U) = 0. U holds the guess on entry and the solution on exit; on
 * success ws holds the state at the solution (see acceptLinearUpdate). Overwrites U, buf.res, buf.delta, buf.work and
 * the ws buffers.
 */
function solveStage(ws: Workspace, buf: StepBuffers, U: Float64Array, h: number, cond: StepConditions,
  newton: NewtonSettings, outcome: StepOutcome): StepStatus {
  const { n } = ws;
  const m = n + 2;
  let previous = Infinity;
  for (let iter = 0; iter < newton.maxIterations; iter++) {
    evaluate(ws, U, cond);
    stageResidual(ws, U, buf.B, h, cond, buf.res);
    stageJacobian(ws, h, cond);
    if (!solveTridiagonal(m, ws.lower, ws.diag, ws.upper, buf.res, buf.delta, buf.work)) return 'singular';
    outcome.newtonIterations++;
    let worst = 0;
    let clipped = false;
    const { delta, res } = buf;
    for (let j = 1; j <= n; j++) {
      const old = U[j]!;
      const next = stopAtKink(ws.curves[j - 1]!.kinks, old, old - delta[j]!, ws.capacity[j - 1]! * KINK_NUDGE_K);
      if (next !== old - delta[j]!) { clipped = true; delta[j] = old - next; }
      U[j] = next;
      const scaled = Math.abs(delta[j]! / ws.capacity[j - 1]!);
      if (!(scaled <= worst)) worst = scaled; // also catches NaN
    }
    // a face node moves with its cell: when the cell's update stopped at a kink, the face takes what its own linearised
    // balance gives for the cell's shortened update, not the full one (which assumed the cell went past the kink, and
    // made the pair cycle across it)
    if (clipped) {
      delta[0] = (res[0]! - ws.upper[0]! * delta[1]!) / ws.diag[0]!;
      delta[n + 1] = (res[n + 1]! - ws.lower[n + 1]! * delta[n]!) / ws.diag[n + 1]!;
    }
    U[0] = U[0]! - delta[0]!;
    U[n + 1] = U[n + 1]! - delta[n + 1]!;
    const faceWorst = Math.max(Math.abs(delta[0]!), Math.abs(delta[n + 1]!));
    if (!(faceWorst <= worst)) worst = faceWorst;
    // converged when the update, or the remaining error bound θ/(1−θ)·|δ| of a contracting iteration, is below the
    // tolerance (Hairer & Wanner, Solving ODEs II, §IV.8, eq. 8.10); an update stopped at a kink is never the last
    const theta = iter > 0 ? worst / previous : 1;
    if (!clipped && (worst <= newton.toleranceK || (theta < 1 && (theta / (1 - theta)) * worst <= newton.toleranceK))) {
      acceptLinearUpdate(ws, buf, U, h, cond);
      return 'ok';
    }
    if (!Number.isFinite(worst)) return 'newton-failed';
    previous = worst;
  }
  return 'newton-failed';
}

/**
 * After the last Newton update U ← U − δ, brings ws to the new U by the same linearisation the update solved, instead
 * of evaluating again: F ← F − (Δx·δ − R)/h on the cells (so Δx·(U − B) − h·F = 0 holds exactly), T ← T − τ·δ, and
 * each face's heat input and each cell term's rate moves along its slope. The linearised interior fluxes telescope and the face rows balance,
 * so the energy ledger closes to round-off; the remaining difference from a fresh evaluation is O(δ²), far below the
 * Newton tolerance. Overwrites ws.F, ws.T, ws.faceQ.
 */
function acceptLinearUpdate(ws: Workspace, buf: StepBuffers, U: Float64Array, h: number, cond: StepConditions): void {
  const { n, T, tau, F, G, dHalf, faceQ, faceDq } = ws;
  const dx = ws.grid.dx;
  const { delta, res } = buf;
  // faces first, from the slopes at the old state
  if (cond.bottom.kind === 'fixed') {
    const b0 = -G[0]! * tau[1]! - G[0]! * G[0]! * (T[0]! - T[1]!) * dHalf[1]!;
    faceQ[0] = faceQ[0]! - b0 * delta[1]!;
  } else {
    faceQ[0] = faceQ[0]! - faceDq[0]! * delta[0]!;
  }
  if (cond.top.kind === 'fixed') {
    // heat into the top face is −Q_n; Q_n's slope in U_n is a_n
    const an = G[n]! * tau[n]! - G[n]! * G[n]! * (T[n]! - T[n + 1]!) * dHalf[n]!;
    faceQ[1] = faceQ[1]! + an * delta[n]!;
  } else {
    faceQ[1] = faceQ[1]! - faceDq[1]! * delta[n + 1]!;
  }
  linearizeCellTerms(ws, delta);
  for (let i = 0; i < n; i++) {
    const j = i + 1;
    F[i] = F[i]! - (dx[i]! * delta[j]! - res[j]!) / h;
    T[j] = T[j]! - tau[j]! * delta[j]!;
  }
  T[0] = U[0]!;
  T[n + 1] = U[n + 1]!;
}

/**
 * Takes one step of size h from buf.U0 (whose rates buf.F0, buf.q0 are current under `cond`). On 'ok' the end state
 * is in buf.U1/F1/q1 and the stage state in buf.Ug/Fg/qg; buf.U0 is untouched either way.
 * The error of each cell's enthalpy is measured as what it does to the reported quantities: its temperature (through
 * the secant dT/dH over the step, which is zero while a cell sits on an isothermal plateau) and, for a cell in or
 * across its melt, its liquid fraction (error / ρL, or the temperature measure if that allows more). So a cell
 * crossing a kink of T(H) is judged by its real effect, not by the kink.
 */
export function takeStep(ws: Workspace, buf: StepBuffers, h: number, cond: StepConditions, newton: NewtonSettings,
  scale: ErrorScale, backwardEuler: boolean, outcome: StepOutcome): StepOutcome {
  const { n, grid } = ws;
  const dx = grid.dx;
  const { U0, Ug, U1, F0, Fg, F1, B } = buf;
  outcome.newtonIterations = 0;
  outcome.errorNorm = 0;

  if (backwardEuler) {
    for (let i = 0; i < n; i++) B[i] = U0[i + 1]!;
    beginPlateStage(ws, cond, h, 'euler', buf.q0, buf.qg, Ug);
    U1.set(U0);
    outcome.status = solveStage(ws, buf, U1, h, cond, newton, outcome);
    if (outcome.status !== 'ok') return outcome;
    F1.set(ws.F);
    buf.q1.set(ws.faceQ);
    Ug.set(U1);
    Fg.set(F1);
    buf.qg.set(buf.q1);
    return outcome;
  }

  const hd = D * h;
  // trapezoidal stage to t + γh
  for (let i = 0; i < n; i++) B[i] = U0[i + 1]! + (hd * F0[i]!) / dx[i]!;
  beginPlateStage(ws, cond, hd, 'trapezoid', buf.q0, buf.qg, Ug);
  Ug.set(U0);
  outcome.status = solveStage(ws, buf, Ug, hd, cond, newton, outcome);
  if (outcome.status !== 'ok') return outcome;
  Fg.set(ws.F);
  buf.qg.set(ws.faceQ);

  // BDF2 stage to t + h, from a linear extrapolation of the two known states
  const lean = (1 - GAMMA) / GAMMA;
  for (let j = 0; j < n + 2; j++) U1[j] = Ug[j]! + lean * (Ug[j]! - U0[j]!);
  for (let i = 0; i < n; i++) B[i] = A * Ug[i + 1]! - BB * U0[i + 1]!;
  beginPlateStage(ws, cond, hd, 'bdf2', buf.q0, buf.qg, Ug, A, BB);
  outcome.status = solveStage(ws, buf, U1, hd, cond, newton, outcome);
  if (outcome.status !== 'ok') return outcome;
  F1.set(ws.F);
  buf.q1.set(ws.faceQ);

  // error estimate h·Σ(b − b̂)·f, filtered through the stage matrix at the end state
  const { res, delta, work } = buf;
  res[0] = 0;
  res[n + 1] = 0;
  for (let i = 0; i < n; i++) res[i + 1] = h * (E[0] * F0[i]! + E[1] * Fg[i]! + E[2] * F1[i]!);
  stageJacobian(ws, hd, cond);
  if (!solveTridiagonal(n + 2, ws.lower, ws.diag, ws.upper, res, delta, work)) {
    outcome.status = 'singular';
    return outcome;
  }
  let worst = 0;
  const T1 = ws.T;
  const T0 = buf.T0;
  for (let i = 0; i < n; i++) {
    const z = Math.abs(delta[i + 1]!);
    const dH = Math.abs(U1[i + 1]! - U0[i + 1]!);
    const secant = dH > ws.capacity[i]! * KINK_NUDGE_K ? Math.abs(T1[i + 1]! - T0[i + 1]!) / dH : ws.tau[i + 1]!;
    let e = (z * secant) / scale.toleranceK;
    const latent = ws.latent[i]!;
    if (latent > 0) {
      // the liquid-fraction error counts only for a cell in or across its melt over the step, and is measured
      // against the larger of the two allowances, so it fades into the temperature measure as the latent heat → 0
      // (a latent heat of 1e-6 J/kg must cost what no melt costs)
      const melt = grid.materials[i]!.melt!;
      const a = U0[i + 1]!;
      const b = U1[i + 1]!;
      if (Math.min(a, b) <= melt.hLiquidus + z && Math.max(a, b) >= melt.hSolidus - z) {
        e = Math.max(e, z / Math.max(scale.liquidFraction * latent, scale.toleranceK * ws.capacity[i]!));
      }
    }
    if (!(e <= worst)) worst = e;
  }
  outcome.errorNorm = worst;
  return outcome;
}

/**
 * Energy per unit area (J/m²) that a ledger channel (a face, the cells' generation, their edges) took in over a step
 * of size h, by the method's own quadrature: the same weights that advance the enthalpies, so the ledger closes.
 */
export function stepFaceEnergy(buf: StepBuffers, side: LedgerChannel, h: number, backwardEuler: boolean): number {
  if (backwardEuler) return h * buf.q1[side]!;
  return h * (WEIGHTS[0] * buf.q0[side]! + WEIGHTS[1] * buf.qg[side]! + WEIGHTS[2] * buf.q1[side]!);
}

/**
 * Brings the face nodes of U into balance with the cells under `cond` (after a schedule change the face temperature
 * jumps; a zero-volume node has no memory). Scalar Newton per face. Leaves ws evaluated at U. Overwrites U[0], U[n+1].
 */
export function settleFaces(ws: Workspace, U: Float64Array, cond: StepConditions, toleranceK: number): boolean {
  const { n } = ws;
  if (cond.bottom.kind === 'fixed') U[0] = cond.bottom.tK;
  if (cond.top.kind === 'fixed') U[n + 1] = cond.top.tK;
  const maxIterations = 60;
  for (let iter = 0; iter < maxIterations; iter++) {
    evaluate(ws, U, cond);
    let worst = 0;
    if (cond.bottom.kind !== 'fixed') {
      const r = ws.G[0]! * (ws.T[0]! - ws.T[1]!) - ws.faceQ[0]!;
      const step = r / (ws.G[0]! - ws.faceDq[0]!);
      U[0] = U[0]! - step;
      worst = Math.max(worst, Math.abs(step));
    }
    if (cond.top.kind !== 'fixed') {
      const r = ws.G[n]! * (ws.T[n + 1]! - ws.T[n]!) - ws.faceQ[1]!;
      const step = r / (ws.G[n]! - ws.faceDq[1]!);
      U[n + 1] = U[n + 1]! - step;
      worst = Math.max(worst, Math.abs(step));
    }
    if (worst <= toleranceK) {
      evaluate(ws, U, cond);
      // book as the face's heat input exactly what its half cell conducts inwards: the Newton remainder of the face
      // balance (up to tolerance × (G + |dq/dT|), large beside a stiff plate) then stays out of the energy ledger
      if (cond.bottom.kind !== 'fixed') ws.faceQ[0] = ws.G[0]! * (ws.T[0]! - ws.T[1]!);
      if (cond.top.kind !== 'fixed') ws.faceQ[1] = ws.G[n]! * (ws.T[n + 1]! - ws.T[n]!);
      return true;
    }
    if (!Number.isFinite(worst)) return false;
  }
  return false;
}
