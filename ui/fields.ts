/**
 * Inputs bound to a path in the draft. Each sits in a `.field` wrapper (label with unit, input, room for the solver's
 * message). Numbers are typed as text so that what was typed is kept and the solver can say what is wrong with it.
 */
import type { DraftStore } from './draft.ts';
import { h, type Child } from './dom.ts';
import { inputText, parseNumberInput } from './format.ts';
import type { Json } from './json.ts';

export interface FieldOptions {
  readonly path: string;
  readonly label: string;
  /** Shown after the label, e.g. `mm`, `W/(m²·K)`. */
  readonly unit?: string;
  readonly testid?: string;
  readonly placeholder?: string;
  readonly hint?: string;
  /** Clearing this field also removes its parent group if left empty (e.g. a plate with both fields cleared). */
  readonly prune?: boolean;
  /** Replaces the plain write at `path` (renames, contacts). */
  readonly write?: (value: Json | undefined, control: HTMLInputElement | HTMLSelectElement) => void;
  readonly wide?: boolean;
}

export function fieldWrapper(label: string, unit: string | undefined, hint: string | undefined, ...controls: Child[]): HTMLElement {
  return h('label', { class: 'field', title: hint },
    h('span', { class: 'field-label' }, label, unit ? h('span', { class: 'unit' }, `, ${unit}`) : undefined),
    ...controls);
}

function textInput(store: DraftStore, o: FieldOptions, parse: (text: string) => Json | undefined): HTMLElement {
  const input = h('input', {
    type: 'text', 'data-path': o.path, 'data-testid': o.testid, placeholder: o.placeholder, spellcheck: 'false',
    autocomplete: 'off', class: o.wide ? 'wide' : undefined, 'aria-label': o.unit ? `${o.label}, ${o.unit}` : o.label,
  });
  input.value = inputText(store.get(o.path));
  input.addEventListener('input', () => {
    const value = parse(input.value);
    if (o.write) o.write(value, input);
    else store.setField(o.path, value, { prune: o.prune ?? false, source: input });
  });
  return fieldWrapper(o.label, o.unit, o.hint, input);
}

/** A number field (kept as typed if it is not a number). */
export const numberField = (store: DraftStore, o: FieldOptions): HTMLElement => {
  const field = textInput(store, o, parseNumberInput);
  field.querySelector('input')?.setAttribute('inputmode', 'decimal');
  return field;
};

/** A text field; empty text is kept as an empty string (ids and names are required). */
export const stringField = (store: DraftStore, o: FieldOptions): HTMLElement => textInput(store, o, (t) => t);

export interface Choice { readonly value: string; readonly label: string }

export function selectField(store: DraftStore, o: FieldOptions & { readonly choices: readonly Choice[] }): HTMLElement {
  const current = inputText(store.get(o.path));
  const choices = o.choices.some((c) => c.value === current) ? o.choices
    : [{ value: current, label: `${current || '(none)'} — not found` }, ...o.choices];
  const select = h('select', { 'data-path': o.path, 'data-testid': o.testid, 'aria-label': o.label },
    ...choices.map((c) => h('option', { value: c.value, selected: c.value === current }, c.label)));
  select.addEventListener('change', () => {
    if (o.write) o.write(select.value, select);
    else store.setField(o.path, select.value, { source: select });
  });
  return fieldWrapper(o.label, o.unit, o.hint, select);
}

/** A check box: ticked writes `true`, unticked removes the key (the file stays minimal). */
export function checkField(store: DraftStore, o: FieldOptions): HTMLElement {
  const box = h('input', { type: 'checkbox', 'data-path': o.path, 'data-testid': o.testid, checked: store.get(o.path) === true });
  box.addEventListener('change', () => store.setField(o.path, box.checked ? true : undefined, { source: box }));
  return h('label', { class: 'field check', title: o.hint }, box, h('span', { class: 'field-label' }, o.label));
}

/** Brings every other input bound to `path` up to date with the draft (two controls can edit one value). */
export function syncPeers(root: ParentNode, store: DraftStore, path: string, source: Element | undefined): void {
  for (const e of root.querySelectorAll<HTMLInputElement>(`input[type="text"][data-path="${CSS.escape(path)}"]:not([data-list])`)) {
    if (e !== source) e.value = inputText(store.get(path));
  }
}
