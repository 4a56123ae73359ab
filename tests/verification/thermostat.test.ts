// State events (sim/time/events.ts, evolve.ts) on a thermostat toy: a thin, highly conductive slab heated through its
// bottom face by a constant flux while a thermostat on its mean temperature is on, cooled by convection from its top
// face all the time. With Bi = hL/k = 5e-5 the slab is a lumped capacitance, whose temperature under an imposed flux q
// and convection h is, with θ = T − T∞ − q/h and τ = ρcL/h (Incropera & DeWitt, Fundamentals of Heat and Mass Transfer,
// 6th ed., §5.3, general lumped capacitance analysis):  θ(t) = θ₀·exp(−t/τ).
// So every switch time is closed-form: the heating leg from T_a to T_b takes τ·ln((T_a − T∞ − q/h)/(T_b − T∞ − q/h)),
// the cooling leg (q = 0) τ·ln((T_a − T∞)/(T_b − T∞)).

import { describe, expect, it } from 'vitest';
import { buildGrid } from '../../sim/grid/mesh.ts';
import { ADIABATIC } from '../../sim/physics/problem.ts';
import type { StepConditions } from '../../sim/grid/discretization.ts';
import { evolve } from '../../sim/time/evolve.ts';
import { stackSensorK, thermostat } from '../../sim/time/events.ts';
import { assertClose } from '../support/assert-close.ts';
import { flat, parseOk, slab, toK } from '../support/scenarios.ts';

const RHO = 8900;
const CP = 400;
const K = 400;
const L = 1e-3;
const H = 20;
const Q = 5000;
const AMBIENT_C = 20;
const SET_C = 150;
const BAND_K = 5;
const TAU = (RHO * CP * L) / H;

const problem = parseOk(slab({
  duration_s: 300, ambient_C: AMBIENT_C, initial_C: AMBIENT_C,
  material: { k_W_mK: K, rho_kg_m3: RHO, cp_J_kgK: flat(CP) }, thickness_mm: 1,
  bottom: [{ from_s: 0, flux_W_m2: Q }],
  top: [{ from_s: 0, convection_W_m2K: H }],
  // a tight error tolerance, so the switch times measure the event location rather than the step's error
  numerics: { tolerance_K: 1e-3 },
}));

/** Closed-form switch times of the lumped slab: off at the set-point, on at set-point − band, alternating. */
function closedFormSwitches(until: number): number[] {
  const excess = Q / H;
  const heat = (from: number, to: number) => TAU * Math.log((from - AMBIENT_C - excess) / (to - AMBIENT_C - excess));
  const cool = (from: number, to: number) => TAU * Math.log((from - AMBIENT_C) / (to - AMBIENT_C));
  const times = [heat(AMBIENT_C, SET_C)];
  for (let k = 1; times[times.length - 1]! < until; k++) {
    times.push(times[times.length - 1]! + (k % 2 === 1 ? cool(SET_C, SET_C - BAND_K) : heat(SET_C - BAND_K, SET_C)));
  }
  return times.slice(0, -1);
}

function run() {
  const grid = buildGrid(problem);
  const switchedAt: number[] = [];
  const sensor = { kind: 'layer', index: 0 } as const;
  const th = thermostat({
    sensorK: (ws) => stackSensorK(sensor, ws, grid),
    setPointK: () => toK(SET_C),
    bandK: () => BAND_K,
    onSwitch: (_on, tS) => { switchedAt.push(tS); },
  });
  const adjust = (c: StepConditions): StepConditions => (th.isOn() ? c : { ...c, bottom: ADIABATIC });
  const steps: { t1: number; meanC: number; switched: boolean }[] = [];
  const loop = evolve(problem, grid, { switches: [{ ...th, adjust }] });
  for (;;) {
    const next = loop.next();
    if (next.done) { expect(next.value.status).toBe('ok'); break; }
    steps.push({ t1: next.value.t1, meanC: stackSensorK(sensor, next.value.ws, grid) - toK(0), switched: next.value.switched });
  }
  return { switchedAt, steps };
}

describe('state events: a thermostat on a lumped slab', () => {
  it('evolve() switches at the closed-form times of the lumped slab, to within 0.01 s over ten cycles', () => {
    const { switchedAt } = run();
    const expected = closedFormSwitches(300);
    expect(switchedAt.length).toBe(expected.length);
    // Errors: the lumped model's neglect of the internal gradient (Bi = 5e-5: the mean lags the lumped value by
    // ~qL/(2k) = 0.006 K, i.e. < 0.01 s at the ≥ 0.7 K/s the sensor moves), the event tolerance (1e-3 s late per
    // switch) and the step error at tolerance 1e-3 K; they accumulate over the cycles, so 0.01 s + 1e-3 s per switch.
    expected.forEach((t, k) => assertClose(switchedAt[k]!, t, { abs: 0.01 + 1e-3 * k }, `switch ${k}`));
  });

  it('evolve() lands a step on every crossing: the sensor there is at its level, at most the event tolerance late', () => {
    const { switchedAt, steps } = run();
    for (const [k, t] of switchedAt.entries()) {
      const at = steps.find((s) => s.t1 === t);
      expect(at, `a step ends at the switch ${k}, t = ${t} s`).toBeDefined();
      expect(at!.switched).toBe(true);
      const level = k % 2 === 0 ? SET_C : SET_C - BAND_K;
      // the kept step ends at or past the crossing by ≤ 1e-3 s; the sensor moves ≤ 1.5 K/s (q/(ρcL) = 1.4 K/s), so
      // it is past its level by at most 0.0015 K, plus the Newton tolerance (1e-5 K)
      const past = k % 2 === 0 ? at!.meanC - level : level - at!.meanC;
      expect(past).toBeGreaterThanOrEqual(-1e-9);
      expect(past).toBeLessThanOrEqual(0.0015 + 1e-5);
    }
  });

  it('evolve() holds the sensor in its band [set-point − band, set-point] once the set-point is reached', () => {
    const { switchedAt, steps } = run();
    const after = steps.filter((s) => s.t1 >= switchedAt[0]!);
    expect(after.length).toBeGreaterThan(10);
    // the same allowance as above: an event is landed on at most 1e-3 s late, 0.0015 K past its level
    for (const s of after) {
      expect(s.meanC).toBeLessThanOrEqual(SET_C + 0.0015 + 1e-5);
      expect(s.meanC).toBeGreaterThanOrEqual(SET_C - BAND_K - 0.0015 - 1e-5);
    }
  });
});
