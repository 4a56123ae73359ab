/**
 * A heat source added in the view: the new row starts empty and starts no run until it is filled in (an empty field of
 * a new row reads "to fill in", not as an error); its value can be typed as the layer's total watts over the footprint
 * or in W/kg, is stored in W/m³ (the file's unit) and is shown in the other units beside it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { runnerDefaults } from '../../ui/runner.ts';
import { assertClose } from '../support/assert-close.ts';
import { freshPage as openPage, runCount, startHarness, text, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const freshPage = (): Promise<Page> => openPage(harness);
const ROW = '[data-testid="layer-row-1"]';
const at = (key: string) => `${ROW} input[data-path="layers[1].source_W_m3[0].${key}"]`;
/** Runs the page has started (each start sets this performance mark). */
const runsStarted = (page: Page): Promise<number> => page.evaluate(() => performance.getEntriesByName('freezeline:run-start').length);
const saved = (page: Page) => page.evaluate(() =>
  (JSON.parse(localStorage.getItem('freezeline.scenario.v1') ?? '{}') as { layers: { source_W_m3?: { value?: unknown }[] }[] }).layers[1]!.source_W_m3);

/** Waits long enough that a debounced run, had one been requested, would have started (4 × the debounce). */
const settle = (page: Page): Promise<void> => page.waitForTimeout(4 * runnerDefaults.debounceMs);

describe('a new heat-source row in the browser view', () => {
  it('reruns nothing until it is valid: its empty fields read "to fill in", not as errors', async () => {
    const page = await freshPage();
    const started = await runsStarted(page);
    const shown = await runCount(page);
    await page.click(`${ROW} button[title^="add a volumetric heat source"]`);
    await settle(page);
    expect(await runsStarted(page), 'no run started by adding the row').toBe(started);
    expect(await text(page, 'run-status')).toBe('waiting');
    expect(await page.$$eval(`${ROW} [data-testid="field-todo"]`, (es) => es.map((e) => e.textContent))).toEqual(['to fill in', 'to fill in']);
    expect(await page.$$eval('[data-testid="field-error"]', (es) => es.length), 'an empty new field is not an error').toBe(0);
    expect(await saved(page)).toEqual([{ from_s: 0 }]);
    // half filled in: still no run
    await page.fill(at('value'), '2e6');
    await settle(page);
    expect(await runsStarted(page)).toBe(started);
    expect(await page.$$eval(`${ROW} [data-testid="field-todo"]`, (es) => es.length)).toBe(1);
    // filled in: one run, and the result is shown
    await page.fill(at('to_s'), '30');
    await waitForDone(page, shown);
    expect(await runsStarted(page)).toBeGreaterThan(started);
    expect(await page.$$eval('[data-testid="field-todo"]', (es) => es.length)).toBe(0);
    await page.context().close();
  });

  it('a value typed as total watts over the footprint is stored in W/m³ and books that power in the energy balance', async () => {
    const page = await freshPage();
    await page.click(`${ROW} button[title^="add a volumetric heat source"]`);
    await page.selectOption('[data-testid="source-unit-1-0"]', 'W');
    const before = await runCount(page);
    await page.fill(at('value'), '0.5');
    await page.fill(at('to_s'), '60');
    await waitForDone(page, before);
    // W/m³ = P / (A t): the demo's 25 mm disc (A = π d²/4) and 1.5 mm separator; exact to double precision
    const areaM2 = (Math.PI * 0.025 ** 2) / 4;
    const wPerM3 = 0.5 / (areaM2 * 1.5e-3);
    const stored = (await saved(page))?.[0]?.value;
    assertClose(Number(stored), wPerM3, { rel: 1e-12 }, 'stored source, W/m³');
    // energy conservation: P t over the footprint = 0.5 W × 60 s = 30 J; the ledger prints 6 significant figures
    // on its largest term (≈ 6745 J: two decimals), so the tolerance is half the last printed digit, 0.005 J
    const totalJ = await page.$eval('.ledger tbody tr:nth-child(3) td:nth-child(3)', (e) => Number(e.textContent));
    assertClose(totalJ, 0.5 * 60, { abs: 0.005 }, 'heat from the source over the footprint, J');
    // shown in the other units too: W/m³ and W/kg = W/m³ ÷ ρ, with the salt's density 1648 kg/m³ from its library
    // file (materials/licl-kcl-eutectic.json); the page prints 3 significant figures
    const also = await text(page, 'source-also-1-0');
    expect(also).toContain(`${Number(wPerM3.toPrecision(3))} W/m³`);
    expect(also).toContain(`${Number((wPerM3 / 1648).toPrecision(3))} W/kg`);
    // and read back in the chosen unit after the editor is redrawn (a structural edit elsewhere)
    const runs = await runCount(page);
    await page.click('text=+ layer on top');
    await waitForDone(page, runs);
    expect(await page.$eval(at('value'), (e) => (e as HTMLInputElement).value)).toBe('0.5');
    await page.context().close();
  });
});
