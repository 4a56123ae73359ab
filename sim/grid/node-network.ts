/**
 * A lumped thermal network as a stage system (stage-system.ts): nodes of heat capacity C_i (J/K), linked to each
 * other and to held surroundings by conductances (W/K), each with a constant heat input P_i (W):
 *
 *   C_i·dT_i/dt = Σ_j G_ij·(T_j − T_i) + Σ_a G_ia·(T_a − T_i) + P_i      (Incropera et al., Fundamentals of Heat and
 *   Mass Transfer, §5.2, the lumped-capacitance balance, one per body; §3.1 for the conductance network)
 *
 * The state is the node temperatures (K), every entry stored (M = C). The model is linear, so the stage operator
 * C − h·J is constant; it is solved densely by Gaussian elimination with partial pivoting (Golub & Van Loan, Matrix
 * Computations, §3.4), fine for the handful of nodes a network has. Ledger channels: heat from the surroundings
 * (W, negative: lost) and heat put in. It exists to show that TR-BDF2 and its step control (time/drive.ts) need
 * nothing of the 1D grid; the heater plate and rim nodes of later work can be written the same way.
 */
import type { StageKind, StageSystem, StepBuffers, UpdateSize } from './stage-system.ts';

export interface NetworkLink {
  readonly a: number;
  readonly b: number;
  readonly conductanceWPerK: number;
}

export interface NetworkLoss {
  readonly node: number;
  readonly conductanceWPerK: number;
  /** Temperature of the surroundings the node loses to, K. */
  readonly toK: number;
}

export interface Network {
  /** Heat capacity of each node, J/K (> 0). */
  readonly capacitiesJPerK: readonly number[];
  readonly links: readonly NetworkLink[];
  readonly losses: readonly NetworkLoss[];
  /** Heat put into each node, W (absent: none). */
  readonly powersW?: readonly number[];
}

/** The ledger channels of a network: heat from the surroundings, heat put in (W). */
export const NETWORK_CHANNEL = { surroundings: 0, input: 1 } as const;

/** A network that cannot be solved: names the field and the value. */
function refuse(field: string, value: unknown, why: string): never {
  throw new Error(`${field}: ${why}, got ${String(value)}`);
}

export class NetworkSystem implements StageSystem {
  readonly size: number;
  readonly channels = 2;
  private readonly capacity: Float64Array;
  private readonly power: Float64Array;
  /** The conductance matrix K (dense, n×n, row-major): F(T) = K·T + s, with s = P + Σ G_ia·T_a. */
  private readonly k: Float64Array;
  private readonly s: Float64Array;
  /** Σ_a G_ia per node, W/K: the surroundings channel is Σ_i G_ia·(T_a − T_i). */
  private readonly lossG: Float64Array;
  private readonly lossGT: Float64Array;
  /** The stage operator's LU factors (row-major) and row permutation, and a solve's scratch. */
  private readonly lu: Float64Array;
  private readonly perm: Int32Array;
  private readonly y: Float64Array;
  /** Rates C·dT/dt and channel rates at the last evaluation or accept. */
  private readonly F: Float64Array;
  private readonly q: Float64Array;
  /** Update tolerance of the error norm, K. */
  private readonly toleranceK: number;

  constructor(net: Network, toleranceK: number) {
    const n = net.capacitiesJPerK.length;
    if (n === 0) refuse('capacitiesJPerK', '[]', 'a network needs at least one node');
    if (!(toleranceK > 0)) refuse('toleranceK', toleranceK, 'must be a positive number of kelvin');
    this.size = n;
    this.toleranceK = toleranceK;
    this.capacity = Float64Array.from(net.capacitiesJPerK);
    this.capacity.forEach((c, i) => { if (!(c > 0 && Number.isFinite(c))) refuse(`capacitiesJPerK[${i}]`, c, 'must be a positive number of J/K'); });
    this.power = new Float64Array(n);
    (net.powersW ?? []).forEach((p, i) => {
      if (i >= n) refuse(`powersW[${i}]`, p, `there are only ${n} nodes`);
      if (!Number.isFinite(p)) refuse(`powersW[${i}]`, p, 'must be a finite number of W');
      this.power[i] = p;
    });
    this.k = new Float64Array(n * n);
    this.s = Float64Array.from(this.power);
    this.lossG = new Float64Array(n);
    this.lossGT = new Float64Array(n);
    const node = (field: string, i: number): number => {
      if (!(Number.isInteger(i) && i >= 0 && i < n)) refuse(field, i, `must be a node index in 0…${n - 1}`);
      return i;
    };
    const conductance = (field: string, g: number): number => {
      if (!(g >= 0 && Number.isFinite(g))) refuse(field, g, 'must be a non-negative number of W/K');
      return g;
    };
    net.links.forEach((l, m) => {
      const a = node(`links[${m}].a`, l.a);
      const b = node(`links[${m}].b`, l.b);
      if (a === b) refuse(`links[${m}].b`, b, 'must differ from links[].a');
      const g = conductance(`links[${m}].conductanceWPerK`, l.conductanceWPerK);
      this.k[a * n + a] = this.k[a * n + a]! - g; this.k[b * n + b] = this.k[b * n + b]! - g;
      this.k[a * n + b] = this.k[a * n + b]! + g; this.k[b * n + a] = this.k[b * n + a]! + g;
    });
    net.losses.forEach((l, m) => {
      const i = node(`losses[${m}].node`, l.node);
      const g = conductance(`losses[${m}].conductanceWPerK`, l.conductanceWPerK);
      if (!(l.toK > 0 && Number.isFinite(l.toK))) refuse(`losses[${m}].toK`, l.toK, 'must be a positive temperature in K');
      this.k[i * n + i] = this.k[i * n + i]! - g;
      this.s[i] = this.s[i]! + g * l.toK;
      this.lossG[i] = this.lossG[i]! + g;
      this.lossGT[i] = this.lossGT[i]! + g * l.toK;
    });
    this.lu = new Float64Array(n * n);
    this.perm = new Int32Array(n);
    this.y = new Float64Array(n);
    this.F = new Float64Array(n);
    this.q = new Float64Array(2);
  }

  evaluate(U: Float64Array): void {
    const { size: n, k, s, F, q, lossG, lossGT } = this;
    let surroundings = 0;
    let input = 0;
    for (let i = 0; i < n; i++) {
      let f = s[i]!;
      for (let j = 0; j < n; j++) f += k[i * n + j]! * U[j]!;
      F[i] = f;
      surroundings += lossGT[i]! - lossG[i]! * U[i]!;
      input += this.power[i]!;
    }
    q[NETWORK_CHANNEL.surroundings] = surroundings;
    q[NETWORK_CHANNEL.input] = input;
  }

  readRates(out: Float64Array): void { out.set(this.F); }

  readChannels(out: Float64Array): void { out.set(this.q); }

  addRates(B: Float64Array, F: Float64Array, h: number): void {
    for (let i = 0; i < this.size; i++) B[i] = B[i]! + (h * F[i]!) / this.capacity[i]!;
  }

  massTimes(x: Float64Array, out: Float64Array): void {
    for (let i = 0; i < this.size; i++) out[i] = this.capacity[i]! * x[i]!;
  }

  /** A network has no eliminated bodies: nothing to set before a stage. */
  beginStage(_kind: StageKind, _hd: number, _buf: StepBuffers, _a: number, _bb: number): void {}

  stageResidual(U: Float64Array, B: Float64Array, h: number, res: Float64Array): void {
    for (let i = 0; i < this.size; i++) res[i] = this.capacity[i]! * (U[i]! - B[i]!) - h * this.F[i]!;
  }

  /** Factors C − h·K by Gaussian elimination with partial pivoting (in place, row-major). */
  assembleStage(h: number): void {
    const { size: n, lu, perm, k } = this;
    for (let i = 0; i < n * n; i++) lu[i] = -h * k[i]!;
    for (let i = 0; i < n; i++) { lu[i * n + i] = lu[i * n + i]! + this.capacity[i]!; perm[i] = i; }
    for (let c = 0; c < n; c++) {
      let pivot = c;
      for (let r = c + 1; r < n; r++) if (Math.abs(lu[r * n + c]!) > Math.abs(lu[pivot * n + c]!)) pivot = r;
      if (pivot !== c) {
        for (let j = 0; j < n; j++) { const t = lu[c * n + j]!; lu[c * n + j] = lu[pivot * n + j]!; lu[pivot * n + j] = t; }
        const t = perm[c]!; perm[c] = perm[pivot]!; perm[pivot] = t;
      }
      const d = lu[c * n + c]!;
      if (d === 0) continue; // solveStage reports the zero pivot
      for (let r = c + 1; r < n; r++) {
        const f = lu[r * n + c]! / d;
        lu[r * n + c] = f;
        for (let j = c + 1; j < n; j++) lu[r * n + j] = lu[r * n + j]! - f * lu[c * n + j]!;
      }
    }
  }

  solveStage(rhs: Float64Array, out: Float64Array): boolean {
    const { size: n, lu, perm, y } = this;
    for (let i = 0; i < n; i++) {
      let v = rhs[perm[i]!]!;
      for (let j = 0; j < i; j++) v -= lu[i * n + j]! * y[j]!;
      y[i] = v;
    }
    for (let i = n - 1; i >= 0; i--) {
      const d = lu[i * n + i]!;
      if (d === 0) return false;
      let v = y[i]!;
      for (let j = i + 1; j < n; j++) v -= lu[i * n + j]! * out[j]!;
      out[i] = v / d;
    }
    return true;
  }

  /** A linear model has no kinks: the full update, its size in kelvin. */
  newtonUpdate(U: Float64Array, delta: Float64Array, _res: Float64Array, size: UpdateSize): void {
    let worst = 0;
    for (let i = 0; i < this.size; i++) {
      U[i] = U[i]! - delta[i]!;
      const move = Math.abs(delta[i]!);
      if (!(move <= worst)) worst = move; // also catches NaN
    }
    size.largest = worst;
    size.stopped = false;
  }

  /**
   * F ← F − (C·δ − R)/h (so C·(U − B) − h·F = 0 holds exactly) and the surroundings channel moves along its slope,
   * as the stack does (line-system.ts): the ledger then closes to round-off.
   */
  acceptUpdate(_U: Float64Array, delta: Float64Array, res: Float64Array, h: number): void {
    let moved = 0;
    for (let i = 0; i < this.size; i++) {
      this.F[i] = this.F[i]! - (this.capacity[i]! * delta[i]! - res[i]!) / h;
      moved += this.lossG[i]! * delta[i]!;
    }
    this.q[NETWORK_CHANNEL.surroundings] = this.q[NETWORK_CHANNEL.surroundings]! + moved;
  }

  /** The largest node temperature error over the tolerance. */
  errorNorm(_U0: Float64Array, _U1: Float64Array, z: Float64Array): number {
    let worst = 0;
    for (let i = 0; i < this.size; i++) {
      const e = Math.abs(z[i]!) / this.toleranceK;
      if (!(e <= worst)) worst = e;
    }
    return worst;
  }

  /** The error scale is fixed (kelvin): nothing to take at the start of a step. */
  markStart(): void {}

  /** Heat stored in the nodes above the temperatures T (J): Σ C_i·(U_i − T_i). */
  storedAboveJ(U: Float64Array, T: Float64Array): number {
    let sum = 0;
    for (let i = 0; i < this.size; i++) sum += this.capacity[i]! * (U[i]! - T[i]!);
    return sum;
  }
}
