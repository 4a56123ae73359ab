/**
 * `npm run bench`, part: three ways of treating an isothermal melt front, measured on the one-phase Stefan problem of
 * bench/stefan.ts (tests/support/stefan-problem.ts: 10 mm, liquid at T_m, the wall 100 K below from t = 0, adiabatic far
 * end; Alexiades & Solomon 1993 §2.1, Carslaw & Jaeger §11.2), each a stage system (sim/grid/stage-system.ts) driven by
 * freezeline's own TR-BDF2 and step control (sim/time/drive.ts) at the ×0.01 tolerances of the scaling rows. It asks
 * which candidate of the engine issue's second deliverable brings the work's growth with the grid to ≤ 1.1, and at
 * what error. A measurement of candidates, not the product's solver: no schedules, faces or ledger, one material.
 *
 *   enthalpy   the cells' enthalpies, T(H) with its plateau at T_m: the product's method (grid/discretization.ts),
 *              written again for this problem, with its Newton updates stopped at the kinks (grid/newton-kinks.ts) and
 *              its error measure (a cell's temperature error through its secant, the width-weighted RMS; the cells in
 *              or across their melt by Σ Δx·|z|/ρL against tol_f × the level-0 width, LineSystem.errorNorm).
 *   sub-cell   the same cells, but T_m sits at the front inside the front cell J, at s·Δx from its solid face (our
 *              own derivation, no source): the solid share holds the linear profile from the last solid node to the
 *              front, so H_J = ρL(1 − s) − ρc_p·G·s²·Δx/(2(a + sΔx)), G = T_m − T_{J−1}, a the distance from that
 *              node to the cell's face; the neighbours' fluxes are k·G/(a + sΔx) and k(T_{J+1} − T_m)/((1 − s)Δx + Δx/2),
 *              continuous when the front crosses a face (s = 1 in J is s = 0 in J + 1, and J's mean temperature is then
 *              T_m − G/3 both ways). A cell the front has left stays solid for the rest of the step's trials. Its error
 *              measure: the temperatures as above (the front cell's mean temperature), and the front position's
 *              error X = (J + s)·Δx linearised through s(H_J, G), against the same allowance.
 *   fixed      the front-fixing map of Landau (1950; Crank, Free and Moving Boundary Problems, 1984, §6.3): ξ = x/X(t)
 *              on the solid, nodes at ξ = j/N, unknowns T_1 … T_{N−1}, X and V = dX/dt (a constraint entry,
 *              ρL·V = k·∂T/∂x at the front by a second-order one-sided difference):
 *                dT_j/dt = α/X²·∂²T/∂ξ² + ξ_j·(V/X)·∂T/∂ξ   (central differences);
 *              its stage operator is tridiagonal bordered by two rows and columns, solved by block elimination (three
 *              tridiagonal solves). Error measure: the RMS of the nodes' temperature errors, and X's against the
 *              allowance. Its accept re-evaluates (no ledger here).
 *
 * Printed per method and grid: time, accepted and rejected steps, Newton sweeps, work (cells × sweeps), the half-frozen
 * time's error against the closed form, and the log–log slope of the work. Figures only: nothing here asserts.
 * BENCH_QUICK=1 stops at 400 cells.
 */
import type { StageKind, StageSystem, UpdateSize } from '../sim/grid/stage-system.ts';
import { createStepBuffers } from '../sim/grid/stage-system.ts';
import { solveTridiagonal } from '../sim/grid/tridiagonal.ts';
import { stopAtKink } from '../sim/grid/newton-kinks.ts';
import { KINK_NUDGE_K } from '../sim/grid/line-system.ts';
import { drive } from '../sim/time/drive.ts';
import { evolveDefaults, newtonSettingsOf } from '../sim/time/evolve.ts';
import { scenarioDefaults } from '../sim/scenario/scenario.ts';
import { cToK } from '../sim/physics/units.ts';
import { STEFAN, stefanTimes } from '../tests/support/stefan-problem.ts';
import { erf } from '../tests/support/special.ts';
import { DEMO_BASE_CELLS } from './demo-problem.ts';

const QUICK = process.env.BENCH_QUICK === '1';
const CELLS = QUICK ? [50, 100, 200, 400] : [50, 100, 200, 400, 800];
const TIGHT = 0.01;
/** Wall below T_m, K: a fast freeze (St = 0.5) and a slow one (St = 0.025, where a melt ramp's error was largest). */
const WALLS_BELOW_K = [100, 5] as const;

const { thicknessM: W, k, rho, cp, latent } = STEFAN;
const TM = cToK(STEFAN.meltC);
const RC = rho * cp;
const RL = rho * latent;
const ALPHA = k / RC;
/** Level-0 cell width, m: the allowance of the front's error is tol_f times it, as the scaling rows have it. */
const LEVEL0_M = W / DEMO_BASE_CELLS;
/** Nudge past a kink, J/m³: the product's, in kelvin of ρc_p. */
const NUDGE = RC * KINK_NUDGE_K;

interface Tolerances { readonly tolK: number; readonly tolF: number }

/** The enthalpy and sub-cell methods: the cells' enthalpies (J/m³, 0 = solid at T_m), wall at x = 0, adiabatic end. */
class CellSlab implements StageSystem {
  readonly size: number;
  readonly channels = 0;
  private readonly dx: number;
  private readonly T: Float64Array;
  private readonly tau: Float64Array;
  private readonly F: Float64Array;
  private readonly dLo: Float64Array;
  private readonly dDi: Float64Array;
  private readonly dUp: Float64Array;
  private readonly lower: Float64Array;
  private readonly diag: Float64Array;
  private readonly upper: Float64Array;
  private readonly work: Float64Array;
  private readonly T0: Float64Array;
  private readonly kinks = Float64Array.of(0, RL);
  /** The front cell at the last evaluation and at the step's start (n: none). */
  private front = 0;
  private frontStart = 0;
  private dsdH = 0;
  private dsdG = 0;

  constructor(private readonly n: number, private readonly wallK: number, private readonly subCell: boolean, private readonly tol: Tolerances) {
    this.size = n;
    this.dx = W / n;
    const z = () => new Float64Array(n);
    this.T = z(); this.tau = z(); this.F = z(); this.dLo = z(); this.dDi = z(); this.dUp = z();
    this.lower = z(); this.diag = z(); this.upper = z(); this.work = z(); this.T0 = z();
  }

  /** The front's share s of cell J solid, from H_J and G (the quadratic of the header, its root in [0, 1]). */
  private share(h: number, g: number, a: number): number {
    if (h >= RL) return 0;
    const A = RL + (RC * g) / 2;
    const B = RL * (1 - a) - h;
    const C = a * (RL - h);
    return Math.min(1, (B + Math.sqrt(B * B + 4 * A * C)) / (2 * A));
  }

  /**
   * The sub-cell front: cells below the step's starting front are solid; from there, the first cell whose enthalpy
   * lies above its solid reading at s = 1 holds the front. Writes T and tau of the solid cells; returns J (n: none).
   */
  private findFront(U: Float64Array): number {
    const { n, dx, T, tau } = this;
    let prevT = this.wallK;
    let a = 0;
    for (let i = 0; i < n; i++) {
      const g = TM - prevT;
      const threshold = (-RC * g * dx) / (2 * (a + dx));
      if (i >= this.frontStart && U[i]! > threshold) return i;
      T[i] = TM + U[i]! / RC;
      tau[i] = 1 / RC;
      prevT = T[i]!;
      a = dx / 2;
    }
    return n;
  }

  /** Solid thickness, m: the front's position. */
  position(U: Float64Array): number {
    const { n, dx } = this;
    if (!this.subCell) {
      let x = 0;
      for (let i = 0; i < n; i++) x += dx * (1 - Math.min(1, Math.max(0, U[i]! / RL)));
      return x;
    }
    const J = this.findFront(U);
    if (J === n) return W;
    const a = J === 0 ? 0 : dx / 2;
    return (J + this.share(U[J]!, TM - (J === 0 ? this.wallK : this.T[J - 1]!), a / dx)) * dx;
  }

  evaluate(U: Float64Array): void {
    const { n, dx, T, tau, F, dLo, dDi, dUp } = this;
    dLo.fill(0); dDi.fill(0); dUp.fill(0); F.fill(0);
    const g = k / dx;
    const gWall = k / (dx / 2);
    const J = this.subCell ? this.findFront(U) : n;
    this.front = J;
    for (let i = this.subCell ? J : 0; i < n; i++) {
      const h = U[i]!;
      if (h < 0) { T[i] = TM + h / RC; tau[i] = 1 / RC; } else if (h <= RL) { T[i] = TM; tau[i] = 0; } else { T[i] = TM + (h - RL) / RC; tau[i] = 1 / RC; }
    }
    // conduction between neighbouring nodes left of the front (all of the slab without a sub-cell front)
    const solidEnd = Math.min(J, n);
    for (let i = 0; i < solidEnd; i++) {
      const gl = i === 0 ? gWall : g;
      const tl = i === 0 ? this.wallK : T[i - 1]!;
      F[i] = F[i]! - gl * (T[i]! - tl);
      dDi[i] = dDi[i]! - gl * tau[i]!;
      if (i > 0) dLo[i] = gl * tau[i - 1]!;
      if (i + 1 < solidEnd || (!this.subCell && i + 1 < n)) {
        F[i] = F[i]! + g * (T[i + 1]! - T[i]!);
        dDi[i] = dDi[i]! - g * tau[i]!;
        dUp[i] = g * tau[i + 1]!;
      }
    }
    if (!this.subCell || J === n) return;
    const h = U[J]!;
    const a = J === 0 ? 0 : dx / 2;
    const al = a / dx;
    const gradK = TM - (J === 0 ? this.wallK : T[J - 1]!);
    const s = this.share(h, gradK, al);
    // ds/dH and ds/dG from Φ(s, H, G) = ρL(1 − s) − ρc_p·G·s²/(2(α + s)) − H = 0, α = a/Δx
    const phiS = -RL - (RC * gradK * s * (s + 2 * al)) / (2 * (al + s) * (al + s));
    const phiG = (-RC * s * s) / (2 * (al + s));
    this.dsdH = h >= RL ? 0 : 1 / phiS;
    this.dsdG = h >= RL ? 0 : -phiG / phiS;
    // the front cell's mean temperature (what a run would report; the fluxes do not read it)
    T[J] = TM - (gradK * s * s) / (2 * (al + s));
    tau[J] = ((-gradK * s * (s + 2 * al)) / (2 * (al + s) * (al + s))) * this.dsdH;
    const dl = a + s * dx;
    const pl = (k * gradK) / dl; // from the front into the solid
    const plS = (-k * gradK * dx) / (dl * dl);
    const plH = plS * this.dsdH;
    const plG = k / dl + plS * this.dsdG;
    let pr = 0;
    let prH = 0;
    let prG = 0;
    let prNext = 0;
    if (J + 1 < n) {
      const dr = (1 - s) * dx + dx / 2;
      pr = (k * (T[J + 1]! - TM)) / dr; // from the liquid into the front
      const prS = (k * (T[J + 1]! - TM) * dx) / (dr * dr);
      prH = prS * this.dsdH;
      prG = prS * this.dsdG;
      prNext = (k * tau[J + 1]!) / dr;
    }
    F[J] = pr - pl;
    dDi[J] = prH - plH;
    dUp[J] = prNext;
    if (J > 0) {
      const t = tau[J - 1]!; // dG/dH_{J−1} = −τ
      dLo[J] = -(prG - plG) * t;
      F[J - 1] = F[J - 1]! + pl;
      dDi[J - 1] = dDi[J - 1]! - plG * t;
      dUp[J - 1] = plH;
    }
    // the liquid beyond (its coupling to H_{J−1} through s, zero while the liquid sits at T_m, is left out)
    for (let i = J + 1; i < n; i++) {
      let f = 0;
      let d = 0;
      if (i + 1 < n) { f += g * (T[i + 1]! - T[i]!); d -= g * tau[i]!; dUp[i] = g * tau[i + 1]!; }
      if (i === J + 1) { f -= pr; d -= prNext; dLo[i] = -prH; } else { f -= g * (T[i]! - T[i - 1]!); d -= g * tau[i]!; dLo[i] = g * tau[i - 1]!; }
      F[i] = f;
      dDi[i] = d;
    }
  }

  readRates(out: Float64Array): void { out.set(this.F); }
  readChannels(): void { /* no channels */ }
  addRates(B: Float64Array, F: Float64Array, h: number): void { for (let i = 0; i < this.n; i++) B[i] = B[i]! + (h * F[i]!) / this.dx; }
  massTimes(x: Float64Array, out: Float64Array): void { for (let i = 0; i < this.n; i++) out[i] = this.dx * x[i]!; }
  beginStage(_kind: StageKind): void { /* nothing eliminated */ }
  stageResidual(U: Float64Array, B: Float64Array, h: number, res: Float64Array): void {
    for (let i = 0; i < this.n; i++) res[i] = this.dx * (U[i]! - B[i]!) - h * this.F[i]!;
  }
  assembleStage(h: number): void {
    for (let i = 0; i < this.n; i++) {
      this.lower[i] = -h * this.dLo[i]!;
      this.diag[i] = this.dx - h * this.dDi[i]!;
      this.upper[i] = -h * this.dUp[i]!;
    }
  }
  solveStage(rhs: Float64Array, out: Float64Array): boolean {
    return solveTridiagonal(this.n, this.lower, this.diag, this.upper, rhs, out, this.work);
  }
  newtonUpdate(U: Float64Array, delta: Float64Array, _res: Float64Array, size: UpdateSize): void {
    let worst = 0;
    let stopped = false;
    for (let i = 0; i < this.n; i++) {
      const old = U[i]!;
      let next = old - delta[i]!;
      if (!this.subCell) {
        const at = stopAtKink(this.kinks, old, next, NUDGE);
        if (at !== next) { stopped = true; next = at; delta[i] = old - next; }
      }
      U[i] = next;
      const move = Math.abs(delta[i]! / RC);
      if (!(move <= worst)) worst = move;
    }
    size.largest = worst;
    size.stopped = stopped;
  }
  acceptUpdate(_U: Float64Array, delta: Float64Array, res: Float64Array, h: number): void {
    // the stage equation's own linearisation (grid/line-system.ts acceptUpdate)
    for (let i = 0; i < this.n; i++) {
      this.F[i] = this.F[i]! - (this.dx * delta[i]! - res[i]!) / h;
      this.T[i] = this.T[i]! - this.tau[i]! * delta[i]!;
    }
  }
  errorNorm(U0: Float64Array, U1: Float64Array, z: Float64Array): number {
    const { n, dx, tol } = this;
    let sq = 0;
    let frontM = 0;
    for (let i = 0; i < n; i++) {
      const dH = Math.abs(U1[i]! - U0[i]!);
      const secant = dH > NUDGE ? Math.abs(this.T[i]! - this.T0[i]!) / dH : this.tau[i]!;
      const e = (Math.abs(z[i]!) * secant) / tol.tolK;
      sq += dx * e * e;
      if (!this.subCell && Math.min(U0[i]!, U1[i]!) <= RL && Math.max(U0[i]!, U1[i]!) >= 0) frontM += (dx * Math.abs(z[i]!)) / RL;
    }
    if (this.subCell) {
      const J = this.front;
      if (J < n) frontM = Math.abs(dx * this.dsdH * z[J]! + (J > 0 ? dx * this.dsdG * -this.tau[J - 1]! * z[J - 1]! : 0));
    }
    return Math.max(Math.sqrt(sq / W), frontM / (tol.tolF * LEVEL0_M));
  }
  markStart(): void {
    this.T0.set(this.T);
    this.frontStart = this.front;
  }
}

/** The front-fixing map (header): state T_1 … T_{N−1} (K), X (m), V (m/s). */
class FrontFixed implements StageSystem {
  readonly size: number;
  readonly channels = 0;
  private readonly m: number;
  private readonly F: Float64Array;
  /** Per interior row: ∂F/∂T_{j−1}, ∂F/∂T_j, ∂F/∂T_{j+1}, ∂F/∂X, ∂F/∂V. */
  private readonly d: Float64Array[];
  private readonly lower: Float64Array;
  private readonly diag: Float64Array;
  private readonly upper: Float64Array;
  private readonly colX: Float64Array;
  private readonly colV: Float64Array;
  private readonly y: Float64Array;
  private readonly yX: Float64Array;
  private readonly yV: Float64Array;
  private readonly work: Float64Array;
  /** The constraint g = V − k·∂T/∂x/ρL and its slopes in T_{N−2}, T_{N−1}, X, V. */
  private g = 0;
  private readonly gSlope = new Float64Array(4);
  private stageH = 0;

  constructor(private readonly n: number, private readonly wallK: number, private readonly tol: Tolerances) {
    this.m = n - 1;
    this.size = n + 1;
    const z = (len: number) => new Float64Array(len);
    this.F = z(this.size);
    this.d = [z(this.m), z(this.m), z(this.m), z(this.m), z(this.m)];
    this.lower = z(this.m); this.diag = z(this.m); this.upper = z(this.m);
    this.colX = z(this.m); this.colV = z(this.m); this.y = z(this.m); this.yX = z(this.m); this.yV = z(this.m); this.work = z(this.m);
  }

  private node(U: Float64Array, j: number): number { return j === 0 ? this.wallK : j === this.n ? TM : U[j - 1]!; }

  evaluate(U: Float64Array): void {
    const { n, m, F, d } = this;
    const X = U[m]!;
    const V = U[m + 1]!;
    const dxi = 1 / n;
    const diffusion = ALPHA / (X * X * dxi * dxi);
    for (let j = 1; j <= m; j++) {
      const tl = this.node(U, j - 1);
      const tc = this.node(U, j);
      const tr = this.node(U, j + 1);
      const advection = ((j * dxi) * V) / (X * 2 * dxi);
      const lap = tr - 2 * tc + tl;
      F[j - 1] = diffusion * lap + advection * (tr - tl);
      d[0]![j - 1] = j > 1 ? diffusion - advection : 0;
      d[1]![j - 1] = -2 * diffusion;
      d[2]![j - 1] = j < m ? diffusion + advection : 0;
      d[3]![j - 1] = ((-2 * diffusion) / X) * lap - (advection / X) * (tr - tl);
      d[4]![j - 1] = ((j * dxi) / (X * 2 * dxi)) * (tr - tl);
    }
    F[m] = V;
    F[m + 1] = 0;
    const c = k / (RL * X * 2 * dxi);
    const f = c * (3 * TM - 4 * this.node(U, n - 1) + this.node(U, n - 2));
    this.g = V - f;
    this.gSlope[0] = -c; // ∂g/∂T_{N−2}
    this.gSlope[1] = 4 * c; // ∂g/∂T_{N−1}
    this.gSlope[2] = f / X;
    this.gSlope[3] = 1;
  }

  readRates(out: Float64Array): void { out.set(this.F); }
  readChannels(): void { /* no channels */ }
  addRates(B: Float64Array, F: Float64Array, h: number): void { for (let i = 0; i <= this.m; i++) B[i] = B[i]! + h * F[i]!; }
  massTimes(x: Float64Array, out: Float64Array): void { out.set(x); out[this.m + 1] = 0; }
  beginStage(_kind: StageKind): void { /* nothing eliminated */ }
  stageResidual(U: Float64Array, B: Float64Array, h: number, res: Float64Array): void {
    for (let i = 0; i <= this.m; i++) res[i] = U[i]! - B[i]! - h * this.F[i]!;
    res[this.m + 1] = this.g;
  }
  assembleStage(h: number): void {
    this.stageH = h;
    const { d } = this;
    for (let i = 0; i < this.m; i++) {
      this.lower[i] = -h * d[0]![i]!;
      this.diag[i] = 1 - h * d[1]![i]!;
      this.upper[i] = -h * d[2]![i]!;
      this.colX[i] = -h * d[3]![i]!;
      this.colV[i] = -h * d[4]![i]!;
    }
  }
  solveStage(rhs: Float64Array, out: Float64Array): boolean {
    const { m, lower, diag, upper, work, y, yX, yV, gSlope } = this;
    // δT = y − yX·δX − yV·δV from the tridiagonal block; then the X row (δX − h·δV = r_X) and the constraint row
    // (gSlope on T_{N−2}, T_{N−1}, X, V) in δX, δV
    if (!solveTridiagonal(m, lower, diag, upper, rhs, y, work)) return false;
    if (!solveTridiagonal(m, lower, diag, upper, this.colX, yX, work)) return false;
    if (!solveTridiagonal(m, lower, diag, upper, this.colV, yV, work)) return false;
    const on = (v: Float64Array) => gSlope[0]! * v[m - 2]! + gSlope[1]! * v[m - 1]!;
    const a21 = gSlope[2]! - on(yX);
    const a22 = gSlope[3]! - on(yV);
    const r1 = rhs[m]!;
    const r2 = rhs[m + 1]! - on(y);
    const det = a22 + this.stageH * a21;
    if (det === 0) return false;
    const dX = (r1 * a22 + this.stageH * r2) / det;
    const dV = (r2 - a21 * r1) / det;
    for (let i = 0; i < m; i++) out[i] = y[i]! - yX[i]! * dX - yV[i]! * dV;
    out[m] = dX;
    out[m + 1] = dV;
    return true;
  }
  newtonUpdate(U: Float64Array, delta: Float64Array, _res: Float64Array, size: UpdateSize): void {
    let worst = 0;
    for (let i = 0; i < this.size; i++) U[i] = U[i]! - delta[i]!;
    for (let i = 0; i < this.m; i++) { const move = Math.abs(delta[i]!); if (!(move <= worst)) worst = move; }
    // X's move in kelvin: as a share of its allowance, times the temperature tolerance
    const xMove = (Math.abs(delta[this.m]!) / (this.tol.tolF * LEVEL0_M)) * this.tol.tolK;
    size.largest = Math.max(worst, xMove);
    size.stopped = false;
  }
  acceptUpdate(U: Float64Array): void { this.evaluate(U); }
  errorNorm(_U0: Float64Array, _U1: Float64Array, z: Float64Array): number {
    let sq = 0;
    for (let i = 0; i < this.m; i++) sq += (z[i]! / this.tol.tolK) ** 2;
    return Math.max(Math.sqrt(sq / this.m), Math.abs(z[this.m]!) / (this.tol.tolF * LEVEL0_M));
  }
  markStart(): void { /* scales are fixed */ }
}

type Method = 'enthalpy' | 'sub-cell' | 'fixed';

/** One run from Neumann's solution at the front 0.5 mm in; the half-frozen time's error, s. */
function run(method: Method, n: number, wallBelowK: number, tol: Tolerances) {
  const wallK = TM - wallBelowK;
  const exact = stefanTimes(STEFAN.meltC - wallBelowK);
  const lam = exact.lambda;
  const timeAt = (x: number) => (x / (2 * lam)) ** 2 / ALPHA;
  const t0 = timeAt(0.05 * W);
  const tEnd = timeAt(W) * (method === 'fixed' ? 0.999 : 1.02); // the map holds while some liquid is left
  const profile = (x: number, t: number) => wallK + ((TM - wallK) * erf(x / (2 * Math.sqrt(ALPHA * t)))) / erf(lam);
  const x0 = 2 * lam * Math.sqrt(ALPHA * t0);
  let sys: CellSlab | FrontFixed;
  let position: (U: Float64Array) => number;
  if (method === 'fixed') {
    sys = new FrontFixed(n, wallK, tol);
    position = (U) => U[n - 1]!;
  } else {
    const cells = new CellSlab(n, wallK, method === 'sub-cell', tol);
    sys = cells;
    position = (U) => cells.position(U);
  }
  const buf = createStepBuffers(sys);
  if (method === 'fixed') {
    for (let j = 1; j < n; j++) buf.U0[j - 1] = profile((j / n) * x0, t0);
    buf.U0[n - 1] = x0;
    buf.U0[n] = lam * Math.sqrt(ALPHA / t0);
  } else {
    // cell means of Neumann's profile, by the midpoint rule on 2000 points a cell
    const dx = W / n;
    for (let i = 0; i < n; i++) {
      let h = 0;
      for (let q = 0; q < 2000; q++) {
        const x = (i + (q + 0.5) / 2000) * dx;
        h += x < x0 ? RC * (profile(x, t0) - TM) : RL;
      }
      buf.U0[i] = h / 2000;
    }
  }
  const duration = tEnd - t0;
  const half = W / 2;
  let halfS = NaN;
  let lastT = 0;
  let lastX = x0;
  const start = performance.now();
  const end = drive(sys, buf, {
    endS: duration,
    stepping: { kind: 'adaptive', firstStepS: evolveDefaults.firstStepS, maxStepS: duration * scenarioDefaults.maxStepShare },
    newton: newtonSettingsOf(tol.tolK),
    maxSteps: 5e6,
  }, (_t0, t1) => {
    const x = position(buf.U1);
    // X² grows linearly in time here: interpolated so, the crossing is read without the interpolation's own error
    if (lastX < half && x >= half) halfS = t0 + lastT + ((half * half - lastX * lastX) / (x * x - lastX * lastX)) * (t1 - lastT);
    lastT = t1;
    lastX = x;
  });
  const ms = performance.now() - start;
  return { ...end.stats, ok: end.status === 'ok', ms, work: n * end.stats.newtonIterations, halfErrS: halfS - exact.halfS };
}

const tol: Tolerances = { tolK: scenarioDefaults.toleranceK * TIGHT, tolF: scenarioDefaults.liquidFractionTolerance * TIGHT };
const figures: Record<string, Record<string, { cells: number; work: number; halfErrS: number }[]>> = {};
for (const below of WALLS_BELOW_K) {
  console.log('');
  console.log(`front treatments on the one-phase Stefan problem (10 mm, wall ${below} K below T_m), tolerances ×${TIGHT}, freezeline's TR-BDF2 and step control`);
  console.log('  method      cells      ms    steps  rejected   Newton   work (cells × sweeps)   half-frozen err');
  const byMethod: Record<string, { cells: number; work: number; halfErrS: number }[]> = {};
  for (const method of ['enthalpy', 'sub-cell', 'fixed'] as const) {
    const rows: { cells: number; work: number; halfErrS: number }[] = [];
    for (const n of CELLS) {
      const r = run(method, n, below, tol);
      rows.push({ cells: n, work: r.work, halfErrS: r.halfErrS });
      const status = r.ok ? '' : '  (did not finish)';
      console.log(`  ${method.padEnd(9)} ${String(n).padStart(6)} ${r.ms.toFixed(0).padStart(7)} ${String(r.steps).padStart(8)} ${String(r.rejected).padStart(9)} ${String(r.newtonIterations).padStart(8)} ${String(r.work).padStart(23)} ${r.halfErrS.toFixed(4).padStart(15)} s${status}`);
    }
    const a = rows.find((r) => r.cells === 200)!;
    const b = rows[rows.length - 1]!;
    console.log(`  ${method}: log–log slope of the work ${a.cells} → ${b.cells} cells ${(Math.log(b.work / a.work) / Math.log(b.cells / a.cells)).toFixed(2)}`);
    byMethod[method] = rows;
  }
  figures[`${below}K`] = byMethod;
}
console.log(JSON.stringify({ front_methods: figures }));
