// The window search (sim/study/window.ts) on small invented scenarios whose answer is known without the search:
// a closed-form steady state ("no limit for any hold"), a start already too hot (immediate removal crosses), and a
// crafted non-monotonic case whose every edge is checked against a brute-force scan of the hold.

import { describe, expect, it } from 'vitest';
import { searchWindow } from '../../sim/study/window.ts';
import type { FaceSegmentFile, InlineMaterialFile, ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { assertClose } from '../support/assert-close.ts';
import { parseOk, runOk, slab } from '../support/scenarios.ts';

/** An invented metal: k = 1 W/m·K, ρc_p = 2e6 J/m³·K, an ignition limit at 600 °C. */
const METAL: InlineMaterialFile = { k_W_mK: 1, rho_kg_m3: 2000, cp_J_kgK: 1000, limits: [{ kind: 'ignition', at_C: 600 }] };

describe('searchWindow() when no hold reaches the margin', () => {
  // a 2 mm slab on a 300 °C plate (G = 500 W/m²K), top face h = 10 W/m²K to 20 °C air; plate lifted at 600 s
  const s = slab({
    material: METAL, thickness_mm: 2, duration_s: 3600, ambient_C: 20,
    bottom: [{ from_s: 0, plate: { temperature_C: 300, conductance_W_m2K: 500 } }, { from_s: 600, convection_W_m2K: 10 }],
    top: [{ from_s: 0, convection_W_m2K: 10 }],
  });
  const result = searchWindow(parseOk(s));

  it('searchWindow() says "no limit" and gives the closed-form steady level of the hottest face and its margin', () => {
    if (!result.ok) throw new Error(result.reason);
    const r = result.report;
    expect(r.longest).toBeNull();
    expect(r.no_limit).not.toBeNull();
    // steady series circuit (Incropera, Fundamentals of Heat and Mass Transfer, §3.1 thermal resistances):
    // q = (T_plate − T_air)/(1/G + L/k + 1/h), and the hottest point is the bottom face, T_b = T_plate − q/G
    const q = (300 - 20) / (1 / 500 + 0.002 / 1 + 1 / 10);
    const bottomC = 300 - q / 500;
    // held 3600 s ≈ 8.7 time constants (ρc_pL·R ≈ 416 s): within 0.05 K of steady; the run's own tolerance is 0.2 K
    assertClose(r.no_limit!.settles_C, bottomC, { abs: 0.3 }, 'settled peak, °C');
    assertClose(r.no_limit!.margin_K, 600 - bottomC, { abs: 0.3 }, 'margin there, K');
    expect(r.no_limit!.settled).toBe(true);
    expect(r.no_limit!.layer).toBe('slab');
    expect(r.safe).toEqual([{ from: 0, to: 3600, fromRangeEnd: true, toRangeEnd: true }]);
  });

  it('searchWindow() has no shortest hold and no window without a separator, and says why', () => {
    if (!result.ok) throw new Error(result.reason);
    const r = result.report;
    expect(r.shortest).toBeNull();
    expect(r.shortest_reason).toMatch(/no layer is marked as the separator/);
    expect(r.window?.chosen).toBe('own');
    expect(r.window?.point.window_s).toBeNull();
    expect(r.window?.reason).toMatch(/separator/);
  });
});

describe('searchWindow() when even an immediate removal crosses', () => {
  it('searchWindow() returns no longest hold, with the layer and the margin in the reason', () => {
    // starts at 590 °C: 10 K below ignition whatever the hold, less than the 25 K asked for
    const s = slab({
      material: METAL, thickness_mm: 2, duration_s: 600, ambient_C: 20, initial_C: 590,
      bottom: [{ from_s: 0, plate: { temperature_C: 300, conductance_W_m2K: 500 } }, { from_s: 60, convection_W_m2K: 10 }],
    });
    const result = searchWindow(parseOk(s), { marginK: 25 });
    if (!result.ok) throw new Error(result.reason);
    const r = result.report;
    expect(r.longest).toBeNull();
    expect(r.no_limit).toBeNull();
    expect(r.safe).toEqual([]);
    expect(r.longest_reason).toMatch(/even at 0\.0 s slab comes within 10\.0 K of its ignition limit/);
    expect(r.window).toBeNull();
  });

  it('searchWindow() refuses a scenario whose heat never ends, naming the face', () => {
    const s = slab({ material: METAL, thickness_mm: 2, duration_s: 600, bottom: [{ from_s: 0, plate: { temperature_C: 300, conductance_W_m2K: 500 } }] });
    const result = searchWindow(parseOk(s));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(/bottom\[0\] lasts to the end of the run/);
  });
});

describe('searchWindow() on a response that is not monotonic', () => {
  // Invented: a plate at 500 °C (G = 100 W/m²K, time constant ρc_pL/G = 40 s) until the hold, then a 900 °C gas
  // (h = 10 W/m²K, time constant 400 s) until 300 s, then room air. A short hold leaves the slab cool when the gas
  // comes (safe); a middle hold leaves it warm with a long gas spell (too hot); a long hold leaves a short spell
  // (safe again). Lumped estimate of the peak: 485 °C (hold 0), 634 °C (100 s), 500 °C (300 s) against 575 °C.
  const bottom: FaceSegmentFile[] = [
    { from_s: 0, plate: { temperature_C: 500, conductance_W_m2K: 100 } },
    { from_s: 150, convection_W_m2K: 10, fluid_C: 900 },
    { from_s: 300, convection_W_m2K: 10 },
  ];
  const scenarioAt = (hold: number): ScenarioFile => {
    const s = slab({ material: METAL, thickness_mm: 2, duration_s: 600, ambient_C: 20, bottom: structuredClone(bottom) });
    s.bottom[1]!.from_s = hold;
    if (hold === 0) s.bottom.splice(0, 1); // immediate removal: no plate at all
    if (hold === 300) s.bottom.splice(1, 1); // held to the next segment: no gas at all
    return s;
  };
  const result = searchWindow(parseOk(scenarioAt(150)), { marginK: 25 });
  const safeAt = (hold: number) => {
    const { summary } = runOk(scenarioAt(hold));
    return summary.layers.slab!.margin_K! > 25;
  };

  it('searchWindow() reports both safe intervals and marks the response as not monotonic', () => {
    if (!result.ok) throw new Error(result.reason);
    const r = result.report;
    expect(r.monotonic).toBe(false);
    expect(r.safe).toHaveLength(2);
    expect(r.safe[0]!.fromRangeEnd).toBe(true);
    expect(r.safe[1]!.toRangeEnd).toBe(true);
    // the longest hold is the top of the range here, so the search says "no limit" up to the next segment (300 s)
    expect(r.no_limit).not.toBeNull();
    expect(r.knob.hi).toBe(300);
  });

  it('searchWindow() puts each edge where a 2 s brute-force scan of the hold puts it', () => {
    if (!result.ok) throw new Error(result.reason);
    const STEP = 2;
    const holds = Array.from({ length: 300 / STEP + 1 }, (_, i) => i * STEP);
    const flags = holds.map(safeAt);
    const edges: number[] = [];
    for (let i = 1; i < holds.length; i++) if (flags[i] !== flags[i - 1]) edges.push(flags[i - 1] ? holds[i - 1]! : holds[i]!);
    // brute force: the last safe hold before the gap and the first safe hold after it
    expect(edges).toHaveLength(2);
    const [a, b] = result.report.safe;
    // the search's edges are run values inside the set, ≤ 0.5 s from the true edge; the scan's are ≤ STEP from it
    assertClose(a!.to, edges[0]!, { abs: STEP + 0.5 }, 'end of the first safe interval, s');
    assertClose(b!.from, edges[1]!, { abs: STEP + 0.5 }, 'start of the second safe interval, s');
  });
});
