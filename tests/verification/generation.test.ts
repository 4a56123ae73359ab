// Uniform volumetric generation (source_W_m3): the steady slab with both faces held (Incropera & DeWitt, Fundamentals
// of Heat and Mass Transfer, 6th ed., eq. 3.42) and the adiabatic rise ΔT = q̇t/(ρcp) (first law for a closed system).
// Closed forms from tests/support/closed-forms.ts.

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { adiabaticGenerationRise, uniformGenerationSlabSteady } from '../support/closed-forms.ts';
import { flat, probeAt, runOk, slab } from '../support/scenarios.ts';

describe('uniform heat generation', () => {
  // 10 mm slab (half-thickness L = 5 mm), k = 2 W/m·K, ρcp = 2e6 J/m³·K, q̇ = 1e7 W/m³, both faces held at 100 °C:
  // the centre sits q̇L²/(2k) = 62.5 K above the faces; the slowest mode decays with (2L)²/(π²α) ≈ 10 s.
  const qdot = 1e7;
  const probes = [0, 1, 2.5, 5, 7.5, 9, 10];
  const steady = (duration: number) => runOk(slab({
    material: { k_W_mK: 2, rho_kg_m3: 2000, cp_J_kgK: flat(1000) }, thickness_mm: 10, initial_C: 100, duration_s: duration,
    source_W_m3: qdot,
    bottom: [{ from_s: 0, fixed_C: 100 }], top: [{ from_s: 0, fixed_C: 100 }],
    output: { times_s: [duration], probes_mm: probes },
    numerics: { cells_per_mm: 4, min_cells_per_layer: 8 },
  }));

  it('runProblem() with a constant source and held faces reaches Ts + q̇L²/(2k)·(1 − x²/L²) (eq. 3.42)', () => {
    const { record } = steady(400);
    const T = uniformGenerationSlabSteady({ qdot, k: 2, L: 5e-3, Ts: 100 });
    for (const x of probes) {
      // Tolerance 0.01 K (1.6e-4 of the 62.5 K rise): second-order finite volumes; the node error of the three-point
      // scheme on this graded grid is ≤ (q̇/k)·Δx²/8 ≈ 0.06 K at the coarsest cell and shrinks 4× per halving, and
      // the interpolated probes are better still. Transient left after 40 decay times: none. Measured: 2.3e-3 K.
      assertClose(probeAt(record, x, 400), T(x / 1000 - 5e-3), { abs: 0.01 }, `T(${x} mm)`);
    }
  });

  it('runProblem() at steady state sends q̇L out of each held face, and the ledger counts q̇·2L·t generated', () => {
    const first = steady(400);
    const second = steady(500);
    // heat out of each face over [400 s, 500 s], from the ledgers of the two runs
    const bottomQ = (second.record.energy.bottomOutJ - first.record.energy.bottomOutJ) / 100;
    const topQ = (second.record.energy.topOutJ - first.record.energy.topOutJ) / 100;
    // Tolerance 1e-6 relative: at steady state the face flux of the held node is the exact integral of the source
    // over the half-slab (finite volumes conserve it cell by cell); only the Newton tolerance remains. Measured: 1e-14.
    assertClose(bottomQ, qdot * 5e-3, { rel: 1e-6 }, 'heat out of the bottom face, W/m²');
    assertClose(topQ, qdot * 5e-3, { rel: 1e-6 }, 'heat out of the top face, W/m²');
    // a constant source over a step is integrated exactly
    assertClose(second.record.energy.sourceJ, qdot * 10e-3 * 500, { rel: 1e-12 }, 'heat generated, J/m²');
  });

  it('runProblem() with a source for 50 s in an adiabatic slab raises it uniformly by q̇t/(ρcp) and then holds it', () => {
    const source = 2e5; // W/m³ for 50 s in ρcp = 2e6 J/m³·K: 5 K
    const { record, summary } = runOk(slab({
      material: { k_W_mK: 2, rho_kg_m3: 2000, cp_J_kgK: flat(1000) }, thickness_mm: 3, initial_C: 100, duration_s: 100,
      source_W_m3: [{ from_s: 0, to_s: 50, value: source }],
      output: { times_s: [25, 50, 100], probes_mm: [0, 1.5, 3] },
    }));
    for (const [t, heated] of [[25, 25], [50, 50], [100, 50]] as const) {
      const expected = 100 + adiabaticGenerationRise({ qdot: source, rho: 2000, cp: 1000, t: heated });
      // Exact for the scheme: uniform H growing linearly in time is integrated without truncation error (every
      // Runge–Kutta method is exact for a constant right-hand side). Tolerance 1e-9 K for round-off. Measured: 1.3e-12 K.
      for (const x of [0, 1.5, 3]) assertClose(probeAt(record, x, t), expected, { abs: 1e-9 }, `T(${x} mm, ${t} s)`);
    }
    assertClose(summary.heat_off_s ?? Number.NaN, 50, { abs: 0 }, 'heat_off_s: the end of the positive source');
  });
});
