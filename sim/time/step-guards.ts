/**
 * What the time loop watches besides the local error: the smallest step worth taking, the work a run may take, and
 * the physical end of a run whose heat extraction outruns the stack (its temperature would fall below absolute zero).
 *
 * The smallest step is tied to the stack itself, not to the duration: a cell of capacity C·Δx between conductances
 * G₋ and G₊ relaxes with the time constant τ = C·Δx/(G₋ + G₊) (the cell's own eigenvalue of the semi-discrete heat
 * equation, Patankar 1980 §4.3). A step far below the smallest τ resolves nothing the grid can show: the error
 * estimate there is measuring the start-up transient of a thin cell after an abrupt change (a held face switched on),
 * which TR-BDF2 damps anyway (L-stable). So at a small share of it the step is taken by backward Euler and accepted
 * without an error estimate (a forced step, counted in the run's statistics): backward Euler is L-stable and, on the
 * M-matrix of the stage, monotone, while TR-BDF2's stability function is negative for large hλ (Hosea & Shampine 1996,
 * §2), so a step accepted whatever its error could overshoot a held face's jump (evolve.ts).
 */
import type { StepConditions, Workspace } from '../grid/discretization.ts';
import { evaluate } from '../grid/discretization.ts';
import { faceHeatIn } from '../physics/faces.ts';
import type { Problem } from '../physics/problem.ts';
import type { StopReason } from './drive.ts';

export const stepGuardDefaults = {
  /**
   * Smallest step as a share of the smallest cell relaxation time: a thousandth, so the error control still meets the
   * tolerance on every transient the grid resolves (from there the step grows ×3 a step back to the cell's own time).
   */
  floorShare: 1e-3,
  /**
   * …and never below this share of the time stepped since the last instant landed on (a breakpoint or a state event:
   * evolve.ts keeps time as that instant plus an offset), so that offset + h differs from the offset in double
   * precision (ε ≈ 2.2e-16: 45 ulps). A share of t itself was 1e-7 s at t = 1e7 s, far above a thin cell's relaxation
   * time: right after a held face switched there a whole melting layer crossed its melt within one floored step and
   * Newton failed (fuzz seed 11 cases 1615, 1492 at 1e-12·t; seed 12 cases 338, 1048, 2893, 3009, 3678, 3895, 4734,
   * 6555 at 1e-14·t). Right after a landing the offset is 0 and the floor is the cell's own.
   */
  floorRelative: 1e-14,
  /**
   * Work budget, cells × steps tried (accepted and rejected): half of maxCellSweeps, so that at the 2 or more Newton
   * sweeps a step takes it never binds before maxCellSweeps does. sim/scenario/accuracy.ts plans the grid and
   * tolerances against a budget of its own, at most this one (5e7; a unit test holds the order): its work model does
   * not see a melt front crossing a thick layer cell by cell, and the plans keep that margin.
   */
  maxCellSteps: 1.25e8,
  /**
   * A run stopped at the ceiling after at least this many state events landed on, and as many as a fifth of its steps,
   * says the switching held it back (switchingSentence): a run with a thermostat switches about once a minute to once
   * a second (the examples: 289 in an hour at most, described-rig.json), a separator melts and freezes a few times.
   */
  switchingEvents: 5000,
  /**
   * The run-time ceiling, cells × Newton sweeps (every sweep of every trial: accepted, rejected, or locating a state
   * event). Per simulated second: a run of n cells over D s may average 2.5e8/(n·D) cell-sweeps per second of
   * simulated time. A run needing more ends with a message naming the ceiling and what to change. It is set in
   * seconds: a sweep of one cell (evaluate, assemble, one tridiagonal solve) costs 0.08–0.13 µs on one idle core of
   * this machine (2026-12-03), so 2.5e8 is about 25 s. It was 4e7 (seed 12's timeouts, on a loaded machine), then 1e8
   * (about 10 s); on 2026-12-04 it was raised to 2.5e8 because the three full-range fuzz runs of seed 38 that met 1e8,
   * each a tight tolerance_K of the file's own on a fine grid of its own with a melt front crossing a thick layer,
   * finish at 1.1e8–2.0e8 (10.7–19.1 s alone; one ends with the below-absolute-zero message): a user who asked for
   * those settings gets the answer rather than a stop. DEVELOPERS.md, "Bounded run time".
   */
  maxCellSweeps: 2.5e8,
  /**
   * Fewest Newton sweeps a TR-BDF2 step can take (one per stage): what turns a step count that max_step_s forces into
   * sweeps when the ceiling is checked at validation (scenario-limits.ts).
   */
  minSweepsPerStep: 2,
} as const;

/** The smallest cell relaxation time C·Δx/(G₋ + G₊), s, at the state last evaluated into ws. */
export function smallestRelaxationS(ws: Workspace): number {
  let least = Infinity;
  for (let i = 0; i < ws.n; i++) {
    const tau = (ws.capacity[i]! * ws.grid.dx[i]!) / (ws.G[i]! + ws.G[i + 1]!);
    if (tau < least) least = tau;
  }
  return least;
}

/** The coldest node temperature, K. */
export function coldestK(T: Float64Array): number {
  let least = Infinity;
  for (let j = 0; j < T.length; j++) if (!(T[j]! >= least)) least = T[j]!;
  return least;
}

/**
 * The stop for a stack driven below absolute zero at about tS: the message names the largest heat extraction at that
 * time (a face's net heat input, or a layer's volumetric source) so the user knows what to change, and the stop is
 * 'physical'. With no face or source that draws heat even at 0 K there is no physical cause to name: the stop is
 * 'numerical' ("the heat drawn from the stack", which the fuzz suite counts as a violation).
 */
export function belowAbsoluteZeroStop(problem: Problem, ws: Workspace, cond: StepConditions, faceQ: Float64Array, tS: number): { readonly reason: StopReason; readonly message: string } {
  let what = 'the heat drawn from the stack';
  let most = 0;
  const faces = [['bottom', faceQ[0]!, cond.bottom, ws.bottomContext], ['top', faceQ[1]!, cond.top, ws.topContext]] as const;
  const scratch = new Float64Array(1);
  for (const [side, q, c, ctx] of faces) {
    // only a face that would still draw heat at 0 K can be the cause: a held face, or one whose imposed flux and power
    // do not outweigh its convection and radiation from surroundings above 0 K, only conducts a transient (the fuzz met
    // a face held at −60 °C named for the −470 kW/m² drawn from the other face)
    if (c.kind !== 'terms' || !(faceHeatIn(c, ctx, 0, scratch) < 0)) continue;
    if (q < -most) { most = -q; what = `the heat drawn from the ${side} face`; }
  }
  problem.layers.forEach((layer, li) => {
    let drawn = 0;
    for (let i = ws.grid.layerStart[li]!; i < ws.grid.layerEnd[li]!; i++) drawn -= cond.source[i]! * ws.grid.dx[i]!;
    if (drawn > most) { most = drawn; what = `the heat drawn by the source in layer ${layer.id}`; }
  });
  return {
    reason: most > 0 ? 'physical' : 'numerical',
    message: `${what} exceeds what the stack holds: its temperature would fall below absolute zero at t = ${formatTime(tS)} s`,
  };
}

/**
 * Whether a face's balance has no root at or above 0 K: even at 0 K the face would lose more heat (its own net input
 * q(0 K) plus what its half cell conducts to it) than it gets, so its temperature would have to fall below absolute
 * zero. The balance G·(T_face − T_cell) − q(T_face) rises with T_face for every physical term, so this decides it.
 */
export function faceBelowAbsoluteZero(ws: Workspace, U: Float64Array, cond: StepConditions, side: 0 | 1): boolean {
  const c = side === 0 ? cond.bottom : cond.top;
  if (c.kind !== 'terms') return false;
  // G is the Kirchhoff mean between the face at 0 K and its cell (not the one at whatever iterate the face last held)
  const at = Float64Array.from(U);
  at[side === 0 ? 0 : ws.n + 1] = 0;
  evaluate(ws, at, cond);
  const g = side === 0 ? ws.G[0]! : ws.G[ws.n]!;
  const cellK = side === 0 ? ws.T[1]! : ws.T[ws.n]!;
  const scratch = new Float64Array(1);
  return faceHeatIn(c, side === 0 ? ws.bottomContext : ws.topContext, 0, scratch) + g * cellK < 0;
}

/**
 * Whether a run of `cells` cells that has tried `trials` steps and made `sweeps` Newton sweeps has used its budget;
 * `maxCellSweeps` is the ceiling in force (a benchmark that means to run long may raise it: EvolveOptions).
 */
export function budgetSpent(cells: number, trials: number, sweeps: number, maxCellSweeps: number = stepGuardDefaults.maxCellSweeps): boolean {
  return cells * trials >= stepGuardDefaults.maxCellSteps || cells * sweeps >= maxCellSweeps;
}

/**
 * The sentence of the ceiling's message that names the layer that held the steps back, or '' when no layer set the
 * error of at least half of the rejected steps, with its cell count (`layerCells`). `rejectedBy[l]` counts the steps
 * rejected on layer l's error, `rejectedMelting[l]` those of them over which it was melting (a melt front crossing a
 * finely cut layer cell by cell is what costs most: DEVELOPERS.md, Robustness).
 */
export function heldBackSentence(layerIds: readonly string[], layerCells: readonly number[], rejectedBy: Uint32Array, rejectedMelting: Uint32Array,
  rejected: number): string {
  let most = 0;
  for (let l = 1; l < rejectedBy.length; l++) if (rejectedBy[l]! > rejectedBy[most]!) most = l;
  const n = rejectedBy[most] ?? 0;
  if (rejected === 0 || 2 * n < rejected) return '';
  const melting = 2 * rejectedMelting[most]! >= n ? ' while a melt front crossed it' : '';
  return `${n} of the ${rejected} rejected steps were held back by layer ${JSON.stringify(layerIds[most])} (${layerCells[most]} cells)${melting}. `;
}

/**
 * The sentence of the ceiling's message that names frequent switching, or '' when the state events landed on (a
 * thermostat's switches, the separator's melt and freeze) were fewer than a fifth of the accepted steps or fewer than
 * stepGuardDefaults.switchingEvents. An on-off thermostat whose plate crosses its band in milliseconds switches every
 * few milliseconds, and each switch is a step landed on (followed switch by switch, a 0.01 K band on
 * heater-plate-lift-off.json: 94 481 events in an hour, 5 s; a 0.7 K band on a 1.9 mm insulating-board plate under
 * 1 MW/m²: 200 a second). A thermostat that reads its plate is held in its band instead once it cycles that fast
 * (time/plates.ts); one that reads a layer's mean is not, and can still end here.
 */
export function switchingSentence(events: number, steps: number, tS: number): string {
  if (events < stepGuardDefaults.switchingEvents || 5 * events < steps) return '';
  return `The heat switched ${events} times before then (a thermostat crossing its band), every ${Number((tS / events).toPrecision(2))} s on average: ` +
    'widen band_K, give the heater a heavier plate or less power_W, or use control kind "pi". ';
}

/**
 * The message for a run that has used its work budget (budgetSpent), naming the ceiling that bound, and what held the
 * steps back when something did: frequent switching (switchingSentence), a layer (heldBackSentence).
 */
export function budgetMessage(cells: number, trials: number, sweeps: number, tS: number, durationS: number,
  maxCellSweeps: number = stepGuardDefaults.maxCellSweeps, heldBack = ''): string {
  const g = stepGuardDefaults;
  const sweepsBind = cells * sweeps >= maxCellSweeps;
  const whose = maxCellSweeps === g.maxCellSweeps ? 'stepGuardDefaults.maxCellSweeps, about 25 s' : 'set by the caller';
  const spent = sweepsBind
    ? `${cells} cells × ${sweeps} Newton sweeps; the limit is ${exponent(maxCellSweeps)} cell-sweeps (${whose})`
    : `${cells} cells × ${trials} steps tried; the limit is ${exponent(g.maxCellSteps)} cell-steps (stepGuardDefaults.maxCellSteps)`;
  return `the run reached its work budget at t = ${formatTime(tS)} of ${formatTime(durationS)} s: ${spent}. ${heldBack}` +
    'Use fewer cells, loosen numerics.tolerance_K or numerics.liquid_fraction_tolerance, or shorten duration_s';
}

/** A limit in exponent form with its significant digits, at most three: 2.5e+8, not toExponential(0)'s 3e+8. */
const exponent = (x: number): string => Number(x.toPrecision(3)).toExponential();

const formatTime = (t: number): string => (t >= 1e5 || (t > 0 && t < 1e-3) ? t.toPrecision(4) : String(Number(t.toPrecision(6))));
