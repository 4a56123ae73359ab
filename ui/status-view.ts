/**
 * The run status in the header. The word in `run-status` is the state alone (`done` exactly when a current result
 * is shown); progress and explanations go beside it. `data-run` counts the results shown, for tests and timing.
 */
import { byId } from './dom.ts';
import { formatTime } from './format.ts';

/** `waiting`: a new row has fields to fill in, so no run is requested. */
export type RunState = 'idle' | 'running' | 'done' | 'error' | 'failed' | 'cancelled' | 'waiting';

export interface StatusView {
  readonly set: (state: RunState, detail?: string) => void;
  readonly progress: (tS: number, durationS: number | undefined) => void;
  readonly state: () => RunState;
}

export function createStatusView(onCancel: () => void): StatusView {
  const word = byId('run-status');
  const bar = byId<HTMLProgressElement>('run-progress');
  const detail = byId('run-detail');
  const cancel = byId<HTMLButtonElement>('cancel-run');
  cancel.addEventListener('click', onCancel);
  let state: RunState = 'idle';
  return {
    set(next, text = '') {
      state = next;
      word.textContent = next;
      document.body.dataset.run = next;
      if (next === 'done') word.dataset.run = String(Number(word.dataset.run ?? '0') + 1);
      detail.textContent = text;
      bar.hidden = next !== 'running';
      if (next === 'running') bar.removeAttribute('value');
      cancel.hidden = next !== 'running';
    },
    progress(tS, durationS) {
      if (state !== 'running') return;
      if (durationS !== undefined && durationS > 0) {
        bar.value = Math.min(tS / durationS, 1);
        detail.textContent = `t = ${formatTime(tS, '—')} of ${formatTime(durationS, '—')}`;
      }
    },
    state: () => state,
  };
}
