/** What the charts share: configuration (hover, zoom, PNG export), base layout, and marker lines. */
import type { Annotation, Config, Data, Layout, Shape } from 'plotly.js-dist-min';
import { formatTime } from './format.ts';
import { xAxisLayout, xOf, type TimeAxis } from './time-axis.ts';

export function chartConfig(filename: string): Partial<Config> {
  return {
    responsive: true,
    displaylogo: false,
    displayModeBar: true,
    scrollZoom: false,
    toImageButtonOptions: { format: 'png', filename, scale: 2 },
  };
}

export function baseLayout(yTitle: string, axis: TimeAxis, extra: Partial<Layout> = {}): Partial<Layout> {
  return {
    margin: { l: 64, r: 24, t: 16, b: 48 },
    font: { family: 'system-ui, -apple-system, "Segoe UI", sans-serif', size: 12, color: '#1f2933' },
    paper_bgcolor: '#ffffff',
    plot_bgcolor: '#ffffff',
    xaxis: xAxisLayout(axis),
    yaxis: { title: { text: yTitle }, zeroline: false, gridcolor: '#e4e8ec' },
    // at the figure's bottom edge, with the time axis's title pushed clear of its ticks (time-axis.ts automargin):
    // a legend placed at a share of the plot's height lay over the title on the short margin chart
    legend: { orientation: 'h', x: 0, y: 0, yref: 'container', yanchor: 'bottom' },
    ...extra,
  };
}

/** A vertical line across the plot at time t (s), with its label and time at the top. */
export function timeLine(tS: number, label: string, axis: TimeAxis, colour = '#52606d'): { shape: Partial<Shape>; annotation: Partial<Annotation> } {
  const x = xOf(axis, tS);
  return {
    shape: { type: 'line', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: colour, width: 1.5, dash: 'dash' } },
    annotation: {
      xref: 'x', yref: 'paper', x, y: 1, yanchor: 'bottom', xanchor: 'left', showarrow: false,
      text: `${label} ${formatTime(tS, '')}`, font: { size: 11, color: colour },
    },
  };
}

/** A horizontal line at y, labelled above it (or below) at the right end (or left). */
export function levelLine(y: number, label: string, colour: string, dash: 'dash' | 'dot' | 'dashdot', side: 'left' | 'right' = 'right', below = false):
  { shape: Partial<Shape>; annotation: Partial<Annotation> } {
  return {
    shape: { type: 'line', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: y, y1: y, line: { color: colour, width: 1.2, dash } },
    annotation: {
      xref: 'paper', yref: 'y', x: side === 'right' ? 1 : 0, y, xanchor: side === 'right' ? 'right' : 'left', yanchor: below ? 'top' : 'bottom',
      showarrow: false, text: label, font: { size: 11, color: colour },
    },
  };
}

/** The thin cursor line for the time chosen with the slider, t in s (its `name` lets it be replaced alone). */
export function cursorShape(tS: number, axis: TimeAxis): Partial<Shape> {
  const x = xOf(axis, tS);
  return { type: 'line', name: 'cursor', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: '#1f2933', width: 1 } };
}

/**
 * Hover texts built by the one formatting module (sim/observe/format.ts), one per point, for `hovertemplate: '%{text}'`:
 * a tooltip prints a number exactly as the verdict and the CLI do.
 */
export function hoverTexts(n: number, text: (k: number) => string): string[] {
  return Array.from({ length: n }, (_, k) => text(k));
}

/** The hover template that shows the prepared text alone. */
export const TEXT_ONLY = '%{text}<extra></extra>';

export interface Figure {
  readonly data: Data[];
  readonly layout: Partial<Layout>;
  /** Shapes without the time cursor, so moving the cursor only appends one. */
  readonly shapes: Partial<Shape>[];
  /** How the chart's x reads time (undefined: x is not time, no cursor). */
  readonly axis: TimeAxis | undefined;
}
