/**
 * Everything that shows a result: verdict cards, cross-section with its time slider, charts, ledger, warnings. A new
 * result replaces all of them together; an error leaves them as they are, marked as the last good result.
 */
import { renderCautionBox } from './caution-box.ts';
import { createCharts } from './charts.ts';
import { byId, h } from './dom.ts';
import { formatTime } from './format.ts';
import { renderLedger, renderWarnings } from './ledger-view.ts';
import { stepNear, type ShownResult } from './result.ts';
import { renderPrintScenario } from './print-scenario.ts';
import { drawStack } from './stack-drawing.ts';
import { renderSummaryBar } from './summary-bar.ts';
import { renderVerdict } from './verdict-view.ts';

export const resultsDefaults = {
  /** The time slider's resolution: the run's duration in this many equal steps (0.1 % of a run is finer than the eye). */
  sliderPositions: 1000,
} as const;

export interface ResultsView {
  /** Shows a result; the promise resolves when the charts have drawn it. */
  readonly show: (r: ShownResult) => Promise<void>;
  /** Says why nothing is shown yet (before the first result). */
  readonly placeholder: (message: string) => void;
  /** Marks what is on screen as older than the scenario (message), or current (undefined). */
  readonly stale: (message: string | undefined) => void;
  readonly current: () => ShownResult | undefined;
}

export function createResultsView(): ResultsView {
  const charts = createCharts({
    temperatures: byId('plot-temperatures'), liquid: byId('plot-liquid'), map: byId('plot-map'), offScale: byId('off-scale'),
    freeze: byId('plot-freeze'), margin: byId('plot-margin'),
  });
  const slider = byId<HTMLInputElement>('time-slider');
  const sliderValue = byId<HTMLOutputElement>('time-value');
  const staleNote = byId('stale-note');
  const drawing = byId('stack-drawing');
  const cautionList = renderCautionBox(byId('cautions'));
  // the print stylesheet lays out the scenario, verdict, charts and cautions on one page
  byId('print-report').addEventListener('click', () => { void charts.forPrint(true).then(() => window.print()); });
  window.addEventListener('beforeprint', () => { void charts.forPrint(true); });
  window.addEventListener('afterprint', () => { void charts.forPrint(false); });
  let shown: ShownResult | undefined;
  let chosenS: number | undefined;
  drawStack(drawing, undefined, 0);

  const showStep = (r: ShownResult, step: number): void => {
    drawStack(drawing, r, step);
    sliderValue.textContent = formatTime(r.record.tS[step] ?? null, '—');
  };

  // the slider moves in time (its value is seconds), not in solver steps: the drawing shows the recorded step nearest
  slider.addEventListener('input', () => {
    if (!shown) return;
    const t = Number(slider.value);
    if (!Number.isFinite(t)) return;
    chosenS = t;
    showStep(shown, stepNear(shown.record.tS, t));
    charts.moveCursor(t);
  });

  return {
    show(r) {
      shown = r;
      const tS = r.record.tS;
      const endS = tS[tS.length - 1] ?? 0;
      const wanted = Math.min(chosenS ?? r.summary.heat_off_s ?? endS, endS);
      const step = stepNear(tS, wanted);
      slider.min = String(tS[0] ?? 0);
      slider.max = String(endS);
      slider.step = String(endS / resultsDefaults.sliderPositions || 1);
      slider.value = String(wanted);
      renderSummaryBar(byId('summary-bar'), r, renderVerdict(byId('verdict'), cautionList, r));
      renderLedger(byId('ledger'), r);
      renderPrintScenario(byId('print-scenario'), r);
      renderWarnings(byId('warnings'), r);
      showStep(r, step);
      return charts.draw(r, wanted);
    },
    placeholder(message) {
      if (!shown) byId('verdict').replaceChildren(h('p', { class: 'note' }, message));
    },
    stale(message) {
      staleNote.hidden = message === undefined;
      staleNote.textContent = message ?? '';
      document.body.classList.toggle('is-stale', message !== undefined);
    },
    current: () => shown,
  };
}
