// The study chart's figures (ui/study-chart.ts), built from literal rows: the readings follow the target (a missing
// verdict is a gap, never a number), one input gives a line with met/missed markers, two inputs a heatmap whose cell
// (row j, column i) is grid point i·n₂ + j (the sweep's order, first input slowest) and a contour at the target level.
import { describe, expect, it } from 'vitest';
import type { Data } from 'plotly.js-dist-min';
import { readings, studyFigure, unitOf } from '../../ui/study-chart.ts';
import { parseTarget } from '../../sim/study/target.ts';
import type { SweepPlan, SweepRow } from '../../sim/study/sweep.ts';

const target = (() => { const t = parseTarget('safe_window_s>=50'); if (!t.ok) throw new Error(t.message); return t.value; })();
const row = (index: number, window: number | null): SweepRow => ({
  index, inputs: {}, error: null,
  summary: {
    heat_off_s: 900, separator: { molten_at_s: 80, half_frozen_at_s: null, frozen_at_s: null }, layers: {},
    safe_window_s: window, safe_window_status: window === null ? 'never-molten' : 'ok', binding_layer: null,
    energy: { in_J_m2: 0, out_J_m2: 0, stored_J_m2: 0, imbalance_rel: 0 }, warnings: [],
  },
});
const axis = (key: string, values: number[]) => ({ key, places: [], values });

describe('study chart', () => {
  it('reads the verdict of each row; a missing verdict or a failed run is a gap and misses the target', () => {
    const failed: SweepRow = { index: 3, inputs: {}, summary: null, error: 'bad' };
    expect(readings([row(0, 40), row(1, 50), row(2, null), failed], target)).toEqual({ y: [40, 50, null, null], met: [false, true, false, false] });
  });

  it('draws one input as a line with the met and missed runs as separate marker traces carrying their index', () => {
    const plan: SweepPlan = { doc: {}, axes: [axis('ambient_C', [0, 10, 20])], count: 3 };
    const fig = studyFigure(plan, [row(0, 40), row(1, 55), row(2, 60)], target);
    const [line, met, missed] = fig.data as (Data & { x: number[]; y: number[]; customdata: number[] })[];
    expect(line!.y).toEqual([40, 55, 60]);
    expect([met!.x, met!.customdata]).toEqual([[10, 20], [1, 2]]);
    expect([missed!.x, missed!.customdata]).toEqual([[0], [0]]);
    expect(fig.layout.shapes).toHaveLength(1);
  });

  it('draws two inputs as a heatmap in grid order with the boundary contour at the target level', () => {
    const plan: SweepPlan = { doc: {}, axes: [axis('ambient_C', [0, 10, 20]), axis('layers.separator.thickness_mm', [1, 2])], count: 6 };
    const fig = studyFigure(plan, [0, 1, 2, 3, 4, 5].map((i) => row(i, 10 * i)), target);
    const heat = fig.data[0] as Data & { z: number[][]; customdata: number[][] };
    expect(heat.z).toEqual([[0, 20, 40], [10, 30, 50]]);
    expect(heat.customdata).toEqual([[0, 2, 4], [1, 3, 5]]);
    const contour = fig.data[1] as Data & { contours: { start: number; end: number; coloring: string } };
    expect(contour.contours).toMatchObject({ start: 50, end: 50, coloring: 'none' });
  });

  it('names the unit of a key from its suffix', () => {
    expect([unitOf('ambient_C'), unitOf('layers.a.thickness_mm'), unitOf('top.0.convection_W_m2K'), unitOf('safe_window_s'), unitOf('name')]).toEqual(['°C', 'mm', 'W/m²K', 's', '']);
  });
});
