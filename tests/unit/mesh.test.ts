// The layer stack cut into cells (sim/grid/mesh.ts): cell widths add up to each layer, cells are finer at every layer
// face and graded smoothly (Patankar, Numerical Heat Transfer and Fluid Flow, 1980, §4.6: cell faces placed first),
// the counts follow the numerics, and a contact resistance sits on the face between its two layers.

import { describe, expect, it } from 'vitest';
import { buildGrid } from '../../sim/grid/mesh.ts';
import { assertClose } from '../support/assert-close.ts';
import { PLAIN, parseOk, scenario } from '../support/scenarios.ts';

const stack = (numerics = {}) => parseOk(scenario({
  duration_s: 10,
  materials: { a: PLAIN, salt: { ...PLAIN, melt: { solidus_C: 300, liquidus_C: 300, latent_J_kg: 1e5 } } },
  layers: [
    { id: 'bottom', material: 'a', thickness_mm: 1 },
    { id: 'sep', material: 'salt', thickness_mm: 1.5, separator: true },
    { id: 'top', material: 'a', thickness_mm: 3.25 },
    { id: 'own', material: 'a', thickness_mm: 0.5, cells: 5 },
  ],
  contacts: [{ below: 'bottom', above: 'sep', resistance_m2K_W: 1e-4 }, { below: 'top', above: 'own', resistance_m2K_W: 3e-3 }],
  numerics: { cells_per_mm: 4, min_cells_per_layer: 8, separator_cells_per_mm: 16, min_separator_cells: 16, ...numerics },
}));
const THICKNESS_M = [1e-3, 1.5e-3, 3.25e-3, 0.5e-3];

describe('buildGrid()', () => {
  it('buildGrid() gives each layer max(min cells, ⌈thickness·cells per mm⌉) cells, or its own count, times refine', () => {
    for (const refine of [1, 2, 4]) {
      const grid = buildGrid(stack(), refine);
      // by hand: 1 mm → max(8, 4) = 8; separator 1.5 mm → max(16, 24) = 24; 3.25 mm → max(8, 13) = 13; own: 5
      const counts = [8, 24, 13, 5].map((c) => c * refine);
      counts.forEach((c, li) => expect(grid.layerEnd[li]! - grid.layerStart[li]!, `cells in layer ${li} at refine ${refine}`).toBe(c));
      expect(grid.n).toBe(counts.reduce((a, b) => a + b, 0));
    }
  });

  it('buildGrid() caps the default per-millimetre counts of thick layers (256 separator cells, 128 others) unless the file gives its own per-millimetre counts', () => {
    const thick = (numerics?: object) => parseOk(scenario({
      duration_s: 10,
      materials: { a: PLAIN, salt: { ...PLAIN, melt: { solidus_C: 300, liquidus_C: 300, latent_J_kg: 1e5 } } },
      layers: [
        { id: 'plate', material: 'a', thickness_mm: 100 },
        { id: 'sep', material: 'salt', thickness_mm: 100, separator: true },
        { id: 'thin', material: 'a', thickness_mm: 1 },
        { id: 'own', material: 'a', thickness_mm: 100, cells: 300 },
      ],
      ...(numerics ? { numerics } : {}),
    }));
    const counts = (numerics?: object) => { const g = buildGrid(thick(numerics)); return [0, 1, 2, 3].map((li) => g.layerEnd[li]! - g.layerStart[li]!); };
    // by hand: 100 mm × 4/mm = 400 → 128; 100 mm × 16/mm = 1600 → 256; 1 mm → max(8, 4) = 8; own count as given
    expect(counts()).toEqual([128, 256, 8, 300]);
    // a file's own per-millimetre count lifts the cap of the layers it sets: 100 × 2 = 200, 100 × 3 = 300
    expect(counts({ cells_per_mm: 2 })).toEqual([200, 256, 8, 300]);
    expect(counts({ separator_cells_per_mm: 3 })).toEqual([128, 300, 8, 300]);
    // a minimum above the cap wins over it
    expect(counts({ min_separator_cells: 400 })).toEqual([128, 400, 8, 300]);
  });

  it('buildGrid() cell widths sum to each layer thickness and the centres lie in order inside their layers', () => {
    const grid = buildGrid(stack(), 2);
    let base = 0;
    THICKNESS_M.forEach((t, li) => {
      let sum = 0;
      for (let i = grid.layerStart[li]!; i < grid.layerEnd[li]!; i++) {
        sum += grid.dx[i]!;
        expect(grid.layerOf[i]).toBe(li);
        expect(grid.xc[i]!).toBeGreaterThan(base);
        expect(grid.xc[i]!).toBeLessThan(base + t);
        if (i > 0) expect(grid.xc[i]!).toBeGreaterThan(grid.xc[i - 1]!);
      }
      // Tolerance 1e-15 m: a sum of differences of face positions, exact up to round-off.
      assertClose(sum, t, { abs: 1e-15 }, `widths of layer ${li}, m`);
      base += t;
    });
    assertClose(grid.totalM, 6.25e-3, { abs: 1e-15 }, 'total thickness, m');
  });

  it('buildGrid() makes cells finer at both faces of every layer, symmetric inside it, and graded smoothly', () => {
    const grid = buildGrid(stack());
    THICKNESS_M.forEach((_t, li) => {
      const start = grid.layerStart[li]!;
      const end = grid.layerEnd[li]!;
      const widths = Array.from(grid.dx.subarray(start, end));
      const middle = widths[Math.floor(widths.length / 2)]!;
      expect(widths[0]!, `first cell of layer ${li}`).toBeLessThan(middle);
      expect(widths[widths.length - 1]!, `last cell of layer ${li}`).toBeLessThan(middle);
      widths.forEach((w, j) => assertClose(w, widths[widths.length - 1 - j]!, { rel: 1e-9 }, `mirror of cell ${j} in layer ${li}`));
      // smooth grading: neighbouring cells differ by less than a factor 2 (a cosine blend of 5–24 cells)
      for (let j = 1; j < widths.length; j++) expect(Math.max(widths[j]! / widths[j - 1]!, widths[j - 1]! / widths[j]!)).toBeLessThan(2);
    });
  });

  it('buildGrid() puts each contact resistance on the face between its two layers and nowhere else', () => {
    const grid = buildGrid(stack());
    const expected = new Float64Array(grid.n - 1);
    expected[grid.layerEnd[0]! - 1] = 1e-4;
    expected[grid.layerEnd[2]! - 1] = 3e-3;
    expect(Array.from(grid.contactAbove)).toEqual(Array.from(expected));
  });
});
