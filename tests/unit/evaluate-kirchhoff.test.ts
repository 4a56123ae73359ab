// evaluate() (grid/discretization.ts) reads each cell's k once per evaluation and lets the two half cells that meet
// inside a layer share one Kirchhoff mean. Its conductances, their slopes and the net rates must be what the
// definition gives half cell by half cell: halfCellConductivity() of grid/kirchhoff.ts (held against the closed-form
// integral of a linear k and hand-computed trapezoids in kirchhoff.test.ts) in the series sum of the file's header
// (Patankar, Numerical Heat Transfer and Fluid Flow, 1980, §4.2), to the bit, on random steep tables, across
// solid, two-phase and liquid cells, layer boundaries and contact resistances.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { StepConditions } from '../../sim/grid/discretization.ts';
import { createWorkspace, evaluate } from '../../sim/grid/discretization.ts';
import { halfCellConductivity } from '../../sim/grid/kirchhoff.ts';
import type { Grid } from '../../sim/grid/mesh.ts';
import type { Material } from '../../sim/physics/material.ts';
import { buildMaterial, enthalpyAt } from '../../sim/physics/material.ts';

const rows = fc.array(fc.tuple(fc.double({ min: 1, max: 40, noNaN: true }), fc.double({ min: 0.05, max: 400, noNaN: true })), { minLength: 1, maxLength: 6 });

/** A material from random rows: temperatures 300 K upwards by the given gaps, k and c_p as drawn (c_p × 10). */
function material(name: string, k: [number, number][], cp: number, melt: { solidusK: number; liquidusK: number; latentJPerKg: number } | undefined): Material {
  let t = 300;
  const tK = Float64Array.from(k, (r) => (t += r[0]));
  return buildMaterial({
    name, title: name, density: 2000, limits: [], sources: {},
    conductivity: { tK, y: Float64Array.from(k, (r) => r[1]) },
    specificHeat: { tK: Float64Array.of(300), y: Float64Array.of(cp) },
    melt,
  });
}

/** The series conductances and slopes as the definition reads them, half cell by half cell. */
function reference(grid: Grid, T: Float64Array, tau: Float64Array) {
  const n = grid.n;
  const G = new Float64Array(n + 1);
  const dRa = new Float64Array(n + 1);
  const dRb = new Float64Array(n + 1);
  const s = new Float64Array(3);
  let halfBelow = 0;
  let belowOwn = 0;
  let belowNb = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1;
    const m = grid.materials[i]!;
    const dx = grid.dx[i]!;
    // each half through T alone (a melting material's k read by temperature): d(Δx/(2k̄))/dH = −Δx/(2k̄²)·∂k̄/∂T·τ
    const kLo = halfCellConductivity(m, T[j]!, T[j - 1]!, s);
    const cLo = (-0.5 * dx) / (kLo * kLo);
    const loOwn = cLo * s[0]! * tau[j]!;
    const loNb = cLo * s[1]! * tau[j - 1]!;
    const kUp = halfCellConductivity(m, T[j]!, T[j + 1]!, s);
    const cUp = (-0.5 * dx) / (kUp * kUp);
    G[i] = 1 / (halfBelow + (i === 0 ? 0 : grid.contactAbove[i - 1]!) + (0.5 * dx) / kLo);
    dRa[i] = belowOwn + loNb;
    dRb[i] = belowNb + loOwn;
    halfBelow = (0.5 * dx) / kUp;
    belowOwn = cUp * s[0]! * tau[j]!;
    belowNb = cUp * s[1]! * tau[j + 1]!;
  }
  G[n] = 1 / halfBelow;
  dRa[n] = belowOwn;
  dRb[n] = belowNb;
  return { G, dRa, dRb };
}

describe('evaluate() against halfCellConductivity() per half cell', () => {
  it('gives the same conductances and slopes to the bit on random steep tables and phases', () => {
    fc.assert(fc.property(rows, rows, fc.boolean(), fc.array(fc.double({ min: 250, max: 700, noNaN: true }), { minLength: 9, maxLength: 9 }),
      fc.array(fc.double({ min: 250, max: 700, noNaN: true }), { minLength: 2, maxLength: 2 }),
      (k1, k2, isothermal, temps, faces) => {
        // layer 0: no melt (5 cells); layer 1: a melt whose k follows its phase (4 cells), solidus 420 K
        const plain = material('plain', k1, 900, undefined);
        const salt = material('salt', k2, 1200, { solidusK: 420, liquidusK: isothermal ? 420 : 430, latentJPerKg: 2e5 });
        const n = 9;
        const materials = Array.from({ length: n }, (_, i) => (i < 5 ? plain : salt));
        const dx = Float64Array.from({ length: n }, (_, i) => 1e-4 * (1 + (i % 3)));
        const grid: Grid = {
          n, dx, xc: new Float64Array(n), totalM: dx.reduce((a, b) => a + b, 0),
          layerOf: Int32Array.from({ length: n }, (_, i) => (i < 5 ? 0 : 1)), materials,
          contactAbove: Float64Array.from({ length: n }, (_, i) => (i === 4 ? 1e-4 : 0)),
          layerStart: Int32Array.of(0, 5), layerEnd: Int32Array.of(5, 9),
        };
        const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
        const U = new Float64Array(n + 2);
        U[0] = faces[0]!;
        U[n + 1] = faces[1]!;
        // cells two by two at one temperature now and then, so same-piece means (and mush cells) occur
        for (let i = 0; i < n; i++) U[i + 1] = enthalpyAt(materials[i]!.enthalpy, temps[i % 3 === 2 ? i - 1 : i]!);
        if (!isothermal) U[7] = (salt.melt!.hSolidus + salt.melt!.hLiquidus) / 2;
        const cond: StepConditions = { bottom: { kind: 'fixed', tK: faces[0]! }, top: { kind: 'fixed', tK: faces[1]! }, source: new Float64Array(n) };
        // twice, so the second evaluation starts its piece searches from the first one's pieces
        evaluate(ws, U, cond);
        for (let i = 1; i <= n; i++) U[i] = U[i]! * (1 + 1e-3 * ((i % 2) - 0.5));
        evaluate(ws, U, cond);
        const ref = reference(grid, ws.T, ws.tau);
        expect(Array.from(ws.G)).toEqual(Array.from(ref.G));
        expect(Array.from(ws.dRa)).toEqual(Array.from(ref.dRa));
        expect(Array.from(ws.dRb)).toEqual(Array.from(ref.dRb));
        for (let i = 0; i < n; i++) {
          const j = i + 1;
          expect(ws.F[i]).toBe(ref.G[j - 1]! * (ws.T[j - 1]! - ws.T[j]!) - ref.G[j]! * (ws.T[j]! - ws.T[j + 1]!) + 0);
        }
      }), { numRuns: 300, seed: 20261202 });
  });

  it('reads a cell held at its phase\'s table row to the bit: a solid between that row and the solidus, a liquid between the liquidus and its row', () => {
    // the random states above seldom put two neighbours there. Salt rows at 400, 415, 445 K: the solid reads k up to
    // 415 K (the last row at or below the 420 K solidus), the liquid from 445 K (the first at or above the 430 K
    // liquidus), so cells at 416–419 K and 431–444 K read their table at its clamp, k(415) = 1.5 and k(445) = 0.5,
    // neither the table's first nor its last value; the plain cell below (418 K) and the top face (443 K) lie in those
    // gaps too, so the salt's half cells toward them read the clamp at the far end as well
    const plain = material('plain', [[50, 20], [100, 30]], 900, undefined);
    const salt = material('salt', [[100, 2], [15, 1.5], [30, 0.5]], 1200, { solidusK: 420, liquidusK: 430, latentJPerKg: 2e5 });
    expect([salt.melt!.solidTableK, salt.melt!.liquidTableK]).toEqual([415, 445]);
    const n = 6;
    const materials = [plain, plain, salt, salt, salt, salt];
    const dx = Float64Array.from({ length: n }, () => 1e-4);
    const grid: Grid = {
      n, dx, xc: new Float64Array(n), totalM: dx.reduce((a, b) => a + b, 0),
      layerOf: Int32Array.of(0, 0, 1, 1, 1, 1), materials, contactAbove: new Float64Array(n),
      layerStart: Int32Array.of(0, 2), layerEnd: Int32Array.of(2, 6),
    };
    const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
    const temps = [380, 418, 416, 419, 433, 441];
    const U = new Float64Array(n + 2);
    U[0] = 370;
    U[n + 1] = 443;
    for (let i = 0; i < n; i++) U[i + 1] = enthalpyAt(materials[i]!.enthalpy, temps[i]!);
    const cond: StepConditions = { bottom: { kind: 'fixed', tK: 370 }, top: { kind: 'fixed', tK: 443 }, source: new Float64Array(n) };
    evaluate(ws, U, cond);
    const ref = reference(grid, ws.T, ws.tau);
    expect(Array.from(ws.G)).toEqual(Array.from(ref.G));
    expect(Array.from(ws.dRa)).toEqual(Array.from(ref.dRa));
    expect(Array.from(ws.dRb)).toEqual(Array.from(ref.dRb));
    // by hand: the two solid cells share k(415 K) = 1.5 W/(m·K), so the face between their centres, 1e-4 m apart,
    // conducts G = 1.5 / 1e-4 = 15 000 W/(m²·K)
    expect(ws.G[3]).toBeCloseTo(1.5 / 1e-4, 9);
    // and the two liquid cells k(445 K) = 0.5 W/(m·K): 5000 W/(m²·K)
    expect(ws.G[5]).toBeCloseTo(0.5 / 1e-4, 9);
  });
});

describe('evaluate() slopes of the series resistances beside two-phase cells', () => {
  it('match central differences of 1/G in every node (the Jacobian terms dRa, dRb)', () => {
    // the exact derivative of a half cell in or beside a melt (kirchhoff.ts meltMean): through the Kirchhoff mean of
    // k(T) in each temperature, T moving with H by τ. A central difference is exact to O(e²) on the smooth pieces;
    // draws with a node within 1 mK of a table row or the melt's ends are skipped (so an isothermal melt's plateau
    // cells, at T_m, only in the first test)
    fc.assert(fc.property(rows, fc.boolean(), fc.array(fc.double({ min: 250, max: 700, noNaN: true }), { minLength: 4, maxLength: 4 }),
      fc.array(fc.double({ min: 0.02, max: 0.98, noNaN: true }), { minLength: 2, maxLength: 2 }), (k, isothermal, temps, fracs) => {
        const salt = material('salt', k, 1200, { solidusK: 420, liquidusK: isothermal ? 420 : 430, latentJPerKg: 2e5 });
        const melt = salt.melt!;
        const n = 4;
        const dx = Float64Array.of(1e-4, 2e-4, 1.5e-4, 1e-4);
        const grid: Grid = {
          n, dx, xc: new Float64Array(n), totalM: 5.5e-4, layerOf: new Int32Array(n), materials: Array.from({ length: n }, () => salt),
          contactAbove: new Float64Array(n), layerStart: Int32Array.of(0), layerEnd: Int32Array.of(n),
        };
        const ws = createWorkspace(grid, { facing: 'down', lengthM: 0.01 }, { facing: 'up', lengthM: 0.01 });
        const U = new Float64Array(n + 2);
        U[0] = temps[0]!;
        U[1] = enthalpyAt(salt.enthalpy, temps[1]!);
        // cells 2 and 3 two-phase; cell 1 and the faces anywhere
        U[2] = melt.hSolidus + fracs[0]! * (melt.hLiquidus - melt.hSolidus);
        U[3] = melt.hSolidus + fracs[1]! * (melt.hLiquidus - melt.hSolidus);
        U[4] = enthalpyAt(salt.enthalpy, temps[2]!);
        U[5] = temps[3]!;
        const cond: StepConditions = { bottom: { kind: 'fixed', tK: U[0] }, top: { kind: 'fixed', tK: U[5] }, source: new Float64Array(n) };
        evaluate(ws, U, cond);
        const T = Array.from(ws.T);
        const near = (t: number) => [...Array.from(salt.conductivity.tK), melt.solidusK, melt.liquidusK].some((x) => Math.abs(x - t) < 1e-3);
        if (T.some(near)) return true;
        const dRa = Array.from(ws.dRa);
        const dRb = Array.from(ws.dRb);
        const G = Array.from(ws.G);
        for (let node = 0; node <= n + 1; node++) {
          const e = node === 0 || node === n + 1 ? 1e-5 : 1e-5 * 2000 * 1200;
          const inv = (v: number) => { const W = U.slice(); W[node] = v; evaluate(ws, W, cond); return Array.from(ws.G, (g) => 1 / g); };
          const up = inv(U[node]! + e);
          const down = inv(U[node]! - e);
          for (const face of [node - 1, node]) {
            if (face < 0 || face > n) continue;
            const fd = (up[face]! - down[face]!) / (2 * e);
            const exact = face === node ? dRa[face]! : dRb[face]!;
            const scale = Math.abs(fd) + 1e-9 / (G[face]! * Math.abs(e));
            if (!(Math.abs(exact - fd) <= 1e-5 * scale)) throw new Error(`face ${face}, node ${node}: ${exact} vs ${fd}`);
          }
        }
        return true;
      }), { numRuns: 300, seed: 20261203 });
  });
});
