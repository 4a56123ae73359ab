/**
 * The conductivity of a half cell as the mean of k over the temperatures between the cell and its neighbour, through
 * the Kirchhoff transform Φ(T) = ∫k dT (Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed. 1959, §1.7; Özişik,
 * Heat Conduction, 2nd ed. 1993, §11.2):  k̄ = (Φ(T_nb) − Φ(T_own)) / (T_nb − T_own).
 *
 * Why: with k read at the cell's own temperature, the flux G·(T_i − T_{i+1}) toward a much hotter neighbour falls as
 * the cell warms wherever (dk/dT)·ΔT > k (a tabulated k rising ×100 over a few kelvin next to a held face), so the
 * discrete equations stop being monotone and Newton's method cycles even at steps of 1e-12 s. With the mean, each half
 * resistance Δx/(2k̄) falls as either temperature moves away from the other, so the flux ΔT/(Σ Δx/(2k̄) + R_c) rises
 * with T_i and falls with T_{i+1} whatever the table: the monotone flux of the Kirchhoff transform. Within one material
 * it is the exact Kirchhoff flux (Φ(T_i) − Φ(T_{i+1}))/((Δx_i + Δx_{i+1})/2); for a constant k it is the usual one.
 *
 * A melting material is read by phase: a solid cell on the table held flat above its solid row (g_s), a liquid cell
 * on the table held flat below its liquid row (g_l), as conductivityAt() reads them (physics/material.ts). A
 * two-phase cell with liquid fraction f puts its solid and liquid parts in series as mushConductivity() does, each
 * part with its own Kirchhoff mean toward the neighbour:  1/k̄ = (1 − f)/k̄_s + f/k̄_l,  k̄_s, k̄_l the means of g_s
 * and g_l between T_own and T_nb. So k̄ equals the solid cell's at f → 0 and the liquid cell's at f → 1 (continuous
 * at the solidus and the liquidus), and equals the point mush value whenever both temperatures lie between the solid
 * and liquid rows.
 * Why: with the point mush value a cell just past its solidus beside a much colder neighbour conducted with k_s
 * while the same cell just below it conducted with the mean of g_s down to the neighbour; the stage equations had no
 * root at that jump and Newton cycled between the two values at the smallest step (fuzz seed 12, nine cases: e.g.
 * 83.6 ↔ 91.4 kW/m²K). The half flux (2/Δx)·ΔT·k̄ is the harmonic mix of (2/Δx)·ΔΦ_s and (2/Δx)·ΔΦ_l, each monotone
 * in either temperature, so at a given f the series flux stays monotone; its change with f (through the caller's
 * df/dH) is ∂(1/k̄)/∂f = 1/k̄_l − 1/k̄_s, in out[2]. A melt whose latent heat is below what c_p·(1 K) holds is not
 * read by phase (splitsConductivity): its k would jump from k_s to k_l across an enthalpy interval ρL too narrow for
 * any step to resolve (with L = 0, a true jump, and the stage equations have no root: fuzz seed 9 case 275, Newton
 * failed at 1.8e-9 s), so the table is read at T straight through the melt, continuous and Kirchhoff-monotone.
 */
import type { Material } from '../physics/material.ts';
import { liquidFractionOf } from '../physics/material.ts';
import type { Table } from '../physics/table.ts';
import { evalTable } from '../physics/table.ts';

/** g(T) = table(clamp(T, lo, hi)): the table as one phase of a cell reads it. */
export function clampedValue(table: Table, lo: number, hi: number, t: number): number {
  return evalTable(table, t < lo ? lo : t > hi ? hi : t);
}

/** Which linear piece of g holds T: −1 below the first knot, the row index between knots, n − 1 above. */
function pieceOf(table: Table, lo: number, hi: number, t: number): number {
  const xs = table.tK;
  const last = xs.length - 1;
  if (t <= lo || t <= xs[0]!) return -1;
  if (t >= hi || t >= xs[last]!) return last;
  let k = 0;
  while (k + 1 < last && xs[k + 1]! <= t) k++;
  return k;
}

/** ∫_a^b table(T) dT for a ≤ b, the table held flat outside its rows. */
function tableIntegral(table: Table, a: number, b: number): number {
  const { tK: xs, y } = table;
  const last = xs.length - 1;
  let sum = 0;
  let t = a;
  if (t < xs[0]!) { const e = Math.min(b, xs[0]!); sum += (e - t) * y[0]!; t = e; }
  for (let k = 0; k < last && t < b; k++) {
    if (xs[k + 1]! <= t) continue;
    const e = Math.min(b, xs[k + 1]!);
    sum += ((e - t) * (evalTable(table, t) + evalTable(table, e))) / 2;
    t = e;
  }
  if (t < b) sum += (b - t) * y[last]!;
  return sum;
}

/** ∫_a^b g(T) dT for a ≤ b, g the table clamped to [lo, hi]. */
export function clampedIntegral(table: Table, lo: number, hi: number, a: number, b: number): number {
  let sum = 0;
  let from = a;
  let to = b;
  if (from < lo) { const e = Math.min(to, lo); sum += (e - from) * evalTable(table, lo); from = e; }
  if (to > hi) { const s = Math.max(from, hi); sum += (to - s) * evalTable(table, hi); to = s; }
  if (from < to) sum += tableIntegral(table, from, to);
  return sum;
}

/**
 * Mean of g(T) = table(clamp(T, lo, hi)) over the temperatures between `own` and `nb` (K), with ∂/∂own in out[0] and
 * ∂/∂nb in out[1]. Exact for a piecewise-linear table; where both ends lie on one linear piece the mean is the
 * average of the end values and each slope is half the piece's, so no difference of near-equal numbers is taken.
 * Overwrites out[0], out[1]. Allocates nothing.
 */
export function clampedTableMean(table: Table, lo: number, hi: number, own: number, nb: number, out: Float64Array): number {
  const gOwn = clampedValue(table, lo, hi, own);
  const gNb = clampedValue(table, lo, hi, nb);
  const piece = pieceOf(table, lo, hi, own);
  if (piece === pieceOf(table, lo, hi, nb)) {
    const xs = table.tK;
    const inner = piece >= 0 && piece < xs.length - 1;
    const slope = inner ? (table.y[piece + 1]! - table.y[piece]!) / (xs[piece + 1]! - xs[piece]!) : 0;
    out[0] = slope / 2;
    out[1] = slope / 2;
    return (gOwn + gNb) / 2;
  }
  const span = nb - own;
  const mean = (own < nb ? clampedIntegral(table, lo, hi, own, nb) : clampedIntegral(table, lo, hi, nb, own)) / Math.abs(span);
  out[0] = (mean - gOwn) / span;
  out[1] = (gNb - mean) / span;
  return mean;
}

/**
 * Each linear piece's slope (y[k+1] − y[k])/(T[k+1] − T[k]) of a table (length rows − 1), as clampedTableMean() divides
 * it out per call: worked out once per table for the grid's evaluation (discretization.ts).
 */
export function tableSlopes(table: Table): Float64Array {
  const { tK: xs, y } = table;
  const slopes = new Float64Array(Math.max(0, xs.length - 1));
  for (let k = 0; k + 1 < xs.length; k++) slopes[k] = (y[k + 1]! - y[k]!) / (xs[k + 1]! - xs[k]!);
  return slopes;
}

/**
 * The conductivity (W·m⁻¹·K⁻¹) of the half of a cell (enthalpy hJ, temperature ownK) that faces a node at nbK: the
 * Kirchhoff mean of its material's k between the two, read by phase as above; out[0] = ∂k̄/∂T_own, out[1] = ∂k̄/∂T_nb
 * (in a two-phase cell at its liquid fraction held), out[2] = ∂(1/k̄)/∂f (m·K/W; 0 outside the two-phase range).
 * Overwrites out[0..2]: out needs three entries.
 */
export function halfCellConductivity(material: Material, hJ: number, ownK: number, nbK: number, out: Float64Array): number {
  const melt = material.melt;
  const table = material.conductivity;
  out[0] = 0;
  out[1] = 0;
  out[2] = 0;
  if (table.y.length === 1) return table.y[0]!;
  if (melt === undefined || !splitsConductivity(material)) return clampedTableMean(table, -Infinity, Infinity, ownK, nbK, out);
  if (hJ <= melt.hSolidus) return clampedTableMean(table, -Infinity, melt.solidTableK, ownK, nbK, out);
  if (hJ >= melt.hLiquidus) return clampedTableMean(table, melt.liquidTableK, Infinity, ownK, nbK, out);
  const f = liquidFractionOf(material, hJ, ownK);
  // both ends on a flat stretch of a part's reading (the common case: the neighbour between the solid and liquid
  // rows): that part's mean is its end value k_s or k_l, exactly, with zero slopes
  let kS = melt.kSolid;
  let sOwn = 0;
  let sNb = 0;
  if (ownK < melt.solidTableK || nbK < melt.solidTableK) {
    kS = clampedTableMean(table, -Infinity, melt.solidTableK, ownK, nbK, out);
    sOwn = out[0]!;
    sNb = out[1]!;
  }
  let kL = melt.kLiquid;
  let lOwn = 0;
  let lNb = 0;
  if (ownK > melt.liquidTableK || nbK > melt.liquidTableK) {
    kL = clampedTableMean(table, melt.liquidTableK, Infinity, ownK, nbK, out);
    lOwn = out[0]!;
    lNb = out[1]!;
  }
  // the arithmetic of discretization.ts mushHalf(), in the same order (the same bits); with both parts flat, that of
  // mushConductivity()
  const rS = (1 - f) / kS;
  const rL = f / kL;
  const k = 1 / (rS + rL);
  const kk = k * k;
  out[0] = kk * ((rS * sOwn) / kS + (rL * lOwn) / kL);
  out[1] = kk * ((rS * sNb) / kS + (rL * lNb) / kL);
  out[2] = 1 / kL - 1 / kS;
  return k;
}

/**
 * Below this latent heat, in kelvin of the material's own c_p at its solidus, the melt does not split k into solid,
 * mush and liquid values: a phase change whose latent heat a 1 K temperature step outweighs cannot change conduction in
 * a way the grid resolves (real melts: 10²–10⁴ K of c_p, e.g. 3.3e5 J/kg over 2.1e3 J/(kg·K) for ice, from memory).
 */
const SPLIT_LATENT_K = 1;

/** Whether a melting material's k follows its phase (solid, mush, liquid) rather than the table at T (see above). */
export function splitsConductivity(material: Material): boolean {
  const melt = material.melt;
  return melt !== undefined && melt.latentJPerKg >= SPLIT_LATENT_K * evalTable(material.specificHeat, melt.solidusK);
}
