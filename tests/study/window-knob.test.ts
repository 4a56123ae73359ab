// The varied input of a window search (sim/study/knob.ts): which scenario field moves, its range, and what the
// edited Problem holds, checked against the scenario written out by hand.

import { describe, expect, it } from 'vitest';
import { holdKnob, powerKnob } from '../../sim/study/knob.ts';
import { heatOffTime } from '../../sim/observe/verdict.ts';
import { assertClose } from '../support/assert-close.ts';
import { PLAIN, parseOk, scenario, slab } from '../support/scenarios.ts';

const plate = { from_s: 0, plate: { temperature_C: 450, conductance_W_m2K: 500 } };

describe('holdKnob()', () => {
  it('holdKnob() moves the start of the segment after the plate, and heat_off_s follows it', () => {
    const p = parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 3600, bottom: [plate, { from_s: 900, convection_W_m2K: 6 }] }));
    const k = holdKnob(p);
    if (typeof k === 'string') throw new Error(k);
    expect([k.path, k.lo, k.hi, k.own, k.label, k.unit, k.vary]).toEqual(['bottom[1].from_s', 0, 3600, 900, 'heater hold', 's', 'time']);
    expect(k.apply(3600).bottom[1]!.fromS).toBe(3600);
    // a shorter hold keeps the scenario's duration (it is only ever lengthened)
    expect(k.apply(600).durationS).toBe(3600);
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

  it('holdKnob() and powerKnob() name the file field a derived source came from: W/kg heat and a pellet, not source_W_m3', () => {
    const perKg = slab({ material: PLAIN, thickness_mm: 2, duration_s: 1000, bottom: [{ from_s: 0, convection_W_m2K: 6 }] });
    perKg.layers[0] = { ...perKg.layers[0]!, heat_W_kg: [{ from_s: 50, to_s: 400, value: 100 }] };
    const k = holdKnob(parseOk(perKg));
    if (typeof k === 'string') throw new Error(k);
    expect(k.path).toBe('layers[0].heat_W_kg[0].to_s');
    const pk = powerKnob(parseOk(perKg));
    if (typeof pk === 'string') throw new Error(pk);
    expect(pk.path).toBe('layers[0].heat_W_kg[0] (as W/m³)');
    const pellet = slab({ material: PLAIN, thickness_mm: 2, duration_s: 1000, bottom: [{ from_s: 0, convection_W_m2K: 6 }] });
    pellet.layers[0] = { ...pellet.layers[0]!, pellet: { heat_J_g: 1, burn_s: 20, from_s: 10 } };
    const kp = holdKnob(parseOk(pellet));
    if (typeof kp === 'string') throw new Error(kp);
    expect([kp.path, kp.own]).toEqual(['layers[0].pellet (its end, from_s + burn time)', 30]);
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
    expect(k.apply(300).layers[0]!.sources).toEqual([]); // would be an empty interval [300, 300)
    expect(heatOffTime(k.apply(200))).toBe(200);
  });

  it('holdKnob() moves a top-face plate, and only the moving intervals of each layer', () => {
    const p = parseOk(scenario({ duration_s: 1800, materials: { m: PLAIN },
      layers: [
        { id: 'a', material: 'm', thickness_mm: 1, source_W_m3: [{ from_s: 0, to_s: 100, value: 1e5 }, { from_s: 100, to_s: 900, value: 1e5 }] },
        { id: 'b', material: 'm', thickness_mm: 1, source_W_m3: [{ from_s: 0, to_s: 900, value: 1e5 }] },
      ],
      bottom: [{ from_s: 0, convection_W_m2K: 5 }],
      top: [plate, { from_s: 900, convection_W_m2K: 6 }] }));
    const k = holdKnob(p);
    if (typeof k === 'string') throw new Error(k);
    const q = k.apply(500);
    expect(q.top.map((s) => s.fromS)).toEqual([0, 500]);
    expect(q.bottom).toBe(p.bottom);
    expect(q.layers[0]!.sources.map((s) => [s.fromS, s.toS])).toEqual([[0, 100], [100, 500]]);
    expect(q.layers[1]!.sources.map((s) => [s.fromS, s.toS])).toEqual([[0, 500]]);
  });

  it('holdKnob() explains why there is nothing to vary', () => {
    expect(holdKnob(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 60, bottom: [{ from_s: 0, convection_W_m2K: 6 }] }))))
      .toMatch(/no heat input/);
    // a source lasting exactly to the end of the run never ends
    expect(holdKnob(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 60, source_W_m3: 1e5 }))))
      .toMatch(/the heat input layers\[0\] \(slab\)\.source_W_m3\[0\] lasts to the end of the run/);
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
    expect([f.path, f.lo, f.hi, f.own, f.unit]).toEqual(['bottom[0].flux_W_m2', 0, 6000, 2000, 'W/m²']);
    const g = f.apply(3000).bottom[0]!.condition;
    expect(g.kind === 'terms' && g.fluxWPerM2).toBe(3000);
    expect(() => f.apply(6001)).toThrow(/power: must be within \[0, 6000\], got 6001/);
    expect(() => f.apply(-1)).toThrow(/power: must be within/);
    expect(f.apply(3000).bottom[1]).toEqual(f.apply(0).bottom[1]); // only the heating segment changes
    expect(f.apply(0).bottom[0]!.condition).toMatchObject({ fluxWPerM2: 0 });
    expect(f.apply(6000).bottom[0]!.condition).toMatchObject({ fluxWPerM2: 6000 });
  });

  it('powerKnob() ranges a plate from the coldest of ambient and start to 50 K above the highest limit', () => {
    const limited = { ...PLAIN, limits: [{ kind: 'ignition' as const, at_C: 600 }, { kind: 'melt' as const, at_C: 650 }] };
    const k = powerKnob(parseOk(slab({ material: limited, thickness_mm: 2, duration_s: 3600, ambient_C: 20, initial_C: 100,
      bottom: [plate, { from_s: 900, convection_W_m2K: 6 }] })));
    if (typeof k === 'string') throw new Error(k);
    // T/K = t/°C + 273.15 (ISO 80000-5): 20 °C and 650 °C + 50 K
    assertClose(k.lo, 293.15, { abs: 1e-9 }, 'bottom of the range, K');
    assertClose(k.hi, 973.15, { abs: 1e-9 }, 'top of the range, K');
    expect([k.label, k.unit]).toEqual(['plate temperature', '°C']);
  });

  it('powerKnob() varies a held face temperature and a volumetric source', () => {
    const held = powerKnob(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 600, bottom: [{ from_s: 0, fixed_C: 400 }, { from_s: 60, convection_W_m2K: 6 }] })));
    if (typeof held === 'string') throw new Error(held);
    expect([held.path, held.label]).toEqual(['bottom[0].fixed_C', 'held face temperature']);
    expect(held.apply(700).bottom[0]!.condition).toEqual({ kind: 'fixed', tK: 700 });
    const src = powerKnob(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 600,
      source_W_m3: [{ from_s: 0, to_s: 60, value: 2e5 }, { from_s: 60, to_s: 90, value: -1e5 }] })));
    if (typeof src === 'string') throw new Error(src);
    expect([src.path, src.lo, src.hi, src.own, src.unit]).toEqual(['layers[0].source_W_m3[0].value', 0, 6e5, 2e5, 'W/m³']);
    expect(src.apply(3e5).layers[0]!.sources.map((s) => s.value)).toEqual([3e5, -1e5]);
    expect(powerKnob(parseOk(slab({ material: PLAIN, thickness_mm: 2, duration_s: 60, bottom: [{ from_s: 0, convection_W_m2K: 6 }] })))).toMatch(/no heat input/);
  });
});
