// evaluateExpectations() against hand-written summaries: each statement of an `expect` block is met or not met as its
// words say, with the run's value in words, and a verdict with no value never passes a comparison it cannot make.
import { describe, expect, it } from 'vitest';
import { countExpectations, evaluateExpectations, unmet } from '../../sim/scenario/expect.ts';
import type { Summary } from '../../sim/observe/verdict.ts';

const ENERGY = { in_J_m2: 1, out_J_m2: 1, stored_J_m2: 0, imbalance_rel: 0 };
const LAYER = (margin: number | null) => ({
  peak_C: 400, peak_at_s: 900, limit: margin === null ? null : { kind: 'ignition' as const, at_C: 400 + margin }, margin_K: margin, limits: [],
});

function summary(over: Partial<Summary> = {}): Summary {
  return {
    heat_off_s: 900,
    separator: { molten_at_s: 85, half_frozen_at_s: 955, frozen_at_s: 972 },
    layers: { anode: LAYER(257), separator: LAYER(null) },
    safe_window_s: 55,
    safe_window_status: 'ok',
    binding_layer: 'anode',
    energy: ENERGY,
    ...over,
  };
}

describe('evaluateExpectations()', () => {
  it('meets every statement a run satisfies and reports the value it gave, with its unit', () => {
    const out = evaluateExpectations({ molten_before_s: 900, half_frozen_before_s: 3600, window_status: 'ok', window_at_least_s: 50, margin_at_least_K: { anode: 100 } }, summary());
    expect(out.map((o) => o.met)).toEqual([true, true, true, true, true]);
    expect(out[0]).toMatchObject({ key: 'molten_before_s', statement: 'separator molten before 15:00 min:s', actual: '85.0 s' });
    expect(out[4]).toMatchObject({ key: 'margin_at_least_K.anode', statement: 'anode margin at least 100 K', actual: '257 K' });
  });

  it('fails a statement the run does not satisfy, and unmet() lists it', () => {
    const out = evaluateExpectations({ window_at_least_s: 60, margin_at_least_K: { anode: 300 } }, summary());
    expect(unmet(out).map((o) => o.key)).toEqual(['window_at_least_s', 'margin_at_least_K.anode']);
  });

  it('never passes a comparison with a verdict that has no value, and says why in words', () => {
    const never = summary({ separator: { molten_at_s: null, half_frozen_at_s: null, frozen_at_s: null }, safe_window_s: null, safe_window_status: 'never-molten' });
    const out = evaluateExpectations({ molten_before_s: 900, half_frozen_before_s: 3600, window_at_least_s: 0, window_at_most_s: 100 }, never);
    expect(out.every((o) => !o.met)).toBe(true);
    expect(out[0]!.actual).toBe('never fully molten');
    expect(out[2]!.actual).toBe('none: never fully molten');
    for (const o of out) expect(o.actual).not.toMatch(/NaN|never s|null/);
  });

  it('counts "half-frozen after" as met by a separator that never half-freezes, as the words say', () => {
    const still = summary({ separator: { molten_at_s: 85, half_frozen_at_s: null, frozen_at_s: null }, safe_window_s: null, safe_window_status: 'still-molten-at-end' });
    expect(evaluateExpectations({ half_frozen_after_s: 600 }, still)[0]!.met).toBe(true);
    expect(evaluateExpectations({ half_frozen_after_s: 1000 }, summary())[0]!.met).toBe(false);
  });

  it('fails a margin statement about a layer the scenario does not have', () => {
    const [o] = evaluateExpectations({ margin_at_least_K: { cathode: 10 } }, summary());
    expect(o).toMatchObject({ met: false, actual: 'no such layer' });
  });

  it('fails a margin statement about a layer without a limit', () => {
    const [o] = evaluateExpectations({ margin_at_least_K: { separator: 10 } }, summary());
    expect(o).toMatchObject({ met: false, actual: 'no limit' });
  });

  it('returns nothing for a scenario without an expect block, and countExpectations() counts each layer once', () => {
    expect(evaluateExpectations(undefined, summary())).toEqual([]);
    expect(countExpectations({ molten_before_s: 1, margin_at_least_K: { a: 1, b: 2 } })).toBe(3);
  });
});
