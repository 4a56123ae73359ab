/**
 * The freeze, zoomed: the minutes after heat off, until a little after the separator is frozen. Each layer's mean
 * temperature (left axis, °C) and the separator's liquid fraction (right axis, 0–1), time counted from heat off,
 * with the separator's solidus and liquidus and the half-frozen and frozen events marked.
 */
import type { Annotation, Data, Shape } from 'plotly.js-dist-min';
import { noValueWords, verdictTerms } from '../sim/index.ts';
import { formatNumber, formatTemperature, formatTime } from './format.ts';
import { baseLayout, hoverTexts, levelLine, TEXT_ONLY, type Figure } from './plot-common.ts';
import { heatOffLabel } from './plot-temperatures.ts';
import type { ShownResult } from './result.ts';
import { timeAxis, xAxisLayout, xOf, xsOf } from './time-axis.ts';

export const freezeDefaults = {
  /** Shown after the last freeze event, as a share of heat off → that event: enough to see the curves settle. */
  tailShare: 0.5,
  /** ... and at least this long, s, so a freeze of a few seconds still has room around it. */
  minTailS: 30,
} as const;

/** The zoom window [from, to], s, or why there is none. */
export function freezeWindow(r: ShownResult): { fromS: number; toS: number } | { why: string } {
  const s = r.summary;
  const endS = r.record.tS[r.record.tS.length - 1] ?? 0;
  if (!r.layers.some((l) => l.separator)) return { why: 'No separator layer: nothing freezes to zoom on.' };
  if (s.heat_off_s === null) return { why: `${noValueWords.heat_off_s[0]!.toUpperCase()}${noValueWords.heat_off_s.slice(1)}: nothing to zoom on after heat off.` };
  const last = s.separator.frozen_at_s ?? s.separator.half_frozen_at_s ?? endS;
  const tail = Math.max((last - s.heat_off_s) * freezeDefaults.tailShare, freezeDefaults.minTailS);
  const toS = Math.min(endS, last + tail);
  return toS > s.heat_off_s ? { fromS: s.heat_off_s, toS } : { why: 'The run ends at heat off.' };
}

export function freezeFigure(r: ShownResult): Figure {
  const { record, summary } = r;
  const w = freezeWindow(r);
  if ('why' in w) {
    const axis = timeAxis(0);
    return { data: [], shapes: [], axis: undefined, layout: baseLayout('temperature, °C', axis, {
      annotations: [{ xref: 'paper', yref: 'paper', x: 0.5, y: 0.5, showarrow: false, text: w.why }],
      xaxis: { visible: false }, yaxis: { visible: false },
    }) };
  }
  const axis = timeAxis(w.toS - w.fromS, w.fromS, heatOffLabel);
  const keep: number[] = [];
  for (let k = 0; k < record.tS.length; k++) if (record.tS[k]! >= w.fromS && record.tS[k]! <= w.toS) keep.push(k);
  const pick = (a: Float64Array): Float64Array => Float64Array.from(keep, (k) => a[k]!);
  const x = xsOf(axis, pick(record.tS));
  const data: Data[] = [];
  for (const layer of r.layers) {
    const s = record.layers[layer.index];
    if (!s) continue;
    const mean = pick(s.meanC);
    data.push({ type: 'scatter', mode: 'lines', x, y: mean, name: `${layer.id} mean`, line: { width: 2, color: layer.colour },
      text: hoverTexts(mean.length, (k) => `<b>${layer.id}</b> mean ${formatTemperature(mean[k]!, '')}`), hovertemplate: TEXT_ONLY });
    if (layer.separator && s.liquidFraction) {
      const liquid = pick(s.liquidFraction);
      data.push({ type: 'scatter', mode: 'lines', x, y: liquid, yaxis: 'y2', name: `${layer.id} liquid fraction`,
        line: { width: 2, color: layer.colour, dash: 'dash' }, hovertemplate: TEXT_ONLY,
        text: hoverTexts(liquid.length, (k) => `<b>${layer.id}</b> liquid fraction ${formatNumber(liquid[k]!, { decimals: 3 })}`) });
    }
  }
  const shapes: Partial<Shape>[] = [];
  const annotations: Partial<Annotation>[] = [];
  for (const layer of r.layers) {
    const m = layer.material.melt;
    if (!layer.separator || !m) continue;
    for (const [c, name] of m.solidusC === m.liquidusC ? [[m.solidusC, 'melts']] as const : [[m.solidusC, 'solidus'], [m.liquidusC, 'liquidus']] as const) {
      const l = levelLine(c, `${layer.id} ${name} ${formatNumber(c, { decimals: 0 })} °C`, '#52606d', 'dot', 'right', name === 'solidus');
      shapes.push(l.shape);
      annotations.push(l.annotation);
    }
  }
  const ev = summary.separator;
  const events = [[ev.half_frozen_at_s, verdictTerms.half_frozen_at_s.term, 1], [ev.frozen_at_s, verdictTerms.frozen_at_s.term, 0.92]] as const;
  for (const [t, name, yLabel] of events) {
    if (t === null || t < w.fromS || t > w.toS) continue;
    const xe = xOf(axis, t);
    shapes.push({ type: 'line', xref: 'x', yref: 'paper', x0: xe, x1: xe, y0: 0, y1: 1, line: { color: '#1f2933', width: 1, dash: 'dot' } });
    annotations.push({ xref: 'x', yref: 'paper', x: xe, y: yLabel, yanchor: 'bottom', xanchor: 'left', showarrow: false, bgcolor: 'rgba(255,255,255,0.8)',
      text: `${name.replace('separator ', '')} ${formatTime(t, '')}`, font: { size: 11, color: '#1f2933' } });
  }
  return {
    data, shapes, axis,
    layout: baseLayout('temperature, °C', axis, {
      hovermode: 'x unified',
      xaxis: xAxisLayout(axis, { range: [0, xOf(axis, w.toS)] }),
      yaxis: { title: { text: 'mean temperature, °C' }, zeroline: false, gridcolor: '#e4e8ec' },
      yaxis2: { title: { text: 'liquid fraction (0–1)' }, overlaying: 'y', side: 'right', range: [-0.05, 1.12], zeroline: false, showgrid: false,
        tickmode: 'array', tickvals: [0, 0.5, 1] },
      margin: { l: 64, r: 64, t: 28, b: 48 },
      shapes, annotations,
    }),
  };
}
