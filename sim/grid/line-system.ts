/**
 * The 1D layer stack as a stage system (stage-system.ts): the state is [bottom face temperature K, cell enthalpies
 * J/m³, top face temperature K] (n + 2 entries), the cells' mass is their width Δx, the face nodes are constraints
 * (zero volume: the half-cell conduction balances the face's heat input, or the face is held). It wraps the kernels
 * of discretization.ts (evaluate, stageResidual, stageJacobian, linearizeCellTerms) and the tridiagonal solve; what it
 * adds is what only the stack knows:
 * - the Newton update stops a cell at the solidus or liquidus kink of its T(H) (newton-kinks.ts), and a face node whose
 *   cell stopped takes the update its own linearised balance gives for the shortened one;
 * - the linear accept (acceptUpdate): F, T, the face heats and the cell-term channels move by the update's own
 *   linearisation, so the stage equations hold exactly and the energy ledger closes to round-off; after a trapezoidal
 *   stage it also keeps the stage's temperature range, which the time loop checks (time/step-bounds.ts);
 * - the error measure: each cell's enthalpy error in what a run reports, its temperature (through the secant dT/dH over
 *   the step, zero on an isothermal plateau) and, for the cells in or across their melt, a layer's molten thickness
 *   (Σ Δx·error/ρL, against the liquid-fraction tolerance × the layer's level-0 cell width) while that thickness is
 *   near one of the events the verdicts read (none, half or all of the layer).
 * The heater plates and bench chains are eliminated per stage through the `beforeStage` hook (time/plates.ts).
 */
import type { StepConditions, Workspace } from './discretization.ts';
import { CHANNEL_COUNT, evaluate, linearizeCellTerms, stageJacobian, stageResidual, updateCapacity } from './discretization.ts';
import { stopAtKink } from './newton-kinks.ts';
import { liquidFractionOf } from '../physics/material.ts';
import type { StageKind, StageSystem, StepBuffers, UpdateSize } from './stage-system.ts';
import { solveTridiagonal } from './tridiagonal.ts';

/** What the local error is measured in: the quantities a run reports. */
export interface ErrorScale {
  /** Temperature error allowed per step, K. */
  readonly toleranceK: number;
  /** Liquid-fraction error allowed per step (a share of the latent heat) of a level-0 cell: see LineSystem.errorNorm. */
  readonly liquidFraction: number;
  /** Cells per level-0 cell: the accuracy plan's grid factor (scenario/accuracy.ts), 1 without a plan. */
  readonly gridRefine: number;
  /**
   * Per layer, whether it is a separator: its temperature error while it melts or freezes is its width-weighted RMS
   * (LineSystem.errorNorm); every other layer's is its largest cell's. Absent: none.
   */
  readonly separator?: readonly boolean[];
}

/** Sets the eliminated bodies' stage constants before a stage (time/plates.ts beginPlateStage has this shape). */
export type BeforeStage = (ws: Workspace, cond: StepConditions, hd: number, stage: StageKind,
  q0: Float64Array, qg: Float64Array, Ug: Float64Array, a: number, bb: number) => void;

/** Nudge past a kink, in kelvin-equivalent enthalpy: far below any tolerance, far above round-off. */
export const KINK_NUDGE_K = 1e-9;

/**
 * How near (in level-0 cells of the layer) a layer's molten thickness must come to one of its event thicknesses (none,
 * half the layer, all of it: the frozen, half-frozen and molten verdicts) for its error to be held: see errorNorm. Our
 * own choice, not tuned: 2 is the only band that was measured (the figures in errorNorm's comment are for it).
 */
const EVENT_BAND_CELLS = 2;

/**
 * Whether a layer melts over the step being measured (errorNorm: a cell in or across its melt, or a front inside it),
 * and which rule holds it.
 */
const MELTING_NONE = 0;
const MELTING_SEPARATOR = 1;
const MELTING_OTHER = 2;

/*
 * errorNorm and the helpers below evaluate every comparison of a test before combining them, not `a || b` with b
 * skipped: a comparison that had never run when the JIT optimised the code has no type feedback, and reaching it later
 * deoptimised errorNorm, over and over (up to 5862 times in one run of the demo at 1600 cells and ×0.01 tolerances,
 * which then took 6.9–11.9 s from one process to the next, the unoptimised code's boxed numbers with it).
 */

/** Whether a value going from a to b over a step crosses `at` or comes within `band` of it at either end. */
function near(a: number, b: number, at: number, band: number): boolean {
  const crosses = (a - at) * (b - at) <= 0;
  const startNear = Math.abs(a - at) < band;
  const endNear = Math.abs(b - at) < band;
  return crosses || startNear || endNear;
}

export class LineSystem implements StageSystem {
  readonly size: number;
  readonly channels = CHANNEL_COUNT;
  /** The conditions of the step being taken: set by the time loop before each step. */
  cond: StepConditions;
  /** Node temperatures at the start of the step, K (n + 2): the secant of the error measure. */
  readonly T0: Float64Array;
  private readonly work: Float64Array;
  /** The cells' part of the integrator's B (a view, made once for the buffer it is given). */
  private bOf: Float64Array | undefined;
  private bCells: Float64Array;
  /** Per layer: the molten-thickness error of the step being measured, m, and its allowance's length, m. */
  private readonly frontError: Float64Array;
  private readonly layerSq: Float64Array;
  private readonly layerMax: Float64Array;
  /** Per layer: whether it melts over the step (MELTING_*), its hottest cell's T (K) and that cell's error. */
  private readonly layerMelting: Uint8Array;
  private readonly layerHottest: Float64Array;
  private readonly layerHottestError: Float64Array;
  private readonly levelZeroWidth: Float64Array;
  private readonly layerWidth: Float64Array;
  /** Per layer: its molten thickness Σ Δx·f at the start and at the end of the step being measured, m. */
  private readonly moltenStart: Float64Array;
  private readonly moltenEnd: Float64Array;
  /**
   * Per layer, 1 for a separator (ErrorScale.separator), read into a typed array once: errorNorm reads it only on a
   * step where a layer melts, and an optional array read there went without type feedback, so the JIT's code for
   * errorNorm deoptimised on it again and again (about a thousand times on the demo at 1600 cells, with the boxed
   * numbers of the unoptimised code six times as many young-generation collections).
   */
  private readonly separatorLayer: Uint8Array;
  /**
   * The layer whose error set the last errorNorm() (−1 before the first), and whether it was melting over that step:
   * the time loop counts them on rejected steps, for the run-time ceiling's message (which layer held the steps back).
   */
  binding = -1;
  bindingMelting = false;
  /**
   * The least and greatest node temperature at the end of the last trapezoidal stage, K: the time loop's range check
   * (time/step-bounds.ts) reads them beside the step's end state.
   */
  stageLowK = Infinity;
  stageHighK = -Infinity;
  /** The stage being solved (beginStage), so that acceptUpdate knows a trapezoidal one. */
  private stage: StageKind = 'trapezoid';

  constructor(readonly ws: Workspace, readonly scale: ErrorScale, private readonly beforeStage: BeforeStage,
    cond: StepConditions) {
    this.size = ws.n + 2;
    this.cond = cond;
    this.T0 = new Float64Array(this.size);
    this.work = new Float64Array(this.size);
    this.bCells = new Float64Array(0);
    const { grid } = ws;
    const layers = grid.layerStart.length;
    this.frontError = new Float64Array(layers);
    this.layerSq = new Float64Array(layers);
    this.layerMax = new Float64Array(layers);
    this.layerMelting = new Uint8Array(layers);
    this.layerHottest = new Float64Array(layers);
    this.layerHottestError = new Float64Array(layers);
    this.levelZeroWidth = new Float64Array(layers);
    this.layerWidth = new Float64Array(layers);
    this.moltenStart = new Float64Array(layers);
    this.moltenEnd = new Float64Array(layers);
    this.separatorLayer = Uint8Array.from({ length: layers }, (_, l) => (scale.separator?.[l] ? 1 : 0));
    for (let l = 0; l < layers; l++) {
      let thick = 0;
      for (let i = grid.layerStart[l]!; i < grid.layerEnd[l]!; i++) thick += grid.dx[i]!;
      // the mean width of the layer's cells before the plan refined them
      this.levelZeroWidth[l] = (thick * scale.gridRefine) / Math.max(1, grid.layerEnd[l]! - grid.layerStart[l]!);
      this.layerWidth[l] = thick;
    }
  }

  evaluate(U: Float64Array): void {
    evaluate(this.ws, U, this.cond);
  }

  readRates(out: Float64Array): void {
    const n = this.ws.n;
    out[0] = 0;
    out.set(this.ws.F, 1);
    out[n + 1] = 0;
  }

  readChannels(out: Float64Array): void {
    out.set(this.ws.faceQ);
  }

  addRates(B: Float64Array, F: Float64Array, h: number): void {
    const dx = this.ws.grid.dx;
    for (let j = 1; j <= this.ws.n; j++) B[j] = B[j]! + (h * F[j]!) / dx[j - 1]!;
  }

  massTimes(x: Float64Array, out: Float64Array): void {
    const { n, grid } = this.ws;
    const dx = grid.dx;
    out[0] = 0;
    for (let j = 1; j <= n; j++) out[j] = dx[j - 1]! * x[j]!;
    out[n + 1] = 0;
  }

  beginStage(kind: StageKind, hd: number, buf: StepBuffers, a: number, bb: number): void {
    this.stage = kind;
    this.beforeStage(this.ws, this.cond, hd, kind, buf.q0, buf.qg, buf.Ug, a, bb);
  }

  stageResidual(U: Float64Array, B: Float64Array, h: number, res: Float64Array): void {
    if (B !== this.bOf) { this.bOf = B; this.bCells = B.subarray(1, this.ws.n + 1); }
    stageResidual(this.ws, U, this.bCells, h, this.cond, res);
  }

  assembleStage(h: number): void {
    stageJacobian(this.ws, h, this.cond);
  }

  solveStage(rhs: Float64Array, out: Float64Array): boolean {
    const ws = this.ws;
    return solveTridiagonal(this.size, ws.lower, ws.diag, ws.upper, rhs, out, this.work);
  }

  newtonUpdate(U: Float64Array, delta: Float64Array, res: Float64Array, size: UpdateSize): void {
    const ws = this.ws;
    const { n, capacity, layerCurves } = ws;
    const { layerStart, layerEnd } = ws.grid;
    let worst = 0;
    let clipped = false;
    // layer by layer: a layer's cells share its curve and so its kinks
    for (let l = 0; l < layerStart.length; l++) {
      const kinks = layerCurves[l]!.kinks;
      for (let j = layerStart[l]! + 1; j <= layerEnd[l]!; j++) {
        const old = U[j]!;
        const nudge = capacity[j - 1]! * KINK_NUDGE_K;
        const next = stopAtKink(kinks, old, old - delta[j]!, nudge);
        if (next !== old - delta[j]!) { clipped = true; delta[j] = old - next; }
        U[j] = next;
        const scaled = Math.abs(delta[j]! / capacity[j - 1]!);
        if (!(scaled <= worst)) worst = scaled; // also catches NaN
      }
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
    size.largest = worst;
    size.stopped = clipped;
  }

  /**
   * After the last Newton update U ← U − δ, brings ws to the new U by the same linearisation the update solved,
   * instead of evaluating again: F ← F − (Δx·δ − R)/h on the cells (so Δx·(U − B) − h·F = 0 holds exactly),
   * T ← T − τ·δ, and each face's heat input and each cell term's rate moves along its slope. The linearised interior
   * fluxes telescope and the face rows balance, so the energy ledger closes to round-off; the remaining difference from
   * a fresh evaluation is O(δ²), far below the Newton tolerance. Overwrites ws.F, ws.T, ws.faceQ.
   */
  acceptUpdate(U: Float64Array, delta: Float64Array, res: Float64Array, h: number): void {
    const ws = this.ws;
    const cond = this.cond;
    const { n, T, tau, F, G, dRa, dRb, faceQ, faceDq } = ws;
    const dx = ws.grid.dx;
    // faces first, from the slopes at the old state
    if (cond.bottom.kind === 'fixed') {
      const b0 = -G[0]! * tau[1]! - G[0]! * G[0]! * (T[0]! - T[1]!) * dRb[0]!;
      faceQ[0] = faceQ[0]! - b0 * delta[1]!;
    } else {
      faceQ[0] = faceQ[0]! - faceDq[0]! * delta[0]!;
    }
    if (cond.top.kind === 'fixed') {
      // heat into the top face is −Q_n; Q_n's slope in U_n is a_n
      const an = G[n]! * tau[n]! - G[n]! * G[n]! * (T[n]! - T[n + 1]!) * dRa[n]!;
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
    if (this.stage === 'trapezoid') {
      let low = Infinity;
      let high = -Infinity;
      for (let j = 0; j < n + 2; j++) {
        low = Math.min(low, T[j]!);
        high = Math.max(high, T[j]!);
      }
      this.stageLowK = low;
      this.stageHighK = high;
    }
  }

  /**
   * The error of each cell's enthalpy (z) as what it does to the reported quantities: its temperature (through the
   * secant dT/dH over the step, which is zero while a cell sits on an isothermal plateau), and, for the cells in or
   * across their melt, the molten thickness of their layer: Σ Δx·z/ρL over those cells (each z/ρL is measured against
   * the larger of tol_f and the temperature allowance ρc_p·tol_K/ρL, so it fades into the temperature measure as the
   * latent heat → 0), against tol_f × the width of the layer's level-0 cell. So a cell crossing a kink of T(H) is judged
   * by its real effect, not by the kink; and, because the front's error is summed over the layer rather than taken at
   * each cell, the several cells that share a smoothed melt (physics/melt-ramp.ts) do not each reject steps. What this
   * gives up: on a refined grid one cell's liquid fraction may be off by up to tol_f × the refinement within a step, so
   * the time the last cell melts or freezes is held to the level-0 front position, tol_f × Δx₀, and no longer tightens
   * with the grid by itself; the accuracy plan divides the tolerances for that (scenario/accuracy.ts).
   *
   * The molten-thickness part is held only near the layer's events (nearEvent): its molten thickness, at the step's
   * start or end, within EVENT_BAND_CELLS level-0 cells of none, half or all of the layer, or crossing half of it in
   * the step; the verdicts read exactly those instants (frozen, half-frozen, molten; the first and last are also landed
   * on, time/separator-events.ts). Between them it is left to the temperature part. The reason: on the enthalpy method
   * each cell a sharp front crosses kinks in T(t), and the step that carries the front across it has a local error
   * there, which moves heat between the cell and its neighbours; energy is conserved to round-off, so the layer's
   * molten thickness, its heat less its sensible heat over ρL, is off only by what the temperature part already holds,
   * and the next steps diffuse the local error away. Held at every cell it set one step size per cell the front crossed,
   * so the steps grew with the cells and the work with their square: on the one-phase Stefan problem (bench/stefan.ts,
   * 100 K, default tolerances) 731 → 1763 steps from 200 to 800 cells; held near the events, 185 → 202, both event
   * times within 0.01 s of the closed form at 800 cells. Over the examples, against runs with cells ×8 and tolerances
   * ÷27, the largest event error at the defaults fell from 1.05 s to 0.18 s (with the landing; the pellet stack's
   * frozen time had been the 1.05 s). What it gives up: between events the recorded molten thickness is held only
   * through the temperatures, so a curve of it may wander by more than tol_f of a level-0 cell there.
   *
   * The temperature part is each cell's against tol_K, taken over a layer as its largest cell; but over a separator
   * with a cell in or across its melt in the step, as the width-weighted RMS, √(Σ Δx·e²/Σ Δx). Beside a melt front the
   * enthalpy method's staircase makes each cell's T(t) kink as its neighbour melts (the front's own error is the
   * molten-thickness part above), and the per-cell maximum rejected steps for those kinks one cell at a time. On the
   * demo at ×0.01 tolerances and 800 cells the RMS takes 4791 steps with 2683 rejected where the maximum took 9966
   * with 4553, 41 % less work (cells × Newton sweeps); the work's log–log slope 200 → 800 cells falls from 1.90 to
   * 1.71, and the event times move by at most 0.002 s. At the defaults the examples' work falls 4 %. What it gives up:
   * while a separator melts or freezes one of its cells may be off by more than tol_K, up to √(its cells) × tol_K if
   * the whole error sat in that cell. Separators: their verdicts are the melt and freeze times, which the
   * molten-thickness part holds.
   *
   * Any other layer with a cell in or across its melt in the step (an electrode that melts: magnesium, aluminium, a
   * salt layer not marked as the separator) takes the larger of the same RMS and its hottest cell's own error: its
   * verdict is its margin, which reads its hottest temperature, so that cell keeps the per-cell hold while the cells
   * beside its front are held as a whole, as in a separator. With the per-cell maximum over every cell, a front crossing
   * a thick electrode set a chain of rejected steps at each cell it crossed (2800–3200 rejections beside 5500–6000
   * accepted steps when they met the run-time ceiling, on 62–100 mm layers of about 1000 cells at their own
   * tolerance_K of 0.0035–0.024 K, fuzz seed 23), and the work grew with the cells the front crossed. Measured on three
   * such runs (cases 2529, 1018, 7885): Newton sweeps 85 419 → 26 550, 39 397 → 14 138 and 67 894 → 20 050. What it
   * gives up: while such a layer melts or freezes, a cell other than its hottest may be off by more than tol_K, as in a
   * separator (its recorded minimum and mean are held through the RMS).
   *
   * A layer counts as melting also while a front lies inside it, part liquid and part solid at the step's start or end,
   * though no cell be in its melt just then: an isothermal front leaves its cell at the liquidus before the next cell
   * reaches the solidus, and the steps in between fell back to the per-cell maximum while the kinks beside the front
   * were still in the error estimate, which switched the rule, and the step size with it, at every cell the front
   * crossed. Measured on fuzz seed 25's 30 work-budget stops run past the ceiling: Newton sweeps −11 % (geometric mean;
   * up to −37 %, case 9080), and the melting layers' per-cell rejections moved to their RMS. No example has
   * such a step, so their results are unchanged to the bit. Reads ws.T as the end state's temperatures.
   */
  errorNorm(U0: Float64Array, U1: Float64Array, z: Float64Array): number {
    const ws = this.ws;
    const { n, grid } = ws;
    const dx = grid.dx;
    const scale = this.scale;
    const front = this.frontError;
    front.fill(0);
    const molten0 = this.moltenStart;
    const molten1 = this.moltenEnd;
    molten0.fill(0);
    molten1.fill(0);
    const sq = this.layerSq;
    const most = this.layerMax;
    const melting = this.layerMelting;
    sq.fill(0);
    most.fill(0);
    melting.fill(MELTING_NONE);
    const hottest = this.layerHottest;
    const hottestError = this.layerHottestError;
    hottest.fill(-Infinity);
    hottestError.fill(0);
    let worst = 0;
    const T1 = ws.T;
    const T0 = this.T0;
    for (let i = 0; i < n; i++) {
      const e0 = Math.abs(z[i + 1]!);
      const dH = Math.abs(U1[i + 1]! - U0[i + 1]!);
      const secant = dH > ws.capacity[i]! * KINK_NUDGE_K ? Math.abs(T1[i + 1]! - T0[i + 1]!) / dH : ws.tau[i + 1]!;
      const e = (e0 * secant) / scale.toleranceK;
      const li = grid.layerOf[i]!;
      const latent = ws.latent[i]!;
      if (latent > 0) {
        // the liquid-fraction error counts only for a cell in or across its melt over the step
        const material = grid.materials[i]!;
        const melt = material.melt!;
        const a = U0[i + 1]!;
        const b = U1[i + 1]!;
        molten0[li] = molten0[li]! + dx[i]! * liquidFractionOf(material, a, T0[i + 1]!);
        molten1[li] = molten1[li]! + dx[i]! * liquidFractionOf(material, b, T1[i + 1]!);
        if (Math.min(a, b) <= melt.hLiquidus + e0 && Math.max(a, b) >= melt.hSolidus - e0) {
          front[li] = front[li]! + (dx[i]! * e0) / Math.max(scale.liquidFraction * latent, scale.toleranceK * ws.capacity[i]!);
          melting[li] = MELTING_OTHER; // melting; whether by the separator's rule is settled below
        }
      }
      sq[li] = sq[li]! + dx[i]! * e * e;
      if (!(e <= most[li]!)) most[li] = e;
      if (!(T1[i + 1]! <= hottest[li]!)) { hottest[li] = T1[i + 1]!; hottestError[li] = e; }
    }
    // a layer with a front inside it, at the step's start or end, is melting too, though no cell be in its melt just
    // then (an isothermal front between one cell's last melt and the next cell's first); a melting separator takes its
    // own rule
    const width = this.layerWidth;
    for (let l = 0; l < front.length; l++) {
      const w = width[l]!;
      const m0 = molten0[l]!;
      const m1 = molten1[l]!;
      const partial0 = m0 > 0 && m0 < w;
      const partial1 = m1 > 0 && m1 < w;
      const partial = partial0 || partial1;
      if (melting[l] === MELTING_NONE && !partial) continue;
      melting[l] = this.separatorLayer[l] === 1 ? MELTING_SEPARATOR : MELTING_OTHER;
    }
    // the temperature part: a melting separator by its width-weighted RMS, any other melting layer by the larger of
    // that and its hottest cell's, every layer else by its largest cell (above)
    let binding = -1;
    for (let l = 0; l < front.length; l++) {
      const rms = melting[l] === MELTING_NONE ? 0 : Math.sqrt(sq[l]! / width[l]!);
      const e = melting[l] === MELTING_SEPARATOR ? rms : melting[l] === MELTING_OTHER ? Math.max(rms, hottestError[l]!) : most[l]!;
      if (!(e <= worst)) { worst = e; binding = l; }
    }
    for (let l = 0; l < front.length; l++) {
      const held = this.nearEvent(l);
      if (front[l] === 0 || !held) continue;
      const e = front[l]! / this.levelZeroWidth[l]!;
      if (!(e <= worst)) { worst = e; binding = l; }
    }
    this.binding = binding;
    this.bindingMelting = binding >= 0 && melting[binding] !== MELTING_NONE;
    return worst;
  }

  /**
   * Whether layer l's molten thickness, at the start or the end of the step, lies within EVENT_BAND_CELLS level-0
   * cells of none, half or all of the layer, or crosses half of it in the step (errorNorm).
   */
  private nearEvent(l: number): boolean {
    const band = EVENT_BAND_CELLS * this.levelZeroWidth[l]!;
    const width = this.layerWidth[l]!;
    const a = this.moltenStart[l]!;
    const b = this.moltenEnd[l]!;
    const none = near(a, b, 0, band);
    const half = near(a, b, width / 2, band);
    const all = near(a, b, width, band);
    return none || half || all;
  }

  /** The evaluated state starts the next step: its temperatures for the secant, ρc_p at them for the scales. */
  markStart(): void {
    this.T0.set(this.ws.T);
    updateCapacity(this.ws);
  }
}

/**
 * Brings the face nodes of U into balance with the cells under `cond` (after a schedule change the face temperature
 * jumps; a zero-volume node has no memory). Leaves ws evaluated at U. Overwrites U[0], U[n+1].
 *
 * Each face's residual G·(T_face − T_cell) − q(T_face) rises with T_face for every physical term (faceBelowAbsoluteZero
 * below), so its root is bracketed: a point with a positive residual bounds it above, one with a negative residual
 * below, and 0 K is the floor. Scalar Newton per face, safeguarded by bisection of that bracket (Press et al.,
 * Numerical Recipes, 3rd ed. 2007, §9.4, "rtsafe"): a Newton step that leaves the bracket is replaced by its midpoint,
 * and one that would go below the bracket's floor of 0 K tries 0 K itself. Unguarded, a face drawing 1 MW/m² out of a
 * layer whose k rises ×60 over 3 K above its own temperature stepped up to 2278 K, where that k made the face look
 * fed, and never came back (fuzz seed 13 cases 1770, 5577). Where Newton stays inside the bracket, or moves by less than
 * the tolerance, its steps are the plain ones. Returns false if a face has no root at or above 0 K, or has not
 * converged.
 */
export function settleFaces(ws: Workspace, U: Float64Array, cond: StepConditions, toleranceK: number): boolean {
  const { n } = ws;
  if (cond.bottom.kind === 'fixed') U[0] = cond.bottom.tK;
  if (cond.top.kind === 'fixed') U[n + 1] = cond.top.tK;
  const free = [cond.bottom.kind !== 'fixed', cond.top.kind !== 'fixed'];
  const node = [0, n + 1];
  const below = [0, 0];
  const above = [Infinity, Infinity];
  const maxIterations = 100;
  for (let iter = 0; iter < maxIterations; iter++) {
    evaluate(ws, U, cond);
    let worst = 0;
    for (let side = 0; side < 2; side++) {
      if (!free[side]) continue;
      const j = node[side]!;
      const g = side === 0 ? ws.G[0]! : ws.G[n]!;
      const dT = side === 0 ? ws.T[0]! - ws.T[1]! : ws.T[n + 1]! - ws.T[n]!;
      const dR = side === 0 ? ws.dRa[0]! : ws.dRb[n]!;
      const r = g * dT - ws.faceQ[side]!;
      const x = U[j]!;
      if (r > 0) above[side] = Math.min(above[side]!, x);
      else below[side] = Math.max(below[side]!, x);
      // the root lies below 0 K (0 K itself was tried and still loses heat)
      if (x === 0 && r > 0) return false;
      let next = x - r / (g * (1 - g * dT * dR) - ws.faceDq[side]!);
      // a step within the tolerance is taken as Newton gives it, in or out of the bracket (at the root r may be ±0 or
      // round off to either side; the last step of a converged face stays the plain Newton step it always was)
      if (!(next > below[side]! && next < above[side]!) && !(Math.abs(next - x) <= toleranceK)) {
        next = below[side] === 0 && next <= 0 && x !== 0 ? 0
          : Number.isFinite(above[side]!) ? 0.5 * (below[side]! + above[side]!)
          : 2 * Math.max(x, 1);
      }
      worst = Math.max(worst, Math.abs(next - x));
      U[j] = next;
    }
    if (worst <= toleranceK) {
      evaluate(ws, U, cond);
      // book as the face's heat input exactly what its half cell conducts inwards: the Newton remainder of the face
      // balance (up to tolerance × (G + |dq/dT|), large beside a stiff plate) then stays out of the energy ledger
      if (free[0]) ws.faceQ[0] = ws.G[0]! * (ws.T[0]! - ws.T[1]!);
      if (free[1]) ws.faceQ[1] = ws.G[n]! * (ws.T[n + 1]! - ws.T[n]!);
      return true;
    }
    if (!Number.isFinite(worst)) return false;
  }
  return false;
}
