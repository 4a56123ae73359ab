// The ambient study (sim/study/ambient.ts): which fields follow the ambient, the pass rule on literal rows, and the
// margin at each ambient against the lumped closed form (Incropera 6th ed. eq. 5.6, see lumped-slab.ts).
import { describe, expect, it } from 'vitest';
import { ambientDefaults, ambientPlan, ambientStudy, type AmbientOptions } from '../../sim/study/ambient.ts';
import { pointScenario, runSweepPoint, type SweepRow } from '../../sim/study/sweep.ts';
import { assertClose } from '../support/assert-close.ts';
import { SLAB, slabFile } from './lumped-slab.ts';

const opts = (o: Partial<AmbientOptions> = {}): AmbientOptions => ({ ...ambientDefaults, ...o });

describe('ambientPlan()', () => {
  it('defaults to −54 … 74 °C in 15 points (the range commonly required of military thermal batteries, from memory)', () => {
    expect([ambientDefaults.fromC, ambientDefaults.toC, ambientDefaults.count]).toEqual([-54, 74, 15]);
  });

  it('moves initial_C with the ambient when the file sets them equal, and keeps a different initial_C', () => {
    const same = ambientPlan(slabFile(), opts({ fromC: -20, toC: 40, count: 4 }));
    if (!same.ok) throw new Error(same.message);
    expect(same.value.initialFollows).toBe(true);
    const at = pointScenario(same.value, 0) as { ambient_C: number; initial_C: number };
    expect([at.ambient_C, at.initial_C]).toEqual([-20, -20]);
    const differs = ambientPlan({ ...slabFile(), initial_C: 300 }, opts({ fromC: -20, toC: 40, count: 4 }));
    if (!differs.ok) throw new Error(differs.message);
    expect(differs.value.initialFollows).toBe(false);
    expect((pointScenario(differs.value, 3) as { initial_C: number }).initial_C).toBe(300);
  });

  it('refuses a backwards range and a count that is not a whole number ≥ 1', () => {
    const back = ambientPlan(slabFile(), opts({ fromC: 40, toC: -20 }));
    expect(!back.ok && back.message).toContain('--from must not be above --to');
    const count = ambientPlan(slabFile(), opts({ count: 2.5 }));
    expect(!count.ok && count.message).toContain('--count: must be a whole number ≥ 1, got 2.5');
  });
});

describe('ambientStudy()', () => {
  const row = (index: number, ambient: number, window: number | null, margin: number | null): SweepRow => ({
    index, inputs: { ambient_C: ambient }, error: null,
    summary: {
      heat_off_s: 900, separator: { molten_at_s: 80, half_frozen_at_s: window === null ? null : 900 + window, frozen_at_s: null },
      layers: { anode: { peak_C: 400, peak_at_s: 900, limit: margin === null ? null : { kind: 'ignition', at_C: 400 + margin }, margin_K: margin, limits: [] } },
      safe_window_s: window, safe_window_status: window === null ? 'never-molten' : 'ok', binding_layer: margin === null ? null : 'anode',
      energy: { in_J_m2: 0, out_J_m2: 0, stored_J_m2: 0, imbalance_rel: 0 }, warnings: [],
    },
  });

  it('passes a point with a window of at least the minimum and every margin at least the margin, and joins neighbours', () => {
    const rows = [row(0, -40, null, 200), row(1, -20, 30, 200), row(2, 0, 45, 30), row(3, 20, 50, 20), row(4, 40, 60, 100)];
    const s = ambientStudy(rows, opts({ fromC: -40, toC: 40, count: 5, marginK: 25, minWindowS: 10 }), true);
    expect(s.points.map((p) => p.pass)).toEqual([false, true, true, false, true]);
    expect(s.passing).toEqual([[-20, 0], [40, 40]]);
    expect(s.spacing_K).toBe(20);
  });

  it('gives each ambient the margin the closed form gives (slab with a 90 °C limit, warmed by 100 °C fluid)', () => {
    const file = slabFile();
    file.materials!.copperish!.limits = [{ kind: 'service', at_C: 90 }];
    const plan = ambientPlan(file, opts({ fromC: -20, toC: 40, count: 3 }));
    if (!plan.ok) throw new Error(plan.message);
    const s = ambientStudy([0, 1, 2].map((i) => runSweepPoint(plan.value, i)), opts({ fromC: -20, toC: 40, count: 3 }), true);
    for (const p of s.points) {
      const endC = SLAB.fluidC - (SLAB.fluidC - p.ambient_C) * Math.exp((-5 * SLAB.durationS) / SLAB.rhoCL);
      // solver error < 0.02 K at tolerance_K 0.01 (lumped-slab.ts); allow 0.1 K
      assertClose(p.margin_K!, 90 - endC, { abs: 0.1 }, `margin at ${p.ambient_C} °C`);
      expect(p.pass).toBe(false); // no separator, so no usable window
    }
  });
});
