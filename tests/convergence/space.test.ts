// Observed order of accuracy in space: the plane wall at Bi = 1 (eigenfunction series of Incropera & DeWitt,
// Fundamentals of Heat and Mass Transfer, 6th ed., eqs. 5.39a–c) on grids refined 1×, 2×, 4×, 8×, with the time error
// held far below the space error. Cell-centred finite volumes with smoothly graded cells are second order
// (Patankar, Numerical Heat Transfer and Fluid Flow, 1980, ch. 4); the log–log slope must be within 0.1 of 2.

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { planeWallSeries } from '../support/closed-forms.ts';
import { PLAIN, observedOrder, probeAt, runOk, slab } from '../support/scenarios.ts';

describe('convergence in space', () => {
  it('runProblem() with refine = 1, 2, 4, 8 converges at order 2 ± 0.1 on the Bi = 1 plane wall', () => {
    const probes = [0, 2.5, 5, 7.5, 10];
    const t = 100; // Fo = 0.5
    const refinements = [1, 2, 4, 8];
    const errors = refinements.map((refine) => {
      const { record } = runOk(slab({
        material: PLAIN, thickness_mm: 10, initial_C: 220, ambient_C: 20, duration_s: t,
        top: [{ from_s: 0, convection_W_m2K: 100 }],
        output: { times_s: [t], probes_mm: probes },
        // 10 cells at refine 1 (80 at refine 8). tolerance_K = 1e-6 keeps the time error near 1e-5 K, below 1 % of the
        // finest grid's space error (2.2e-3 K).
        numerics: { cells_per_mm: 1, min_cells_per_layer: 5, tolerance_K: 1e-6 },
      }), { refine });
      return Math.max(...probes.map((x) =>
        Math.abs(probeAt(record, x, t) - (20 + 200 * planeWallSeries({ Bi: 1, Fo: 0.5, xStar: x / 10, terms: 100 })))));
    });
    // cell size ∝ 1/refine; measured errors 0.140, 0.035, 8.8e-3, 2.2e-3 K (slope 1.99)
    const order = observedOrder(refinements.map((r) => 1 / r), errors);
    assertClose(order, 2, { abs: 0.1 }, `observed order ${order} from errors ${errors.join(', ')} K`);
  });
});
