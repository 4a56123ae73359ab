// Radiative loss at a face: a grey surface in large isothermal surroundings loses ε·σ·(T⁴ − Tsur⁴) (Incropera &
// DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., eq. 1.7), with σ = 5.670374419e-8 W/m²·K⁴ (CODATA 2018).

import { describe, it } from 'vitest';
import { faceHeatIn } from '../../sim/physics/faces.ts';
import { assertClose } from '../support/assert-close.ts';
import { brent } from '../support/special.ts';
import { flat, last, runOk, slab, toK } from '../support/scenarios.ts';

const SIGMA = 5.670374419e-8;

describe('Stefan–Boltzmann radiation at a face', () => {
  it('faceHeatIn() with emissivity 0.5 at 773.15 K in 293.15 K surroundings is −εσ(T⁴ − Tsur⁴) ≈ −9.92 kW/m²', () => {
    // by hand: 773.15⁴ = 3.5732e11, 293.15⁴ = 7.385e9; σ·(difference) = 19 842 W/m²; × 0.5 = 9 921 W/m²
    const byHand = 0.5 * SIGMA * (773.15 ** 4 - 293.15 ** 4);
    assertClose(byHand, 9921, { rel: 1e-3 }, 'hand loss, W/m²');
    const out = new Float64Array(1);
    const q = faceHeatIn({
      kind: 'terms', fluxWPerM2: 0, convection: { kind: 'none' }, fluidK: 293.15, emissivity: 0.5, surroundingsK: 293.15, plate: undefined,
    }, { facing: 'up', lengthM: 0 }, 773.15, out);
    // Tolerance 1e-12 relative: the same formula, evaluated in a different order.
    assertClose(q, -byHand, { rel: 1e-12 }, 'heat into the face, W/m²');
    assertClose(out[0]!, -4 * 0.5 * SIGMA * 773.15 ** 3, { rel: 1e-12 }, 'dq/dT, W/m²·K');
  });

  it('runProblem() at steady state balances conduction k(Tb − Ts)/ℓ against εσ(Ts⁴ − Tsur⁴) at the top face', () => {
    // 10 mm of k = 1 W/m·K held at 500 °C below, emissivity 0.5 above, surroundings 20 °C.
    const run = (duration: number) => runOk(slab({
      material: { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: flat(1000) }, thickness_mm: 10, initial_C: 20, ambient_C: 20,
      duration_s: duration,
      bottom: [{ from_s: 0, fixed_C: 500 }], top: [{ from_s: 0, emissivity: 0.5, surroundings_C: 20 }],
      // a tight step tolerance: Newton stops within newtonShare·tolerance_K ≤ 1e-6 K (evolveDefaults.newtonShare ≤ 1e-2)
      numerics: { tolerance_K: 1e-4 },
    }));
    const first = run(3000);
    const second = run(4000);
    const tb = toK(500);
    const tsur = toK(20);
    // the balance solved by hand (Brent's method on the one unknown Ts)
    const ts = brent((t) => (1 * (tb - t)) / 0.01 - 0.5 * SIGMA * (t ** 4 - tsur ** 4), tsur, tb, 1e-12);
    const q = 0.5 * SIGMA * (ts ** 4 - tsur ** 4);
    // Tolerances: steady conduction through one layer is exact on the grid (a linear profile), so what remains is the
    // transient after 3000 s = 15 times ℓ²/α (≈ e^−37 of it) and the Newton stop, ≤ 1e-6 K; the flux then moves by
    // (k/ℓ + 4εσTs³)·1e-6 K ≈ 1.4e-4 W/m², 2e-8 of it. Tolerances 1e-5 K and 1e-6 relative.
    assertClose(last(second.record.topC), ts - 273.15, { abs: 1e-5 }, 'top face temperature, °C');
    const out = (second.record.energy.topOutJ - first.record.energy.topOutJ) / 1000;
    assertClose(out, q, { rel: 1e-6 }, 'radiated through the top face, W/m²');
  });
});
