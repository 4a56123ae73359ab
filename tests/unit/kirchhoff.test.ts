// The half-cell conductivity of grid/kirchhoff.ts against closed forms: the mean of a linear k(T) = a + b·T over
// [T₁, T₂] is a + b·(T₁ + T₂)/2 (the integral of a linear function, exact), a table held flat outside its rows gives
// the exact piecewise integral, and the slopes match central differences. Then the property the transform is for
// (Carslaw & Jaeger, Conduction of Heat in Solids, 1959, §1.7): the series flux between two cells rises with the one
// temperature and falls with the other for any positive table, however steep.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clampedTableMean, halfCellConductivity, meltConductivity } from '../../sim/grid/kirchhoff.ts';
import type { Material } from '../../sim/physics/material.ts';
import { buildMaterial, temperatureOf } from '../../sim/physics/material.ts';
import { withMeltRamp } from '../../sim/physics/melt-ramp.ts';
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

/**
 * ∫_a^b g by adaptive Simpson quadrature to an absolute error of about eps (Lyness, Notes on the adaptive Simpson
 * quadrature routine, J. ACM 16, 1969): halves an interval until Simpson's rule on it and on its two halves agree to
 * 15·eps, then takes the Richardson-corrected sum.
 */
function adaptiveSimpson(g: (t: number) => number, a: number, b: number, eps: number): number {
  const simpson = (x0: number, x1: number, f0: number, fm: number, f1: number) => ((x1 - x0) / 6) * (f0 + 4 * fm + f1);
  const step = (x0: number, x1: number, f0: number, fm: number, f1: number, whole: number, tol: number, depth: number): number => {
    const m = (x0 + x1) / 2;
    const fl = g((x0 + m) / 2);
    const fr = g((m + x1) / 2);
    const left = simpson(x0, m, f0, fl, fm);
    const right = simpson(m, x1, fm, fr, f1);
    if (depth <= 0 || Math.abs(left + right - whole) <= 15 * tol) return left + right + (left + right - whole) / 15;
    return step(x0, m, f0, fl, fm, left, tol / 2, depth - 1) + step(m, x1, fm, fr, f1, right, tol / 2, depth - 1);
  };
  const fa = g(a);
  const fm = g((a + b) / 2);
  const fb = g(b);
  return step(a, b, fa, fm, fb, simpson(a, b, fa, fm, fb), eps, 40);
}

// A melting material's half cell (grid/kirchhoff.ts halfCellConductivity): the Kirchhoff mean toward the neighbour of
// one k(T), the solid's reading below the solidus (its table held flat above the solid row), the liquid's above the
// liquidus (held flat below the liquid row), the two in series by the melt's liquid fraction at T between them, a jump
// at an isothermal melt. Φ(T) = ∫k dT is continuous through the melt, so the mean is continuous in both temperatures,
// and the flux (2/Δx)·(Φ(T_own) − Φ(T_nb)) is monotone in both, whatever the cell's phase (Carslaw & Jaeger, Conduction
// of Heat in Solids, 1959, §1.7). Read by phase at the cell's point value it jumped at the solidus (e.g. 83.6 ↔ 91.4
// kW/m²K in fuzz seed 12 case 1359, and Newton cycled between the two); read by the cell's liquid fraction it changed
// with the cell's enthalpy at a fixed temperature, and a front parked on an isothermal plateau cycled (fuzz seed 18
// case 9151; tests/validation/melt-conduction.test.ts).
describe('halfCellConductivity() of a melting material', () => {
  const scratch = new Float64Array(2);
  const rows = fc.array(fc.tuple(fc.double({ min: 1, max: 60, noNaN: true }), fc.double({ min: 0.05, max: 400, noNaN: true })), { minLength: 2, maxLength: 7 });
  /** A temperature across the melt (400–430 K) and the rows around it, K. */
  const kelvin = fc.double({ min: 250, max: 700, noNaN: true });
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

  /** The steepest slope of the melt's k(T): the table's, and the series mix's k²·|1/k_l − 1/k_s|/(T_l − T_s). */
  const steepestMelt = (m: Material) => {
    const melt = m.melt!;
    const width = melt.liquidusK - melt.solidusK;
    const kMax = Math.max(melt.kSolid, melt.kLiquid);
    return Math.max(steepest(m), width > 0 ? (kMax * kMax * Math.abs(1 / melt.kLiquid - 1 / melt.kSolid)) / width : 0);
  };

  it('is continuous across the solidus and the liquidus from both sides, to round-off, on random tables', () => {
    fc.assert(fc.property(rows, fc.boolean(), kelvin, (k, isothermal, nb) => {
      const m = salt(k, isothermal);
      const melt = m.melt!;
      for (const edge of [melt.hSolidus, melt.hLiquidus]) {
        const tEdge = tOf(m, edge);
        const at = halfCellConductivity(m, tEdge, nb, scratch);
        for (const up of [false, true]) {
          const t = tOf(m, next(edge, up));
          const near = halfCellConductivity(m, t, nb, scratch);
          // what one ulp of H moves: the steepest slope of k(T) times the temperature step (twice, for the mean), and
          // at an isothermal melt the jump k_l − k_s over the share dT/|T_nb − T_m| of the mean's interval; plus 1e-13 of k̄
          const dT = Math.abs(t - tEdge);
          const tol = 2 * steepestMelt(m) * dT + (Math.abs(melt.kLiquid - melt.kSolid) * dT) / Math.abs(nb - tEdge) + 1e-13 * at;
          if (!(Math.abs(near - at) <= tol)) throw new Error(`${up ? 'above' : 'below'} H = ${edge}: ${near} vs ${at} (tol ${tol})`);
        }
      }
    }), { seed: 1202, numRuns: 400 });
  });

  it('has the slopes of central differences of its mean in both temperatures, in and across the melt', () => {
    fc.assert(fc.property(rows, fc.boolean(), kelvin, kelvin,
      (k, isothermal, own, nb) => {
        const m = salt(k, isothermal);
        const melt = m.melt!;
        const e = 1e-5;
        // a table row or an end of the melt within e of either temperature makes a difference one-sided: skip those
        const kinks = [...Array.from(m.conductivity.tK), melt.solidusK, melt.liquidusK];
        if (kinks.some((x) => Math.abs(x - nb) < 2 * e || Math.abs(x - own) < 2 * e) || Math.abs(own - nb) < 1e-3) return true;
        const kBar = halfCellConductivity(m, own, nb, scratch);
        const [dOwn, dNb] = [scratch[0]!, scratch[1]!];
        const mean = (a: number, b: number) => halfCellConductivity(m, a, b, scratch);
        const fdOwn = (mean(own + e, nb) - mean(own - e, nb)) / (2 * e);
        const fdNb = (mean(own, nb + e) - mean(own, nb - e)) / (2 * e);
        // central differences: exact to O(e²·k''') on the smooth pieces, and to round-off of k̄/e
        const tol = (fd: number) => 1e-5 * (Math.abs(fd) + kBar / 50) + (steepestMelt(m) * e) / Math.abs(own - nb);
        return Math.abs(dOwn - fdOwn) <= tol(fdOwn) && Math.abs(dNb - fdNb) <= tol(fdNb);
      }), { seed: 1203, numRuns: 400 });
  });

  it('is the mean of k(T) over the two temperatures: adaptive Simpson quadrature through the melt agrees', () => {
    // the closed form of the series mix's integral, ∫ dT/(r_s + f(T)·Δr) = (w/Δr)·ln(r_b/r_a) (kirchhoff.ts
    // meltIntegral), against a plain quadrature of meltConductivity() on each smooth piece
    fc.assert(fc.property(rows, fc.boolean(), kelvin, kelvin,
      (k, isothermal, a0, b0) => {
        const m = salt(k, isothermal);
        const melt = m.melt!;
        const [a, b] = a0 < b0 ? [a0, b0] : [b0, a0];
        if (b - a < 1e-6) return true;
        const cuts = [a, ...[...Array.from(m.conductivity.tK), melt.solidusK, melt.liquidusK].filter((x) => x > a && x < b).sort((x, y) => x - y), b];
        let sum = 0;
        for (let c = 0; c + 1 < cuts.length; c++) {
          const [lo, hi] = [cuts[c]!, cuts[c + 1]!];
          // the open piece's values (its lower end read from inside the piece: k may jump at T_m)
          sum += adaptiveSimpson((t) => meltConductivity(m.conductivity, melt, t, t <= lo), lo, hi, 1e-12 * (hi - lo));
        }
        const mean = halfCellConductivity(m, a, b, scratch);
        return Math.abs(mean * (b - a) - sum) <= 1e-9 * Math.abs(sum);
      }), { seed: 1205, numRuns: 300 });
  });

  it('is finite with zero slopes for two cells at T_m of an isothermal melt, k_s = k_l too', () => {
    // the two sides' mean, (k_s + k_l)/2: no heat flows between the two and their T does not move with H. With
    // k_s = k_l the slope of the series mix, −k²·(1/k_l − 1/k_s)/(T_l − T_s), is 0/0 here (fuzz: face-balance-23 and six
    // other kept scenarios turned NaN when it was taken at T_m)
    for (const [kS, kL] of [[1, 1], [2, 0.45], [0.45, 2]] as const) {
      const m = salt([[99, kS], [2, kL]], true); // rows 399 and 401 K around T_m = 400 K
      const out = new Float64Array([NaN, NaN]);
      expect(halfCellConductivity(m, 400, 400, out)).toBe((kS + kL) / 2);
      expect(Array.from(out)).toEqual([0, 0]);
    }
  });

  it('has no jump at T_m once the melt ramp smooths an isothermal melt: the series mix over T_m ± δ', () => {
    // the ramp (physics/melt-ramp.ts) spreads the latent heat over T_m ± δ; k passes from k_s to k_l over the same
    // interval, in series by a fraction linear in T, as for a melting range of width 2δ: k_s at T_m − δ, k_l at
    // T_m + δ, the harmonic mean of the two at T_m from either side
    const m = withMeltRamp(salt([[99, 2], [2, 0.45]], true), 0.1);
    const melt = m.melt!;
    const table = m.conductivity;
    expect(meltConductivity(table, melt, 400, false)).toBe(meltConductivity(table, melt, 400, true));
    expect(meltConductivity(table, melt, 400, true)).toBeCloseTo(1 / (0.5 / 2 + 0.5 / 0.45), 12);
    expect(meltConductivity(table, melt, 400 - 0.1, true)).toBeCloseTo(2, 12);
    expect(meltConductivity(table, melt, 400 + 0.1, false)).toBeCloseTo(0.45, 12);
    // and the half cell across it is continuous in either temperature through T_m
    const out = new Float64Array(2);
    const below = halfCellConductivity(m, 400 - 1e-9, 380, out);
    const above = halfCellConductivity(m, 400 + 1e-9, 380, out);
    expect(Math.abs(above - below)).toBeLessThan(1e-8);
  });

  it('at one temperature reads k there: inside a range with half of dk/dT on each end, at its ends with slopes 0', () => {
    // inside the melting range 400–430 K the series mix is smooth: its slope against a central difference of
    // meltConductivity(); at T_s and T_l the two sides' slopes differ and the mean of the values is taken, slopes 0
    const m = salt([[99, 2], [32, 0.45]], false); // rows 399 and 431 K: k_s = 2, k_l = 0.45
    const melt = m.melt!;
    const out = new Float64Array(2);
    for (const t of [401, 415, 429.5]) {
      const k = halfCellConductivity(m, t, t, out);
      expect(k).toBe(meltConductivity(m.conductivity, melt, t, true));
      const e = 1e-4;
      const dk = (meltConductivity(m.conductivity, melt, t + e, true) - meltConductivity(m.conductivity, melt, t - e, true)) / (2 * e);
      assertClose(out[0]!, dk / 2, { rel: 1e-6 }, `∂k̄/∂T_own at ${t} K`);
      assertClose(out[1]!, dk / 2, { rel: 1e-6 }, `∂k̄/∂T_nb at ${t} K`);
    }
    expect(halfCellConductivity(m, 400, 400, out)).toBe(2);
    expect(Array.from(out)).toEqual([0, 0]);
    expect(halfCellConductivity(m, 430, 430, out)).toBeCloseTo(0.45, 12);
    expect(Array.from(out)).toEqual([0, 0]);
  });

  it('reads the neighbour at T_m of an isothermal melt on the side facing the cell (its slope as it moves toward it)', () => {
    // own at 390 K (solid), neighbour exactly at T_m = 400 K: the mean is of k_s over [390, 400], and moving the
    // neighbour toward the cell keeps it there, so ∂k̄/∂T_nb is 0 (read on the far side, k_l, it would be (k_l − k_s)/10)
    const m = salt([[99, 2], [2, 0.45]], true);
    const out = new Float64Array(2);
    expect(halfCellConductivity(m, 390, 400, out)).toBe(2);
    const e = 1e-6;
    const toward = (halfCellConductivity(m, 390, 400, new Float64Array(2)) - halfCellConductivity(m, 390, 400 - e, new Float64Array(2))) / e;
    expect(out[1]).toBe(toward);
  });

  it('keeps a melting range as it is under the melt ramp (only an isothermal melt is spread over T_m ± δ)', () => {
    // the ramp smooths the range's capacity kinks, but k is already continuous there: k_s up to the solidus
    const m = withMeltRamp(salt([[99, 2], [32, 0.45]], false), 0.1);
    expect(meltConductivity(m.conductivity, m.melt!, 400 - 0.05, true)).toBe(2);
    expect(meltConductivity(m.conductivity, m.melt!, 430 + 0.05, false)).toBe(0.45);
  });

  it('keeps the series flux monotone in both temperatures beside a cell in its melt, for any liquid fraction', () => {
    fc.assert(fc.property(rows, rows, fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 260, max: 690, noNaN: true }),
      fc.double({ min: 0.01, max: 100, noNaN: true }), fc.boolean(), (k1, k2, f, nb, bump, isothermal) => {
        const m = salt(k1, isothermal);
        const plain = solid(k2);
        const melt = m.melt!;
        // a two-phase cell at fraction f beside a cell of a material without a melt, colder or hotter, through a
        // contact resistance
        const h = melt.hSolidus + Math.min(Math.max(f, 1e-9), 1 - 1e-9) * (melt.hLiquidus - melt.hSolidus);
        const own = tOf(m, h);
        const flux = (tNb: number) => (own - tNb) / (0.5e-3 / halfCellConductivity(m, own, tNb, scratch) + 1e-5
          + 0.5e-3 / halfCellConductivity(plain, tNb, own, scratch));
        const q = flux(nb);
        return flux(Math.max(nb - bump, 250)) >= q && flux(Math.min(nb + bump, 700)) <= q;
      }), { seed: 1204, numRuns: 500 });
  });
});
