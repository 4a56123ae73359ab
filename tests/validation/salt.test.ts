// The LiCl–KCl liquidus model (sim/physics/salt.ts, sim/scenario/salt-mixture.ts) against the measured facts it is built from and
// checked by: pure-salt melting points (Wikipedia "Lithium chloride" data page; you-iggy "Potassium chloride" tables),
// the eutectic at 352 °C (Sandia, "Electrolyte effects in Li(Si)/FeS2 thermal batteries"; Ito et al., J. Chem. Eng.
// Data 46 (2001)) and 58.5 mol % LiCl (Li et al., "Electrical Conductivity of LiCl–KCl–CsCl Melts", J. Chem. Eng. Data
// 2016), and the heat-of-fusion fit of Korin & Soifer, J. Thermal Analysis 50 (1997) 347.

import { describe, expect, it } from 'vitest';
import { branchK, leverLiquidFraction, liquidusModel, meltingRange, mixtureLatentJPerKg, moleFromMass } from '../../sim/physics/salt.ts';
import { liclMoleFraction, saltMixtureMaterial } from '../../sim/scenario/salt-mixture.ts';
import { assertClose } from '../support/assert-close.ts';
import { parseOk } from '../support/scenarios.ts';

const K = 273.15; // 0 °C in kelvin (SI Brochure, 9th ed., §2.3.1)
// Molar masses, g/mol, from the IUPAC standard atomic weights (from memory): Li 6.94, K 39.098, Cl 35.45.
const M_LICL = 6.94 + 35.45;
const M_KCL = 39.098 + 35.45;

describe('LiCl–KCl liquidus model', () => {
  it('liquidusModel() reproduces its fitted eutectic temperature, 352 °C, to round-off', () => {
    // Tolerance 1e-6 K: the fit is a bisection carried to round-off.
    assertClose(liquidusModel().eutectic.tK - K, 352, { abs: 1e-6 }, 'eutectic, °C');
  });

  it('meltingRange() of pure LiCl and pure KCl is their published melting point, 610 °C and 771 °C, exactly', () => {
    expect(meltingRange(1).liquidusK - K).toBeCloseTo(610, 10);
    expect(meltingRange(0).liquidusK - K).toBeCloseTo(771, 10);
    // the branch formula itself gives Tᵢ at xᵢ = 1 whatever Ω: ln 1 = 0 and (1 − 1)² = 0
    const { salts, omegaJPerMol } = liquidusModel();
    assertClose(branchK(salts.LiCl, 1, omegaJPerMol), 610 + K, { abs: 1e-9 }, 'LiCl branch at x = 1');
    assertClose(branchK(salts.KCl, 1, omegaJPerMol), 771 + K, { abs: 1e-9 }, 'KCl branch at x = 1');
  });

  it('the fitted eutectic composition lands within 0.005 of the measured 58.5 mol % LiCl (not fitted: a check)', () => {
    // Tolerance 0.005: the literature spread of the eutectic composition is 0.582–0.587.
    assertClose(liquidusModel().eutectic.xLiCl, 0.585, { abs: 0.005 }, 'eutectic x_LiCl');
  });

  it('meltingRange() puts the LiCl-rich liquidus within 20 K of the lowering reported for 10 and 20 mol % KCl', () => {
    // "The presence of KCl ... in the amount of 10 and 20 mol.% reduces the liquidus temperature by 30 and 80 degrees"
    // (Li₂O solubility in LiCl–KCl melt, Rasplavy 2018, abstract; measured with Li₂O present, so a loose check).
    const drop = (x: number) => 610 - (meltingRange(x).liquidusK - K);
    // Tolerance 20 K: the model gives ≈41 and ≈96 K; the reference's Li₂O content and baseline are not stated exactly.
    assertClose(drop(0.9), 30, { abs: 20 }, 'liquidus drop at 10 mol % KCl, K');
    assertClose(drop(0.8), 80, { abs: 20 }, 'liquidus drop at 20 mol % KCl, K');
  });

  it('meltingRange() gives the eutectic temperature as the solidus of every mixture (simple eutectic, no solid solution)', () => {
    for (const x of [0.1, 0.4, 0.585, 0.8, 0.95]) assertClose(meltingRange(x).solidusK - K, 352, { abs: 1e-6 }, `solidus at x ${x}`);
  });

  it('leverLiquidFraction(): at the liquidus temperature of x₁ the liquid of x₀ has composition x₁, so f = (1 − x₀)/(1 − x₁) in moles', () => {
    const x0 = 0.8;
    const x1 = 0.7;
    const t = meltingRange(x1).liquidusK;
    const molesLiquid = (1 - x0) / (1 - x1);
    const massFraction = (molesLiquid * (x1 * M_LICL + (1 - x1) * M_KCL)) / (x0 * M_LICL + (1 - x0) * M_KCL);
    // Tolerance 1e-6: the liquid composition is found by bisection to round-off; atomic weights agree to 1e-5.
    assertClose(leverLiquidFraction(x0, t), massFraction, { rel: 1e-4 }, 'liquid mass fraction');
    expect(leverLiquidFraction(x0, 351 + K)).toBe(0);
    expect(leverLiquidFraction(x0, meltingRange(x0).liquidusK + 0.01)).toBe(1);
  });

  it('leverLiquidFraction() just above the eutectic is (1 − x₀)/(1 − x_e) in moles, with the measured x_e = 0.585: 55 % by mass at x₀ = 0.8', () => {
    const molesLiquid = (1 - 0.8) / (1 - 0.585); // 0.482
    const byHand = (molesLiquid * (0.585 * M_LICL + 0.415 * M_KCL)) / (0.8 * M_LICL + 0.2 * M_KCL); // 0.550
    // Tolerance 0.005: the model's eutectic composition lies within 0.001 of the measured one (test above).
    assertClose(leverLiquidFraction(0.8, 352 + K + 1e-6), byHand, { abs: 0.005 }, 'liquid mass fraction at the eutectic');
  });

  it('mixtureLatentJPerKg() at the eutectic is the DSC fit 26.95 − 50.20x + 43.06x² kJ/mol over the molar mass', () => {
    const x = 0.585;
    const byHand = ((26.95 - 50.2 * x + 43.06 * x * x) * 1e3) / ((x * M_LICL + (1 - x) * M_KCL) * 1e-3); // ≈ 221 kJ/kg
    // Tolerance 1e-4 relative: atomic weights to four or five digits.
    assertClose(mixtureLatentJPerKg(x), byHand, { rel: 1e-4 }, 'latent heat, J/kg');
  });

  it('moleFromMass(0.445) is the 58.5 mol % of the eutectic (44.5 wt % LiCl, computed by hand from the molar masses)', () => {
    const byHand = (0.445 / M_LICL) / (0.445 / M_LICL + 0.555 / M_KCL);
    assertClose(moleFromMass(0.445), byHand, { rel: 1e-4 }, 'mole fraction');
    assertClose(byHand, 0.585, { abs: 0.001 }, 'hand value');
  });

  it('liclMoleFraction() refuses fractions that do not add up to 1, naming the field', () => {
    const errors: { path: string; message: string }[] = [];
    expect(liclMoleFraction({ LiCl: 0.5, KCl: 0.4 }, 'materials.s.salt', errors)).toBeUndefined();
    expect(errors[0]!.path).toBe('materials.s.salt');
    expect(errors[0]!.message).toMatch(/0\.9/);
  });

  it('saltMixtureMaterial() melts from the eutectic to the liquidus with the mixture latent heat', () => {
    const m = saltMixtureMaterial('s', 0.8);
    assertClose(m.melt!.solidusK, liquidusModel().eutectic.tK, { abs: 1e-9 }, 'solidus');
    assertClose(m.melt!.liquidusK, meltingRange(0.8).liquidusK, { abs: 1e-9 }, 'liquidus');
    // latent heat: the DSC fit at x = 0.8, inside its range 0.368–0.812, by hand
    const byHand = ((26.95 - 50.2 * 0.8 + 43.06 * 0.64) * 1e3) / ((0.8 * M_LICL + 0.2 * M_KCL) * 1e-3);
    assertClose(m.melt!.latentJPerKg, byHand, { rel: 1e-4 }, 'latent heat, J/kg');
    // the enthalpy rise across the melt is ρL plus the sensible heat of the range (c_p between 1000 and 2000 J/kg·K)
    const rise = m.melt!.hLiquidus - m.melt!.hSolidus;
    const span = m.melt!.liquidusK - m.melt!.solidusK;
    expect(rise).toBeGreaterThan(m.density * (byHand + 1000 * span));
    expect(rise).toBeLessThan(m.density * (byHand + 2000 * span));
  });

  it('parseScenario() accepts a separator given as "salt": { "LiCl": 44, "KCl": 56 } by mass and builds its melting range', () => {
    const problem = parseOk({
      freezeline: 1, ambient_C: 20, duration_s: 10,
      materials: { mix: { salt: { LiCl: 0.44, KCl: 0.56, basis: 'mass' } } },
      layers: [{ id: 'sep', material: 'mix', thickness_mm: 1, separator: true }],
      bottom: [], top: [],
    });
    const melt = problem.layers[0]!.material.melt!;
    assertClose(melt.solidusK - K, 352, { abs: 1e-6 }, 'solidus, °C');
    // 44 wt % LiCl is 58.0 mol %, just KCl-side of the eutectic: the liquidus lies a few kelvin above it
    expect(melt.liquidusK - K).toBeGreaterThan(352);
    expect(melt.liquidusK - K).toBeLessThan(360);
  });
});

describe('freezeline salt (sim/cli/cmd-salt.ts)', () => {
  it('saltJson() of pure LiCl prints its published melting point as solidus and liquidus, and the fitted eutectic', async () => {
    const { saltJson } = await import('../../sim/cli/cmd-salt.ts');
    const doc = saltJson(1);
    expect(Object.keys(doc)).toEqual(['solidus_C', 'liquidus_C', 'eutectic_C', 'eutectic_x_LiCl']);
    expect(doc).toMatchObject({ solidus_C: 610, liquidus_C: 610, eutectic_C: 352 });
    assertClose(doc.eutectic_x_LiCl!, 0.585, { abs: 0.005 }, 'eutectic x');
  });

  it('parseParts() reads LiCl=0.8 KCl=0.2, fills in the missing salt, and refuses anything else by name', async () => {
    const { parseParts } = await import('../../sim/cli/cmd-salt.ts');
    expect(parseParts(['LiCl=0.8', 'KCl=0.2'])).toEqual({ LiCl: 0.8, KCl: 0.2 });
    expect(parseParts(['KCl=0.25'])).toEqual({ LiCl: 0.75, KCl: 0.25 });
    expect(() => parseParts(['NaCl=0.5'])).toThrow(/"NaCl=0.5"/);
    expect(() => parseParts(['LiCl=1.5'])).toThrow(/LiCl must be a fraction in \[0, 1\], got "1.5"/);
  });
});
