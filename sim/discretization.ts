/**
 * The semi-discrete heat equation on the grid, in conservation form (finite volumes, Patankar 1980 ch. 4):
 *   Δx_i · dH_i/dt = Q_{i−½} − Q_{i+½} + s_i·Δx_i,     Q_{i+½} = G_{i+½}·(T_i − T_{i+1}),
 *   1/G_{i+½} = Δx_i/(2k_i) + R_contact + Δx_{i+1}/(2k_{i+1})   (series resistance; harmonic mean of k).
 * Each exposed face carries a node of zero volume whose temperature balances the half-cell conduction against the
 * face's heat input (flux, convection, radiation, plate), or is held fixed. So the face temperature that drives
 * convection and radiation is the surface temperature itself, not a cell centre.
 *
 * Unknowns (length n+2): U[0] = bottom face temperature (K), U[1..n] = cell enthalpies H (J/m³), U[n+1] = top face
 * temperature (K). Node temperatures T[0..n+1] follow from U through each cell's T(H).
 */
import type { FaceContext } from './faces.ts';
import { faceHeatIn } from './faces.ts';
import type { EnthalpyCurve, Table } from './material.ts';
import { evalTable, sensibleCapacity, temperatureOf } from './material.ts';
import type { Grid } from './mesh.ts';
import type { FaceCondition } from './problem.ts';

/** The conditions that hold over one time step (schedules only change on step boundaries). */
export interface StepConditions {
  readonly bottom: FaceCondition;
  readonly top: FaceCondition;
  /** W/m³ per cell. */
  readonly source: Float64Array;
}

/** Buffers of one run, allocated once. Every kernel below says which of them it overwrites. */
export interface Workspace {
  readonly grid: Grid;
  readonly n: number;
  readonly curves: readonly EnthalpyCurve[];
  readonly conductivities: readonly Table[];
  readonly bottomContext: FaceContext;
  readonly topContext: FaceContext;
  /** Node temperatures, K (n+2). */
  readonly T: Float64Array;
  /** dT/dU per node: dT/dH for cells, 1 for face nodes (n+2). */
  readonly tau: Float64Array;
  /** Conductance between node j and j+1, W·m⁻²·K⁻¹ (n+1). */
  readonly G: Float64Array;
  /** Net heat rate into each cell per unit area, W/m² (n). */
  readonly F: Float64Array;
  /** Sensible capacity ρc_p per cell at the last evaluation, J·m⁻³·K⁻¹ (n): the error scale. */
  readonly capacity: Float64Array;
  readonly segmentHint: Int32Array;
  /** Latent heat per volume ρ·L per cell, J/m³ (0 where the material does not melt): the liquid-fraction error scale. */
  readonly latent: Float64Array;
  /** Heat into the bottom and top faces, W/m², and their derivatives dq/dT at the last evaluation. */
  readonly faceQ: Float64Array;
  readonly faceDq: Float64Array;
  readonly lower: Float64Array;
  readonly diag: Float64Array;
  readonly upper: Float64Array;
  readonly scratch2: Float64Array;
}

export function createWorkspace(grid: Grid, bottomContext: FaceContext, topContext: FaceContext): Workspace {
  const n = grid.n;
  const m = n + 2;
  return {
    grid, n,
    curves: grid.materials.map((mat) => mat.enthalpy),
    conductivities: grid.materials.map((mat) => mat.conductivity),
    bottomContext, topContext,
    T: new Float64Array(m), tau: new Float64Array(m), G: new Float64Array(n + 1), F: new Float64Array(n),
    capacity: new Float64Array(n), segmentHint: new Int32Array(n),
    latent: Float64Array.from(grid.materials, (mat) => (mat.melt ? mat.density * mat.melt.latentJPerKg : 0)),
    faceQ: new Float64Array(2), faceDq: new Float64Array(2),
    lower: new Float64Array(m), diag: new Float64Array(m), upper: new Float64Array(m),
    scratch2: new Float64Array(2),
  };
}

/**
 * Evaluates everything that depends on U: T, tau, conductances G, face heat inputs and the net rates F.
 * Overwrites ws.T, ws.tau, ws.G, ws.F, ws.capacity, ws.segmentHint, ws.faceQ, ws.faceDq, ws.scratch2.
 */
export function evaluate(ws: Workspace, U: Float64Array, cond: StepConditions): void {
  const { n, T, tau, G, F, curves, conductivities, segmentHint, scratch2, grid, capacity } = ws;
  const dx = grid.dx;
  T[0] = U[0]!;
  tau[0] = 1;
  T[n + 1] = U[n + 1]!;
  tau[n + 1] = 1;
  for (let i = 0; i < n; i++) {
    segmentHint[i] = temperatureOf(curves[i]!, U[i + 1]!, segmentHint[i]!, scratch2);
    T[i + 1] = scratch2[0]!;
    tau[i + 1] = scratch2[1]!;
  }
  // half-cell resistances, then series sums on each face
  let halfBelow = 0;
  for (let i = 0; i < n; i++) {
    const tC = T[i + 1]!;
    const half = (0.5 * dx[i]!) / evalTable(conductivities[i]!, tC);
    capacity[i] = sensibleCapacity(grid.materials[i]!, tC);
    if (i === 0) G[0] = 1 / half;
    else G[i] = 1 / (halfBelow + grid.contactAbove[i - 1]! + half);
    halfBelow = half;
  }
  G[n] = 1 / halfBelow;
  for (let i = 0; i < n; i++) {
    const j = i + 1;
    F[i] = G[j - 1]! * (T[j - 1]! - T[j]!) - G[j]! * (T[j]! - T[j + 1]!) + cond.source[i]! * dx[i]!;
  }
  evaluateFace(ws, cond.bottom, 0, 0);
  evaluateFace(ws, cond.top, 1, n + 1);
}

function evaluateFace(ws: Workspace, c: FaceCondition, side: 0 | 1, node: number): void {
  if (c.kind === 'fixed') {
    // the heat into a held face is what the half cell conducts away from it
    const g = side === 0 ? ws.G[0]! : ws.G[ws.n]!;
    const inner = side === 0 ? ws.T[1]! : ws.T[ws.n]!;
    ws.faceQ[side] = g * (ws.T[node]! - inner);
    ws.faceDq[side] = 0;
    return;
  }
  ws.faceQ[side] = faceHeatIn(c, side === 0 ? ws.bottomContext : ws.topContext, ws.T[node]!, ws.scratch2);
  ws.faceDq[side] = ws.scratch2[0]!;
}

/**
 * Residual of one implicit stage  Δx·(H − B) − h·F(U) = 0  on the cells, and the face balances, written to `res`
 * (n+2), with `h` the stage's effective step (s) and B (J/m³, length n) its explicit part. Face rows are scaled by h so
 * the Jacobian stays diagonally dominant by columns. Call evaluate() on U first. Overwrites `res`.
 */
export function stageResidual(ws: Workspace, U: Float64Array, B: Float64Array, h: number, cond: StepConditions,
  res: Float64Array): void {
  const { n, G, T, F, grid } = ws;
  for (let i = 0; i < n; i++) res[i + 1] = grid.dx[i]! * (U[i + 1]! - B[i]!) - h * F[i]!;
  res[0] = cond.bottom.kind === 'fixed' ? U[0]! - cond.bottom.tK : h * (G[0]! * (T[0]! - T[1]!) - ws.faceQ[0]!);
  res[n + 1] = cond.top.kind === 'fixed' ? U[n + 1]! - cond.top.tK : h * (G[n]! * (T[n + 1]! - T[n]!) - ws.faceQ[1]!);
}

/**
 * Jacobian of stageResidual() with respect to U, conductances held at their current values (their T-dependence is
 * left to the Newton iterations). Overwrites ws.lower, ws.diag, ws.upper.
 */
export function stageJacobian(ws: Workspace, h: number, cond: StepConditions): void {
  const { n, G, tau, lower, diag, upper, grid } = ws;
  for (let j = 1; j <= n; j++) {
    lower[j] = -h * G[j - 1]! * tau[j - 1]!;
    diag[j] = grid.dx[j - 1]! + h * (G[j - 1]! + G[j]!) * tau[j]!;
    upper[j] = -h * G[j]! * tau[j + 1]!;
  }
  if (cond.bottom.kind === 'fixed') {
    diag[0] = 1;
    upper[0] = 0;
  } else {
    diag[0] = h * (G[0]! - ws.faceDq[0]!);
    upper[0] = -h * G[0]! * tau[1]!;
  }
  if (cond.top.kind === 'fixed') {
    diag[n + 1] = 1;
    lower[n + 1] = 0;
  } else {
    diag[n + 1] = h * (G[n]! - ws.faceDq[1]!);
    lower[n + 1] = -h * G[n]! * tau[n]!;
  }
}
