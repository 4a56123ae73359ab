// An on-off thermostat held in its band (time/plates.ts): once it switches faster than the run follows, the plate is held
// in the middle of its band at the mean power of the switching. Checked against
// - the steady state of a plate, a contact, a slab and a convective top face in series, a closed form (Incropera &
//   DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., §3.1, the plane wall with thermal resistances in series):
//   q = (T_p − T∞)/(1/G_c + L/k + 1/h), and the plate's own loss h_loss·(T_p − T∞) besides;
// - the same heater followed switch by switch (holdFastThermostats: false), whose switching times are checked against
//   the two-node closed form in heater.test.ts;
// - the relay's cycle and mean, which decide when a hold begins and lets go, against the relay simulated here by brute
//   force: the plate node c′·dT/dt = p − G_c·(T − T_face) − h_loss·(T − T∞) with the face held, switched at the two
//   levels, integrated by RK4 in small steps (relayCycle's closed form, physics/heater.ts, is not used).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Heater } from '../../sim/physics/heater.ts';
import { createPlateNode, heldThermostatDefaults as HELD, plateStage, relayCycle } from '../../sim/physics/heater.ts';
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
const HALF_WIDTH_K = (HELD.heldWidthShare * BAND_K) / 2;

interface Relay { readonly c: number; readonly p: number; readonly g: number; readonly loss: number; readonly ambient: number }

/**
 * The relay between the levels low and high with the face held at face (K), by brute force: RK4 steps of τ/4000
 * (τ = c/(g + loss)), switching where a step crosses a level (the crossing found by linear interpolation within the
 * step), 30 cycles to settle, then 200 cycles: their mean length and the plate's time-mean.
 */
function relayBrute(r: Relay, low: number, high: number, face: number): { periodS: number; meanK: number } {
  const dt = r.c / (r.g + r.loss) / 4000;
  const rate = (t: number, on: boolean) => ((on ? r.p : 0) - r.g * (t - face) - r.loss * (t - r.ambient)) / r.c;
  let t = low;
  let on = true;
  let switches = 0;
  let area = 0;
  let time = 0;
  while (switches < 2 * 230) {
    const k1 = rate(t, on);
    const k2 = rate(t + 0.5 * dt * k1, on);
    const k3 = rate(t + 0.5 * dt * k2, on);
    const k4 = rate(t + dt * k3, on);
    const next = t + (dt / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    const level = on ? high : low;
    const crossed = on ? next >= level : next <= level;
    const s = crossed ? (dt * (level - t)) / (next - t) : dt;
    const end = crossed ? level : next;
    if (switches >= 60) { area += 0.5 * (t + end) * s; time += s; }
    t = end;
    if (crossed) { on = !on; switches++; }
  }
  return { periodS: time / 200, meanK: area / time };
}

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

describe('the cycle of a fast relay', () => {
  const heaterOf = (r: Relay): Heater => ({
    powerW: r.p, powerWPerM2: r.p, areaM2: 1, capacityJPerM2K: r.c, contactWPerM2K: r.g, lossWPerM2K: r.loss, lossToK: r.ambient,
    control: { kind: 'on-off', bandK: 1, sensor: { kind: 'plate' } }, setPoints: [],
  });
  it.each([
    // a light board plate under 305 kW/m², narrow and wide bands; tile plates whose band is a tenth of their rise
    { r: { c: 50, p: 3.06e5, g: 2000, loss: 20, ambient: 293 }, low: 692.5, high: 693, face: 600 },
    { r: { c: 50, p: 3.06e5, g: 2000, loss: 20, ambient: 293 }, low: 683, high: 693, face: 600 },
    { r: { c: 2150, p: 2.98e5, g: 2230, loss: 0, ambient: 268 }, low: 707.6, high: 717.9, face: 601 },
    { r: { c: 2150, p: 2.98e5, g: 2230, loss: 8, ambient: 268 }, low: 650, high: 700, face: 640 },
  ])('relayCycle() is the period and mean of the relay simulated switch by switch (band $low–$high K)', ({ r, low, high, face }) => {
    // the brute force's own error: its steps of τ/4000 and the linear crossing, ≪ 1e-4 of the cycle and of the band
    const out = new Float64Array(2);
    relayCycle(heaterOf(r), low, high, face, out);
    const brute = relayBrute(r, low, high, face);
    assertClose(out[0]!, brute.periodS, { rel: 1e-4 }, 'period, s');
    assertClose(out[1]!, brute.meanK, { abs: 1e-4 * (high - low) }, 'mean, K');
  });
  it('relayCycle() is stuck (an endless cycle, the plate where it settles) where a level cannot be passed, and tends to it', () => {
    const h = heaterOf({ c: 50, p: 1e4, g: 1000, loss: 0, ambient: 293 });
    const out = new Float64Array(2);
    const at = (low: number, high: number, face: number) => { relayCycle(h, low, high, face, out); return [out[0]!, out[1]!]; };
    // full power lifts the plate 10 K above the face (no loss: u = the face): a set-point above face + 10 K is out of
    // reach, the relay stays on and the plate settles at face + 10 K; with the face at or above the foot it stays off
    // at the face. Near either limit the cycle grows without bound and the mean leans to that limit (logarithmically:
    // 1e-9 K from the foot it is still 0.8 K above it)
    expect(at(500, 511, 500.5)).toEqual([Infinity, 510.5]);
    expect(at(500, 509, 500)).toEqual([Infinity, 500]);
    expect(at(500 + 1e-9, 509, 500)[0]).toBeGreaterThan(at(500 + 1e-3, 509, 500)[0]!);
    expect(at(500 + 1e-9, 509, 500)[1]).toBeLessThan(at(500 + 1e-3, 509, 500)[1]!);
    expect(at(500, 509 - 1e-9, 499)[0]).toBeGreaterThan(at(500, 509 - 1e-3, 499)[0]!);
    expect(at(500, 509 - 1e-9, 499)[1]).toBeGreaterThan(at(500, 509 - 1e-3, 499)[1]!);
  });
  it('the middle of the band, where a held plate sits, is the simulated relay\'s mean to 5 % of a narrow band', () => {
    // the straight-ramp limit: over a band far narrower than the plate's rise the two segments are nearly straight
    const r = { c: 50, p: 3.06e5, g: 2000, loss: 20, ambient: 293 };
    assertClose(relayBrute(r, 692.5, 693, 600).meanK, 692.75, { abs: 0.05 * 0.5 }, 'mean, K');
  });
  it('plateStage() held gives dT_plate/dT_face as a central difference does', () => {
    // the Newton Jacobian's face entry (discretization.ts reads it through plateHeatIn); central difference with a
    // 1e-4 K step on a piecewise-linear function, away from its knees: exact to round-off, ≈ 1e-16 × 700 K / 1e-4 K
    const node = createPlateNode(700);
    Object.assign(node, { held: true, lowK: 650, highK: 700, hd: 0.3, b: 668 });
    const h = heaterOf({ c: 2150, p: 2.98e5, g: 2230, loss: 8, ambient: 268 });
    const out = new Float64Array(1);
    for (const face of [600, 640, 660]) {
      plateStage(h, node, face, out);
      const slope = out[0]!;
      const central = (plateStage(h, node, face + 1e-4, out) - plateStage(h, node, face - 1e-4, out)) / 2e-4;
      assertClose(slope, central, { abs: 1e-7 }, `dT_p/dT_face at ${face} K`);
    }
  });
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
    expect(Math.abs(plateC - (SET_C - BAND_K / 2))).toBeLessThanOrEqual(HALF_WIDTH_K);
    const resistance = 1 / CONTACT + SLAB.thicknessM / SLAB.k + 1 / TOP_H;
    const steadyW = ((plateC - T0) / resistance + LOSS * (plateC - T0)) * AREA;
    // the tolerance: the slab's remaining transient (≈ 1e-5 K of ≈ 400 K) and the step's error (≤ 1e-3 K on ≈ 400 K)
    assertClose(h.powerW[last]!, steadyW, { rel: 1e-5 }, 'mean power at the end, W');
    expect(h.heldS).toBeGreaterThan(1100);
    expect(record.warnings.some((w) => w.startsWith(`the heater's thermostat switched ${HELD.heldSwitches} times within ${HELD.heldWithinS} s by t = `))).toBe(true);
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
    expect(Math.abs(h.powerW[after]!)).toBeLessThan(1e-9);
    const last = record.tS.length - 1;
    expect(Math.abs(h.plateC[last]! - (300 - BAND_K / 2))).toBeLessThanOrEqual(HALF_WIDTH_K);
    // let go while it cooled: no power from 402 s until the plate first reaches the new band's foot (≈ 417 s)
    const foot = record.tS.findIndex((t, i) => t > 402 && h.plateC[i]! <= 300 - BAND_K);
    expect(foot).toBeGreaterThan(after + 3);
    for (let i = after; i < foot; i++) expect(Math.abs(h.powerW[i]!)).toBeLessThan(1e-9);
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
