/**
 * The charts. Plotly (≈4.6 MB) arrives through a dynamic import requested only once the first verdict is on
 * screen, so neither its download nor its start-up delays the numbers; until then each chart box says it is
 * loading. Charts are drawn one per task (temperatures first), so the page answers input between them. Only the
 * newest result is drawn; the time cursor moves without redrawing the data.
 */
import type { Layout } from 'plotly.js-dist-min';
import { h } from './dom.ts';
import { chartConfig, cursorShape, type Figure } from './plot-common.ts';
import { freezeFigure } from './plot-freeze.ts';
import { liquidFigure } from './plot-liquid.ts';
import { mapFigure } from './plot-map.ts';
import { marginFigure } from './plot-margin.ts';
import { temperatureFigure } from './plot-temperatures.ts';
import type { ShownResult } from './result.ts';

type PlotlyApi = (typeof import('plotly.js-dist-min'))['default'];

let plotly: Promise<PlotlyApi> | undefined;
let plotlyReady = false;

/** Loads Plotly (once). */
export const loadPlotly = (): Promise<PlotlyApi> =>
  (plotly ??= import('plotly.js-dist-min').then((m) => { plotlyReady = true; return m.default; }));

/** Resolves after the browser has had the chance to handle input. */
const nextTask = (): Promise<void> => new Promise((resolve) => setTimeout(resolve, 0));

/** Resolves after the next paint. */
const afterPaint = (): Promise<void> => new Promise((resolve) => requestAnimationFrame(() => setTimeout(resolve, 0)));

export interface ChartElements {
  readonly temperatures: HTMLElement;
  readonly liquid: HTMLElement;
  readonly map: HTMLElement;
  /** The freeze, zoomed on the minutes after heat off. */
  readonly freeze: HTMLElement;
  /** Margin to each layer's binding limit against time. */
  readonly margin: HTMLElement;
  /** Where limits too far above the curves to draw are listed. */
  readonly offScale: HTMLElement;
}

export interface Charts {
  /** Draws a result; resolves when every chart shows it (or a newer result took its place). */
  readonly draw: (r: ShownResult, cursorS: number | undefined) => Promise<void>;
  readonly moveCursor: (tS: number) => void;
  /** Sizes the charts for the one-page printed report (on) or back to their boxes (off); resolves when redrawn. */
  readonly forPrint: (on: boolean) => Promise<void>;
}

export const printDefaults = {
  /** Two charts side by side on an A4 page with 10 mm margins (718 px of 96 dpi across), px. */
  widthPx: 350,
  /** Low enough that four charts, the scenario, the verdict and the cautions fit one page, px. */
  heightPx: 205,
} as const;

/** PNG names, in drawing order (temperatures first: it is the chart most people look at). */
const FILE_NAMES = ['freezeline-temperatures', 'freezeline-liquid-fraction', 'freezeline-freeze', 'freezeline-margin', 'freezeline-map'] as const;

export function createCharts(el: ChartElements): Charts {
  const boxes = [el.temperatures, el.liquid, el.freeze, el.margin, el.map] as const;
  for (const b of boxes) b.append(h('div', { class: 'chart-loading' }, 'loading the chart library…'));
  let latest = 0;
  let figures: (Figure | undefined)[] = [];
  let cursor: number | undefined;
  let frame = 0;

  const layoutWithCursor = (f: Figure): Partial<Layout> =>
    ({ ...f.layout, shapes: cursor === undefined || !f.axis ? f.shapes : [...f.shapes, cursorShape(cursor, f.axis)] });

  const failed = (e: unknown): void => {
    for (const b of boxes) b.replaceChildren(h('div', { class: 'chart-loading' }, `The chart library did not load: ${(e as Error).message}`));
  };

  return {
    async draw(r, cursorS) {
      const ticket = ++latest;
      let api: PlotlyApi;
      try {
        // the first time, let the verdict paint before the chart library starts; later, draw in the same frame
        if (!plotlyReady) await afterPaint();
        api = await loadPlotly();
      } catch (e) {
        failed(e);
        return;
      }
      if (ticket !== latest) return;
      cursor = cursorS;
      const temp = temperatureFigure(r);
      el.offScale.textContent = temp.offScale.length > 0 ? `Limits above the chart: ${temp.offScale.map((o) => o.text).join('; ')}.` : '';
      const build = [() => temp, () => liquidFigure(r), () => freezeFigure(r), () => marginFigure(r), () => mapFigure(r)] as const;
      figures = [];
      for (let i = 0; i < boxes.length; i++) {
        if (i > 0) await nextTask();
        if (ticket !== latest) return;
        const f = build[i]!();
        figures[i] = f;
        boxes[i]!.querySelector('.chart-loading')?.remove();
        await api.react(boxes[i]!, f.data, layoutWithCursor(f), chartConfig(FILE_NAMES[i]!));
        if (i === 0) performance.mark('freezeline:temperatures-plotted');
      }
    },
    async forPrint(on) {
      if (figures.length === 0) return;
      const api = await loadPlotly();
      await Promise.all(boxes.map(async (b, i) => {
        if (!figures[i]) return;
        // on paper the legend gives way to the plot: the layer colours are keyed in the printed scenario table
        if (on) {
          await api.relayout(b, { width: printDefaults.widthPx, height: printDefaults.heightPx, showlegend: false, 'font.size': 9,
            'margin.t': 22, 'margin.b': 30, 'margin.l': 48 } as Partial<Layout>);
        } else {
          const f = figures[i]!;
          await api.relayout(b, { width: null, height: null, showlegend: f.layout.showlegend ?? null, 'font.size': 12,
            'margin.t': f.layout.margin?.t ?? null, 'margin.b': f.layout.margin?.b ?? null, 'margin.l': f.layout.margin?.l ?? null } as unknown as Partial<Layout>);
          await api.Plots.resize(b);
        }
      }));
    },
    moveCursor(tS) {
      cursor = tS;
      if (frame !== 0 || figures.length === 0) return;
      frame = requestAnimationFrame(() => {
        frame = 0;
        void loadPlotly().then((api) => {
          figures.forEach((f, i) => {
            if (!f || !f.axis || f.data.length === 0) return;
            void api.relayout(boxes[i]!, { shapes: layoutWithCursor(f).shapes ?? [] });
          });
        });
      });
    },
  };
}
