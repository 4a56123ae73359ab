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
 * A melting material's k is read by temperature, through its phases: below the solidus the solid's reading, the table
 * held flat above its last row at or below the solidus (g_s); above the liquidus the liquid's, held flat below its first
 * row at or above the liquidus (g_l); between them the two in series by the liquid fraction the melt has at T,
 * 1/k = (1 − f)/k_s + f/k_l (meltConductivity()); at an isothermal melt a jump from k_s to k_l at T_m. Every half cell,
 * whatever its own phase, takes the Kirchhoff mean of that one k(T) toward its neighbour (meltMean()): a cell on the
 * plateau at T_m conducts as liquid toward a hotter neighbour and as solid toward a colder one, the two sides of the
 * front it holds, and a solid cell beside a liquid one reads the liquid's k above T_m. Φ is continuous through the melt,
 * so the flux is continuous in both temperatures, and monotone: it rises with the cell's temperature and falls with
 * its neighbour's. Within one material it is the exact steady flux, so a steady front between two nodes leaves every
 * node on the closed-form profile (tests/validation/melt-conduction.test.ts).
 * Why by temperature and not by the cell's phase: read by phase, a two-phase cell's conductance followed its liquid
 * fraction (the two parts in series by f), so the heat a neighbour exchanged with it changed with the cell's own
 * enthalpy at a fixed temperature. On an isothermal plateau that coupling has the wrong sign for one neighbour (the
 * hotter one where k_l > k_s, the colder one where k_l < k_s): the discrete equations stop being cooperative (an
 * off-diagonal of ∂F/∂H below 0), and a front parked in a cell can cycle. Fuzz seed 18 case 9151, default numerics: a
 * separator with k_l = 2.6 k_s and a plateau worth 8 K of c_p under a held face cycled with a 60 s period, its
 * neighbours swinging 4 K, in backward Euler at a fixed 0.01 s step too; the run stopped at the work ceiling after 59 000
 * trial steps. Seed 16 case 4049 (a two-phase cell whose residual fell with its own enthalpy) was the same coupling. A
 * cooperative system with a stable equilibrium reaches it (Hirsch's convergence theorem, as in Smith, Monotone
 * Dynamical Systems, AMS 1995, ch. 3), and read by temperature both finish. Before that, read by phase at the cell's
 * point value, the conductance jumped at the solidus and the stage equations had no root (fuzz seed 12: 83.6 ↔ 91.4
 * kW/m²K); read by temperature it is continuous there as everywhere.
 * A melt whose latent heat is below what c_p·(1 K) holds is not read through its phases (splitsConductivity): its
 * table is read at T straight through the melt, as a material with no melt is (fuzz seed 9 case 275: with L = 0 and
 * the point reading by phase, k jumped across an enthalpy interval of width 0).
 */
import type { Material, Melt } from '../physics/material.ts';
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
 * The conductivity (W·m⁻¹·K⁻¹) of the half of a cell at ownK that faces a node at nbK: the Kirchhoff mean of its
 * material's k between the two, a melting material's k read by temperature as meltConductivity() gives it;
 * out[0] = ∂k̄/∂T_own, out[1] = ∂k̄/∂T_nb. Overwrites out[0..1]. It does not depend on the cell's enthalpy: see the
 * header.
 */
export function halfCellConductivity(material: Material, ownK: number, nbK: number, out: Float64Array): number {
  const melt = material.melt;
  const table = material.conductivity;
  out[0] = 0;
  out[1] = 0;
  if (table.y.length === 1) return table.y[0]!;
  if (melt === undefined || !splitsConductivity(material)) return clampedTableMean(table, -Infinity, Infinity, ownK, nbK, out);
  return meltMean(table, melt, ownK, nbK, out);
}

/**
 * Where a melting material's k passes from the solid's reading to the liquid's, K: its solidus and liquidus; an
 * isothermal melt smoothed by the melt ramp (physics/melt-ramp.ts, Melt.rampK = δ) over T_m ± δ, in series by a
 * fraction linear in T as a melting range is, so that the ramp, which takes the kink out of T(H) there, leaves no jump
 * in k at T_m either (a jump is a kink in Φ, and each cell crossing it would reject steps as the kink of T(H) did).
 */
export function conductionFromK(melt: Melt): number {
  return melt.solidusK === melt.liquidusK && melt.rampK ? melt.solidusK - melt.rampK : melt.solidusK;
}

/** The upper end of conductionFromK()'s range, K. */
export function conductionToK(melt: Melt): number {
  return melt.solidusK === melt.liquidusK && melt.rampK ? melt.liquidusK + melt.rampK : melt.liquidusK;
}

/**
 * k (W·m⁻¹·K⁻¹) of a melting material at T (K) as its half cells read it (see the header): the solid's reading below
 * the solidus, the liquid's above the liquidus, and between them the two in series by the liquid fraction the melt
 * has at T, 1/k = (1 − f)/k_s + f/k_l with f = (T − T_s)/(T_l − T_s), T_s and T_l as conductionFromK() and
 * conductionToK() give them. At an isothermal melt without a ramp k jumps at T_m, and `up` picks the side: the
 * liquid's value (true) or the solid's.
 */
export function meltConductivity(table: Table, melt: Melt, tK: number, up: boolean): number {
  const ts = conductionFromK(melt);
  const tl = conductionToK(melt);
  if (tK < ts || (tK === ts && !up)) return clampedValue(table, -Infinity, melt.solidTableK, tK);
  if (tK > tl || (tK === tl && up)) return clampedValue(table, melt.liquidTableK, Infinity, tK);
  const f = (tK - ts) / (tl - ts);
  return 1 / ((1 - f) / melt.kSolid + f / melt.kLiquid);
}

/**
 * ∫_a^b meltConductivity(T) dT (a ≤ b, K): the solid's and the liquid's readings by clampedIntegral(), and across the
 * melting range the series mix in closed form, ∫ dT/(r_s + f(T)·Δr) = (w/Δr)·ln(r(f_b)/r(f_a)) with r = 1/k, written
 * as ((T_b − T_a)/r(f_a))·log1p(x)/x, x = (f_b − f_a)·Δr/r(f_a), so that Δr → 0 (k_s = k_l) needs no special case
 * beyond x = 0.
 */
export function meltIntegral(table: Table, melt: Melt, a: number, b: number): number {
  const ts = conductionFromK(melt);
  const tl = conductionToK(melt);
  let sum = 0;
  const solidEnd = Math.min(b, ts);
  if (a < solidEnd) sum += clampedIntegral(table, -Infinity, melt.solidTableK, a, solidEnd);
  const m0 = Math.max(a, ts);
  const m1 = Math.min(b, tl);
  if (m0 < m1) {
    const w = tl - ts;
    const rs = 1 / melt.kSolid;
    const dr = 1 / melt.kLiquid - rs;
    const r0 = rs + ((m0 - ts) / w) * dr;
    const x = ((m1 - m0) / w) * (dr / r0);
    sum += ((m1 - m0) / r0) * (x === 0 ? 1 : Math.log1p(x) / x);
  }
  const liquidStart = Math.max(a, tl);
  if (liquidStart < b) sum += clampedIntegral(table, melt.liquidTableK, Infinity, liquidStart, b);
  return sum;
}

/**
 * The Kirchhoff mean of meltConductivity() between own and nb (K), with ∂/∂own in out[0] and ∂/∂nb in out[1]: where
 * both lie below the solidus or both above the liquidus, clampedTableMean() of that phase's reading (the same bits as
 * before the melt was read by temperature); otherwise the mean of meltIntegral(), its slopes (k̄ − k(own))/(nb − own)
 * and (k(nb) − k̄)/(nb − own) with each end's k read on the side facing the other end. Both at one temperature:
 * strictly inside a melting range, k there with half its slope on each end; at an isothermal melt's T_m (two cells on
 * the plateau) or at an end of a range, the mean of the two sides' values with slopes 0 (no heat flows between them,
 * and on the plateau their T does not move with H). Allocates nothing.
 */
export function meltMean(table: Table, melt: Melt, own: number, nb: number, out: Float64Array): number {
  const ts = conductionFromK(melt);
  const tl = conductionToK(melt);
  if (own < ts && nb < ts) return clampedTableMean(table, -Infinity, melt.solidTableK, own, nb, out);
  if (own > tl && nb > tl) return clampedTableMean(table, melt.liquidTableK, Infinity, own, nb, out);
  if (own === nb) {
    if (own > ts && own < tl) {
      // strictly inside a melting range: k = 1/(r_s + f·Δr), dk/dT = −k²·Δr/w; each end takes half
      const k = meltConductivity(table, melt, own, true);
      const slope = (-k * k * (1 / melt.kLiquid - 1 / melt.kSolid)) / (tl - ts);
      out[0] = slope / 2;
      out[1] = slope / 2;
      return k;
    }
    // at T_m of an isothermal melt, or at an end of a range (where the two sides' slopes differ)
    out[0] = 0;
    out[1] = 0;
    return (meltConductivity(table, melt, own, false) + meltConductivity(table, melt, own, true)) / 2;
  }
  const up = nb > own;
  const span = nb - own;
  const mean = (up ? meltIntegral(table, melt, own, nb) : meltIntegral(table, melt, nb, own)) / Math.abs(span);
  out[0] = (mean - meltConductivity(table, melt, own, up)) / span;
  out[1] = (meltConductivity(table, melt, nb, !up) - mean) / span;
  return mean;
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
