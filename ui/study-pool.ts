/**
 * A pool of study workers for the browser: the points are dealt out in interleaved shares (worker w gets the indices
 * ≡ w mod N, so every worker has early and late points of the grid alike); rows arrive in any order and are handed on
 * with the count done. Cancel terminates the workers, which stops their runs at once (a run is synchronous inside).
 */
import type { SweepPlan, SweepRow } from '../sim/index.ts';
import type { FromStudy, ToStudy } from './study-protocol.ts';

export const studyPoolDefaults = {
  /** At most this many workers: each holds a copy of the solver, and the main page needs a core too. */
  maxWorkers: 4,
} as const;

export interface StudyHandlers {
  readonly onRow: (row: SweepRow, done: number, total: number) => void;
  readonly onDone: () => void;
  readonly onFailed: (message: string) => void;
}

export interface StudyRun { readonly cancel: () => void }

let job = 0;

export function runStudy(plan: SweepPlan, handlers: StudyHandlers): StudyRun {
  job += 1;
  const mine = job;
  const n = Math.max(1, Math.min(studyPoolDefaults.maxWorkers, navigator.hardwareConcurrency || 2, plan.count));
  const workers: Worker[] = [];
  let done = 0;
  let over = false;
  const stop = () => { over = true; for (const w of workers) w.terminate(); };
  for (let w = 0; w < n; w++) {
    const indices: number[] = [];
    for (let i = w; i < plan.count; i += n) indices.push(i);
    const worker = new Worker(new URL('./study-worker.ts', import.meta.url), { type: 'module', name: `freezeline-study-${w}` });
    worker.onmessage = (e: MessageEvent<FromStudy>) => {
      if (over || e.data.job !== mine) return;
      if (e.data.type === 'failed') { stop(); handlers.onFailed(e.data.message); return; }
      done += 1;
      handlers.onRow(e.data.row, done, plan.count);
      if (done === plan.count) { stop(); handlers.onDone(); }
    };
    worker.onerror = (e: ErrorEvent) => {
      e.preventDefault();
      if (over) return;
      stop();
      handlers.onFailed(`a study worker stopped: ${e.message || 'could not load'}`);
    };
    const msg: ToStudy = { type: 'points', job: mine, plan, indices };
    worker.postMessage(msg);
    workers.push(worker);
  }
  return { cancel: stop };
}
