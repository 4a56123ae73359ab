/**
 * State events: a switch watches a function g of the state (a sensor temperature minus a set-point) and acts when g
 * rises through zero. After each accepted step the time loop evaluates every armed switch (g < 0 at the step's start);
 * if one has risen to g ≥ 0 by the step's end, the step is redone from the same start with a shorter length until it
 * ends just past the earliest crossing: regula falsi on the step length with Anderson and Björck's scaling of the kept
 * end (BIT 13 (1973) 253–264; the Illinois halving, Dowell & Jarratt, BIT 11 (1971) 168–174, where their factor is not
 * positive), stopped when the bracket is narrower than the time tolerance. Its first estimate is the root of the
 * parabola through g at the step's start, its stage point and its end (parabolaRoot), which the step has already
 * computed; regula falsi's first point, from the two ends alone, is poor wherever g curves over a long step. Each trial
 * is aimed a little to one side of its estimate, so that the trial that closes the bracket is, as a rule, the step
 * kept. The step that is kept is the bracket's right end, so the switch sees its level reached, at most the tolerance
 * late. Then the switch acts and the loop re-reads the face conditions, as at a schedule change (Hairer, Nørsett &
 * Wanner, Solving ODEs I, §II.6, "dense output and event location"; here without dense output: each trial is a real
 * step, so the landed state is the method's own). A g that dips above zero and back within one step is not seen; the
 * step limit bounds how long such a dip can be.
 */
import type { Workspace } from '../grid/discretization.ts';
import type { Grid } from '../grid/mesh.ts';

/** A switch driven by the state. */
export interface StateSwitch {
  /**
   * The event function at the state U (the loop's n + 2 state vector) evaluated into ws, at time tS: the event is its
   * rise from < 0 to ≥ 0.
   */
  readonly g: (ws: Workspace, tS: number, U: Float64Array) => number;
  /**
   * The loop has landed on the crossing at tS: act (the loop then re-reads the conditions and settles the faces, unless
   * the switch is quiet).
   */
  readonly fire: (tS: number) => void;
  /**
   * A quiet switch changes no condition: it marks an instant the run reports (the separator's melt and freeze,
   * separator-events.ts). The loop lands on it as on any other, but neither re-reads the conditions nor shortens the
   * step that follows.
   */
  readonly quiet?: boolean;
  /** Called with the state at the end of every accepted step (after any firing), before g is read for the next one. */
  readonly accepted?: (ws: Workspace, tS: number, U: Float64Array) => void;
}

/** A sensor of the stack: a face's temperature, or the thickness-weighted mean temperature of a layer. */
export type StackSensor =
  | { readonly kind: 'face'; readonly side: 0 | 1 }
  | { readonly kind: 'layer'; readonly index: number };

/** The sensor's temperature at the state evaluated into ws, K. */
export function stackSensorK(sensor: StackSensor, ws: Workspace, grid: Grid): number {
  if (sensor.kind === 'face') return sensor.side === 0 ? ws.T[0]! : ws.T[grid.n + 1]!;
  let sum = 0;
  let width = 0;
  for (let i = grid.layerStart[sensor.index]!; i < grid.layerEnd[sensor.index]!; i++) {
    sum += ws.T[i + 1]! * grid.dx[i]!;
    width += grid.dx[i]!;
  }
  return sum / width;
}

export interface ThermostatSpec {
  /** The sensed temperature at the state in ws, K. */
  readonly sensorK: (ws: Workspace) => number;
  /** The set-point at time tS, K. */
  readonly setPointK: (tS: number) => number;
  /** Hysteresis band, K: off when the sensor reaches the set-point, on again when it falls to set-point − band. */
  readonly bandK: () => number;
  /** Whether the thermostat watches at all (e.g. only while its heater is under the stack). */
  readonly active?: () => boolean;
  /** Called at every switch with the new state. */
  readonly onSwitch: (on: boolean, tS: number) => void;
}

export interface Thermostat extends StateSwitch {
  readonly isOn: () => boolean;
  /** Puts the thermostat on or off without an event (at the start, or when its heater is attached). */
  readonly reset: (on: boolean) => void;
}

/** An on/off thermostat with hysteresis (the sensor stays in [set-point − band, set-point] once it has reached it). */
export function thermostat(spec: ThermostatSpec): Thermostat {
  let on = true;
  return {
    g: (ws, tS) => {
      if (spec.active && !spec.active()) return -1;
      const sensed = spec.sensorK(ws);
      const level = spec.setPointK(tS);
      return on ? sensed - level : level - spec.bandK() - sensed;
    },
    fire: (tS) => {
      on = !on;
      spec.onSwitch(on, tS);
    },
    isOn: () => on,
    reset: (state) => { on = state; },
  };
}

/** The switches of a run, with each one's event value at the start of the current step. */
export function createEventWatch(switches: readonly StateSwitch[]) {
  const gStart = new Float64Array(switches.length);
  const highest = (ws: Workspace, tS: number, U: Float64Array): number =>
    switches.reduce((most, sw) => Math.max(most, sw.g(ws, tS, U)), -Infinity);
  return {
    /** The largest value at the step's start: below 0 every switch is armed (−∞ without switches). */
    armed: (): number => gStart.reduce((a, g) => Math.max(a, g), -Infinity),
    /** The largest event value at the state in ws: an event is due where it is ≥ 0. */
    highest,
    /**
     * Fires every switch whose event is due at the state U evaluated into ws, calling `reread` (re-read the conditions,
     * settle the faces; false if they did not settle) after each round in which a switch that is not quiet fired, at
     * most maxRounds rounds; then tells each switch the state was accepted and keeps its value as the start of the next
     * step. 'failed' if `reread` failed, 'changed' if a switch that is not quiet fired, else 'none'.
     */
    fireDue(ws: Workspace, tS: number, U: Float64Array, reread: () => boolean, maxRounds: number): 'failed' | 'changed' | 'none' {
      if (switches.length === 0) return 'none';
      let changed = false;
      for (let round = 0; round < maxRounds; round++) {
        const due = switches.filter((sw) => sw.g(ws, tS, U) >= 0);
        if (due.length === 0) break;
        for (const sw of due) sw.fire(tS);
        if (due.every((sw) => sw.quiet)) continue;
        changed = true;
        if (!reread()) return 'failed';
      }
      for (const sw of switches) sw.accepted?.(ws, tS, U);
      switches.forEach((sw, k) => { gStart[k] = sw.g(ws, tS, U); });
      return changed ? 'changed' : 'none';
    },
  };
}

export interface Located {
  /** The step length kept: the bracket's right end, where g ≥ 0. */
  readonly s: number;
  /** Length of the last trial taken (the buffers hold that step; redo s if it differs). */
  readonly lastS: number;
  readonly trials: number;
}

/**
 * Locates the rise of g through zero on (0, sB], given g(0) = gA < 0 ≤ g(sB) = gB, by Anderson–Björck regula falsi
 * on the step length. `trial(s)` takes the step of length s from the same start and returns g at its end, or
 * undefined if that step failed: the next trial then goes halfway to an end of the bracket instead (alternating far
 * and near), and after MAX_FAILED_TRIALS failures the bracket found so far is kept. Stops when the bracket is
 * narrower than tolS or after maxTrials trials. `firstS`, when given, is the first estimate instead of the regula falsi
 * point. Each trial is aimed a quarter of the tolerance to one side of its estimate (aimedTrial), so that the trial
 * that closes the bracket is, as a rule, the step kept. Measured on described-rig (288 thermostat switches): 999 trials
 * where aiming at the estimate took 1284 (the step kept was then taken again after 287 of the 289 events, because the
 * bracket had closed from below), Newton sweeps 9204 → 7969; heater-plate-lift-off 744 → 571 trials, 6991 → 6384
 * sweeps.
 */
export function locateRise(trial: (s: number) => number | undefined, gA: number, sB: number, gB: number,
  tolS: number, maxTrials: number, firstS?: number): Located {
  let a = 0;
  let fa = gA;
  let b = sB;
  let fb = gB;
  let side = 0;
  let lastS = sB;
  let trials = 0;
  let failed = 0;
  // after a failed trial, where the next one goes (it narrows nothing, so the estimate would repeat it)
  let instead: number | undefined;
  while (b - a > tolS && trials < maxTrials) {
    const guess = trials === 0 && firstS !== undefined ? firstS : b - (fb * (b - a)) / (fb - fa);
    const s = instead ?? aimedTrial(guess, a, b, tolS);
    instead = undefined;
    const fs = trial(s);
    trials++;
    lastS = s;
    if (fs === undefined) {
      // Newton can cycle at a melt kink for one step length and converge for a length nearby (insulated-pellet-stack at
      // tolerances × 2.7: the trial of 9.7 s failed even with 300 sweeps where the whole step of 17.6 s took 13, and
      // the molten time, left inside that step, came 2.8 s late). Halfway to the bracket's far end, then its near end
      if (++failed > MAX_FAILED_TRIALS) break;
      instead = failed % 2 === 1 ? 0.5 * (s + b) : 0.5 * (a + s);
      continue;
    }
    // the same end replaced twice in a row scales the other end's value by Anderson and Björck's m = 1 − f_new/f_old,
    // or halves it (Illinois) when m ≤ 0
    if (fs >= 0) {
      if (side === 1) fa *= andersonBjorck(fs, fb);
      b = s; fb = fs;
      side = 1;
    } else {
      if (side === -1) fb *= andersonBjorck(fs, fa);
      a = s; fa = fs;
      side = -1;
    }
  }
  return { s: b, lastS, trials };
}

/**
 * Where the next trial goes, from the estimate `guess` of the root in the bracket (a, b]. A trial that closes the
 * bracket should be its right end, the step that is kept: a bracket closed by its left end leaves the step at b to be
 * taken again (evolve.ts). So the trial is aimed a little to one side of the estimate, not at it: past it (by
 * AIM_SHARE × tolS) when a, the last trial below the root, lies near enough that a trial just past the root closes the
 * bracket; otherwise short of it, so that an estimate good to a fraction of tolS puts a within reach of the root and
 * the next trial, aimed past it, closes the bracket and is the step kept. Either way the trial stays half the tolerance
 * inside the bracket, where a trial next to one end narrows the bracket from the other end at once.
 */
function aimedTrial(guess: number, a: number, b: number, tolS: number): number {
  const aim = AIM_SHARE * tolS;
  const s = guess + aim <= a + CLOSE_SHARE * tolS ? guess + aim : guess - aim;
  const inset = 0.5 * tolS;
  return Math.min(b - inset, Math.max(a + inset, s));
}

/**
 * The trials' aim to either side of the root's estimate, and the farthest from the last trial below the root that a
 * trial aimed past it may go, as shares of the time tolerance: our own choice. The estimates after the first trial are
 * good to about 1e-5 s on the examples' thermostats (tolerance 1e-3 s), so 0.25 leaves room for an estimate 20× worse,
 * and the step kept ends about a quarter of the tolerance past the crossing. Aims of 0.1 and 0.4 took within 1 % of the
 * same trials on the three examples with the most events (described-rig, heater-plate-lift-off, sleeved-square-cell).
 */
const AIM_SHARE = 0.25;
const CLOSE_SHARE = 0.95;
/** Failed trials one location may replace by others in the bracket before it keeps the bracket it has (our own choice). */
const MAX_FAILED_TRIALS = 4;

/**
 * The factor on the kept end's value when the other end is replaced by a point of the same sign twice in a row: m =
 * 1 − f_new/f_replaced (Anderson & Björck, BIT 13 (1973) 253–264), or 1/2 (the Illinois factor) when m ≤ 0. Shared
 * with the window search's narrowing (study/bracket.ts).
 */
export function andersonBjorck(fNew: number, fReplaced: number): number {
  const m = 1 - fNew / fReplaced;
  return m > 0 ? m : 0.5;
}

/**
 * The smallest root in (0, b) of the parabola through (0, gA), (m, gM) and (b, gB), 0 < m < b; undefined when it has
 * none there (or the three values are not finite). Newton's divided differences give p(s) = c₂s² + c₁s + gA, and the
 * roots come from the form of the quadratic formula that does not cancel (Press et al., Numerical Recipes, 3rd ed.
 * 2007, §5.6): q = −(c₁ + sgn(c₁)·√(c₁² − 4c₂gA))/2, roots q/c₂ and gA/q. A parabola too flat to tell from a line is
 * solved as the line.
 */
export function parabolaRoot(gA: number, m: number, gM: number, b: number, gB: number): number | undefined {
  const slopeAM = (gM - gA) / m;
  const c2 = ((gB - gM) / (b - m) - slopeAM) / b;
  const c1 = slopeAM - c2 * m;
  let root = NaN;
  if (Math.abs(c2) * b <= 1e-12 * Math.abs(c1)) root = -gA / c1;
  else {
    const disc = c1 * c1 - 4 * c2 * gA;
    if (!(disc >= 0)) return undefined;
    const q = -0.5 * (c1 + (c1 < 0 ? -1 : 1) * Math.sqrt(disc));
    for (const r of [q / c2, gA / q]) if (r > 0 && r < b && !(r >= root)) root = r;
  }
  return root > 0 && root < b ? root : undefined;
}
