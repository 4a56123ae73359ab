/**
 * The operating-duration panel: verdict cards for the longest hold, the usable window after heat off and the binding
 * constraint (and the shortest hold that melts the separator), the operating chart, and every interval in words.
 * Recomputed in the background (operating-runner.ts) after each finished run; while it runs the last answer stays,
 * marked as being recomputed. Test hooks: data-testid="operating-status" (data-state, data-job), the cards'
 * data-value (seconds, empty when there is none) and data-testid="plot-operating".
 */
import type { WindowReport } from '../sim/index.ts';
import type { WindowWords } from '../sim/index.ts';
import { predictionNotCertification } from '../sim/index.ts';
import { chartConfig } from './plot-common.ts';
import { loadPlotly } from './charts.ts';
import { h } from './dom.ts';
import { formatNumber, formatTime } from './format.ts';
import { operatingFigure } from './operating-chart.ts';
import type { FromOperating } from './operating-protocol.ts';
import { createOperatingRunner } from './operating-runner.ts';

function card(label: string, testid: string, value: number | null, shown: string, note: string, good: boolean): HTMLElement {
  return h('div', { class: `card${value === null ? ' muted' : good ? ' window good' : ''}` },
    h('div', { class: 'card-label' }, label),
    h('div', { class: 'card-value' }, h('span', { 'data-testid': testid, 'data-value': value === null ? '' : String(value) }, shown)),
    h('div', { class: 'card-note' }, note));
}

/** True when every number the panel draws is finite (a guard: the page never shows NaN). */
function allFinite(r: WindowReport): boolean {
  const nums = r.points.flatMap((p) => [p.value, p.margin_K, p.window_s].filter((v): v is number => v !== null));
  return nums.every(Number.isFinite);
}

export function createOperatingPanel(root: HTMLElement): { request: (scenario: unknown) => void; clear: (text: string) => void } {
  const status = h('p', { class: 'note', 'data-testid': 'operating-status', 'data-state': 'idle', 'data-job': '0' }, 'The operating duration is computed after the first run.');
  const cards = h('div', { class: 'cards' });
  const chart = h('div', { class: 'chart', 'data-testid': 'plot-operating' });
  const details = h('ul', { class: 'note operating-details' });
  const caution = h('p', { class: 'note' },
    `Hold times and windows are predictions with the model's uncertainty: keep well inside the shaded band, and treat margins of a few tens of kelvin as no margin. ${predictionNotCertification}`);
  root.replaceChildren(status, cards, chart, details, caution);
  let job = 0;
  let drawn = 0;

  const setStatus = (state: string, text: string) => {
    status.dataset.state = state;
    status.dataset.job = String(job);
    status.textContent = text;
  };

  function show(r: WindowReport, words: WindowWords, ms: number): void {
    const w = r.window;
    const longestShown = r.longest ? formatTime(r.longest.value, '—') : r.no_limit ? 'no limit' : 'none';
    const b = r.longest?.binding;
    cards.replaceChildren(
      card('longest hold', 'operating-longest', r.longest?.value ?? null, longestShown, words.longest, r.longest !== null || r.no_limit !== null),
      card('usable window after heat off', 'operating-window', w?.point.window_s ?? null, formatTime(w?.point.window_s ?? null, 'none'), words.window, (w?.point.window_s ?? null) !== null && w!.safe),
      card('binding constraint', 'operating-binding', b ? b.at_s : null, b ? `${b.layer} · ${b.kind}` : r.no_limit ? 'none binds' : 'none', words.binding, false),
      card('shortest hold, separator fully molten', 'operating-shortest', r.shortest?.value ?? null, formatTime(r.shortest?.value ?? null, 'none'), words.shortest, false));
    details.replaceChildren(...[
      h('li', {}, `keeps the ${formatNumber(r.margin_K, { decimals: 0 })} K margin: ${words.safeIntervals.join('; ') || 'at no hold in the range'}`),
      h('li', {}, `separator fully molten: ${words.moltenIntervals.join('; ') || 'at no hold in the range'}`),
      r.monotonic ? undefined : h('li', {}, 'the response is not monotonic: every interval is listed; narrower ones between scan points may be missed'),
      h('li', {}, `${words.method}; searched in ${formatNumber(ms, { decimals: 0 })} ms`)].filter((e) => e !== undefined));
    chart.hidden = false;
    const mine = ++drawn;
    void loadPlotly().then((plotly) => {
      if (mine !== drawn) return;
      const fig = operatingFigure(r);
      return plotly.react(chart, fig.data, fig.layout, chartConfig('freezeline-operating-chart'));
    }).then(() => { if (mine === drawn) setStatus('done', `${r.solves} runs in ${formatNumber(ms, { decimals: 0 })} ms`); });
  }

  /** No answer for the scenario shown: the cards, details and chart go, and the status says why. */
  const clear = (state: string, text: string): void => {
    drawn++;
    cards.replaceChildren();
    details.replaceChildren();
    chart.hidden = true;
    setStatus(state, text);
  };

  const onReply = (msg: FromOperating): void => {
    if (msg.type === 'done') {
      if (!allFinite(msg.report)) { setStatus('failed', 'internal error: the search gave a non-finite value; nothing shown'); return; }
      performance.mark('freezeline:window');
      show(msg.report, msg.words, msg.searchMs);
    } else if (msg.type === 'none') {
      clear('none', `No operating duration: ${msg.reason}.`);
    } else {
      setStatus('failed', `The search did not finish: ${msg.message}`);
    }
  };
  const runner = createOperatingRunner(() => { job += 1; setStatus('running', 'searching the hold times… (the answer shown is for the previous scenario)'); }, onReply);
  return {
    request: (scenario) => runner.request(scenario),
    clear: (text) => { runner.stop(); clear('none', text); },
  };
}
