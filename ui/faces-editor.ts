/**
 * The bottom and top face schedules: rows in time order, each holding from its start time until the next row.
 * A row is a sum of terms, every one optional (empty = absent): a held plate, an imposed heat flux or heater power,
 * convection (a coefficient or the natural-convection correlation), radiation, or the face held at a temperature.
 * Or the row is of the kind "heater body" (ui/heater-editor.ts): a heater with its plate and control, and no other term;
 * or "bench surface" (ui/bench-editor.ts): a solid the face rests on after lift-off.
 */
import type { DraftStore } from './draft.ts';
import { button, h } from './dom.ts';
import { fieldWrapper, numberField } from './fields.ts';
import { inputText, parseNumberInput } from './format.ts';
import { asList, asNumber, asObject, isObject, type JsonObject } from './json.ts';
import { segmentSummary } from './face-summary.ts';
import { benchTerm } from './bench-editor.ts';
import { heaterTerm, NON_HEATER_TERMS, setRowKind, type RowKind } from './heater-editor.ts';

export type Side = 'bottom' | 'top';

const defaults = {
  /** A new row starts this long after the last one. */
  gapS: 60,
} as const;

/** Convection: none, the natural-convection correlation, or a fixed coefficient. */
function convectionField(store: DraftStore, path: string): HTMLElement {
  const current = store.get(path);
  const mode = current === undefined ? 'none' : current === 'natural' ? 'natural' : 'fixed';
  const select = h('select', { 'aria-label': 'convection' },
    h('option', { value: 'none', selected: mode === 'none' }, 'none'),
    h('option', { value: 'natural', selected: mode === 'natural' }, 'natural (still air)'),
    h('option', { value: 'fixed', selected: mode === 'fixed' }, 'coefficient h'));
  const input = h('input', { type: 'text', inputmode: 'decimal', 'data-path': path, 'aria-label': 'convection coefficient, W/(m²·K)', placeholder: 'h' });
  input.value = mode === 'fixed' ? inputText(current) : '';
  input.hidden = mode !== 'fixed';
  select.addEventListener('change', () => {
    input.hidden = select.value !== 'fixed';
    if (select.value === 'none') store.setField(path, undefined, { source: input });
    else if (select.value === 'natural') store.setField(path, 'natural', { source: input });
    else {
      if (input.value === '') input.value = '10';
      store.setField(path, parseNumberInput(input.value), { source: input });
      input.focus();
    }
  });
  input.addEventListener('input', () => store.setField(path, parseNumberInput(input.value), { source: input }));
  return fieldWrapper('convection', 'W/(m²·K)', 'Heat lost to the surrounding air: a coefficient, or the correlation for a horizontal plate in still air.', select, input);
}

/** The row's kind: a sum of terms, a heater body or a bench surface (each of the last two excludes the terms). */
function kindField(store: DraftStore, p: string, testid: string): HTMLElement {
  const seg = asObject(store.get(p));
  const kind: RowKind = isObject(seg.heater) ? 'heater' : isObject(seg.bench) ? 'bench' : 'terms';
  const select = h('select', { 'data-testid': testid, 'aria-label': 'row kind' },
    h('option', { value: 'terms', selected: kind === 'terms' }, 'terms (plate, flux, air, held face)'),
    h('option', { value: 'heater', selected: kind === 'heater' }, 'heater body'),
    h('option', { value: 'bench', selected: kind === 'bench' }, 'bench surface'));
  select.addEventListener('change', () => store.change((d) => setRowKind(d, p, select.value as RowKind)));
  return fieldWrapper('kind', undefined, 'A heater body is a plate with its own heat capacity, power limit and control; a bench surface is a solid the face rests on after lift-off. Either takes no other term.', select);
}

function termFields(n: (path: string, label: string, unit: string | undefined, extra?: { placeholder?: string; hint?: string; prune?: boolean }) => HTMLElement,
  store: DraftStore, p: string): HTMLElement[] {
  return [
    h('fieldset', { class: 'term' }, h('legend', {}, 'held plate'),
      n('plate.temperature_C', 'temperature', '°C', { prune: true, placeholder: 'none' }),
      n('plate.conductance_W_m2K', 'contact conductance', 'W/(m²·K)', { prune: true })),
    h('fieldset', { class: 'term' }, h('legend', {}, 'heater'),
      n('flux_W_m2', 'heat flux', 'W/m²', { placeholder: 'none' }),
      n('power_W', 'or power', 'W', { placeholder: 'none', hint: 'Heater power spread over the footprint.' })),
    h('fieldset', { class: 'term' }, h('legend', {}, 'air and radiation'),
      convectionField(store, `${p}.convection_W_m2K`),
      n('fluid_C', 'air', '°C', { placeholder: 'ambient' }),
      n('emissivity', 'emissivity', '0–1', { placeholder: '0' }),
      n('surroundings_C', 'surroundings', '°C', { placeholder: 'ambient' })),
    h('fieldset', { class: 'term' }, h('legend', {}, 'held face'),
      n('fixed_C', 'temperature', '°C', { placeholder: 'not held', hint: 'Holds the face at this temperature; excludes the other terms.' }))];
}

function segmentRow(store: DraftStore, side: Side, j: number): HTMLElement {
  const p = `${side}[${j}]`;
  const n = (path: string, label: string, unit: string | undefined, extra: { placeholder?: string; hint?: string; prune?: boolean } = {}) =>
    numberField(store, { path: `${p}.${path}`, label, unit, ...extra });
  const seg = asObject(store.get(p));
  const own = isObject(seg.heater) ? [heaterTerm(store, p, `${side}-heater-${j}`)]
    : isObject(seg.bench) ? [benchTerm(store, p, `${side}-bench-${j}`)] : [];
  // a heater or bench row shows the other terms only when a file gave some (the core names them; they can be cleared)
  const terms = own.length === 0 || NON_HEATER_TERMS.some((k) => k !== 'bench' && seg[k] !== undefined)
    ? [...own, ...termFields(n, store, p)] : own;
  const summary = h('span', { class: 'segment-summary' }, segmentSummary(store.get(p)));
  const row = h('div', { class: 'segment-row', 'data-testid': `${side}-row-${j}` },
    h('div', { class: 'segment-head' }, h('span', { class: 'segment-place' }, `row ${j + 1}`),
      n('from_s', 'from', 's', { hint: 'This row holds from this time until the next row starts.' }),
      kindField(store, p, `${side}-row-${j}-kind`),
      summary,
      button('✕', 'remove this row', () => store.change((x) => removeSegment(x, side, j)), { class: 'danger' })),
    h('div', { class: 'segment-terms' }, ...terms));
  const update = (): void => { summary.textContent = segmentSummary(store.get(p)); };
  row.addEventListener('input', update);
  row.addEventListener('change', update);
  return row;
}

function removeSegment(d: JsonObject, side: Side, j: number): void {
  const rows = asList(d[side]);
  rows.splice(j, 1);
  d[side] = rows;
}

function addSegment(d: JsonObject, side: Side): void {
  const rows = asList(d[side]);
  const last = asNumber(asObject(rows[rows.length - 1]).from_s);
  const duration = asNumber(d.duration_s);
  let from = last === undefined ? 0 : last + defaults.gapS;
  if (duration !== undefined && from > duration) from = duration;
  rows.push({ from_s: from, convection_W_m2K: 'natural' });
  d[side] = rows;
}

export function renderFaceEditor(root: HTMLElement, store: DraftStore, side: Side): void {
  const rows = asList(store.current()[side]);
  root.replaceChildren(
    ...rows.map((_, j) => segmentRow(store, side, j)),
    ...(rows.length === 0 ? [h('p', { class: 'note' }, 'No rows: this face is insulated (adiabatic).')] : []),
    h('div', { class: 'row-actions' },
      button(`+ ${side} row`, `add a row at the end of the ${side} face schedule`, () => store.change((x) => addSegment(x, side)))));
}
