// Heat balance through the phase change: a known flux for a known time into an adiabatic metal / salt stack, then
// both faces adiabatic until the stack is uniform. The final temperature and liquid fraction follow from the first law
// alone (tests/support/closed-forms.ts adiabaticPhaseChangeFinalTemperature; the enthalpy formulation of Alexiades &
// Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993, ch. 4), whatever happened in between.

import { describe, expect, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { adiabaticPhaseChangeFinalTemperature } from '../support/closed-forms.ts';
import { flat, last, runOk, scenario, toC, toK } from '../support/scenarios.ts';

const FLUX = 2e4; // W/m² into the bottom face while the heater is on
const INITIAL_C = 300;

interface Case {
  readonly what: string;
  readonly solidus: number;
  readonly liquidus: number;
  /** Heat put in, J/m². */
  readonly q: number;
  readonly saltCp: number | [number, number][];
}

// The stack: 1 mm of metal (ρcp = 4e6 J/m³·K) under 2 mm of salt (ρcp = 2e6 J/m³·K, latent 2e5 J/kg, ρL·t = 8e5 J/m²).
// 50 K of sensible heat to the melt takes 4e5 J/m². Equilibration: the slowest mode of the salt inside its mushy
// range has α_eff = k/(ρcp + ρL/ΔT) ≈ 1.5e-8 m²/s, decaying as exp(−π²α_eff t/ℓ²) ≈ e^−68 over the adiabatic time.
const cases: Case[] = [
  { what: 'ends inside a 6 K mushy range', solidus: 350, liquidus: 356, q: 1.2e6, saltCp: flat(1000) },
  { what: 'ends on an isothermal melt, partly liquid', solidus: 352, liquidus: 352, q: 0.8e6, saltCp: flat(1000) },
  { what: 'ends above an isothermal melt, all liquid', solidus: 352, liquidus: 352, q: 1.4e6, saltCp: flat(1000) },
  // cp as a plain number: the enthalpy above the liquidus must rise by ρcp per kelvin, not by the mushy slope
  { what: 'ends above a mushy range, cp a plain number', solidus: 350, liquidus: 356, q: 1.4e6, saltCp: 1000 },
];

function heat(c: Case) {
  return runOk(scenario({
    duration_s: 3000, initial_C: INITIAL_C,
    materials: {
      metal: { k_W_mK: 50, rho_kg_m3: 8000, cp_J_kgK: flat(500) },
      salt: { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: c.saltCp, melt: { solidus_C: c.solidus, liquidus_C: c.liquidus, latent_J_kg: 2e5 } },
    },
    layers: [{ id: 'metal', material: 'metal', thickness_mm: 1 }, { id: 'salt', material: 'salt', thickness_mm: 2, separator: true }],
    // the heater segment, then a segment with no terms: adiabatic
    bottom: [{ from_s: 0, flux_W_m2: FLUX }, { from_s: c.q / FLUX }],
    // a tight step tolerance: Newton stops within a small share of it (evolveDefaults.newtonShare ≤ 1e-2) of each step's solution
    numerics: { tolerance_K: 0.01, liquid_fraction_tolerance: 2e-4 },
  }));
}

describe('adiabatic stack heated through the phase change (first-law balance)', () => {
  it.each(cases.map((c) => [c.what, c] as const))('runProblem(): a stack that %s comes to the balance temperature and liquid fraction', (_what, c) => {
    const { record, summary } = heat(c);
    const exact = adiabaticPhaseChangeFinalTemperature({
      Q: c.q,
      pieces: [
        { rho: 8000, thickness: 1e-3, cp: 500, T0: toK(INITIAL_C) },
        { rho: 2000, thickness: 2e-3, cp: 1000, T0: toK(INITIAL_C), latent: 2e5, solidus: toK(c.solidus), liquidus: toK(c.liquidus) },
      ],
    });
    // The imposed flux over a segment that ends on a step boundary is integrated exactly; the ledger books the heat
    // the cells receive through the face node, which meets the imposed flux up to the face balance's Newton residual.
    // Tolerance 1e-9 relative. Measured: ≤ 2e-15.
    assertClose(summary.energy.in_J_m2, c.q, { rel: 1e-9 }, 'heat in, J/m²');
    // Tolerances: the final state is set by the energy balance, which the scheme keeps up to its Newton stop
    // (an imbalance ≤ 1e-6 of Q): 1.2 J/m² over the sensible capacity 8000 J/m²·K is 1.5e-4 K, over the latent
    // 8e5 J/m² a liquid fraction of 1.5e-6. Measured: ≤ 1e-6 K and 2e-7 (the mushy case).
    const T_TOL = { abs: 2e-4 };
    for (const layer of record.layers) {
      assertClose(last(layer.minC), toC(exact.T), T_TOL, `${layer.id} coldest, °C`);
      assertClose(last(layer.maxC), toC(exact.T), T_TOL, `${layer.id} hottest, °C`);
    }
    const liquid = record.layers[1]!.liquidFraction;
    expect(liquid).toBeDefined();
    assertClose(last(liquid!), exact.liquidFractions[1]!, { abs: 5e-6 }, 'salt mean liquid fraction');
  });
});
