/**
 * A salt-soaked separator: a porous matrix (glass cloth, a pressed MgO or BN powder) whose pores a salt fills to a
 * share `fill`, the rest being gas (air). Volume fractions: matrix 1 − φ, salt φ·fill, gas φ·(1 − fill).
 *   ρ = Σ vᵢρᵢ and ρc_p = Σ vᵢρᵢc_pᵢ (exact volume weighting; the gas's mass is neglected, < 0.1 % of any salt's);
 *   latent heat per kilogram = the salt's × its mass fraction v_s·ρ_s/ρ; solidus and liquidus are the salt's;
 *   k by effective-medium theory (Landauer 1952; Bruggeman), Σ vᵢ·(kᵢ − k)/(kᵢ + 2k) = 0, as given by Wang, Carson,
 *   North & Cleland, Int. J. Heat Mass Transfer 49 (2006) 3075.
 * Why effective-medium theory: in a cloth or a pressed powder at separator porosities (0.4–0.7) both the matrix and
 * the salt form connected paths, so neither is a dispersed phase; the rule treats the phases alike and takes a third
 * (gas) without nesting, while Maxwell–Eucken would need one phase chosen as continuous (it then gives one of the
 * Hashin–Shtrikman bounds). It always lies between the series and parallel bounds.
 * k is tabulated with the salt solid below the solidus and liquid above the liquidus; inside the melt the material
 * model mixes those two values by liquid fraction (material.ts), so k follows the salt's state.
 */
import { airConductivity } from './air.ts';
import { buildMaterial, evalTable, type Material, type Table } from './material.ts';

export const compositeDefaults = {
  /** Bisection steps on ln k: halving a bracket of a few decades 100 times reaches round-off. */
  bisectionSteps: 100,
  /** Offset, K, of the k rows below the solidus and above the liquidus (rows must be distinct for an isothermal salt). */
  tableOffsetK: 0.5,
} as const;

export interface Phase { readonly fraction: number; /** W·m⁻¹·K⁻¹ */ readonly k: number }

/** Effective-medium conductivity of phases with volume fractions summing to 1 (empty phases are ignored). */
export function effectiveMediumConductivity(phases: readonly Phase[]): number {
  const used = phases.filter((p) => p.fraction > 0);
  if (used.length === 1) return used[0]!.k;
  const residual = (k: number) => used.reduce((s, p) => s + (p.fraction * (p.k - k)) / (p.k + 2 * k), 0);
  let lo = Math.log(Math.min(...used.map((p) => p.k)));
  let hi = Math.log(Math.max(...used.map((p) => p.k)));
  // the residual falls monotonically in k: positive at the smallest kᵢ, negative at the largest
  for (let i = 0; i < compositeDefaults.bisectionSteps; i++) {
    const mid = 0.5 * (lo + hi);
    if (residual(Math.exp(mid)) > 0) lo = mid;
    else hi = mid;
  }
  return Math.exp(0.5 * (lo + hi));
}

/** Parallel (upper, Wiener) and series (lower) bounds of the conductivity. */
export const parallelBound = (phases: readonly Phase[]): number => phases.reduce((s, p) => s + p.fraction * p.k, 0);
export const seriesBound = (phases: readonly Phase[]): number => 1 / phases.reduce((s, p) => s + (p.fraction > 0 ? p.fraction / p.k : 0), 0);

export interface CompositeInput {
  readonly name: string;
  readonly matrix: Material;
  readonly salt: Material;
  readonly porosity: number;
  readonly fill: number;
}

/** Volume fractions of matrix, salt and gas. */
export function volumeFractions(porosity: number, fill: number) {
  return { matrix: 1 - porosity, salt: porosity * fill, gas: porosity * (1 - fill) };
}

const union = (...tables: Table[]): number[] => [...new Set(tables.flatMap((t) => [...t.tK]))].sort((a, b) => a - b);

/** Builds the composite Material. The salt must melt (have melt data); the matrix is read as a solid throughout. */
export function compositeMaterial(input: CompositeInput): Material {
  const { matrix, salt } = input;
  const melt = salt.melt;
  if (!melt) throw new Error(`composite ${input.name}: the salt ${salt.name} has no melt data`);
  const v = volumeFractions(input.porosity, input.fill);
  const density = v.matrix * matrix.density + v.salt * salt.density;
  const saltMassFraction = (v.salt * salt.density) / density;

  const cpRows = union(matrix.specificHeat, salt.specificHeat);
  const cp = cpRows.map((t) => (v.matrix * matrix.density * evalTable(matrix.specificHeat, t) + v.salt * salt.density * evalTable(salt.specificHeat, t)) / density);

  const d = compositeDefaults.tableOffsetK;
  const below = melt.solidusK - d;
  const above = melt.liquidusK + d;
  const kRows = [...union(matrix.conductivity, salt.conductivity, airConductivity).filter((t) => t < below || t > above), below, above].sort((a, b) => a - b);
  const k = kRows.map((t) => {
    const kSalt = t <= below ? evalTable(salt.conductivity, Math.min(t, melt.solidTableK)) : evalTable(salt.conductivity, Math.max(t, melt.liquidTableK));
    return effectiveMediumConductivity([
      { fraction: v.matrix, k: evalTable(matrix.conductivity, t) },
      { fraction: v.salt, k: kSalt },
      { fraction: v.gas, k: evalTable(airConductivity, t) },
    ]);
  });

  return buildMaterial({
    name: input.name,
    title: `${salt.title} in ${matrix.title}, porosity ${input.porosity}, fill ${input.fill}`,
    conductivity: { tK: Float64Array.from(kRows), y: Float64Array.from(k) },
    density,
    specificHeat: { tK: Float64Array.from(cpRows), y: Float64Array.from(cp) },
    melt: { solidusK: melt.solidusK, liquidusK: melt.liquidusK, latentJPerKg: melt.latentJPerKg * saltMassFraction },
    limits: [...matrix.limits, ...salt.limits],
    sources: {
      rho_kg_m3: 'computed: volume-weighted matrix and salt densities (gas mass neglected)',
      cp_J_kgK: 'computed: volume-weighted ρc_p of matrix and salt',
      k_W_mK: 'computed: effective-medium theory (Landauer/Bruggeman) over matrix, salt (solid below the solidus, liquid above the liquidus) and air; formula as in Wang, Carson, North & Cleland, Int. J. Heat Mass Transfer 49 (2006) 3075',
      melt: `computed: the salt's solidus and liquidus; latent heat × salt mass fraction ${saltMassFraction.toFixed(4)}`,
      ...Object.fromEntries(Object.entries(matrix.sources).map(([key, s]) => [`matrix ${key}`, s])),
      ...Object.fromEntries(Object.entries(salt.sources).map(([key, s]) => [`salt ${key}`, s])),
    },
  });
}
