/**
 * The summary bar: the verdict in one line inside the sticky header, so it stays in view while the editor scrolls on
 * a narrow screen (below 1100 px the editor and the results stack in one column). The usable window, the separator's
 * half-frozen time, the binding layer's margin, and how many cautions apply, with a link to the full verdict. The
 * same words and formats as the verdict cards. Test hook: `summary-bar`.
 */
import { marginWords, noValueWords, stoppedWords, verdictTerms, windowStatusWords } from '../sim/index.ts';
import type { Caution } from './cautions.ts';
import { h } from './dom.ts';
import { formatMargin, formatTime } from './format.ts';
import type { ShownResult } from './result.ts';

export function renderSummaryBar(bar: HTMLElement, r: ShownResult, cautions: readonly Caution[]): void {
  const s = r.summary;
  const words = windowStatusWords[s.safe_window_status];
  const binding = s.binding_layer;
  const v = binding === null ? undefined : s.layers[binding];
  const reached = v?.margin_K !== null && v?.margin_K !== undefined && v.margin_K <= 0;
  const item = (label: string, value: string, cls = '') => h('span', { class: `summary-item${cls}` }, h('span', { class: 'summary-label' }, label), ' ', h('strong', {}, value));
  // a stopped run (ShownResult.stopped) has no window verdict, and an event it did not reach may lie past the stop
  const parts = [
    r.stopped ? item(verdictTerms.safe_window_s.term, `${stoppedWords.window} at ${formatTime(r.stopped.tS, '')}`, ' warn')
      : item(verdictTerms.safe_window_s.term, s.safe_window_s === null ? words.label : formatTime(s.safe_window_s, words.label), s.safe_window_s === null ? ' muted' : ' good'),
    item(verdictTerms.half_frozen_at_s.term, r.stopped && s.separator.half_frozen_at_s === null ? stoppedWords.notReached
      : formatTime(s.separator.half_frozen_at_s, noValueWords.half_frozen_at_s)),
    binding === null || !v ? item(verdictTerms.margin_K.term, noValueWords.margin_K)
      : item(`${binding} ${verdictTerms.margin_K.term} (${reached ? marginWords.reached : marginWords.binding})`, formatMargin(v.margin_K, noValueWords.margin_K), reached ? ' warn' : ''),
    cautions.length > 0 ? h('span', { class: 'summary-item warn' }, `⚠ ${cautions.length} caution${cautions.length === 1 ? '' : 's'} for this scenario`) : undefined,
    h('a', { href: '#verdict', class: 'summary-link' }, 'verdict ↓')];
  bar.replaceChildren(...parts.filter((p): p is HTMLElement => p !== undefined));
  bar.hidden = false;
}
