/**
 * Heat lost through the side walls of a 1D stack, as a volumetric term in each cell (a fin-like side loss):
 *   q_edge = −(P/A)·q_side(T)   W/m³,
 * with P/A the footprint's perimeter over its area and q_side the heat leaving one square metre of the stack's side
 * wall at the cell's temperature T. The wall is taken at the cell's temperature (the 1D assumption: no radial
 * gradient inside the stack; the later r–z model will check that). The bare side loses
 *   q_side = h_c(T)·(T − T∞) + ε·σ·(T⁴ − T∞⁴)
 * (grey surface in large isothermal surroundings, Incropera eq. 1.7; the radiative part is h_r·(T − T∞) with
 * h_r = εσ(T² + T∞²)(T + T∞), the usual linearised coefficient, exactly), h_c from Churchill & Chu for a vertical
 * plate as tall as the whole stack (vertical-plate.ts), or a fixed coefficient. Air and surroundings are at ambient.
 *
 * An insulation sleeve of thickness t and conductivity k is a steady series resistance (its heat capacity is left
 * out). Per square metre of the stack's side wall it is
 *   disc of radius r₁ (r₂ = r₁ + t): R = r₁·ln(r₂/r₁)/k, the cylindrical-shell resistance ln(r₂/r₁)/(2πk) per metre of
 *                                   height (Incropera eq. 3.28) times the inner perimeter 2πr₁; outer/inner area r₂/r₁;
 *   rectangle: R = t/k, a plane wall (eq. 3.6); outer/inner area (P + 8t)/P (corners square, their 2D spreading
 *              left out — it would add conductance near the corners).
 * The sleeve's outer surface T_s balances conduction through it against its own loss:
 *   f(T, T_s) = (T − T_s)·k(T_m)/(R·k) − (A_out/A_in)·q_side(T_s) = 0,   T_m = (T + T_s)/2,
 * solved for T_s by safeguarded Newton (k at the sleeve's mean temperature, with its slope); then
 * dq/dT = g·dT_s/dT with dT_s/dT = −(∂f/∂T)/(∂f/∂T_s), g = (A_out/A_in)·q_side'(T_s) (without k(T) this is the series
 * conductance g/(1 + R·g)).
 */
import type { Table } from './table.ts';
import { evalTableWithSlope } from './table.ts';
import type { FootprintMm } from './problem.ts';
import { mmToM, STEFAN_BOLTZMANN_W_M2K4 } from './units.ts';
import { verticalPlateAt } from './vertical-plate.ts';
import { createLazyTable, readLazyTable, type LazyTable } from './lazy-table.ts';

export const edgeLossDefaults = {
  /**
   * The sleeve's surface temperature is taken once a Newton move is below this, K: Newton converges quadratically, so
   * the error left is of the order of its square (1e-12 K), far below any tolerance of the run.
   */
  surfaceToleranceK: 1e-6,
  /** Newton iterations for the sleeve surface: 2–3 from the cell's last surface, ~6 cold; bisection steps guard it. */
  maxSurfaceIterations: 60,
  /**
   * The solver reads q_side(T) from a table (sideLossTabled): nodes every tableStepK kelvin, each the exact sideLoss()
   * with its slope, filled the first time a cell's temperature falls beside it, and cubic Hermite interpolation
   * between them (q and dq/dT continuous). Each exact evaluation costs a Churchill–Chu correlation with its air
   * properties (and, with a sleeve, a Newton solve for its surface): 80 % of a run's time on a 129-cell stack with a
   * sleeve. Between kinks the interpolation error is Δ⁴/384·|q''''| (de Boor, A Practical Guide to Splines, 2001,
   * ch. IV); the air-property and sleeve k(T) tables are piecewise linear, so q's slope kinks at their rows and the
   * error there is first order in Δ. Measured at 0.1 K (tests/unit/edge-loss-table.test.ts): within 6e-6 of q, its
   * slope within 16 % right at a kink (the slope only steers Newton; the balance solved is the tabled q's).
   */
  tableStepK: 0.1,
  /**
   * Within this many kelvin of the ambient the exact form is used: there Churchill–Chu's q grows as |T − T∞|^(7/6)
   * (Nu = (0.825 + c·Ra^(1/6))², Ra ∝ |T − T∞|), whose second derivative is unbounded, so no cubic follows it.
   */
  tableNearAmbientK: 0.5,
  /** The table spans temperatures up to this, K (above it, the exact form): 60 001 nodes, 0.96 MB per edge term. */
  tableTopK: 6000,
} as const;

export type SideConvection = { readonly kind: 'natural' } | { readonly kind: 'fixed'; /** W·m⁻²·K⁻¹ */ readonly coefficient: number };

export interface Sleeve {
  /** Sleeve conductivity against temperature, W·m⁻¹·K⁻¹. */
  readonly conductivity: Table;
  /** Resistance per square metre of side wall times k, m (so R = resistanceTimesK / k, m²·K/W). */
  readonly resistanceTimesK: number;
  /** Outer over inner side area (≥ 1). */
  readonly areaRatio: number;
}

export interface EdgeLoss {
  /** Footprint perimeter over area, 1/m. */
  readonly perimeterPerArea: number;
  /** Height of the side wall as a vertical plate (the whole stack), m. */
  readonly heightM: number;
  readonly convection: SideConvection;
  /** Emissivity of the side surface (the sleeve's outer surface when there is one). */
  readonly emissivity: number;
  /** Air and surroundings, K. */
  readonly ambientK: number;
  readonly sleeve: Sleeve | undefined;
}

/** The sleeve's geometry on a footprint given in mm (see the header): R·k per square metre of side wall and the area ratio. */
export function sleeveGeometry(footprint: FootprintMm, thicknessM: number): { resistanceTimesK: number; areaRatio: number } {
  if ('diameter_mm' in footprint) {
    const r1 = mmToM(footprint.diameter_mm) / 2;
    const r2 = r1 + thicknessM;
    return { resistanceTimesK: r1 * Math.log(r2 / r1), areaRatio: r2 / r1 };
  }
  const perimeter = 2 * (mmToM(footprint.width_mm) + mmToM(footprint.length_mm));
  return { resistanceTimesK: thicknessM, areaRatio: (perimeter + 8 * thicknessM) / perimeter };
}

/** [T, T∞, L] in and [q, dq/dT] out of verticalPlateAt(), and room for the air properties it reads. */
const plateIo = new Float64Array(6);

/** Heat leaving a bare side surface at tK, W/m² (convection + radiation), with its slope in out[0]. */
function surfaceLoss(loss: EdgeLoss, tK: number, out: Float64Array): number {
  let q = 0;
  let dq = 0;
  const c = loss.convection;
  if (c.kind === 'fixed') {
    q = c.coefficient * (tK - loss.ambientK);
    dq = c.coefficient;
  } else {
    plateIo[0] = tK;
    plateIo[1] = loss.ambientK;
    plateIo[2] = loss.heightM;
    verticalPlateAt(plateIo);
    q = plateIo[0]!;
    dq = plateIo[1]!;
  }
  if (loss.emissivity > 0) {
    const es = loss.emissivity * STEFAN_BOLTZMANN_W_M2K4;
    const t2 = tK * tK;
    const a2 = loss.ambientK * loss.ambientK;
    q += es * (t2 * t2 - a2 * a2);
    dq += 4 * es * t2 * tK;
  }
  out[0] = dq;
  return q;
}

const surface = new Float64Array(1);
const kSlope = new Float64Array(1);

/**
 * Heat leaving one square metre of side wall whose inside is at tK, W/m², with dq/dT (W·m⁻²·K⁻¹) in out[0]: the
 * bare surface, or through the sleeve to its outer surface. out[1] is, on entry, a start for the sleeve's surface
 * temperature (K; used if it lies between tK and the ambient, e.g. the last one of the same cell) and, on exit, the
 * surface temperature found. Overwrites out[0], out[1]; allocates nothing.
 */
export function sideLoss(loss: EdgeLoss, tK: number, out: Float64Array): number {
  const sleeve = loss.sleeve;
  if (!sleeve) {
    out[1] = tK;
    return surfaceLoss(loss, tK, out);
  }
  const { areaRatio, resistanceTimesK } = sleeve;
  const ambient = loss.ambientK;
  // the surface lies between the inside and the ambient: a bracket for the safeguarded Newton
  let lo = Math.min(tK, ambient);
  let hi = Math.max(tK, ambient);
  const start = out.length > 1 ? out[1]! : NaN;
  let ts = start >= lo && start <= hi ? start : 0.5 * (tK + ambient);
  let conductance = 0;
  let g = 0;
  let dfdT = 0;
  let dfdTs = -1;
  for (let it = 0; it < edgeLossDefaults.maxSurfaceIterations; it++) {
    const k = evalTableWithSlope(sleeve.conductivity, 0.5 * (tK + ts), kSlope);
    conductance = k / resistanceTimesK;
    const halfSlope = (0.5 * (tK - ts) * kSlope[0]!) / resistanceTimesK;
    const phi = areaRatio * surfaceLoss(loss, ts, surface);
    g = areaRatio * surface[0]!;
    const f = (tK - ts) * conductance - phi;
    dfdT = conductance + halfSlope;
    dfdTs = -conductance + halfSlope - g;
    // f > 0 at the bracket's low end and < 0 at its high end (T∞ and T, whichever is lower first)
    if (f > 0) lo = ts; else hi = ts;
    let next = ts - f / dfdTs;
    if (!(next >= lo && next <= hi)) next = 0.5 * (lo + hi);
    const moved = Math.abs(next - ts);
    ts = next;
    if (moved <= edgeLossDefaults.surfaceToleranceK) break;
  }
  out[0] = (-g * dfdT) / dfdTs;
  if (out.length > 1) out[1] = ts;
  return (tK - ts) * conductance;
}

/** One table per edge term, shared by every run of the same problem (a window search's runs); values only. */
const tables = new WeakMap<EdgeLoss, LazyTable>();
/** The last edge term read and its table: a problem has one, so the lookup per cell and sweep is a comparison. */
let lastLoss: EdgeLoss | undefined;
let lastTable: LazyTable | undefined;

function tableOf(loss: EdgeLoss): LazyTable {
  let t = tables.get(loss);
  if (!t) {
    const d = edgeLossDefaults;
    t = createLazyTable({ stepK: d.tableStepK, topK: d.tableTopK, centreK: loss.ambientK, nearK: d.tableNearAmbientK }, (x, o) => sideLoss(loss, x, o));
    tables.set(loss, t);
  }
  lastLoss = loss;
  lastTable = t;
  return t;
}

/**
 * sideLoss() read from the edge term's table (lazy-table.ts; edgeLossDefaults.tableStepK): cubic Hermite between the
 * exact values and slopes at the nodes around tK, the interpolant's own slope in out[0]. Near the ambient and beyond
 * the table, the exact form itself, which also moves the sleeve surface's warm start in out[1]; elsewhere out[1] is
 * left as it was.
 */
export function sideLossTabled(loss: EdgeLoss, tK: number, out: Float64Array): number {
  return readLazyTable(loss === lastLoss ? lastTable! : tableOf(loss), tK, out);
}

/**
 * The edge term of a cell at tK: heat into the cell, W/m³ (negative: lost), with its slope in out[0] (W·m⁻³·K⁻¹),
 * from the side-loss table (sideLossTabled).
 */
export function edgeHeatIn(loss: EdgeLoss, tK: number, out: Float64Array): number {
  const q = sideLossTabled(loss, tK, out);
  out[0] = -loss.perimeterPerArea * out[0]!;
  return -loss.perimeterPerArea * q;
}
