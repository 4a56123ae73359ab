/**
 * Temperature against time, per layer: the mean as a line, the min–max over the layer as a band; a labelled level
 * at each layer limit that lies near the curves (the binding limit always), the separator's solidus and liquidus,
 * and a vertical line where the heater is removed. With a heater body, its plate temperature as a line and its power
 * (W, stepped: each value holds over the step that ends at it) on an axis of its own at the right.
 */
import type { Annotation, Data, Shape } from 'plotly.js-dist-min';
import { translucent } from './colours.ts';
import { verdictTerms } from '../sim/index.ts';
import { formatMargin, formatNumber, formatTemperature } from './format.ts';
import { baseLayout, hoverTexts, levelLine, TEXT_ONLY, timeLine, type Figure } from './plot-common.ts';
import type { ShownResult } from './result.ts';
import { timeAxis, xsOf } from './time-axis.ts';

/** The words of the vertical line at heat off ("heat off"), from the wording table's "heat off at". */
export const heatOffLabel = verdictTerms.heat_off_s.term.replace(/ at$/, '');

const defaults = {
  /** Limits further above the hottest curve than this share of the curves' span (or 100 K) are listed, not drawn. */
  limitReachShare: 1,
  limitReachMinK: 100,
  bandAlpha: 0.18,
} as const;

export interface OffScaleLimit { readonly text: string }

export function temperatureFigure(r: ShownResult): Figure & { offScale: OffScaleLimit[] } {
  const { record, summary } = r;
  const axis = timeAxis(record.tS[record.tS.length - 1] ?? 0);
  const x = xsOf(axis, record.tS);
  const data: Data[] = [];
  let low = Infinity;
  let high = -Infinity;
  r.layers.forEach((layer, li) => {
    const s = record.layers[li];
    if (!s) return;
    for (const v of s.minC) low = Math.min(low, v);
    for (const v of s.maxC) high = Math.max(high, v);
    const text = hoverTexts(s.meanC.length, (j) => `<b>${layer.id}</b> mean ${formatTemperature(s.meanC[j]!, '')}, `
      + `min ${formatTemperature(s.minC[j]!, '')}, max ${formatTemperature(s.maxC[j]!, '')}`);
    data.push(
      { type: 'scatter', mode: 'lines', x, y: s.maxC, line: { width: 0, color: layer.colour }, legendgroup: layer.id, showlegend: false, hoverinfo: 'skip', name: `${layer.id} max` },
      { type: 'scatter', mode: 'lines', x, y: s.minC, line: { width: 0, color: layer.colour }, fill: 'tonexty', fillcolor: translucent(layer.colour, defaults.bandAlpha), legendgroup: layer.id, showlegend: false, hoverinfo: 'skip', name: `${layer.id} min` },
      {
        type: 'scatter', mode: 'lines', x, y: s.meanC, text, line: { width: 2, color: layer.colour }, legendgroup: layer.id,
        name: `${layer.id} (${layer.material.name})`,
        hovertemplate: TEXT_ONLY,
      });
  });
  const heater = record.heater;
  if (heater) {
    // NaN where the cell is off the heater (a lifted-off plate is not followed): a gap in the line
    const plate = Array.from(heater.plateC, (c) => (Number.isNaN(c) ? null : c));
    for (const c of plate) if (c !== null) { low = Math.min(low, c); high = Math.max(high, c); }
    data.push(
      { type: 'scatter', mode: 'lines', x, y: plate, line: { width: 1.5, color: '#9a3412', dash: 'dot' }, name: 'heater plate, °C', hovertemplate: 'heater plate %{y:.1f} °C<extra></extra>' },
      // translucent: a thermostat switching every few seconds draws a solid block, and the second axis's traces lie
      // over the layers' curves, which must still show through
      { type: 'scatter', mode: 'lines', x, y: Array.from(heater.powerW), yaxis: 'y2', opacity: 0.35, line: { width: 1, color: '#b45309', shape: 'vh' }, name: 'heater power, W', hovertemplate: 'heater power %{y:.0f} W<extra></extra>' },
    );
  }
  const shapes: Partial<Shape>[] = [];
  const annotations: Partial<Annotation>[] = [];
  const add = (l: { shape: Partial<Shape>; annotation: Partial<Annotation> }) => { shapes.push(l.shape); annotations.push(l.annotation); };
  const reach = high + Math.max((high - low) * defaults.limitReachShare, defaults.limitReachMinK);
  const offScale: OffScaleLimit[] = [];
  let top = high;
  for (const layer of r.layers) {
    const verdict = summary.layers[layer.id];
    // limits of one layer at one temperature (magnesium: ignition and melt at 650 °C) share one line
    const byLevel = new Map<number, { kinds: string[]; marginK: number; binding: boolean }>();
    for (const limit of verdict?.limits ?? []) {
      const entry = byLevel.get(limit.at_C) ?? { kinds: [], marginK: limit.margin_K, binding: false };
      entry.kinds.push(limit.kind);
      entry.binding ||= summary.binding_layer === layer.id && verdict?.limit?.at_C === limit.at_C;
      byLevel.set(limit.at_C, entry);
    }
    for (const [atC, entry] of byLevel) {
      const text = `${layer.id} ${entry.kinds.join(', ')} ${formatNumber(atC, { decimals: 0 })} °C`;
      if (atC <= reach || entry.binding) {
        add(levelLine(atC, text, layer.colour, 'dash'));
        top = Math.max(top, atC);
      } else {
        offScale.push({ text: `${text} (${verdictTerms.margin_K.term} ${formatMargin(entry.marginK, '')})` });
      }
    }
  }
  for (const layer of r.layers) {
    const m = layer.material.melt;
    if (!layer.separator || !m) continue;
    if (m.solidusC === m.liquidusC) add(levelLine(m.solidusC, `${layer.id} melts ${formatNumber(m.solidusC, { decimals: 0 })} °C`, '#52606d', 'dot'));
    else {
      add(levelLine(m.solidusC, `${layer.id} solidus ${formatNumber(m.solidusC, { decimals: 0 })} °C`, '#52606d', 'dot', 'right', true));
      add(levelLine(m.liquidusC, `${layer.id} liquidus ${formatNumber(m.liquidusC, { decimals: 0 })} °C`, '#52606d', 'dot'));
    }
  }
  if (summary.heat_off_s !== null && summary.heat_off_s > 0) add(timeLine(summary.heat_off_s, heatOffLabel, axis));
  const pad = (top - low) * 0.06 || 1;
  return {
    data,
    shapes,
    offScale,
    axis,
    layout: baseLayout('temperature, °C', axis, {
      hovermode: 'x unified',
      yaxis: { title: { text: 'temperature, °C' }, range: [low - pad, top + pad], zeroline: false, gridcolor: '#e4e8ec' },
      ...(heater ? { yaxis2: { title: { text: 'heater power, W' }, overlaying: 'y', side: 'right', rangemode: 'tozero', showgrid: false, tickmode: 'auto' } } : {}),
      margin: { l: 64, r: heater ? 64 : 24, t: 28, b: 48 },
      shapes, annotations,
    }),
  };
}
