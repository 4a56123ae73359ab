/**
 * A study worker: runs the points it is given (sim/study/sweep.ts, summary-only runs) and posts each row as it is
 * done. A point that is invalid or fails comes back as a row with its error. Cancelling is terminating the worker.
 */
import { runSweepPoint } from '../sim/index.ts';
import type { FromStudy, ToStudy } from './study-protocol.ts';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (msg: FromStudy): void => scope.postMessage(msg);

scope.onmessage = (event: MessageEvent<ToStudy>) => {
  const { job, plan, indices } = event.data;
  try {
    for (const i of indices) post({ type: 'row', job, row: runSweepPoint(plan, i) });
  } catch (e) {
    post({ type: 'failed', job, message: (e as Error).message });
  }
};
