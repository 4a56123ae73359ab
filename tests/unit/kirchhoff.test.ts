// The half-cell conductivity of grid/kirchhoff.ts against closed forms: the mean of a linear k(T) = a + b·T over
// [T₁, T₂] is a + b·(T₁ + T₂)/2 (the integral of a linear function, exact), a table held flat outside its rows gives
// the exact piecewise integral, and the slopes match central differences. Then the property the transform is for
// (Carslaw & Jaeger, Conduction of Heat in Solids, 1959, §1.7): the series flux between two cells rises with the one
// temperature and falls with the other for any positive table, however steep.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clampedTableMean, halfCellConductivity } from '../../sim/grid/kirchhoff.ts';
import type { Material } from '../../sim/physics/material.ts';
import { buildMaterial, enthalpyAt, temperatureOf } from '../../sim/physics/material.ts';
import type { Table } from '../../sim/physics/table.ts';
import { assertClose } from '../support/assert-close.ts';

const table = (rows: [number, number][]): Table => ({ tK: Float64Array.from(rows, (r) => r[0]), y: Float64Array.from(rows, (r) => r[1]) });
const out = new Float64Array(2);
const mean = (t: Table, a: number, b: number, lo = -Infinity, hi = Infinity) => clampedTableMean(t, lo, hi, a, b, out);

describe('clampedTableMean()', () => {
  it('gives a + b·(T₁ + T₂)/2 for a linear k over its rows, and half the slope on each end', () => {
    const k = table([[300, 10], [900, 70]]); // k = 10 + 0.1·(T − 300)
    assertClose(mean(k, 400, 800), 10 + 0.1 * (600 - 300), { rel: 1e-14 });
    expect(out[0]).toBeCloseTo(0.05, 14);
    expect(out[1]).toBeCloseTo(0.05, 14);
  });

  it('integrates across rows and the flat ends exactly (hand-computed trapezoids)', () => {
    const k = table([[500, 1], [510, 101]]);
    // ∫_400^600: 100 K at 1, the ramp 10 K × mean 51, 90 K at 101 → 100 + 510 + 9090 = 9700 over 200 K
    assertClose(mean(k, 400, 600), 9700 / 200, { rel: 1e-14 });
    assertClose(mean(k, 600, 400), 9700 / 200, { rel: 1e-14 });
    // held flat above 505 K (a solid read up to its solid row): ∫_400^600 = 100·1 + 5·(1 + 51)/2 + 95·51 = 5075
    assertClose(mean(k, 400, 600, -Infinity, 505), 5075 / 200, { rel: 1e-14 });
  });

  it('has the slopes of a central difference of the mean', () => {
    const k = table([[500, 1], [503, 40], [520, 60]]);
    const [a, b, e] = [498, 515, 1e-4];
    mean(k, a, b);
    const [da, db] = [out[0]!, out[1]!];
    const fd = (f: (x: number) => number, x: number) => (f(x + e) - f(x - e)) / (2 * e);
    // central differences are exact to O(e²·k'') away from the rows: 1e-6 relative
    assertClose(da, fd((x) => mean(k, x, b), a), { rel: 1e-6 });
    assertClose(db, fd((x) => mean(k, a, x), b), { rel: 1e-6 });
  });
});

describe('the Kirchhoff series flux', () => {
  it('rises with the warmer temperature and falls with the colder one for random steep tables', () => {
    const rows = fc.array(fc.tuple(fc.double({ min: 0.1, max: 50, noNaN: true }), fc.double({ min: 0.01, max: 500, noNaN: true })), { minLength: 2, maxLength: 5 });
    fc.assert(fc.property(rows, rows, fc.double({ min: 200, max: 2000, noNaN: true }), fc.double({ min: 0, max: 1500, noNaN: true }),
      fc.double({ min: 0.01, max: 100, noNaN: true }), (r1, r2, cold, rise, bump) => {
        const mk = (r: [number, number][]) => { let t = 900; return table(r.map(([dt, k]) => [(t += dt), k])); };
        const [k1, k2] = [mk(r1), mk(r2)];
        const flux = (ti: number, tj: number) => (ti - tj) / (0.5e-3 / mean(k1, ti, tj) + 1e-5 + 0.5e-3 / mean(k2, tj, ti));
        const hot = cold + rise;
        const q = flux(hot, cold);
        // monotone in each argument (a steep table broke this with k read at the cell's own temperature)
        return flux(hot + bump, cold) >= q && flux(hot, cold - bump) >= q;
      }), { seed: 9, numRuns: 500 });
  });
});

// A melting material's half cell at the solidus and the liquidus (grid/kirchhoff.ts halfCellConductivity): a solid
// cell reads its table held flat above the solid row, a liquid cell below the liquid row, and a two-phase cell puts
// the two Kirchhoff means toward the neighbour in series by liquid fraction. At f → 0 and f → 1 that is the solid's
// and the liquid's value, so the conductance has no jump at either end (with the point mush value it jumped, e.g.
// 83.6 ↔ 91.4 kW/m²K in fuzz seed 12 case 1359, and Newton cycled between the two). The continuity and the monotone
// series flux are properties of Kirchhoff's transform (Carslaw & Jaeger, Conduction of Heat in Solids, 1959, §1.7):
// each part's flux is (2/Δx)·(Φ(T_own) − Φ(T_nb)), monotone in both temperatures, and a series (harmonic) mix of
// monotone fluxes is monotone.
describe('halfCellConductivity() of a melting material', () => {
  const scratch = new Float64Array(3);
  const rows = fc.array(fc.tuple(fc.double({ min: 1, max: 60, noNaN: true }), fc.double({ min: 0.05, max: 400, noNaN: true })), { minLength: 2, maxLength: 7 });
  const next = (x: number, up: boolean) => {
    const f = new Float64Array([x]);
    const b = new BigInt64Array(f.buffer);
    b[0] = b[0]! + ((x >= 0) === up ? 1n : -1n);
    return f[0]!;
  };
  /** k rows from 300 K upwards by the drawn gaps, so the melt (400–430 K or isothermal at 400 K) falls among them. */
  const salt = (k: [number, number][], isothermal: boolean): Material => {
    let t = 300;
    return buildMaterial({
      name: 'salt', title: 'salt', density: 2000, limits: [], sources: {},
      conductivity: { tK: Float64Array.from(k, (r) => (t += r[0])), y: Float64Array.from(k, (r) => r[1]) },
      specificHeat: { tK: Float64Array.of(300), y: Float64Array.of(1200) },
      melt: { solidusK: 400, liquidusK: isothermal ? 400 : 430, latentJPerKg: 2e5 },
    });
  };
  const solid = (k: [number, number][]): Material => {
    let t = 300;
    return buildMaterial({
      name: 'plain', title: 'plain', density: 3000, limits: [], sources: {},
      conductivity: { tK: Float64Array.from(k, (r) => (t += r[0])), y: Float64Array.from(k, (r) => r[1]) },
      specificHeat: { tK: Float64Array.of(300), y: Float64Array.of(800) }, melt: undefined,
    });
  };
  const tOf = (m: Material, h: number) => { const o = new Float64Array(2); temperatureOf(m.enthalpy, h, 0, o); return o[0]!; };
  const steepest = (m: Material) => {
    const { tK, y } = m.conductivity;
    let s = 0;
    for (let i = 0; i + 1 < tK.length; i++) s = Math.max(s, Math.abs((y[i + 1]! - y[i]!) / (tK[i + 1]! - tK[i]!)));
    return s;
  };

  it('is continuous across the solidus and the liquidus from both sides, to round-off, on random tables', () => {
    fc.assert(fc.property(rows, fc.boolean(), fc.double({ min: 250, max: 700, noNaN: true }), (k, isothermal, nb) => {
      const m = salt(k, isothermal);
      const melt = m.melt!;
      for (const edge of [melt.hSolidus, melt.hLiquidus]) {
        const at = halfCellConductivity(m, edge, tOf(m, edge), nb, scratch);
        for (const up of [false, true]) {
          const h = next(edge, up);
          const t = tOf(m, h);
          const near = halfCellConductivity(m, h, t, nb, scratch);
          // what one ulp of H moves: the table's steepest slope times the temperature step (twice, for the mean), and
          // k̄²·|∂(1/k̄)/∂f| times the step in liquid fraction; plus 1e-13 of k̄ for round-off
          const dT = Math.abs(t - tOf(m, edge));
          const df = Math.max(dT / (melt.liquidusK - melt.solidusK || Infinity), Math.abs(h - edge) / (melt.hLiquidus - melt.hSolidus));
          const tol = 2 * steepest(m) * dT + near * near * Math.abs(scratch[2]!) * df * 2 + 1e-13 * at;
          if (!(Math.abs(near - at) <= tol)) throw new Error(`${up ? 'above' : 'below'} H = ${edge}: ${near} vs ${at} (tol ${tol})`);
        }
      }
    }), { seed: 1202, numRuns: 400 });
  });

  it('has the slopes of a central difference of its mean in a two-phase cell, and ∂(1/k̄)/∂f in out[2]', () => {
    fc.assert(fc.property(rows, fc.double({ min: 0.05, max: 0.95, noNaN: true }), fc.double({ min: 250, max: 700, noNaN: true }), (k, f, nb) => {
      const m = salt(k, true);
      const melt = m.melt!;
      const h = melt.hSolidus + f * (melt.hLiquidus - melt.hSolidus);
      const own = tOf(m, h);
      const kBar = halfCellConductivity(m, h, own, nb, scratch);
      const [dNb, dF] = [scratch[1]!, scratch[2]!];
      const e = 1e-5;
      // a row of the table within e of the neighbour makes the difference one-sided: skip those draws
      if (m.conductivity.tK.some((x) => Math.abs(x - nb) < 2 * e)) return true;
      const atNb = (x: number) => halfCellConductivity(m, h, own, x, scratch);
      const fdNb = (atNb(nb + e) - atNb(nb - e)) / (2 * e);
      const dh = 1e-6 * (melt.hLiquidus - melt.hSolidus);
      const inv = (x: number) => 1 / halfCellConductivity(m, x, own, nb, scratch);
      const fdF = ((inv(h + dh) - inv(h - dh)) / (2 * dh)) * (melt.hLiquidus - melt.hSolidus);
      // central differences: exact to round-off of k̄/e on a piecewise-linear table away from its rows
      return Math.abs(dNb - fdNb) <= 1e-6 * (Math.abs(fdNb) + kBar / 50) && Math.abs(dF - fdF) <= 1e-6 * (Math.abs(fdF) + 1 / kBar);
    }), { seed: 1203, numRuns: 300 });
  });

  it('keeps the series flux monotone in both temperatures beside a two-phase cell, for any liquid fraction', () => {
    fc.assert(fc.property(rows, rows, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 260, max: 690, noNaN: true }),
      fc.double({ min: 0.01, max: 100, noNaN: true }), fc.boolean(), (k1, k2, f, nb, bump, isothermal) => {
        const m = salt(k1, isothermal);
        const plain = solid(k2);
        const melt = m.melt!;
        // a two-phase cell at fraction f (its own temperature held with it) beside a cell of a material without a melt,
        // colder or hotter, through a contact resistance
        const h = melt.hSolidus + Math.min(Math.max(f, 1e-9), 1 - 1e-9) * (melt.hLiquidus - melt.hSolidus);
        const own = tOf(m, h);
        const flux = (tNb: number) => (own - tNb) / (0.5e-3 / halfCellConductivity(m, h, own, tNb, scratch) + 1e-5
          + 0.5e-3 / halfCellConductivity(plain, enthalpyAt(plain.enthalpy, tNb), tNb, own, scratch));
        const q = flux(nb);
        return flux(Math.max(nb - bump, 250)) >= q && flux(Math.min(nb + bump, 700)) <= q;
      }), { seed: 1204, numRuns: 500 });
  });
});
