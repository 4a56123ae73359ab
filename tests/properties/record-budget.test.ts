// A record is kept to a budget of rows whatever the step count (row-store.ts), and thinning never moves an event:
// the verdicts read the same first crossings from the thinned indicators as from every point (the reference here is
// the unthinned series itself, searched by the same firstCrossing()). A summary-only run gives the same verdicts as a
// full run on every example, and each layer's peak time, found as the run goes, is the definition read off every step.

import { readdirSync, readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createIndicatorStore } from '../../sim/observe/record-trace.ts';
import { PeakReach, recordDefaults } from '../../sim/observe/record.ts';
import { RowStore } from '../../sim/observe/row-store.ts';
import { runProblem } from '../../sim/run.ts';
import { parseScenario } from '../../sim/scenario/scenario.ts';
import { firstCrossing } from '../../sim/observe/verdict.ts';
import { assertClose } from '../support/assert-close.ts';
import { peakReachedS } from '../support/scenarios.ts';

describe('RowStore', () => {
  it('RowStore keeps at most its budget plus the latest row however many rows are committed, first and last included', () => {
    const store = new RowStore(2, 100, 4);
    for (let k = 0; k < 100_000; k++) {
      store.row[0] = k;
      store.row[1] = -k;
      store.commit();
    }
    const { rows, data } = store.finish();
    expect(rows).toBeLessThanOrEqual(101);
    expect(rows).toBeGreaterThanOrEqual(50); // decimation by halving keeps at least half the budget
    expect(data[0]).toBe(0);
    expect(data[(rows - 1) * 2]).toBe(99_999);
    for (let r = 0; r < rows; r++) expect(data[r * 2 + 1]).toBe(-data[r * 2]!);
  });

  it('RowStore.hold() keeps a row through decimation until it is released', () => {
    const store = new RowStore(1, 8, 2);
    let slot = -1;
    for (let k = 0; k < 1000; k++) {
      store.row[0] = k;
      store.commit();
      if (k === 333) slot = store.hold('latest');
    }
    expect(Array.from(store.finish().data)).toContain(333);
    store.release(slot);
    expect(Array.from(store.finish().data)).not.toContain(333);
  });
});

describe('PeakReach', () => {
  // a layer's hottest point step by step: mostly creeping by less than the allowance (a plateau), now and then a rise
  // or a fall of kelvins; the reference is the definition itself, searched over every value
  const creep = fc.array(fc.oneof(
    { weight: 8, arbitrary: fc.double({ min: -0.001, max: 0.004, noNaN: true }) },
    { weight: 1, arbitrary: fc.double({ min: -3, max: 3, noNaN: true }) },
  ), { minLength: 1, maxLength: 3000 });
  it('PeakReach gives the first time a series came within its allowance of its highest value, however long the plateau', () => {
    fc.assert(fc.property(creep, (moves) => {
      const within = recordDefaults.peakReachedWithinK;
      const reach = new PeakReach(within);
      const values: number[] = [];
      let v = 400;
      let high = -Infinity;
      for (const dv of moves) {
        values.push(v);
        // the recorder passes each new high only (record.ts holdPeaks)
        if (v > high) { high = v; reach.rise(values.length - 1, v); }
        v += dv;
      }
      assertClose(reach.firstS(), peakReachedS(values.map((_, i) => i), values, within), { abs: 1e-9 });
    }), { seed: 20261205, numRuns: 300 });
  });

  it('PeakReach keeps every high of a plateau that creeps up steadily, hundreds of them within the allowance', () => {
    // 1 mK a step for 2000 steps: the last 50 highs lie within 0.05 K of the peak, all queued at once
    const within = recordDefaults.peakReachedWithinK;
    const reach = new PeakReach(within);
    const values = Array.from({ length: 2000 }, (_, i) => 400 + 0.001 * i);
    values.forEach((v, i) => reach.rise(10 * i, v));
    // a straight line crosses its peak less 0.05 K at (1999 − 50)·10 s
    assertClose(reach.firstS(), 19_490, { abs: 1e-6 }, 'steady creep');
    const slow = new PeakReach(within);
    // 10 µK a step: 5000 highs within the allowance, crossed at step 5999 − 5000
    for (let i = 0; i < 6000; i++) slow.rise(i, 400 + 1e-5 * i);
    assertClose(slow.firstS(), 999, { abs: 1e-6 }, 'slow creep');
  });
});

/** A random walk of the three indicators that crosses their levels now and then, at strictly increasing times. */
const walk = fc.array(fc.tuple(fc.double({ min: 0.001, max: 5, noNaN: true }), fc.double({ min: -0.3, max: 0.3, noNaN: true }),
  fc.double({ min: -0.3, max: 0.3, noNaN: true }), fc.double({ min: -0.3, max: 0.3, noNaN: true })), { minLength: 1, maxLength: 2000 });

describe('separator indicators kept to a budget', () => {
  it('createIndicatorStore() with a small budget gives the same first crossings as the full series, for any start time', () => {
    fc.assert(fc.property(walk, fc.integer({ min: 0, max: 12 }), fc.double({ min: 0, max: 1, noNaN: true }), (steps, budget, share) => {
      const t: number[] = [];
      const melt: number[] = [];
      const mean: number[] = [];
      const freeze: number[] = [];
      let now = 0;
      let m = -0.5;
      let f = 0.5;
      let z = 0.1;
      const store = createIndicatorStore(budget, 5000);
      for (const [dt, a, b, c] of steps) {
        t.push(now); melt.push(m); mean.push(f); freeze.push(z);
        store.add(now, m, f, z);
        now += dt; m += a; f += b; z += c;
      }
      const { trace, exact } = store.finish();
      expect(exact).toBe(true);
      expect(trace.tS.length).toBeLessThanOrEqual(steps.length);
      const from = share * now;
      const full = { tS: Float64Array.from(t), melt: Float64Array.from(melt), mean: Float64Array.from(mean), freeze: Float64Array.from(freeze) };
      expect(firstCrossing(trace.tS, trace.meltMargin, 0, from, 'rise-to')).toBe(firstCrossing(full.tS, full.melt, 0, from, 'rise-to'));
      expect(firstCrossing(trace.tS, trace.meanLiquid, 0.5, from, 'fall-below')).toBe(firstCrossing(full.tS, full.mean, 0.5, from, 'fall-below'));
      expect(firstCrossing(trace.tS, trace.freezeMargin, 0, from, 'fall-to')).toBe(firstCrossing(full.tS, full.freeze, 0, from, 'fall-to'));
    }), { seed: 20261202, numRuns: 300 });
  });
});

describe('summary-only runs', () => {
  const dir = new URL('../../examples/', import.meta.url);
  const files = readdirSync(dir).filter((f) => f.endsWith('.json'));
  it.each(files)('runProblem() with detail "summary" on %s gives the full run\'s summary and records no map', (file) => {
    const parsed = parseScenario(JSON.parse(readFileSync(new URL(file, dir), 'utf8')));
    if (!parsed.ok) throw new Error(`${file} does not parse`);
    const full = runProblem(parsed.problem);
    const summary = runProblem(parsed.problem, { detail: 'summary' });
    if (full.status !== 'ok' || summary.status !== 'ok') throw new Error(`${file} did not finish`);
    expect(summary.summary).toEqual(full.summary);
    expect(summary.record.map.data.length).toBe(0);
    // only the first, the last and each layer's peak row: at most layers + 2
    expect(summary.record.tS.length).toBeLessThanOrEqual(parsed.problem.layers.length + 2);
    expect(summary.record.probes).toEqual(full.record.probes);
  });

  it.each(files)('%s: each layer\'s peak time is the first recorded point within peakReachedWithinK of its peak', (file) => {
    const parsed = parseScenario(JSON.parse(readFileSync(new URL(file, dir), 'utf8')));
    if (!parsed.ok) throw new Error(`${file} does not parse`);
    const full = runProblem(parsed.problem);
    if (full.status !== 'ok') throw new Error(`${file} did not finish`);
    // the examples' records keep every step (below the row budget), so the definition can be read off the series
    expect(full.record.tS.length).toBeLessThan(recordDefaults.seriesPoints);
    for (const layer of full.record.layers) {
      expect(full.summary.layers[layer.id]!.peak_C, layer.id).toBe(Math.max(...layer.maxC));
      const reached = peakReachedS(full.record.tS, layer.maxC, recordDefaults.peakReachedWithinK);
      assertClose(full.summary.layers[layer.id]!.peak_at_s, reached, { abs: 1e-9 }, layer.id);
    }
  });
});
