/**
 * The study panel in the browser: one input gives a line chart whose values are the Node solver's for the same runs
 * (the browser and Node agree within the defaults' stated accuracy: event times to 0.5 s, DEVELOPERS.md), clicking a
 * run loads its scenario into the editor, and the scenario it replaced is one click away.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import demo from '../../examples/bench-coupon.json' with { type: 'json' };
import { parseVary, planSweep, runSweepPoint } from '../../sim/study/sweep.ts';
import { assertClose } from '../support/assert-close.ts';
import { freshPage, startHarness, traceCount, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

describe('study panel', () => {
  it('draws a line chart of the verdict over one input, and a clicked run loads into the editor with a way back', async () => {
    const page = await freshPage(harness);
    await page.fill('[data-testid="study-key-1"]', 'ambient_C');
    await page.fill('[data-testid="study-from-1"]', '-20');
    await page.fill('[data-testid="study-to-1"]', '40');
    await page.fill('[data-testid="study-count-1"]', '4');
    await page.fill('[data-testid="study-key-2"]', '');
    await page.fill('[data-testid="study-target"]', 'safe_window_s>=50');
    await page.click('[data-testid="study-run"]');
    await page.waitForFunction(() => (document.querySelector('[data-testid="study-status"]') as HTMLElement | null)?.dataset.state === 'done', undefined, { timeout: 120_000 });
    expect(await traceCount(page, 'plot-study')).toBe(3);
    const line = await page.$eval('[data-testid="plot-study"]', (e) => {
      const d = (e as HTMLElement & { data: { x: number[]; y: (number | null)[] }[] }).data[0]!;
      return { x: Array.from(d.x), y: Array.from(d.y) };
    });
    expect(line.x).toEqual([-20, 0, 20, 40]);
    // the same four runs in Node
    const axis = parseVary(demo, 'ambient_C=-20:40:4');
    if (!axis.ok) throw new Error(axis.message);
    const plan = planSweep(demo, [axis.value]);
    if (!plan.ok) throw new Error(plan.message);
    line.y.forEach((y, i) => {
      const node = runSweepPoint(plan.value, i).summary!.safe_window_s!;
      // the window is a difference of two event times, each within 0.5 s between engines (accuracy promise)
      assertClose(y!, node, { abs: 1 }, `window at ${line.x[i]} °C`);
    });
    expect(await page.$eval('.study-panel', (e) => e.textContent ?? '')).not.toMatch(/NaN|Infinity|undefined/);

    // a click on the third run (20 °C) loads it; the back button restores the demo's 22 °C
    const before = await page.$eval('[data-testid="run-status"]', (e) => Number((e as HTMLElement).dataset.run));
    await page.$eval('[data-testid="plot-study"]', (e) => (e as HTMLElement & { emit: (ev: string, d: unknown) => void }).emit('plotly_click', { points: [{ customdata: 2 }] }));
    await waitForDone(page, before);
    expect(await page.$eval('input[data-path="ambient_C"]', (e) => (e as HTMLInputElement).value)).toBe('20');
    await page.click('[data-testid="study-back"]');
    expect(await page.$eval('input[data-path="ambient_C"]', (e) => (e as HTMLInputElement).value)).toBe(String(demo.ambient_C));
  });
});
