/**
 * The energy balance (per square metre of footprint, and for the whole footprint when it is given) and the warnings.
 * Figures at about 6 significant figures, as in the CLI and the CSV (sim/observe/format.ts).
 */
import { windowStatusWords } from '../sim/index.ts';
import { h } from './dom.ts';
import { formatDefaults, formatNumber, NO_VALUE } from './format.ts';
import type { ShownResult } from './result.ts';

const ledgerDefaults = {
  /** Significant figures of the largest term: the CSV's precision (sim/observe/format.ts). */
  significant: formatDefaults.csvSignificant,
} as const;

export function renderLedger(root: HTMLElement, r: ShownResult): void {
  const e = r.record.energy;
  const area = r.areaM2;
  // about 6 significant figures on the largest term, the same decimals for all (round-off shows as 0, not 4e-18)
  const terms = [e.bottomInJ, e.topInJ, e.sourceJ, e.bottomOutJ, e.topOutJ, e.storedJ, e.edgeInJ ?? 0, e.edgeOutJ ?? 0, e.heaterJ ?? 0].map(Math.abs);
  const places = (scale: number): number => {
    const big = Math.max(...terms) * scale;
    return big > 0 && Number.isFinite(big) ? Math.max(0, ledgerDefaults.significant - 1 - Math.floor(Math.log10(big))) : 0;
  };
  const perM2 = places(1e-3);
  const total = area === undefined ? 0 : places(area);
  const row = (label: string, jPerM2: number) => h('tr', {},
    h('th', {}, label),
    h('td', {}, formatNumber(jPerM2 / 1000, { decimals: perM2 })),
    h('td', {}, area === undefined ? NO_VALUE : formatNumber(jPerM2 * area, { decimals: total })));
  root.replaceChildren(h('table', { class: 'ledger' },
    h('thead', {}, h('tr', {}, h('th', {}, ''), h('th', {}, 'kJ/m²'), h('th', {}, 'J over the footprint'))),
    h('tbody', {},
      // a heater body's electric heat (key heater): its plate's loss counts as heat out of the face it is under
      ...(e.heaterJ === undefined ? [] : [row('heat in, heater (electric)', e.heaterJ)]),
      row('heat in, bottom face', e.bottomInJ),
      row('heat in, top face', e.topInJ),
      row('heat from sources in layers', e.sourceJ),
      row('heat out, bottom face', e.bottomOutJ),
      row('heat out, top face', e.topOutJ),
      // the side walls' channel exists only when the scenario has edge losses (key edges)
      ...(e.edgeOutJ === undefined ? [] : [row('heat in, side walls (edges)', e.edgeInJ ?? 0), row('heat out, side walls (edges)', e.edgeOutJ)]),
      row(e.heaterJ === undefined ? 'stored at the end (sensible + latent)' : 'stored at the end (sensible + latent, heater plate included)', e.storedJ))),
    ...(r.summary.heater ? [h('p', { class: 'note', 'data-testid': 'heater-summary' },
      `Heater: ${formatNumber(r.summary.heater.energy_J / 1000, { significant: 3 })} kJ over ${formatNumber(r.summary.heater.under_stack_s, { decimals: 0 })} s under the stack, `
      + `duty cycle ${formatNumber(100 * r.summary.heater.duty_cycle, { decimals: 1 })} %, plate up to ${formatNumber(r.summary.heater.plate_peak_C, { decimals: 1 })} °C.`)] : []),
  h('p', { class: 'note' }, `Imbalance (in − out − stored) relative to the largest term: ${formatNumber(r.summary.energy.imbalance_rel, { significant: 2 })}.`));
}

export function renderWarnings(root: HTMLElement, r: ShownResult): void {
  const items = [...r.record.warnings];
  const s = r.summary;
  // the two statuses a user can act on, in the wording table's sentences (the CLI prints the same); a stopped run has
  // no window status to act on (its verdict says why it stopped)
  const actionable = s.safe_window_status === 'still-molten-at-end' || s.safe_window_status === 'never-molten';
  if (actionable && !r.stopped) items.push(windowStatusWords[s.safe_window_status].sentence);
  root.replaceChildren(items.length === 0 ? h('p', { class: 'note' }, 'No warnings.')
    : h('ul', { class: 'warnings' }, ...items.map((w) => h('li', {}, w))));
}
