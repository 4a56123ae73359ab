/**
 * A LiCl–KCl mixture given by composition → a Material. Melting range and latent heat from the liquidus model
 * (salt.ts); density by ideal molar-volume mixing of the pure liquids at 450 °C; c_p by the Kopp (Neumann–Kopp) rule
 * on molar heat capacities; k as the LiCl–KCl eutectic's library entry (no measurements by composition were found).
 *
 * Approximation: the enthalpy model (material.ts) spreads latent heat linearly between solidus and liquidus. The lever
 * rule (leverLiquidFraction) releases a share (1 − x₀)/(1 − x_e) of it isothermally at the eutectic and the rest along
 * a curve up to the liquidus; the linear ramp keeps the total latent heat, the solidus and the liquidus exact.
 */
import type { FieldError } from './field-errors.ts';
import { libraryMaterial } from './library.ts';
import { buildMaterial, type Material } from '../physics/material.ts';
import type { SaltMixtureFile } from './rig-schema.ts';
import { leverLiquidFraction, liquidusModel, meltingRange, mixtureLatentJPerKg, molarMass, moleFromMass } from '../physics/salt.ts';
import { liclKclFacts, saltData } from '../physics/salt-data.ts';
import { cToK } from '../physics/units.ts';

export const saltMixtureDefaults = {
  /** How far the fractions may miss a sum of 1 (rounded percentages such as 44/56 are exact; 1/3 + 2/3 typed as decimals are not). */
  sumTolerance: 1e-3,
  /** A melting range narrower than this, K, is treated as isothermal (at the eutectic composition). */
  isothermalBelowK: 0.01,
  /** Offset, K, of the k and c_p table rows below the solidus and above the liquidus (rows must be distinct). */
  tableOffsetK: 1,
  /** Temperature of the solid c_p row taken near 600 K, K. */
  solid600K: 600,
} as const;

/** The LiCl mole fraction of a mixture, or an error at `path`. */
export function liclMoleFraction(spec: SaltMixtureFile, path: string, errors: FieldError[]): number | undefined {
  const sum = spec.LiCl + spec.KCl;
  if (Math.abs(sum - 1) > saltMixtureDefaults.sumTolerance) {
    errors.push({ path, message: `LiCl + KCl must add up to 1, got ${spec.LiCl} + ${spec.KCl} = ${sum}` });
    return undefined;
  }
  const share = spec.LiCl / sum;
  return spec.basis === 'mass' ? moleFromMass(share) : share;
}

/** The mixture's melting data: solidus, liquidus (K) and latent heat (J/kg). */
export function mixtureMelt(xLiCl: number) {
  const range = meltingRange(xLiCl);
  const narrow = range.liquidusK - range.solidusK < saltMixtureDefaults.isothermalBelowK;
  return { solidusK: range.solidusK, liquidusK: narrow ? range.solidusK : range.liquidusK, latentJPerKg: mixtureLatentJPerKg(xLiCl) };
}

/** Builds the Material of a LiCl–KCl mixture with LiCl mole fraction x. */
export function saltMixtureMaterial(name: string, xLiCl: number, title?: string): Material {
  const { LiCl, KCl } = saltData;
  const melt = mixtureMelt(xLiCl);
  const m = molarMass(xLiCl);
  const t = liclKclFacts.densityAtK;
  const volume = (xLiCl * LiCl.molarMassKgPerMol) / (LiCl.liquidDensity.a - LiCl.liquidDensity.b * t)
    + ((1 - xLiCl) * KCl.molarMassKgPerMol) / (KCl.liquidDensity.a - KCl.liquidDensity.b * t);
  const kopp = (key: 'cpSolid298' | 'cpSolid600' | 'cpLiquid') => (xLiCl * LiCl[key] + (1 - xLiCl) * KCl[key]) / m;
  const eutectic = libraryMaterial('licl-kcl-eutectic')?.melt;
  if (!eutectic) throw new Error('materials/licl-kcl-eutectic.json has no melt block');
  const { tableOffsetK: d, solid600K } = saltMixtureDefaults;
  const below = melt.solidusK - d;
  const above = melt.liquidusK + d;
  return buildMaterial({
    name,
    title: title ?? `LiCl–KCl, ${(100 * xLiCl).toFixed(1)} mol % LiCl (liquidus model)`,
    conductivity: { tK: Float64Array.of(below, above), y: Float64Array.of(eutectic.kSolid, eutectic.kLiquid) },
    density: m / volume,
    specificHeat: {
      tK: Float64Array.of(cToK(25), solid600K, below, above),
      y: Float64Array.of(kopp('cpSolid298'), kopp('cpSolid600'), kopp('cpSolid600'), kopp('cpLiquid')),
    },
    melt,
    limits: [],
    sources: {
      melt: `computed: regular-solution liquidus, Ω = ${(liquidusModel().omegaJPerMol / 1000).toFixed(2)} kJ/mol fitted to the 352 °C eutectic, from the pure salts' melting points and latent heats (materials/licl.json, materials/kcl.json); latent heat from the DSC fit of Korin & Soifer, J. Thermal Analysis 50 (1997); linear ramp between solidus and liquidus in place of the lever rule`,
      rho_kg_m3: 'computed: ideal molar-volume mixing of the pure liquids at 450 °C (Janz density equations, from memory)',
      cp_J_kgK: 'computed: Kopp rule on molar heat capacities (LiCl: Wikipedia "Lithium chloride"; KCl: you-iggy tables; 600 K and liquid values from memory, NIST-JANAF)',
      k_W_mK: 'as materials/licl-kcl-eutectic.json (from memory: solid 2.0, liquid 0.45 W/m·K)',
    },
  });
}

/** Liquid fraction by mass of the mixture at T (°C) by the lever rule, for tables and the CLI. */
export const mixtureLiquidFraction = (xLiCl: number, tC: number): number => leverLiquidFraction(xLiCl, cToK(tC));
