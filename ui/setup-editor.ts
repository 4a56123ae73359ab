/**
 * The run's setting: name, ambient and initial temperature, footprint, duration, and the one-line heater control
 * ("heat off at", the wording table's term; test hook `heat-off-s`), which moves every heat input that ends at heat off
 * together, by the core's rule (ui/heat-off.ts): the `from_s` of the bottom row where the heating ends — the same value
 * as that row's own "from" field, kept in step with it — and the `to_s` of Joule, W/kg and source heat ending then.
 */
import { accuracyPlan, verdictTerms } from '../sim/index.ts';
import type { DraftStore } from './draft.ts';
import { h } from './dom.ts';
import { fieldWrapper, numberField, stringField, syncPeers } from './fields.ts';
import { inputText, parseNumberInput } from './format.ts';
import { asNumber, asObject } from './json.ts';
import { heatOffFieldWords, heatOffFields, setHeatOff } from './heat-off.ts';
import { probesField } from './probes-field.ts';

function footprintFields(store: DraftStore): HTMLElement {
  const fp = asObject(store.get('footprint'));
  const kind = 'width_mm' in fp || 'length_mm' in fp ? 'rectangle' : store.get('footprint') === undefined ? 'none' : 'disc';
  const select = h('select', { 'aria-label': 'footprint shape' },
    h('option', { value: 'disc', selected: kind === 'disc' }, 'disc'),
    h('option', { value: 'rectangle', selected: kind === 'rectangle' }, 'rectangle'),
    h('option', { value: 'none', selected: kind === 'none' }, 'not given'));
  select.addEventListener('change', () => store.change((d) => {
    const old = asObject(d.footprint);
    const size = asNumber(old.diameter_mm) ?? asNumber(old.width_mm) ?? 25;
    if (select.value === 'disc') d.footprint = { diameter_mm: size };
    else if (select.value === 'rectangle') d.footprint = { width_mm: size, length_mm: asNumber(old.length_mm) ?? size };
    else delete d.footprint;
  }));
  const fields = kind === 'disc' ? [numberField(store, { path: 'footprint.diameter_mm', label: 'diameter', unit: 'mm' })]
    : kind === 'rectangle' ? [numberField(store, { path: 'footprint.width_mm', label: 'width', unit: 'mm' }),
      numberField(store, { path: 'footprint.length_mm', label: 'length', unit: 'mm' })] : [];
  return h('div', { class: 'footprint', 'data-path-group': 'footprint' },
    fieldWrapper('footprint', undefined, 'Used by the natural-convection correlation and to turn heater power (W) into flux (W/m²).', select),
    ...fields);
}

export interface SetupEditor {
  /** Re-points the heater control after the bottom schedule changed. */
  readonly refresh: () => void;
}

/** The accuracy a run without `numerics.event_accuracy_s` states, s, by the core's rule (its defaults). */
function defaultAccuracyS(durationS: number | undefined): number | undefined {
  if (durationS === undefined || !(durationS > 0)) return undefined;
  const plan = accuracyPlan({ eventAccuracyS: undefined, durationS, ownGrid: false, ownTolerances: false, baseCells: 0, maxCells: Infinity });
  return 'error' in plan ? undefined : plan.eventAccuracyS;
}

/** The last list of fields the heat-off control moved: kept across redraws while it still holds one value. */
let heatOffKept: readonly string[] | undefined;

export function renderSetupEditor(root: HTMLElement, store: DraftStore): SetupEditor {
  const heatOff = h('input', { type: 'text', inputmode: 'decimal', 'data-testid': 'heat-off-s', 'aria-label': `${verdictTerms.heat_off_s.term}, s` });
  const heatOffNote = h('span', { class: 'note', 'data-testid': 'heat-off-note' });
  heatOff.addEventListener('input', () => {
    const paths = heatOffKept;
    if (!paths || paths.length === 0) return;
    const value = parseNumberInput(heatOff.value);
    store.editField(paths[0]!, (d) => setHeatOff(d, paths, value), heatOff);
    // the rows' own fields for the other paths show the moved value too
    const editor = root.closest('.editor') ?? document;
    for (const p of paths.slice(1)) syncPeers(editor, store, p, heatOff);
  });
  const accuracy = numberField(store, {
    path: 'numerics.event_accuracy_s', label: 'event-time accuracy', unit: 's', testid: 'event-accuracy-s', prune: true,
    hint: 'How close the molten, half-frozen and frozen times should be. A smaller value refines the grid and the steps (slower runs); a larger one than the default loosens the steps (faster runs). Empty: the default, which keeps the default grid and tolerances.',
  });
  const accuracyInput = accuracy.querySelector('input');
  // room for its placeholder, "default 0.936"
  accuracyInput?.classList.add('medium');
  const refresh = (): void => {
    const byDefault = defaultAccuracyS(asNumber(store.get('duration_s')));
    accuracyInput?.setAttribute('placeholder', byDefault === undefined ? 'default' : `default ${Number(byDefault.toPrecision(3))}`);
    const found = heatOffFields(store.current(), heatOffKept, document.activeElement === heatOff);
    if ('reason' in found) {
      heatOffKept = undefined;
      heatOff.removeAttribute('data-path');
      heatOff.removeAttribute('data-also-paths');
      heatOff.disabled = true;
      heatOff.value = '';
      heatOffNote.textContent = `Not available: ${found.reason}.`;
      return;
    }
    const path = found.paths[0];
    heatOffKept = found.paths;
    if (path === undefined) {
      heatOff.removeAttribute('data-path');
      heatOff.disabled = true;
    } else {
      heatOff.disabled = false;
      if (heatOff.getAttribute('data-path') !== path || document.activeElement !== heatOff) heatOff.value = inputText(store.get(path));
      heatOff.setAttribute('data-path', path);
    }
    // the control's field shows the core's errors about every field it moves (ui/errors-view.ts)
    heatOff.setAttribute('data-also-paths', found.paths.slice(1).join(' '));
    const draft = store.current();
    const moves = found.paths.length === 0 ? 'nothing it can move' : `moves ${found.paths.map((p) => heatOffFieldWords(draft, p)).join(', ')}`;
    const pellets = found.pellets.length === 0 ? ''
      : `; the pellet in ${found.pellets.join(', ')} also ends then and is left alone (its end is its start plus its burn time, not a field)`;
    heatOffNote.textContent = `${moves}${pellets}${found.note ? ` (${found.note})` : ''}`;
  };
  refresh();
  root.replaceChildren(
    h('div', { class: 'setup-grid' },
      h('div', { class: 'heat-off' }, fieldWrapper(verdictTerms.heat_off_s.term, 's', 'Moves every heat input that ends at heat off together: the start of the face row after the heating, and the end of Joule, W/kg and source heat that ends at the same time. A pellet is left alone: its end is its start plus its burn time.', heatOff), heatOffNote),
      numberField(store, { path: 'ambient_C', label: 'ambient', unit: '°C', testid: 'ambient-c', hint: 'Air and surroundings temperature unless a row gives its own.' }),
      numberField(store, { path: 'initial_C', label: 'initial temperature', unit: '°C', placeholder: 'ambient' }),
      numberField(store, { path: 'duration_s', label: 'duration', unit: 's' }),
      footprintFields(store),
      stringField(store, { path: 'name', label: 'scenario name', wide: true }),
      probesField(store),
      accuracy));
  return { refresh };
}
