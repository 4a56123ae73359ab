/**
 * The verdict: when the separator is molten, half-frozen and frozen, the usable window, and each layer's peak against
 * its nearest limit (the binding layer highlighted, a crossed limit in the warning style). Times are plain numbers
 * in seconds (`959.3`) or `never` inside the test hooks; units and explanations sit beside them.
 */
import type { Summary, WindowStatus } from '../sim/verdict.ts';
import { scenarioCautions, type Caution } from './cautions.ts';
import { h } from './dom.ts';
import { formatNumber, formatSeconds } from './format.ts';
import type { ShownResult } from './result.ts';

const WINDOW_WHY: Record<WindowStatus, string> = {
  'ok': 'from heater removal to half-frozen, no limit reached',
  'limit-crossed': 'none: a layer reached one of its limits',
  'never-molten': 'none: the separator never became fully molten',
  'no-separator': 'none: no layer is marked as separator',
  'heat-never-off': 'none: the heat stays on until the end of the run',
  'still-molten-at-end': 'not known: the separator is still molten at the end; lengthen the duration',
};

function timeCard(label: string, testid: string, value: number | null, note: string): HTMLElement {
  return h('div', { class: `card${value === null ? ' muted' : ''}` },
    h('div', { class: 'card-label' }, label),
    h('div', { class: 'card-value' }, h('span', { 'data-testid': testid }, formatSeconds(value)), value === null ? undefined : h('span', { class: 'unit' }, ' s')),
    h('div', { class: 'card-note' }, note));
}

function sinceHeatOff(t: number | null, s: Summary): string {
  if (t === null) return 'does not happen within the run';
  if (s.heat_off_s === null || t < s.heat_off_s) return `${formatNumber(t / 60, { decimals: 1 })} min after the start`;
  return `${formatNumber(t - s.heat_off_s, { decimals: 1 })} s after the heater is removed`;
}

function layerCard(r: ShownResult, id: string, cautions: readonly Caution[]): HTMLElement {
  const v = r.summary.layers[id];
  const binding = r.summary.binding_layer === id;
  const margin = v?.margin_K ?? null;
  const crossed = margin !== null && margin <= 0;
  const limit = v?.limit;
  return h('div', { class: `card layer-card${binding ? ' binding' : ''}${crossed ? ' crossed' : ''}${margin === null ? ' muted' : ''}` },
    h('div', { class: 'card-label' }, h('strong', {}, id), limit ? ` margin to ${limit.kind}` : '',
      binding ? h('span', { class: 'tag' }, 'binding') : undefined, crossed ? h('span', { class: 'tag warn' }, 'limit crossed') : undefined),
    h('div', { class: 'card-value' }, h('span', { 'data-testid': `verdict-margin-${id}` }, margin === null ? 'no limit' : formatNumber(margin, { decimals: 1 })),
      margin === null ? undefined : h('span', { class: 'unit' }, ' K')),
    h('div', { class: 'card-note' },
      `peak ${formatNumber(v?.peak_C, { decimals: 1 })} °C at ${formatNumber(v?.peak_at_s, { decimals: 0 })} s`,
      limit ? `; ${limit.kind} at ${formatNumber(limit.at_C, { decimals: 0 })} °C` : '; no limit on file'),
    crossed ? h('div', { class: 'card-warning', role: 'alert' }, `⚠ ${id} reaches its ${limit?.kind ?? ''} limit: not safe as predicted.`) : undefined,
    ...cautions.filter((c) => c.layer === id).map((c) =>
      h('div', { class: 'card-caution', 'data-testid': `caution-${c.kind}-${id}` }, `⚠ ${c.short}`)));
}

/** The scenario's own cautions, inside the caution box beside the verdict. */
function renderScenarioCautions(list: HTMLElement, cautions: readonly Caution[]): void {
  list.replaceChildren(...cautions.map((c) => h('li', { 'data-kind': c.kind }, c.sentence)));
  list.hidden = cautions.length === 0;
}

export function renderVerdict(root: HTMLElement, cautionList: HTMLElement, r: ShownResult): void {
  const s = r.summary;
  const cautions = scenarioCautions(r.layers, s);
  renderScenarioCautions(cautionList, cautions);
  const sep = s.separator;
  const window = h('div', { class: `card window${s.safe_window_s === null ? ' muted' : ' good'}${s.safe_window_status === 'limit-crossed' ? ' crossed' : ''}` },
    h('div', { class: 'card-label' }, 'usable window'),
    h('div', { class: 'card-value' }, h('span', { 'data-testid': 'verdict-window' }, formatSeconds(s.safe_window_s)),
      s.safe_window_s === null ? undefined : h('span', { class: 'unit' }, ' s')),
    h('div', { class: 'card-note' }, WINDOW_WHY[s.safe_window_status],
      s.heat_off_s !== null ? ` (heater removed at ${formatNumber(s.heat_off_s, { decimals: 1 })} s)` : ''));
  root.replaceChildren(
    h('div', { class: 'cards' },
      window,
      timeCard('separator molten at', 'verdict-molten-at', sep.molten_at_s, sinceHeatOff(sep.molten_at_s, s)),
      timeCard('separator half-frozen at', 'verdict-half-frozen-at', sep.half_frozen_at_s, sinceHeatOff(sep.half_frozen_at_s, s)),
      timeCard('separator frozen at', 'verdict-frozen-at', sep.frozen_at_s, sinceHeatOff(sep.frozen_at_s, s))),
    h('div', { class: 'cards layers' }, ...r.layers.map((l) => layerCard(r, l.id, cautions))));
}
