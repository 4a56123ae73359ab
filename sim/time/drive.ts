/**
 * drive(): TR-BDF2 with the time loop's step control (step-control.ts, evolveDefaults) on any stage system
 * (grid/stage-system.ts), for a system with no schedule, breakpoints or state events: a lumped network
 * (grid/node-network.ts), and the proof that the integrator and its control need nothing of the grid. The stack's own
 * loop, with schedules, events, plates and the record, is evolve.ts.
 */
import type { StageSystem, StepBuffers } from '../grid/stage-system.ts';
import { evolveDefaults } from './evolve.ts';
import type { FixedStepping } from './step-control.ts';
import { growthFactor, noRejectedTrial, retryStepS } from './step-control.ts';
import type { NewtonSettings, StepOutcome } from './tr-bdf2.ts';
import { acceptStep, stepFaceEnergy, takeStep } from './tr-bdf2.ts';

export interface DriveOptions {
  /** End of the run, s (the run starts at 0). */
  readonly endS: number;
  /** Adaptive steps from firstStepS up to maxStepS, or a fixed step. */
  readonly stepping: { readonly kind: 'adaptive'; readonly firstStepS: number; readonly maxStepS: number } | FixedStepping;
  readonly newton: NewtonSettings;
  /** Trial steps allowed (accepted and rejected). */
  readonly maxSteps: number;
}

export interface DriveStats {
  steps: number;
  rejected: number;
  newtonIterations: number;
}

/**
 * Why a time loop stopped before its end:
 *   - 'physical': the scenario asks what no stack can give (heat drawn beyond what it holds: a temperature would fall
 *     below absolute zero); the message names the face or source that draws it;
 *   - 'work-budget': the run reached the run-time ceiling (or a caller's step budget); the message names the limit;
 *   - 'numerical': the solver itself could not go on (it found no physical cause: a defect of ours, or a fixed step
 *     too long for Newton in a convergence study).
 */
export type StopReason = 'physical' | 'work-budget' | 'numerical';

/** How a time loop ended (this one, and evolve() with its larger stats). */
export type DriveEnd<S extends DriveStats = DriveStats> =
  | { readonly status: 'ok'; readonly stats: S }
  | { readonly status: 'failed'; readonly reason: StopReason; readonly message: string; readonly tS: number; readonly stats: S };

/**
 * Integrates sys from the state in buf.U0 at t = 0 to options.endS, landing on the end. After each accepted step
 * onStep(t0, t1, channelJ) sees buf (U0 the start, U1 the end) and the energy each ledger channel took in over it by
 * the method's quadrature (channelJ, reused). Never throws for numerical trouble: a failure is the returned status.
 */
export function drive(sys: StageSystem, buf: StepBuffers, options: DriveOptions,
  onStep?: (t0: number, t1: number, channelJ: Float64Array) => void): DriveEnd {
  const d = evolveDefaults;
  const stats: DriveStats = { steps: 0, rejected: 0, newtonIterations: 0 };
  const outcome: StepOutcome = { status: 'ok', errorNorm: 0, newtonIterations: 0 };
  const { stepping, endS } = options;
  const adaptive = stepping.kind === 'adaptive';
  const backwardEuler = stepping.kind === 'fixed' && stepping.scheme === 'backward-euler';
  const maxStepS = stepping.kind === 'adaptive' ? stepping.maxStepS : stepping.stepS;
  const channelJ = new Float64Array(sys.channels);
  sys.evaluate(buf.U0);
  sys.readRates(buf.F0);
  sys.readChannels(buf.q0);
  sys.markStart();
  let h = stepping.kind === 'adaptive' ? Math.min(stepping.firstStepS, maxStepS) : stepping.stepS;
  let t = 0;
  let rejectedLast = false;
  const chain = noRejectedTrial();
  while (t < endS) {
    if (stats.steps + stats.rejected >= options.maxSteps) {
      return { status: 'failed', reason: 'work-budget', message: `the step budget of ${options.maxSteps} trial steps ran out at t = ${t} s`, tS: t, stats };
    }
    let step = Math.min(h, maxStepS);
    let landing = false;
    if (t + step * (1 + d.landShare) >= endS) { step = endS - t; landing = true; }
    else if (adaptive && t + 2 * step > endS) step = 0.5 * (endS - t);
    takeStep(sys, buf, step, options.newton, backwardEuler, outcome);
    stats.newtonIterations += outcome.newtonIterations;
    if (outcome.status !== 'ok' || (adaptive && outcome.errorNorm > 1)) {
      if (!adaptive) return { status: 'failed', reason: 'numerical', message: `Newton did not converge with the fixed step ${step} s`, tS: t, stats };
      stats.rejected++;
      rejectedLast = true;
      h = retryStepS(step, outcome, d, chain);
      continue;
    }
    stats.steps++;
    const t1 = landing ? endS : t + step;
    if (onStep) {
      for (let k = 0; k < sys.channels; k++) channelJ[k] = stepFaceEnergy(buf, k, step, backwardEuler);
      onStep(t, t1, channelJ);
    }
    acceptStep(sys, buf);
    if (adaptive) {
      h = Math.max(landing ? h : step, step) * growthFactor(outcome.errorNorm, rejectedLast, d);
      rejectedLast = false;
      chain.stepS = 0;
    }
    t = t1;
  }
  return { status: 'ok', stats };
}
