/**
 * Runs a sweep plan's points on worker threads (tinypool) and hands back the rows in index order, whatever order the
 * workers finish in, so a parallel sweep prints exactly what a serial one does. With jobs = 1 the points run here,
 * in this thread, one after the other (the serial reference).
 *
 * The worker is its own entry file (see workerEntry). Progress goes to a cli-progress bar on stderr, with the time left, only when stderr is a terminal.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { SingleBar } from 'cli-progress';
import type { Tinypool as TinypoolClass } from 'tinypool';
import { runSweepPoint, type SweepPlan, type SweepRow } from '../study/sweep.ts';
import type { SweepTask } from './sweep-worker.ts';

export const poolDefaults = {
  /** Points per task: enough to hide the per-task message cost (~0.1 ms) against runs of a few ms… */
  maxBatch: 16,
  /** …and at least this many tasks per thread, so the threads finish together and the bar moves. */
  tasksPerThread: 8,
} as const;

export const defaultJobs = (): number => availableParallelism();

/**
 * The worker's entry file: `sweep-worker.js` beside this module (a bundled CLI ships it as a second entry point), or,
 * from source, `sweep-worker-source.mjs`, which registers tsx in the worker and loads `sweep-worker.ts` (Node 20
 * ignores an `--import tsx` in a worker's execArgv).
 */
export function workerEntry(): string {
  const js = new URL('./sweep-worker.js', import.meta.url);
  return existsSync(fileURLToPath(js)) ? js.href : new URL('./sweep-worker-source.mjs', import.meta.url).href;
}

/**
 * tinypool, loaded from its own package folder at run time: it starts each thread from a script it finds beside
 * itself (`entry/worker.js`), so it must not be bundled into the CLI (a non-literal specifier keeps esbuild out).
 */
async function loadTinypool(): Promise<typeof TinypoolClass> {
  const name = 'tinypool';
  return ((await import(name)) as { Tinypool: typeof TinypoolClass }).Tinypool;
}

export interface PoolOptions {
  readonly jobs: number;
  /** Show a progress bar on stderr (only takes effect when stderr is a terminal). */
  readonly progress: boolean;
  /** Receives each row, in increasing index order. */
  readonly onRow: (row: SweepRow) => void;
}

function progressBar(total: number, wanted: boolean): SingleBar | null {
  if (!wanted || !process.stderr.isTTY || total < 2) return null;
  const bar = new SingleBar({ stream: process.stderr, format: 'runs {bar} {value}/{total}  time left {eta_formatted}', etaBuffer: 50, hideCursor: true });
  bar.start(total, 0);
  return bar;
}

/** Runs the given points (indices in increasing order) and calls onRow for each in that order. */
export async function runPoints(plan: SweepPlan, indices: readonly number[], opts: PoolOptions): Promise<void> {
  const bar = progressBar(indices.length, opts.progress);
  try {
    if (indices.length === 0) return;
    if (opts.jobs <= 1) {
      for (const i of indices) { opts.onRow(runSweepPoint(plan, i)); bar?.increment(); }
      return;
    }
    const threads = Math.min(opts.jobs, indices.length);
    const size = Math.max(1, Math.min(poolDefaults.maxBatch, Math.ceil(indices.length / (threads * poolDefaults.tasksPerThread))));
    const batches: number[][] = [];
    for (let s = 0; s < indices.length; s += size) batches.push(indices.slice(s, s + size));
    const Tinypool = await loadTinypool();
    const pool = new Tinypool({ filename: workerEntry(), minThreads: threads, maxThreads: threads });
    const done = new Map<number, SweepRow[]>();
    let next = 0;
    const flush = () => {
      while (done.has(next)) { for (const row of done.get(next)!) opts.onRow(row); done.delete(next); next++; }
    };
    try {
      await Promise.all(batches.map(async (b, bi) => {
        const task: SweepTask = { plan, indices: b };
        done.set(bi, (await pool.run(task)) as SweepRow[]);
        bar?.increment(b.length);
        flush();
      }));
    } finally {
      await pool.destroy();
    }
  } finally {
    bar?.stop();
  }
}
