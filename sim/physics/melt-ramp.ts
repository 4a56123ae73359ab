/**
 * The melt ramp: the enthalpy curve of a melting material with its latent capacity smoothed over ±δ kelvin at the
 * solidus and the liquidus, so H(T) has no kink there (its capacity dH/dT is continuous).
 *
 * The latent capacity of the enthalpy method, ρL/(T_l − T_s) on [T_s, T_l] (a Dirac ρL·δ(T − T_m) at an isothermal
 * melt), is convolved with a kernel of half-width δ: a box of width 2δ for a melting range, a hat for an isothermal
 * melt (the box would leave a jump in the capacity). A convolution keeps the integral, and a symmetric kernel keeps a
 * linear function, so H(T) is unchanged at and beyond T_s − δ and T_l + δ and, when T_l − T_s ≥ 2δ, on
 * [T_s + δ, T_l − δ]: the ramp moves latent heat by at most δ in temperature, it neither adds nor removes any. What a
 * cell reports is unchanged by definition: its liquid fraction is read from the unramped curve at the same enthalpy
 * (Melt.lever), so "solid" and "fully liquid" are the same enthalpies as without the ramp; only T(H) moves, by less
 * than δ, inside the two ramps.
 *
 * Why: a cell crossing a kink of T(H) inside a step makes its rate dH/dt jump, so the step's embedded error estimate
 * (third order, sees a smooth solution) rejects the step; on fine grids many cells cross one each, and the cost then
 * grows faster than the grid (issue 8). A kink smoothed over ±δ is crossed smoothly once the step resolves the time a
 * cell takes to cross 2δ.
 */
import type { EnthalpyCurve, Material } from './material.ts';
import { evalTable } from './table.ts';

export const meltRampDefaults = {
  /** Width of the sensible-only end segments of the curve, K (as in buildMaterial: any positive width serves). */
  bracketK: 1000,
} as const;

/** Latent capacity (J·m⁻³·K⁻¹) of the ramped melt at T (K): a trapezoid (melting range) or a hat (isothermal). */
function latentCapacity(solidusK: number, liquidusK: number, latentJPerM3: number, rampK: number, tK: number): number {
  const width = liquidusK - solidusK;
  if (width === 0) return (latentJPerM3 / rampK) * Math.max(0, 1 - Math.abs(tK - solidusK) / rampK);
  const overlap = Math.max(0, Math.min(tK + rampK, liquidusK) - Math.max(tK - rampK, solidusK));
  return (latentJPerM3 / width) * (overlap / (2 * rampK));
}

/**
 * The material with its melt smoothed over ±rampK kelvin (rampK > 0), or the material itself when it does not melt or
 * rampK is 0. The enthalpy origin is the one buildMaterial() uses (call before withEnthalpyOrigin()). Melt.hSolidus and
 * hLiquidus keep their values (they are enthalpies, which the ramp does not move), and Melt.lever holds the unramped
 * curve from which the liquid fraction is read. Capacity jumps no longer exist, so the curve lists no kinks.
 */
export function withMeltRamp(material: Material, rampK: number): Material {
  const melt = material.melt;
  if (melt === undefined || rampK === 0 || melt.lever !== undefined) return material;
  const { solidusK, liquidusK } = melt;
  const latent = material.density * melt.latentJPerKg;
  const sensible = (t: number) => material.density * evalTable(material.specificHeat, t);
  const capacity = (t: number) => sensible(t) + latentCapacity(solidusK, liquidusK, latent, rampK, t);
  const knots = new Set<number>(material.specificHeat.tK);
  for (const t of [solidusK - rampK, solidusK + rampK, liquidusK - rampK, liquidusK + rampK]) knots.add(t);
  if (liquidusK === solidusK) knots.add(solidusK);
  const inner = [...knots].sort((a, b) => a - b);
  const original = material.enthalpy;
  // the same lower bracket as the unramped curve, so both curves measure H from the same zero
  const lowK = original.tK[0]!;
  const temps = [lowK, ...inner.filter((t) => t > lowK), inner[inner.length - 1]! + meltRampDefaults.bracketK];
  const tK = new Float64Array(temps.length);
  const h = new Float64Array(temps.length);
  const cLeft = new Float64Array(temps.length - 1);
  const cRight = new Float64Array(temps.length - 1);
  tK[0] = temps[0]!;
  h[0] = original.h[0]!;
  for (let i = 0; i + 1 < temps.length; i++) {
    const a = temps[i]!;
    const b = temps[i + 1]!;
    // the capacity is continuous and linear between consecutive knots, so its end values define the segment
    cLeft[i] = capacity(a);
    cRight[i] = capacity(b);
    tK[i + 1] = b;
    h[i + 1] = h[i]! + ((b - a) * (cLeft[i]! + cRight[i]!)) / 2;
  }
  const enthalpy: EnthalpyCurve = { tK, h, cLeft, cRight, kinks: new Float64Array(0) };
  return { ...material, enthalpy, melt: { ...melt, rampK, lever: original } };
}
