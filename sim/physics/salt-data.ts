/**
 * Data of the LiCl–KCl system for the liquidus model (salt.ts) and the mixture's properties, each with its source.
 * The pure salts' melting points and latent heats are read from the library files materials/licl.json and
 * materials/kcl.json (sourced there), so there is one copy of each number.
 */

/** Molar gas constant, J·mol⁻¹·K⁻¹ (CODATA 2018, exact since the 2019 SI redefinition). */
export const GAS_CONSTANT_J_MOLK = 8.314462618;

export interface PureSaltData {
  /** kg/mol */
  readonly molarMassKgPerMol: number;
  /** Liquid density ρ(T) = a − b·T (T in K), kg/m³. */
  readonly liquidDensity: { readonly a: number; readonly b: number };
  /** Molar heat capacity, J·mol⁻¹·K⁻¹: solid at 298 K, solid near 600 K, liquid. */
  readonly cpSolid298: number;
  readonly cpSolid600: number;
  readonly cpLiquid: number;
}

export const saltData: Readonly<Record<'LiCl' | 'KCl', PureSaltData>> = {
  LiCl: {
    // 42.394 g/mol: Wikipedia "Lithium chloride" data page (ChemLin agrees)
    molarMassKgPerMol: 42.394e-3,
    // ρ = 1.8842 − 4.328e-4·T g/cm³: from memory (Janz, Molten Salts Handbook); reproduces the 1.502 g/cm³ at 611 °C
    // of the Wikipedia data page to 0.03 %
    liquidDensity: { a: 1884.2, b: 0.4328 },
    // 48.03 J/mol·K at 298 K: Wikipedia "Lithium chloride"; ≈54.5 near 600 K and ≈73.4 liquid: from memory (NIST-JANAF)
    cpSolid298: 48.03,
    cpSolid600: 54.5,
    cpLiquid: 73.4,
  },
  KCl: {
    // 74.551 g/mol: you-iggy "Potassium chloride" tables
    molarMassKgPerMol: 74.551e-3,
    // ρ = 2.1359 − 5.831e-4·T g/cm³: from memory (Janz, Molten Salts Handbook)
    liquidDensity: { a: 2135.9, b: 0.5831 },
    // 51.30 J/mol·K at 298 K: you-iggy tables; ≈56 near 600 K and ≈73.6 liquid: from memory (NIST-JANAF)
    cpSolid298: 51.3,
    cpSolid600: 56,
    cpLiquid: 73.6,
  },
};

/**
 * Measured facts of the LiCl–KCl system the model is fitted to or compared with.
 */
export const liclKclFacts = {
  /**
   * Eutectic temperature, K: 352 °C (Sandia National Laboratories, "Electrolyte effects in Li(Si)/FeS2 thermal
   * batteries"; Li et al., J. Chem. Eng. Data 2016; Ito, Hasegawa & Ito, J. Chem. Eng. Data 46 (2001)). Other reports
   * 353 °C (Basin et al., Russ. J. Inorg. Chem. 53 (2008)) and 354.4 °C (Korin & Soifer 1997).
   */
  eutecticK: 352 + 273.15,
  /** Eutectic composition, mole fraction LiCl: 0.585 (Li et al. 2016); 0.582 and 0.587 also reported. */
  eutecticXLiCl: 0.585,
  /**
   * Heat of fusion of the mixtures, kJ/mol, against the LiCl mole fraction x: ΔH = 26.95 − 50.20·x + 43.06·x², fitted
   * to DSC measurements for 0.368 ≤ x ≤ 0.812 (Korin & Soifer, "Thermal analysis of the system KCl–LiCl by
   * differential scanning calorimetry", J. Thermal Analysis 50 (1997) 347).
   */
  heatOfFusionFit: { c0: 26.95, c1: -50.2, c2: 43.06, xLow: 0.368, xHigh: 0.812 },
  /**
   * Temperature at which the mixture's (constant) density is taken, K: 450 °C, the usual operating temperature of the
   * LiCl–KCl eutectic (Ito, Hasegawa & Ito 2001), as for materials/licl-kcl-eutectic.json.
   */
  densityAtK: 450 + 273.15,
} as const;
