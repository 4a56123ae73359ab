/**
 * The operating chart: over the heater hold (time of heat off), the smallest margin to any limit (left axis, with the
 * binding layer named where it changes) and the usable window after heat off (right axis). Holds that both keep the
 * required margin and melt the separator are shaded; the required margin, the scenario's own hold and the longest
 * hold are marked. A quantity that does not exist at a hold is a gap in its line, never a made-up number.
 */
import type { Data, Layout, Shape, Annotation } from 'plotly.js-dist-min';
import type { Interval } from '../sim/index.ts';
import type { WindowReport } from '../sim/index.ts';
import { formatNumber } from './format.ts';

const COLOURS = { margin: '#1f5f99', window: '#3f8f3a', band: 'rgba(47, 125, 74, 0.13)', required: '#b42318', own: '#52606d', longest: '#1f2933' } as const;

/** The holds in both sets: every overlap of a safe interval with a molten one. */
export function operatingBands(safe: readonly Interval[], molten: readonly Interval[]): { from: number; to: number }[] {
  const out: { from: number; to: number }[] = [];
  for (const a of safe) {
    for (const b of molten) {
      const from = Math.max(a.from, b.from);
      const to = Math.min(a.to, b.to);
      if (to > from) out.push({ from, to });
    }
  }
  return out;
}

const finiteOrNull = (v: number | null): number | null => (v !== null && Number.isFinite(v) ? v : null);

function verticalLine(x: number, label: string, colour: string, dash: 'dash' | 'dot', y: number): { shape: Partial<Shape>; annotation: Partial<Annotation> } {
  return {
    shape: { type: 'line', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: colour, width: 1.4, dash } },
    annotation: { xref: 'x', yref: 'paper', x, y, xanchor: 'left', yanchor: 'bottom', showarrow: false, text: label, font: { size: 11, color: colour } },
  };
}

export function operatingFigure(r: WindowReport): { data: Data[]; layout: Partial<Layout> } {
  const pts = r.points;
  const x = pts.map((p) => p.value);
  let lastLayer = '';
  const labels = pts.map((p) => {
    const layer = p.binding?.layer ?? '';
    const text = layer !== lastLayer ? layer : '';
    lastLayer = layer;
    return text;
  });
  const hover = pts.map((p) => (p.binding
    ? `${p.binding.layer}: ${p.binding.kind} limit ${formatNumber(p.binding.limit_C, { decimals: 0 })} °C, peak ${formatNumber(p.binding.peak_C, { decimals: 1 })} °C`
    : 'no limit on file'));
  const data: Data[] = [
    {
      type: 'scatter', mode: 'text+lines+markers', name: 'smallest margin to a limit, K', x, y: pts.map((p) => finiteOrNull(p.margin_K)),
      text: labels, textposition: 'top center', textfont: { size: 11, color: COLOURS.margin }, hovertext: hover,
      hovertemplate: 'hold %{x:.1f} s<br>margin %{y:.1f} K<br>%{hovertext}<extra></extra>',
      line: { color: COLOURS.margin, width: 2 }, marker: { size: 5 }, connectgaps: false,
    },
    {
      type: 'scatter', mode: 'lines+markers', name: 'usable window after heat off, s', x, y: pts.map((p) => finiteOrNull(p.window_s)), yaxis: 'y2',
      hovertemplate: 'hold %{x:.1f} s<br>usable window %{y:.1f} s<extra></extra>',
      line: { color: COLOURS.window, width: 2, dash: 'dot' }, marker: { size: 4 }, connectgaps: false,
    },
  ];
  const shapes: Partial<Shape>[] = operatingBands(r.safe, r.molten).map((b) => ({
    type: 'rect', xref: 'x', yref: 'paper', x0: b.from, x1: b.to, y0: 0, y1: 1, fillcolor: COLOURS.band, line: { width: 0 }, layer: 'below',
  }));
  const annotations: Partial<Annotation>[] = [];
  shapes.push({ type: 'line', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: r.margin_K, y1: r.margin_K, line: { color: COLOURS.required, width: 1.2, dash: 'dash' } });
  annotations.push({ xref: 'paper', yref: 'y', x: 1, y: r.margin_K, xanchor: 'right', yanchor: 'bottom', showarrow: false,
    text: `required margin ${formatNumber(r.margin_K, { decimals: 0 })} K`, font: { size: 11, color: COLOURS.required } });
  const own = verticalLine(r.knob.own, `scenario's hold ${formatNumber(r.knob.own, { decimals: 0 })} s`, COLOURS.own, 'dash', 1);
  shapes.push(own.shape);
  annotations.push(own.annotation);
  if (r.longest) {
    const l = verticalLine(r.longest.value, `longest hold ${formatNumber(r.longest.value, { decimals: 1 })} s`, COLOURS.longest, 'dot', 0.9);
    shapes.push(l.shape);
    annotations.push(l.annotation);
  }
  const layout: Partial<Layout> = {
    margin: { l: 64, r: 64, t: 28, b: 48 },
    font: { family: 'system-ui, -apple-system, "Segoe UI", sans-serif', size: 12, color: '#1f2933' },
    paper_bgcolor: '#ffffff', plot_bgcolor: '#ffffff',
    xaxis: { title: { text: 'heater hold (time of heat off), s' }, zeroline: false, gridcolor: '#e4e8ec' },
    yaxis: { title: { text: 'smallest margin to a limit, K' }, zeroline: true, gridcolor: '#e4e8ec' },
    yaxis2: { title: { text: 'usable window after heat off, s' }, overlaying: 'y', side: 'right', zeroline: false, showgrid: false, rangemode: 'tozero', tickmode: 'auto' },
    legend: { orientation: 'h', y: -0.2, x: 0 },
    shapes, annotations,
  };
  return { data, layout };
}
