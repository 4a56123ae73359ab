/**
 * Temperature over height and time (the position–time map): one column per recorded step, one row per node
 * (bottom face, cell centres, top face), layer interfaces marked. Same colour scale as the stack drawing.
 */
import type { Annotation, Data, Shape } from 'plotly.js-dist-min';
import { temperatureScale } from './colours.ts';
import { baseLayout, timeLine, type Figure } from './plot-common.ts';
import { heatOffLabel } from './plot-temperatures.ts';
import { mapRange, type ShownResult } from './result.ts';
import { hoverTime, timeAxis, xOf } from './time-axis.ts';

const defaults = {
  /** More columns than this are thinned (every k-th step, the last always kept): the screen cannot show them. */
  maxColumns: 1500,
} as const;

export function mapFigure(r: ShownResult): Figure {
  const { record, summary } = r;
  const { steps, nodes, data: flat } = record.map;
  const stride = Math.max(1, Math.ceil(steps / defaults.maxColumns));
  const cols: number[] = [];
  for (let j = 0; j < steps; j += stride) cols.push(j);
  if (cols[cols.length - 1] !== steps - 1 && steps > 0) cols.push(steps - 1);
  const z = Array.from({ length: nodes }, (_, n) => cols.map((j) => flat[j * nodes + n]!));
  const { lowC, highC } = mapRange(record);
  const axis = timeAxis(record.tS[record.tS.length - 1] ?? 0);
  const data: Data[] = [{
    type: 'heatmap', x: cols.map((j) => xOf(axis, record.tS[j]!)), y: Array.from(record.nodeXMm), z,
    colorscale: temperatureScale(), zmin: lowC, zmax: highC, zsmooth: false,
    colorbar: { title: { text: '°C' }, thickness: 14 },
    hovertemplate: `${hoverTime(axis)}<br>height %{y:.2f} mm<br>%{z:.1f} °C<extra></extra>`,
  }];
  const shapes: Partial<Shape>[] = [];
  const annotations: Partial<Annotation>[] = [];
  for (const layer of r.layers) {
    if (layer.index > 0) {
      shapes.push({ type: 'line', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: layer.bottomMm, y1: layer.bottomMm, line: { color: 'rgba(255,255,255,0.85)', width: 1 } });
    }
    annotations.push({ xref: 'paper', yref: 'y', x: 0.005, y: (layer.bottomMm + layer.topMm) / 2, xanchor: 'left', showarrow: false,
      text: layer.id, font: { size: 11, color: '#ffffff' } });
  }
  if (summary.heat_off_s !== null && summary.heat_off_s > 0) {
    const off = timeLine(summary.heat_off_s, heatOffLabel, axis, '#ffffff');
    shapes.push(off.shape);
    annotations.push({ ...off.annotation, font: { size: 11, color: '#1f2933' } });
  }
  return {
    data, shapes, axis,
    layout: baseLayout('height above the bottom face, mm', axis, {
      hovermode: 'closest',
      margin: { l: 64, r: 24, t: 28, b: 48 },
      yaxis: { title: { text: 'height above the bottom face, mm' }, zeroline: false },
      shapes, annotations,
    }),
  };
}
