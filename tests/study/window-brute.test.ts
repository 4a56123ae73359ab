// The window search (sim/study/window.ts) against a brute-force scan: the same scenario run hold by hold with the
// hold edited in the scenario JSON (not through the search's own Problem edit), each run judged straight from its
// summary. The search must put every edge where the scan puts it, within the search tolerance plus the scan step.

import { describe, expect, it } from 'vitest';
import { searchWindow, windowDefaults } from '../../sim/study/window.ts';
import type { ScenarioFile } from '../../sim/scenario/scenario-schema.ts';
import { assertClose } from '../support/assert-close.ts';
import { demoOnPlate, parseOk, runOk } from '../support/scenarios.ts';

/** Smallest margin to any limit of any layer, K, read from a plain run's summary. */
function smallestMargin(s: ScenarioFile): number {
  const { summary } = runOk(s);
  return Math.min(...Object.values(summary.layers).flatMap((l) => l.limits.map((m) => m.margin_K)));
}

const M = windowDefaults.marginK;
const TOL = windowDefaults.holdToleranceS;

describe('searchWindow() against a brute-force scan of the hold', () => {
  // a plate hot enough (800 °C) that the magnesium anode comes within 25 K of ignition (650 °C) if held long
  const plateC = 800;
  const result = searchWindow(parseOk(demoOnPlate(plateC)), { marginK: M });

  it('searchWindow() finds one edge of the margin on the hot-plate demo, and names the anode and its ignition limit', () => {
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const r = result.report;
    expect(r.longest).not.toBeNull();
    expect(r.longest!.binding?.layer).toBe('anode');
    expect(r.longest!.binding?.kind).toBe('ignition');
    expect(r.monotonic).toBe(true);
    expect(r.safe).toHaveLength(1);
    // a guard on the count, measured on this code (the answers are checked against brute force below): 27 solves
    // since the event trials are aimed to one side of their estimate (the separator's molten and frozen instants land
    // up to a quarter of the event tolerance later), 26 when face convection and T(H) were evaluated without Math.pow
    // and with one division (their last bits), 28 with the rounding before them, 27 with the one-ended tridiagonal
    // sweep's, 32 when the molten edge was halved instead of narrowed from the molten neighbour's molten time
    expect(r.solves).toBeLessThanOrEqual(27);
  });

  it('searchWindow() puts the longest hold where a 1 s scan of the hold finds the margin running out', () => {
    if (!result.ok) throw new Error(result.reason);
    const found = result.report.longest!.value;
    // step through whole seconds around the found value until the scan's own edge is bracketed
    const STEP = 1;
    let lastSafe = Math.floor(found) - 3;
    expect(smallestMargin(demoOnPlate(plateC, lastSafe))).toBeGreaterThan(M);
    let firstUnsafe = lastSafe + STEP;
    while (smallestMargin(demoOnPlate(plateC, firstUnsafe)) > M) {
      lastSafe = firstUnsafe;
      firstUnsafe += STEP;
      if (firstUnsafe > found + 10) throw new Error(`the scan found no edge near ${found} s`);
    }
    // the search's bracket is ≤ TOL wide and the scan's is STEP wide: the two edges agree within TOL + STEP
    assertClose(found, lastSafe, { abs: TOL + STEP }, 'longest hold vs brute-force scan, s');
    expect(found).toBeLessThan(firstUnsafe);
  });

  it('searchWindow() reports at the longest hold the same usable window as a plain run with that hold', () => {
    if (!result.ok) throw new Error(result.reason);
    const r = result.report;
    const hold = r.longest!.value;
    expect(r.window?.chosen).toBe('longest');
    const { summary } = runOk(demoOnPlate(plateC, hold));
    const direct = summary.separator.half_frozen_at_s! - summary.heat_off_s!;
    // the same hold run two ways (Problem edit vs JSON edit): identical to round-off in the hold
    assertClose(r.window!.point.window_s ?? Number.NaN, direct, { abs: 1e-6 }, 'usable window, s');
    assertClose(r.window!.point.heat_off_s ?? Number.NaN, hold, { abs: 1e-9 }, 'heat off at the hold, s');
  });

  it('searchWindow() reads each run\'s melt reach on the molten verdict\'s side: ≥ 0 exactly when molten', () => {
    if (!result.ok) throw new Error(result.reason);
    const points = result.report.points;
    expect(points.some((p) => p.molten_at_s === null)).toBe(true);
    for (const p of points) expect([p.value, p.melt_reach! >= 0]).toEqual([p.value, p.molten_at_s !== null]);
    // short of molten it is the largest mean liquid fraction less 1, in [−1, 0)
    for (const p of points.filter((q) => q.molten_at_s === null)) expect(p.melt_reach!).toBeGreaterThanOrEqual(-1);
  });

  it('searchWindow() puts the shortest hold where a scan of the hold first finds the separator fully molten', () => {
    if (!result.ok) throw new Error(result.reason);
    const shortest = result.report.shortest!.value;
    const molten = (h: number) => runOk(demoOnPlate(plateC, h)).summary.separator.molten_at_s !== null;
    // the narrowing brackets it within TOL: molten at the reported hold, not molten TOL + a little below it
    expect(molten(shortest)).toBe(true);
    expect(molten(Math.max(0, shortest - TOL - 0.05))).toBe(false);
  });
});
