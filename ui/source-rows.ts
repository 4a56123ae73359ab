/**
 * A layer's volumetric heat source, W/m³: a list of intervals [from, to) each with a value (or one constant value for
 * the whole run, as a file may give it). Adding the first interval creates the list; removing the last removes it.
 */
import type { DraftStore } from './draft.ts';
import { button, h } from './dom.ts';
import { numberField } from './fields.ts';
import { asList, asNumber, asObject, isObject, type JsonObject } from './json.ts';

const defaults = {
  /** A new source: 1 MW/m³ for the first minute, a size that shows on a coupon without melting it. */
  valueWPerM3: 1e6,
  toS: 60,
} as const;

function layerAt(d: JsonObject, i: number): JsonObject | undefined {
  const l = asList(d.layers)[i];
  return isObject(l) ? l : undefined;
}

function addInterval(d: JsonObject, i: number): void {
  const layer = layerAt(d, i);
  if (!layer) return;
  const duration = asNumber(d.duration_s);
  const interval = { from_s: 0, to_s: duration !== undefined ? Math.min(defaults.toS, duration) : defaults.toS, value: defaults.valueWPerM3 };
  if (typeof layer.source_W_m3 === 'number') {
    layer.source_W_m3 = [{ from_s: 0, to_s: duration ?? defaults.toS, value: layer.source_W_m3 }, interval];
  } else if (Array.isArray(layer.source_W_m3)) {
    layer.source_W_m3.push(interval);
  } else {
    layer.source_W_m3 = [interval];
  }
}

function removeInterval(d: JsonObject, i: number, j: number | undefined): void {
  const layer = layerAt(d, i);
  if (!layer) return;
  if (j === undefined || !Array.isArray(layer.source_W_m3)) { delete layer.source_W_m3; return; }
  layer.source_W_m3.splice(j, 1);
  if (layer.source_W_m3.length === 0) delete layer.source_W_m3;
}

export function sourceRows(store: DraftStore, i: number): HTMLElement {
  const layer = asObject(asList(store.current().layers)[i]);
  const base = `layers[${i}].source_W_m3`;
  const rows: HTMLElement[] = [];
  const src = layer.source_W_m3;
  if (src !== undefined && !Array.isArray(src)) {
    rows.push(h('div', { class: 'source-row' },
      numberField(store, { path: base, label: 'heat source, whole run', unit: 'W/m³' }),
      button('✕', 'remove this heat source', () => store.change((x) => removeInterval(x, i, undefined)), { class: 'danger' })));
  }
  asList(src).forEach((_, j) => {
    const p = `${base}[${j}]`;
    rows.push(h('div', { class: 'source-row' },
      numberField(store, { path: `${p}.value`, label: 'heat source', unit: 'W/m³' }),
      numberField(store, { path: `${p}.from_s`, label: 'from', unit: 's' }),
      numberField(store, { path: `${p}.to_s`, label: 'to', unit: 's' }),
      button('✕', 'remove this heat source', () => store.change((x) => removeInterval(x, i, j)), { class: 'danger' })));
  });
  return h('div', { class: 'layer-sources' }, ...rows,
    button('+ heat source', 'add a volumetric heat source in this layer (W/m³ over a time interval)',
      () => store.change((x) => addInterval(x, i)), { class: 'quiet' }));
}
