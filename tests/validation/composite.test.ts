// The salt-soaked separator (sim/physics/composite.ts) against the mixing rules as published: effective-medium theory in its
// two-phase closed form k = [B + √(B² + 8k₁k₂)]/4, B = (3v₁ − 1)k₁ + (3v₂ − 1)k₂ (Landauer 1952; formula as in Wang,
// Carson, North & Cleland, Int. J. Heat Mass Transfer 49 (2006) 3075), and the series and parallel (Wiener) bounds;
// ρ, ρc_p and latent heat by volume and mass weighting, checked by hand.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compositeMaterial, effectiveMediumConductivity, parallelBound, seriesBound } from '../../sim/physics/composite.ts';
import { libraryMaterial } from '../../sim/scenario/library.ts';
import { conductivityAt, evalTable } from '../../sim/physics/material.ts';
import { assertClose } from '../support/assert-close.ts';
import { parseOk } from '../support/scenarios.ts';

const K = 273.15; // 0 °C in kelvin (SI Brochure, 9th ed., §2.3.1)
const glass = libraryMaterial('e-glass')!;
const salt = libraryMaterial('licl-kcl-eutectic')!;

describe('effective-medium conductivity', () => {
  it('effectiveMediumConductivity() of two phases is the closed form [B + √(B² + 8k₁k₂)]/4', () => {
    fc.assert(fc.property(fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }),
      fc.double({ min: 0.01, max: 100, noNaN: true }), (v1, k1, k2) => {
        const v2 = 1 - v1;
        const b = (3 * v1 - 1) * k1 + (3 * v2 - 1) * k2;
        const closed = (b + Math.sqrt(b * b + 8 * k1 * k2)) / 4;
        // Tolerance 1e-9 relative: bisection on ln k to round-off against an exact root.
        assertClose(effectiveMediumConductivity([{ fraction: v1, k: k1 }, { fraction: v2, k: k2 }]), closed, { rel: 1e-9 });
      }));
  });

  it('effectiveMediumConductivity() of 40 vol % MgO grains (k 14) in molten salt (k 0.5) is 2.83 W/m·K, by hand', () => {
    // B = 0.2·14 + 0.8·0.5 = 3.2; k = (3.2 + √(3.2² + 8·14·0.5))/4 = (3.2 + 8.139)/4 = 2.835
    assertClose(effectiveMediumConductivity([{ fraction: 0.4, k: 14 }, { fraction: 0.6, k: 0.5 }]), 2.835, { abs: 0.001 }, 'k, W/m·K');
  });

  it('effectiveMediumConductivity() of three phases lies between the series and parallel bounds', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }),
      fc.double({ min: 0.02, max: 50, noNaN: true }), fc.double({ min: 0.02, max: 50, noNaN: true }), (phi, fill, km, ks) => {
        const phases = [{ fraction: 1 - phi, k: km }, { fraction: phi * fill, k: ks }, { fraction: phi * (1 - fill), k: 0.04 }];
        const k = effectiveMediumConductivity(phases);
        expect(k).toBeGreaterThanOrEqual(seriesBound(phases) * (1 - 1e-9));
        expect(k).toBeLessThanOrEqual(parallelBound(phases) * (1 + 1e-9));
      }));
  });
});

describe('compositeMaterial() of LiCl–KCl eutectic in E-glass cloth', () => {
  it('reduces to the matrix at porosity 0 and to the salt at porosity 1 (ρ, c_p, k)', () => {
    const allGlass = compositeMaterial({ name: 'c0', matrix: glass, salt, porosity: 0, fill: 1 });
    const allSalt = compositeMaterial({ name: 'c1', matrix: glass, salt, porosity: 1, fill: 1 });
    // Tolerance 1e-12 relative: a weighted sum with one weight 1 and the others 0.
    assertClose(allGlass.density, glass.density, { rel: 1e-12 }, 'ρ at φ = 0');
    assertClose(allSalt.density, salt.density, { rel: 1e-12 }, 'ρ at φ = 1');
    for (const tC of [25, 300, 500]) {
      assertClose(evalTable(allGlass.specificHeat, tC + K), evalTable(glass.specificHeat, tC + K), { rel: 1e-12 }, `c_p at φ = 0, ${tC} °C`);
      assertClose(evalTable(allGlass.conductivity, tC + K), evalTable(glass.conductivity, tC + K), { rel: 1e-9 }, `k at φ = 0, ${tC} °C`);
    }
    // the salt's own solid and liquid conductivities (2.0 and 0.45 in its file) come back at porosity 1
    assertClose(allSalt.melt!.kSolid, salt.melt!.kSolid, { rel: 1e-9 }, 'k solid at φ = 1');
    assertClose(allSalt.melt!.kLiquid, salt.melt!.kLiquid, { rel: 1e-9 }, 'k liquid at φ = 1');
  });

  it('scales the latent heat by the salt mass fraction, by hand: 212 kJ/kg × 0.6·1648/(0.4·2570 + 0.6·1648)', () => {
    const c = compositeMaterial({ name: 'c', matrix: glass, salt, porosity: 0.6, fill: 1 });
    const massFraction = (0.6 * 1648) / (0.4 * 2570 + 0.6 * 1648); // 0.4903
    assertClose(c.density, 0.4 * 2570 + 0.6 * 1648, { rel: 1e-12 }, 'ρ, kg/m³');
    assertClose(c.melt!.latentJPerKg, 212000 * massFraction, { rel: 1e-12 }, 'latent heat, J/kg');
    expect(c.melt!.solidusK).toBe(salt.melt!.solidusK);
  });

  it('k follows the salt from solid to liquid through the melt and stays inside the bounds of its phases', () => {
    const c = compositeMaterial({ name: 'c', matrix: glass, salt, porosity: 0.6, fill: 0.9 });
    const m = c.melt!;
    expect(m.kSolid).toBeGreaterThan(m.kLiquid); // solid salt (2.0) conducts better than liquid (0.45)
    const half = 0.5 * (m.hSolidus + m.hLiquidus);
    const k = conductivityAt(c, half, m.solidusK);
    expect(k).toBeLessThan(m.kSolid);
    expect(k).toBeGreaterThan(m.kLiquid);
    const phases = [{ fraction: 0.4, k: 1.15 }, { fraction: 0.54, k: 0.45 }, { fraction: 0.06, k: 0.05 }];
    expect(m.kLiquid).toBeGreaterThan(seriesBound(phases));
    expect(m.kLiquid).toBeLessThan(parallelBound(phases));
  });

  it('parseScenario() builds a "composite" separator of 44/56 wt % LiCl–KCl in glass cloth and refuses a melting matrix', () => {
    const base = {
      freezeline: 1, ambient_C: 20, duration_s: 10,
      layers: [{ id: 'sep', material: 'cloth', thickness_mm: 1, separator: true }], bottom: [], top: [],
    };
    const problem = parseOk({ ...base, materials: { cloth: { composite: { matrix: 'e-glass', salt: { LiCl: 0.44, KCl: 0.56, basis: 'mass' }, porosity: 0.6 } } } });
    assertClose(problem.layers[0]!.material.melt!.solidusK - K, 352, { abs: 1e-6 }, 'solidus, °C');
    // the entry's own limits join the matrix's (E-glass: service 700 °C, softening 844 °C); nothing given is ignored
    const limited = parseOk({ ...base, materials: { cloth: { title: 'my cloth', limits: [{ kind: 'service', at_C: 500 }], composite: { matrix: 'e-glass', salt: 'licl-kcl-eutectic', porosity: 0.6 } } } });
    const m = limited.layers[0]!.material;
    expect(m.title).toBe('my cloth');
    expect(m.limits.map((l) => Math.round(l.atK - K))).toEqual([700, 844, 500]);
    expect(() => parseOk({ ...base, materials: { cloth: { composite: { matrix: 'licl-kcl-eutectic', salt: 'licl-kcl-eutectic', porosity: 0.6 } } } }))
      .toThrow(/materials\.cloth\.composite\.matrix: the matrix must be a material that does not melt/);
    expect(() => parseOk({ ...base, materials: { cloth: { composite: { matrix: 'e-glass', salt: 'licl-kcl-eutectic', porosity: 0 } } } }))
      .toThrow(/materials\.cloth\.composite\.porosity/);
  });
});
