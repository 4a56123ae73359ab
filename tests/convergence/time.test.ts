// Observed order of accuracy in time: the plane wall at Bi = 1 (eigenfunction series of Incropera & DeWitt,
// Fundamentals of Heat and Mass Transfer, 6th ed., eqs. 5.39a–c) on a fine grid with fixed steps halved three times.
// TR-BDF2 is second order (Bank et al., IEEE Trans. Electron Devices 32, 1985; Hosea & Shampine, Appl. Numer. Math. 20,
// 1996), backward Euler first order; each log–log slope must be within 0.1 of that order.

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { planeWallSeries } from '../support/closed-forms.ts';
import { PLAIN, observedOrder, probeAt, runOk, slab } from '../support/scenarios.ts';

const probes = [0, 2.5, 5, 7.5, 10];
const DURATION = 96; // Fo = 0.48, a whole number of every step below
const STEPS = [16, 8, 4, 2];

function errorWithStep(fixedStepS: number, backwardEuler: boolean): number {
  const { record } = runOk(slab({
    material: PLAIN, thickness_mm: 10, initial_C: 220, ambient_C: 20, duration_s: DURATION,
    top: [{ from_s: 0, convection_W_m2K: 100 }],
    output: { times_s: [DURATION], probes_mm: probes },
    // max_step_s no smaller than the fixed step, so the fixed step is the step taken
    numerics: { cells_per_mm: 4, min_cells_per_layer: 8, max_step_s: DURATION },
  }), { refine: 16, stepping: { kind: 'fixed', stepS: fixedStepS, scheme: backwardEuler ? 'backward-euler' : 'tr-bdf2' } });
  return Math.max(...probes.map((x) =>
    Math.abs(probeAt(record, x, DURATION) - (20 + 200 * planeWallSeries({ Bi: 1, Fo: DURATION / 200, xStar: x / 10, terms: 100 })))));
}

describe('convergence in time', () => {
  // 640 cells: the space error (≈ 3e-5 K, 1/256 of the 40-cell error) stays below 10 % of the smallest time error.
  it('runProblem() with fixed steps of 16, 8, 4, 2 s converges at order 2 ± 0.1 (TR-BDF2)', () => {
    const errors = STEPS.map((h) => errorWithStep(h, false));
    // measured errors 2.67e-2, 6.72e-3, 1.67e-3, 4.27e-4 K (slope 1.99)
    const order = observedOrder(STEPS, errors);
    assertClose(order, 2, { abs: 0.1 }, `observed order ${order} from errors ${errors.join(', ')} K`);
  });

  it('runProblem() with fixed backward-Euler steps of 16, 8, 4, 2 s converges at order 1 ± 0.1', () => {
    const errors = STEPS.map((h) => errorWithStep(h, true));
    // measured errors 1.66, 0.809, 0.397, 0.197 K (slope 1.02)
    const order = observedOrder(STEPS, errors);
    assertClose(order, 1, { abs: 0.1 }, `observed order ${order} from errors ${errors.join(', ')} K`);
  });
});
