/**
 * The solver worker: checks the scenario, runs it, and posts progress (at most every `progressEveryMs`) and the
 * result. The run is synchronous; the page cancels it by terminating this worker.
 */
import { accuracyLine, parseScenario } from '../sim/index.ts';
import { runProblem, stopSentence, summarize } from '../sim/index.ts';
import type { FromWorker, ToWorker } from './protocol.ts';
import { toWire } from './protocol.ts';

const defaults = {
  /** Often enough for a smooth progress bar, rarely enough not to flood the page. */
  progressEveryMs: 40,
} as const;

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (msg: FromWorker, transfer: Transferable[] = []): void => scope.postMessage(msg, transfer);

scope.onmessage = (event: MessageEvent<ToWorker>) => {
  const msg = event.data;
  if (msg.type !== 'run') return;
  const { job } = msg;
  try {
    const parsed = parseScenario(msg.scenario);
    if (!parsed.ok) {
      post({ type: 'error', job, errors: parsed.errors });
      return;
    }
    const started = performance.now();
    let lastPost = started;
    const outcome = runProblem(parsed.problem, {
      onProgress: (tS) => {
        const now = performance.now();
        if (now - lastPost >= defaults.progressEveryMs) {
          lastPost = now;
          post({ type: 'progress', job, t_s: tS });
        }
      },
    });
    if (outcome.status === 'ok') {
      const { wire, transfer } = toWire(outcome.record);
      post({ type: 'done', job, record: wire, summary: outcome.summary, solveMs: performance.now() - started,
        accuracy: accuracyLine(outcome.problem.numerics.accuracy) }, transfer);
    } else if (outcome.status === 'failed') {
      if (outcome.reason === 'numerical') {
        post({ type: 'failed', job, message: stopSentence(outcome) });
      } else {
        // the curves up to the stop show which layer plunged, or how far a long run came
        const { wire, transfer } = toWire(outcome.record);
        post({ type: 'failed', job, message: stopSentence(outcome),
          stopped: { record: wire, summary: summarize(parsed.problem, outcome.record), tS: outcome.tS } }, transfer);
      }
    }
  } catch (e) {
    post({ type: 'failed', job, message: `internal error: ${(e as Error).message}` });
  }
};
