/**
 * The heater plates in the time loop (sim/physics/heater.ts has the model): the stage constants b and d·h of each
 * implicit stage, the plate temperature recovered after a stage, the heater's control (constant power, or an on/off
 * thermostat whose switching is a state event, events.ts) and the energy of a step.
 *
 * A plate's stage equations are those of a stack cell: trapezoidal stage c′·(T_g − T_0) = d·h·(f_0 + f_g), BDF2 stage
 * T_1 = A·T_g − B·T_0 + d·h·f_1/c′ (tr-bdf2.ts). So c′·(T_1 − T_0) = h·Σ w_i·f_i with the method's own weights, and
 * the plate's ledger — electric heat in = heat passed to the face + heat lost + heat stored — closes exactly, with f_i
 * built from the face heat q_i the stack itself books.
 *
 * An on-off thermostat on a light plate can cross its band in milliseconds, and every switch is a step landed on: an
 * hour of such a run is hundreds of thousands of switches, more than the run-time ceiling allows (step-guards.ts). Once
 * the thermostat has switched `heldThermostatDefaults.heldSwitches` times within `heldWithinS` (ten cycles of at most
 * 0.1 s each), it is held in its band: the relay's cycles are replaced by their mean. A fast relay's plate swings as a
 * sawtooth between the two levels, whose mean is the middle of the band where both ramps are nearly straight; the hold
 * begins only while the mean estimated from the plate's two exponential segments (physics/heater.ts relayCycle) lies
 * within heldLeanShare of the band (or numerics.tolerance_K, if larger) from the middle. Held, the power follows the
 * plate's temperature within each stage, from P_max at the middle − w/2 to 0 at the middle + w/2, w = heldWidthShare ×
 * band: the plate stays within w/2 of the middle at any duty, drawing the power that holds it there, the relay's mean
 * power. The stage stays one root per plate (plateStage), and the ledger stays exact: the heater's heat over a step is
 * what the plate's stages balance. The hold lets go when the estimated cycle would exceed letGoPeriodS or its mean lean
 * twice what begins a hold (a relay that can no longer pass a level, stuck on or off, has an endless cycle and leans to
 * that level), or when the plate has stayed out of the band for longer than heldWithinS; the relay then switches again
 * from there, on below the middle, off above it. Model error: the stack sees the middle of the band, not a ripple of
 * the band's height at the cycle's frequency, which its contact and heat capacity damp, nor the relay's lean (against
 * the relay followed switch by switch: tests/verification/thermostat-held.test.ts).
 *
 * A slower relay (heldSwitches within heldQuietWithinS, cycles up to 0.5 s) is held the same way when that ripple is
 * small: its largest amplitude over the stack's nodes, from the band's sawtooth at the observed cycle through the
 * contact into the grid as last evaluated (relay-ripple.ts), at most heldRippleShare of numerics.tolerance_K. Such a
 * hold lets go at a cycle heldQuietWithinS/heldWithinS times longer, or when the ripple at the estimated cycle passes
 * twice that share (tests/verification/relay-ripple.test.ts). While held, the trapezoidal stage takes the law's power
 * at its end for both halves (PlateNode.heldHd): its explicit half at full power overshot a hold begun with a long step.
 */
import type { StepConditions, Workspace } from '../grid/discretization.ts';
import type { Grid } from '../grid/mesh.ts';
import type { Heater, PlateNode } from '../physics/heater.ts';
import { heldThermostatDefaults, plateRate, relayCycle, setPointAt } from '../physics/heater.ts';
import type { Problem } from '../physics/problem.ts';
import { attachBenches, beginBenchStage, commitBenches } from './bench-chain.ts';
import type { StateSwitch, Thermostat } from './events.ts';
import { stackSensorK, thermostat } from './events.ts';
import { createRippleScratch, rippleInStackK, sawtoothFundamentalK } from './relay-ripple.ts';
import { STAGE_FRACTION } from './tr-bdf2.ts';


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
    if (node.held) {
      // the law at the stage's own time: the trapezoidal stage ends at γ·h (hd = γ·h/2), the others at h
      heldKnees(h, node, node.t0S + (stage === 'trapezoid' ? 2 * hd : stage === 'bdf2' ? hd / BDF2_SHARE : hd));
    }
    // held, the trapezoidal stage leaves the start's power out of b and takes the law's at its end for both halves
    // (PlateNode.heldHd)
    node.heldHd = node.held && stage === 'trapezoid' ? 2 * hd : hd;
    const startPower = node.held ? 0 : node.powerWPerM2;
    if (stage === 'trapezoid') node.b = node.tK + (hd * plateRate(h, startPower, node.tK, q0[side]!)) / h.capacityJPerM2K;
    else if (stage === 'euler') node.b = node.tK;
    else node.b = a * (Ug[nodeOf(ws, side)]! + qg[side]! / h.contactWPerM2K) - bb * node.tK;
  }
}

/** The share of the step that is the BDF2 stage's effective step d·h: d = 1 − √2/2 = γ/2 (tr-bdf2.ts). */
const BDF2_SHARE = STAGE_FRACTION / 2;

/** Sets a held plate's levels at time tS: set-point − band and set-point. */
function heldKnees(h: Heater, node: PlateNode, tS: number): void {
  const c = h.control;
  if (c.kind !== 'on-off') return;
  node.highK = setPointAt(h.setPoints, tS);
  node.lowK = node.highK - c.bandK;
}

/** What a heater did over one accepted step, per footprint area. */
export interface PlateStep {
  /** Electric heat into the plate, J/m². */
  heaterJ: number;
  /** Heat the plate lost to the surroundings, J/m². */
  lossJ: number;
  /** Change of the plate's stored heat, J/m². */
  storedJ: number;
  /** Power during the step (its mean, while held), W, and the plate temperature at its end, K (NaN without a heater). */
  powerW: number;
  plateK: number;
  /** Whether the thermostat was held in its band over the step (heldThermostatDefaults). */
  held: boolean;
  /**
   * While held: the window of the rule that began the hold, s (heldWithinS for a fast relay, heldQuietWithinS for one
   * whose ripple in the stack is small); NaN otherwise.
   */
  heldWithinS: number;
}

export interface PlateControlOptions {
  /** Hold a fast-cycling thermostat in its band (default true); false follows every switch (the comparison of tests). */
  readonly holdFastThermostats?: boolean;
}

export function createPlateControl(problem: Problem, grid: Grid, ws: Workspace, options: PlateControlOptions = {}) {
  /** The plate temperature the sensors read: recovered after each (trial) step, the node's own after a commit. */
  const nowK = Float64Array.of(problem.initialK, problem.initialK);
  let cond: StepConditions | undefined;
  const hold = options.holdFastThermostats ?? true;
  /**
   * Each side's last heldSwitches switch times, a ring (NaN: none yet), and where the next one goes; while held, how
   * long its plate has been out of the band, and whether the hold began by the ripple rule (`quiet`).
   */
  const switchTimes = SIDES.map(() => ({ at: new Float64Array(heldThermostatDefaults.heldSwitches).fill(NaN), next: 0, outsideS: 0, quiet: false }));
  const forget = (side: 0 | 1): void => { switchTimes[side]!.at.fill(NaN); switchTimes[side]!.outsideS = 0; };
  const rippleScratch = createRippleScratch(grid.n + 2);
  /**
   * The ripple a relay cycling at periodS sends into the stack, in units of what a quiet hold allows (heldRippleShare
   * of tolerance_K): from the band's sawtooth on the plate, on the state last evaluated into ws (relay-ripple.ts).
   */
  const rippleOf = (h: Heater, node: PlateNode, side: 0 | 1, periodS: number): number =>
    rippleInStackK(ws, side, h.contactWPerM2K, sawtoothFundamentalK(node.highK - node.lowK), periodS, rippleScratch) /
    (heldThermostatDefaults.heldRippleShare * problem.numerics.toleranceK);
  /** The face temperature at the end of the last accepted step, K, per side (what the relay's estimates read). */
  const faceNowK = Float64Array.of(NaN, NaN);
  /** relayCycle()'s period and mean. */
  const cycle = new Float64Array(2);
  /**
   * How far the relay's estimated mean leans from the band's middle, in units of what a hold allows: heldLeanShare of
   * the band, or the run's own temperature tolerance where that is larger (a lean of hundredths of a kelvin in a
   * narrow band is below what the steps resolve anyway). Above 1 no hold begins; above 2 a hold lets go.
   */
  const leanOf = (h: Heater, node: PlateNode, faceK: number): number => {
    relayCycle(h, node.lowK, node.highK, faceK, cycle);
    const allowed = Math.max(heldThermostatDefaults.heldLeanShare * (node.highK - node.lowK), problem.numerics.toleranceK);
    return Math.abs(cycle[1]! - 0.5 * (node.lowK + node.highK)) / allowed;
  };
  /** Records a switch at tS; returns how long the last heldSwitches switches took, s (NaN until there are as many). */
  const switchSpan = (side: 0 | 1, tS: number): number => {
    const ring = switchTimes[side]!;
    ring.at[ring.next] = tS;
    ring.next = (ring.next + 1) % ring.at.length;
    // after the write, the slot at `next` holds the switch heldSwitches − 1 before this one
    return tS - ring.at[ring.next]!;
  };
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
      active: () => control() !== undefined && !ws.plates[side].held,
      onSwitch: (on, tS) => {
        const { h, c } = control()!;
        const node = ws.plates[side];
        // cycling too fast to follow, or fast with a ripple in the stack below what the run resolves, around the middle
        // of the band: from here the plate is held in its band by the relay's mean power (heldKnees sets the levels at
        // tS, which leanOf and rippleOf read; the state in ws is the one the switch landed on)
        const g = heldThermostatDefaults;
        const span = hold && c.sensor.kind === 'plate' ? switchSpan(side, tS) : NaN;
        if (span <= g.heldQuietWithinS) {
          heldKnees(h, node, tS);
          const fast = span <= g.heldWithinS;
          const quiet = !fast && rippleOf(h, node, side, span / ((g.heldSwitches - 1) / 2)) <= 1;
          if ((fast || quiet) && leanOf(h, node, faceNowK[side]!) <= 1) {
            node.held = true;
            forget(side);
            switchTimes[side]!.quiet = quiet;
            return;
          }
        }
        node.powerWPerM2 = on ? h.powerWPerM2 : 0;
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
    { heaterJ: 0, lossJ: 0, storedJ: 0, powerW: NaN, plateK: NaN, held: false, heldWithinS: NaN },
    { heaterJ: 0, lossJ: 0, storedJ: 0, powerW: NaN, plateK: NaN, held: false, heldWithinS: NaN },
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
        if (!h) { node.powerWPerM2 = 0; node.held = false; continue; }
        if (h.control.kind === 'pi') {
          const st = pi[side]!;
          if (was !== h) { st.integralKs = 0; st.nextS = tS; }
          // a sample is due at its breakpoint (allowing for the rounding of k·period)
          if (tS >= st.nextS - 1e-9 * Math.max(1, tS)) samplePi(h, side, tS);
          node.powerWPerM2 = st.powerW / h.areaM2;
          continue;
        }
        // a heater newly under the stack starts on; one that stays keeps its thermostat's state (held or switching)
        if (was !== h) { thermostats[side]!.reset(true); node.held = false; forget(side); }
        if (node.held) { heldKnees(h, node, tS); continue; }
        node.powerWPerM2 = h.control.kind === 'constant' || thermostats[side]!.isOn() ? h.powerWPerM2 : 0;
      }
    },
    /** A step (and every trial of it) starts at tS: a held plate's stages read the set-point at their own times. */
    startStep(tS: number): void {
      ws.plates[0].t0S = tS;
      ws.plates[1].t0S = tS;
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
     * Accepts a step of length hS whose face heats were q0, qg, q1 at the start, the stage and the end and face temperatures Ug, U1 (weights w of the
     * method's quadrature): advances the plates and returns what each side's heater did.
     */
    commit(hS: number, w: readonly [number, number, number], q0: Float64Array, qg: Float64Array, q1: Float64Array, Ug: Float64Array, U1: Float64Array, out: [PlateStep, PlateStep]): void {
      commitBenches(ws, cond, U1);
      for (const side of SIDES) {
        const r = out[side];
        const h = cond ? heaterOn(cond, side) : undefined;
        const node = ws.plates[side];
        r.held = node.held;
        r.heldWithinS = node.held ? (switchTimes[side]!.quiet ? heldThermostatDefaults.heldQuietWithinS : heldThermostatDefaults.heldWithinS) : NaN;
        if (!h) { r.heaterJ = 0; r.lossJ = 0; r.storedJ = 0; r.powerW = NaN; r.plateK = NaN; continue; }
        const j = nodeOf(ws, side);
        const t0 = node.tK;
        const tg = Ug[j]! + qg[side]! / h.contactWPerM2K;
        const t1 = U1[j]! + q1[side]! / h.contactWPerM2K;
        r.lossJ = hS * h.lossWPerM2K * (w[0] * (t0 - h.lossToK) + w[1] * (tg - h.lossToK) + w[2] * (t1 - h.lossToK));
        r.storedJ = h.capacityJPerM2K * (t1 - t0);
        // held, the power may vary within the step: its heat is what the plate's stages balance, stored + passed to
        // the face + lost (each stage solved the plate exactly, physics/heater.ts plateStage). Reading the law at the
        // recovered plate temperatures instead would amplify their round-off by the law's slope P_max/w (the cost: a
        // held step at full power or none reads within round-off of it, e.g. 7e-16 W, not exactly)
        r.heaterJ = node.held
          ? r.storedJ + r.lossJ + hS * (w[0] * q0[side]! + w[1] * qg[side]! + w[2] * q1[side]!)
          : hS * node.powerWPerM2;
        r.powerW = node.held ? (r.heaterJ / hS) * h.areaM2 : node.powerWPerM2 * h.areaM2;
        r.plateK = t1;
        node.tK = t1;
        node.b = t1;
        node.hd = 0;
        nowK[side] = t1;
        faceNowK[side] = U1[j]!;
        if (!node.held) continue;
        // the levels at the step's end, which the checks below read
        heldKnees(h, node, node.t0S + hS);
        const ring = switchTimes[side]!;
        const g = heldThermostatDefaults;
        ring.outsideS = t1 < node.lowK || t1 > node.highK ? ring.outsideS + hS : 0;
        // leanOf fills cycle (the period) as it goes; a quiet hold (begun by the ripple rule) allows the longer cycles
        // that rule admits, while their ripple stays within twice what begins one
        const lean = leanOf(h, node, U1[j]!);
        const quiet = ring.quiet;
        const slow = lean > 2 || cycle[0]! > g.letGoPeriodS * (quiet ? g.heldQuietWithinS / g.heldWithinS : 1)
          || (quiet && rippleOf(h, node, side, cycle[0]!) > 2);
        if (slow || ring.outsideS > g.heldWithinS) {
          // the relay's cycle would no longer be fast, or its mean no longer the middle, or the plate has stayed out of
          // the band (the law at full power or none there, as the relay would be) for longer than a held cycle lasts
          // (just out of it, it is the overshoot of the switch that began the hold): switch again, on below the middle
          // of the band, off above it
          const on = t1 < 0.5 * (node.lowK + node.highK);
          node.held = false;
          ring.outsideS = 0;
          thermostats[side]!.reset(on);
          node.powerWPerM2 = on ? h.powerWPerM2 : 0;
        }
      }
    },
  };
}

export type PlateControl = ReturnType<typeof createPlateControl>;
