/**
 * The layer stack, drawn top layer first (as it sits on the bench): per layer its id, material, thickness, the
 * separator flag and any volumetric heat source; between neighbours the contact resistance. A layer's material may be a
 * salt-soaked matrix of the file's own (composite-editor.ts), edited in a panel under the layer. Test hooks:
 * `layer-row-<i>`, `layer-thickness-<i>`, `layer-material-<i>`, with i the index in the file (0 = bottom).
 */
import { layerColours } from './colours.ts';
import type { DraftStore } from './draft.ts';
import { button, h } from './dom.ts';
import { checkField, numberField, selectField, stringField } from './fields.ts';
import { inputText } from './format.ts';
import { asList, asObject, asString, isObject, type JsonObject } from './json.ts';
import { addComposite, compositeEntry, compositePanel, NEW_COMPOSITE } from './composite-editor.ts';
import { materialCard } from './material-card.ts';
import { materialChoices, materialInfo } from './materials.ts';
import { sourceRows } from './source-rows.ts';
import { addLayer, contactIndex, moveLayer, removeLayer, renameLayer, setContact } from './stack-ops.ts';

const NEW_LAYER_MATERIAL = 'alumina';

function contactRow(store: DraftStore, i: number): HTMLElement {
  const d = store.current();
  const layers = asList(d.layers);
  const below = asString(asObject(layers[i]).id) ?? '';
  const above = asString(asObject(layers[i + 1]).id) ?? '';
  const k = contactIndex(d, i);
  const path = k >= 0 ? `contacts[${k}].resistance_m2K_W` : `(contact ${i})`;
  const field = numberField(store, {
    path, label: `contact resistance ${above} / ${below}`, unit: 'm²·K/W', placeholder: 'perfect',
    hint: 'Thermal contact resistance of the interface; leave empty for perfect contact.',
    write: (value, input) => {
      store.editField(path, (draft) => setContact(draft, i, value), input);
      const now = contactIndex(store.current(), i);
      input.setAttribute('data-path', now >= 0 ? `contacts[${now}].resistance_m2K_W` : `(contact ${i})`);
    },
  });
  const input = field.querySelector('input');
  if (input && k >= 0) input.value = inputText(asObject(asList(d.contacts)[k]).resistance_m2K_W);
  return h('div', { class: 'contact-row' }, field);
}

function layerRow(store: DraftStore, i: number, count: number, tell: Tell, colour: string | undefined): HTMLElement {
  const d = store.current();
  const layer = asObject(asList(d.layers)[i]);
  const base = `layers[${i}]`;
  const materialName = asString(layer.material) ?? '';
  const place = count === 1 ? 'only layer' : i === 0 ? 'bottom' : i === count - 1 ? 'top' : `layer ${i + 1}`;
  const controls = h('div', { class: 'layer-controls' },
    button('▲', 'move this layer up', () => structural(store, tell, (x) => moveLayer(x, i, 1)), { disabled: i === count - 1 }),
    button('▼', 'move this layer down', () => structural(store, tell, (x) => moveLayer(x, i, -1)), { disabled: i === 0 }),
    button('✕', 'remove this layer', () => structural(store, tell, (x) => removeLayer(x, i)), { disabled: count === 1, class: 'danger' }));
  const fields = h('div', { class: 'layer-fields' },
    stringField(store, {
      path: `${base}.id`, label: 'id',
      write: (value, input) => store.editField(`${base}.id`, (x) => renameLayer(x, i, typeof value === 'string' ? value : ''), input),
    }),
    selectField(store, {
      path: `${base}.material`, label: 'material', testid: `layer-material-${i}`,
      choices: [...materialChoices(d).map((c) => ({ value: c.name, label: c.label })),
        { value: NEW_COMPOSITE, label: 'salt-soaked matrix (new: matrix + salt, porosity, fill)' }],
      write: (value) => store.change((x) => { if (value === NEW_COMPOSITE) addComposite(x, i); else setMaterial(x, i, value); }),
    }),
    numberField(store, { path: `${base}.thickness_mm`, label: 'thickness', unit: 'mm', testid: `layer-thickness-${i}` }),
    checkField(store, { path: `${base}.separator`, label: 'separator', hint: 'The molten-salt layer whose melting and freezing set the usable window.' }));
  return h('div', { class: `layer-row${layer.separator === true ? ' is-separator' : ''}`, 'data-testid': `layer-row-${i}`,
    style: colour ? `border-left-color: ${colour}` : undefined, 'data-colour': colour },
    h('div', { class: 'layer-head' }, h('span', { class: 'layer-place' }, place), fields, controls),
    compositeEntry(d, materialName) ? compositePanel(store, i, materialName) : materialCard(materialInfo(d, materialName)),
    sourceRows(store, i));
}

function setMaterial(d: JsonObject, i: number, value: unknown): void {
  const layer = asList(d.layers)[i];
  if (isObject(layer) && typeof value === 'string') layer.material = value;
}

/** Shows a message to the person (the page's notice line). */
export type Tell = (message: string) => void;

/** A structural edit whose dropped contacts, if any, are reported. */
function structural(store: DraftStore, tell: Tell, edit: (d: JsonObject) => string[]): void {
  let notes: string[] = [];
  store.change((x) => { notes = edit(x); });
  if (notes.length > 0) tell(notes.join(' '));
}

export function renderStackEditor(root: HTMLElement, store: DraftStore, tell: Tell): void {
  const layers = asList(store.current().layers);
  const ids = layers.map((l, i) => asString(asObject(l).id) ?? `layer ${i + 1}`);
  const colours = layerColours(ids);
  const rows: HTMLElement[] = [];
  for (let i = layers.length - 1; i >= 0; i--) {
    rows.push(layerRow(store, i, layers.length, tell, colours.get(ids[i]!)));
    if (i > 0) rows.push(contactRow(store, i - 1));
  }
  root.replaceChildren(
    h('div', { class: 'stack-rows' }, ...rows),
    h('div', { class: 'row-actions' },
      button('+ layer on top', 'add a layer on top of the stack', () => structural(store, tell, (x) => addLayer(x, NEW_LAYER_MATERIAL)))));
}
