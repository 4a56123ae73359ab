// Key paths into a scenario file (sim/study/scenario-path.ts): the notations a person types, layers by id, deep-copy
// writes, and refusals that name the path and say what exists where it failed. The expected values are read off the
// literal documents below.
import { describe, expect, it } from 'vitest';
import { getAt, parsePath, resolveLeaf, resolvePath, setAt, type ScenarioPath } from '../../sim/study/scenario-path.ts';

const doc = {
  ambient_C: 22,
  layers: [
    { id: 'collector', material: 'nickel', thickness_mm: 1 },
    { id: 'separator', material: 'salt', thickness_mm: 1.5, separator: true },
  ],
  bottom: [{ from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } }, { from_s: 900, convection_W_m2K: 'natural' }],
  materials: { 'salt.v2': { k_W_mK: 1 } },
};

const path = (text: string): ScenarioPath => {
  const p = parsePath(text);
  if (!p.ok) throw new Error(p.message);
  return p.value;
};

describe('parsePath() and resolvePath()', () => {
  it('reads a top-level key, a dotted index, a bracketed index and a layer id to the same places', () => {
    expect(getAt(doc, 'ambient_C')).toEqual({ ok: true, value: 22 });
    expect(getAt(doc, 'bottom.1.from_s')).toEqual({ ok: true, value: 900 });
    expect(getAt(doc, 'bottom[1].from_s')).toEqual({ ok: true, value: 900 });
    expect(getAt(doc, 'layers.separator.thickness_mm')).toEqual({ ok: true, value: 1.5 });
    expect(getAt(doc, 'layers[1].thickness_mm')).toEqual({ ok: true, value: 1.5 });
    expect(getAt(doc, 'bottom.0.plate.temperature_C')).toEqual({ ok: true, value: 450 });
  });

  it('reads a quoted key that holds a dot', () => {
    expect(getAt(doc, 'materials["salt.v2"].k_W_mK')).toEqual({ ok: true, value: 1 });
  });

  it('gives the concrete path in the scenario parser\'s notation, so its errors can be matched', () => {
    const r = resolvePath(doc, path('layers.separator.thickness_mm'));
    expect(r.ok && r.value.concreteText).toBe('layers[1].thickness_mm');
  });

  it('refuses an unknown layer id, listing the ids there', () => {
    const r = resolvePath(doc, path('layers.anode.thickness_mm'));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toBe('layers.anode.thickness_mm: no entry with id "anode" in layers (entries 0–1, ids collector, separator)');
  });

  it('refuses an index past the end, and a missing key in the middle, saying what exists', () => {
    const r1 = resolvePath(doc, path('bottom.5.from_s'));
    expect(!r1.ok && r1.message).toContain('bottom has no entry 5 (entries 0–1)');
    const r2 = resolvePath(doc, path('bottom.0.plat.temperature_C'));
    expect(!r2.ok && r2.message).toContain('no key "plat" in bottom[0] (keys there: from_s, plate)');
  });

  it('refuses a path that goes through a number', () => {
    const r = resolvePath(doc, path('ambient_C.low'));
    expect(!r.ok && r.message).toBe('ambient_C.low: ambient_C is a number, so it has no "low" inside it');
  });

  it('accepts an absent last key (an optional field the file leaves out) with an undefined value', () => {
    const r = resolvePath(doc, path('bottom.1.emissivity'));
    expect(r.ok && r.value.value).toBeUndefined();
    expect(r.ok && r.value.concreteText).toBe('bottom[1].emissivity');
  });

  it('refuses empty paths, empty keys and stray brackets', () => {
    for (const bad of ['', 'a..b', 'a.', '.a', 'a[', 'a[1']) expect(parsePath(bad).ok, bad).toBe(false);
  });
});

describe('resolveLeaf() and setAt()', () => {
  it('refuses a path to an object or a list, naming what could be chosen there', () => {
    const r = resolveLeaf(doc, path('layers.separator'));
    expect(!r.ok && r.message).toBe('layers.separator: is an object, not a single value; name one of its keys (id, material, thickness_mm, separator)');
    const l = resolveLeaf(doc, path('layers'));
    expect(!l.ok && l.message).toContain('is a list, not a single value');
  });

  it('writes into a deep copy and leaves the original as it was', () => {
    const before = JSON.stringify(doc);
    const r = resolveLeaf(doc, path('layers.separator.thickness_mm'));
    if (!r.ok) throw new Error(r.message);
    const copy = setAt(doc, r.value, 2.5) as typeof doc;
    expect(copy.layers[1]!.thickness_mm).toBe(2.5);
    expect(JSON.stringify(doc)).toBe(before);
  });

  it('adds an absent optional key', () => {
    const r = resolveLeaf(doc, path('bottom.1.emissivity'));
    if (!r.ok) throw new Error(r.message);
    expect((setAt(doc, r.value, 0.4) as typeof doc).bottom[1]).toEqual({ from_s: 900, convection_W_m2K: 'natural', emissivity: 0.4 });
  });
});

describe('the view\'s suggested paths (ui/study-paths.ts)', () => {
  it('name only numbers of the demo file, each found again by resolveLeaf, layers by id', async () => {
    const { numericPaths } = await import('../../ui/study-paths.ts');
    const demo = (await import('../../examples/bench-coupon.json', { with: { type: 'json' } })).default as unknown as Parameters<typeof numericPaths>[0];
    const paths = numericPaths(demo);
    expect(paths).toContain('ambient_C');
    expect(paths).toContain('layers.anode.thickness_mm');
    expect(paths).toContain('bottom.1.from_s');
    expect(paths.some((p) => p.startsWith('expect') || p.startsWith('output') || p === 'freezeline')).toBe(false);
    for (const p of paths) {
      const r = resolveLeaf(demo, path(p));
      expect(r.ok && typeof r.value.value, p).toBe('number');
    }
  });
});
