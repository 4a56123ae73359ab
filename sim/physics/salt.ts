/**
 * LiCl–KCl mixtures: composition → eutectic, solidus, liquidus and the liquid fraction between them.
 *
 * Model: a simple eutectic with no solid solubility (the solids are pure LiCl and pure KCl) and a regular-solution
 * liquid with one symmetric interaction parameter Ω, RT·ln γᵢ = Ω·(1 − xᵢ)². Equilibrium of pure solid i with the
 * liquid (the Schröder–van Laar equation with the regular-solution activity; constant heat of fusion, Δc_p neglected):
 *   ln(xᵢ·γᵢ) = −(ΔHᵢ/R)·(1/T − 1/Tᵢ)   →   T = (ΔHᵢ + Ω·(1 − xᵢ)²) / (ΔHᵢ/Tᵢ − R·ln xᵢ),
 * one branch per salt; the liquidus is the higher of the two, the eutectic is where they cross. Ω is fitted so the
 * eutectic lies at the measured 352 °C; at xᵢ = 1 each branch gives Tᵢ exactly. The liquid fraction between solidus and
 * liquidus follows from the lever rule with the liquid on the liquidus (moles: f = (1 − x₀)/(1 − x_l) on the LiCl side).
 * The pure salts' Tᵢ and ΔHᵢ come from materials/licl.json and materials/kcl.json.
 */
import { libraryFile } from '../scenario/library.ts';
import { GAS_CONSTANT_J_MOLK, liclKclFacts, saltData } from './salt-data.ts';
import { cToK } from './units.ts';

export const saltDefaults = {
  /** Bisection steps: halving a bracket of width 1 (or 60 kJ/mol) 80 times reaches round-off. */
  bisectionSteps: 80,
  /** Search bracket of Ω, J/mol: an ideal solution (0) puts the eutectic ≈140 K too high; −60 kJ/mol far too low. */
  omegaLowJPerMol: -60000,
  omegaHighJPerMol: 0,
} as const;

export interface PureSalt { readonly meltK: number; /** J/mol */ readonly latentJPerMol: number }

function pure(name: 'licl' | 'kcl', key: 'LiCl' | 'KCl'): PureSalt {
  const melt = libraryFile(name)?.melt;
  if (!melt) throw new Error(`materials/${name}.json has no melt block`);
  return { meltK: cToK(melt.solidus_C), latentJPerMol: melt.latent_J_kg * saltData[key].molarMassKgPerMol };
}

/** The two end members, read once from the library. */
export const pureSalts = (): { readonly LiCl: PureSalt; readonly KCl: PureSalt } => ({ LiCl: pure('licl', 'LiCl'), KCl: pure('kcl', 'KCl') });

/** Temperature, K, at which pure solid `s` is in equilibrium with a liquid holding mole fraction x of it. */
export function branchK(s: PureSalt, x: number, omegaJPerMol: number): number {
  if (x <= 0) return 0;
  const y = 1 - x;
  return (s.latentJPerMol + omegaJPerMol * y * y) / (s.latentJPerMol / s.meltK - GAS_CONSTANT_J_MOLK * Math.log(x));
}

function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  const fa = f(a);
  for (let i = 0; i < saltDefaults.bisectionSteps; i++) {
    const m = 0.5 * (a + b);
    if ((f(m) > 0) === (fa > 0)) a = m;
    else b = m;
  }
  return 0.5 * (a + b);
}

export interface EutecticPoint { readonly xLiCl: number; readonly tK: number }

/** The eutectic for an interaction parameter Ω: the crossing of the two branches. */
export function eutecticFor(omegaJPerMol: number, salts = pureSalts()): EutecticPoint {
  const gap = (x: number) => branchK(salts.LiCl, x, omegaJPerMol) - branchK(salts.KCl, 1 - x, omegaJPerMol);
  const x = bisect(gap, 1e-9, 1 - 1e-9);
  return { xLiCl: x, tK: branchK(salts.LiCl, x, omegaJPerMol) };
}

export interface LiquidusModel {
  readonly salts: { readonly LiCl: PureSalt; readonly KCl: PureSalt };
  /** Fitted interaction parameter, J/mol. */
  readonly omegaJPerMol: number;
  readonly eutectic: EutecticPoint;
}

let fitted: LiquidusModel | undefined;

/** The model with Ω fitted so the eutectic temperature is the measured one (fitted once). */
export function liquidusModel(): LiquidusModel {
  if (fitted) return fitted;
  const salts = pureSalts();
  const omega = bisect((w) => eutecticFor(w, salts).tK - liclKclFacts.eutecticK, saltDefaults.omegaLowJPerMol, saltDefaults.omegaHighJPerMol);
  fitted = { salts, omegaJPerMol: omega, eutectic: eutecticFor(omega, salts) };
  return fitted;
}

export interface MeltingRange { readonly solidusK: number; readonly liquidusK: number; readonly eutectic: EutecticPoint }

/** Solidus and liquidus, K, of a mixture with LiCl mole fraction x in [0, 1]. */
export function meltingRange(xLiCl: number, model = liquidusModel()): MeltingRange {
  const { salts, omegaJPerMol: w, eutectic } = model;
  if (xLiCl >= 1) return { solidusK: salts.LiCl.meltK, liquidusK: salts.LiCl.meltK, eutectic };
  if (xLiCl <= 0) return { solidusK: salts.KCl.meltK, liquidusK: salts.KCl.meltK, eutectic };
  const liquidusK = xLiCl >= eutectic.xLiCl ? branchK(salts.LiCl, xLiCl, w) : branchK(salts.KCl, 1 - xLiCl, w);
  return { solidusK: eutectic.tK, liquidusK: Math.max(liquidusK, eutectic.tK), eutectic };
}

/**
 * Liquid fraction by mass at T (K) for a mixture of LiCl mole fraction x₀ (0 < x₀ < 1), by the lever rule: the liquid
 * lies on the liquidus branch of the primary solid, the solid is that pure salt. 0 below the eutectic temperature (all
 * solid; the eutectic itself melts isothermally), 1 at and above the liquidus.
 */
export function leverLiquidFraction(xLiCl: number, tK: number, model = liquidusModel()): number {
  const { salts, omegaJPerMol: w, eutectic } = model;
  const range = meltingRange(xLiCl, model);
  if (tK >= range.liquidusK) return 1;
  if (tK < eutectic.tK || xLiCl <= 0 || xLiCl >= 1) return 0;
  const licl = xLiCl >= eutectic.xLiCl;
  // liquid composition on the primary branch at T
  const xl = licl
    ? bisect((x) => branchK(salts.LiCl, x, w) - tK, eutectic.xLiCl, 1)
    : 1 - bisect((y) => branchK(salts.KCl, y, w) - tK, 1 - eutectic.xLiCl, 1);
  const moles = licl ? (1 - xLiCl) / (1 - xl) : xLiCl / xl;
  return (moles * molarMass(xl)) / molarMass(xLiCl);
}

/** Molar mass, kg/mol, of a mixture with LiCl mole fraction x. */
export const molarMass = (xLiCl: number): number =>
  xLiCl * saltData.LiCl.molarMassKgPerMol + (1 - xLiCl) * saltData.KCl.molarMassKgPerMol;

/** LiCl mole fraction from a LiCl mass fraction. */
export function moleFromMass(wLiCl: number): number {
  const nLi = wLiCl / saltData.LiCl.molarMassKgPerMol;
  const nK = (1 - wLiCl) / saltData.KCl.molarMassKgPerMol;
  return nLi / (nLi + nK);
}

/**
 * Heat of fusion of the mixture, J/kg: Korin & Soifer's DSC fit inside its range 0.368 ≤ x ≤ 0.812; outside it, linear
 * in x between the fit's end value and the pure salt's (the fit's ends lie within 1–3 % of the pure salts anyway).
 */
export function mixtureLatentJPerKg(xLiCl: number, model = liquidusModel()): number {
  const { c0, c1, c2, xLow, xHigh } = liclKclFacts.heatOfFusionFit;
  const fit = (x: number) => (c0 + c1 * x + c2 * x * x) * 1e3;
  let jPerMol: number;
  if (xLiCl < xLow) jPerMol = model.salts.KCl.latentJPerMol + ((fit(xLow) - model.salts.KCl.latentJPerMol) * xLiCl) / xLow;
  else if (xLiCl > xHigh) jPerMol = model.salts.LiCl.latentJPerMol + ((fit(xHigh) - model.salts.LiCl.latentJPerMol) * (1 - xLiCl)) / (1 - xHigh);
  else jPerMol = fit(xLiCl);
  return jPerMol / molarMass(xLiCl);
}
