/**
 * The heater plates in the time loop (sim/physics/heater.ts has the model): the stage constants b and d·h of each
 * implicit stage, the plate temperature recovered after a stage, the heater's control (constant power, or an on/off
 * thermostat whose switching is a state event, events.ts) and the energy of a step.
 *
 * A plate's stage equations are those of a stack cell: trapezoidal stage c′·(T_g − T_0) = d·h·(f_0 + f_g), BDF2 stage
 * T_1 = A·T_g − B·T_0 + d·h·f_1/c′ (tr-bdf2.ts). So c′·(T_1 − T_0) = h·Σ w_i·f_i with the method's own weights, and
 * the plate's ledger — electric heat in = heat passed to the face + heat lost + heat stored — closes exactly, with f_i
 * built from the face heat q_i the stack itself books.
 */
import type { StepConditions, Workspace } from '../grid/discretization.ts';
import type { Grid } from '../grid/mesh.ts';
import type { Heater } from '../physics/heater.ts';
import { plateRate, setPointAt } from '../physics/heater.ts';
import type { Problem } from '../physics/problem.ts';
import { attachBenches, beginBenchStage, commitBenches } from './bench-chain.ts';
import type { StateSwitch, Thermostat } from './events.ts';
import { stackSensorK, thermostat } from './events.ts';

const SIDES = [0, 1] as const;

const heaterOn = (cond: StepConditions, side: 0 | 1): Heater | undefined => {
  const c = side === 0 ? cond.bottom : cond.top;
  return c.kind === 'heater' ? c.heater : undefined;
};

/** The node index of a face: 0 (bottom) or n + 1 (top). */
const nodeOf = (ws: Workspace, side: 0 | 1): number => (side === 0 ? 0 : ws.n + 1);

/**
 * Sets the plates' stage constants before a stage of a step from ws.plates[·].tK. 'trapezoid' (first TR-BDF2 stage,
 * effective step hd = d·h): b = T_0 + hd·f_0/c′ with f_0 from the booked face heat q0. 'euler': b = T_0. 'bdf2': b =
 * a·T_g − bb·T_0, with T_g recovered from the first stage (face temperature faceGK and face heat qg).
 */
export function beginPlateStage(ws: Workspace, cond: StepConditions, hd: number, stage: 'trapezoid' | 'euler' | 'bdf2',
  q0: Float64Array, qg: Float64Array, Ug: Float64Array, a = 0, bb = 0): void {
  // a bench under a face takes the same stages (bench-chain.ts)
  beginBenchStage(ws, cond, hd, stage, q0, Ug, a, bb);
  for (const side of SIDES) {
    const h = heaterOn(cond, side);
    if (!h) continue;
    const node = ws.plates[side];
    node.hd = hd;
    if (stage === 'trapezoid') node.b = node.tK + (hd * plateRate(h, node, node.tK, q0[side]!)) / h.capacityJPerM2K;
    else if (stage === 'euler') node.b = node.tK;
    else node.b = a * (Ug[nodeOf(ws, side)]! + qg[side]! / h.contactWPerM2K) - bb * node.tK;
  }
}

/** What a heater did over one accepted step, per footprint area. */
export interface PlateStep {
  /** Electric heat into the plate, J/m². */
  heaterJ: number;
  /** Heat the plate lost to the surroundings, J/m². */
  lossJ: number;
  /** Change of the plate's stored heat, J/m². */
  storedJ: number;
  /** Power during the step, W, and the plate temperature at its end, K (NaN without a heater). */
  powerW: number;
  plateK: number;
}

export function createPlateControl(problem: Problem, grid: Grid, ws: Workspace) {
  /** The plate temperature the sensors read: recovered after each (trial) step, the node's own after a commit. */
  const nowK = Float64Array.of(problem.initialK, problem.initialK);
  let cond: StepConditions | undefined;
  const thermostats: Thermostat[] = SIDES.map((side) => {
    const control = () => {
      const h = cond ? heaterOn(cond, side) : undefined;
      return h && h.control.kind === 'on-off' ? { h, c: h.control } : undefined;
    };
    return thermostat({
      sensorK: (w) => {
        const c = control()!.c;
        return c.sensor.kind === 'plate' ? nowK[side]! : stackSensorK({ kind: 'layer', index: c.sensor.index }, w, grid);
      },
      setPointK: (tS) => setPointAt(control()!.h.setPoints, tS),
      bandK: () => { const c = control()!.c; return c.bandK; },
      active: () => control() !== undefined,
      onSwitch: (on) => {
        ws.plates[side].powerWPerM2 = on ? control()!.h.powerWPerM2 : 0;
      },
    });
  });
  const switches: readonly StateSwitch[] = thermostats;
  /** Each side's PI controller: its integral of the error (K·s), its next sample (s) and the power it holds (W). */
  const pi = SIDES.map(() => ({ integralKs: 0, nextS: 0, powerW: 0 }));
  /** A PI sample at tS (a breakpoint: problem.ts puts every sample there): reads the sensor, sets the power. */
  const samplePi = (h: Heater, side: 0 | 1, tS: number): void => {
    const c = h.control;
    if (c.kind !== 'pi') return;
    const st = pi[side]!;
    // the state in ws is the end of the step that landed here; before the first step it is the initial state
    const sensed = c.sensor.kind === 'plate' ? ws.plates[side].tK
      : tS === 0 ? problem.initialK : stackSensorK({ kind: 'layer', index: c.sensor.index }, ws, grid);
    const e = setPointAt(h.setPoints, tS) - sensed;
    const out = (integral: number) => c.gainWPerK * (e + integral / c.integralS);
    const grown = st.integralKs + e * c.periodS;
    // conditional integration: the integral grows only while the output it gives is within [0, P_max]
    if (out(grown) >= 0 && out(grown) <= h.powerW) st.integralKs = grown;
    st.powerW = Math.min(h.powerW, Math.max(0, out(st.integralKs)));
    st.nextS = tS + c.periodS;
  };

  /**
   * The plate temperatures the sensors read at a state, recovered from its face temperatures (U, the n+2 node layout)
   * and the heats into the faces there (q, by ledger channel): T_plate = T_face + q/G_contact.
   */
  const recoverPlates = (U: Float64Array, q: Float64Array): void => {
    if (!cond) return;
    for (const side of SIDES) {
      const h = heaterOn(cond, side);
      if (h) nowK[side] = U[nodeOf(ws, side)]! + q[side]! / h.contactWPerM2K;
    }
  };

  const steps: [PlateStep, PlateStep] = [
    { heaterJ: 0, lossJ: 0, storedJ: 0, powerW: NaN, plateK: NaN }, { heaterJ: 0, lossJ: 0, storedJ: 0, powerW: NaN, plateK: NaN },
  ];
  return {
    switches,
    /** What each side's heater did over the last accepted step (commit() writes it; evolve's StepReport holds it). */
    steps,
    /** New conditions from tS on (the start, a schedule change): powers follow each heater's control. */
    attach(next: StepConditions, previous: StepConditions | undefined, tS: number): void {
      cond = next;
      attachBenches(ws, next, previous, problem.durationS - tS);
      for (const side of SIDES) {
        const h = heaterOn(next, side);
        const node = ws.plates[side];
        node.hd = 0;
        node.b = node.tK;
        nowK[side] = node.tK;
        const was = previous ? heaterOn(previous, side) : undefined;
        if (!h) { node.powerWPerM2 = 0; continue; }
        if (h.control.kind === 'pi') {
          const st = pi[side]!;
          if (was !== h) { st.integralKs = 0; st.nextS = tS; }
          // a sample is due at its breakpoint (allowing for the rounding of k·period)
          if (tS >= st.nextS - 1e-9 * Math.max(1, tS)) samplePi(h, side, tS);
          node.powerWPerM2 = st.powerW / h.areaM2;
          continue;
        }
        // a heater newly under the stack starts on; one that stays keeps its thermostat's state
        if (was !== h) thermostats[side]!.reset(true);
        node.powerWPerM2 = h.control.kind === 'constant' || thermostats[side]!.isOn() ? h.powerWPerM2 : 0;
      }
    },
    /**
     * The plate temperatures at a step's stage point, for the sensors, from its state Ug and face heats qg. The next
     * trial's afterTrial() replaces them.
     */
    atStage(Ug: Float64Array, qg: Float64Array): void {
      recoverPlates(Ug, qg);
    },
    /** After a (trial) step: the plate temperatures at its end, for the sensors. */
    afterTrial(): void {
      recoverPlates(ws.T, ws.faceQ);
    },
    /**
     * Accepts a step of length hS whose face heats were qg, q1 at the stage and the end and face temperatures Ug, U1 (weights w of the
     * method's quadrature): advances the plates and returns what each side's heater did.
     */
    commit(hS: number, w: readonly [number, number, number], qg: Float64Array, q1: Float64Array, Ug: Float64Array, U1: Float64Array, out: [PlateStep, PlateStep]): void {
      commitBenches(ws, cond, U1);
      for (const side of SIDES) {
        const r = out[side];
        const h = cond ? heaterOn(cond, side) : undefined;
        const node = ws.plates[side];
        if (!h) { r.heaterJ = 0; r.lossJ = 0; r.storedJ = 0; r.powerW = NaN; r.plateK = NaN; continue; }
        const j = nodeOf(ws, side);
        const t0 = node.tK;
        const tg = Ug[j]! + qg[side]! / h.contactWPerM2K;
        const t1 = U1[j]! + q1[side]! / h.contactWPerM2K;
        r.heaterJ = hS * node.powerWPerM2;
        r.lossJ = hS * h.lossWPerM2K * (w[0] * (t0 - h.lossToK) + w[1] * (tg - h.lossToK) + w[2] * (t1 - h.lossToK));
        r.storedJ = h.capacityJPerM2K * (t1 - t0);
        r.powerW = node.powerWPerM2 * h.areaM2;
        r.plateK = t1;
        node.tK = t1;
        node.b = t1;
        node.hd = 0;
        nowK[side] = t1;
      }
    },
  };
}

export type PlateControl = ReturnType<typeof createPlateControl>;
