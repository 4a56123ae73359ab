// Lumped capacitance: a thin, very conductive slab (Bi ≪ 0.1) cooled by convection or by radiation alone follows the
// lumped closed forms of Incropera & DeWitt, Fundamentals of Heat and Mass Transfer (6th ed.), eqs. 5.6 and 5.18.
// The materials are invented; the closed forms (tests/support/closed-forms.ts) are the reference.

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { lumpedConvectiveCooling, lumpedRadiativeCoolingTime } from '../support/closed-forms.ts';
import { brent } from '../support/special.ts';
import { flat, probeAt, runOk, slab, toC, toK } from '../support/scenarios.ts';

describe('lumped convective cooling (Incropera eq. 5.6)', () => {
  // 1 mm slab, k = 1000 W/m·K, ρcp = 2e6 J/m³·K, h = 10 W/m²·K on both faces:
  // V/A = 0.5 mm, τ = ρcp(V/A)/h = 100 s, Bi = h(V/A)/k = 5e-6.
  const h = 10;
  const times = [50, 100, 200, 300];
  const probes = [0, 0.5, 1];
  const cooling = (cp: number | [number, number][]) => slab({
    material: { k_W_mK: 1000, rho_kg_m3: 2000, cp_J_kgK: cp },
    thickness_mm: 1, initial_C: 400, ambient_C: 20, duration_s: 300,
    bottom: [{ from_s: 0, convection_W_m2K: h }], top: [{ from_s: 0, convection_W_m2K: h }],
    output: { times_s: times, probes_mm: probes },
    numerics: { max_step_s: 0.25 },
  });
  const expected = (t: number) =>
    toC(lumpedConvectiveCooling({ T0: toK(400), Tinf: toK(20), h, rho: 2000, cp: 1000, V_over_A: 0.5e-3, t }));
  // Tolerance 4e-3 K: the exact slab departs from the lumped curve by θ·Bi·(1/6 − x*²/2 + t/3τ) (first term of the
  // plane-wall series expanded in Bi), at most 1.2·Bi·380 K ≈ 2.3e-3 K here; TR-BDF2 at h ≤ 0.25 s adds
  // ≈ (h/τ)²·ΔT/12 ≈ 2e-4 K. Measured: 3.5e-4 K.
  const tolerance = { abs: 4e-3 };

  it('runProblem() cools a thin conductive slab along T∞ + (T0 − T∞)·exp(−t/τ) at every probe', () => {
    const { record } = runOk(cooling(flat(1000)));
    for (const t of times) for (const x of probes) assertClose(probeAt(record, x, t), expected(t), tolerance, `T(${x} mm, ${t} s)`);
  });

  it('runProblem() gives the same lumped curve when cp is written as a plain number', () => {
    // cp_J_kgK: 1000 is the same material as the flat table above (DESIGN.md: a property is a number or a table).
    const { record } = runOk(cooling(1000));
    for (const t of times) for (const x of probes) assertClose(probeAt(record, x, t), expected(t), tolerance, `T(${x} mm, ${t} s)`);
  });
});

describe('lumped radiative cooling (Incropera eq. 5.18)', () => {
  // 2 mm slab, k = 1e4 W/m·K, ρcp = 2e6 J/m³·K, ε = 0.8 on both faces, surroundings 20 °C, from 600 °C.
  // V/A = 1 mm; the radiative coefficient 4εσT³ is at most ≈ 120 W/m²·K, so Bi ≤ 1.2e-5.
  const eps = 0.8;
  const times = [5, 20, 50, 100, 200];
  const probes = [0, 1, 2];

  it('runProblem() with emissivity only follows the time–temperature relation of eq. 5.18', () => {
    const { record } = runOk(slab({
      material: { k_W_mK: 1e4, rho_kg_m3: 2000, cp_J_kgK: flat(1000) },
      thickness_mm: 2, initial_C: 600, ambient_C: 20, duration_s: 200,
      bottom: [{ from_s: 0, emissivity: eps }], top: [{ from_s: 0, emissivity: eps, surroundings_C: 20 }],
      output: { times_s: times, probes_mm: probes },
      numerics: { tolerance_K: 1e-4, max_step_s: 0.5 },
    }));
    const timeToReach = (T: number) =>
      lumpedRadiativeCoolingTime({ T0: toK(600), T, Tsur: toK(20), eps, rho: 2000, cp: 1000, V_over_A: 1e-3 });
    for (const t of times) {
      // eq. 5.18 gives t(T); T(t) is its root, found to 1e-10 K by Brent's method.
      const expected = toC(brent((T) => timeToReach(T) - t, toK(20) + 1e-6, toK(600), 1e-10));
      // Tolerance 0.01 K (2e-5 of the 580 K drop): the lumped model is off by O(Bi·ΔT) ≈ 1e-3 K (the face–centre
      // difference of the slab), and the controller at tolerance_K = 1e-4 keeps the accumulated time error to a few
      // 1e-3 K over ~420 steps. Measured: 2.3e-3 K.
      for (const x of probes) assertClose(probeAt(record, x, t), expected, { abs: 0.01 }, `T(${x} mm, ${t} s)`);
    }
  });
});
