// The melt ramp of sim/physics/melt-ramp.ts against the enthalpy method's definition H(T) = ∫ρcp dT + ρL·f(T)
// (Voller & Swaminathan 1990; Alexiades & Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993,
// ch. 4), written out here for invented materials with round numbers: the ramp may move latent heat by at most δ in
// temperature, never add or remove it, and leaves the liquid fraction a function of the enthalpy as before.

import { describe, expect, it } from 'vitest';
import type { Material, Table } from '../../sim/physics/material.ts';
import { buildMaterial, enthalpyAt, liquidFractionOf, temperatureOf, withEnthalpyOrigin } from '../../sim/physics/material.ts';
import { withMeltRamp } from '../../sim/physics/melt-ramp.ts';
import type { Problem } from '../../sim/physics/problem.ts';
import { runProblem } from '../../sim/run.ts';
import { assertClose } from '../support/assert-close.ts';
import { flat, parseOk, slab } from '../support/scenarios.ts';

const K0 = 273.15;
const RHO = 2000;
const CP = 1000;
const LATENT = 2e5;
const RAMP = 0.1;
const flatCp: Table = { tK: Float64Array.of(K0, 1000 + K0), y: Float64Array.of(CP, CP) };

function material(solidusC: number, liquidusC: number, cp: Table = flatCp): Material {
  return buildMaterial({
    name: 'test', title: 'test', conductivity: { tK: Float64Array.of(K0), y: Float64Array.of(1) }, density: RHO, specificHeat: cp,
    melt: { solidusK: solidusC + K0, liquidusK: liquidusC + K0, latentJPerKg: LATENT }, limits: [], sources: {},
  });
}

/** H(T) − H(0 °C) by the definition, flat cp, sharp melt (no ramp), J/m³. */
function sharp(tC: number, solidusC: number, liquidusC: number): number {
  const f = tC <= solidusC ? 0 : tC >= liquidusC ? 1 : (tC - solidusC) / (liquidusC - solidusC);
  return RHO * CP * tC + RHO * LATENT * (liquidusC === solidusC && tC === solidusC ? 1 : f);
}

// Tolerance: sums of trapezoids of ~1e9 J/m³, round-off only: 1e-12 relative of the largest enthalpy.
const H_TOL = { abs: 1e-12 * (RHO * CP * 400 + RHO * LATENT) };
const melts: [string, number, number][] = [['an isothermal melt', 300, 300], ['a 4 K melting range', 300, 304], ['a 0.1 K melting range', 300, 300.1]];

describe('withMeltRamp()', () => {
  it.each(melts)('keeps H(T) of %s at and beyond solidus − δ and liquidus + δ', (_what, s, l) => {
    const ramped = withMeltRamp(material(s, l), RAMP);
    const at = (tC: number) => enthalpyAt(ramped.enthalpy, tC + K0) - enthalpyAt(ramped.enthalpy, K0);
    for (const tC of [100, s - 5, s - RAMP, l + RAMP, l + 5, 600]) {
      assertClose(at(tC), sharp(tC, s, l), H_TOL, `H(${tC} °C) − H(0 °C), J/m³`);
    }
  });

  it('keeps H(T) inside a melting range wider than 2δ, between solidus + δ and liquidus − δ', () => {
    const ramped = withMeltRamp(material(300, 304), RAMP);
    for (const tC of [300 + RAMP, 301, 302.5, 304 - RAMP]) {
      assertClose(enthalpyAt(ramped.enthalpy, tC + K0) - enthalpyAt(ramped.enthalpy, K0), sharp(tC, 300, 304), H_TOL, `H(${tC} °C), J/m³`);
    }
  });

  it.each(melts)('moves T(H) of %s by less than δ, and only within δ of the solidus or liquidus', (_what, s, l) => {
    const plain = material(s, l);
    const ramped = withMeltRamp(plain, RAMP);
    const out = new Float64Array(2);
    const h0 = enthalpyAt(plain.enthalpy, (s - 1) + K0);
    const h1 = enthalpyAt(plain.enthalpy, (l + 1) + K0);
    for (let k = 0; k <= 400; k++) {
      const h = h0 + ((h1 - h0) * k) / 400;
      temperatureOf(plain.enthalpy, h, 0, out);
      const tSharp = out[0]! - K0;
      temperatureOf(ramped.enthalpy, h, 0, out);
      const tRamp = out[0]! - K0;
      expect(Math.abs(tRamp - tSharp), `T at H step ${k}`).toBeLessThanOrEqual(RAMP);
      const near = Math.abs(tSharp - s) < RAMP || Math.abs(tSharp - l) < RAMP || (tSharp >= s && tSharp <= l && l - s < 2 * RAMP);
      // elsewhere the two curves are the same quadratic pieces: round-off only (1e-9 K)
      if (!near) assertClose(tRamp, tSharp, { abs: 1e-9 }, `T(H) away from the ramps, step ${k}`);
    }
  });

  it.each(melts)('reads the liquid fraction of %s from the enthalpy as without the ramp', (_what, s, l) => {
    const plain = withEnthalpyOrigin(material(s, l), 1e8);
    const ramped = withEnthalpyOrigin(withMeltRamp(material(s, l), RAMP), 1e8);
    const out = new Float64Array(2);
    const h0 = plain.melt!.hSolidus - 1e5;
    const h1 = plain.melt!.hLiquidus + 1e5;
    expect([ramped.melt!.hSolidus, ramped.melt!.hLiquidus]).toEqual([plain.melt!.hSolidus, plain.melt!.hLiquidus]);
    for (let k = 0; k <= 100; k++) {
      const h = h0 + ((h1 - h0) * k) / 100;
      temperatureOf(plain.enthalpy, h, 0, out);
      const fPlain = liquidFractionOf(plain, h, out[0]!);
      temperatureOf(ramped.enthalpy, h, 0, out);
      // the lever rule of the unramped curve at the same H: equal up to the round trip (1e-9)
      assertClose(liquidFractionOf(ramped, h, out[0]!), fPlain, { abs: 1e-9 }, `f at H step ${k}`);
    }
  });

  it('leaves a material that does not melt, and a zero ramp, as they are', () => {
    const solid = buildMaterial({ name: 's', title: 's', conductivity: { tK: Float64Array.of(K0), y: Float64Array.of(1) }, density: RHO, specificHeat: flatCp, limits: [], sources: {} });
    expect(withMeltRamp(solid, RAMP)).toBe(solid);
    const m = material(300, 300);
    expect(withMeltRamp(m, 0)).toBe(m);
  });

  it('smooths the kinks away: the capacity is continuous (no jump left for Newton to stop at)', () => {
    const ramped = withMeltRamp(material(300, 304), RAMP);
    const e = ramped.enthalpy;
    expect(e.kinks.length).toBe(0);
    // capacity at the right end of each segment equals the next one's left end (piecewise linear, continuous)
    for (let i = 0; i + 1 < e.cLeft.length; i++) assertClose(e.cRight[i]!, e.cLeft[i + 1]!, { rel: 1e-12 }, `capacity at knot ${i + 1}`);
  });

  // The initial temperature is read on the curve as written (material.ts writtenCurve): a file that starts a layer just
  // above (below) its isothermal melt starts it liquid (solid), with or without the ramp. On the ramped curve
  // T_m ± 1e-6 K lies on the hat's middle, and the layer started half liquid (found on the one-phase Stefan problem,
  // whose liquid starts at its melting point).
  it.each([[1e-6, 1], [-1e-6, 0]])('starts a layer at T_m %s K in the phase the file gives it, not the ramp\'s', (offset, liquid) => {
    const file = slab({
      material: { k_W_mK: 1, rho_kg_m3: RHO, cp_J_kgK: flat(CP), melt: { solidus_C: 300, liquidus_C: 300, latent_J_kg: LATENT } },
      thickness_mm: 1, separator: true, duration_s: 1, initial_C: 300 + offset, ambient_C: 300 + offset,
      numerics: { cells_per_mm: 8, separator_cells_per_mm: 8 },
    });
    const problem = parseOk(file);
    const ramped: Problem = { ...problem, numerics: { ...problem.numerics, accuracy: { ...problem.numerics.accuracy!, meltRampK: RAMP } } };
    for (const p of [problem, ramped]) {
      const out = runProblem(p);
      if (out.status !== 'ok') throw new Error(JSON.stringify(out));
      const f = out.record.layers[0]!.liquidFraction!;
      // an adiabatic layer at rest: its liquid fraction stays what it started at (exactly 0 or 1: the lever rule on the
      // curve as written reads the enthalpy of the initial state itself)
      expect(f[0]).toBe(liquid);
      expect(f[f.length - 1]).toBe(liquid);
    }
  });
});
