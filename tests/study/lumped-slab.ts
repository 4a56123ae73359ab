// A thin, highly conducting slab warmed by convection from a hot fluid on its top face, bottom face adiabatic: at a Biot
// number of ~1e-5 it is lumped, T(t) = T_f − (T_f − T_0)·exp(−h·t/(ρ·c·L)) (Incropera, Fundamentals of Heat and Mass
// Transfer, 6th ed., §5.2, eq. 5.6). The study tests vary h and check verdicts against this closed form.
import { scenario } from '../support/scenarios.ts';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';

export const SLAB = {
  /** ρ·c·L = 2000 kg/m³ · 1000 J/(kg·K) · 0.001 m, J/(m²·K). */
  rhoCL: 2000,
  fluidC: 100,
  initialC: 20,
  durationS: 600,
} as const;

/** The slab's temperature at the end of the run for a convection coefficient h (W/m²K), closed form. */
export const slabEndC = (h: number): number => SLAB.fluidC - (SLAB.fluidC - SLAB.initialC) * Math.exp((-h * SLAB.durationS) / SLAB.rhoCL);

/** The h at which the slab ends the run at `endC`, the closed form solved for h. */
export const hForEndC = (endC: number): number => (-SLAB.rhoCL / SLAB.durationS) * Math.log((SLAB.fluidC - endC) / (SLAB.fluidC - SLAB.initialC));

/** The slab as a scenario file (invented test material: k = 400 W/mK, ρ = 2000 kg/m³, c = 1000 J/kgK). */
export function slabFile(h = 5): ScenarioFile {
  return scenario({
    duration_s: SLAB.durationS,
    ambient_C: SLAB.initialC,
    initial_C: SLAB.initialC,
    materials: { copperish: { k_W_mK: 400, rho_kg_m3: 2000, cp_J_kgK: 1000 } },
    layers: [{ id: 'slab', material: 'copperish', thickness_mm: 1 }],
    top: [{ from_s: 0, convection_W_m2K: h, fluid_C: SLAB.fluidC }],
    // a tighter step tolerance than the default, so the solver's error (< 0.02 K) is small beside the test tolerances
    numerics: { tolerance_K: 0.01 },
  });
}
