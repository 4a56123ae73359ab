/**
 * One run, end to end: scenario → grid → evolve() driven to the end → each step observed (time/observe-step.ts) →
 * record → verdicts. Used by the CLI, the Web
 * Worker, the tests and the benchmark; `onProgress` lets a caller show progress or stop the run (return false).
 * `detail: 'summary'` records only what the verdicts read (no position–time map, no per-step series): for window
 * searches and sweeps, which run many times and read only the summary.
 */
import type { StopReason } from './time/drive.ts';
import type { EvolveEnd, EvolveOptions, EvolveStats } from './time/evolve.ts';
import { evolve } from './time/evolve.ts';
import { createStepObserver } from './time/observe-step.ts';
import type { Grid } from './grid/mesh.ts';
import { buildGrid } from './grid/mesh.ts';
import { withMeltRamp } from './physics/melt-ramp.ts';
import type { AccuracyPlan, Problem } from './physics/problem.ts';
import type { EventTimes } from './scenario/accuracy.ts';
import { estimatedErrorS, ladderPlans } from './scenario/accuracy.ts';
import type { RecordDetail, RunRecord } from './observe/record.ts';
import { createRecorder } from './observe/record.ts';
import { lumpedLayout, observeLumped } from './lumped/lumped.ts';
import type { Summary } from './observe/verdict.ts';
import { summarize } from './observe/verdict.ts';

export interface RunOptions extends EvolveOptions {
  /** Multiplies the cell counts (grid refinement studies). */
  readonly refine?: number;
  /** Called after each step with the time reached; return false to stop the run. */
  readonly onProgress?: (tS: number) => boolean | void;
  /** 'full' (default): series and map for drawing. 'summary': only the verdicts' inputs; record.map is empty. */
  readonly detail?: RecordDetail;
}

export type RunOutcome =
  | { readonly status: 'ok'; readonly problem: Problem; readonly grid: Grid; readonly record: RunRecord; readonly summary: Summary; readonly stats: EvolveStats }
  | {
    readonly status: 'failed'; readonly reason: StopReason; readonly message: string; readonly tS: number; readonly stats: EvolveStats;
    /** What was recorded up to the last accepted step before the stop: the curves to look at, no verdicts. */
    readonly record: RunRecord;
  }
  | { readonly status: 'cancelled'; readonly tS: number };

/**
 * The one sentence every front end (the CLI, a sweep's rows, the studies, the browser view) gives for a run that
 * stopped before its end, in the solver's words (which name the time, and what to change): a physical stop reads as the
 * run stopping; the run-time ceiling's own words already say so ("the run reached its work budget at …"); a numerical
 * stop reads as the solver failing: no physical cause was found, so it is a defect to report, not a property of the
 * scenario.
 */
export function stopSentence(out: { readonly reason: StopReason; readonly message: string }): string {
  if (out.reason === 'physical') return `the run stopped: ${out.message}`;
  return out.reason === 'work-budget' ? out.message : `the solver failed: ${out.message}`;
}

/**
 * The problem as solved: with its accuracy plan's melt ramp applied to every melting layer (scenario/accuracy.ts;
 * the ramp is 0 at the defaults and whenever the file sets its own tolerances).
 */
export function solvedProblem(problem: Problem): Problem {
  const rampK = problem.numerics.accuracy?.meltRampK ?? 0;
  if (rampK === 0) return problem;
  return { ...problem, layers: problem.layers.map((l) => ({ ...l, material: withMeltRamp(l.material, rampK) })) };
}

/**
 * One run of the problem. When its accuracy plan asks to be confirmed (an accuracy asked in seconds whose plan refines
 * the defaults; scenario/accuracy.ts), the run climbs the plan's ladder instead: it solves rung 0 (the defaults), rung
 * 1, … and returns the first rung from the second on whose estimated event-time error (estimatedErrorS, from the runs
 * so far) is within the accuracy asked, or the plan itself, the top rung, which the rule holds to it anyway. The
 * outcome's problem then carries the rung's plan with the estimate; its stats are the returned rung's own (the rungs
 * below it cost more steps besides); onProgress sees each rung's steps from t = 0; a failure or a cancellation of any
 * rung ends the climb with it. A refinement study (`refine`) runs the plan as it is.
 */
export function runProblem(asWritten: Problem, options: RunOptions = {}): RunOutcome {
  const plan = asWritten.numerics.accuracy;
  if (plan?.confirm && options.refine === undefined) return climbLadder(asWritten, plan, options);
  return runOnce(asWritten, options);
}

const EVENTS = ['molten_at_s', 'half_frozen_at_s', 'frozen_at_s'] as const;

function climbLadder(asWritten: Problem, plan: AccuracyPlan, options: RunOptions): RunOutcome {
  const rungs = ladderPlans(plan, asWritten.durationS);
  const seen: EventTimes[] = [];
  const num = asWritten.numerics;
  for (let i = 0; i < rungs.length; i++) {
    const rung = rungs[i]!;
    // the plan's tolerances are divided by its own divisor: undo it, divide by the rung's
    const scale = plan.toleranceDivisor / rung.toleranceDivisor;
    const problem: Problem = { ...asWritten, numerics: { ...num, toleranceK: num.toleranceK * scale, liquidFractionTolerance: num.liquidFractionTolerance * scale, accuracy: rung } };
    const out = runOnce(problem, options);
    if (out.status !== 'ok') return out;
    seen.push(EVENTS.map((e) => out.summary.separator[e]));
    const estimate = estimatedErrorS(seen);
    if (i === rungs.length - 1 || (estimate !== undefined && estimate <= plan.eventAccuracyS)) {
      const stated: AccuracyPlan = { ...rung, estimatedErrorS: estimate };
      return { ...out, problem: { ...out.problem, numerics: { ...out.problem.numerics, accuracy: stated } } };
    }
  }
  throw new Error('climbLadder: a plan has at least one rung');
}

function runOnce(asWritten: Problem, options: RunOptions): RunOutcome {
  const problem = solvedProblem(asWritten);
  // the plan's grid factor (1 at the defaults) times a refinement study's own
  const grid = buildGrid(problem, (options.refine ?? 1) * (problem.numerics.accuracy?.gridRefine ?? 1));
  const observer = createStepObserver(problem, grid);
  const recorder = createRecorder(problem, observer.layout, { detail: options.detail ?? 'full' });
  const loop = evolve(problem, grid, options);
  let end: EvolveEnd;
  for (;;) {
    const next = loop.next();
    if (next.done) { end = next.value; break; }
    recorder.onStep(observer.observe(next.value));
    if (options.onProgress && options.onProgress(next.value.t1) === false) {
      return { status: 'cancelled', tS: next.value.t1 };
    }
  }
  if (end.status === 'failed') return { ...end, record: recorder.finish() };
  const record = recorder.finish();
  return { status: 'ok', problem, grid, record, summary: summarize(problem, record), stats: end.stats };
}

export type LumpedOutcome =
  | { readonly status: 'ok'; readonly record: RunRecord; readonly summary: Summary }
  | { readonly status: 'failed'; readonly message: string };

/**
 * The lumped network (lumped/lumped.ts: one node per layer) summarised by the same recorder and verdicts as the grid:
 * its observations feed createRecorder unchanged. A quick estimate and an independent check; the problem as written
 * (no melt ramp: the network's event times are not held to an accuracy plan). Throws for a heater or bench face or
 * cell terms, which the network does not model.
 */
export function runLumpedProblem(problem: Problem, options: { readonly detail?: RecordDetail } = {}): LumpedOutcome {
  const recorder = createRecorder(problem, lumpedLayout(problem), { detail: options.detail ?? 'full' });
  if (observeLumped(problem, recorder.onStep) !== 'ok') {
    return { status: 'failed', message: 'the lumped network did not converge (odex gave up within its step budget)' };
  }
  const record = recorder.finish();
  return { status: 'ok', record, summary: summarize(problem, record) };
}
