/**
 * The view under load and under mistakes: a long run reports progress, leaves the page answering input, and can be
 * cancelled with the last good result kept; an error in a value that two controls share is shown beside both.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { noValueWords, stoppedWords, windowStatusWords } from '../../sim/observe/wording.ts';
import { artifacts, freshPage as openPage, repoRoot, startHarness, text, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const freshPage = (): Promise<Page> => openPage(harness);

const statusIs = (page: Page, word: string) =>
  page.waitForFunction((w) => document.querySelector('[data-testid="run-status"]')?.textContent === w, word);

describe('the browser view while a run is long or an input is wrong', () => {
  it('a long run shows progress, the page keeps answering, and cancel keeps the last result', async () => {
    const page = await freshPage();
    const halfFrozen = await text(page, 'verdict-half-frozen-at');
    // the demo with a 0.04 s step cap on a grid about 5× finer: 90 004 steps of 216 cells, 1.94e7 cell-steps, just
    // under the scenario's limit of 2e7 forced cell-steps (scenarioLimitDefaults), so the run is still going when the
    // page is asked and when cancel is clicked. Measured 4.7 s in Node on 2026-12-05 (longer in the browser); the grid
    // of 120 cells this test had took 3.0 s by then, where it took tens of seconds when written, and a CI run once
    // finished it before the click landed
    const demo = JSON.parse(readFileSync(`${repoRoot}examples/bench-coupon.json`, 'utf8')) as Record<string, unknown>;
    writeFileSync(`${artifacts}/slow-demo.json`, JSON.stringify({ ...demo, numerics: { max_step_s: 0.04, cells_per_mm: 36, separator_cells_per_mm: 72 } }));
    await page.setInputFiles('[data-testid="load-json"]', `${artifacts}/slow-demo.json`);
    await statusIs(page, 'running');
    await page.waitForFunction(() => Number((document.getElementById('run-progress') as HTMLProgressElement).value) > 0);
    // The page answers while the solve is still going: each round trip through the page's main thread comes back
    // with the run still in progress, which a solve on the main thread could not allow. (The round-trip times are
    // printed, not asserted: on a shared 2-core machine they measure the machine, not the page.)
    const latencies: number[] = [];
    for (let k = 0; k < 5; k++) {
      const t0 = Date.now();
      const status = await page.evaluate(() => document.querySelector('[data-testid="run-status"]')?.textContent);
      latencies.push(Date.now() - t0);
      expect(status, `round trip ${k}: the run is still in progress when the page answers`).toBe('running');
    }
    console.log(`[timing] page round trip while the solver runs: ${latencies.join(', ')} ms`);
    await page.click('#cancel-run', { timeout: 5000 });
    await statusIs(page, 'cancelled');
    expect(await text(page, 'verdict-half-frozen-at')).toBe(halfFrozen);
    expect(await page.$eval('#stale-note', (e) => (e as HTMLElement).hidden)).toBe(false);
    await page.context().close();
  });

  it('an out-of-order heater removal time is named beside the heater control and beside the row it moves', async () => {
    const page = await freshPage();
    await page.fill('[data-testid="heat-off-s"]', '0');
    await statusIs(page, 'error');
    const nearControl = await page.$$eval('.heat-off [data-testid="field-error"]', (es) => es.map((e) => e.textContent ?? ''));
    const nearRow = await page.$$eval('[data-testid="bottom-row-1"] [data-testid="field-error"]', (es) => es.map((e) => e.textContent ?? ''));
    expect(nearControl).toHaveLength(1);
    expect(nearControl[0]).toMatch(/time order/);
    expect(nearRow).toEqual(nearControl);
    expect(await page.evaluate(() => document.body.innerText)).not.toMatch(/NaN/);
    await page.context().close();
  });

  it('a scenario that draws more heat than the stack holds stops with the physical reason, and shows the run up to the stop', async () => {
    const page = await freshPage();
    // the demo with its bottom drained at 50 kW/m² from the start: the 4.5 mm stack (about 11 kJ/m²K of heat capacity)
    // would fall from 22 °C to 0 K within a minute or so
    const demo = JSON.parse(readFileSync(`${repoRoot}examples/bench-coupon.json`, 'utf8')) as Record<string, unknown>;
    writeFileSync(`${artifacts}/drained-demo.json`, JSON.stringify({ ...demo, bottom: [{ from_s: 0, flux_W_m2: -50000 }] }));
    await page.setInputFiles('[data-testid="load-json"]', `${artifacts}/drained-demo.json`);
    await statusIs(page, 'failed');
    const detail = await page.$eval('#run-detail', (e) => e.textContent ?? '');
    expect(detail).toMatch(/^the run stopped: the heat drawn from the bottom face exceeds what the stack holds: its temperature would fall below absolute zero at t = [\d.]+ s$/);
    const stopS = Number(/t = ([\d.]+) s$/.exec(detail)![1]);
    // the verdict says why above what the run did record, and claims nothing past the stop
    await page.waitForSelector('[data-testid="verdict-stopped"]');
    expect(await text(page, 'verdict-stopped')).toContain('The run stopped: the heat drawn from the bottom face');
    expect(await text(page, 'verdict-window')).toBe(stoppedWords.window);
    expect(await text(page, 'verdict-half-frozen-at')).toBe(stoppedWords.notReached);
    // the temperature chart is this run's, up to its last accepted step before the stop (the stop time itself is
    // interpolated inside the step that went below 0 K): a time axis in seconds that ends at or before the stop
    await page.waitForFunction((s) => {
      const el = document.querySelector('[data-testid="plot-temperatures"]') as (HTMLElement & { data?: { x?: number[] }[] }) | null;
      const x = el?.data?.[0]?.x;
      return x !== undefined && x.length > 1 && x[x.length - 1]! > 0 && x[x.length - 1]! <= s;
    }, stopS);
    // (a trace's y may be a typed array: Array.from makes it a list of numbers; limit lines carry nulls)
    const coldest = await page.$eval('[data-testid="plot-temperatures"]', (el) => Math.min(...((el as HTMLElement & { data: { y?: ArrayLike<number | null> }[] }).data
      .flatMap((t) => Array.from(t.y ?? []).filter((v): v is number => typeof v === 'number')))));
    // the coldest cell drawn has fallen far below the 22 °C the stack started at (measured −141.6 °C at 29.9 s)
    expect(coldest).toBeLessThan(-100);
    // not the last good result: nothing is marked stale, and no operating-duration search runs for it
    expect(await page.$eval('#stale-note', (e) => (e as HTMLElement).hidden)).toBe(true);
    expect(await page.$eval('[data-testid="operating-status"]', (e) => (e as HTMLElement).dataset.state)).toBe('none');
    expect(await page.evaluate(() => document.body.innerText)).not.toMatch(/internal error|NaN/);
    // nor a window status among the warnings: the part that ran cannot tell whether the separator would have melted
    expect(await page.$eval('#warnings', (e) => e.textContent ?? '')).not.toContain(windowStatusWords['never-molten'].sentence);
    await page.screenshot({ path: `${artifacts}/view-stopped.png`, fullPage: true });
    await page.context().close();
  });

  it('without a separator the verdict says so and nothing shows NaN', async () => {
    const page = await freshPage();
    await page.uncheck('[data-testid="layer-row-1"] input[type="checkbox"]');
    // the words are the wording table's (sim/observe/wording.ts), as the CLI prints them
    const none = windowStatusWords['no-separator'];
    await page.waitForFunction((w) => document.querySelector('[data-testid="verdict-window"]')?.textContent === w, none.label);
    expect(await text(page, 'run-status')).toBe('done');
    expect(await text(page, 'verdict-half-frozen-at')).toBe(noValueWords.half_frozen_at_s);
    expect(await page.$eval('.card.window', (e) => e.textContent ?? '')).toContain(none.sentence);
    expect(await page.evaluate(() => document.body.innerText)).not.toMatch(/NaN|Infinity/);
    await page.screenshot({ path: `${artifacts}/view-no-separator.png`, fullPage: true });
    await page.context().close();
  });
});
