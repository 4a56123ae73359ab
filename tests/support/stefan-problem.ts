/**
 * The one-phase Stefan problem as a scenario, with its exact separator event times (Alexiades & Solomon, Mathematical
 * Modeling of Melting and Freezing Processes, 1993, §2.1; Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed.,
 * §11.2 with no superheat; closed-forms.ts stefanOnePhaseLambda). A 10 mm salt layer of round invented properties,
 * liquid at its melting point (300 °C), cooled from t = 0 through its bottom face by a fluid at the wall temperature
 * with h = 1e9 W/(m²·K), adiabatic on top. The front is X = 2λ√(αt) with λ the root for St = c(Tm − Tw)/L. The liquid
 * stays at Tm, so the adiabatic top face holds no heat the closed form does not: the layer is half frozen when
 * X = 5 mm and frozen when X = 10 mm, exactly. A held face would be a heat input for heat_off_s (the verdicts read a
 * freeze only after it), hence the fluid; its k/h = 1e-9 m puts the front 1e-9 m behind (5e-5 s at the end, 100 K).
 * Used by tests/verification/stefan-events.test.ts and bench/stefan.ts.
 */
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { stefanOnePhaseLambda } from './closed-forms.ts';
import { flat, slab } from './scenarios.ts';

/**
 * Layer thickness, m; k, W/(m·K); ρ, kg/m³; c_p, J/(kg·K); latent heat, J/kg; melting point, °C. Round invented
 * numbers (no material's): the closed form holds for any, and these give α = 5e-7 m²/s and St = 0.5 at 100 K.
 */
export const STEFAN = { thicknessM: 0.01, k: 1, rho: 2000, cp: 1000, latent: 2e5, meltC: 300 } as const;

/** λ and the exact half-frozen and frozen times, s, under a wall at wallC (°C; above the melting point: see stefanScenario). */
export function stefanTimes(wallC: number): { readonly lambda: number; readonly halfS: number; readonly frozenS: number } {
  const { thicknessM, k, rho, cp, latent, meltC } = STEFAN;
  const lambda = stefanOnePhaseLambda((cp * Math.abs(meltC - wallC)) / latent);
  const at = (x: number) => (x / (2 * lambda)) ** 2 / (k / (rho * cp));
  return { lambda, halfS: at(thicknessM / 2), frozenS: at(thicknessM) };
}

/**
 * The scenario, run for 1.2 × the frozen time, with `numerics` if given. A wall above the melting point gives the
 * same problem melting: the solid starts at its melting point, and with equal properties in both phases the front and
 * its times are the mirror image (St = c·|Tw − Tm|/L), so the layer is fully molten at stefanTimes(wallC).frozenS.
 */
export function stefanScenario(wallC: number, numerics?: ScenarioFile['numerics']): ScenarioFile {
  const { thicknessM, k, rho, cp, latent, meltC } = STEFAN;
  const melting = wallC > meltC;
  return slab({
    name: `one-phase Stefan problem, wall ${Math.abs(meltC - wallC)} K ${melting ? 'above' : 'below'} the melting point`,
    material: { k_W_mK: k, rho_kg_m3: rho, cp_J_kgK: flat(cp), melt: { solidus_C: meltC, liquidus_C: meltC, latent_J_kg: latent } },
    thickness_mm: thicknessM * 1000, separator: true, duration_s: Math.ceil(1.2 * stefanTimes(wallC).frozenS),
    ambient_C: 25, initial_C: melting ? meltC - 1e-6 : meltC + 1e-6,
    bottom: [{ from_s: 0, convection_W_m2K: 1e9, fluid_C: wallC }],
    ...(numerics ? { numerics } : {}),
  });
}
