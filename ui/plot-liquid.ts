/** The separator's liquid fraction against time, with the half-frozen level and the three events marked. */
import type { Annotation, Data, Shape } from 'plotly.js-dist-min';
import { formatNumber, formatTime } from './format.ts';
import { baseLayout, hoverTexts, levelLine, TEXT_ONLY, timeLine, type Figure } from './plot-common.ts';
import { heatOffLabel } from './plot-temperatures.ts';
import type { ShownResult } from './result.ts';
import { timeAxis, xAxisLayout, xOf, xsOf } from './time-axis.ts';

export function liquidFigure(r: ShownResult): Figure {
  const { record, summary } = r;
  const endS = record.tS[record.tS.length - 1] ?? 0;
  const axis = timeAxis(endS);
  const data: Data[] = [];
  for (const layer of r.layers) {
    const series = record.layers[layer.index]?.liquidFraction;
    if (!layer.separator || !series) continue;
    data.push({
      type: 'scatter', mode: 'lines', x: xsOf(axis, record.tS), y: series, name: `${layer.id} liquid fraction`, line: { width: 2, color: layer.colour },
      text: hoverTexts(series.length, (k) => `t = ${formatTime(record.tS[k]!, '')}<br><b>${layer.id}</b> liquid fraction ${formatNumber(series[k]!, { decimals: 3 })}`),
      hovertemplate: TEXT_ONLY,
    });
  }
  const ev = summary.separator;
  const events: [number | null, number, string][] = [[ev.molten_at_s, 1, 'molten'], [ev.half_frozen_at_s, 0.5, 'half-frozen'], [ev.frozen_at_s, 0, 'frozen']];
  const shown = events.filter((e): e is [number, number, string] => e[0] !== null);
  if (data.length > 0 && shown.length > 0) {
    data.push({
      type: 'scatter', mode: 'text+markers', x: shown.map((e) => xOf(axis, e[0])), y: shown.map((e) => e[1]), name: 'events',
      text: shown.map((e) => `${e[2]} ${formatTime(e[0], '')}`), textposition: 'top right',
      marker: { size: 9, color: '#1f2933', symbol: 'diamond' }, hovertemplate: '%{text}<extra></extra>', showlegend: false,
    });
  }
  const shapes: Partial<Shape>[] = [];
  const annotations: Partial<Annotation>[] = [];
  const half = levelLine(0.5, 'half-frozen level', '#52606d', 'dot', 'left');
  shapes.push(half.shape);
  annotations.push(half.annotation);
  if (summary.heat_off_s !== null && summary.heat_off_s > 0) {
    const off = timeLine(summary.heat_off_s, heatOffLabel, axis);
    shapes.push(off.shape);
    annotations.push(off.annotation);
  }
  if (data.length === 0) {
    annotations.push({ xref: 'paper', yref: 'paper', x: 0.5, y: 0.5, showarrow: false, text: 'No separator layer: tick “separator” on the salt layer.' });
  }
  return {
    data, shapes, axis,
    layout: baseLayout('separator liquid fraction (0–1)', axis, {
      hovermode: 'closest',
      yaxis: { title: { text: 'liquid fraction (0–1)' }, range: [-0.05, 1.12], zeroline: false, gridcolor: '#e4e8ec' },
      margin: { l: 64, r: 24, t: 28, b: 48 },
      showlegend: false,
      xaxis: xAxisLayout(axis, { range: [0, xOf(axis, endS) || 1] }),
      shapes, annotations,
    }),
  };
}
