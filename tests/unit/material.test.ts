// The enthalpy–temperature relation of sim/physics/material.ts against the enthalpy method's definition
// H(T) = ∫ρcp dT + ρL·f(T), f a linear ramp over [solidus, liquidus] or a jump at an isothermal melt (Voller &
// Swaminathan 1990; Alexiades & Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993, ch. 4),
// written out here for invented materials with round numbers.

import { describe, expect, it } from 'vitest';
import type { Material, Table } from '../../sim/physics/material.ts';
import { buildMaterial, enthalpyAt, liquidFractionOf, temperatureOf } from '../../sim/physics/material.ts';
import { assertClose } from '../support/assert-close.ts';

const K0 = 273.15;
/** A table in K from rows in °C. */
const table = (rows: [number, number][]): Table => ({ tK: Float64Array.from(rows, (r) => r[0] + K0), y: Float64Array.from(rows, (r) => r[1]) });
/** A constant given as one number: the file form `cp_J_kgK: 1000` becomes a one-row table (sim/scenario/material-file.ts). */
const single = (v: number): Table => table([[0, v]]);

const RHO = 2000;
const LATENT = 2e5;
function material(cp: Table, melt?: { solidusC: number; liquidusC: number }): Material {
  return buildMaterial({
    name: 'test', title: 'test', conductivity: single(1), density: RHO, specificHeat: cp,
    melt: melt ? { solidusK: melt.solidusC + K0, liquidusK: melt.liquidusC + K0, latentJPerKg: LATENT } : undefined,
    limits: [], sources: {},
  });
}

/** H(T2) − H(T1) by the definition, for constant cp (J/m³). */
function enthalpyRise(cp: number, t1C: number, t2C: number, melt?: { solidusC: number; liquidusC: number }): number {
  const f = (tC: number) => !melt ? 0 : tC <= melt.solidusC ? 0 : tC >= melt.liquidusC ? 1
    : (tC - melt.solidusC) / (melt.liquidusC - melt.solidusC);
  return RHO * cp * (t2C - t1C) + RHO * LATENT * (f(t2C) - f(t1C));
}

// Tolerances: H is built by exact sums of trapezoids of a piecewise-linear capacity, so only round-off in sums of
// up to ~1e9 J/m³ remains: 1e-12 relative of the larger enthalpy, 1e-9 K on a round trip.
const H_TOL = (scale: number) => ({ abs: 1e-12 * Math.max(Math.abs(scale), 1e6) });

describe('enthalpyAt() and temperatureOf()', () => {
  const forms: [string, Table][] = [['a flat two-row table', table([[0, 1000], [1000, 1000]])], ['one number', single(1000)]];

  it.each(forms)('enthalpyAt() of a constant cp given as %s rises by ρcp per kelvin', (_form, cp) => {
    const m = material(cp);
    for (const [a, b] of [[20, 21], [-50, 400], [300, 900]] as const) {
      const rise = enthalpyAt(m.enthalpy, b + K0) - enthalpyAt(m.enthalpy, a + K0);
      assertClose(rise, enthalpyRise(1000, a, b), H_TOL(rise), `H(${b} °C) − H(${a} °C), J/m³`);
    }
  });

  const melts: [string, Table, { solidusC: number; liquidusC: number }][] = [
    ['an isothermal melt, flat table', table([[0, 1000], [1000, 1000]]), { solidusC: 300, liquidusC: 300 }],
    ['a 4 K mushy range, flat table', table([[0, 1000], [1000, 1000]]), { solidusC: 300, liquidusC: 304 }],
    ['a 4 K mushy range, cp one number', single(1000), { solidusC: 300, liquidusC: 304 }],
    ['a 4 K mushy range, cp table ending below the melt', table([[0, 1000], [200, 1000]]), { solidusC: 300, liquidusC: 304 }],
    ['an isothermal melt, cp one number', single(1000), { solidusC: 300, liquidusC: 300 }],
  ];

  it.each(melts)('enthalpyAt() across %s adds ρL to the sensible ρcp·ΔT, below, inside and above the melt', (_what, cp, melt) => {
    const m = material(cp, melt);
    const base = enthalpyAt(m.enthalpy, 100 + K0);
    for (const tC of [150, 299, 301, 302, 303.5, 305, 320, 600]) {
      if (melt.solidusC === melt.liquidusC && tC > melt.solidusC && tC < melt.solidusC + 1e-9) continue;
      const rise = enthalpyAt(m.enthalpy, tC + K0) - base;
      assertClose(rise, enthalpyRise(1000, 100, tC, melt), H_TOL(rise), `H(${tC} °C) − H(100 °C), J/m³`);
    }
    assertClose(m.melt!.hLiquidus - m.melt!.hSolidus, RHO * LATENT + RHO * 1000 * (melt.liquidusC - melt.solidusC),
      H_TOL(RHO * LATENT), 'H(liquidus) − H(solidus), J/m³');
  });

  const roundTrips: [string, Table, { solidusC: number; liquidusC: number } | undefined][] = [
    ['a rising cp table and a mushy range', table([[0, 800], [250, 1000], [310, 1300], [500, 1200]]), { solidusC: 290, liquidusC: 305 }],
    ['a rising cp table and an isothermal melt', table([[0, 800], [250, 1000], [500, 1200]]), { solidusC: 300, liquidusC: 300 }],
    ['a rising cp table without melt', table([[0, 800], [250, 1000], [500, 1200]]), undefined],
  ];

  it.each(roundTrips)('temperatureOf(enthalpyAt(T)) returns T, with dT/dH = 1/(dH/dT), for %s', (_what, cp, melt) => {
    const m = material(cp, melt);
    const out = new Float64Array(2);
    let hint = 0;
    for (let tC = -100; tC <= 700; tC += 0.37) {
      const tK = tC + K0;
      const h = enthalpyAt(m.enthalpy, tK);
      hint = temperatureOf(m.enthalpy, h, hint, out);
      // Tolerance 1e-9 K: the inverse of a quadratic segment in cancellation-free form, relative error ~1e-15 of H.
      assertClose(out[0]!, tK, { abs: 1e-9 }, `T(H(${tC.toFixed(2)} °C))`);
      // dH/dT by a central difference of enthalpyAt (error O(δ²·dC/dT) ≪ 1e-6 relative with δ = 1e-4 K), away from kinks
      const delta = 1e-4;
      const kinks = [...(melt ? [melt.solidusC, melt.liquidusC] : []), 250, 310, 0, 500];
      if (kinks.some((k) => Math.abs(tC - k) < 2 * delta)) continue;
      const slope = (enthalpyAt(m.enthalpy, tK + delta) - enthalpyAt(m.enthalpy, tK - delta)) / (2 * delta);
      assertClose(out[1]!, 1 / slope, { rel: 1e-6 }, `dT/dH at ${tC.toFixed(2)} °C`);
    }
  });

  it('enthalpyAt() is strictly increasing in T and temperatureOf() non-decreasing in H across a mushy and an isothermal melt', () => {
    for (const melt of [{ solidusC: 290, liquidusC: 305 }, { solidusC: 300, liquidusC: 300 }]) {
      const m = material(table([[0, 800], [250, 1000], [500, 1200]]), melt);
      let previousH = -Infinity;
      for (let tC = 0; tC <= 600; tC += 0.5) {
        const h = enthalpyAt(m.enthalpy, tC + K0);
        expect(h, `H(${tC} °C)`).toBeGreaterThan(previousH);
        previousH = h;
      }
      const out = new Float64Array(2);
      const h0 = enthalpyAt(m.enthalpy, K0);
      const h1 = enthalpyAt(m.enthalpy, 600 + K0);
      let previousT = -Infinity;
      for (let k = 0; k <= 2000; k++) {
        temperatureOf(m.enthalpy, h0 + ((h1 - h0) * k) / 2000, 0, out);
        expect(out[0]!).toBeGreaterThanOrEqual(previousT);
        expect(out[1]!).toBeGreaterThanOrEqual(0);
        previousT = out[0]!;
      }
    }
  });

  it('temperatureOf() holds an isothermal melt at Tm with dT/dH = 0 while the latent heat is taken up', () => {
    const m = material(table([[0, 1000], [1000, 1000]]), { solidusC: 300, liquidusC: 300 });
    const { hSolidus, hLiquidus } = m.melt!;
    const out = new Float64Array(2);
    for (const share of [0.01, 0.25, 0.5, 0.99]) {
      const h = hSolidus + share * (hLiquidus - hSolidus);
      temperatureOf(m.enthalpy, h, 0, out);
      assertClose(out[0]!, 300 + K0, { abs: 1e-9 }, `T at liquid share ${share}`);
      assertClose(out[1]!, 0, { abs: 0 }, 'dT/dH on the plateau');
      assertClose(liquidFractionOf(m, h, out[0]!), share, { abs: 1e-12 }, 'liquid fraction (lever rule in H)');
    }
  });

  it('liquidFractionOf() is 0 below the solidus, 1 above the liquidus and linear in T between', () => {
    const m = material(table([[0, 1000], [1000, 1000]]), { solidusC: 300, liquidusC: 304 });
    for (const [tC, f] of [[250, 0], [300, 0], [301, 0.25], [302, 0.5], [303, 0.75], [304, 1], [400, 1]] as const) {
      const h = enthalpyAt(m.enthalpy, tC + K0);
      assertClose(liquidFractionOf(m, h, tC + K0), f, { abs: 1e-12 }, `f(${tC} °C)`);
    }
  });
});
