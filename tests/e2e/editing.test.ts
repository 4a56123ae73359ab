/**
 * Editing the scenario in the view: every edit re-runs; the direction of each change is checked against the physics
 * it must follow, and a bad value is named beside its field without breaking the page.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { assertClose } from '../support/assert-close.ts';
import { artifacts, freshPage as openPage, runCount, shown, startHarness, text, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const freshPage = (): Promise<Page> => openPage(harness);

/** Fills a field and waits for the re-run it causes to be shown. */
async function edit(page: Page, testid: string, value: string): Promise<void> {
  const before = await runCount(page);
  await page.fill(`[data-testid="${testid}"]`, value);
  await waitForDone(page, before);
}

describe('editing in the browser view', () => {
  it('a thicker separator half-freezes later', async () => {
    // More salt holds more latent heat (latent heat × mass) for the same faces to remove, so freezing takes longer:
    // the energy balance of the enthalpy method; common practice, no source needed beyond that balance.
    const page = await freshPage();
    const before = await shown(page, 'verdict-half-frozen-at');
    await edit(page, 'layer-thickness-1', '3');
    const after = await shown(page, 'verdict-half-frozen-at');
    expect(Number.isFinite(before)).toBe(true);
    expect(after).toBeGreaterThan(before);
    await page.context().close();
  });

  it('a negative thickness is named beside the field, the last result stays, and no NaN appears', async () => {
    const page = await freshPage();
    const halfFrozen = await text(page, 'verdict-half-frozen-at');
    await page.fill('[data-testid="layer-thickness-1"]', '-1.5');
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'error');
    const beside = await page.$$eval('[data-testid="layer-row-1"] [data-testid="field-error"]', (es) => es.map((e) => e.textContent ?? ''));
    expect(beside).toEqual(['must be > 0, got -1.5']);
    expect(await page.$$eval('[data-testid="field-error"]', (es) => es.length)).toBeGreaterThanOrEqual(1);
    expect(await text(page, 'verdict-half-frozen-at')).toBe(halfFrozen);
    const pageText = await page.evaluate(() => document.body.innerText);
    expect(pageText).not.toMatch(/NaN/);
    expect(pageText).not.toMatch(/Infinity/);
    await page.screenshot({ path: `${artifacts}/view-field-error.png` });
    // text that is not a number is kept as typed and named too
    await page.fill('[data-testid="layer-thickness-1"]', 'thick');
    await page.waitForFunction(() => document.querySelector('[data-testid="layer-row-1"] [data-testid="field-error"]')?.textContent?.includes('"thick"'));
    // fixing the value clears the message and computes again
    await edit(page, 'layer-thickness-1', '1.5');
    expect(await page.$$eval('[data-testid="field-error"]', (es) => es.length)).toBe(0);
    expect(await text(page, 'verdict-half-frozen-at')).toBe(halfFrozen);
    await page.context().close();
  });

  it('"heat off at" moves the bottom row where the heating ends, and the freeze follows it', async () => {
    const page = await freshPage();
    await edit(page, 'heat-off-s', '1200');
    // the same value shows in that row's own field (bottom row 2)
    expect(await page.$eval('[data-testid="bottom-row-1"] input[data-path="bottom[1].from_s"]', (e) => (e as HTMLInputElement).value)).toBe('1200');
    const halfFrozen = await shown(page, 'verdict-half-frozen-at');
    // half-frozen is defined after the heat is removed (DESIGN.md, result contract)
    expect(halfFrozen).toBeGreaterThan(1200);
    await page.context().close();
  });

  it('a warmer room (ambient) gives a longer usable window', async () => {
    // Newton's law of cooling: heat loss scales with the face-to-ambient difference, so a warmer room cools slower.
    const page = await freshPage();
    const before = await shown(page, 'verdict-window');
    await edit(page, 'ambient-c', '150');
    expect(await shown(page, 'verdict-window')).toBeGreaterThan(before);
    await page.context().close();
  });

  it('adding, moving and removing layers keeps the stack editable and computed', async () => {
    const page = await freshPage();
    let before = await runCount(page);
    await page.click('text=+ layer on top');
    before = await waitForDone(page, before);
    expect(await page.$$eval('[data-testid^="layer-row-"]', (es) => es.length)).toBe(4);
    expect(await page.$eval('[data-testid="layer-material-3"]', (e) => (e as HTMLSelectElement).value)).toBe('alumina');
    await page.click('[data-testid="layer-row-3"] button[title="move this layer down"]');
    before = await waitForDone(page, before);
    expect(await page.$eval('[data-testid="layer-material-2"]', (e) => (e as HTMLSelectElement).value)).toBe('alumina');
    await page.click('[data-testid="layer-row-2"] button[title="remove this layer"]');
    await waitForDone(page, before);
    expect(await page.$$eval('[data-testid^="layer-row-"]', (es) => es.length)).toBe(3);
    expect(await page.$eval('[data-testid="layer-material-2"]', (e) => (e as HTMLSelectElement).value)).toBe('magnesium');
    await page.context().close();
  });

  it('a heat source and a contact resistance edited in the stack reach the scenario and the energy ledger', async () => {
    const page = await freshPage();
    let before = await runCount(page);
    const row = '[data-testid="layer-row-1"]';
    await page.click(`${row} button[title^="add a volumetric heat source"]`);
    // the new row is empty: nothing runs until its value and end are filled in (tests/e2e/sources.test.ts)
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'waiting');
    await page.fill(`${row} input[data-path="layers[1].source_W_m3[0].value"]`, '1e6');
    await page.fill(`${row} input[data-path="layers[1].source_W_m3[0].to_s"]`, '60');
    before = await waitForDone(page, before);
    // energy conservation: the ledger books what the source put in, value × thickness × time = 90 kJ/m² here;
    // the ledger prints 0.1 kJ/m² (6 significant figures on its largest term), so half of that is the tolerance
    const sourceKJ = await page.$eval('.ledger tbody tr:nth-child(3) td', (e) => Number(e.textContent));
    assertClose(sourceKJ, (1e6 * 1.5e-3 * 60) / 1000, { abs: 0.05 }, 'heat from the source, kJ/m²');
    await page.fill(`${row} input[data-path="layers[1].source_W_m3[0].to_s"]`, '0');
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'error');
    expect(await page.$eval(`${row} [data-testid="field-error"]`, (e) => e.textContent)).toMatch(/must be > from_s/);
    before = await runCount(page);
    await page.fill(`${row} input[data-path="layers[1].source_W_m3[0].to_s"]`, '30');
    before = await waitForDone(page, before);
    await page.fill('input[data-path="contacts[0].resistance_m2K_W"]', '');
    await waitForDone(page, before);
    const saved = await page.evaluate(() => JSON.parse(localStorage.getItem('freezeline.scenario.v1') ?? '{}') as {
      layers: { source_W_m3?: unknown }[]; contacts: unknown[];
    });
    expect(saved.layers[1]!.source_W_m3).toEqual([{ from_s: 0, to_s: 30, value: 1e6 }]);
    expect(saved.contacts).toEqual([{ below: 'separator', above: 'anode', resistance_m2K_W: 1e-4 }]);
    await page.context().close();
  });
});
