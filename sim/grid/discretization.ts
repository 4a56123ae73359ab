/**
 * The semi-discrete heat equation on the grid, in conservation form (finite volumes, Patankar 1980 ch. 4):
 *   Δx_i · dH_i/dt = Q_{i−½} − Q_{i+½} + s_i·Δx_i,     Q_{i+½} = G_{i+½}·(T_i − T_{i+1}),
 *   s_i = s_sched,i(t) + Σ s_term(T_i)   (the layer's schedule and its temperature-dependent terms, heat-terms.ts),
 *   1/G_{i+½} = Δx_i/(2k̄_i) + R_contact + Δx_{i+1}/(2k̄_{i+1})   (series resistance), each k̄ the Kirchhoff mean of
 *   its cell's k between T_i and T_{i+1} (kirchhoff.ts), so the flux is monotone in both temperatures for any k(T).
 * Each exposed face carries a node of zero volume whose temperature balances the half-cell conduction against the
 * face's heat input (flux, convection, radiation, plate), or is held fixed. So the face temperature that drives
 * convection and radiation is the surface temperature itself, not a cell centre.
 *
 * Unknowns (length n+2): U[0] = bottom face temperature (K), U[1..n] = cell enthalpies H (J/m³), U[n+1] = top face
 * temperature (K). Node temperatures T[0..n+1] follow from U through each cell's T(H).
 */
import type { BenchNode } from '../physics/bench.ts';
import { benchHeatIn, createBenchNode } from '../physics/bench.ts';
import type { FaceContext } from '../physics/faces.ts';
import { faceHeatIn } from '../physics/faces.ts';
import type { PlateNode } from '../physics/heater.ts';
import { createPlateNode, plateHeatIn } from '../physics/heater.ts';
import type { EnthalpyCurve } from '../physics/material.ts';
import { curveSlopes, temperaturesOf } from '../physics/material.ts';
import { evalTable, type Table } from '../physics/table.ts';
import { clampedIntegral, conductionFromK, conductionToK, meltMean, splitsConductivity, tableSlopes } from './kirchhoff.ts';
import type { Grid } from './mesh.ts';
import type { FaceCondition } from '../physics/problem.ts';
import type { CellHeatTerm } from '../physics/heat-terms.ts';
import { cellTermRate } from '../physics/heat-terms.ts';

/**
 * The ledger's channels, indices into ws.faceQ and the step buffers' q0/qg/q1: heat into the bottom and top faces,
 * heat generated in the cells, and heat into the cells through their edges (W/m² of footprint; negative: out).
 */
export const CHANNEL = { bottom: 0, top: 1, generated: 2, edge: 3 } as const;
export type LedgerChannel = (typeof CHANNEL)[keyof typeof CHANNEL];
export const CHANNEL_COUNT = 4;
const NO_TERMS: readonly CellHeatTerm[] = [];

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
  readonly bottomContext: FaceContext;
  readonly topContext: FaceContext;
  /** Node temperatures, K (n+2). */
  readonly T: Float64Array;
  /** dT/dU per node: dT/dH for cells, 1 for face nodes (n+2). */
  readonly tau: Float64Array;
  /** Conductance between node j and j+1, W·m⁻²·K⁻¹ (n+1). */
  readonly G: Float64Array;
  /**
   * Slopes of each face's series resistance 1/G_j in the unknowns of its two nodes, ∂(1/G_j)/∂U_j and ∂(1/G_j)/∂U_{j+1}
   * (n+1 each): through k̄ of each half cell (kirchhoff.ts), a function of the two temperatures only, so T moving with H by τ.
   */
  readonly dRa: Float64Array;
  readonly dRb: Float64Array;
  /** Net heat rate into each cell per unit area, W/m² (n). */
  readonly F: Float64Array;
  /** Sensible capacity ρc_p per cell at the start of the step, J·m⁻³·K⁻¹ (n): the error scale. */
  readonly capacity: Float64Array;
  readonly segmentHint: Int32Array;
  /** Each layer's enthalpy curve and its curveSlopes(), by layer index: T(H) runs layer by layer (temperaturesOf). */
  readonly layerCurves: readonly EnthalpyCurve[];
  readonly layerSlopes: readonly Float64Array[];
  /** Latent heat per volume ρ·L per cell, J/m³ (0 where the material does not melt): the liquid-fraction error scale. */
  readonly latent: Float64Array;
  /**
   * Rates of the ledger channels (CHANNEL), W/m²: heat into the bottom and top faces from the face model, heat
   * generated in the cells Σ s·Δx, heat into the cells through their edges. faceDq: the faces' dq/dT.
   */
  readonly faceQ: Float64Array;
  /** Each cell's terms (the layer's list, shared). */
  readonly cellTerms: readonly (readonly CellHeatTerm[])[];
  /** ∂s/∂T per cell of its generated and of its edge terms, W·m⁻³·K⁻¹ (n each), at the last evaluation. */
  readonly generatedDs: Float64Array;
  readonly edgeDs: Float64Array;
  /** [∂s/∂T, warm start] of the term being evaluated (heat-terms.ts cellTermRate). */
  readonly termScratch: Float64Array;
  /** Each cell's edge-term warm start (the sleeve's surface temperature, K; NaN: none yet) (n). */
  readonly termState: Float64Array;
  /** Whether any cell has a term (else the term passes are skipped). */
  readonly hasTerms: boolean;

  readonly faceDq: Float64Array;
  /** The heater plate behind each face (used while that face's condition is a heater; see physics/heater.ts). */
  readonly plates: readonly [PlateNode, PlateNode];
  /** The bench chain under each face (used while that face's condition is a bench; see physics/bench.ts). */
  readonly benches: readonly [BenchNode, BenchNode];
  readonly lower: Float64Array;
  readonly diag: Float64Array;
  readonly upper: Float64Array;
  readonly scratch2: Float64Array;
  /** Per cell, fixed for the run: whether its material's k follows its phase (kirchhoff.ts splitsConductivity). */
  readonly kSplits: Uint8Array;
  /** Per cell, fixed for the run: its k table's piece slopes (kirchhoff.ts tableSlopes; one array per table). */
  readonly kSlopes: readonly Float64Array[];
  /**
   * Per cell at the last evaluation, how its half cells read k (kirchhoff.ts halfCellConductivity): K_CONSTANT (one
   * row), K_TABLE (the table clamped to [kFloor, kCeiling]: its phase's range; a melting material's cell below its
   * solidus or above its liquidus) or K_MELT (a melting material's cell at a temperature inside its melt, read by
   * kirchhoff.ts meltMean()); kValue: k at the cell's own temperature as so read; kPiece: the table's piece holding it
   * (also the next search's start).
   */
  readonly kRegion: Uint8Array;
  readonly kFloor: Float64Array;
  readonly kCeiling: Float64Array;
  /**
   * The clamped table's value below kFloor and above kCeiling, evalTable(kTable, kFloor) and evalTable(kTable,
   * kCeiling): what a reading below or above the clamp (kirchhoff.ts clampedValue) gives, set with the clamp by the
   * classification. Read from here, not recomputed: clampedValue() takes doubles, and a call the JIT leaves out of line
   * boxes each one (a third of the demo's cells read a clamped end in every Newton sweep).
   */
  readonly kFloorValue: Float64Array;
  readonly kCeilingValue: Float64Array;
  readonly kValue: Float64Array;
  readonly kPiece: Int32Array;
  /**
   * Per cell, fixed for the run, read by the kernels instead of the material records (whose shapes differ between
   * materials, which made every read polymorphic): its k table (one record of one shape per distinct table) and that
   * table's index (equal indices: the same table); the table rows the solid and the liquid read k up to
   * (physics/material.ts Melt: solidTableK, liquidTableK); and where its k passes from the solid's reading to the
   * liquid's, K (kirchhoff.ts conductionFromK, conductionToK: the solidus and liquidus, or T_m ± δ under the melt ramp;
   * +∞ and −∞ without a melt).
   */
  readonly kTable: readonly Table[];
  readonly kTableId: Int32Array;
  readonly solidTableK: Float64Array;
  readonly liquidTableK: Float64Array;
  /** Per cell, fixed for the run: its k table's value at solidTableK and at liquidTableK (0 without a melt). */
  readonly solidCeilingValue: Float64Array;
  readonly liquidFloorValue: Float64Array;
  readonly meltFromK: Float64Array;
  readonly meltToK: Float64Array;
  /** The half-cell readings' scratch: [∂k̄/∂T_own, ∂k̄/∂T_nb, k̄, a node's clamped k] (meanOf, meltHalf). */
  readonly kOut: Float64Array;
}

const K_CONSTANT = 0;
const K_TABLE = 1;
const K_MELT = 2;

/** termsByLayer: each layer's temperature-dependent terms (heat-terms.ts), by layer index; none if omitted. */
export function createWorkspace(grid: Grid, bottomContext: FaceContext, topContext: FaceContext,
  termsByLayer: readonly (readonly CellHeatTerm[] | undefined)[] = []): Workspace {
  const n = grid.n;
  const m = n + 2;
  const cellTerms = Array.from(grid.layerOf, (li) => termsByLayer[li] ?? NO_TERMS);
  // a layer's cells share its material (mesh.ts), so its curve is its first cell's
  const layerCurves = Array.from(grid.layerStart, (first) => grid.materials[first]!.enthalpy);
  return {
    grid, n,
    curves: grid.materials.map((mat) => mat.enthalpy),
    bottomContext, topContext,
    T: new Float64Array(m), tau: new Float64Array(m), G: new Float64Array(n + 1), dRa: new Float64Array(n + 1), dRb: new Float64Array(n + 1),
    F: new Float64Array(n),
    capacity: new Float64Array(n), segmentHint: new Int32Array(n),
    layerCurves, layerSlopes: layerCurves.map(curveSlopes),
    latent: Float64Array.from(grid.materials, (mat) => (mat.melt ? mat.density * mat.melt.latentJPerKg : 0)),
    faceQ: new Float64Array(CHANNEL_COUNT), faceDq: new Float64Array(2), plates: [createPlateNode(NaN), createPlateNode(NaN)],
    benches: [createBenchNode(), createBenchNode()],
    cellTerms, hasTerms: cellTerms.some((t) => t.length > 0),
    generatedDs: new Float64Array(n), edgeDs: new Float64Array(n), termScratch: new Float64Array(2),
    termState: new Float64Array(n).fill(NaN),
    lower: new Float64Array(m), diag: new Float64Array(m), upper: new Float64Array(m),
    scratch2: new Float64Array(2),
    kSplits: Uint8Array.from(grid.materials, (mat) => (splitsConductivity(mat) ? 1 : 0)),
    kRegion: new Uint8Array(n), kFloor: new Float64Array(n), kCeiling: new Float64Array(n), kValue: new Float64Array(n),
    kFloorValue: new Float64Array(n), kCeilingValue: new Float64Array(n),
    kPiece: new Int32Array(n),
    kOut: new Float64Array(4),
    ...cellConstants(grid),
  };
}

/** The per-cell constants of the workspace (see Workspace.kTable), one table record and slope array per table. */
function cellConstants(grid: Grid) {
  const n = grid.n;
  const tables = new Map<Table, { table: Table; slopes: Float64Array; id: number }>();
  const kTable: Table[] = [];
  const kSlopes: Float64Array[] = [];
  const kTableId = new Int32Array(n);
  const solidTableK = new Float64Array(n);
  const liquidTableK = new Float64Array(n);
  const solidCeilingValue = new Float64Array(n);
  const liquidFloorValue = new Float64Array(n);
  const meltFromK = new Float64Array(n).fill(Infinity);
  const meltToK = new Float64Array(n).fill(-Infinity);
  for (let i = 0; i < n; i++) {
    const mat = grid.materials[i]!;
    let entry = tables.get(mat.conductivity);
    if (entry === undefined) {
      entry = { table: { tK: mat.conductivity.tK, y: mat.conductivity.y }, slopes: tableSlopes(mat.conductivity), id: tables.size };
      tables.set(mat.conductivity, entry);
    }
    kTable.push(entry.table);
    kSlopes.push(entry.slopes);
    kTableId[i] = entry.id;
    const melt = mat.melt;
    if (melt === undefined) continue;
    solidTableK[i] = melt.solidTableK;
    liquidTableK[i] = melt.liquidTableK;
    solidCeilingValue[i] = evalTable(mat.conductivity, melt.solidTableK);
    liquidFloorValue[i] = evalTable(mat.conductivity, melt.liquidTableK);
    meltFromK[i] = conductionFromK(melt);
    meltToK[i] = conductionToK(melt);
  }
  return { kTable, kSlopes, kTableId, solidTableK, liquidTableK, solidCeilingValue, liquidFloorValue, meltFromK, meltToK };
}

/**
 * How each cell's half cells read k at its state (halfCellConductivity's cases, kirchhoff.ts), and k at its own
 * temperature so read. Overwrites ws.kRegion, ws.kFloor, ws.kCeiling, ws.kValue, ws.kPiece. Reads ws.T.
 * Layer by layer: a layer's cells share its material (mesh.ts), so its table and melt limits are read once per layer
 * rather than once per cell (the same arithmetic per cell, so the same bits).
 */
function classifyConductivity(ws: Workspace): void {
  const { grid, T, kSplits, kRegion, kFloor, kCeiling, kFloorValue, kCeilingValue, kValue, kPiece, kTable, meltFromK, meltToK,
    solidTableK, liquidTableK, solidCeilingValue, liquidFloorValue } = ws;
  const { layerStart, layerEnd } = grid;
  for (let l = 0; l < layerStart.length; l++) {
    const first = layerStart[l]!;
    const end = layerEnd[l]!;
    if (first >= end) continue;
    const table = kTable[first]!;
    const xs = table.tK;
    const y = table.y;
    const last = xs.length - 1;
    if (last === 0) {
      const k = y[0]!;
      for (let i = first; i < end; i++) { kRegion[i] = K_CONSTANT; kValue[i] = k; }
      continue;
    }
    const splits = kSplits[first] === 1;
    const fromK = meltFromK[first]!;
    const toK = meltToK[first]!;
    const solidK = solidTableK[first]!;
    const liquidK = liquidTableK[first]!;
    const yFirst = y[0]!;
    const yLast = y[last]!;
    const solidTop = solidCeilingValue[first]!;
    const liquidBottom = liquidFloorValue[first]!;
    const xFirst = xs[0]!;
    const xLast = xs[last]!;
    for (let i = first; i < end; i++) {
      const t = T[i + 1]!;
      let lo = -Infinity;
      let hi = Infinity;
      let loValue = yFirst;
      let hiValue = yLast;
      if (splits) {
        if (t < fromK) { hi = solidK; hiValue = solidTop; }
        else if (t > toK) { lo = liquidK; loValue = liquidBottom; }
        else {
          kRegion[i] = K_MELT;
          continue;
        }
      }
      kRegion[i] = K_TABLE;
      kFloor[i] = lo;
      kCeiling[i] = hi;
      kFloorValue[i] = loValue;
      kCeilingValue[i] = hiValue;
      // pieceAt() and valueAt() written out here, the loop's hot path (calls the JIT leaves out of line cost more than
      // their bodies)
      let piece: number;
      if (t <= lo || t <= xFirst) piece = -1;
      else if (t >= hi || t >= xLast) piece = last;
      else {
        const hint = kPiece[i]!;
        piece = hint < 0 ? 0 : hint >= last ? last - 1 : hint;
        while (piece > 0 && xs[piece]! > t) piece--;
        while (piece + 1 < last && xs[piece + 1]! <= t) piece++;
      }
      kPiece[i] = piece;
      if (piece < 0) kValue[i] = loValue;
      else if (piece >= last) kValue[i] = hiValue;
      else {
        const x0 = xs[piece]!;
        const y0 = y[piece]!;
        kValue[i] = y0 + ((y[piece + 1]! - y0) * (t - x0)) / (xs[piece + 1]! - x0);
      }
    }
  }
}

/*
 * The helpers below take and return only integers and write their numbers to ws.kOut: a double passed to or returned
 * from a call the JIT does not inline is boxed on the heap, which made evaluate() allocate ~35 bytes per cell and sweep.
 */

/**
 * Which piece of cell i's k table, clamped to its phase's range, holds the temperature of node `node` (kirchhoff.ts
 * pieceOf), searched from the cell's own piece: −1 below, the row index between rows, the last row index above.
 */
function pieceAt(ws: Workspace, i: number, node: number): number {
  const xs = ws.kTable[i]!.tK;
  const last = xs.length - 1;
  const t = ws.T[node]!;
  if (t <= ws.kFloor[i]! || t <= xs[0]!) return -1;
  if (t >= ws.kCeiling[i]! || t >= xs[last]!) return last;
  const hint = ws.kPiece[i]!;
  let k = hint < 0 ? 0 : hint >= last ? last - 1 : hint;
  while (k > 0 && xs[k]! > t) k--;
  while (k + 1 < last && xs[k + 1]! <= t) k++;
  return k;
}

/**
 * Cell i's clamped k at node `node`'s temperature, its piece known (kirchhoff.ts clampedValue: below or above the clamp
 * the value stored with it, ws.kFloorValue or ws.kCeilingValue; on an inner piece with evalTable()'s arithmetic on the
 * row pair its search finds, so the same bits). Overwrites ws.kOut[3].
 */
function valueAt(ws: Workspace, i: number, node: number, piece: number): void {
  const table = ws.kTable[i]!;
  const xs = table.tK;
  if (piece < 0) { ws.kOut[3] = ws.kFloorValue[i]!; return; }
  if (piece >= xs.length - 1) { ws.kOut[3] = ws.kCeilingValue[i]!; return; }
  const t = ws.T[node]!;
  const y = table.y;
  const x0 = xs[piece]!;
  const y0 = y[piece]!;
  ws.kOut[3] = y0 + ((y[piece + 1]! - y0) * (t - x0)) / (xs[piece + 1]! - x0);
}

/**
 * kirchhoff.ts clampedTableMean() for cell i between its own node and node `nbNode`, from the ends' readings: its own
 * (ws.kValue, ws.kPiece) and the neighbour's (value in ws.kOut[3], piece pNb) under the cell's clamp. The same
 * arithmetic, so the same bits; swapping the ends gives the same mean and swaps the slopes exactly (a − b = −(b − a),
 * x/(−y) = −(x/y)), which lets two half cells that meet inside a layer share it. Writes ws.kOut[0] = ∂k̄/∂T_own,
 * ws.kOut[1] = ∂k̄/∂T_nb, ws.kOut[2] = k̄.
 */
function meanOf(ws: Workspace, i: number, ownNode: number, nbNode: number, pNb: number): void {
  const out = ws.kOut;
  const pOwn = ws.kPiece[i]!;
  const gOwn = ws.kValue[i]!;
  const gNb = out[3]!;
  if (pOwn === pNb) {
    // × 0.5 is ÷ 2 to the bit (a power of two), without a division
    const slopes = ws.kSlopes[i]!;
    const half = 0.5 * (pOwn >= 0 && pOwn < slopes.length ? slopes[pOwn]! : 0);
    out[0] = half;
    out[1] = half;
    out[2] = 0.5 * (gOwn + gNb);
    return;
  }
  const table = ws.kTable[i]!;
  const lo = ws.kFloor[i]!;
  const hi = ws.kCeiling[i]!;
  const own = ws.T[ownNode]!;
  const nb = ws.T[nbNode]!;
  const span = nb - own;
  const mean = (own < nb ? clampedIntegral(table, lo, hi, own, nb) : clampedIntegral(table, lo, hi, nb, own)) / Math.abs(span);
  out[0] = (mean - gOwn) / span;
  out[1] = (gNb - mean) / span;
  out[2] = mean;
}

/**
 * halfCellConductivity(cell i, its temperature, T at nbNode) (kirchhoff.ts) from the cell's classification: its half
 * toward a node whose reading is not shared (a face node, a cell of another layer or phase). Writes ws.kOut[0..2] as
 * meanOf() does (0, 0 and the cell's k when its k does not follow T). A melting material's cell in its melt, or whose
 * neighbour's temperature lies in or across it, is read by meltMean() (meltHalf).
 */
function halfTowards(ws: Workspace, i: number, nbNode: number): void {
  const out = ws.kOut;
  const region = ws.kRegion[i]!;
  if (region === K_MELT) { meltHalf(ws, i, nbNode); return; }
  if (region !== K_TABLE) { out[0] = 0; out[1] = 0; out[2] = ws.kValue[i]!; return; }
  if (ws.kSplits[i] === 1) {
    // a solid cell (clamped above) toward a node at or above where k leaves the solid's reading, a liquid one toward a
    // node at or below where it reaches the liquid's: the mean runs through the melt
    const nb = ws.T[nbNode]!;
    if (ws.kCeiling[i]! < Infinity ? nb >= ws.meltFromK[i]! : nb <= ws.meltToK[i]!) { meltHalf(ws, i, nbNode); return; }
  }
  const piece = pieceAt(ws, i, nbNode);
  valueAt(ws, i, nbNode, piece);
  meanOf(ws, i, i + 1, nbNode, piece);
}

/**
 * kirchhoff.ts meltMean() for cell i toward node nbNode: the Kirchhoff mean of its melting material's k(T) through the
 * melt (the cells at and beside a front, a few per layer). Writes ws.kOut[0..2] as meanOf() does.
 */
function meltHalf(ws: Workspace, i: number, nbNode: number): void {
  const out = ws.kOut;
  out[2] = meltMean(ws.kTable[i]!, ws.grid.materials[i]!.melt!, ws.T[i + 1]!, ws.T[nbNode]!, out);
}

/**
 * Evaluates everything that depends on U: T, tau, conductances G, face heat inputs, cell terms and the net rates F.
 * Overwrites ws.T, ws.tau, ws.G, ws.dHalf, ws.F, ws.segmentHint, ws.faceQ, ws.faceDq, ws.generatedDs, ws.edgeDs,
 * ws.scratch2, ws.termScratch, ws.termState.
 */
export function evaluate(ws: Workspace, U: Float64Array, cond: StepConditions): void {
  const { n, T, tau, G, F, segmentHint, grid, dRa, dRb, layerCurves, layerSlopes } = ws;
  const dx = grid.dx;
  T[0] = U[0]!;
  tau[0] = 1;
  T[n + 1] = U[n + 1]!;
  tau[n + 1] = 1;
  for (let l = 0; l < layerCurves.length; l++) {
    temperaturesOf(layerCurves[l]!, layerSlopes[l]!, U, grid.layerStart[l]!, grid.layerEnd[l]!, segmentHint, T, tau);
  }
  // half-cell resistances Δx/(2k̄), k̄ the Kirchhoff mean toward each neighbour (kirchhoff.ts), then series sums on
  // each face with their slopes in the face's two nodes (dRa: the node below, dRb: the node above). Two cells of one
  // layer that read k on the same clamped table share the mean of their common face (one evaluation, slopes swapped)
  classifyConductivity(ws);
  const { kRegion, kFloor, kCeiling, kValue, kPiece, kTableId, kOut, kSlopes } = ws;
  const contactAbove = grid.contactAbove;
  let halfBelow = 0;
  let belowOwn = 0;
  let belowNb = 0;
  let shared = false;
  let sharedK = 0;
  let sharedOwn = 0;
  let sharedNb = 0;
  // without cell terms each cell's net rate F is summed here, one cell behind (its upper face's G comes next)
  const noTerms = !ws.hasTerms;
  const source = cond.source;
  let generated = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1;
    const dxi = dx[i]!;
    // half = Δx/(2k̄(T_own, T_nb)): d(half)/dT = −Δx/(2k̄²)·dk̄/dT
    let kLo: number;
    let sLoOwn: number;
    let sLoNb: number;
    if (shared) {
      kLo = sharedK;
      sLoOwn = sharedNb;
      sLoNb = sharedOwn;
    } else {
      halfTowards(ws, i, j - 1);
      kLo = kOut[2]!;
      sLoOwn = kOut[0]!;
      sLoNb = kOut[1]!;
    }
    const cLo = (-0.5 * dxi) / (kLo * kLo);
    const loOwn = cLo * sLoOwn * tau[j]!;
    const loNb = cLo * sLoNb * tau[j - 1]!;
    const next = i + 1;
    if (next < n && kRegion[i] === K_TABLE && kRegion[next] === K_TABLE && kTableId[next] === kTableId[i]
      && kFloor[i] === kFloor[next] && kCeiling[i] === kCeiling[next]) {
      const piece = kPiece[i]!;
      if (piece === kPiece[next]!) {
        // meanOf()'s same-piece case written out (the common one: the two temperatures on one piece of the table)
        const slopes = kSlopes[i]!;
        const half = 0.5 * (piece >= 0 && piece < slopes.length ? slopes[piece]! : 0);
        kOut[0] = half;
        kOut[1] = half;
        kOut[2] = 0.5 * (kValue[i]! + kValue[next]!);
      } else {
        kOut[3] = kValue[next]!;
        meanOf(ws, i, j, j + 1, kPiece[next]!);
      }
      shared = true;
    } else {
      halfTowards(ws, i, j + 1);
      shared = false;
    }
    const kUp = kOut[2]!;
    const upOwn = kOut[0]!;
    const upNb = kOut[1]!;
    sharedK = kUp;
    sharedOwn = upOwn;
    sharedNb = upNb;
    const cUp = (-0.5 * dxi) / (kUp * kUp);
    G[i] = 1 / (halfBelow + (i === 0 ? 0 : contactAbove[i - 1]!) + (0.5 * dxi) / kLo);
    dRa[i] = belowOwn + loNb;
    dRb[i] = belowNb + loOwn;
    halfBelow = (0.5 * dxi) / kUp;
    belowOwn = cUp * upOwn * tau[j]!;
    belowNb = cUp * upNb * tau[j + 1]!;
    if (noTerms && i > 0) {
      const c = i - 1;
      const s = source[c]! * dx[c]!;
      generated += s;
      F[c] = G[c]! * (T[c]! - T[i]!) - G[i]! * (T[i]! - T[j]!) + s;
    }
  }
  G[n] = 1 / halfBelow;
  dRa[n] = belowOwn;
  dRb[n] = belowNb;
  if (noTerms) {
    // no cell has a term: the schedule's source alone (generatedDs and edgeDs stay 0)
    const c = n - 1;
    const s = source[c]! * dx[c]!;
    generated += s;
    F[c] = G[c]! * (T[c]! - T[n]!) - G[n]! * (T[n]! - T[n + 1]!) + s;
    ws.faceQ[CHANNEL.generated] = generated;
    ws.faceQ[CHANNEL.edge] = 0;
  } else {
    evaluateCellTerms(ws, cond);
  }
  evaluateFace(ws, cond.bottom, 0, 0);
  evaluateFace(ws, cond.top, 1, n + 1);
}

/** The net rates F of evaluate() with each cell's terms and their slopes. Overwrites ws.F, ws.generatedDs, ws.edgeDs. */
function evaluateCellTerms(ws: Workspace, cond: StepConditions): void {
  const { n, T, G, F, cellTerms, generatedDs, edgeDs, termScratch, termState } = ws;
  const dx = ws.grid.dx;
  let generated = 0;
  let edge = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1;
    let s = cond.source[i]!;
    let e = 0;
    let ds = 0;
    let de = 0;
    const terms = cellTerms[i]!;
    for (let k = 0; k < terms.length; k++) {
      const term = terms[k]!;
      termScratch[1] = termState[i]!;
      const q = cellTermRate(term, T[j]!, termScratch);
      if (term.kind === 'edge') { e += q; de += termScratch[0]!; termState[i] = termScratch[1]!; } else { s += q; ds += termScratch[0]!; }
    }
    generatedDs[i] = ds;
    edgeDs[i] = de;
    generated += s * dx[i]!;
    edge += e * dx[i]!;
    F[i] = G[j - 1]! * (T[j - 1]! - T[j]!) - G[j]! * (T[j]! - T[j + 1]!) + (s + e) * dx[i]!;
  }
  ws.faceQ[CHANNEL.generated] = generated;
  ws.faceQ[CHANNEL.edge] = edge;
}

/** Sets ws.capacity (ρc_p per cell at the temperatures in ws.T), the scale of errors and Newton updates. */
export function updateCapacity(ws: Workspace): void {
  const { grid, capacity, T } = ws;
  // layer by layer (a layer's cells share its material): ρ·c_p(T) as sensibleCapacity() computes it
  for (let l = 0; l < grid.layerStart.length; l++) {
    const first = grid.layerStart[l]!;
    const material = grid.materials[first]!;
    const table = material.specificHeat;
    const rho = material.density;
    for (let i = first; i < grid.layerEnd[l]!; i++) capacity[i] = rho * evalTable(table, T[i + 1]!);
  }
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
  if (c.kind === 'heater') {
    // the plate eliminated from the current stage: q and dq/dT are linear in the face temperature
    ws.faceQ[side] = plateHeatIn(c.heater, ws.plates[side], ws.T[node]!, ws.scratch2);
    ws.faceDq[side] = ws.scratch2[0]!;
    return;
  }
  if (c.kind === 'bench') {
    // the bench chain eliminated from the current stage: q is affine in the face temperature
    ws.faceQ[side] = benchHeatIn(ws.benches[side], ws.T[node]!, ws.scratch2);
    ws.faceDq[side] = ws.scratch2[0]!;
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
 * Jacobian of stageResidual() with respect to U. The flux through face j (node j to j+1), Q_j = G_j·(T_j − T_{j+1}),
 * has slopes a_j = ∂Q_j/∂U_j and b_j = ∂Q_j/∂U_{j+1}, which include the change of G through the half-cell resistances
 * of both its cells (ws.dRa, ws.dRb: through k̄ of each half cell, which follows the temperatures alone). A cell's own
 * terms add −h·Δx·(∂s/∂T)·τ to its diagonal. Overwrites ws.lower, ws.diag, ws.upper.
 */
export function stageJacobian(ws: Workspace, h: number, cond: StepConditions): void {
  const { n, G, tau, lower, diag, upper, grid, T, dRa, dRb, generatedDs, edgeDs } = ws;
  const dx = grid.dx;
  // face 0 (bottom node to cell 1) gives the bottom face's row
  const g0 = G[0]!;
  const g2dT0 = g0 * g0 * (T[0]! - T[1]!);
  let aPrev = g0 * tau[0]! - g2dT0 * dRa[0]!;
  let bPrev = -g0 * tau[1]! - g2dT0 * dRb[0]!;
  if (cond.bottom.kind === 'fixed') { diag[0] = 1; upper[0] = 0; }
  else { diag[0] = h * (aPrev - ws.faceDq[0]!); upper[0] = h * bPrev; }
  // cell row j: Δx·(U_j − B) − h·(Q_{j−1} − Q_j); its own terms add −h·Δx·(∂s/∂T)·τ (none: the loop without them)
  const terms = ws.hasTerms;
  for (let j = 1; j <= n; j++) {
    const g = G[j]!;
    const g2dT = g * g * (T[j]! - T[j + 1]!);
    const a = g * tau[j]! - g2dT * dRa[j]!;
    const b = -g * tau[j + 1]! - g2dT * dRb[j]!;
    const w = dx[j - 1]!;
    lower[j] = -h * aPrev;
    diag[j] = terms ? w - h * (bPrev - a + w * (generatedDs[j - 1]! + edgeDs[j - 1]!) * tau[j]!) : w - h * (bPrev - a);
    upper[j] = h * b;
    aPrev = a;
    bPrev = b;
  }
  if (cond.top.kind === 'fixed') { diag[n + 1] = 1; lower[n + 1] = 0; }
  else { lower[n + 1] = -h * aPrev; diag[n + 1] = h * (-bPrev - ws.faceDq[1]!); }
}

/**
 * Moves the cell-term channels of ws.faceQ along their slopes for a Newton update U ← U − δ (δ = delta, n+2), as
 * acceptLinearUpdate (time/tr-bdf2.ts) moves F: the same linearisation the update solved, so the energy ledger closes
 * to round-off. Overwrites ws.faceQ[CHANNEL.generated], ws.faceQ[CHANNEL.edge].
 */
export function linearizeCellTerms(ws: Workspace, delta: Float64Array): void {
  if (!ws.hasTerms) return;
  const { n, tau, generatedDs, edgeDs, faceQ } = ws;
  const dx = ws.grid.dx;
  let generated = 0;
  let edge = 0;
  for (let i = 0; i < n; i++) {
    const move = dx[i]! * tau[i + 1]! * delta[i + 1]!;
    generated += generatedDs[i]! * move;
    edge += edgeDs[i]! * move;
  }
  faceQ[CHANNEL.generated] = faceQ[CHANNEL.generated]! - generated;
  faceQ[CHANNEL.edge] = faceQ[CHANNEL.edge]! - edge;
}
