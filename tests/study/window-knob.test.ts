// The varied input of a window search (sim/study/knob.ts): which scenario field moves, its range, and what the
// edited Problem holds, checked against the scenario written out by hand.

import { describe, expect, it } from 'vitest';
import { holdKnob, powerKnob } from '../../sim/study/knob.ts';
import { heatOffTime } from '../../sim/verdict.ts';
import { assertClose } from '../support/assert-close.ts';
import { PLAIN, parseOk, slab } from '../support/scenarios.ts';

const plate = { from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } };

describe('holdKnob()', () => {
  it('holdKnob() moves the start of the segment after the plate, and heat_off_s follows it', () => {
    const p = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 3600, bottom: [plate, { from_s: 900, convection_W_m2K: 6 }] }));
    const k = holdKnob(p);
    if (typeof k === 'string') throw new Error(k);
    expect([k.path, k.lo, k.hi, k.own]).toEqual(['bottom[1].from_s', 0, 3600, 900]);
    const moved = k.apply(600);
    expect(moved.bottom.map((s) => s.fromS)).toEqual([0, 600]);
    expect(heatOffTime(moved)).toBe(600);
    // removal at the start drops the plate; a later hold lengthens the run to keep 2700 s after removal
    expect(k.apply(0).bottom).toHaveLength(1);
    expect(heatOffTime(k.apply(0))).toBe(0);
    expect(k.apply(3000).durationS).toBe(5700);
    expect(() => k.apply(-1)).toThrow(/hold: must be within \[0, 3600\] s, got -1/);
  });

  it('holdKnob() moves the end of a source interval, and starts the range where another heat input ends', () => {
    const p = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 1000,
      bottom: [plate, { from_s: 100, convection_W_m2K: 6 }], source_W_m3: [{ from_s: 50, to_s: 400, value: 1e6 }] }));
    const k = holdKnob(p);
    if (typeof k === 'string') throw new Error(k);
    expect([k.path, k.lo, k.hi, k.own]).toEqual(['layers[0].source_W_m3[0].to_s', 100, 1000, 400]);
    expect(k.apply(250).layers[0]!.sources[0]!.toS).toBe(250);
    expect(heatOffTime(k.apply(250))).toBe(250);
  });

  it('holdKnob() moves every heat input that ends at heat off together, and drops a source that would end before it starts', () => {
    const p = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 1800,
      bottom: [plate, { from_s: 900, convection_W_m2K: 6 }], source_W_m3: [{ from_s: 300, to_s: 900, value: 1e5 }] }));
    const k = holdKnob(p);
    if (typeof k === 'string') throw new Error(k);
    expect([k.path, k.lo, k.hi, k.own]).toEqual(['bottom[1].from_s, layers[0].source_W_m3[0].to_s', 0, 1800, 900]);
    const at600 = k.apply(600);
    expect([at600.bottom[1]!.fromS, at600.layers[0]!.sources[0]!.toS]).toEqual([600, 600]);
    expect(heatOffTime(at600)).toBe(600);
    expect(k.apply(200).layers[0]!.sources).toEqual([]);
    expect(heatOffTime(k.apply(200))).toBe(200);
  });

  it('holdKnob() explains why there is nothing to vary', () => {
    expect(holdKnob(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 60, bottom: [{ from_s: 0, convection_W_m2K: 6 }] }))))
      .toMatch(/no heat input/);
  });
});

describe('powerKnob()', () => {
  it('powerKnob() varies a plate temperature (K inside) and a flux from zero to three times its own', () => {
    const p = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 3600, ambient_C: 20, bottom: [plate, { from_s: 900, convection_W_m2K: 6 }] }));
    const k = powerKnob(p);
    if (typeof k === 'string') throw new Error(k);
    expect(k.path).toBe('bottom[0].plate.temperature_C');
    // 450 °C in K (T/K = t/°C + 273.15, ISO 80000-5), exact to round-off; without limits the range ends 50 K above
    assertClose(k.own, 723.15, { abs: 1e-9 }, 'own plate temperature, K');
    assertClose(k.hi, 773.15, { abs: 1e-9 }, 'top of the range, K');
    const c = k.apply(750).bottom[0]!.condition;
    expect(c.kind === 'terms' && c.plate?.tK).toBe(750);
    const f = powerKnob(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 600, bottom: [{ from_s: 0, flux_W_m2: 2000 }, { from_s: 100 }] })));
    if (typeof f === 'string') throw new Error(f);
    expect([f.path, f.lo, f.hi, f.own]).toEqual(['bottom[0].flux_W_m2', 0, 6000, 2000]);
  });
});
