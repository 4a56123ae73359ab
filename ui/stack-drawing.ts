/**
 * The stack in cross-section, to scale (height and width in the same mm per pixel, unless the stack is too thin to
 * see, then the height is stretched and the drawing says by how much), coloured by the temperature profile at the
 * chosen time: one gradient stop per node, on the same colour scale as the position–time map.
 */
import { temperatureColour } from './colours.ts';
import { svg } from './dom.ts';
import { formatNumber, formatTime } from './format.ts';
import { mapRange, type ShownResult } from './result.ts';

const geometry = {
  width: 560, stackWidth: 250, left: 16, top: 14, minStackHeight: 110, maxStackHeight: 300,
  labelGap: 32, labelX: 300, legendHeight: 46, strip: 6,
} as const;

interface Placed { readonly y: number; readonly ideal: number }

/** Spreads label centres at least `gap` apart, keeping them near their ideal heights and inside [lo, hi]. */
export function spreadLabels(ideal: readonly number[], gap: number, lo: number, hi: number): number[] {
  const order = ideal.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
  const placed: Placed[] = [];
  for (const o of order) {
    const prev = placed[placed.length - 1];
    placed.push({ y: prev ? Math.max(o.y, prev.y + gap) : Math.max(o.y, lo), ideal: o.y });
  }
  const overflow = (placed[placed.length - 1]?.y ?? hi) - hi;
  const shifted = overflow > 0 ? placed.map((p) => ({ ...p, y: p.y - overflow })) : placed;
  const out = new Array<number>(ideal.length);
  order.forEach((o, k) => { out[o.i] = shifted[k]!.y; });
  return out;
}

export function drawStack(host: HTMLElement, r: ShownResult | undefined, step: number): void {
  if (!r || r.layers.length === 0) {
    host.replaceChildren(svg('svg', { viewBox: `0 0 ${geometry.width} 60`, role: 'img', 'aria-label': 'stack drawing' },
      svg('text', { x: 16, y: 34, class: 'stack-label' }, 'The stack is drawn once a result is computed.')));
    return;
  }
  const { record } = r;
  const totalMm = record.nodeXMm[record.nodeXMm.length - 1] ?? r.layers[r.layers.length - 1]!.topMm;
  let stackW: number = geometry.stackWidth;
  let pxPerMm = r.widthMm !== undefined ? stackW / r.widthMm : geometry.minStackHeight * 1.5 / totalMm;
  let stretch = 1;
  if (totalMm * pxPerMm > geometry.maxStackHeight) {
    pxPerMm = geometry.maxStackHeight / totalMm;
    if (r.widthMm !== undefined) stackW = Math.max(r.widthMm * pxPerMm, 40);
  }
  let vPerMm = pxPerMm;
  if (totalMm * vPerMm < geometry.minStackHeight) {
    vPerMm = geometry.minStackHeight / totalMm;
    stretch = vPerMm / pxPerMm;
  }
  const stackH = totalMm * vPerMm;
  const y0 = geometry.top + Math.max(stackH, r.layers.length * geometry.labelGap);
  const yOf = (mm: number) => y0 - mm * vPerMm;
  const { lowC, highC } = mapRange(record);
  const frac = (c: number) => (c - lowC) / (highC - lowC);
  const nodes = record.map.nodes;
  const row = (n: number) => record.map.data[step * nodes + n]!;
  const stops = Array.from(record.nodeXMm, (x, n) => svg('stop', { offset: formatNumber(x / totalMm, { decimals: 5 }), 'stop-color': temperatureColour(frac(row(n))) }));
  const gradient = svg('linearGradient', { id: 'stack-profile', gradientUnits: 'userSpaceOnUse', x1: 0, x2: 0, y1: yOf(0), y2: yOf(totalMm) }, ...stops);
  const legendStops = Array.from({ length: 11 }, (_, k) => svg('stop', { offset: k / 10, 'stop-color': temperatureColour(k / 10) }));
  const legend = svg('linearGradient', { id: 'stack-legend', x1: 0, x2: 1, y1: 0, y2: 0 }, ...legendStops);
  const x0 = geometry.left;
  const ideal = r.layers.map((l) => yOf((l.bottomMm + l.topMm) / 2));
  const labelY = spreadLabels(ideal, geometry.labelGap, geometry.top + 10, y0 - 6);
  const items = r.layers.flatMap((l, i) => {
    const s = record.layers[l.index];
    const meanC = s?.meanC[step];
    const yTop = yOf(l.topMm);
    const y = labelY[i]!;
    return [
      svg('rect', { x: x0, y: yTop, width: stackW, height: Math.max(l.thicknessMm * vPerMm, 0.5), fill: 'url(#stack-profile)',
        class: l.separator ? 'stack-layer separator' : 'stack-layer' }),
      // the layer's own colour (as in the editor and the charts) in a strip beside it
      svg('rect', { x: x0 - geometry.strip - 2, y: yTop, width: geometry.strip, height: Math.max(l.thicknessMm * vPerMm, 0.5), fill: l.colour,
        class: 'layer-strip', 'data-layer': l.id }),
      svg('polyline', { points: `${x0 + stackW},${ideal[i]} ${geometry.labelX - 8},${y}`, class: 'stack-leader' }),
      svg('text', { x: geometry.labelX, y: y - 3, class: 'stack-label' },
        svg('tspan', { class: 'stack-id', fill: l.colour }, l.id), ` · ${l.material.name}${l.separator ? ' · separator' : ''}`),
      svg('text', { x: geometry.labelX, y: y + 12, class: 'stack-sub' },
        `${formatNumber(l.thicknessMm, { significant: 3 })} mm · mean ${formatNumber(meanC, { decimals: 0 })} °C`),
    ];
  });
  const barMm = r.widthMm !== undefined ? niceLength(r.widthMm / 2) : undefined;
  const ly = y0 + 18;
  const height = ly + geometry.legendHeight;
  host.replaceChildren(svg('svg', {
    viewBox: `0 0 ${geometry.width} ${height}`, role: 'img',
    'aria-label': `stack cross-section at t = ${formatTime(record.tS[step] ?? null, '—')}`,
  },
  svg('defs', {}, gradient, legend),
  ...items,
  barMm === undefined ? undefined : svg('line', { x1: x0, x2: x0 + barMm * pxPerMm, y1: y0 + 6, y2: y0 + 6, class: 'scale-bar' }),
  barMm === undefined ? undefined : svg('text', { x: x0 + barMm * pxPerMm + 6, y: y0 + 10, class: 'stack-sub' }, `${formatNumber(barMm, { significant: 2 })} mm`),
  svg('text', { x: x0, y: ly + 12, class: 'stack-sub' },
    r.widthMm === undefined ? 'no footprint given: width not to scale'
      : stretch > 1.01 ? `width ${formatNumber(r.widthMm, { significant: 3 })} mm; height stretched ×${formatNumber(stretch, { significant: 2 })} to be seen`
        : `to scale: width ${formatNumber(r.widthMm, { significant: 3 })} mm`),
  svg('rect', { x: geometry.labelX, y: ly + 8, width: 200, height: 10, fill: 'url(#stack-legend)', class: 'legend-bar' }),
  svg('text', { x: geometry.labelX, y: ly + 32, class: 'stack-sub' }, `${formatNumber(lowC, { decimals: 0 })} °C`),
  svg('text', { x: geometry.labelX + 200, y: ly + 32, class: 'stack-sub', 'text-anchor': 'end' }, `${formatNumber(highC, { decimals: 0 })} °C`)));
}

/** A round length (1, 2 or 5 × 10ⁿ mm) no longer than the stack, for the scale bar. */
function niceLength(totalMm: number): number {
  const p = 10 ** Math.floor(Math.log10(totalMm));
  for (const m of [5, 2, 1]) if (m * p <= totalMm) return m * p;
  return p;
}
