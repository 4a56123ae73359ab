/**
 * Property models of one material, in SI: conductivity k(T) and volumetric enthalpy H(T), and the inverse T(H).
 *
 * Enthalpy method (Voller & Swaminathan 1990; Alexiades & Solomon 1993, ch. 4): the volumetric enthalpy is
 *   H(T) = ∫ ρ c_p(T') dT' + ρ L f(T),
 * with f the liquid fraction, a linear ramp from 0 at the solidus to 1 at the liquidus (a jump when they are equal).
 * c_p is tabulated and linear between rows, so the effective capacity C(T) = dH/dT is piecewise linear between the
 * knots {table rows, solidus, liquidus}; H(T) is piecewise quadratic and T(H) is inverted in closed form on each
 * segment. This conserves energy exactly through the phase change: the solver's unknown is H, never T.
 * Outside the tables the end values are held (flat c_p and k), so H is extended linearly.
 */
import { evalTable, evalTableWithSlope, type Table } from './table.ts';

/** What a layer's limit guards against (the file's `limits[].kind`). */
export const LIMIT_KINDS = ['melt', 'ignition', 'decomposition', 'softening', 'service'] as const;
export type LimitKind = (typeof LIMIT_KINDS)[number];

export { evalTable, evalTableWithSlope, type Table };


/**
 * Volumetric enthalpy curve, J/m³ against K. Knot i sits at (tK[i], h[i]); on segment i (knot i to i+1) the capacity
 * runs linearly from cLeft[i] to cRight[i] (J·m⁻³·K⁻¹). A segment with tK[i] === tK[i+1] is an isothermal latent jump.
 */
export interface EnthalpyCurve {
  readonly tK: Float64Array;
  readonly h: Float64Array;
  readonly cLeft: Float64Array;
  readonly cRight: Float64Array;
  /** Enthalpies (J/m³) where the capacity jumps (solidus and liquidus): Newton updates stop there, not across. */
  readonly kinks: Float64Array;
}

export interface Melt {
  readonly solidusK: number;
  readonly liquidusK: number;
  /** J/kg */
  readonly latentJPerKg: number;
  /** H at the solidus (all solid) and at the liquidus (all liquid), J/m³. */
  readonly hSolidus: number;
  readonly hLiquidus: number;
  /**
   * Conductivity of the solid and of the liquid at the melt, W·m⁻¹·K⁻¹: the table's value at its last row at or below
   * the solidus and at its first row at or above the liquidus (a table may ramp between them across the melt).
   */
  readonly kSolid: number;
  readonly kLiquid: number;
  /** The table rows those come from, K: the solid is read at T ≤ solidTableK, the liquid at T ≥ liquidTableK. */
  readonly solidTableK: number;
  readonly liquidTableK: number;
  /** Half-width of the melt ramp, K (melt-ramp.ts); absent or 0: the curve has its kinks. */
  readonly rampK?: number | undefined;
  /** With a ramp: the unramped curve, from which the liquid fraction is read (the same enthalpies as without it). */
  readonly lever?: EnthalpyCurve | undefined;
}

export interface Limit {
  readonly kind: LimitKind;
  readonly atK: number;
  readonly source?: string | undefined;
  readonly note?: string | undefined;
}

export interface Material {
  readonly name: string;
  readonly title: string;
  /** W·m⁻¹·K⁻¹ */
  readonly conductivity: Table;
  /** kg/m³ */
  readonly density: number;
  /** J·kg⁻¹·K⁻¹ */
  readonly specificHeat: Table;
  readonly enthalpy: EnthalpyCurve;
  readonly melt: Melt | undefined;
  readonly limits: readonly Limit[];
  readonly sources: Readonly<Record<string, string>>;
  /** Where the record is, for a reader: "materials/nickel.json", "the scenario file's materials.cloth (composite)". */
  readonly from?: string | undefined;
}

/** Width of the sensible-only end segments of an enthalpy curve, K (any positive width gives the same curve). */
const BRACKET_K = 1000;

export interface MaterialInput {
  readonly name: string;
  readonly title: string;
  readonly conductivity: Table;
  readonly density: number;
  readonly specificHeat: Table;
  readonly melt?: { solidusK: number; liquidusK: number; latentJPerKg: number } | undefined;
  readonly limits: readonly Limit[];
  readonly sources: Readonly<Record<string, string>>;
  readonly from?: string | undefined;
}

/** Builds the enthalpy curve and melt bookkeeping of a material. The caller has validated the inputs. */
export function buildMaterial(input: MaterialInput): Material {
  const { density, specificHeat, melt } = input;
  const knotSet = new Set<number>(specificHeat.tK);
  if (melt) {
    knotSet.add(melt.solidusK);
    knotSet.add(melt.liquidusK);
  }
  // bracket the knots with one sensible-only segment at each end, so extrapolation beyond them never carries latent
  // heat and a constant c_p (a single table row) still has a segment
  const inner = [...knotSet].sort((a, b) => a - b);
  const temps = [inner[0]! - BRACKET_K, ...inner, inner[inner.length - 1]! + BRACKET_K];
  const latentDensity = melt && melt.liquidusK > melt.solidusK
    ? (density * melt.latentJPerKg) / (melt.liquidusK - melt.solidusK)
    : 0;
  const inMush = (a: number, b: number) => melt !== undefined && a >= melt.solidusK && b <= melt.liquidusK;
  const sensible = (t: number) => density * evalTable(specificHeat, t);

  const tK: number[] = [temps[0]!];
  const h: number[] = [0];
  const cLeft: number[] = [];
  const cRight: number[] = [];
  let hSolidus = Number.NaN;
  let hLiquidus = Number.NaN;
  const isothermalJump = melt !== undefined && melt.liquidusK === melt.solidusK;
  const atKnot = (t: number, hNow: number) => {
    if (!melt) return hNow;
    if (t === melt.solidusK) {
      hSolidus = hNow;
      if (isothermalJump) {
        const jumped = hNow + density * melt.latentJPerKg;
        cLeft.push(sensible(t));
        cRight.push(sensible(t));
        tK.push(t);
        h.push(jumped);
        hLiquidus = jumped;
        return jumped;
      }
    }
    if (t === melt.liquidusK && !isothermalJump) hLiquidus = hNow;
    return hNow;
  };
  let hNow = 0; // the first knot is the lower bracket: never a melt point
  for (let i = 0; i + 1 < temps.length; i++) {
    const a = temps[i]!;
    const b = temps[i + 1]!;
    const extra = inMush(a, b) ? latentDensity : 0;
    const cl = sensible(a) + extra;
    const cr = sensible(b) + extra;
    cLeft.push(cl);
    cRight.push(cr);
    hNow += ((b - a) * (cl + cr)) / 2;
    tK.push(b);
    h.push(hNow);
    hNow = atKnot(b, hNow);
  }
  const enthalpy: EnthalpyCurve = {
    tK: Float64Array.from(tK),
    h: Float64Array.from(h),
    cLeft: Float64Array.from(cLeft),
    cRight: Float64Array.from(cRight),
    kinks: melt ? Float64Array.of(hSolidus, hLiquidus) : new Float64Array(0),
  };
  return {
    name: input.name,
    title: input.title,
    conductivity: input.conductivity,
    density,
    specificHeat,
    enthalpy,
    melt: melt ? { ...melt, hSolidus, hLiquidus, ...meltConductivities(input.conductivity, melt.solidusK, melt.liquidusK) } : undefined,
    limits: input.limits,
    sources: input.sources,
    ...(input.from !== undefined ? { from: input.from } : {}),
  };
}

function meltConductivities(k: Table, solidusK: number, liquidusK: number) {
  let below = solidusK;
  let above = liquidusK;
  let foundAbove = false;
  for (const t of k.tK) {
    if (t <= solidusK) below = t;
    if (t >= liquidusK && !foundAbove) { above = t; foundAbove = true; }
  }
  return { kSolid: evalTable(k, below), kLiquid: evalTable(k, above), solidTableK: below, liquidTableK: above };
}

/**
 * k (W·m⁻¹·K⁻¹) of a cell with enthalpy hJ and temperature tK. For a material that melts, the table is read on the
 * solid side up to its last row at or below the solidus and on the liquid side from its first row at or above the
 * liquidus (a ramp the table draws across the melt is not used), and a two-phase cell takes the series mix below, so k
 * is continuous in H through the whole phase change. A point value, for the lumped network (lumped/lumped.ts); the
 * grid's half cells read k by temperature through the melt instead (grid/kirchhoff.ts).
 */
export function conductivityAt(material: Material, hJ: number, tK: number): number {
  const melt = material.melt;
  const table = material.conductivity;
  if (melt === undefined) return table.y.length === 1 ? table.y[0]! : evalTable(table, tK);
  if (hJ <= melt.hSolidus) return evalTable(table, Math.min(tK, melt.solidTableK));
  if (hJ >= melt.hLiquidus) return evalTable(table, Math.max(tK, melt.liquidTableK));
  return mushConductivity(melt, liquidFractionOf(material, hJ, tK));
}

/**
 * Conductivity of a two-phase cell with liquid fraction f: its solid and liquid parts in series across the cell,
 * 1/k = (1 − f)/k_s + f/k_l (a plane front parallel to the layers, as in a 1D stack). conductivityAt()'s reading of a
 * two-phase lumped node; the grid's half cells read the same mix by temperature (grid/kirchhoff.ts meltConductivity).
 */
export function mushConductivity(melt: Melt, liquidFraction: number): number {
  return 1 / ((1 - liquidFraction) / melt.kSolid + liquidFraction / melt.kLiquid);
}

/**
 * The same material with its volumetric enthalpy measured from `originJ` (J/m³): every enthalpy of the curve and of
 * the melt moves by −originJ, nothing else changes. The solver measures each cell from its initial state, so the
 * stored energy it books is a difference of small numbers and round-off scales with what moves, not with the
 * arbitrary zero of the curve (a cell at rest would otherwise book ε·H of noise per step).
 */
export function withEnthalpyOrigin(material: Material, originJ: number): Material {
  const e = material.enthalpy;
  const shift = (a: Float64Array) => Float64Array.from(a, (v) => v - originJ);
  const melt = material.melt;
  const moved = (c: EnthalpyCurve): EnthalpyCurve => ({ tK: c.tK, h: shift(c.h), cLeft: c.cLeft, cRight: c.cRight, kinks: shift(c.kinks) });
  return {
    ...material,
    enthalpy: moved(e),
    // no `lever` key unless there is a lever curve: a melt record given `lever: undefined` made the 40-cell demo solve
    // ~15 % slower (measured, bench/solver.ts demo; the record is read per cell and per step), a cost that came in with
    // the melt ramp and stayed after it for every run without one
    melt: melt === undefined ? undefined : melt.lever === undefined
      ? { ...melt, hSolidus: melt.hSolidus - originJ, hLiquidus: melt.hLiquidus - originJ }
      : { ...melt, hSolidus: melt.hSolidus - originJ, hLiquidus: melt.hLiquidus - originJ, lever: moved(melt.lever) },
  };
}

/** H(T), J/m³, for T in K. */
/**
 * The curve on which a temperature given in the file is read: the material's own, as written. Under a melt ramp
 * (melt-ramp.ts) that is the unramped curve, Melt.lever: the ramp moves T(H) by less than δ near the melt, and a
 * temperature within δ of it must keep the phase the file gave it (an initial temperature 1e-6 K above an isothermal
 * melt read on the ramped curve was half liquid; on the curve as written it is liquid, as without the ramp).
 */
export function writtenCurve(material: Material): EnthalpyCurve {
  return material.melt?.lever ?? material.enthalpy;
}

export function enthalpyAt(curve: EnthalpyCurve, tK: number): number {
  const { tK: xs, h, cLeft, cRight } = curve;
  const last = xs.length - 1;
  if (tK <= xs[0]!) return h[0]! + cLeft[0]! * (tK - xs[0]!);
  if (tK >= xs[last]!) return h[last]! + cRight[last - 1]! * (tK - xs[last]!);
  let i = 0;
  while (i + 1 < last && xs[i + 1]! <= tK) i++;
  // exactly at an isothermal melt point the search has passed the jump, so H(T) takes the liquid side there.
  const width = xs[i + 1]! - xs[i]!;
  if (width === 0) return h[i]!;
  const d = tK - xs[i]!;
  const slope = (cRight[i]! - cLeft[i]!) / width;
  return h[i]! + cLeft[i]! * d + 0.5 * slope * d * d;
}

/**
 * Within a segment of capacity c_l + s·d: the temperature step d (K) that takes up ΔH (J/m³), the root of
 * ½·s·d² + c_l·d − ΔH = 0 in the cancellation-free form d = 2ΔH/(c_l + r), r = √(c_l² + 2·s·ΔH), to out[0]; and dT/dH
 * there, 1/(c_l + s·d) = 1/r, to out[1]. Both come from one division, 1/(r·(c_l + r)), where two chained ones were
 * (a division costs several multiplications). With no capacity left at the end (r = 0, a curve no valid material
 * has) the two-division form. temperaturesOf() writes the same operations out.
 */
function quadraticStep(cl: number, slope: number, dh: number, out: Float64Array): void {
  const root = Math.sqrt(Math.max(cl * cl + 2 * slope * dh, 0));
  const sum = cl + root;
  if (root > 0) {
    const q = 1 / (root * sum);
    out[0] = 2 * dh * root * q;
    out[1] = sum * q;
  } else {
    const d = (2 * dh) / sum;
    out[0] = d;
    out[1] = 1 / (cl + slope * d);
  }
}

/**
 * T(H) in K, and dT/dH (K·m³/J) written to `out[0]`, `out[1]`. Zero slope on an isothermal jump.
 * `hint` is the segment index where the search starts (the previous answer for this cell); the new index is returned.
 * Overwrites `out[0..1]`. Allocates nothing.
 */
export function temperatureOf(curve: EnthalpyCurve, hJ: number, hint: number, out: Float64Array): number {
  const { tK: xs, h, cLeft, cRight } = curve;
  const last = xs.length - 1;
  if (hJ <= h[0]!) {
    const c = cLeft[0]!;
    out[0] = xs[0]! + (hJ - h[0]!) / c;
    out[1] = 1 / c;
    return -1;
  }
  if (hJ >= h[last]!) {
    const c = cRight[last - 1]!;
    out[0] = xs[last]! + (hJ - h[last]!) / c;
    out[1] = 1 / c;
    return last;
  }
  let i = hint < 0 ? 0 : hint >= last ? last - 1 : hint;
  while (i > 0 && hJ < h[i]!) i--;
  while (i + 1 < last && hJ >= h[i + 1]!) i++;
  const width = xs[i + 1]! - xs[i]!;
  if (width === 0) {
    out[0] = xs[i]!;
    out[1] = 0;
    return i;
  }
  const cl = cLeft[i]!;
  const slope = (cRight[i]! - cl) / width;
  const dh = hJ - h[i]!;
  // root of ½·s·d² + c_l·d − ΔH = 0 in the cancellation-free form, d = 2ΔH/(c_l + r), r = √(c_l² + 2·s·ΔH), and the
  // capacity there c_l + s·d = r: both from one division (quadraticStep)
  quadraticStep(cl, slope, dh, out);
  out[0] = xs[i]! + out[0]!;
  return i;
}

/**
 * Each segment's capacity slope (cRight − cLeft)/width of an enthalpy curve, J·m⁻³·K⁻² (0 on an isothermal jump): the
 * division temperatureOf() does per call, done once per curve for temperaturesOf().
 */
export function curveSlopes(curve: EnthalpyCurve): Float64Array {
  const { tK: xs, cLeft, cRight } = curve;
  const slopes = new Float64Array(Math.max(0, xs.length - 1));
  for (let i = 0; i + 1 < xs.length; i++) {
    const width = xs[i + 1]! - xs[i]!;
    slopes[i] = width === 0 ? 0 : (cRight[i]! - cLeft[i]!) / width;
  }
  return slopes;
}

/**
 * temperatureOf() for the cells from ≤ i < to that share one curve, in one loop with the curve's arrays held: T[i + 1]
 * and tau[i + 1] (dT/dH) from U[i + 1], hint[i] the segment where cell i's search starts and ends. `slopes` is
 * curveSlopes(curve). The arithmetic is temperatureOf()'s, operation for operation, so the results are the same to the
 * bit. Overwrites T[from + 1 .. to], tau[from + 1 .. to], hint[from .. to − 1]. Allocates nothing.
 */
export function temperaturesOf(curve: EnthalpyCurve, slopes: Float64Array, U: Float64Array, from: number, to: number,
  hint: Int32Array, T: Float64Array, tau: Float64Array): void {
  const { tK: xs, h, cLeft } = curve;
  const last = xs.length - 1;
  const hFirst = h[0]!;
  const hLast = h[last]!;
  for (let c = from; c < to; c++) {
    const j = c + 1;
    const hJ = U[j]!;
    if (hJ <= hFirst) {
      const cl = cLeft[0]!;
      T[j] = xs[0]! + (hJ - hFirst) / cl;
      tau[j] = 1 / cl;
      hint[c] = -1;
      continue;
    }
    if (hJ >= hLast) {
      const cr = curve.cRight[last - 1]!;
      T[j] = xs[last]! + (hJ - hLast) / cr;
      tau[j] = 1 / cr;
      hint[c] = last;
      continue;
    }
    const start = hint[c]!;
    let i = start < 0 ? 0 : start >= last ? last - 1 : start;
    while (i > 0 && hJ < h[i]!) i--;
    while (i + 1 < last && hJ >= h[i + 1]!) i++;
    hint[c] = i;
    const x0 = xs[i]!;
    if (xs[i + 1]! === x0) {
      T[j] = x0;
      tau[j] = 0;
      continue;
    }
    // quadraticStep() written out (the loop's hot path)
    const cl = cLeft[i]!;
    const slope = slopes[i]!;
    const dh = hJ - h[i]!;
    const root = Math.sqrt(Math.max(cl * cl + 2 * slope * dh, 0));
    const sum = cl + root;
    if (root > 0) {
      const q = 1 / (root * sum);
      T[j] = x0 + 2 * dh * root * q;
      tau[j] = sum * q;
    } else {
      const d = (2 * dh) / sum;
      T[j] = x0 + d;
      tau[j] = 1 / (cl + slope * d);
    }
  }
}

const leverScratch = new Float64Array(2);

/** Liquid fraction in [0, 1] from H (J/m³) and its T (K): linear in T over the mushy range, linear in H on a jump. */
export function liquidFractionOf(material: Material, hJ: number, tK: number): number {
  const melt = material.melt;
  if (!melt) return 0;
  if (hJ <= melt.hSolidus) return 0;
  if (hJ >= melt.hLiquidus) return 1;
  if (melt.liquidusK === melt.solidusK) return (hJ - melt.hSolidus) / (melt.hLiquidus - melt.hSolidus);
  // with a melt ramp tK is the ramped temperature: the lever rule reads the unramped curve at the same enthalpy
  let t = tK;
  if (melt.lever) { temperatureOf(melt.lever, hJ, 0, leverScratch); t = leverScratch[0]!; }
  return (t - melt.solidusK) / (melt.liquidusK - melt.solidusK);
}

/** Smallest unit of the melt and freeze margins (marginSpan), in kelvin of sensible heat: any positive width keeps them finite. */
const MARGIN_FLOOR_K = 1;

/**
 * The unit of a melting material's melt and freeze margins, (H − H_liquidus)/span and (H − H_solidus)/span, J/m³: its
 * melt's enthalpy span, or MARGIN_FLOOR_K of sensible heat when that is larger (an isothermal melt with zero latent
 * heat has no span, and a margin divided by it would be infinite).
 */
export function marginSpan(material: Material): number {
  const melt = material.melt!;
  return Math.max(melt.hLiquidus - melt.hSolidus, sensibleCapacity(material, melt.solidusK) * MARGIN_FLOOR_K);
}

/** Sensible volumetric heat capacity ρ·c_p(T), J·m⁻³·K⁻¹, used to scale enthalpy errors to kelvin. */
export function sensibleCapacity(material: Material, tK: number): number {
  return material.density * evalTable(material.specificHeat, tK);
}
