// Energy conservation over random valid scenarios (seeded, short): heat in − heat out = stored, and the stored energy
// equals what the final state holds, Σ layers thickness·(ρcp·ΔT̄ + ρL·Δf̄) for constant cp (first law; the enthalpy of
// the enthalpy method, Alexiades & Solomon, Mathematical Modeling of Melting and Freezing Processes, 1993, ch. 4).

import { describe, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { last, randomScenario, runOk, seededRandom } from '../support/scenarios.ts';
import type { InlineMaterialFile } from '../../sim/scenario/scenario-schema.ts';

const SEEDS = Array.from({ length: 30 }, (_, i) => i + 1);

const constantOf = (p: InlineMaterialFile['cp_J_kgK']): number => (typeof p === 'number' ? p : p[0]![1]);

describe('energy conservation (random scenarios)', () => {
  it.each(SEEDS)('summary.energy of random scenario #%i balances and matches the final layer means', (seed) => {
    const scenario = randomScenario(seededRandom(seed * 15485863), { heatInputs: true, natural: true, plainNumbers: false, constantCp: true });
    const { summary, record } = runOk(scenario);
    // TR-BDF2 with the face heat integrated by the same weights conserves energy exactly; what is left is the residual
    // Newton leaves at its stop. The ledger is the run's own check, so it must sit far below the 1e-3 accuracy promise
    // of the event times: tolerance 1e-6. Measured: ≤ 3.7e-7.
    assertClose(summary.energy.imbalance_rel, 0, { abs: 1e-6 }, `imbalance_rel (seed ${seed}: ${JSON.stringify(scenario)})`);
    const initial = scenario.initial_C ?? scenario.ambient_C;
    let held = 0;
    record.layers.forEach((series, i) => {
      const layer = scenario.layers[i]!;
      const m = scenario.materials![layer.material]! as InlineMaterialFile; // a material given directly (randomScenario)
      const t = layer.thickness_mm / 1000;
      held += m.rho_kg_m3 * constantOf(m.cp_J_kgK) * t * (last(series.meanC) - initial);
      if (m.melt && series.liquidFraction) {
        const f0 = initial > m.melt.liquidus_C || (initial === m.melt.liquidus_C && m.melt.liquidus_C > m.melt.solidus_C) ? 1
          : initial <= m.melt.solidus_C ? 0 : (initial - m.melt.solidus_C) / (m.melt.liquidus_C - m.melt.solidus_C);
        held += m.rho_kg_m3 * m.melt.latent_J_kg * t * (last(series.liquidFraction) - f0);
      }
    });
    // Both sums are of the same cell enthalpies, H = ρcp(T − T₀) + ρL·f cell by cell: they agree to round-off in the
    // largest energy exchanged. Tolerance 1e-9 of it.
    const scale = Math.max(summary.energy.in_J_m2, summary.energy.out_J_m2, Math.abs(summary.energy.stored_J_m2));
    assertClose(summary.energy.stored_J_m2, held, { abs: 1e-9 * scale }, 'stored energy against the final state, J/m²');
  });
});
