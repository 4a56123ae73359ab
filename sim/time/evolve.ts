/**
 * The time loop, as a generator (the CLI, the worker, the tests and the benchmark drive the same loop; it never
 * decides where output goes). Steps are chosen by the local error estimate of TR-BDF2 with the usual controller
 * h_new = h·clamp(safety·err^(−1/3), shrink, grow) (Hairer & Wanner, Solving ODEs II, §IV.8), and land exactly on
 * every breakpoint: schedule changes of the faces and sources, requested output times and the end of the run.
 */
import type { StepConditions, Workspace } from '../grid/discretization.ts';
import { CHANNEL, createWorkspace, updateCapacity } from '../grid/discretization.ts';
import { enthalpyAt } from '../physics/material.ts';
import type { Grid } from '../grid/mesh.ts';
import type { Problem } from '../physics/problem.ts';
import { breakpoints, characteristicLengthM, conditionAt, sourceAt } from '../physics/problem.ts';
import type { ErrorScale, NewtonSettings, StepBuffers, StepOutcome } from './tr-bdf2.ts';
import { createStepBuffers, settleFaces, STAGE_FRACTION, stepFaceEnergy, takeStep } from './tr-bdf2.ts';
import { belowAbsoluteZeroMessage, budgetMessage, coldestK, faceBelowAbsoluteZero, smallestRelaxationS, stepGuardDefaults } from './step-guards.ts';

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
  /** Newton failure: cut the step by this factor. */
  newtonCut: 0.25,
  /** A step that would end within this share of a breakpoint is stretched onto it. */
  landShare: 1e-6,
} as const;

/**
 * How steps are chosen. Adaptive steps are always TR-BDF2 (its embedded estimate drives the controller); backward Euler
 * has no error estimate here, so it exists only with a fixed step, for the convergence study. A union, so that no
 * contradictory combination (backward Euler with adaptive steps) can be written.
 */
export type Stepping =
  | { readonly kind: 'adaptive' }
  | { readonly kind: 'fixed'; readonly stepS: number; readonly scheme: 'tr-bdf2' | 'backward-euler' };

export interface EvolveOptions {
  /** Default adaptive. A fixed step (s) still lands on every breakpoint. */
  readonly stepping?: Stepping;
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
}

export interface EvolveStats {
  steps: number;
  rejected: number;
  newtonIterations: number;
  /** Steps accepted at the smallest step (step-guards.ts) although the error estimate asked for less. */
  forced: number;
}

export type EvolveEnd =
  | { readonly status: 'ok'; readonly stats: EvolveStats }
  | { readonly status: 'failed'; readonly message: string; readonly tS: number; readonly stats: EvolveStats };

function conditionsAt(problem: Problem, grid: Grid, tS: number, source: Float64Array): StepConditions {
  for (let i = 0; i < grid.n; i++) source[i] = sourceAt(problem.layers[grid.layerOf[i]!]!, tS);
  return { bottom: conditionAt(problem.bottom, tS), top: conditionAt(problem.top, tS), source };
}

/** The initial state: every cell at the initial temperature, faces balanced against it. */
export function initialState(problem: Problem, grid: Grid, U: Float64Array): void {
  U[0] = problem.initialK;
  U[grid.n + 1] = problem.initialK;
  for (let i = 0; i < grid.n; i++) U[i + 1] = enthalpyAt(grid.materials[i]!.enthalpy, problem.initialK);
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
  const ws = createWorkspace(grid, { facing: 'down', lengthM }, { facing: 'up', lengthM }, problem.layers.map((l) => l.terms));
  const buf = createStepBuffers(grid.n);
  const scale: ErrorScale = { toleranceK: numerics.toleranceK, liquidFraction: numerics.liquidFractionTolerance };
  const newton: NewtonSettings = { toleranceK: numerics.toleranceK * d.newtonShare, maxIterations: d.maxNewtonIterations };
  const stats: EvolveStats = { steps: 0, rejected: 0, newtonIterations: 0, forced: 0 };
  const outcome: StepOutcome = { status: 'ok', errorNorm: 0, newtonIterations: 0 };
  const stepping: Stepping = options.stepping ?? { kind: 'adaptive' };
  const fixedStepS = stepping.kind === 'fixed' ? stepping.stepS : undefined;
  const backwardEuler = stepping.kind === 'fixed' && stepping.scheme === 'backward-euler';
  const breaks = breakpoints(problem);
  const source = new Float64Array(grid.n);

  let t = 0;
  let nextBreak = 0;
  let cond = conditionsAt(problem, grid, t, source);
  initialState(problem, grid, buf.U0);
  let floorS = 0;
  const settle = (): boolean => {
    if (!settleFaces(ws, buf.U0, cond, newton.toleranceK)) return false;
    buf.F0.set(ws.F);
    buf.q0.set(ws.faceQ);
    buf.T0.set(ws.T);
    updateCapacity(ws);
    floorS = stepGuardDefaults.floorShare * smallestRelaxationS(ws);
    return true;
  };
  const unsettled = (tS: number): EvolveEnd => {
    const bottom = faceBelowAbsoluteZero(ws, cond, 0);
    const top = faceBelowAbsoluteZero(ws, cond, 1);
    // a face whose balance needs T < 0 K is the cause: it outranks whatever the unconverged iterate holds
    const faceQ = Float64Array.of(bottom ? -Infinity : ws.faceQ[0]!, top ? -Infinity : ws.faceQ[1]!);
    return {
      status: 'failed', tS, stats,
      message: bottom || top || coldestK(ws.T) < 0 ? belowAbsoluteZeroMessage(problem, ws, cond, faceQ, tS) : `the face balance did not converge at t = ${tS} s`,
    };
  };
  if (!settle()) return unsettled(0);
  // report the initial state as a step of zero length
  buf.U1.set(buf.U0); buf.Ug.set(buf.U0); buf.F1.set(buf.F0); buf.Fg.set(buf.F0); buf.q1.set(buf.q0); buf.qg.set(buf.q0);
  yield { t0: 0, tg: 0, t1: 0, buf, ws, cond, bottomJ: 0, topJ: 0, sourceJ: 0, edgeJ: 0 };

  let h = fixedStepS ?? Math.min(d.firstStepS, numerics.maxStepS);
  let rejectedLast = false;
  const adaptive = stepping.kind === 'adaptive';
  const maxSteps = stepGuardDefaults.maxCellSteps / grid.n;
  while (t < durationS) {
    while (nextBreak < breaks.length && breaks[nextBreak]! <= t) nextBreak++;
    const target = breaks[nextBreak] ?? durationS;
    const floor = Math.max(floorS, stepGuardDefaults.floorRelative * t);
    const floored = adaptive && h <= floor;
    let step = Math.min(fixedStepS ?? Math.max(h, floor), numerics.maxStepS);
    let landing = false;
    if (t + step * (1 + d.landShare) >= target) { step = target - t; landing = true; }
    else if (adaptive && t + 2 * step > target) step = Math.max(0.5 * (target - t), Math.min(floor, target - t));
    if (stats.steps + stats.rejected >= maxSteps) {
      return { status: 'failed', message: budgetMessage(grid.n, stats.steps + stats.rejected, t, durationS, step), tS: t, stats };
    }
    // at the floor the step is taken whatever the error estimate says (see step-guards.ts)
    // (a floored step stretched by rounding to land on a breakpoint is still at the floor)
    const atFloor = floored || (adaptive && step <= floor);
    takeStep(ws, buf, step, cond, newton, scale, backwardEuler, outcome);
    stats.newtonIterations += outcome.newtonIterations;
    if (outcome.status !== 'ok' || (adaptive && !atFloor && outcome.errorNorm > 1)) {
      // an iterate below 0 K on a long step may still come back; on the smallest step it is the physics
      if ((atFloor || !adaptive) && coldestK(ws.T) < 0) {
        return { status: 'failed', message: belowAbsoluteZeroMessage(problem, ws, cond, buf.q0, t), tS: t, stats };
      }
      if (!adaptive) {
        return { status: 'failed', message: `Newton did not converge with the fixed step ${step} s`, tS: t, stats };
      }
      if (atFloor) {
        return { status: 'failed', message: `the solver could not converge at t = ${t} s even with its smallest step, ${step.toPrecision(2)} s (${outcome.status})`, tS: t, stats };
      }
      stats.rejected++;
      rejectedLast = true;
      h = outcome.status === 'ok'
        ? step * Math.max(d.shrink, d.safety * outcome.errorNorm ** (-1 / 3))
        : step * d.newtonCut;
      continue;
    }
    if (atFloor && outcome.errorNorm > 1) stats.forced++;
    const t1 = landing ? target : t + step;
    if (coldestK(ws.T) < 0) {
      // where the coldest node crossed 0 K, by linear interpolation over the step
      const before = coldestK(buf.T0);
      const after = coldestK(ws.T);
      const at = before > 0 ? t + (step * before) / (before - after) : t;
      return { status: 'failed', message: belowAbsoluteZeroMessage(problem, ws, cond, buf.q1, at), tS: at, stats };
    }
    stats.steps++;
    yield {
      t0: t, tg: t + (backwardEuler ? step : step * STAGE_FRACTION), t1, buf, ws, cond,
      bottomJ: stepFaceEnergy(buf, 0, step, backwardEuler),
      topJ: stepFaceEnergy(buf, 1, step, backwardEuler),
      // heat generated and heat through the edges by the stages' own quadrature (exact also for s(T): tr-bdf2.ts)
      sourceJ: stepFaceEnergy(buf, CHANNEL.generated, step, backwardEuler),
      edgeJ: stepFaceEnergy(buf, CHANNEL.edge, step, backwardEuler),
    };
    // accept: the end state becomes the start of the next step
    buf.U0.set(buf.U1);
    buf.F0.set(buf.F1);
    buf.q0.set(buf.q1);
    buf.T0.set(ws.T);
    updateCapacity(ws);
    if (adaptive) {
      const ratio = outcome.errorNorm > 0 ? d.safety * outcome.errorNorm ** (-1 / 3) : d.grow;
      // no growth right after a rejection (Hairer & Wanner II, §IV.8): the step that failed is still near
      const growth = rejectedLast ? 1 : d.grow;
      rejectedLast = false;
      // a step shortened to land on a breakpoint says nothing about the next one: grow from the controller's own h
      h = Math.max(landing ? h : step, step) * Math.min(growth, Math.max(d.shrink, ratio));
    }
    t = t1;
    if (landing && t < durationS) {
      const before = cond;
      cond = conditionsAt(problem, grid, t, source);
      if (cond.bottom !== before.bottom || cond.top !== before.top) {
        if (adaptive) h = Math.min(h, d.stepAfterChangeS);
      }
      if (!settle()) return unsettled(t);
    }
  }
  return { status: 'ok', stats };
}
