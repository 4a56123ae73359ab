/**
 * Runs scenarios in a module Web Worker, one at a time, newest wins. A request waits `debounceMs` for more edits;
 * a run still going when a newer one starts (or when the person cancels) is stopped by terminating its worker.
 * A spare worker is kept loaded, so a restart does not pay for loading the solver again.
 */
import type { FieldError } from '../sim/index.ts';
import type { Summary } from '../sim/index.ts';
import type { FromWorker, ToWorker, WireRecord } from './protocol.ts';
import { spawnSolver, takeSolver } from './solver-worker.ts';

export const runnerDefaults = {
  /** Long enough to gather a burst of keystrokes into one run, short enough to feel immediate. */
  debounceMs: 150,
  /** After the first run has the CPU to itself (and the page has drawn), load a spare worker. */
  spareDelayMs: 3000,
} as const;

export interface RunHandlers {
  readonly onStart: (job: number) => void;
  readonly onProgress: (tS: number) => void;
  readonly onDone: (job: number, scenario: unknown, record: WireRecord, summary: Summary, solveMs: number, accuracy: string) => void;
  readonly onErrors: (errors: readonly FieldError[]) => void;
  /** `stopped`: a run that stopped before its end, with what it recorded (protocol.ts); `scenario` is the one sent. */
  readonly onFailed: (message: string, stopped?: { readonly job: number; readonly scenario: unknown; readonly record: WireRecord; readonly summary: Summary; readonly tS: number }) => void;
  readonly onCancelled: () => void;
}

export interface Runner {
  /** Queues a run of this scenario (debounced); `now` skips the wait. */
  request(scenario: unknown, now?: boolean): void;
  cancel(): void;
  /** Drops a queued run and stops a running one without reporting it: the edited scenario is not ready to run. */
  hold(): void;
  readonly busy: () => boolean;
}


export function createRunner(handlers: RunHandlers): Runner {
  let worker: Worker | undefined;
  /** Loaded while idle after the first run, so that the first run does not share the CPU with it. */
  let spare: Worker | undefined;
  const spawnSpareLater = (): void => {
    if (spare) return;
    setTimeout(() => { spare ??= spawnSolver(); }, runnerDefaults.spareDelayMs);
  };
  let job = 0;
  let running = false;
  /** The scenario of the current job, as sent. */
  let sent: unknown;
  let timer: ReturnType<typeof setTimeout> | undefined;

  const take = (): Worker => {
    const w = spare ?? takeSolver();
    spare = undefined;
    spawnSpareLater();
    w.onmessage = (e: MessageEvent<FromWorker>) => receive(e.data);
    w.onerror = (e: ErrorEvent) => {
      e.preventDefault();
      w.terminate();
      if (worker === w) worker = undefined;
      running = false;
      handlers.onFailed(`the solver worker stopped: ${e.message || 'could not load'}`);
    };
    return w;
  };

  const stop = (): void => {
    if (running && worker) {
      worker.terminate();
      worker = undefined;
    }
    running = false;
  };

  function receive(msg: FromWorker): void {
    if (msg.job !== job) return;
    switch (msg.type) {
      case 'progress': handlers.onProgress(msg.t_s); return;
      case 'done': running = false; handlers.onDone(msg.job, sent, msg.record, msg.summary, msg.solveMs, msg.accuracy); return;
      case 'error': running = false; handlers.onErrors(msg.errors); return;
      case 'failed': running = false; handlers.onFailed(msg.message, msg.stopped && { ...msg.stopped, job: msg.job, scenario: sent }); return;
    }
  }

  const start = (scenario: unknown): void => {
    timer = undefined;
    stop();
    worker ??= take();
    job += 1;
    running = true;
    sent = scenario;
    handlers.onStart(job);
    const msg: ToWorker = { type: 'run', job, scenario };
    worker.postMessage(msg);
  };

  return {
    request(scenario, now = false) {
      if (timer !== undefined) clearTimeout(timer);
      const snapshot = structuredClone(scenario);
      if (now) start(snapshot);
      else timer = setTimeout(() => start(snapshot), runnerDefaults.debounceMs);
    },
    cancel() {
      if (timer !== undefined) { clearTimeout(timer); timer = undefined; }
      job += 1;
      stop();
      handlers.onCancelled();
    },
    hold() {
      if (timer !== undefined) { clearTimeout(timer); timer = undefined; }
      job += 1;
      stop();
    },
    busy: () => running || timer !== undefined,
  };
}
