/**
 * The verdict: when the separator is molten, half-frozen and frozen, the usable window, and each layer's peak against
 * its binding limit (the binding layer highlighted, a reached limit in the warning style), with the cautions that
 * apply to this scenario beside the margin they concern. Every term comes from the one wording table
 * (sim/observe/wording.ts) and every number from the one formatting module, as in the CLI: a verdict with no value reads as
 * words. Test hooks hold the printed text: `verdict-window`, `verdict-molten-at`, `verdict-half-frozen-at`,
 * `verdict-frozen-at`, `verdict-margin-<layer id>`.
 */
import type { Summary } from '../sim/index.ts';
import { marginWords, noValueWords, stoppedWords, verdictTerms, windowStatusWords } from '../sim/index.ts';
import { scenarioCautions, type Caution } from './cautions.ts';
import { h } from './dom.ts';
import { formatMargin, formatNumber, formatTemperature, formatTime } from './format.ts';
import type { ShownResult } from './result.ts';

type EventKey = 'molten_at_s' | 'half_frozen_at_s' | 'frozen_at_s';

const sentenceCase = (line: string): string => `${line.charAt(0).toUpperCase()}${line.slice(1)}.`;

/** What a card says of an event with no time: not within the run, or not before a stopped run stopped. */
const notReached = (stoppedS: number | undefined): string =>
  (stoppedS === undefined ? 'does not happen within the run' : `${stoppedWords.notReached} before the run stopped at ${formatTime(stoppedS, '')}`);

function timeCard(key: EventKey, testid: string, s: Summary, stoppedS: number | undefined): HTMLElement {
  const value = s.separator[key];
  // a stopped run never says "never": the event may lie past the stop
  const shown = value === null && stoppedS !== undefined ? stoppedWords.notReached : formatTime(value, noValueWords[key]);
  return h('div', { class: `card${value === null ? ' muted' : ''}`, title: verdictTerms[key].definition },
    h('div', { class: 'card-label' }, verdictTerms[key].term),
    h('div', { class: 'card-value' }, h('span', { 'data-testid': testid }, shown)),
    h('div', { class: 'card-note' }, sinceHeatOff(value, s, stoppedS)));
}

function sinceHeatOff(t: number | null, s: Summary, stoppedS: number | undefined): string {
  if (t === null) return notReached(stoppedS);
  if (s.heat_off_s === null || t < s.heat_off_s) return 'while the heat is on';
  return `${formatTime(t - s.heat_off_s, '')} after ${verdictTerms.heat_off_s.term.replace(/ at$/, '')}`;
}

function layerCard(r: ShownResult, id: string, cautions: readonly Caution[]): HTMLElement {
  const v = r.summary.layers[id];
  const binding = r.summary.binding_layer === id;
  const margin = v?.margin_K ?? null;
  const crossed = margin !== null && margin <= 0;
  const limit = v?.limit;
  const colour = r.layers.find((l) => l.id === id)?.colour;
  return h('div', { class: `card layer-card${binding ? ' binding' : ''}${crossed ? ' crossed' : ''}${margin === null ? ' muted' : ''}`,
    style: colour ? `border-top: 3px solid ${colour}` : undefined, title: verdictTerms.margin_K.definition },
  h('div', { class: 'card-label' }, h('strong', {}, id), limit ? ` ${verdictTerms.margin_K.term} to ${limit.kind}` : '',
    binding ? h('span', { class: 'tag', title: marginWords.bindingMeaning }, marginWords.binding) : undefined,
    crossed ? h('span', { class: 'tag warn' }, marginWords.reached) : undefined),
  h('div', { class: 'card-value' }, h('span', { 'data-testid': `verdict-margin-${id}` }, formatMargin(margin, noValueWords.margin_K))),
  h('div', { class: 'card-note' },
    `${verdictTerms.peak_C.term} ${formatTemperature(v?.peak_C ?? null, '—')} at ${formatTime(v?.peak_at_s ?? null, '—')}`,
    limit ? `; ${limit.kind} at ${formatNumber(limit.at_C, { decimals: 0 })} °C` : `; limit: ${noValueWords.limit}`),
  crossed ? h('div', { class: 'card-warning', role: 'alert' }, `⚠ ${marginWords.reachedSentence(id, limit?.kind ?? '')}`) : undefined,
  ...cautions.filter((c) => c.layer === id).map((c) =>
    h('div', { class: 'card-caution', 'data-testid': `caution-${c.kind}-${id}` }, `⚠ ${c.short}`)));
}

/** The scenario's own cautions, inside the caution box beside the verdict. */
function renderScenarioCautions(list: HTMLElement, cautions: readonly Caution[]): void {
  list.replaceChildren(...cautions.map((c) => h('li', { 'data-kind': c.kind }, c.sentence)));
  list.hidden = cautions.length === 0;
}

/** Draws the verdict cards and this scenario's cautions; returns the cautions (the summary bar counts them). */
export function renderVerdict(root: HTMLElement, cautionList: HTMLElement, r: ShownResult): Caution[] {
  const s = r.summary;
  const cautions = scenarioCautions(r.layers, s);
  renderScenarioCautions(cautionList, cautions);
  const words = windowStatusWords[s.safe_window_status];
  const stoppedS = r.stopped?.tS;
  // a stopped run has no window to judge: what it would be depends on the part that did not run
  const window = r.stopped
    ? h('div', { class: 'card window muted crossed', title: verdictTerms.safe_window_s.definition },
      h('div', { class: 'card-label' }, verdictTerms.safe_window_s.term),
      h('div', { class: 'card-value' }, h('span', { 'data-testid': 'verdict-window' }, stoppedWords.window)),
      h('div', { class: 'card-note' }, `no verdict: the run stopped at ${formatTime(r.stopped.tS, '')}`))
    : h('div', { class: `card window${s.safe_window_s === null ? ' muted' : ' good'}${s.safe_window_status === 'limit-crossed' ? ' crossed' : ''}`,
      title: verdictTerms.safe_window_s.definition },
    h('div', { class: 'card-label' }, verdictTerms.safe_window_s.term),
    h('div', { class: 'card-value' }, h('span', { 'data-testid': 'verdict-window' }, s.safe_window_s === null ? words.label : formatTime(s.safe_window_s, words.label))),
    h('div', { class: 'card-note' }, words.sentence,
      s.heat_off_s === null ? ` (${noValueWords.heat_off_s})` : ` (${verdictTerms.heat_off_s.term} ${formatTime(s.heat_off_s, '')})`));
  root.replaceChildren(
    // why the run stopped, above everything it did record
    ...(r.stopped ? [h('p', { class: 'card-warning', role: 'alert', 'data-testid': 'verdict-stopped' },
      `⚠ ${sentenceCase(r.stopped.message)} The cards and charts show the run up to then.`)] : []),
    h('div', { class: 'cards' },
      window,
      timeCard('molten_at_s', 'verdict-molten-at', s, stoppedS),
      timeCard('half_frozen_at_s', 'verdict-half-frozen-at', s, stoppedS),
      timeCard('frozen_at_s', 'verdict-frozen-at', s, stoppedS)),
    h('div', { class: 'cards layers' }, ...r.layers.map((l) => layerCard(r, l.id, cautions))),
    // the accuracy the event times were solved to (numerics.event_accuracy_s; the CLI prints the same line)
    ...(r.accuracy === undefined ? [] : [h('p', { class: 'note accuracy-line', 'data-testid': 'verdict-accuracy' }, sentenceCase(r.accuracy))]));
  return cautions;
}
