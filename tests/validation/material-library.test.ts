// The bundled material library (materials/*.json): every file is valid, listed, and sources each of its numbers
// (CONVENTIONS.md: every physical number has a source, or says "from memory" / "common practice, no source").

import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { libraryFile, libraryMaterial, libraryNames } from '../../sim/scenario/library.ts';
import { assertClose } from '../support/assert-close.ts';

const MATERIALS_DIR = new URL('../../materials/', import.meta.url);
const onDisk = readdirSync(MATERIALS_DIR).filter((f) => f.endsWith('.json')).map((f) => f.slice(0, -'.json'.length)).sort();

describe('material library', () => {
  it('libraryNames() lists exactly the materials/*.json files on disk (materials/index.ts is complete)', () => {
    expect(libraryNames()).toEqual(onDisk);
  });

  it.each(onDisk)('libraryFile("%s") passes the library schema, carries its own file name and builds a material', (name) => {
    const file = libraryFile(name);
    expect(file).toBeDefined();
    expect(file!.name).toBe(name);
    expect(libraryMaterial(name)).toBeDefined();
  });

  it.each(onDisk)('materials/%s.json gives a non-empty source for every numeric property, limit and emissivity', (name) => {
    const file = libraryFile(name)!;
    const keys = ['k_W_mK', 'rho_kg_m3', 'cp_J_kgK', ...(file.melt ? ['melt'] : [])];
    for (const key of keys) expect(file.sources[key]?.trim(), `${name}: sources.${key}`).toBeTruthy();
    for (const limit of file.limits ?? []) expect(limit.source?.trim(), `${name}: limit ${limit.kind}`).toBeTruthy();
    if (file.emissivity) expect(file.emissivity.source?.trim(), `${name}: emissivity.source`).toBeTruthy();
  });

  it.each(onDisk)('materials/%s.json tables have strictly increasing temperatures and positive values', (name) => {
    const file = libraryFile(name)!;
    for (const [key, property] of [['k_W_mK', file.k_W_mK], ['cp_J_kgK', file.cp_J_kgK]] as const) {
      if (typeof property === 'number') {
        expect(property, `${name}.${key}`).toBeGreaterThan(0);
        continue;
      }
      property.forEach(([tC, value], i) => {
        expect(value, `${name}.${key}[${i}]`).toBeGreaterThan(0);
        if (i > 0) expect(tC, `${name}.${key}[${i}][0]`).toBeGreaterThan(property[i - 1]![0]);
      });
    }
    if (file.melt) expect(file.melt.solidus_C, `${name}.melt`).toBeLessThanOrEqual(file.melt.liquidus_C);
  });
});

describe('LiCl–KCl eutectic (materials/licl-kcl-eutectic.json)', () => {
  // The file's melt source: "eutectic temperature 352 °C: Sandia National Laboratories, 'Electrolyte effects in
  // Li(Si)/FeS2 thermal batteries'; Li et al., J. Chem. Eng. Data (2016); Ito, Hasegawa & Ito, J. Chem. Eng. Data 46
  // (2001); latent heat 11.8 kJ/mol by DSC: Korin & Soifer, J. Thermal Analysis 50 (1997); computed: 11.8 kJ/mol /
  // 55.74 g/mol = 212 J/g".
  it('libraryFile("licl-kcl-eutectic") melts isothermally at 352 °C with 212 kJ/kg, as its source states', () => {
    const file = libraryFile('licl-kcl-eutectic')!;
    expect(file.melt).toEqual({ solidus_C: 352, liquidus_C: 352, latent_J_kg: 212000 });
    expect(file.sources.melt).toMatch(/352 °C/);
    expect(file.sources.melt).toMatch(/Korin & Soifer/);
    expect(file.sources.melt).toMatch(/212 J\/g/);
  });

  it('the 212 kJ/kg follows from 11.8 kJ/mol and the molar mass of 58.5 mol % LiCl in KCl', () => {
    // Molar masses from the standard atomic weights (IUPAC; Li 6.94, K 39.098, Cl 35.45 — from memory):
    // LiCl 42.39 g/mol, KCl 74.55 g/mol; the mixture 0.585·42.39 + 0.415·74.55 = 55.74 g/mol.
    const molarMass = 0.585 * (6.94 + 35.45) + 0.415 * (39.098 + 35.45);
    assertClose(molarMass, 55.74, { abs: 0.01 }, 'molar mass, g/mol');
    // Tolerance 0.5 kJ/kg: the file rounds to three digits.
    assertClose(11.8e3 / (molarMass * 1e-3), libraryFile('licl-kcl-eutectic')!.melt!.latent_J_kg, { abs: 500 }, 'latent heat, J/kg');
  });

  it('libraryMaterial("licl-kcl-eutectic") jumps by ρ·L = 1648 × 212000 J/m³ at 352 °C', () => {
    const m = libraryMaterial('licl-kcl-eutectic')!;
    assertClose(m.melt!.solidusK, 352 + 273.15, { abs: 1e-12 }, 'melting point, K');
    assertClose(m.melt!.hLiquidus - m.melt!.hSolidus, 1648 * 212000, { rel: 1e-12 }, 'latent heat per volume, J/m³');
  });
});

describe('library coverage and the computed entries', () => {
  it('libraryNames() holds at least 26 materials, among them the anodes, pellet, electrolytes, powders and bench surfaces', () => {
    const names = libraryNames();
    expect(names.length).toBeGreaterThanOrEqual(26);
    for (const n of ['lithium-silicon', 'lithium-aluminium', 'fe-kclo4-pellet', 'lif-licl-libr-eutectic', 'libr-kbr-lif-eutectic',
      'boron-nitride-powder', 'magnesia-powder', 'ceramic-tile', 'mild-steel']) expect(names).toContain(n);
  });

  it('libraryFile("licl") and libraryFile("kcl") melt at 610 °C / 469 J/g and 771 °C / 353 J/g, as their data pages state', () => {
    // LiCl: 610 °C, 19.9 kJ/mol (Wikipedia "Lithium chloride"); KCl: 771 °C, 26.28 kJ/mol (you-iggy "Potassium
    // chloride"). Molar masses from the standard atomic weights (IUPAC, from memory): LiCl 42.394, KCl 74.551 g/mol.
    const licl = libraryFile('licl')!.melt!;
    const kcl = libraryFile('kcl')!.melt!;
    expect([licl.solidus_C, kcl.solidus_C]).toEqual([610, 771]);
    // Tolerance 0.5 kJ/kg: the files round to three digits.
    assertClose(licl.latent_J_kg, 19.9e3 / 0.042394, { abs: 500 }, 'LiCl latent heat, J/kg');
    assertClose(kcl.latent_J_kg, 26.28e3 / 0.074551, { abs: 500 }, 'KCl latent heat, J/kg');
  });

  it('the Fe/KClO₄ pellet note states 1.26 kJ/g, which follows from KClO₄ + 4 Fe → KCl + 4 FeO at 16 wt % KClO₄', () => {
    // Formation enthalpies: KClO₄ −433 kJ/mol (Wikipedia "Potassium perchlorate"), KCl −436.747 (you-iggy tables),
    // FeO −272.0 (CRC Handbook, from memory). Molar mass of KClO₄ 138.55 g/mol (IUPAC atomic weights, from memory).
    const reactionKJPerMol = -433 - (-436.747 + 4 * -272.0); // heat released per mol KClO₄
    assertClose(reactionKJPerMol, 1091.7, { abs: 0.1 }, 'heat of reaction, kJ/mol');
    const kJPerG = (0.16 * reactionKJPerMol) / 138.55;
    // Tolerance 0.005 kJ/g: the note rounds to 1.26.
    assertClose(kJPerG, 1.26, { abs: 0.005 }, 'pellet heat, kJ/g');
    expect(libraryFile('fe-kclo4-pellet')!.notes).toMatch(/1\.26 kJ\/g/);
  });
});
