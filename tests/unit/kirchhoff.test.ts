// The half-cell conductivity of grid/kirchhoff.ts against closed forms: the mean of a linear k(T) = a + b·T over
// [T₁, T₂] is a + b·(T₁ + T₂)/2 (the integral of a linear function, exact), a table held flat outside its rows gives
// the exact piecewise integral, and the slopes match central differences. Then the property the transform is for
// (Carslaw & Jaeger, Conduction of Heat in Solids, 1959, §1.7): the series flux between two cells rises with the one
// temperature and falls with the other for any positive table, however steep.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clampedTableMean } from '../../sim/grid/kirchhoff.ts';
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
