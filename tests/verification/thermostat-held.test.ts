// An on-off thermostat held in its band (time/plates.ts): once it switches faster than the run follows, the plate is held
// in the middle of the band at the mean power of the switching. Checked against
// - the steady state of a plate, a contact, a slab and a convective top face in series, a closed form (Incropera &
//   DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., §3.1, the plane wall with thermal resistances in series):
//   q = (T_p − T∞)/(1/G_c + L/k + 1/h), and the plate's own loss h_loss·(T_p − T∞) besides;
// - the same heater followed switch by switch (holdFastThermostats: false), whose switching times are checked against
//   the two-node closed form in heater.test.ts.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { heldThermostatDefaults as HELD } from '../../sim/physics/heater.ts';
import type { FaceSegmentFile, ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { assertClose } from '../support/assert-close.ts';
import { runOk, scenario } from '../support/scenarios.ts';

const AREA = (Math.PI * 0.025 ** 2) / 4;
const POWER_W = 150;
const T0 = 20;
const SET_C = 420;
const BAND_K = 0.5;
const CONTACT = 2000;
const LOSS = 20;
const TOP_H = 50;
const SLAB = { k: 400, thicknessM: 0.001 };
const MIDDLE_C = SET_C - BAND_K / 2;
const HALF_WIDTH_K = (HELD.heldWidthShare * BAND_K) / 2;

// a 0.5 mm plate of an invented light board, c′ = 100 × 1000 × 0.0005 = 50 J/(m²·K), under 150 W on 491 mm²
// (305 kW/m²): it crosses the 0.5 K band in about 0.1 ms, so the thermostat cycles in well under a millisecond
const heater = (setPoints: { at_s: number; set_point_C: number }[]): FaceSegmentFile => ({
  from_s: 0,
  heater: {
    power_W: POWER_W, plate: { material: 'board', thickness_mm: 0.5 }, contact_W_m2K: CONTACT, loss_W_m2K: LOSS,
    control: { kind: 'on-off', band_K: BAND_K, sensor: 'plate' }, set_points: setPoints,
  },
} as FaceSegmentFile);

const stack = (setPoints: { at_s: number; set_point_C: number }[], duration: number): ScenarioFile => scenario({
  duration_s: duration, ambient_C: T0, initial_C: T0, footprint: { diameter_mm: 25 },
  materials: { slab: { k_W_mK: SLAB.k, rho_kg_m3: 8900, cp_J_kgK: 400 }, board: { k_W_mK: 1, rho_kg_m3: 100, cp_J_kgK: 1000 } },
  layers: [{ id: 'slab', material: 'slab', thickness_mm: SLAB.thicknessM * 1000 }],
  bottom: [heater(setPoints)], top: [{ from_s: 0, convection_W_m2K: TOP_H }],
  numerics: { tolerance_K: 1e-3 },
});

describe('an on-off thermostat held in its band', () => {
  it('runProblem() holds a fast-cycling plate in the middle of its band at the series-resistance steady-state power', () => {
    // the slab's time constant is about C_s·(1/h + …) = 3.56 kJ/(m²·K) / 50 W/(m²·K) ≈ 71 s: 1200 s leaves e^−17 of
    // the 400 K start, below 1e-5 K
    const { record, summary } = runOk(stack([{ at_s: 0, set_point_C: SET_C }], 1200));
    const h = record.heater!;
    const last = record.tS.length - 1;
    const plateC = h.plateC[last]!;
    // the law puts the plate within half its width of the band's middle, at any duty
    expect(Math.abs(plateC - MIDDLE_C)).toBeLessThanOrEqual(HALF_WIDTH_K);
    const resistance = 1 / CONTACT + SLAB.thicknessM / SLAB.k + 1 / TOP_H;
    const steadyW = ((plateC - T0) / resistance + LOSS * (plateC - T0)) * AREA;
    // the tolerance: the slab's remaining transient (≈ 1e-5 K of ≈ 400 K) and the step's error (≤ 1e-3 K on ≈ 400 K)
    assertClose(h.powerW[last]!, steadyW, { rel: 1e-5 }, 'mean power at the end, W');
    expect(h.heldS).toBeGreaterThan(1100);
    expect(record.warnings.some((w) => w.startsWith("the heater's thermostat switched 20 times within 1 s by t = "))).toBe(true);
    expect(summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
    // the duty cycle is the mean power over the full power
    assertClose(summary.heater!.duty_cycle, steadyW / POWER_W, { rel: 0.05 }, 'duty cycle (most of the run at steady state)');
  });

  it('runProblem() lets go of the band when the set-point drops below the plate, and holds again at the new one', () => {
    // set-point 420 °C, then 300 °C from 400 s on: the plate is above the new set-point, the relay is off (no power)
    // until the plate has cooled to 300 − band, where it cycles again and is held again
    const { record, summary } = runOk(stack([{ at_s: 0, set_point_C: SET_C }, { at_s: 400, set_point_C: SET_C }, { at_s: 401, set_point_C: 300 }], 1200));
    const h = record.heater!;
    const after = record.tS.findIndex((t) => t > 402);
    expect(h.powerW[after]).toBe(0);
    const last = record.tS.length - 1;
    expect(Math.abs(h.plateC[last]! - (300 - BAND_K / 2))).toBeLessThanOrEqual(HALF_WIDTH_K);
    // let go while it cooled: no power from 402 s until the plate first reaches the new band's foot (≈ 417 s)
    const foot = record.tS.findIndex((t, i) => t > 402 && h.plateC[i]! <= 300 - BAND_K);
    expect(foot).toBeGreaterThan(after + 3);
    for (let i = after; i < foot; i++) expect(h.powerW[i]).toBe(0);
    expect(h.heldS).toBeLessThan(1200 - 5);
    expect(summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
  });

  it('runProblem() held agrees with the same thermostat followed switch by switch on the separator and the heat', () => {
    // heater-plate-lift-off.json with a 0.05 K band on its 6 mm steel plate: 19 029 switches in the hour when followed
    // one by one (1.5 s), 22 located events held (0.2 s). Measured: molten 82.009 / 82.044 s, half-frozen 910.332 /
    // 910.337 s, frozen 916.701 / 916.700 s, heater 13 089.80 / 13 089.95 J. The allowances: 0.1 s on an event (the
    // ripple of the band at the plate, damped by the stack; a fifth of the 0.5 s to which events are asked), and
    // 1e-4 of the heat (the band's 0.05 K against the plate's ≈ 400 K rise, × 2 for the loss and the stack's share).
    const file = JSON.parse(readFileSync(new URL('../../examples/heater-plate-lift-off.json', import.meta.url), 'utf8')) as ScenarioFile;
    (file.bottom[0]!.heater!.control as { band_K: number }).band_K = 0.05;
    const held = runOk(file, { detail: 'summary' });
    const followed = runOk(file, { detail: 'summary', holdFastThermostats: false });
    expect(held.record.heater!.heldS).toBeGreaterThan(0);
    expect(followed.record.heater!.heldS).toBe(0);
    expect(followed.stats.events).toBeGreaterThan(100 * held.stats.events);
    for (const key of ['molten_at_s', 'half_frozen_at_s', 'frozen_at_s'] as const) {
      assertClose(held.summary.separator[key]!, followed.summary.separator[key]!, { abs: 0.1 }, key);
    }
    assertClose(held.summary.heater!.energy_J, followed.summary.heater!.energy_J, { rel: 1e-4 }, 'heater energy, J');
    for (const [id, layer] of Object.entries(held.summary.layers)) {
      assertClose(layer.peak_C, followed.summary.layers[id]!.peak_C, { abs: 0.05 }, `${id} peak, °C`);
    }
    expect(held.summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
  });
});
