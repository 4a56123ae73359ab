/**
 * Keeping scenarios: save and load JSON (exact round trip), the localStorage autosave across a reload, the share
 * link, and the CSV export of the series (RFC 4180: one header row, comma-separated).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { artifacts, repoRoot, runCount, startHarness, text, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

async function freshPage(): Promise<Page> {
  const context = await harness.browser.newContext({ viewport: { width: 1400, height: 900 }, acceptDownloads: true });
  const page = await context.newPage();
  await page.goto(harness.url);
  await waitForDone(page);
  return page;
}

async function downloadText(page: Page, testid: string, saveAs: string): Promise<string> {
  const [download] = await Promise.all([page.waitForEvent('download'), page.click(`[data-testid="${testid}"]`)]);
  await download.saveAs(saveAs);
  return readFileSync(saveAs, 'utf8');
}

const demo = JSON.parse(readFileSync(`${repoRoot}examples/bench-coupon.json`, 'utf8')) as unknown;

describe('scenario files in the browser view', () => {
  it('save then load round-trips the scenario exactly', async () => {
    const page = await freshPage();
    const saved = await downloadText(page, 'save-json', `${artifacts}/saved-demo.json`);
    // opened on the demo and untouched: the saved file is the demo file, key for key
    expect(JSON.parse(saved)).toEqual(demo);
    // change it, then load the saved file back
    let before = await runCount(page);
    await page.fill('[data-testid="layer-thickness-1"]', '2.5');
    before = await waitForDone(page, before);
    await page.setInputFiles('[data-testid="load-json"]', `${artifacts}/saved-demo.json`);
    await waitForDone(page, before);
    expect(await page.$eval('[data-testid="layer-thickness-1"]', (e) => (e as HTMLInputElement).value)).toBe('1.5');
    const again = await downloadText(page, 'save-json', `${artifacts}/saved-again.json`);
    expect(JSON.parse(again)).toEqual(JSON.parse(saved));
    expect(again).toBe(saved);
    await page.context().close();
  });

  it('a file with an unknown key loads, and the solver names the key', async () => {
    const page = await freshPage();
    const bad = { ...(demo as Record<string, unknown>), ambiant_C: 20 };
    writeFileSync(`${artifacts}/misspelt.json`, JSON.stringify(bad));
    await page.setInputFiles('[data-testid="load-json"]', `${artifacts}/misspelt.json`);
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'error');
    const messages = await page.$$eval('[data-testid="field-error"]', (es) => es.map((e) => e.textContent ?? ''));
    expect(messages.some((m) => m.includes('ambiant_C') && m.includes('unknown key'))).toBe(true);
    await page.context().close();
  });

  it('a reload restores the autosaved scenario', async () => {
    const page = await freshPage();
    let before = await runCount(page);
    await page.fill('[data-testid="ambient-c"]', '31');
    before = await waitForDone(page, before);
    await page.fill('[data-testid="layer-thickness-0"]', '1.25');
    const edited = await waitForDone(page, before);
    const halfFrozen = await text(page, 'verdict-half-frozen-at');
    expect(edited).toBeGreaterThan(0);
    await page.reload();
    await waitForDone(page);
    expect(await page.$eval('[data-testid="ambient-c"]', (e) => (e as HTMLInputElement).value)).toBe('31');
    expect(await page.$eval('[data-testid="layer-thickness-0"]', (e) => (e as HTMLInputElement).value)).toBe('1.25');
    expect(await text(page, 'verdict-half-frozen-at')).toBe(halfFrozen);
    await page.context().close();
  });

  it('the share link opens the same scenario in a fresh browser', async () => {
    const page = await freshPage();
    const before = await runCount(page);
    await page.fill('[data-testid="layer-thickness-2"]', '2.75');
    await waitForDone(page, before);
    await page.click('#share-link');
    const link = await page.$eval('#share-url', (e) => (e as HTMLInputElement).value);
    expect(link).toMatch(/#scenario=[A-Za-z0-9_-]+$/);
    const other = await freshPage();
    await other.goto(link);
    await other.reload(); // the hash is consumed into the autosave: a reload keeps the shared scenario
    await waitForDone(other);
    expect(await other.$eval('[data-testid="layer-thickness-2"]', (e) => (e as HTMLInputElement).value)).toBe('2.75');
    await page.context().close();
    await other.context().close();
  });

  it('exports the series as CSV: a header with units and one row per recorded step', async () => {
    const page = await freshPage();
    const csv = await downloadText(page, 'export-csv', `${artifacts}/series.csv`);
    const lines = csv.trimEnd().split('\r\n');
    const header = lines[0]!.split(',');
    expect(header[0]).toBe('t_s');
    expect(header).toContain('separator_mean_C');
    expect(header).toContain('separator_liquid_fraction');
    expect(lines.length).toBeGreaterThan(100);
    for (const line of lines.slice(1)) {
      const cells = line.split(',');
      expect(cells).toHaveLength(header.length);
      expect(cells.every((c) => Number.isFinite(Number(c)) && c !== '')).toBe(true);
    }
    await page.context().close();
  });
});
