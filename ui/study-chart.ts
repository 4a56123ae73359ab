/**
 * The study chart. One input: the chosen verdict against the input, each run a marker (filled where the target is met,
 * hollow where not), with the target's level as a dashed line. Two inputs: a heatmap of the verdict over the grid with
 * the pass/fail boundary drawn as the contour at the target's level (Plotly's contour, lines only). A verdict with
 * no value at a point is a gap, never a number. Every point carries its sweep index (customdata) for click-to-load.
 */
import type { Data, Layout } from 'plotly.js-dist-min';
import type { SweepPlan, SweepRow } from '../sim/index.ts';
import { evaluateTarget, type Target } from '../sim/index.ts';
import { temperatureScale } from './colours.ts';
import { levelLine } from './plot-common.ts';

const COLOURS = { line: '#1f5f99', met: '#2f7d4a', unmet: '#b42318', boundary: '#1f2933' } as const;

/** Unit of a key from its suffix (the scenario and result keys carry their unit). */
export function unitOf(key: string): string {
  const m = /_(C|K|s|mm|W_m2K|W_m2|W_m3|m2K_W|W_mK|J_kgK|J_kg|kg_m3|J_m2)$/.exec(key);
  const units: Record<string, string> = { C: '°C', K: 'K', s: 's', mm: 'mm', W_m2K: 'W/m²K', W_m2: 'W/m²', W_m3: 'W/m³', m2K_W: 'm²K/W', W_mK: 'W/mK', J_kgK: 'J/kgK', J_kg: 'J/kg', kg_m3: 'kg/m³', J_m2: 'J/m²' };
  return m ? units[m[1]!] ?? '' : '';
}

const titled = (key: string): string => (unitOf(key) ? `${key} (${unitOf(key)})` : key);

/** The verdict's number at each row (null: no value, or the run failed), and whether the target is met. */
export function readings(rows: readonly (SweepRow | undefined)[], target: Target): { y: (number | null)[]; met: boolean[] } {
  const y: (number | null)[] = [];
  const met: boolean[] = [];
  for (const r of rows) {
    const check = r?.summary ? evaluateTarget(target, r.summary) : { met: false, value: null };
    y.push(typeof check.value === 'number' && Number.isFinite(check.value) ? check.value : null);
    met.push(check.met);
  }
  return { y, met };
}

export function studyFigure(plan: SweepPlan, rows: readonly (SweepRow | undefined)[], target: Target): { data: Data[]; layout: Partial<Layout> } {
  const { y, met } = readings(rows, target);
  const level = typeof target.value === 'number' ? target.value : undefined;
  const base: Partial<Layout> = {
    margin: { l: 72, r: 24, t: 16, b: 56 },
    font: { family: 'system-ui, -apple-system, "Segoe UI", sans-serif', size: 12, color: '#1f2933' },
    paper_bgcolor: '#ffffff', plot_bgcolor: '#ffffff', hovermode: 'closest',
    legend: { orientation: 'h', y: -0.22, x: 0 },
  };
  const a = plan.axes[0]!;
  if (plan.axes.length === 1) {
    const x = a.values.map(Number);
    const idx = x.map((_, i) => i);
    const pick = (want: boolean) => idx.filter((i) => met[i] === want && y[i] !== null);
    const marks = (want: boolean): Data => ({
      type: 'scatter', mode: 'markers', name: want ? `meets ${target.text}` : `misses ${target.text}`,
      x: pick(want).map((i) => x[i]!), y: pick(want).map((i) => y[i]!), customdata: pick(want),
      marker: { size: 9, color: want ? COLOURS.met : '#ffffff', line: { color: want ? COLOURS.met : COLOURS.unmet, width: 2 } },
      hovertemplate: `${a.key} = %{x}<br>${target.pathText} = %{y}<extra>click to load this run</extra>`,
    });
    const line = level === undefined ? undefined : levelLine(level, `target ${target.text}`, COLOURS.boundary, 'dash', 'left');
    return {
      data: [{ type: 'scatter', mode: 'lines', name: target.pathText, x, y, line: { color: COLOURS.line, width: 1.5 }, connectgaps: false, hoverinfo: 'skip' }, marks(true), marks(false)],
      layout: { ...base, xaxis: { title: { text: titled(a.key) }, gridcolor: '#e4e8ec' }, yaxis: { title: { text: titled(target.pathText) }, gridcolor: '#e4e8ec' },
        shapes: line ? [line.shape] : [], annotations: line ? [line.annotation] : [] },
    };
  }
  const b = plan.axes[1]!;
  const nb = b.values.length;
  // the grid's last axis varies fastest: index = i·nb + j; z rows follow the second input (y), columns the first (x)
  const grid = <T>(f: (index: number) => T): T[][] => b.values.map((_, j) => a.values.map((__, i) => f(i * nb + j)));
  const data: Data[] = [{
    type: 'heatmap', x: a.values.map(Number), y: b.values.map(Number), z: grid((k) => y[k] ?? null), customdata: grid((k) => k),
    colorscale: temperatureScale(), colorbar: { title: { text: titled(target.pathText) } },
    hovertemplate: `${a.key} = %{x}<br>${b.key} = %{y}<br>${target.pathText} = %{z}<extra>click to load this run</extra>`,
  }];
  if (level !== undefined) {
    data.push({
      type: 'contour', x: a.values.map(Number), y: b.values.map(Number), z: grid((k) => y[k] ?? null), name: `boundary of ${target.text}`,
      contours: { coloring: 'none', start: level, end: level, size: 1, showlabels: true }, line: { color: COLOURS.boundary, width: 2.5 },
      showscale: false, hoverinfo: 'skip', showlegend: true,
    } as Data);
  }
  return { data, layout: { ...base, xaxis: { title: { text: titled(a.key) } }, yaxis: { title: { text: titled(b.key) } } } };
}
