/**
 * The time loop, as a generator (the CLI, the worker, the tests and the benchmark drive the same loop; it never
 * decides where output goes). Steps are chosen by the local error estimate of TR-BDF2 with the usual controller
 * h_new = h·clamp(safety·err^(−1/3), shrink, grow) (Hairer & Wanner, Solving ODEs II, §IV.8), and land exactly on
 * every breakpoint: schedule changes of the faces and sources, requested output times and the end of the run.
 * State events (events.ts: a heater's thermostat, or switches a caller passes in) are located within a time tolerance
 * by redoing the step that crossed them; the step lands there and the conditions are re-read, as at a breakpoint.
 */
import type { StepConditions, Workspace } from '../grid/discretization.ts';
import { CHANNEL, createWorkspace } from '../grid/discretization.ts';
import type { ErrorScale } from '../grid/line-system.ts';
import { LineSystem, settleFaces } from '../grid/line-system.ts';
import type { StepBuffers } from '../grid/stage-system.ts';
import { createStepBuffers } from '../grid/stage-system.ts';
import { enthalpyAt, writtenCurve } from '../physics/material.ts';
import type { Grid } from '../grid/mesh.ts';
import type { Problem } from '../physics/problem.ts';
import { facingOf } from '../physics/natural-convection.ts';
import { breakpoints, characteristicLengthM, conditionAt, sourceAt } from '../physics/problem.ts';
import type { DriveEnd, DriveStats } from './drive.ts';
import type { NewtonSettings, StepOutcome } from './tr-bdf2.ts';
import { acceptStep, STAGE_FRACTION, stepFaceEnergy, takeStep, WEIGHTS } from './tr-bdf2.ts';
import type { StateSwitch } from './events.ts';
import { createEventWatch, locateRise, parabolaRoot } from './events.ts';
import { separatorSwitch } from './separator-events.ts';
import type { PlateControlOptions, PlateStep } from './plates.ts';
import { beginPlateStage, createPlateControl } from './plates.ts';
import type { FixedStepping } from './step-control.ts';
import { growthFactor, noRejectedTrial, retryStepS } from './step-control.ts';
import { leavesBounds, stepBounds } from './step-bounds.ts';
import { belowAbsoluteZeroStop, budgetMessage, budgetSpent, heldBackSentence, switchingSentence, coldestK, faceBelowAbsoluteZero, smallestRelaxationS, stepGuardDefaults } from './step-guards.ts';

export const evolveDefaults = {
  /**
   * Controller safety factor, and the bounds on the step ratio (Hairer & Wanner II §IV.8 use 0.9, 0.2, 5; growth 3
   * rejects fewer steps at the melt and freeze kinks on the examples).
   */
  safety: 0.9,
  shrink: 0.2,
  grow: 3,
  /** First step, s: small enough that the controller only ever grows it at the start. */
  firstStepS: 0.01,
  /** Largest step right after a schedule change, s: the faces change abruptly there. */
  stepAfterChangeS: 0.5,
  /**
   * Newton tolerance as a share of the error tolerance: keeps the iteration error well below the truncation error.
   * (The energy ledger does not depend on it: each stage closes its equations exactly, see tr-bdf2.ts.)
   */
  newtonShare: 1e-2,
  maxNewtonIterations: 12,
  /** Extra Newton iterations at the smallest step, per cell: two melt kinks a cell may stop at, one iteration each. */
  floorIterationsPerCell: 2,
  /** Newton failure: cut the step by this factor. */
  newtonCut: 0.25,
  /** A step that would end within this share of a breakpoint is stretched onto it. */
  landShare: 1e-6,
  /**
   * A state event is landed on at most this late, s: far below the 0.1 s to which event times are printed, and a
   * sensor rising at 10 K/s overshoots its level by at most 0.01 K.
   */
  eventToleranceS: 1e-3,
  /**
   * Trial steps allowed to locate one event (Anderson–Björck regula falsi converges superlinearly; bisection alone
   * would need ~40).
   */
  maxEventTrials: 40,
  /** Rounds of switches allowed to fire at one instant before the loop moves on (a chattering pair cannot hold it). */
  maxFiresAtOnce: 8,
} as const;

/**
 * How steps are chosen. Adaptive steps are always TR-BDF2 (its embedded estimate drives the controller); backward Euler
 * has no error estimate here, so it exists only with a fixed step, for the convergence study. A union, so that no
 * contradictory combination (backward Euler with adaptive steps) can be written.
 */
export type Stepping = { readonly kind: 'adaptive' } | FixedStepping;

export interface EvolveOptions extends PlateControlOptions {
  /** Default adaptive. A fixed step (s) still lands on every breakpoint. */
  readonly stepping?: Stepping;
  /**
   * State switches of the caller's own (events.ts), besides the heaters' thermostats; `adjust` lets a switch change
   * the conditions the schedule gives.
   */
  readonly switches?: readonly (StateSwitch & { readonly adjust?: (cond: StepConditions) => StepConditions })[];
  /**
   * The run-time ceiling in cells × Newton sweeps (default stepGuardDefaults.maxCellSweeps, about 25 s): a benchmark
   * that means to time long runs may raise it, a test may lower it.
   */
  readonly maxCellSweeps?: number;
}

/** What each accepted step exposes. Buffers are the loop's own and valid until the generator resumes. */
export interface StepReport {
  readonly t0: number;
  readonly tg: number;
  readonly t1: number;
  readonly buf: StepBuffers;
  readonly ws: Workspace;
  readonly cond: StepConditions;
  /** Heat into the bottom and top faces over the step, and heat generated inside, J/m². */
  readonly bottomJ: number;
  readonly topJ: number;
  readonly sourceJ: number;
  /** Heat into the cells through their edges over the step (negative: lost), J/m²; 0 without edge terms. */
  readonly edgeJ: number;
  /**
   * What the heater under each face did over the step ([bottom, top]; physics/heater.ts). On a heater face bottomJ /
   * topJ hold minus the plate's loss to the surroundings: the plate is part of the body whose ledger is kept.
   */
  readonly plates: readonly [PlateStep, PlateStep];
  /** Whether a state event fired at t1. */
  readonly switched: boolean;
}

export interface EvolveStats extends DriveStats {
  /** Steps taken at the smallest step (step-guards.ts), by backward Euler and accepted without an error estimate. */
  forced: number;
  /** State events landed on, and the trial steps it took to locate them. */
  events: number;
  eventTrials: number;
}

export type EvolveEnd = DriveEnd<EvolveStats>;

function conditionsAt(problem: Problem, grid: Grid, tS: number, source: Float64Array): StepConditions {
  for (let i = 0; i < grid.n; i++) source[i] = sourceAt(problem.layers[grid.layerOf[i]!]!, tS);
  return { bottom: conditionAt(problem.bottom, tS), top: conditionAt(problem.top, tS), source };
}

/**
 * The initial state: every cell at the initial temperature, read on its material's curve as written (so under a melt
 * ramp a cell keeps the phase the file gives it; material.ts writtenCurve), faces balanced against it.
 */
export function initialState(problem: Problem, grid: Grid, U: Float64Array): void {
  U[0] = problem.initialK;
  U[grid.n + 1] = problem.initialK;
  for (let i = 0; i < grid.n; i++) U[i + 1] = enthalpyAt(writtenCurve(grid.materials[i]!), problem.initialK);
}

/** What the stack's step error is measured against (grid/line-system.ts errorNorm): the problem's tolerances and plan. */
export function errorScaleOf(problem: Problem): ErrorScale {
  const numerics = problem.numerics;
  return {
    toleranceK: numerics.toleranceK, liquidFraction: numerics.liquidFractionTolerance, gridRefine: numerics.accuracy?.gridRefine ?? 1,
    separator: problem.layers.map((l) => l.separator),
  };
}

/** Newton's settings under a step error tolerance of toleranceK: updates held to evolveDefaults.newtonShare of it. */
export function newtonSettingsOf(toleranceK: number): NewtonSettings {
  return { toleranceK: toleranceK * evolveDefaults.newtonShare, maxIterations: evolveDefaults.maxNewtonIterations };
}

/**
 * Runs the problem on the grid, yielding the state at t = 0 (as a step of zero length) and after every accepted step.
 * Returns how it ended. Never throws for numerical trouble: a failure is a returned status.
 */
export function* evolve(problem: Problem, grid: Grid, options: EvolveOptions = {}):
  Generator<StepReport, EvolveEnd, void> {
  const { numerics, durationS } = problem;
  const d = evolveDefaults;
  const lengthM = characteristicLengthM(problem.footprint);
  const ws = createWorkspace(grid, { facing: facingOf('bottom'), lengthM }, { facing: facingOf('top'), lengthM }, problem.layers.map((l) => l.terms));
  const scale = errorScaleOf(problem);
  const newton = newtonSettingsOf(numerics.toleranceK);
  // a floored step must not fail for want of iterations: each cell crossing a melt kink costs one (its update stops
  // there), and a face held far below a thin melting layer's plateau freezes many cells within one floored step
  // (fuzz: 15 cells of a 5 µm separator under a face switched to 463 °C, 3e-9 s steps, 12 iterations not enough)
  const newtonAtFloor: NewtonSettings = { ...newton, maxIterations: d.maxNewtonIterations + d.floorIterationsPerCell * grid.n };
  const stats: EvolveStats = { steps: 0, rejected: 0, newtonIterations: 0, forced: 0, events: 0, eventTrials: 0 };
  const outcome: StepOutcome = { status: 'ok', errorNorm: 0, newtonIterations: 0 };
  // per layer, the steps rejected on its error, and those of them over which it was melting (the ceiling's message)
  const rejectedBy = new Uint32Array(problem.layers.length);
  const rejectedMelting = new Uint32Array(problem.layers.length);
  const stepping: Stepping = options.stepping ?? { kind: 'adaptive' };
  const fixedStepS = stepping.kind === 'fixed' ? stepping.stepS : undefined;
  const backwardEuler = stepping.kind === 'fixed' && stepping.scheme === 'backward-euler';
  const breaks = breakpoints(problem);
  const source = new Float64Array(grid.n);

  const plates = createPlateControl(problem, grid, ws, options);
  // with adaptive steps the separator's melt and freeze are landed on (separator-events.ts); a fixed step keeps its
  // uniform sequence (the convergence study), and the recorder places those events inside a step
  const separator = stepping.kind === 'adaptive' ? separatorSwitch(problem, grid) : undefined;
  const watch = createEventWatch([...plates.switches, ...(separator ? [separator] : []), ...(options.switches ?? [])]);
  const plateSteps = plates.steps;
  const hasCellTerms = problem.layers.some((l) => (l.terms?.length ?? 0) > 0);
  const lohi = new Float64Array(2);
  const eulerWeights = [0, 0, 1] as const;
  /** The conditions at tS: the schedules, then each caller's switch's adjustment; the plates follow them. */
  const readConditions = (tS: number, before: StepConditions | undefined): StepConditions => {
    let c = conditionsAt(problem, grid, tS, source);
    for (const sw of options.switches ?? []) if (sw.adjust) c = sw.adjust(c);
    plates.attach(c, before, tS);
    return c;
  };

  // the smallest step follows the cell relaxation time, and a share of the time stepped since the last landing (a
  // breakpoint or a state event), not of t (step-guards.ts): right after a face switches at t = 1e7 s a step of 1e-12 s
  // must still advance time, although t + h = t in one double for h below 1e-9 s. A step shorter than floorRelative·t
  // (45 ulps of t) therefore adds to t with its rounding error carried in lo (time is t + lo, Knuth's TwoSum), up to the
  // next landing; longer steps add as they always did, so the runs that never take such a step keep every bit
  let t = 0;
  let lo = 0;
  let sinceLanding = 0;
  /** t + lo + s as a sum t' + lo' (TwoSum: t' the rounded sum, lo' its exact error). */
  const advance = (s: number): void => {
    const y = lo + s;
    const sum = t + y;
    const back = sum - y;
    lo = (t - back) + (y - (sum - back));
    t = sum;
  };
  let nextBreak = 0;
  for (const node of ws.plates) node.tK = problem.initialK;
  let cond = readConditions(t, undefined);
  // the stack as TR-BDF2 sees it (grid/line-system.ts); its conditions are set before every step
  const line = new LineSystem(ws, scale, beginPlateStage, cond);
  const buf = createStepBuffers(line);
  initialState(problem, grid, buf.U0);
  let floorS = 0;
  const settle = (): boolean => {
    if (!settleFaces(ws, buf.U0, cond, newton.toleranceK)) return false;
    line.readRates(buf.F0);
    line.readChannels(buf.q0);
    line.markStart();
    floorS = stepGuardDefaults.floorShare * smallestRelaxationS(ws);
    return true;
  };
  const unsettled = (tS: number): EvolveEnd => {
    const faceQ = Float64Array.of(ws.faceQ[0]!, ws.faceQ[1]!);
    const cold = coldestK(ws.T) < 0;
    const bottom = faceBelowAbsoluteZero(ws, buf.U0, cond, 0);
    const top = faceBelowAbsoluteZero(ws, buf.U0, cond, 1);
    // a face whose balance needs T < 0 K is the cause: it outranks whatever the unconverged iterate holds
    if (bottom) faceQ[0] = -Infinity;
    if (top) faceQ[1] = -Infinity;
    return {
      status: 'failed', tS, stats,
      ...(bottom || top || cold ? belowAbsoluteZeroStop(problem, ws, cond, faceQ, tS) : { reason: 'numerical', message: `the face balance did not converge at t = ${tS} s` }),
    };
  };
  /**
   * Fires the switches due at tS, re-reading the conditions and settling the faces when one that is not quiet fired:
   * 'failed' if they did not settle, 'changed' if the conditions were re-read, else 'none'.
   */
  const fireDue = (tS: number): 'failed' | 'changed' | 'none' =>
    watch.fireDue(ws, tS, buf.U0, () => { cond = readConditions(tS, cond); return settle(); }, d.maxFiresAtOnce);
  if (!settle() || fireDue(0) === 'failed') return unsettled(0);
  // report the initial state as a step of zero length
  buf.U1.set(buf.U0); buf.Ug.set(buf.U0); buf.F1.set(buf.F0); buf.Fg.set(buf.F0); buf.q1.set(buf.q0); buf.qg.set(buf.q0);
  yield { t0: 0, tg: 0, t1: 0, buf, ws, cond, bottomJ: 0, topJ: 0, sourceJ: 0, edgeJ: 0, plates: plateSteps, switched: false };

  let h = fixedStepS ?? Math.min(d.firstStepS, numerics.maxStepS);
  let rejectedLast = false;
  // the last trial rejected on its error in the current chain of rejections (step-control.ts)
  const chain = noRejectedTrial();
  const adaptive = stepping.kind === 'adaptive';
  const ceiling = options.maxCellSweeps ?? stepGuardDefaults.maxCellSweeps;
  while (t < durationS) {
    while (nextBreak < breaks.length && breaks[nextBreak]! <= t) nextBreak++;
    const target = breaks[nextBreak] ?? durationS;
    const floor = Math.max(floorS, stepGuardDefaults.floorRelative * sinceLanding);
    const floored = adaptive && h <= floor;
    let step = Math.min(fixedStepS ?? Math.max(h, floor), numerics.maxStepS);
    let landing = false;
    const fine = lo !== 0 || step < stepGuardDefaults.floorRelative * t;
    if (fine) {
      const remaining = (target - t) - lo;
      if (step * (1 + d.landShare) >= remaining) { step = remaining; landing = true; }
      else if (adaptive && 2 * step > remaining) step = Math.max(0.5 * remaining, Math.min(floor, remaining));
    } else if (t + step * (1 + d.landShare) >= target) { step = target - t; landing = true; }
    else if (adaptive && t + 2 * step > target) step = Math.max(0.5 * (target - t), Math.min(floor, target - t));
    /** The time s into this step. */
    const timeInto = (s: number): number => (fine ? t + (lo + s) : t + s);
    if (budgetSpent(grid.n, stats.steps + stats.rejected, stats.newtonIterations, ceiling)) {
      const cellsOf = problem.layers.map((_, l) => grid.layerEnd[l]! - grid.layerStart[l]!);
      const heldBack = switchingSentence(stats.events, stats.steps, t) +
        heldBackSentence(problem.layers.map((l) => l.id), cellsOf, rejectedBy, rejectedMelting, stats.rejected);
      return { status: 'failed', reason: 'work-budget', message: budgetMessage(grid.n, stats.steps + stats.rejected, stats.newtonIterations, t, durationS, ceiling, heldBack), tS: t, stats };
    }
    // at the floor the step is taken whatever the error estimate says (see step-guards.ts)
    // (a floored step stretched by rounding to land on a breakpoint is still at the floor)
    const atFloor = floored || (adaptive && step <= floor);
    // a step at the floor is taken by backward Euler, L-stable and monotone for an M-matrix (Patankar 1980 §4.3):
    // TR-BDF2's stability function dips below 0 for large hλ, and a floored step, accepted whatever its error, then
    // overshot (a 1 µm layer under a face switched from 273 °C to −60 °C reached −102 °C: fuzz seed 9 case 179)
    let euler = backwardEuler || atFloor;
    line.cond = cond;
    plates.startStep(t);
    takeStep(line, buf, step, euler && !backwardEuler ? newtonAtFloor : newton, euler, outcome);
    stats.newtonIterations += outcome.newtonIterations;
    if (outcome.status !== 'ok' || (adaptive && !atFloor && outcome.errorNorm > 1)) {
      // an iterate below 0 K on a long step may still come back; on the smallest step it is the physics
      if ((atFloor || !adaptive) && coldestK(ws.T) < 0) {
        return { status: 'failed', ...belowAbsoluteZeroStop(problem, ws, cond, buf.q0, t), tS: t, stats };
      }
      if (!adaptive) {
        return { status: 'failed', reason: 'numerical', message: `Newton did not converge with the fixed step ${step} s`, tS: t, stats };
      }
      if (atFloor) {
        return { status: 'failed', reason: 'numerical', message: `the solver could not converge at t = ${t} s even with its smallest step, ${step.toPrecision(2)} s (${outcome.status})`, tS: t, stats };
      }
      stats.rejected++;
      if (outcome.status === 'ok' && line.binding >= 0) {
        rejectedBy[line.binding] = rejectedBy[line.binding]! + 1;
        if (line.bindingMelting) rejectedMelting[line.binding] = rejectedMelting[line.binding]! + 1;
      }
      rejectedLast = true;
      h = retryStepS(step, outcome, d, chain);
      continue;
    }
    if (adaptive && !euler && ((stepBounds(line.T0, cond, hasCellTerms, lohi)
      && leavesBounds(ws.T, line.stageLowK, line.stageHighK, lohi, newton.toleranceK)) || coldestK(ws.T) < 0)) {
      // with no heat put in, the step or its trapezoidal stage left the range of its start state and of what the faces
      // see by more than the Newton tolerance: TR-BDF2 undershot a jump (its stability function dips to −0.21), or its
      // stage overshot one and the ledger would book the step's heat as the difference of two huge terms
      // (step-bounds.ts); or, heat put in or not, its end fell below 0 K, which may be the same undershoot (fuzz seed
      // 44 cases 2564 and 4283, once the error estimate read a stiff component as the method damps it, tr-bdf2.ts) or
      // the physics. The same step again by backward Euler, which keeps the range and does not undershoot: if it too
      // ends below 0 K, that is the physics, and the run stops below; the controller goes on from TR-BDF2's estimate
      const errorNorm = outcome.errorNorm;
      takeStep(line, buf, step, newtonAtFloor, true, outcome);
      stats.newtonIterations += outcome.newtonIterations;
      if (outcome.status !== 'ok') {
        stats.rejected++;
        rejectedLast = true;
        h = retryStepS(step, outcome, d, chain);
        continue;
      }
      outcome.errorNorm = errorNorm;
      euler = true;
    }
    if (atFloor) stats.forced++;
    plates.afterTrial();
    const armed = watch.armed();
    const gEnd = armed < 0 ? watch.highest(ws, timeInto(step), buf.U1) : -Infinity;
    const switched = gEnd >= 0;
    if (switched) {
      // a switch's level was crossed within the step: redo it shorter until it ends just past the earliest crossing
      const trial = (s: number): number | undefined => {
        takeStep(line, buf, s, euler && !backwardEuler ? newtonAtFloor : newton, euler, outcome);
        stats.newtonIterations += outcome.newtonIterations;
        stats.eventTrials++;
        if (outcome.status !== 'ok') return undefined;
        plates.afterTrial();
        return watch.highest(ws, timeInto(s), buf.U1);
      };
      // the first trial: the root of the parabola through g at the start, the stage point and the end (events.ts);
      // reading g at the stage point evaluates the state there, which the first trial then replaces (a step no longer
      // than the tolerance is kept as it is, untried, so nothing is evaluated for it)
      let firstS: number | undefined;
      if (!euler && step > d.eventToleranceS) {
        const m = step * STAGE_FRACTION;
        line.evaluate(buf.Ug);
        plates.atStage(buf.Ug, buf.qg);
        firstS = parabolaRoot(armed, m, watch.highest(ws, timeInto(m), buf.Ug), step, gEnd);
      }
      const found = locateRise(trial, armed, step, gEnd, d.eventToleranceS, d.maxEventTrials, firstS);
      if (found.lastS !== found.s) trial(found.s);
      // a crossing located at the very end of a step that lands on a breakpoint still lands there: the schedule
      // changes at that instant as well (a heat off set to the separator's own molten time was skipped, and the heat
      // stayed on to the end of the run: window fuzz, tests/regressions/event-at-breakpoint.test.ts)
      landing = landing && found.s === step;
      step = found.s;
      stats.events++;
    }
    const t1 = landing ? target : timeInto(step);
    if (coldestK(ws.T) < 0) {
      // where the coldest node crossed 0 K, by linear interpolation over the step
      const before = coldestK(line.T0);
      const after = coldestK(ws.T);
      const at = before > 0 ? t + (step * before) / (before - after) : t;
      return { status: 'failed', ...belowAbsoluteZeroStop(problem, ws, cond, buf.q1, at), tS: at, stats };
    }
    stats.steps++;
    plates.commit(step, euler ? eulerWeights : WEIGHTS, buf.q0, buf.qg, buf.q1, buf.Ug, buf.U1, plateSteps);
    // on a heater face what leaves the body (stack + plate) is the plate's loss; its heat into the face is internal
    const faceJ = (side: 0 | 1): number => ((side === 0 ? cond.bottom : cond.top).kind === 'heater'
      ? -plateSteps[side].lossJ : stepFaceEnergy(buf, side, step, euler));
    yield {
      t0: t, tg: timeInto(euler ? step : step * STAGE_FRACTION), t1, buf, ws, cond,
      bottomJ: faceJ(0),
      topJ: faceJ(1),
      plates: plateSteps,
      switched,
      // heat generated and heat through the edges by the stages' own quadrature (exact also for s(T): tr-bdf2.ts)
      sourceJ: stepFaceEnergy(buf, CHANNEL.generated, step, euler),
      edgeJ: stepFaceEnergy(buf, CHANNEL.edge, step, euler),
    };
    // accept: the end state becomes the start of the next step
    acceptStep(line, buf);
    /** The controller's step before this one was shortened to land (on a breakpoint or a state event). */
    const ownS = Math.max(h, step);
    let growth = 1;
    if (adaptive) {
      // a step shortened to land on a breakpoint says nothing about the next one: grow from the controller's own h
      // (step-control.ts: no growth right after a rejection)
      growth = growthFactor(outcome.errorNorm, rejectedLast, d);
      h = (landing ? ownS : step) * growth;
      rejectedLast = false;
      chain.stepS = 0;
    }
    if (landing) { t = target; lo = 0; } else if (fine) advance(step); else t = t1;
    sinceLanding = landing || switched ? 0 : sinceLanding + step;
    if (landing && t < durationS) {
      const before = cond;
      cond = readConditions(t, before);
      if (cond.bottom !== before.bottom || cond.top !== before.top) {
        if (adaptive) h = Math.min(h, d.stepAfterChangeS);
      }
      if (!settle()) return unsettled(t);
    }
    const fired = fireDue(t);
    if (fired === 'failed') return unsettled(t);
    // a switch that changed the conditions starts the next step small; a quiet one only marked an instant, and, like a
    // breakpoint, the step shortened to land on it says nothing about the next one
    if (switched && adaptive) h = fired === 'changed' ? Math.min(h, d.stepAfterChangeS) : ownS * growth;
  }
  return { status: 'ok', stats };
}
