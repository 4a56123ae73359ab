// Plane wall at Bi = 1 against the exact eigenfunction series (Incropera & DeWitt, Fundamentals of Heat and Mass
// Transfer, 6th ed., eqs. 5.39a–c; tests/support/closed-forms.ts planeWallSeries): a slab of half-thickness L with
// one face convective and the other adiabatic is one half of the symmetric wall of the textbook.

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { planeWallEnergyFraction, planeWallSeries } from '../support/closed-forms.ts';
import { PLAIN, probeAt, runOk, slab } from '../support/scenarios.ts';

describe('plane wall, Bi = 1 (eigenfunction series)', () => {
  // L = 10 mm, k = 1 W/m·K, α = 5e-7 m²/s, h = 100 W/m²·K: Bi = hL/k = 1, Fo = αt/L² = t/200 s.
  const Ti = 220;
  const Tinf = 20;
  const fourier = [0.05, 0.2, 0.5, 1];
  const times = fourier.map((Fo) => Fo * 200);
  const probes = [0, 2.5, 5, 7.5, 10]; // x* = x/L from the adiabatic (bottom) face
  const run = () => runOk(slab({
    material: PLAIN, thickness_mm: 10, initial_C: Ti, ambient_C: Tinf, duration_s: 200,
    top: [{ from_s: 0, convection_W_m2K: 100, fluid_C: Tinf }],
    output: { times_s: times, probes_mm: probes },
    numerics: { tolerance_K: 1e-3, cells_per_mm: 4, min_cells_per_layer: 8 },
  }));

  it('runProblem() matches θ* = Σ Cₙ exp(−ζₙ²Fo) cos(ζₙx*) at five depths and four Fourier numbers', () => {
    const { record } = run();
    times.forEach((t, j) => {
      for (const x of probes) {
        const theta = planeWallSeries({ Bi: 1, Fo: fourier[j]!, xStar: x / 10, terms: 100 });
        // Tolerance 0.05 K (2.5e-4 of the 200 K span): second-order finite volumes on 40 cells, observed order 2 in
        // tests/convergence/space.test.ts (8.7e-3 K with 40 cells at Fo = 0.5); the worst point
        // is the convective face at Fo = 0.05, where the gradient is steepest. 100 series terms leave < 1e-8 at
        // Fo ≥ 0.05. Measured: 0.026 K.
        assertClose(probeAt(record, x, t), Tinf + (Ti - Tinf) * theta, { abs: 0.05 }, `T(x* = ${x / 10}, Fo = ${fourier[j]})`);
      }
    });
  });

  it('summary.energy.out_J_m2 is the share Q/Q₀ = 1 − Σ Cₙ (sin ζₙ/ζₙ) exp(−ζₙ²Fo) of the initial excess energy', () => {
    const { summary } = run();
    const q0 = 2000 * 1000 * 0.01 * (Ti - Tinf); // ρcp·L·(Ti − T∞), J/m²
    // Tolerance 1e-4 of Q₀: the energy that left is the face flux integrated by the method's own quadrature, so it
    // carries the same second-order error as the temperatures (≈ 0.026 K / 200 K ≈ 1.3e-4 at the face, less on average).
    assertClose(summary.energy.out_J_m2 / q0, planeWallEnergyFraction({ Bi: 1, Fo: 1, terms: 100 }), { abs: 1e-4 }, 'Q/Q₀ at Fo = 1');
  });
});
