/**
 * Internal heat as a user gives it → the layer's volumetric source schedule (W/m³), converted once at the edge so the
 * solver and the energy ledger see one kind of source:
 *   heat pellet:  q̇ = ρ·q_m/t_burn over [t₀, t₀ + t_burn), q_m the heat per kilogram (given, or from the Fe/KClO₄
 *                 composition: KClO₄ + 4 Fe → KCl + 4 FeO, 1092 kJ per mol of the limiting reactant's share);
 *   Joule heat:   q̇ = I²·R/(A·d) over [from_s, to_s), A the footprint, d the layer's thickness;
 *   per kilogram: q̇ = ρ·p, p in W/kg (a calibration term).
 * The pellet releases its heat evenly in time and space: a burn front that crosses the pellet is not resolved. Given a
 * burn-front speed v instead of a burn time, the front is taken to cross the layer's thickness d at that constant speed,
 * so t_burn = d/v; the heat is still released evenly over the whole layer during that time (the layer's volumetric
 * source is uniform in this 1D model), which keeps the total ρ·q_m·d per unit area and the burn's duration right and
 * leaves out only where, inside the pellet, the heat appears first.
 */
import type { FieldError } from './field-errors.ts';
import type { Footprint, SourceInterval } from '../physics/problem.ts';
import type { HeatPerKgFile, JouleFile, PelletFile } from './rig-schema.ts';
import { mmToM, mToMm } from '../physics/units.ts';

/**
 * Fe/KClO₄ chemistry. Heat of KClO₄ + 4 Fe → KCl + 4 FeO from formation enthalpies: KClO₄ −433 kJ/mol (Wikipedia
 * "Potassium perchlorate"), KCl −436.747 kJ/mol (you-iggy "Potassium chloride" tables), FeO −272.0 kJ/mol (CRC
 * Handbook, from memory): −433 − (−436.747 − 4·272.0) = 1091.7 kJ released per mol KClO₄. Molar masses from the IUPAC
 * standard atomic weights (from memory): KClO₄ 138.55 g/mol, Fe 55.845 g/mol.
 */
export const pelletChemistry = {
  reactionJPerMolKClO4: 1091.7e3,
  molarMassKClO4KgPerMol: 138.55e-3,
  molarMassFeKgPerMol: 55.845e-3,
  /** Mol of Fe per mol of KClO₄ in the reaction. */
  ironPerPerchlorate: 4,
} as const;

/** Heat released per kilogram of an Fe/KClO₄ mixture with KClO₄ mass fraction w, J/kg (the limiting reactant burns). */
export function pelletHeatJPerKg(kclo4Fraction: number): number {
  const c = pelletChemistry;
  const molKClO4 = kclo4Fraction / c.molarMassKClO4KgPerMol;
  const molFeAsKClO4 = (1 - kclo4Fraction) / (c.molarMassFeKgPerMol * c.ironPerPerchlorate);
  return Math.min(molKClO4, molFeAsKClO4) * c.reactionJPerMolKClO4;
}

export interface LayerHeatInput {
  readonly pellet?: PelletFile | undefined;
  readonly joule?: JouleFile | undefined;
  readonly heat_W_kg?: HeatPerKgFile | undefined;
}

/**
 * The W/m³ intervals of a layer's pellet, Joule and per-kilogram heat. `densityKgM3` and `thicknessM` are the layer's;
 * errors name the field under `path` (e.g. `layers[2]`).
 */
export function layerHeatSources(layer: LayerHeatInput, densityKgM3: number, thicknessM: number, footprint: Footprint | undefined,
  durationS: number, path: string, errors: FieldError[]): SourceInterval[] {
  const out: SourceInterval[] = [];
  const p = layer.pellet;
  if (p) {
    const heatGiven = (p.heat_J_g === undefined) !== (p.KClO4_fraction === undefined);
    const timeGiven = (p.burn_s === undefined) !== (p.burn_front_mm_s === undefined);
    if (!heatGiven) {
      errors.push({ path: `${path}.pellet`, message: `give exactly one of heat_J_g and KClO4_fraction, got ${p.heat_J_g === undefined ? 'neither' : 'both'}` });
    }
    if (!timeGiven) {
      errors.push({ path: `${path}.pellet`, message: `give exactly one of burn_s and burn_front_mm_s, got ${p.burn_s === undefined ? 'neither' : 'both'}` });
    }
    if (heatGiven && timeGiven) {
      const jPerKg = p.heat_J_g !== undefined ? p.heat_J_g * 1e3 : pelletHeatJPerKg(p.KClO4_fraction!);
      const from = p.from_s ?? 0;
      // a front at constant speed crosses the thickness d in d / v
      const burnS = p.burn_s ?? thicknessM / mmToM(p.burn_front_mm_s!);
      const key = p.burn_s !== undefined ? 'burn_s' : 'burn_front_mm_s';
      if (from + burnS > durationS) {
        errors.push({ path: `${path}.pellet.${key}`, message: `the burn must end by duration_s (${durationS}): the run ends before it, got from_s + burn time = ${from + burnS}${key === 'burn_front_mm_s' ? ` (thickness ${mToMm(thicknessM)} mm / ${p.burn_front_mm_s} mm/s)` : ''}` });
      }
      out.push({ fromS: from, toS: from + burnS, value: (densityKgM3 * jPerKg) / burnS, origin: 'pellet' });
    }
  }
  const j = layer.joule;
  if (j) {
    if (j.to_s > durationS) errors.push({ path: `${path}.joule.to_s`, message: `must be ≤ duration_s (${durationS}): the run ends before it, got ${j.to_s}` });
    if (!(j.to_s > j.from_s)) errors.push({ path: `${path}.joule.to_s`, message: `must be > from_s (${j.from_s}), got ${j.to_s}` });
    else if (!footprint) errors.push({ path: `${path}.joule`, message: 'needs the scenario\'s footprint (the heat is spread over footprint × thickness), got none' });
    else out.push({ fromS: j.from_s, toS: j.to_s, value: (j.current_A * j.current_A * j.resistance_ohm) / (footprint.areaM2 * thicknessM), origin: 'joule' });
  }
  const w = layer.heat_W_kg;
  if (w !== undefined) {
    if (typeof w === 'number') out.push({ fromS: 0, toS: durationS, value: densityKgM3 * w, origin: 'heat_W_kg' });
    else {
      w.forEach((iv, i) => {
        if (iv.to_s > durationS) errors.push({ path: `${path}.heat_W_kg[${i}].to_s`, message: `must be ≤ duration_s (${durationS}): the run ends before it, got ${iv.to_s}` });
        if (!(iv.to_s > iv.from_s)) errors.push({ path: `${path}.heat_W_kg[${i}].to_s`, message: `must be > from_s (${iv.from_s}), got ${iv.to_s}` });
        else out.push({ fromS: iv.from_s, toS: iv.to_s, value: densityKgM3 * iv.value, origin: `heat_W_kg[${i}]` });
      });
    }
  }
  return out;
}
