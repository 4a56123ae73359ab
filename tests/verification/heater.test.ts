// The heater as a body (physics/heater.ts): a plate of thermal mass c′ = ρ·c·t heated at a constant power p per unit
// area, coupled to a thin, highly conductive slab through the conductance G (contact in series with the slab's half
// thickness). With no losses the two form a linear two-node network (Incropera & DeWitt, Fundamentals of Heat and Mass
// Transfer, 6th ed., §5.1–5.3, lumped capacitance, applied to each body):
//   C_p·dT_p/dt = p − G·(T_p − T_s),   C_s·dT_s/dt = G·(T_p − T_s)
// whose solution from rest is T_p(t) = T₀ + p·t/(C_p + C_s) + (C_s/(C_p + C_s))·δ∞·(1 − e^(−t/τ)),
// δ∞ = p·C_s/(G·(C_p + C_s)), τ = C_p·C_s/(G·(C_p + C_s)) (derived here: the difference δ = T_p − T_s obeys
// dδ/dt = p/C_p − G·δ·(1/C_p + 1/C_s), the heat-capacity-weighted mean rises as p·t/(C_p + C_s)).

import { describe, expect, it } from 'vitest';
import { assertClose } from '../support/assert-close.ts';
import { runOk, scenario } from '../support/scenarios.ts';
import type { FaceSegmentFile } from '../../sim/scenario/scenario-schema.ts';

const AREA = (Math.PI * 0.025 ** 2) / 4;
const POWER_W = 150;
const P = POWER_W / AREA;
const CP_PLATE = 7900 * 500 * 0.006;
const CS = 8900 * 400 * 0.001;
const G = 1 / (1 / 2000 + 0.0005 / 400);
const T0 = 20;
const SET_C = 420;

function plateClosedFormC(t: number): number {
  const sum = CP_PLATE + CS;
  const tau = (CP_PLATE * CS) / (G * sum);
  const deltaInf = (P * CS) / (G * sum);
  return T0 + (P * t) / sum + (CS / sum) * deltaInf * (1 - Math.exp(-t / tau));
}

/** The time the closed form reaches `level` (°C), by bisection on the closed form itself (monotone in t). */
function closedFormTimeTo(level: number): number {
  let lo = 0;
  let hi = 1000;
  for (let k = 0; k < 200; k++) {
    const mid = 0.5 * (lo + hi);
    if (plateClosedFormC(mid) < level) lo = mid; else hi = mid;
  }
  return 0.5 * (lo + hi);
}

const heaterSegment = (control: unknown, extra: Record<string, unknown> = {}): FaceSegmentFile => ({
  from_s: 0,
  heater: { power_W: POWER_W, plate: { material: 'steel', thickness_mm: 6 }, contact_W_m2K: 2000, control, ...extra },
} as FaceSegmentFile);

const stack = (bottom: FaceSegmentFile[], top: FaceSegmentFile[] = [], duration = 60) => scenario({
  duration_s: duration, ambient_C: T0, initial_C: T0, footprint: { diameter_mm: 25 },
  materials: { slab: { k_W_mK: 400, rho_kg_m3: 8900, cp_J_kgK: 400 }, steel: { k_W_mK: 20, rho_kg_m3: 7900, cp_J_kgK: 500 } },
  layers: [{ id: 'slab', material: 'slab', thickness_mm: 1 }],
  bottom, top,
  // tight enough that the step's own error (≤ 1e-3 K) is far below what the checks resolve
  numerics: { tolerance_K: 1e-3 },
});

describe('the heater as a body', () => {
  it('runProblem() heats the plate at constant power along the two-node closed form until its set-point', () => {
    const { record } = runOk(stack([heaterSegment({ kind: 'on-off', set_point_C: SET_C, band_K: 5, sensor: 'plate' })]));
    const h = record.heater!;
    const tSwitch = closedFormTimeTo(SET_C);
    let checked = 0;
    record.tS.forEach((t, i) => {
      if (t > 0 && t < tSwitch - 0.01) {
        // the slab is not quite one node: its half-thickness conduction is in G, its internal gradient (qL/k ≈ 0.1 K
        // across it at the plate's δ∞·G ≈ 40 kW/m²) shifts its mean by a few hundredths of a kelvin
        assertClose(h.plateC[i]!, plateClosedFormC(t), { abs: 0.05 }, `plate at t = ${t} s`);
        checked++;
      }
    });
    expect(checked).toBeGreaterThan(10);
  });

  it('runProblem() switches the heater off at the closed-form time, and the ledger holds P·t of heater energy', () => {
    const { record, summary } = runOk(stack([heaterSegment({ kind: 'on-off', set_point_C: SET_C, band_K: 5, sensor: 'plate' })]));
    const tSwitch = closedFormTimeTo(SET_C);
    // with no losses the plate then only shares heat with the slab: it drops C_s/(C_p+C_s)·δ∞ ≈ 2.6 K, inside the
    // 5 K band, so the heater stays off and its energy is P·t_switch. Tolerance: 0.05 K on the plate at ≈ 11 K/s
    // (above) is 0.005 s, plus the 1e-3 s event tolerance: 0.01 s, i.e. 1.5 J of the ≈ 5.3 kJ.
    assertClose(summary.heater!.energy_J, POWER_W * tSwitch, { abs: POWER_W * 0.01 }, 'heater energy, J');
    const off = record.tS.findIndex((_, i) => record.heater!.powerW[i] === 0);
    assertClose(record.tS[off - 1]!, tSwitch, { abs: 0.01 }, 'switch-off time, s');
    // duty cycle: on for t_switch of the 60 s under the stack (the definition, README "heater"), same 0.01 s tolerance
    assertClose(summary.heater!.under_stack_s, 60, { abs: 1e-9 }, 'time under the stack, s');
    assertClose(summary.heater!.duty_cycle, tSwitch / 60, { abs: 0.01 / 60 }, 'duty cycle');
    // the ledger with its heater channel closes to round-off (the plate's stages use the method's own weights)
    expect(summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
    assertClose(summary.energy.heater_J_m2!, summary.heater!.energy_J / AREA, { rel: 1e-12 }, 'J/m² = J / area');
  });

  it('runProblem() with an on-off heater on a steady load keeps the sensed plate in its band, and the ledger closes', () => {
    const band = 5;
    const { record, summary } = runOk(stack(
      [heaterSegment({ kind: 'on-off', set_point_C: SET_C, band_K: band, sensor: 'plate' }, { loss_W_m2K: 20 })],
      [{ from_s: 0, convection_W_m2K: 50 }], 600));
    const h = record.heater!;
    const first = Array.from(h.plateC).findIndex((c) => c >= SET_C);
    expect(first).toBeGreaterThan(0);
    let switches = 0;
    for (let i = first; i < record.tS.length; i++) {
      // an event is landed on at most 1e-3 s late; the plate moves ≤ 11 K/s: 0.011 K past a level at most
      expect(h.plateC[i]!).toBeLessThanOrEqual(SET_C + 0.011);
      expect(h.plateC[i]!).toBeGreaterThanOrEqual(SET_C - band - 0.011);
      if (h.powerW[i] !== h.powerW[i - 1]) switches++;
    }
    expect(switches).toBeGreaterThan(4);
    expect(summary.heater!.duty_cycle).toBeGreaterThan(0);
    expect(summary.heater!.duty_cycle).toBeLessThan(1);
    expect(summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
  });

  it('runProblem() with a PI heater settles the plate at its set-point, with the power that balances its loss h·A·(T_set − T∞)', () => {
    const loss = 20;
    const { record, summary } = runOk(stack(
      [heaterSegment({ kind: 'pi', set_point_C: SET_C, gain_W_K: 5, integral_s: 30, period_s: 1, sensor: 'plate' }, { loss_W_m2K: loss })],
      [], 1200));
    const h = record.heater!;
    const last = record.tS.length - 1;
    // steady state of the plate and an adiabatic-topped slab: the slab takes no heat, the plate loses h·A·ΔT, and the
    // integral action leaves no offset (Åström & Hägglund, PID Controllers, §3.2). After 40 integral times the
    // remaining transient is far below the tolerances: 0.01 K on the plate and 1e-3 relative on the power.
    assertClose(h.plateC[last]!, SET_C, { abs: 0.01 }, 'plate at the end, °C');
    assertClose(h.powerW[last]!, loss * AREA * (SET_C - T0), { rel: 1e-3 }, 'power at the end, W');
    expect(summary.energy.imbalance_rel).toBeLessThanOrEqual(1e-12);
    // the power is held between samples and changes only on them: a step lands on every sample of the 1 s period
    const ends = new Set(Array.from(record.tS, (t) => Math.round(t * 1e6) / 1e6));
    for (let k = 1; k < 1200; k++) expect(ends.has(k), `a step ends at the sample t = ${k} s`).toBe(true);
  });

  it('runProblem() with the thermostat on a layer switches where that layer\'s mean reaches set-point and set-point − band', () => {
    const band = 4;
    const set = 300;
    const { record } = runOk(stack(
      [heaterSegment({ kind: 'on-off', set_point_C: set, band_K: band, sensor: 'slab' }, { loss_W_m2K: 20 })],
      [{ from_s: 0, convection_W_m2K: 50 }], 600));
    const mean = record.layers[0]!.meanC;
    const power = record.heater!.powerW;
    let switches = 0;
    for (let i = 2; i < record.tS.length; i++) {
      // a row's power is the one during the step that ended there: a change means the previous row ended on a switch
      if (power[i] === power[i - 1]) continue;
      switches++;
      const level = power[i] === 0 ? set : set - band;
      // landed at most 1e-3 s past the crossing; the slab mean rises at most as fast as the whole network,
      // p/(C_p + C_s) ≈ 11.2 K/s: ≤ 0.012 K past its level
      assertClose(mean[i - 1]!, level, { abs: 0.012 }, `slab mean at the switch at t = ${record.tS[i - 1]} s`);
    }
    expect(switches).toBeGreaterThan(4);
  });
});
