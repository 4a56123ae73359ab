/**
 * The window-search worker: checks the scenario, runs the search (sim/study/window.ts: many summary-only runs) and
 * posts the report with its sentences. Synchronous; the page stops a search that is no longer wanted by terminating
 * this worker.
 */
import { parseScenario } from '../sim/index.ts';
import { searchWindow } from '../sim/index.ts';
import { windowWords } from '../sim/index.ts';
import type { FromOperating, ToOperating } from './operating-protocol.ts';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (msg: FromOperating): void => scope.postMessage(msg);

scope.onmessage = (event: MessageEvent<ToOperating>) => {
  const { job, scenario } = event.data;
  try {
    const parsed = parseScenario(scenario);
    if (!parsed.ok) {
      post({ type: 'none', job, reason: 'the scenario has fields to fix (marked in the editor)' });
      return;
    }
    const started = performance.now();
    const result = searchWindow(parsed.problem);
    if (!result.ok) { post({ type: 'none', job, reason: result.reason }); return; }
    post({ type: 'done', job, report: result.report, words: windowWords(result.report), searchMs: performance.now() - started });
  } catch (e) {
    post({ type: 'failed', job, message: (e as Error).message });
  }
};
