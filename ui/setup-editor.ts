/**
 * The run's setting: name, ambient and initial temperature, footprint, duration, and the one-line heater control
 * ("heat off at", the wording table's term; test hook `heat-off-s`), which edits the `from_s` of the bottom row where the heating
 * ends — the same value as that row's own "from" field, kept in step with it.
 */
import { verdictTerms } from '../sim/index.ts';
import type { DraftStore } from './draft.ts';
import { h } from './dom.ts';
import { fieldWrapper, numberField, stringField } from './fields.ts';
import { inputText, parseNumberInput } from './format.ts';
import { asNumber, asObject } from './json.ts';
import { heaterOffRow } from './heat-off.ts';
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

export function renderSetupEditor(root: HTMLElement, store: DraftStore): SetupEditor {
  const heatOff = h('input', { type: 'text', inputmode: 'decimal', 'data-testid': 'heat-off-s', 'aria-label': `${verdictTerms.heat_off_s.term}, s` });
  const heatOffNote = h('span', { class: 'note' });
  heatOff.addEventListener('input', () => {
    const path = heatOff.getAttribute('data-path');
    if (!path) return;
    store.setField(path, parseNumberInput(heatOff.value), { source: heatOff });
  });
  const refresh = (): void => {
    const j = heaterOffRow(store.current());
    if (j === undefined) {
      heatOff.removeAttribute('data-path');
      heatOff.disabled = true;
      heatOff.value = '';
      heatOffNote.textContent = 'No bottom row ends the heating; add a row without a plate or heater to remove it.';
      return;
    }
    const path = `bottom[${j}].from_s`;
    heatOff.disabled = false;
    if (heatOff.getAttribute('data-path') !== path || document.activeElement !== heatOff) heatOff.value = inputText(store.get(path));
    heatOff.setAttribute('data-path', path);
    heatOffNote.textContent = `bottom row ${j + 1} starts then`;
  };
  refresh();
  root.replaceChildren(
    h('div', { class: 'setup-grid' },
      h('div', { class: 'heat-off' }, fieldWrapper(verdictTerms.heat_off_s.term, 's', 'Moves the start of the bottom row where the heating ends.', heatOff), heatOffNote),
      numberField(store, { path: 'ambient_C', label: 'ambient', unit: '°C', testid: 'ambient-c', hint: 'Air and surroundings temperature unless a row gives its own.' }),
      numberField(store, { path: 'initial_C', label: 'initial temperature', unit: '°C', placeholder: 'ambient' }),
      numberField(store, { path: 'duration_s', label: 'duration', unit: 's' }),
      footprintFields(store),
      stringField(store, { path: 'name', label: 'scenario name', wide: true }),
      probesField(store)));
  return { refresh };
}
