/** The energy ledger (per square metre of footprint, and for the whole footprint when it is given) and the warnings. */
import { h } from './dom.ts';
import { formatNumber, NO_VALUE } from './format.ts';
import type { ShownResult } from './result.ts';

export function renderLedger(root: HTMLElement, r: ShownResult): void {
  const e = r.record.energy;
  const area = r.areaM2;
  const row = (label: string, jPerM2: number) => h('tr', {},
    h('th', {}, label),
    h('td', {}, formatNumber(jPerM2 / 1000, { decimals: 1 })),
    h('td', {}, area === undefined ? NO_VALUE : formatNumber(jPerM2 * area, { decimals: 1 })));
  root.replaceChildren(h('table', { class: 'ledger' },
    h('thead', {}, h('tr', {}, h('th', {}, ''), h('th', {}, 'kJ/m²'), h('th', {}, 'J over the footprint'))),
    h('tbody', {},
      row('heat in, bottom face', e.bottomInJ),
      row('heat in, top face', e.topInJ),
      row('heat from sources in layers', e.sourceJ),
      row('heat out, bottom face', e.bottomOutJ),
      row('heat out, top face', e.topOutJ),
      row('stored at the end (sensible + latent)', e.storedJ))),
  h('p', { class: 'note' }, `Imbalance (in − out − stored) relative to the largest term: ${formatNumber(r.summary.energy.imbalance_rel, { significant: 2 })}.`));
}

export function renderWarnings(root: HTMLElement, r: ShownResult): void {
  const items = [...r.record.warnings];
  const s = r.summary;
  if (s.safe_window_status === 'still-molten-at-end') items.push('The separator is still molten when the run ends: lengthen the duration to see it freeze.');
  if (s.safe_window_status === 'never-molten') items.push('The separator never became fully molten: the cell would not work as set up.');
  root.replaceChildren(items.length === 0 ? h('p', { class: 'note' }, 'No warnings.')
    : h('ul', { class: 'warnings' }, ...items.map((w) => h('li', {}, w))));
}
