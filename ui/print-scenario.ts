/**
 * The scenario as computed, for the printed one-page report: name, run settings, the stack (top layer first, as in
 * the editor) and the face rows in plain words. Hidden on screen, where the editor shows the same. Built from the
 * snapshot that produced the result, so the print never mixes a result with later edits. Test hook: `print-scenario`.
 */
import { noValueWords, verdictTerms } from '../sim/index.ts';
import { h } from './dom.ts';
import { segmentSummary } from './face-summary.ts';
import { formatNumber, formatTime } from './format.ts';
import { asList, asNumber, asObject, asString } from './json.ts';
import type { ShownResult } from './result.ts';

const celsius = (v: unknown): string => (typeof v === 'number' ? `${formatNumber(v, { significant: 4 })} °C` : '—');

function faceRows(side: 'bottom' | 'top', r: ShownResult): string {
  return asList(r.scenario[side]).map((row) => `from ${formatTime(asNumber(asObject(row).from_s) ?? 0, '')}: ${segmentSummary(row)}`).join('; ');
}

export function renderPrintScenario(root: HTMLElement, r: ShownResult): void {
  const sc = r.scenario;
  const fp = asObject(sc.footprint);
  const footprint = asNumber(fp.diameter_mm) !== undefined ? `disc ${formatNumber(asNumber(fp.diameter_mm), { significant: 4 })} mm`
    : asNumber(fp.width_mm) !== undefined ? `${formatNumber(asNumber(fp.width_mm), { significant: 4 })} × ${formatNumber(asNumber(fp.length_mm), { significant: 4 })} mm`
      : 'not given';
  const rows = [...r.layers].reverse().map((l) => {
    const src = asObject(asList(sc.layers)[l.index]).source_W_m3;
    return h('tr', {},
      h('td', {}, h('span', { class: 'swatch', style: `background: ${l.colour}` }), l.id),
      h('td', {}, l.material.name), h('td', {}, `${formatNumber(l.thicknessMm, { significant: 3 })} mm`),
      h('td', {}, l.separator ? 'separator' : ''), h('td', {}, src === undefined ? '' : 'heat source'));
  });
  root.setAttribute('data-testid', 'print-scenario');
  root.replaceChildren(
    h('h2', {}, asString(sc.name) ?? 'Scenario'),
    h('p', { class: 'print-settings' },
      `duration ${formatTime(asNumber(sc.duration_s) ?? null, '—')} · ambient ${celsius(sc.ambient_C)} · initial ${celsius(sc.initial_C ?? sc.ambient_C)} · `
      + `footprint ${footprint} · ${r.summary.heat_off_s === null ? noValueWords.heat_off_s : `${verdictTerms.heat_off_s.term} ${formatTime(r.summary.heat_off_s, '')}`}`),
    h('table', { class: 'print-stack' },
      h('thead', {}, h('tr', {}, h('th', {}, 'layer (top first)'), h('th', {}, 'material'), h('th', {}, 'thickness'), h('th', {}, ''), h('th', {}, ''))),
      h('tbody', {}, ...rows)),
    h('p', { class: 'print-settings' }, `bottom face — ${faceRows('bottom', r)}`),
    h('p', { class: 'print-settings' }, `top face — ${faceRows('top', r)}`));
}
