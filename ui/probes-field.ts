/**
 * The probe depths control (`output.probes_mm`): a comma-separated list in mm from the bottom face. Empty means the
 * probes follow the layers (bottom face, each layer's mid-plane, each interface, top face: sim/grid/probes.ts), so editing
 * a thickness can never leave a probe outside the stack. A depth the user typed that falls outside the stack is
 * reported by the solver at `output.probes_mm[i]` and shown beside this field like any bad field.
 */
import type { DraftStore } from './draft.ts';
import { h } from './dom.ts';
import { fieldWrapper } from './fields.ts';
import { inputText, parseNumberInput } from './format.ts';
import type { Json } from './json.ts';

export const PROBES_PATH = 'output.probes_mm';

/** "0, 1.5; 3" → [0, 1.5, 3]; an entry that is not a number is kept as typed so the solver names it. Empty → absent. */
export function parseDepthList(text: string): Json[] | undefined {
  const entries = text.split(/[,;\s]+/).map((t) => t.trim()).filter((t) => t !== '');
  if (entries.length === 0) return undefined;
  return entries.map((t) => parseNumberInput(t) ?? t);
}

export function depthListText(value: Json | undefined): string {
  return Array.isArray(value) ? value.map(inputText).join(', ') : '';
}

export function probesField(store: DraftStore): HTMLElement {
  const input = h('input', {
    type: 'text', 'data-path': PROBES_PATH, 'data-testid': 'probes-mm', spellcheck: 'false', autocomplete: 'off',
    placeholder: 'follow the layers', class: 'wide', 'aria-label': 'probe depths from the bottom face, mm',
  });
  input.value = depthListText(store.get(PROBES_PATH));
  // `data-list` keeps syncPeers (which writes single values) away from this field
  input.setAttribute('data-list', '');
  input.addEventListener('input', () =>
    store.setField(PROBES_PATH, parseDepthList(input.value), { prune: true, source: input }));
  return fieldWrapper('probe depths', 'mm from the bottom face',
    'Comma-separated depths where temperatures are reported at the output times. Leave empty to follow the layers: the bottom face, each layer\'s mid-plane, each interface and the top face.',
    input);
}
