/**
 * A face row of the kind "heater body" (the segment's `heater` key; README "A heater with a body"): the electric power
 * limit, the plate under the stack (a material that does not melt and its thickness), the contact conductance to the
 * face, an optional loss to the air, and the control — constant power, on-off with a band, or PI — with its sensor
 * (the plate or a layer of the stack) and its set-point: one value, or a schedule of ramps and holds (time, °C rows,
 * linear between points). A field left empty is "to fill in" (ui/incomplete.ts), a wrong value is the core's to name
 * beside its field. Test hooks: `<side>-heater-<j>-<what>` (power, material, thickness, contact, loss, control,
 * set-point-mode, set-point, band, gain, integral, period, sensor, point-<k>-at, point-<k>-C, add-point).
 */
import { kToC, libraryMaterial, libraryNames } from '../sim/index.ts';
import type { DraftStore } from './draft.ts';
import { button, h } from './dom.ts';
import { fieldWrapper, numberField } from './fields.ts';
import { formatNumber, inputText } from './format.ts';
import { asList, asObject, isObject, type JsonObject } from './json.ts';
import { getAt } from './paths.ts';

/** The terms a heater row excludes (the core refuses them beside `heater`: sim/scenario/heater-input.ts; and `bench`). */
export const NON_HEATER_TERMS = ['flux_W_m2', 'power_W', 'convection_W_m2K', 'fluid_C', 'emissivity', 'surroundings_C', 'plate', 'fixed_C', 'bench'] as const;

type ControlKind = 'constant' | 'on-off' | 'pi';

/** The heater object at `path` in the draft, created when absent. */
function heaterAt(d: JsonObject, path: string): JsonObject {
  const row = asObject(getAt(d, path.replace(/\.heater$/, '')));
  if (!isObject(row.heater)) row.heater = {};
  return row.heater as JsonObject;
}

/**
 * Plate materials: the file's own, then the library's solids that never melt, then those that melt far above a cell's
 * service (metals), labelled with their solidus, highest first. The core refuses a plate that would reach its solidus.
 */
export function plateChoices(draft: JsonObject): { value: string; label: string }[] {
  const own = Object.keys(asObject(draft.materials)).map((n) => ({ value: n, label: `${n} (in this file)` }));
  const library = libraryNames().map((n) => ({ n, solidusK: libraryMaterial(n)?.melt?.solidusK }));
  const solid = library.filter((m) => m.solidusK === undefined).map((m) => ({ value: m.n, label: m.n }));
  const melting = library.filter((m): m is { n: string; solidusK: number } => m.solidusK !== undefined)
    .sort((a, b) => b.solidusK - a.solidusK)
    .map((m) => ({ value: m.n, label: `${m.n} (solid to ${formatNumber(kToC(m.solidusK), { decimals: 0 })} °C)` }));
  return [...own, ...solid, ...melting];
}

/** A select bound to `path`: an empty first choice (the field is then "to fill in"), a value not offered kept as found. */
export function choiceField(store: DraftStore, path: string, testid: string, label: string, hint: string, empty: string,
  choices: readonly { value: string; label: string }[]): HTMLElement {
  const current = inputText(store.get(path));
  const select = h('select', { 'data-path': path, 'data-testid': testid, 'aria-label': label },
    h('option', { value: '', selected: current === '' }, empty),
    ...(current !== '' && !choices.some((c) => c.value === current) ? [h('option', { value: current, selected: true }, `${current} — not found`)] : []),
    ...choices.map((c) => h('option', { value: c.value, selected: c.value === current }, c.label)));
  select.addEventListener('change', () => store.setField(path, select.value === '' ? undefined : select.value, { source: select }));
  return fieldWrapper(label, undefined, hint, select);
}

/** The control kind: switching keeps the sensor and the set-point, drops what the new kind does not take. */
function controlKindField(store: DraftStore, p: string, testid: string): HTMLElement {
  const kind = asObject(store.get(`${p}.control`)).kind;
  const select = h('select', { 'data-path': `${p}.control.kind`, 'data-testid': testid, 'aria-label': 'control' },
    h('option', { value: 'constant', selected: kind === 'constant' }, 'constant power'),
    h('option', { value: 'on-off', selected: kind === 'on-off' }, 'on-off (thermostat with a band)'),
    h('option', { value: 'pi', selected: kind === 'pi' }, 'PI (proportional–integral)'));
  select.addEventListener('change', () => store.change((d) => {
    const heater = heaterAt(d, p);
    const old = asObject(heater.control);
    const next = select.value as ControlKind;
    if (next === 'constant') {
      heater.control = { kind: 'constant' };
      delete heater.set_points;
      return;
    }
    // a new control's own numbers start empty ("to fill in"); the sensor starts on the plate, shown in its select
    const control: JsonObject = { kind: next };
    if (old.set_point_C !== undefined) control.set_point_C = old.set_point_C;
    control.sensor = typeof old.sensor === 'string' ? old.sensor : 'plate';
    heater.control = control;
  }));
  return fieldWrapper('control', undefined, 'Constant: full power while the cell is on the heater. On-off: full power until the sensor reaches the set-point, none until it falls by the band. PI: power from the error and its integral, sampled.', select);
}

/** One value in the control, or a schedule of (time, °C) points in `heater.set_points`. */
function setPointFields(store: DraftStore, p: string, id: string): HTMLElement[] {
  const points = store.get(`${p}.set_points`);
  const schedule = Array.isArray(points);
  const mode = h('select', { 'data-testid': `${id}-set-point-mode`, 'aria-label': 'set-point' },
    h('option', { value: 'one', selected: !schedule }, 'one value'),
    h('option', { value: 'schedule', selected: schedule }, 'ramps and holds'));
  mode.addEventListener('change', () => store.change((d) => {
    const heater = heaterAt(d, p);
    if (mode.value === 'schedule') {
      const control = asObject(heater.control);
      // the value given so far becomes the first point, at 0 s; otherwise the first point is "to fill in"
      heater.set_points = [control.set_point_C === undefined ? { at_s: 0 } : { at_s: 0, set_point_C: control.set_point_C }];
      delete control.set_point_C;
    } else {
      delete heater.set_points;
    }
  }));
  const modeField = fieldWrapper('set-point', undefined, 'One set-point for the whole run, or points of a schedule, linear between them, held before the first and after the last.', mode);
  if (!schedule) {
    return [modeField, numberField(store, { path: `${p}.control.set_point_C`, label: 'set-point', unit: '°C', testid: `${id}-set-point` })];
  }
  const rows = asList(points).map((_, k) => h('div', { class: 'heater-point', 'data-testid': `${id}-point-${k}` },
    numberField(store, { path: `${p}.set_points[${k}].at_s`, label: 'at', unit: 's', testid: `${id}-point-${k}-at` }),
    numberField(store, { path: `${p}.set_points[${k}].set_point_C`, label: 'set-point', unit: '°C', testid: `${id}-point-${k}-C` }),
    button('✕', 'remove this point', () => store.change((d) => {
      const list = asList(heaterAt(d, p).set_points);
      list.splice(k, 1);
      heaterAt(d, p).set_points = list;
    }), { class: 'danger' })));
  return [modeField, h('div', { class: 'heater-points', 'data-path-group': `${p}.set_points` }, ...rows,
    button('+ point', 'add a set-point at the end of the schedule', () => store.change((d) => {
      const list = asList(heaterAt(d, p).set_points);
      list.push({});
      heaterAt(d, p).set_points = list;
    // the button carries the schedule's path, so the core's message about the list itself (none left) stands beside it
    }), { 'data-testid': `${id}-add-point`, 'data-path': `${p}.set_points` }))];
}

function controlFields(store: DraftStore, p: string, id: string): HTMLElement[] {
  const kind = asObject(store.get(`${p}.control`)).kind;
  if (kind !== 'on-off' && kind !== 'pi') return [];
  const layers = asList(store.current().layers).map((l) => inputText(asObject(l).id)).filter((l) => l !== '');
  const sensor = choiceField(store, `${p}.control.sensor`, `${id}-sensor`, 'sensor',
    'What the controller reads: the plate, or the mean temperature of a layer.', '(choose a sensor)',
    [{ value: 'plate', label: 'the plate' }, ...layers.map((l) => ({ value: l, label: `layer ${l} (mean)` }))]);
  const own = kind === 'on-off'
    ? [numberField(store, { path: `${p}.control.band_K`, label: 'band', unit: 'K', testid: `${id}-band`, hint: 'Power off at the set-point, on again when the sensor has fallen by this much.' })]
    : [numberField(store, { path: `${p}.control.gain_W_K`, label: 'gain', unit: 'W/K', testid: `${id}-gain` }),
        numberField(store, { path: `${p}.control.integral_s`, label: 'integral time', unit: 's', testid: `${id}-integral` }),
        numberField(store, { path: `${p}.control.period_s`, label: 'sample period', unit: 's', testid: `${id}-period`, placeholder: '1', hint: 'How often the controller reads the sensor (each sample is a solver step).' })];
  return [...setPointFields(store, p, id), ...own, sensor];
}

/** The fieldset of a heater row; `p` is the row's path (`bottom[0]`). */
export function heaterTerm(store: DraftStore, rowPath: string, id: string): HTMLElement {
  const p = `${rowPath}.heater`;
  return h('fieldset', { class: 'term heater-body', 'data-path-group': p }, h('legend', {}, 'heater body'),
    numberField(store, { path: `${p}.power_W`, label: 'power', unit: 'W', testid: `${id}-power`, hint: 'Electric power limit of the heater, spread over the footprint.' }),
    choiceField(store, `${p}.plate.material`, `${id}-material`, 'plate material',
      'The plate under the stack: library materials that do not melt, after the file\'s own.', '(choose a material)', plateChoices(store.current())),
    numberField(store, { path: `${p}.plate.thickness_mm`, label: 'plate thickness', unit: 'mm', testid: `${id}-thickness` }),
    numberField(store, { path: `${p}.contact_W_m2K`, label: 'contact conductance', unit: 'W/(m²·K)', testid: `${id}-contact`, hint: 'Between the plate and the face of the stack.' }),
    numberField(store, { path: `${p}.loss_W_m2K`, label: 'loss to air', unit: 'W/(m²·K)', testid: `${id}-loss`, placeholder: '0 (none)', hint: 'Heat the plate loses to the air at ambient, per m² of footprint (optional).' }),
    controlKindField(store, p, `${id}-control`),
    ...controlFields(store, p, id));
}

export type RowKind = 'terms' | 'heater' | 'bench';

/**
 * Makes row `rowPath` a heater body or a bench surface (the other terms go: the core refuses them beside either), or
 * a row of terms (the heater and the bench go).
 */
export function setRowKind(d: JsonObject, rowPath: string, kind: RowKind): void {
  const row = asObject(getAt(d, rowPath));
  if (kind === 'terms') {
    delete row.heater;
    delete row.bench;
    return;
  }
  for (const k of NON_HEATER_TERMS) if (k !== kind) delete row[k];
  delete row[kind === 'heater' ? 'bench' : 'heater'];
  // new fields start empty ("to fill in"); a new heater runs at constant power until another control is chosen
  if (kind === 'heater' && !isObject(row.heater)) row.heater = { control: { kind: 'constant' } };
  if (kind === 'bench' && !isObject(row.bench)) row.bench = {};
}

/** Paths of the required heater fields left empty, in the solver's path notation (ui/incomplete.ts). */
export function heaterFieldsToFill(draft: JsonObject): string[] {
  const out: string[] = [];
  for (const side of ['bottom', 'top'] as const) {
    asList(draft[side]).forEach((row, j) => {
      const heater = asObject(row).heater;
      if (!isObject(heater)) return;
      const p = `${side}[${j}].heater`;
      for (const k of ['power_W', 'contact_W_m2K']) if (!Object.hasOwn(heater, k)) out.push(`${p}.${k}`);
      const plate = asObject(heater.plate);
      for (const k of ['material', 'thickness_mm']) if (!Object.hasOwn(plate, k)) out.push(`${p}.plate.${k}`);
      const control = asObject(heater.control);
      if (control.kind !== 'on-off' && control.kind !== 'pi') return;
      const own = control.kind === 'on-off' ? ['band_K', 'sensor'] : ['gain_W_K', 'integral_s', 'sensor'];
      for (const k of own) if (!Object.hasOwn(control, k)) out.push(`${p}.control.${k}`);
      if (Array.isArray(heater.set_points)) {
        heater.set_points.forEach((pt, k) => {
          for (const key of ['at_s', 'set_point_C']) if (!Object.hasOwn(asObject(pt), key)) out.push(`${p}.set_points[${k}].${key}`);
        });
      } else if (!Object.hasOwn(control, 'set_point_C')) out.push(`${p}.control.set_point_C`);
    });
  }
  return out;
}
