// Internal heat in the user's terms (sim/scenario/heat-sources.ts) against closed forms: a pellet releases mass × heat per
// gram, Joule heat I²R·t, a calibration term ρ·p·d·t per unit area — each read back from the run's energy ledger.
// The Fe/KClO₄ heat is checked against the reaction KClO₄ + 4 Fe → KCl + 4 FeO with formation enthalpies KClO₄
// −433 kJ/mol (Wikipedia "Potassium perchlorate"), KCl −436.747 (you-iggy tables), FeO −272.0 (CRC, from memory).

import { describe, expect, it } from 'vitest';
import { pelletHeatJPerKg } from '../../sim/scenario/heat-sources.ts';
import { assertClose } from '../support/assert-close.ts';
import { parseOk, PLAIN, probeAt, runOk, scenario } from '../support/scenarios.ts';

// Tolerance on ledger totals: sources are integrated exactly over intervals the steps land on, so only round-off
// remains; 1e-9 relative.
const LEDGER = { rel: 1e-9 };

const oneLayer = (layerKeys: Record<string, unknown>, extra: Record<string, unknown> = {}) => ({
  ...scenario({ duration_s: 20, materials: { p: PLAIN }, layers: [{ id: 'p', material: 'p', thickness_mm: 2 }] }),
  footprint: { width_mm: 10, length_mm: 10 },
  ...extra,
  layers: [{ id: 'p', material: 'p', thickness_mm: 2, ...layerKeys }],
});

describe('layer heat sources', () => {
  it('pelletHeatJPerKg(0.16) is 0.16 × 1091.7 kJ/mol / 138.55 g/mol = 1.261 kJ/g (hand calculation)', () => {
    const byHand = (0.16 * (-433 - (-436.747 - 4 * 272.0)) * 1e3) / 0.13855;
    assertClose(pelletHeatJPerKg(0.16), byHand, { rel: 1e-4 }, 'J/kg');
    // above the stoichiometric 38.3 wt % KClO₄ the iron runs out: 4 mol Fe (223.38 g) per mol KClO₄
    const ironLimited = ((1 - 0.5) / (4 * 0.055845)) * 1091.7e3;
    assertClose(pelletHeatJPerKg(0.5), ironLimited, { rel: 1e-4 }, 'J/kg at 50 % KClO₄');
  });

  it('runProblem() books a pellet\'s heat in the ledger as ρ·d·q_m (2000 kg/m³ × 2 mm × 1000 J/g = 4 MJ/m²)', () => {
    const out = runOk(oneLayer({ pellet: { heat_J_g: 1000, from_s: 1, burn_s: 3 } }));
    assertClose(out.record.energy.sourceJ, 2000 * 0.002 * 1e6, LEDGER, 'source energy, J/m²');
    assertClose(out.summary.energy.stored_J_m2, 2000 * 0.002 * 1e6, { rel: 1e-6 }, 'stored, J/m² (adiabatic faces)');
  });

  it('runProblem() books the pellet heat computed from its KClO₄ fraction', () => {
    const out = runOk(oneLayer({ pellet: { KClO4_fraction: 0.16, burn_s: 2 } }));
    assertClose(out.record.energy.sourceJ, 2000 * 0.002 * pelletHeatJPerKg(0.16), LEDGER, 'source energy, J/m²');
  });

  it('parseScenario() turns a burn-front speed into the burn time thickness / speed: 2 mm at 0.5 mm/s burns from 1 s to 5 s', () => {
    // hand computation: t_burn = d / v = 2 mm / 0.5 mm/s = 4 s, q̇ = ρ·q_m / t_burn = 2000 kg/m³ × 1e5 J/kg / 4 s
    const problem = parseOk(oneLayer({ pellet: { heat_J_g: 100, from_s: 1, burn_front_mm_s: 0.5 } }));
    const sources = problem.layers[0]!.sources;
    expect(sources).toHaveLength(1);
    // the interval ends are sums of a few exactly representable numbers: round-off only
    assertClose(sources[0]!.fromS, 1, { rel: 1e-15 }, 'burn start, s');
    assertClose(sources[0]!.toS, 5, { rel: 1e-15 }, 'burn end, s');
    assertClose(sources[0]!.value, (2000 * 1e5) / 4, { rel: 1e-15 }, 'source, W/m³');
  });

  it('runProblem() books a pellet given by its burn-front speed as ρ·d·q_m, and the adiabatic layer warms linearly over d / v', () => {
    // closed form for an adiabatic slab with a uniform source: T rises by q_m/c_p = 1e5 J/kg / 1000 J/(kg·K) = 100 K,
    // linearly over the burn [1 s, 5 s] — half of it (50 K) at 3 s
    const out = runOk(oneLayer({ pellet: { heat_J_g: 100, from_s: 1, burn_front_mm_s: 0.5 } },
      { output: { times_s: [3, 5, 20], probes_mm: [1] } }));
    assertClose(out.record.energy.sourceJ, 2000 * 0.002 * 1e5, LEDGER, 'source energy, J/m²');
    // uniform source, adiabatic faces: the temperature stays uniform, so only the step's quadrature error remains and
    // TR-BDF2 integrates a piecewise-constant source exactly on steps that land on its ends; 1e-6 K of 100 K for round-off
    // in the enthalpy inversion
    assertClose(probeAt(out.record, 1, 3), 20 + 50, { abs: 1e-6 }, 'temperature mid-burn, °C');
    assertClose(probeAt(out.record, 1, 5), 20 + 100, { abs: 1e-6 }, 'temperature at the end of the burn, °C');
    assertClose(probeAt(out.record, 1, 20), 20 + 100, { abs: 1e-6 }, 'temperature after the burn, °C');
  });

  it('runProblem() books Joule heat I²R·t over the footprint: (2 A)²·0.5 Ω·5 s / 1e-4 m² = 1e5 J/m²', () => {
    const out = runOk(oneLayer({ joule: { current_A: 2, resistance_ohm: 0.5, from_s: 2, to_s: 7 } }));
    assertClose(out.record.energy.sourceJ, (4 * 0.5 * 5) / 1e-4, LEDGER, 'source energy, J/m²');
  });

  it('runProblem() books a W/kg calibration term as ρ·p·d·t: 2000 kg/m³ × 50 W/kg × 2 mm × 20 s = 4000 J/m²', () => {
    const out = runOk(oneLayer({ heat_W_kg: 50 }));
    assertClose(out.record.energy.sourceJ, 2000 * 50 * 0.002 * 20, LEDGER, 'source energy, J/m²');
  });

  it('parseScenario() refuses a pellet with both or neither of heat_J_g and KClO4_fraction, and Joule heat without a footprint', () => {
    expect(() => parseOk(oneLayer({ pellet: { burn_s: 2 } }))).toThrow(/layers\[0\]\.pellet: give exactly one of heat_J_g and KClO4_fraction, got neither/);
    expect(() => parseOk(oneLayer({ pellet: { burn_s: 2, heat_J_g: 1, KClO4_fraction: 0.1 } }))).toThrow(/got both/);
    expect(() => parseOk(oneLayer({ pellet: { heat_J_g: 1 } }))).toThrow(/layers\[0\]\.pellet: give exactly one of burn_s and burn_front_mm_s, got neither/);
    expect(() => parseOk(oneLayer({ pellet: { heat_J_g: 1, burn_s: 2, burn_front_mm_s: 1 } }))).toThrow(/burn_s and burn_front_mm_s, got both/);
    expect(() => parseOk(oneLayer({ pellet: { heat_J_g: 1, burn_front_mm_s: 0 } }))).toThrow(/layers\[0\]\.pellet\.burn_front_mm_s: must be > 0/);
    // 2 mm at 0.05 mm/s burns for 40 s, past the 20 s run
    expect(() => parseOk(oneLayer({ pellet: { heat_J_g: 1, burn_front_mm_s: 0.05 } }))).toThrow(/layers\[0\]\.pellet\.burn_front_mm_s: the burn must end by duration_s \(20\).*thickness 2 mm \/ 0\.05 mm\/s/);
    const noFootprint = { ...oneLayer({ joule: { current_A: 1, resistance_ohm: 1, from_s: 0, to_s: 1 } }) } as Record<string, unknown>;
    delete noFootprint.footprint;
    // a burn past the end of the run would leave heat out of the run silently: refused (duration 20 s)
    expect(() => parseOk(oneLayer({ pellet: { heat_J_g: 1, from_s: 19, burn_s: 2 } }))).toThrow(/layers\[0\]\.pellet\.burn_s: the burn must end by duration_s \(20\)/);
    expect(() => parseOk(noFootprint)).toThrow(/layers\[0\]\.joule: needs the scenario's footprint/);
  });
});
