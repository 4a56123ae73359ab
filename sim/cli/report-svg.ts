/**
 * A small line chart as inline SVG text, for the self-contained HTML report (no script, no network). Axes with
 * "nice" ticks (1, 2, 5 × 10ⁿ), one polyline per series, dashed vertical markers (heat off), a legend. A long series
 * is thinned to at most `maxPoints` points by keeping every k-th one plus the last, which is invisible at this size.
 */
import { formatNumber } from '../observe/format.ts';

export interface ChartSeries { readonly name: string; readonly x: ArrayLike<number>; readonly y: ArrayLike<number>; readonly colour: string }
export interface Chart {
  readonly title: string;
  readonly xLabel: string;
  readonly yLabel: string;
  readonly series: readonly ChartSeries[];
  readonly markers?: readonly { readonly x: number; readonly label: string }[];
  /** Divide x by this before drawing (60 to draw seconds as minutes). */
  readonly xScale?: number;
}

export const reportSvgDefaults = {
  width: 640, height: 300, margin: { left: 60, right: 20, top: 30, bottom: 64 },
  /** Points per polyline: more than the pixels across, so thinning changes nothing a reader can see. */
  maxPoints: 800,
  ticks: 6,
} as const;

const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** Tick values covering [lo, hi] at a 1-2-5 step. */
export function niceTicks(lo: number, hi: number, count: number): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

export function lineChart(c: Chart): string {
  const { width: W, height: H, margin: m, maxPoints, ticks } = reportSvgDefaults;
  const xs = c.xScale ?? 1;
  let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
  for (const s of c.series) {
    for (let i = 0; i < s.x.length; i++) {
      const x = s.x[i]! / xs, y = s.y[i]!;
      if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
      x0 = Math.min(x0, x); x1 = Math.max(x1, x); y0 = Math.min(y0, y); y1 = Math.max(y1, y);
    }
  }
  if (!(x1 >= x0) || !(y1 >= y0)) return `<p>${esc(c.title)}: no data to draw.</p>`;
  const yt = niceTicks(y0, y1 === y0 ? y0 + 1 : y1, ticks);
  y0 = Math.min(y0, yt[0]!); y1 = Math.max(y1 === y0 ? y0 + 1 : y1, yt[yt.length - 1]!);
  const xt = niceTicks(x0, x1 === x0 ? x0 + 1 : x1, ticks);
  const px = (x: number) => m.left + ((x - x0) / (x1 - x0 || 1)) * (W - m.left - m.right);
  const py = (y: number) => H - m.bottom - ((y - y0) / (y1 - y0 || 1)) * (H - m.top - m.bottom);
  const parts: string[] = [`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${esc(c.title)}">`,
    `<text x="${m.left}" y="18" font-size="13" font-weight="bold">${esc(c.title)}</text>`];
  for (const v of yt) parts.push(`<line x1="${m.left}" x2="${W - m.right}" y1="${py(v).toFixed(1)}" y2="${py(v).toFixed(1)}" stroke="#ddd"/><text x="${m.left - 6}" y="${(py(v) + 4).toFixed(1)}" font-size="11" text-anchor="end">${formatNumber(v, { significant: 4 })}</text>`);
  for (const v of xt) parts.push(`<line x1="${px(v).toFixed(1)}" x2="${px(v).toFixed(1)}" y1="${m.top}" y2="${H - m.bottom}" stroke="#eee"/><text x="${px(v).toFixed(1)}" y="${H - m.bottom + 16}" font-size="11" text-anchor="middle">${formatNumber(v, { significant: 4 })}</text>`);
  parts.push(`<text x="${(m.left + W - m.right) / 2}" y="${H - m.bottom + 32}" font-size="12" text-anchor="middle">${esc(c.xLabel)}</text>`,
    `<text x="14" y="${(m.top + H - m.bottom) / 2}" font-size="12" text-anchor="middle" transform="rotate(-90 14 ${(m.top + H - m.bottom) / 2})">${esc(c.yLabel)}</text>`);
  for (const mk of c.markers ?? []) {
    const x = px(mk.x / xs);
    parts.push(`<line x1="${x.toFixed(1)}" x2="${x.toFixed(1)}" y1="${m.top}" y2="${H - m.bottom}" stroke="#555" stroke-dasharray="4 3"/><text x="${(x + 4).toFixed(1)}" y="${m.top + 12}" font-size="11">${esc(mk.label)}</text>`);
  }
  c.series.forEach((s, k) => {
    const n = s.x.length;
    const stride = Math.max(1, Math.ceil(n / maxPoints));
    const pts: string[] = [];
    for (let i = 0; i < n; i += stride) pts.push(`${px(s.x[i]! / xs).toFixed(1)},${py(s.y[i]!).toFixed(1)}`);
    if ((n - 1) % stride !== 0) pts.push(`${px(s.x[n - 1]! / xs).toFixed(1)},${py(s.y[n - 1]!).toFixed(1)}`);
    parts.push(`<polyline fill="none" stroke="${s.colour}" stroke-width="1.6" points="${pts.join(' ')}"/>`);
    const lx = m.left + (k % 4) * 145, ly = H - 16 + Math.floor(k / 4) * 13;
    parts.push(`<line x1="${lx}" x2="${lx + 18}" y1="${ly - 4}" y2="${ly - 4}" stroke="${s.colour}" stroke-width="2"/><text x="${lx + 22}" y="${ly}" font-size="11">${esc(s.name)}</text>`);
  });
  parts.push('</svg>');
  return parts.join('\n');
}
