// Semi-infinite solid: a 20 mm slab over 20 s, whose far face barely feels the surface (x/(2√(αt)) = 3.2 there), held
// at a fixed surface temperature (erfc solution, Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed.,
// eq. 5.57) or given a constant flux (ierfc solution, Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed., §2.9;
// Incropera eq. 5.59). Closed forms from tests/support/closed-forms.ts.

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { semiInfiniteConstantFlux, semiInfiniteFixedSurface } from '../support/closed-forms.ts';
import { erfc, ierfc } from '../support/special.ts';
import { PLAIN, last, probeAt, runOk, slab, toC, toK } from '../support/scenarios.ts';
import type { FaceSegmentFile } from '../../sim/scenario/scenario-schema.ts';

const ALPHA = 5e-7; // k/(ρcp) of PLAIN, m²/s
const THICKNESS_MM = 20;
const DURATION = 20;
const times = [5, 10, 20];
const probes = [0, 0.5, 1, 2, 4, 6];

const run = (bottom: FaceSegmentFile[]) => runOk(slab({
  material: PLAIN, thickness_mm: THICKNESS_MM, initial_C: 20, duration_s: DURATION, bottom,
  output: { times_s: times, probes_mm: probes },
  // 8 cells/mm (160 cells, graded finer at the faces) and a tight step tolerance: the check is of the space
  // discretisation, whose error the comments below estimate.
  numerics: { cells_per_mm: 8, min_cells_per_layer: 8, tolerance_K: 1e-3 },
}));

/** u = ℓ/(2√(αt)) at the far face (ℓ = 20 mm): 3.2 at the end of the run. */
const farU = (t: number) => THICKNESS_MM / 1000 / (2 * Math.sqrt(ALPHA * t));

describe('semi-infinite solid', () => {
  it('runProblem() with the bottom face held by fixed_C follows Ts + (Ti − Ts)·erf(x/2√(αt)) (Incropera eq. 5.57)', () => {
    const { record } = run([{ from_s: 0, fixed_C: 220 }]);
    for (const t of times) {
      for (const x of probes) {
        const expected = toC(semiInfiniteFixedSurface({ Ti: toK(20), Ts: toK(220), alpha: ALPHA, x: x / 1000, t }));
        // Tolerance 0.03 K (1.5e-4 of the 200 K step): the three-point flux has a truncation error ≈ (Δx²/12)·T⁗,
        // i.e. ≈ (Δx/δ)²/12·ΔT with δ = 2√(αt) = 3.2 mm at 5 s and Δx ≤ 0.16 mm: 0.04 K at the worst cell, less at
        // the probes. Measured: 0.012 K (at 4 mm, 5 s, where the erfc profile bends most sharply).
        assertClose(probeAt(record, x, t), expected, { abs: 0.03 }, `T(${x} mm, ${t} s)`);
      }
    }
    // The far, adiabatic face is a mirror: with its image source the far face rises by 2·ΔT·erfc(u) ≈ 3e-3 K (method
    // of images, Carslaw & Jaeger §2.4), so the slab was semi-infinite for this check. Measured: 3.15e-3 K.
    assertClose(last(record.topC) - 20, 2 * 200 * erfc(farU(DURATION)), { abs: 1e-3 }, 'rise of the far face');
  });

  it('runProblem() with a constant flux_W_m2 follows Ti + (2q√(αt)/k)·ierfc(x/2√(αt)) (Carslaw & Jaeger §2.9)', () => {
    const q = 2e4;
    const { record, summary } = run([{ from_s: 0, flux_W_m2: q }]);
    for (const t of times) {
      for (const x of probes) {
        const expected = toC(semiInfiniteConstantFlux({ Ti: toK(20), q0: q, k: 1, alpha: ALPHA, x: x / 1000, t }));
        // Tolerance 0.03 K (3e-4 of the 100 K surface rise at 20 s): the same (Δx/δ)²/12 estimate; the flux case is
        // smoother than the erfc case (no jump at t = 0). Measured: 0.009 K (at the surface, 5 s).
        assertClose(probeAt(record, x, t), expected, { abs: 0.03 }, `T(${x} mm, ${t} s)`);
      }
    }
    // The imposed flux enters exactly: q·t into the face (quadrature of a constant is exact), up to the face
    // balance's Newton residual. Tolerance 1e-9 relative. Measured: 2e-15.
    assertClose(summary.energy.in_J_m2, q * DURATION, { rel: 1e-9 }, 'heat in, J/m²');
    // Far face, by the method of images: 2·(2q√(αt)/k)·ierfc(u) ≈ 3e-4 K. Measured: 2.9e-4 K.
    assertClose(last(record.topC) - 20, 2 * (2 * q * Math.sqrt(ALPHA * DURATION)) * ierfc(farU(DURATION)), { abs: 1e-4 }, 'rise of the far face');
  });
});
