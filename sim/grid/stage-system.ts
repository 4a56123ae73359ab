/**
 * What an implicit time integrator asks of a semi-discrete system (the method of lines: space is discretised first,
 * Hairer & Wanner, Solving ODEs II, §IV.1; Patankar 1980 for the finite volumes), written so that the integrator sees
 * only a state vector U of length `size` and this interface:
 *
 *   M·dU/dt = F(U)   on the stored entries (M > 0: a cell's width, a node's heat capacity),
 *   0 = g(U)         on the constraint entries (M = 0: a face node balancing its heat input, held or free).
 *
 * An implicit stage of effective step h from the explicit part B solves  M·(U − B) − h·F(U) = 0  (with the
 * constraints) by Newton's method: residual, an assembled stage operator M − h·∂F/∂U with its own linear solve, an
 * update rule (a system may stop an update at a kink of its constitutive curve), and a linear accept that brings the
 * system to the new state by the same linearisation the update solved, so that the stage equations, and with them the
 * energy ledger, hold to round-off. Rates are M·dU/dt (W/m² for the 1D grid: heat per footprint area), 0 on the
 * constraint entries, and the ledger's channels (heat through each face, generated, through the edges, …) are
 * integrated by the method's own quadrature weights. How a state error counts is the system's: it turns the filtered
 * error vector into the norm that the step control holds at 1.
 *
 * Implementations: grid/line-system.ts (the 1D layer stack), grid/node-network.ts (lumped nodes). The integrator is
 * time/tr-bdf2.ts; keeping one implementation per run keeps its calls monomorphic.
 */

/** Which stage an implicit stage is (TR-BDF2's two, or backward Euler's one). */
export type StageKind = 'trapezoid' | 'bdf2' | 'euler';

/** State, rates and channel rates at the three points of a step: 0 (start), g (the inner stage), 1 (end). */
export interface StepBuffers {
  /** States (size). */
  readonly U0: Float64Array;
  readonly Ug: Float64Array;
  readonly U1: Float64Array;
  /** Rates M·dU/dt (size; 0 on the constraint entries). */
  readonly F0: Float64Array;
  readonly Fg: Float64Array;
  readonly F1: Float64Array;
  /** Rates of the ledger channels (channels). */
  readonly q0: Float64Array;
  readonly qg: Float64Array;
  readonly q1: Float64Array;
  /** A stage's explicit part, its residual and the Newton update (size). */
  readonly B: Float64Array;
  readonly res: Float64Array;
  readonly delta: Float64Array;
}

export function createStepBuffers(system: { readonly size: number; readonly channels: number }): StepBuffers {
  const m = system.size;
  const c = system.channels;
  return {
    U0: new Float64Array(m), Ug: new Float64Array(m), U1: new Float64Array(m),
    F0: new Float64Array(m), Fg: new Float64Array(m), F1: new Float64Array(m),
    q0: new Float64Array(c), qg: new Float64Array(c), q1: new Float64Array(c),
    B: new Float64Array(m), res: new Float64Array(m), delta: new Float64Array(m),
  };
}

/** What a Newton update did: its largest move in the system's own measure, and whether it stopped short at a kink. */
export interface UpdateSize {
  largest: number;
  stopped: boolean;
}

export interface StageSystem {
  /** Length of the state vector. */
  readonly size: number;
  /** Number of ledger channels. */
  readonly channels: number;
  /** Evaluates everything that depends on U; the reads below then refer to U. */
  evaluate(U: Float64Array): void;
  /** Writes the rates M·dU/dt at the last evaluated (or accepted) state into out (size; 0 on constraint entries). */
  readRates(out: Float64Array): void;
  /** Writes the ledger channels' rates at the last evaluated (or accepted) state into out (channels). */
  readChannels(out: Float64Array): void;
  /** B ← B + h·F/M on the stored entries (an explicit part from rates); constraint entries are left alone. */
  addRates(B: Float64Array, F: Float64Array, h: number): void;
  /** out ← M·x on the stored entries, 0 on the constraint entries (the right side of a second error filter). */
  massTimes(x: Float64Array, out: Float64Array): void;
  /**
   * Called before each implicit stage of effective step hd, with the step's buffers (the start point, and for 'bdf2'
   * the inner stage) and the BDF2 coefficients a, bb (0 otherwise): a system with eliminated parts (a heater plate, a
   * bench chain) sets their stage constants here.
   */
  beginStage(kind: StageKind, hd: number, buf: StepBuffers, a: number, bb: number): void;
  /** res ← M·(U − B) − h·F(U) and the constraint rows, at the last evaluation (which must be at U). */
  stageResidual(U: Float64Array, B: Float64Array, h: number, res: Float64Array): void;
  /** Assembles the stage operator ∂res/∂U for effective step h at the last evaluation. */
  assembleStage(h: number): void;
  /** Solves (assembled operator)·out = rhs; false on a zero pivot. */
  solveStage(rhs: Float64Array, out: Float64Array): boolean;
  /**
   * Applies the Newton update U ← U − delta by the system's rule; where it shortens an entry's move it rewrites delta
   * to the move made. Writes the largest move and whether any was shortened into size.
   */
  newtonUpdate(U: Float64Array, delta: Float64Array, res: Float64Array, size: UpdateSize): void;
  /**
   * After the last update (U already moved by delta, res the residual it solved), brings the rates and channels to U
   * by that update's linearisation, so M·(U − B) − h·F = 0 holds exactly and the ledger closes.
   */
  acceptUpdate(U: Float64Array, delta: Float64Array, res: Float64Array, h: number): void;
  /** The local error norm (≤ 1 acceptable) of a step U0 → U1 whose filtered error vector is z. */
  errorNorm(U0: Float64Array, U1: Float64Array, z: Float64Array): number;
  /** The last evaluated state starts the next step: the error scales are taken there. */
  markStart(): void;
}
