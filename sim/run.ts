/**
 * One run, end to end: scenario → grid → evolve() driven to the end → record → verdicts. Used by the CLI, the Web
 * Worker, the tests and the benchmark; `onProgress` lets a caller show progress or stop the run (return false).
 */
import type { EvolveEnd, EvolveOptions, EvolveStats } from './evolve.ts';
import { evolve } from './evolve.ts';
import type { Grid } from './mesh.ts';
import { buildGrid } from './mesh.ts';
import type { Problem } from './problem.ts';
import type { RunRecord } from './record.ts';
import { createRecorder } from './record.ts';
import type { Summary } from './verdict.ts';
import { summarize } from './verdict.ts';

export interface RunOptions extends EvolveOptions {
  /** Multiplies the cell counts (grid refinement studies). */
  readonly refine?: number;
  /** Called after each step with the time reached; return false to stop the run. */
  readonly onProgress?: (tS: number) => boolean | void;
}

export type RunOutcome =
  | { readonly status: 'ok'; readonly problem: Problem; readonly grid: Grid; readonly record: RunRecord; readonly summary: Summary; readonly stats: EvolveStats }
  | { readonly status: 'failed'; readonly message: string; readonly tS: number; readonly stats: EvolveStats }
  | { readonly status: 'cancelled'; readonly tS: number };

export function runProblem(problem: Problem, options: RunOptions = {}): RunOutcome {
  const grid = buildGrid(problem, options.refine ?? 1);
  const recorder = createRecorder(problem, grid);
  const loop = evolve(problem, grid, options);
  let end: EvolveEnd;
  for (;;) {
    const next = loop.next();
    if (next.done) { end = next.value; break; }
    recorder.onStep(next.value);
    if (options.onProgress && options.onProgress(next.value.t1) === false) {
      return { status: 'cancelled', tS: next.value.t1 };
    }
  }
  if (end.status === 'failed') return end;
  const record = recorder.finish();
  return { status: 'ok', problem, grid, record, summary: summarize(problem, record), stats: end.stats };
}
