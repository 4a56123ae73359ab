/**
 * Probes follow the stack a user edits: the demo carries no probe depths of its own, so a thinner stack computes;
 * depths the user types are checked against the stack and a bad one is named beside the probe field.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freshPage, runCount, startHarness, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const status = '[data-testid="run-status"]';

describe('probe depths in the browser view', () => {
  it('a thinner anode (2 → 1 mm) computes without touching the probes', async () => {
    const page = await freshPage(harness);
    const before = await runCount(page);
    await page.fill('[data-testid="layer-thickness-2"]', '1');
    await waitForDone(page, before);
    expect(await page.$$eval('[data-testid="field-error"]', (es) => es.length)).toBe(0);
    expect(await page.$eval('[data-testid="probes-mm"]', (e) => (e as HTMLInputElement).value)).toBe('');
    await page.context().close();
  });

  it('a typed probe outside the stack is named at the probe field, and clearing it computes again', async () => {
    const page = await freshPage(harness);
    await page.fill('[data-testid="probes-mm"]', '0, 1, 9');
    await page.waitForFunction((s) => document.querySelector(s)?.textContent === 'error', status);
    const beside = await page.$$eval('.field:has([data-testid="probes-mm"]) [data-testid="field-error"]', (es) => es.map((e) => e.textContent ?? ''));
    expect(beside.length).toBe(1);
    expect(beside[0]).toMatch(/output\.probes_mm\[2\].*within the stack.*9/);
    const before = await runCount(page);
    await page.fill('[data-testid="probes-mm"]', '0, 1, 4.5');
    await waitForDone(page, before);
    expect(await page.$$eval('[data-testid="field-error"]', (es) => es.length)).toBe(0);
    await page.context().close();
  });
});
