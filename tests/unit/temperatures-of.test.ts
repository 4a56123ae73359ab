// temperaturesOf() (sim/physics/material.ts), the layer-by-layer T(H) kernel of evaluate(), against the inverse of
// the enthalpy method's H(T) written out here: on a segment whose capacity runs linearly from c_l, H − H_i =
// c_l·d + ½·s·d² (Alexiades & Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993, ch. 4), so
// d = (−c_l + √(c_l² + 2·s·ΔH))/s and dT/dH = 1/(c_l + s·d); and against temperatureOf(), the scalar form it replaces
// in the hot loop, which must give the same bits (same operations in the same order).

import { describe, expect, it } from 'vitest';
import type { Table } from '../../sim/physics/material.ts';
import { buildMaterial, curveSlopes, enthalpyAt, temperatureOf, temperaturesOf } from '../../sim/physics/material.ts';
import { assertClose } from '../support/assert-close.ts';
import { seededRandom } from '../support/scenarios.ts';

const K0 = 273.15;
const table = (rows: [number, number][]): Table => ({ tK: Float64Array.from(rows, (r) => r[0] + K0), y: Float64Array.from(rows, (r) => r[1]) });

/** An invented salt: c_p rising 800 → 1200 J/(kg·K) over 0–600 °C, a 10 K melting range at 350 °C, 2e5 J/kg. */
const salt = buildMaterial({
  name: 'test-salt', title: 'test salt', conductivity: table([[0, 1]]), density: 2000,
  specificHeat: table([[0, 800], [300, 1000], [600, 1200]]),
  melt: { solidusK: 345 + K0, liquidusK: 355 + K0, latentJPerKg: 2e5 }, limits: [], sources: {},
});
/** An invented isothermal melt (a jump in H at 300 °C). */
const eutectic = buildMaterial({
  name: 'test-eutectic', title: 'test eutectic', conductivity: table([[0, 1]]), density: 2000,
  specificHeat: table([[0, 900], [500, 1100]]),
  melt: { solidusK: 300 + K0, liquidusK: 300 + K0, latentJPerKg: 2e5 }, limits: [], sources: {},
});

describe('temperaturesOf()', () => {
  it('temperaturesOf() inverts H(T) on a sloped-capacity segment as the quadratic formula does', () => {
    const curve = salt.enthalpy;
    const slopes = curveSlopes(curve);
    // 150 °C: on the segment from 0 °C (c_l = 2000·800) to 300 °C (c_r = 2000·1000); H measured from 0 °C here
    const cl = 2000 * 800;
    const s = (2000 * 1000 - cl) / 300;
    const d = 150;
    const U = Float64Array.of(0, enthalpyAt(curve, K0) + cl * d + 0.5 * s * d * d, 0);
    const T = new Float64Array(3);
    const tau = new Float64Array(3);
    temperaturesOf(curve, slopes, U, 0, 1, new Int32Array(1), T, tau);
    // round-off of H near 3e8 J/m³ over c ~ 2e6: ~1e-10 K
    assertClose(T[1]!, K0 + d, { abs: 1e-9 }, 'T at 150 °C');
    assertClose(tau[1]!, 1 / (cl + s * d), { rel: 1e-12 }, 'dT/dH at 150 °C');
  });

  it('temperaturesOf() gives the same bits as temperatureOf() across both curves, below, inside and above them', () => {
    const rand = seededRandom(42);
    for (const material of [salt, eutectic]) {
      const curve = material.enthalpy;
      const slopes = curveSlopes(curve);
      const n = 400;
      const U = new Float64Array(n + 2);
      // temperatures from −1300 °C to 2000 °C (beyond the curve's bracket on both sides), and the melt's own enthalpies
      for (let i = 1; i <= n; i++) U[i] = enthalpyAt(curve, K0 - 1300 + 3300 * rand());
      const melt = material.melt!;
      U[1] = melt.hSolidus;
      U[2] = melt.hLiquidus;
      U[3] = 0.5 * (melt.hSolidus + melt.hLiquidus);
      const hints = Int32Array.from({ length: n }, () => Math.floor(rand() * 12) - 2);
      const scalarHints = Int32Array.from(hints);
      const T = new Float64Array(n + 2);
      const tau = new Float64Array(n + 2);
      temperaturesOf(curve, slopes, U, 0, n, hints, T, tau);
      const out = new Float64Array(2);
      for (let i = 0; i < n; i++) {
        scalarHints[i] = temperatureOf(curve, U[i + 1]!, scalarHints[i]!, out);
        expect(T[i + 1], `T of cell ${i} (${material.name})`).toBe(out[0]);
        expect(tau[i + 1], `dT/dH of cell ${i} (${material.name})`).toBe(out[1]);
        expect(hints[i], `segment of cell ${i} (${material.name})`).toBe(scalarHints[i]);
      }
    }
  });

  it('temperaturesOf() writes only the cells it is given', () => {
    const curve = eutectic.enthalpy;
    const U = Float64Array.of(0, 1e8, 2e8, 3e8, 0);
    const T = new Float64Array(5).fill(-1);
    const tau = new Float64Array(5).fill(-1);
    temperaturesOf(curve, curveSlopes(curve), U, 1, 3, new Int32Array(3), T, tau);
    expect(Array.from(T)).toEqual([-1, -1, T[2], T[3], -1]);
    expect(Array.from(tau)).toEqual([-1, -1, tau[2], tau[3], -1]);
  });
});
