/**
 * Timing of repeated solves of one problem, in this process: median wall time and the work done.
 * A cell-update is one cell in one Newton iteration (the unit of work of the implicit solver).
 */
import type { Problem } from '../physics/problem.ts';
import { runProblem } from '../run.ts';

export interface BenchFigures {
  median_ms: number;
  runs: number;
  cells: number;
  steps: number;
  newton_iterations: number;
  cell_updates_per_s: number;
}

/** Warm-up runs before timing, so the JIT has compiled the kernels. */
const WARMUP_RUNS = 3;

export function benchProblem(problem: Problem, runs: number): BenchFigures {
  let last = runProblem(problem);
  for (let i = 1; i < WARMUP_RUNS; i++) last = runProblem(problem);
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    last = runProblem(problem);
    times.push(performance.now() - t0);
  }
  if (last.status !== 'ok') throw new Error(`the run did not finish (${last.status})`);
  times.sort((a, b) => a - b);
  const mid = times.length >> 1;
  const median = times.length % 2 === 1 ? times[mid]! : 0.5 * (times[mid - 1]! + times[mid]!);
  const cells = last.grid.n;
  const iterations = last.stats.newtonIterations;
  return {
    median_ms: median,
    runs,
    cells,
    steps: last.stats.steps,
    newton_iterations: iterations,
    cell_updates_per_s: (cells * iterations) / (median / 1000),
  };
}
