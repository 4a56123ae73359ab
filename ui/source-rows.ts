/**
 * A layer's volumetric heat source: a list of intervals [from, to) each with a value (or one constant value for the
 * whole run, as a file may give it). Adding the first interval creates the list; removing the last removes it.
 * A new interval starts at 0 s with its value and end empty, "to fill in" (ui/incomplete.ts): nothing runs until
 * they are. The value is typed in W/m³, W over the footprint or W/kg (a selector per row) and stored in W/m³; the
 * other units are shown beside it. Test hooks: `source-unit-<i>-<j>`, `source-also-<i>-<j>`.
 */
import type { DraftStore } from './draft.ts';
import { button, h } from './dom.ts';
import { fieldWrapper, numberField } from './fields.ts';
import { formatNumber } from './format.ts';
import { asList, asNumber, asObject, asString, isObject, type JsonObject } from './json.ts';
import { materialInfo } from './materials.ts';
import { footprintAreaM2, shownIn, SOURCE_UNITS, toWPerM3, unitUnavailable, type SourceContext, type SourceUnit } from './source-units.ts';

/** The unit chosen on each row (view state, not part of the file), by layer id and row. */
const chosenUnits = new Map<string, SourceUnit>();

function layerAt(d: JsonObject, i: number): JsonObject | undefined {
  const l = asList(d.layers)[i];
  return isObject(l) ? l : undefined;
}

function addInterval(d: JsonObject, i: number): void {
  const layer = layerAt(d, i);
  if (!layer) return;
  const interval = { from_s: 0 };
  if (typeof layer.source_W_m3 === 'number') {
    const duration = asNumber(d.duration_s);
    layer.source_W_m3 = [{ from_s: 0, ...(duration !== undefined ? { to_s: duration } : {}), value: layer.source_W_m3 }, interval];
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

function context(store: DraftStore, i: number): SourceContext {
  const d = store.current();
  const layer = asObject(asList(d.layers)[i]);
  return { areaM2: footprintAreaM2(d), thicknessMm: asNumber(layer.thickness_mm), material: materialInfo(d, asString(layer.material) ?? '') };
}

/**
 * Three significant figures in plain decimals below 10⁷ ("679000", not "6.79e+5", which toPrecision gives once the
 * exponent reaches the digit count), exponent form beyond, as formatNumber does.
 */
const threeFigures = (v: number): string => formatNumber(Number(v.toPrecision(3)), { significant: 15 });

/** The stored value in the units not chosen, e.g. "= 0.49 W total · 575 W/kg". */
function alsoText(wPerM3: unknown, chosen: SourceUnit, c: SourceContext): string {
  if (typeof wPerM3 !== 'number' || !Number.isFinite(wPerM3)) return '';
  const parts = SOURCE_UNITS.filter((u) => u.unit !== chosen).flatMap((u) => {
    const f = toWPerM3(u.unit, c);
    return f === undefined ? [] : [`${threeFigures(wPerM3 / f)} ${u.label}`];
  });
  return parts.length > 0 ? `= ${parts.join(' · ')}` : '';
}

/** The value field with its unit selector and the value in the other units. */
function valueField(store: DraftStore, i: number, j: number | undefined, path: string, label: string): HTMLElement {
  const key = `${asString(asObject(asList(store.current().layers)[i]).id) ?? i}|${j ?? 'whole'}`;
  const hook = `${i}-${j ?? 'whole'}`;
  const also = h('span', { class: 'source-also note', 'data-testid': `source-also-${hook}`, 'data-source-path': path });
  let unit: SourceUnit = chosenUnits.get(key) ?? 'W/m³';
  if (unitUnavailable(unit, context(store, i)) !== undefined) unit = 'W/m³';
  const field = numberField(store, {
    path, label, unit: undefined,
    write: (value, input) => {
      const f = toWPerM3(unit, context(store, i));
      store.setField(path, typeof value === 'number' && f !== undefined ? value * f : value, { source: input });
      also.textContent = alsoText(store.get(path), unit, context(store, i));
    },
  });
  const input = field.querySelector('input')!;
  const show = (): void => {
    const c = context(store, i);
    const stored = store.get(path);
    if (typeof stored === 'number') input.value = shownIn(unit, stored, c) ?? input.value;
    also.textContent = alsoText(stored, unit, c);
  };
  const c0 = context(store, i);
  const select = h('select', { 'aria-label': 'unit of the heat source', 'data-testid': `source-unit-${hook}` },
    ...SOURCE_UNITS.map((u) => {
      const why = unitUnavailable(u.unit, c0);
      return h('option', { value: u.unit, selected: u.unit === unit, disabled: why !== undefined, title: why }, why ? `${u.label} (${why})` : u.label);
    }));
  select.addEventListener('change', () => {
    unit = select.value as SourceUnit;
    chosenUnits.set(key, unit);
    show();
  });
  show();
  return h('span', { class: 'source-value' }, field, fieldWrapper('unit', undefined, 'W/m³ is what the file keeps; W is the layer\'s total over the footprint.', select), also);
}

/** Brings the "in other units" notes up to date after an edit elsewhere (thickness, footprint, material). */
export function refreshSourceNotes(root: ParentNode, store: DraftStore): void {
  for (const also of root.querySelectorAll<HTMLElement>('.source-also[data-source-path]')) {
    const path = also.getAttribute('data-source-path') ?? '';
    const i = Number(/^layers\[(\d+)\]/.exec(path)?.[1] ?? NaN);
    const select = also.parentElement?.querySelector('select');
    if (!Number.isInteger(i) || !select) continue;
    also.textContent = alsoText(store.get(path), select.value as SourceUnit, context(store, i));
  }
}

export function sourceRows(store: DraftStore, i: number): HTMLElement {
  const layer = asObject(asList(store.current().layers)[i]);
  const base = `layers[${i}].source_W_m3`;
  const rows: HTMLElement[] = [];
  const src = layer.source_W_m3;
  if (src !== undefined && !Array.isArray(src)) {
    rows.push(h('div', { class: 'source-row' },
      valueField(store, i, undefined, base, 'heat source, whole run'),
      button('✕', 'remove this heat source', () => store.change((x) => removeInterval(x, i, undefined)), { class: 'danger' })));
  }
  asList(src).forEach((_, j) => {
    const p = `${base}[${j}]`;
    rows.push(h('div', { class: 'source-row' },
      valueField(store, i, j, `${p}.value`, 'heat source'),
      numberField(store, { path: `${p}.from_s`, label: 'from', unit: 's' }),
      numberField(store, { path: `${p}.to_s`, label: 'to', unit: 's' }),
      button('✕', 'remove this heat source', () => store.change((x) => removeInterval(x, i, j)), { class: 'danger' })));
  });
  return h('div', { class: 'layer-sources' }, ...rows,
    button('+ heat source', 'add a volumetric heat source in this layer (fill in its value and time interval)',
      () => store.change((x) => addInterval(x, i)), { class: 'quiet' }));
}
