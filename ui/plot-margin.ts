/**
 * Margin against time, per layer: the layer's binding limit minus its current highest temperature, K. Zero is the
 * limit; the band up to the "no margin" threshold (ui/cautions.ts) is shaded. A thin magnesium layer also shows its
 * margin to the lower ignition figure of thin forms, dotted.
 */
import type { Annotation, Data, Shape } from 'plotly.js-dist-min';
import { verdictTerms } from '../sim/index.ts';
import { cautionDefaults, scenarioCautions } from './cautions.ts';
import { formatMargin, formatNumber } from './format.ts';
import { baseLayout, hoverTexts, levelLine, TEXT_ONLY, timeLine, type Figure } from './plot-common.ts';
import { heatOffLabel } from './plot-temperatures.ts';
import type { ShownResult } from './result.ts';
import { timeAxis, xAxisLayout, xsOf } from './time-axis.ts';

export function marginFigure(r: ShownResult): Figure {
  const { record, summary } = r;
  const axis = timeAxis(record.tS[record.tS.length - 1] ?? 0);
  const x = xsOf(axis, record.tS);
  const thin = new Set(scenarioCautions(r.layers, summary).filter((c) => c.kind === 'thin-magnesium').map((c) => c.layer));
  const data: Data[] = [];
  const below = (atC: number, maxC: Float64Array): Float64Array => Float64Array.from(maxC, (c) => atC - c);
  const texts = (m: Float64Array, what: string) => hoverTexts(m.length, (k) => `${what} ${formatMargin(m[k]!, '')}`);
  for (const layer of r.layers) {
    const limit = summary.layers[layer.id]?.limit;
    const s = record.layers[layer.index];
    if (!limit || !s) continue;
    const m = below(limit.at_C, s.maxC);
    data.push({
      type: 'scatter', mode: 'lines', x, y: m, name: `${layer.id} to ${limit.kind} ${formatNumber(limit.at_C, { decimals: 0 })} °C`,
      line: { width: 2, color: layer.colour }, hovertemplate: TEXT_ONLY, text: texts(m, `<b>${layer.id}</b> ${verdictTerms.margin_K.term} to ${limit.kind}`),
    });
    if (thin.has(layer.id)) {
      const c = cautionDefaults.thinMagnesiumIgnitionC;
      const mThin = below(c, s.maxC);
      data.push({
        type: 'scatter', mode: 'lines', x, y: mThin, name: `${layer.id} to thin-magnesium ignition ${c} °C`,
        line: { width: 2, color: layer.colour, dash: 'dot' }, hovertemplate: TEXT_ONLY, text: texts(mThin, `<b>${layer.id}</b> to ${c} °C (thin)`),
      });
    }
  }
  const shapes: Partial<Shape>[] = [
    { type: 'rect', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: 0, y1: cautionDefaults.noMarginK, fillcolor: 'rgba(217,154,0,0.14)', line: { width: 0 }, layer: 'below' },
  ];
  const annotations: Partial<Annotation>[] = [];
  // one label for both levels: they sit a few pixels apart when margins run to a thousand kelvin
  const zero = levelLine(0, '', '#b42318', 'dash');
  const none = levelLine(cautionDefaults.noMarginK, `shaded: ≤ ${cautionDefaults.noMarginK} K, no margin · red dashed: limit reached`, '#7a4b00', 'dot', 'left');
  shapes.push(zero.shape, none.shape);
  annotations.push(none.annotation);
  if (summary.heat_off_s !== null && summary.heat_off_s > 0) {
    const off = timeLine(summary.heat_off_s, heatOffLabel, axis);
    shapes.push(off.shape);
    annotations.push(off.annotation);
  }
  if (data.length === 0) annotations.push({ xref: 'paper', yref: 'paper', x: 0.5, y: 0.5, showarrow: false, text: 'No layer of this stack has a limit on file.' });
  return {
    data, shapes, axis,
    layout: baseLayout(`${verdictTerms.margin_K.term}, K`, axis, {
      hovermode: 'x unified',
      xaxis: xAxisLayout(axis),
      yaxis: { title: { text: `${verdictTerms.margin_K.term}, K` }, zeroline: false, gridcolor: '#e4e8ec', rangemode: 'tozero' },
      margin: { l: 64, r: 24, t: 28, b: 48 },
      shapes, annotations,
    }),
  };
}
