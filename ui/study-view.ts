/**
 * The study panel: one or two inputs of the scenario (key paths, as on the command line: `ambient_C`,
 * `layers.separator.thickness_mm`, `bottom.1.from_s`) with a range each, and a target (`safe_window_s>=60`) whose
 * verdict is drawn. The runs go to a pool of Web Workers (study-pool.ts) with a progress bar and cancel; the chart is
 * a line (one input) or a heatmap with the pass/fail boundary (two). Clicking a run loads its scenario into the
 * editor; the scenario it replaced is one click away ("back"). Test hooks: data-testid="study-status" (data-state:
 * idle | running | done | cancelled | error | failed, data-runs) and data-testid="plot-study".
 */
import { parseVary, planSweep, pointScenario, type SweepPlan, type SweepRow } from '../sim/index.ts';
import { checkTarget, parseTarget, type Target } from '../sim/index.ts';
import { predictionNotCertification } from '../sim/index.ts';
import { loadPlotly } from './charts.ts';
import { button, h } from './dom.ts';
import type { DraftStore } from './draft.ts';
import { formatNumber } from './format.ts';
import { asList, cloneJson, isObject, type JsonObject } from './json.ts';
import { chartConfig } from './plot-common.ts';
import { studyFigure } from './study-chart.ts';
import { runStudy, type StudyRun } from './study-pool.ts';
import { numericPaths } from './study-paths.ts';

export const studyDefaults = {
  /** The first input offered: the ambient over the default range of the ambient study (from memory, see README). */
  key: 'ambient_C', from: -54, to: 74, count: 9,
  target: 'safe_window_s>=60',
  /** Redraw at most this often while rows arrive, ms: the chart follows the runs without costing them time. */
  redrawMs: 400,
} as const;

interface AxisFields { key: HTMLInputElement; from: HTMLInputElement; to: HTMLInputElement; count: HTMLInputElement }

function axisFields(n: number, key: string, from: string, to: string, count: string, list: string): { row: HTMLElement; f: AxisFields } {
  const f = {
    key: h('input', { type: 'text', value: key, list, size: 30, 'data-testid': `study-key-${n}`, 'aria-label': `input ${n}: key path`, placeholder: n === 1 ? 'ambient_C' : '(optional) second input' }),
    from: h('input', { type: 'text', value: from, size: 7, 'data-testid': `study-from-${n}`, 'aria-label': `input ${n}: from` }),
    to: h('input', { type: 'text', value: to, size: 7, 'data-testid': `study-to-${n}`, 'aria-label': `input ${n}: to` }),
    count: h('input', { type: 'text', value: count, size: 4, 'data-testid': `study-count-${n}`, 'aria-label': `input ${n}: runs` }),
  };
  const row = h('div', { class: 'study-row' }, h('label', {}, `input ${n} `, f.key), h('label', {}, ' from ', f.from), h('label', {}, ' to ', f.to), h('label', {}, ' runs ', f.count));
  return { row, f };
}

export function createStudyPanel(root: HTMLElement, store: DraftStore): void {
  const d = studyDefaults;
  const listId = 'study-key-list';
  const datalist = h('datalist', { id: listId });
  const a1 = axisFields(1, d.key, String(d.from), String(d.to), String(d.count), listId);
  const a2 = axisFields(2, '', '', '', '5', listId);
  const targetField = h('input', { type: 'text', value: d.target, size: 30, 'data-testid': 'study-target', 'aria-label': 'target: PATH OP VALUE' });
  const status = h('p', { class: 'note', 'data-testid': 'study-status', 'data-state': 'idle', 'data-runs': '0' }, 'Choose an input and a range, then run the study.');
  const bar = h('progress', { max: 1, value: 0, hidden: true });
  const chart = h('div', { class: 'chart', 'data-testid': 'plot-study', hidden: true });
  let current: StudyRun | undefined;
  let previous: JsonObject | undefined;
  const runButton = button('run study', 'run the scenario over the inputs\' ranges in background workers', () => start(), { 'data-testid': 'study-run' });
  const cancelButton = button('cancel', 'stop the study', () => { current?.cancel(); current = undefined; setState('cancelled', 'study cancelled'); }, { hidden: true, 'data-testid': 'study-cancel' });
  const backButton = button('back to the scenario before', 'load the scenario that the clicked run replaced', () => {
    if (!previous) return;
    const leaving = cloneJson(store.current());
    store.replace(previous, 'study-back');
    previous = leaving;
  }, { hidden: true, 'data-testid': 'study-back' });

  root.replaceChildren(
    h('p', { class: 'note' }, 'An input is a key path in the scenario: ambient_C, layers.<id>.thickness_mm, bottom.<row>.from_s, … The target is PATH OP VALUE on the verdicts (safe_window_s>=60, margin_K>=25, layers.<id>.margin_K>=25); a verdict with no value misses it.'),
    datalist, a1.row, a2.row, h('div', { class: 'study-row' }, h('label', {}, 'target ', targetField)),
    h('div', { class: 'study-row' }, runButton, cancelButton, bar, backButton), status, chart,
    h('p', { class: 'note' }, `Click a run in the chart to load its scenario into the editor. ${predictionNotCertification}`));

  const refreshList = () => datalist.replaceChildren(...numericPaths(store.current()).map((p) => h('option', { value: p })));
  refreshList();
  store.listen((c) => { if (c.kind !== 'field') refreshList(); });

  function setState(state: string, text: string, runs = 0): void {
    status.dataset.state = state;
    status.dataset.runs = String(runs);
    status.textContent = text;
    const busy = state === 'running';
    runButton.disabled = busy;
    cancelButton.hidden = !busy;
    bar.hidden = !busy;
  }

  function readPlan(doc: JsonObject): { plan: SweepPlan; target: Target } | string {
    const axes = [];
    for (const a of [a1.f, a2.f]) {
      if (a.key.value.trim() === '') continue;
      const axis = parseVary(doc, `${a.key.value.trim()}=${a.from.value.trim()}:${a.to.value.trim()}:${a.count.value.trim()}`);
      if (!axis.ok) return axis.message.replace(/^--vary /, '');
      axes.push(axis.value);
    }
    const plan = planSweep(doc, axes);
    if (!plan.ok) return plan.message;
    const t = parseTarget(targetField.value);
    if (!t.ok) return t.message;
    const ids = asList(doc.layers).map((l) => (isObject(l) && typeof l.id === 'string' ? l.id : '')).filter((s) => s !== '');
    const bad = checkTarget(t.value, ids);
    if (bad) return bad;
    if (typeof t.value.value !== 'number') return `target ${t.value.text}: the chart needs a verdict in numbers (e.g. safe_window_s>=60)`;
    return { plan: plan.value, target: t.value };
  }

  let drawn = 0;
  async function draw(plan: SweepPlan, rows: (SweepRow | undefined)[], target: Target): Promise<void> {
    const mine = ++drawn;
    const plotly = await loadPlotly();
    if (mine !== drawn) return;
    chart.hidden = false;
    const fig = studyFigure(plan, rows, target);
    const el = await plotly.react(chart, fig.data, fig.layout, chartConfig('freezeline-study'));
    const clickable = el as unknown as { on: (ev: string, f: (e: { points: { customdata?: unknown }[] }) => void) => void; removeAllListeners?: (ev: string) => void };
    clickable.removeAllListeners?.('plotly_click');
    clickable.on('plotly_click', (e) => {
      const index = Number(e.points[0]?.customdata);
      if (!Number.isInteger(index) || index < 0 || index >= plan.count) return;
      previous = cloneJson(store.current());
      store.replace(pointScenario(plan, index) as JsonObject, 'study');
      backButton.hidden = false;
    });
  }

  function start(): void {
    const read = readPlan(store.current());
    if (typeof read === 'string') { setState('error', read); return; }
    const { plan, target } = read;
    current?.cancel();
    const rows: (SweepRow | undefined)[] = new Array<SweepRow | undefined>(plan.count);
    const started = performance.now();
    let lastDraw = 0;
    bar.max = plan.count;
    bar.value = 0;
    setState('running', `running ${plan.count} runs…`);
    current = runStudy(plan, {
      onRow: (row, done, total) => {
        rows[row.index] = row;
        bar.value = done;
        status.textContent = `${done} of ${total} runs…`;
        if (performance.now() - lastDraw > d.redrawMs) { lastDraw = performance.now(); void draw(plan, rows, target); }
      },
      onDone: () => {
        current = undefined;
        const errors = rows.filter((r) => r?.error !== null).length;
        void draw(plan, rows, target).then(() => setState('done',
          `${plan.count} runs in ${formatNumber((performance.now() - started) / 1000, { decimals: 1 })} s${errors > 0 ? `; ${errors} could not be computed (gaps)` : ''}`, plan.count));
      },
      onFailed: (message) => { current = undefined; setState('failed', `The study stopped: ${message}`); },
    });
  }
}
