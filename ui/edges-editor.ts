/**
 * The side walls: whether they lose heat (the scenario's `edges` key; README "Edge losses"), and how — convection
 * (the vertical-plate correlation, or a coefficient), the emissivity of the side surface, and an optional insulation
 * sleeve (a material that does not melt and its thickness in mm). Without the key the 1D stack's sides are adiabatic.
 * Unticking keeps the settings with `"loss": false` (the format's own way to switch them off). A field left empty is
 * "to fill in" (ui/incomplete.ts), not an error; a wrong value is the core's to name, beside its field.
 * Test hooks: `edges-loss`, `edges-convection`, `edges-h`, `edges-emissivity`, `edges-sleeve`, `edges-sleeve-material`,
 * `edges-sleeve-thickness`.
 */
import { libraryMaterial, libraryNames } from '../sim/index.ts';
import type { DraftStore } from './draft.ts';
import { h } from './dom.ts';
import { fieldWrapper, numberField } from './fields.ts';
import { inputText, parseNumberInput } from './format.ts';
import { asObject, isObject, type JsonObject } from './json.ts';

const PATH = 'edges';

/** The draft's `edges` object, created when absent. */
function edgesOf(d: JsonObject): JsonObject {
  if (!isObject(d.edges)) d.edges = {};
  return d.edges as JsonObject;
}

function lossBox(store: DraftStore): HTMLElement {
  const edges = store.get(PATH);
  const box = h('input', { type: 'checkbox', 'data-path': `${PATH}.loss`, 'data-testid': 'edges-loss', checked: isObject(edges) && edges.loss === true });
  box.addEventListener('change', () => store.change((d) => {
    const e = edgesOf(d);
    e.loss = box.checked;
    // a first switch-on asks for the one required setting left (the emissivity) and takes the correlation by default
    if (box.checked && e.convection_W_m2K === undefined) e.convection_W_m2K = 'natural';
  }));
  return h('label', { class: 'field check', title: 'Heat leaves through the side walls of the stack (each cell loses at its own temperature).' },
    box, h('span', { class: 'field-label' }, 'side walls lose heat'));
}

/** Convection from the side: the vertical-plate correlation (the default), or a coefficient. */
function convectionField(store: DraftStore): HTMLElement {
  const path = `${PATH}.convection_W_m2K`;
  const current = store.get(path);
  const fixed = typeof current !== 'string' && current !== undefined;
  const select = h('select', { 'aria-label': 'side-wall convection', 'data-testid': 'edges-convection' },
    h('option', { value: 'natural', selected: !fixed }, 'natural (still air, vertical plate)'),
    h('option', { value: 'fixed', selected: fixed }, 'coefficient h'));
  const input = h('input', { type: 'text', inputmode: 'decimal', 'data-path': path, 'data-testid': 'edges-h', 'aria-label': 'side-wall convection coefficient, W/(m²·K)', placeholder: 'h' });
  input.value = fixed ? inputText(current) : '';
  input.hidden = !fixed;
  select.addEventListener('change', () => {
    input.hidden = select.value !== 'fixed';
    if (select.value === 'natural') store.setField(path, 'natural', { source: input });
    else {
      input.value = '';
      store.setField(path, undefined, { source: input });
      input.focus();
    }
  });
  input.addEventListener('input', () => store.setField(path, parseNumberInput(input.value), { source: input }));
  return fieldWrapper('convection', 'W/(m²·K)', 'Natural: Churchill & Chu for a vertical plate as tall as the stack, air at the ambient temperature. Or a coefficient of your own.', select, input);
}

/** Library materials that do not melt (a sleeve must stay solid), after the file's own materials. */
function sleeveChoices(draft: JsonObject): { value: string; label: string }[] {
  const own = Object.keys(asObject(draft.materials)).map((n) => ({ value: n, label: `${n} (in this file)` }));
  const library = libraryNames().filter((n) => libraryMaterial(n)?.melt === undefined).map((n) => ({ value: n, label: n }));
  return [...own, ...library];
}

function sleeveFields(store: DraftStore): HTMLElement[] {
  const sleeve = store.get(`${PATH}.sleeve`);
  const box = h('input', { type: 'checkbox', 'data-testid': 'edges-sleeve', checked: isObject(sleeve) });
  box.addEventListener('change', () => store.change((d) => {
    const e = edgesOf(d);
    // a new sleeve starts empty: its material and thickness are "to fill in"
    if (box.checked) e.sleeve = {};
    else delete e.sleeve;
  }));
  const toggle = h('label', { class: 'field check', title: 'An insulation sleeve round the stack, a series resistance (its heat capacity left out).' },
    box, h('span', { class: 'field-label' }, 'insulation sleeve'));
  if (!isObject(sleeve)) return [toggle];
  const path = `${PATH}.sleeve.material`;
  const current = inputText(store.get(path));
  const choices = sleeveChoices(store.current());
  const select = h('select', { 'data-path': path, 'data-testid': 'edges-sleeve-material', 'aria-label': 'sleeve material' },
    h('option', { value: '', selected: current === '' }, '(choose a material)'),
    ...(current !== '' && !choices.some((c) => c.value === current) ? [h('option', { value: current, selected: true }, `${current} — not found`)] : []),
    ...choices.map((c) => h('option', { value: c.value, selected: c.value === current }, c.label)));
  select.addEventListener('change', () => store.setField(path, select.value === '' ? undefined : select.value, { source: select }));
  return [toggle,
    fieldWrapper('sleeve material', undefined, 'Library materials that do not melt, after the file\'s own.', select),
    numberField(store, { path: `${PATH}.sleeve.thickness_mm`, label: 'sleeve thickness', unit: 'mm', testid: 'edges-sleeve-thickness' })];
}

export function renderEdgesEditor(root: HTMLElement, store: DraftStore): void {
  const edges = store.get(PATH);
  if (!isObject(edges)) {
    root.replaceChildren(h('div', { class: 'setup-grid edges', 'data-path-group': PATH }, lossBox(store),
      h('p', { class: 'note' }, 'Off: the side walls are insulated (adiabatic), as a 1D stack assumes.')));
    return;
  }
  root.replaceChildren(h('div', { class: 'setup-grid edges', 'data-path-group': PATH },
    lossBox(store),
    convectionField(store),
    numberField(store, { path: `${PATH}.emissivity`, label: 'emissivity', unit: '0–1', testid: 'edges-emissivity', hint: 'Of the side surface (the sleeve\'s outer surface when there is one), radiating to surroundings at the ambient temperature.' }),
    ...sleeveFields(store),
    h('p', { class: 'note' }, edges.loss === true
      ? 'Each cell loses heat through the side walls at its own temperature, to air and surroundings at the ambient; the energy balance gains side-wall rows. Needs the footprint.'
      : 'Off: the settings are kept ("loss": false) and the side walls are insulated (adiabatic).')));
}
