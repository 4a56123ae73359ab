/**
 * Runs window searches in their own module Web Worker, newest wins: a search still going when a newer scenario
 * arrives is stopped by terminating its worker (the search is synchronous inside it). The page asks for a search
 * after each finished main run, so the search never holds up the main result.
 */
import type { FromOperating, ToOperating } from './operating-protocol.ts';

export interface OperatingRunner {
  request(scenario: unknown): void;
  /** Stops a search still going, and drops its answer. */
  stop(): void;
}

export function createOperatingRunner(onStart: () => void, onReply: (msg: FromOperating) => void): OperatingRunner {
  let worker: Worker | undefined;
  let busy = false;
  let job = 0;

  const spawn = (): Worker => {
    const w = new Worker(new URL('./operating-worker.ts', import.meta.url), { type: 'module', name: 'freezeline-window' });
    w.onmessage = (e: MessageEvent<FromOperating>) => {
      if (e.data.job !== job) return;
      busy = false;
      onReply(e.data);
    };
    w.onerror = (e: ErrorEvent) => {
      e.preventDefault();
      w.terminate();
      if (worker === w) worker = undefined;
      busy = false;
      onReply({ type: 'failed', job, message: `the search worker stopped: ${e.message || 'could not load'}` });
    };
    return w;
  };

  return {
    request(scenario) {
      if (busy && worker) { worker.terminate(); worker = undefined; }
      worker ??= spawn();
      job += 1;
      busy = true;
      onStart();
      const msg: ToOperating = { type: 'window', job, scenario: structuredClone(scenario) };
      worker.postMessage(msg);
    },
    stop() {
      if (busy && worker) { worker.terminate(); worker = undefined; }
      busy = false;
      job += 1;
    },
  };
}
