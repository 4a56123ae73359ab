// A temperature-dependent volumetric source s = a + b·T (b < 0) in a slab, against its closed forms:
// - steady state with both faces held at T_w: k·T'' + a + b·T = 0, so θ = T + a/b obeys θ'' = m²θ with m² = −b/k and
//   T(x) = −a/b + (T_w + a/b)·cosh(m(x − L/2))/cosh(mL/2) (Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed.,
//   §1.8 — the fin-like equation; equally Incropera §3.6, eq. 3.70's form for a fin of uniform section);
// - with adiabatic faces the slab stays uniform and ρc·dT/dt = a + b·T, so T = T_p + (T₀ − T_p)·exp(b·t/ρc), T_p = −a/b
//   (a first-order linear ODE, exact).
// The term enters through Layer.terms (sim/physics/heat-terms.ts): the scenario file has no key for it.
import { describe, expect, it } from 'vitest';
import type { Problem } from '../../sim/physics/problem.ts';
import { runProblem } from '../../sim/run.ts';
import { assertClose } from '../support/assert-close.ts';
import { last, observedOrder, parseOk, PLAIN, slab, toC, toK } from '../support/scenarios.ts';

/** s = a + b·T: b = −1e5 W/m³K and a = 6e7 W/m³, so T_p = −a/b = 600 K; with k = 1 W/mK, m = √(1e5) m⁻¹. */
const B = -1e5;
const A = 6e7;
const TP = -A / B;
const RHO_C = 2000 * 1000; // PLAIN: ρ = 2000 kg/m³, c = 1000 J/kgK

const withLinearTerm = (problem: Problem): Problem => ({
  ...problem,
  layers: problem.layers.map((l) => ({ ...l, terms: [{ kind: 'linear', aWPerM3: A, bWPerM3K: B }] })),
});

describe('a linear source s = a + b·T (heat-terms.ts) in a slab', () => {
  it('runProblem() reaches the cosh steady state between held faces, with second-order convergence in space', () => {
    const wallC = toC(300);
    const problem = withLinearTerm(parseOk(slab({
      material: PLAIN, thickness_mm: 10, duration_s: 300, initial_C: wallC,
      bottom: [{ from_s: 0, fixed_C: wallC }], top: [{ from_s: 0, fixed_C: wallC }],
      // the slowest mode decays at α(π/L)² − b/ρc ≈ 0.1 /s, so 300 s leave e^-30 of the start; a tight Newton
      // tolerance (tolerance_K × 1e-2) keeps the iteration error far below the spatial error measured here
      numerics: { tolerance_K: 1e-3 },
    })));
    const m = Math.sqrt(-B / 1);
    const L = 0.01;
    const exact = (xM: number) => TP + (300 - TP) * Math.cosh(m * (xM - L / 2)) / Math.cosh(m * L / 2);
    const sizes: number[] = [];
    const errors: number[] = [];
    for (const refine of [1, 2, 4]) {
      const out = runProblem(problem, { refine });
      if (out.status !== 'ok') throw new Error(out.status);
      const { map, nodeXMm } = out.record;
      const row = map.shape[0]! - 1;
      let worst = 0;
      for (let j = 0; j < nodeXMm.length; j++) {
        worst = Math.max(worst, Math.abs(toK(map.get(row, j)) - exact(nodeXMm[j]! / 1000)));
      }
      sizes.push(1 / out.grid.n);
      errors.push(worst);
    }
    // the mid-plane sits 600 − 300/cosh(1.58) ≈ 480 K; the cell-centred scheme is second order on the smoothly
    // graded grid: the coarse grid (40 cells) within 0.5 K (measured 0.091, 0.023, 0.0057 K on 40, 80, 160 cells),
    // and the fitted order within 0.1 of 2 (CONVENTIONS.md; measured 2.00)
    expect(errors[0]!).toBeLessThan(0.5);
    assertClose(observedOrder(sizes, errors), 2, { abs: 0.1 }, 'observed order in space');
  });

  it('runProblem() follows T_p + (T₀ − T_p)·exp(b·t/ρc) in an adiabatic slab, with second-order convergence in time', () => {
    // max_step_s: the default largest step (1 % of the duration) would cap the fixed steps
    const problem = withLinearTerm(parseOk(slab({
      material: PLAIN, thickness_mm: 2, duration_s: 40, initial_C: toC(300), numerics: { max_step_s: 2 },
    })));
    const exact = TP + (300 - TP) * Math.exp((B * 40) / RHO_C);
    const steps = [2, 1, 0.5];
    const errors = steps.map((h) => {
      const out = runProblem(problem, { stepping: { kind: 'fixed', stepS: h, scheme: 'tr-bdf2' } });
      if (out.status !== 'ok') throw new Error(out.status);
      return Math.abs(toK(last(out.record.layers[0]!.meanC)) - exact);
    });
    // |b|h/ρc = 0.05 at the largest step: TR-BDF2's global error is O(h²) there (measured 33, 8.2, 2.1 mK on a
    // 258 K change; fitted order 2.00)
    expect(errors[0]!).toBeLessThan(0.05);
    assertClose(observedOrder(steps, errors), 2, { abs: 0.1 }, 'observed order in time');
  });

  it('the energy ledger books a T-dependent source exactly: summary.energy closes to 1e-12 with adaptive steps', () => {
    const problem = withLinearTerm(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 40, initial_C: toC(300) })));
    const out = runProblem(problem);
    if (out.status !== 'ok') throw new Error(out.status);
    // the source's energy is integrated with TR-BDF2's own weights at the stage points and moved with each Newton
    // update's linearisation, so in − out = stored to round-off (measured 1.0e-14)
    expect(out.summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
    // and it is the heat the closed form says the slab took in: ρc·L·(T(40 s) − T₀), to the run's time error
    const exactJ = RHO_C * 0.002 * (TP + (300 - TP) * Math.exp((B * 40) / RHO_C) - 300);
    // default tolerance_K 0.2 K per step: the final temperature is within 0.2 K of the closed form → 800 J/m² of 1.04e6
    // (measured 5.2 J/m²)
    assertClose(out.record.energy.sourceJ, exactJ, { abs: RHO_C * 0.002 * 0.2 }, 'heat generated, J/m²');
  });
});
