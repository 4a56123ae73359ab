// The energy ledger of a run through melting and freezing: heat in − heat out = stored (first law), and the stored
// energy equals what the final state holds, Σ layers thickness·(ρcp·ΔT̄ + ρL·Δf̄) for constant cp (the enthalpy
// of the enthalpy method, Alexiades & Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993, ch. 4).

import { describe, expect, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { flat, last, runOk, scenario } from '../support/scenarios.ts';

// metal / salt / metal, on a 450 °C plate for 300 s, then in air (convection and radiation) until it has frozen.
const layers = [
  { id: 'lower', material: 'metal', thickness_mm: 1 },
  { id: 'separator', material: 'salt', thickness_mm: 1.5, separator: true },
  { id: 'upper', material: 'metal', thickness_mm: 2 },
];
const volumetricCp: Record<string, number> = { metal: 8000 * 500, salt: 2000 * 1000 };
const LATENT_J_M3 = 2000 * 2e5;

const run = () => runOk(scenario({
  duration_s: 1500, initial_C: 20, ambient_C: 20,
  materials: {
    metal: { k_W_mK: 50, rho_kg_m3: 8000, cp_J_kgK: flat(500) },
    salt: { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: flat(1000), melt: { solidus_C: 350, liquidus_C: 354, latent_J_kg: 2e5 } },
  },
  layers,
  contacts: [{ below: 'lower', above: 'separator', resistance_m2K_W: 1e-4 }],
  bottom: [{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }, { from_s: 300, convection_W_m2K: 10, emissivity: 0.5 }],
  top: [{ from_s: 0, convection_W_m2K: 10, emissivity: 0.3 }],
}));

describe('energy ledger through a phase change', () => {
  it('summary.energy.imbalance_rel is below 1e-6 for a run that melts and freezes the separator', () => {
    const { summary } = run();
    expect(summary.separator.molten_at_s).not.toBeNull();
    expect(summary.separator.frozen_at_s).not.toBeNull();
    // TR-BDF2 conserves energy exactly in the discrete sense (an ESDIRK method whose face heat is integrated with the
    // same weights), so the imbalance is what Newton leaves unconverged at its stop. The ledger is the run's own check,
    // so it must sit far below the 1e-3 accuracy promise of the event times: tolerance 1e-6. Measured: 3.9e-12.
    assertClose(summary.energy.imbalance_rel, 0, { abs: 1e-6 }, 'imbalance_rel');
    assertClose(summary.energy.stored_J_m2, summary.energy.in_J_m2 - summary.energy.out_J_m2,
      { rel: 1e-6 * summary.energy.in_J_m2 / Math.abs(summary.energy.stored_J_m2) }, 'stored = in − out, J/m²');
  });

  it('summary.energy.stored_J_m2 equals Σ thickness·(ρcp·ΔT̄ + ρL·Δf̄) read off the final layer means', () => {
    const { summary, record } = run();
    let stored = 0;
    record.layers.forEach((series, i) => {
      const layer = layers[i]!;
      const thicknessM = layer.thickness_mm / 1000;
      stored += volumetricCp[layer.material]! * thicknessM * (last(series.meanC) - 20);
      if (series.liquidFraction) stored += LATENT_J_M3 * thicknessM * last(series.liquidFraction);
    });
    // With constant cp, H = ρcp(T − T₀) + ρL·f holds in every cell, and the layer means are cell-width weighted, so the
    // two sums agree to round-off. Tolerance 1e-9 relative. Measured: 0.
    assertClose(summary.energy.stored_J_m2, stored, { rel: 1e-9 }, 'stored energy, J/m²');
  });
});
