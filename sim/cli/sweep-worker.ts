/**
 * The worker-thread entry of `freezeline sweep` and `ambient` (a tinypool task): one point of a sweep plan → its row.
 * Kept as its own entry file so a bundle can ship it beside the CLI (the pool looks for `sweep-worker.js` next to the
 * running module, then `sweep-worker.ts`). The plan travels with each task (a few kB, structured-cloned).
 */
import { runSweepPoint, type SweepPlan, type SweepRow } from '../study/sweep.ts';

export interface SweepTask {
  readonly plan: SweepPlan;
  readonly indices: readonly number[];
}

/** Runs a batch of points; a failing point is a row with its error (runSweepPoint never throws). */
export default function runBatch(task: SweepTask): SweepRow[] {
  return task.indices.map((i) => runSweepPoint(task.plan, i));
}
