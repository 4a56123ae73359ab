/**
 * Loading a scenario file in the view goes through the solver's strict JSON reader (ui/files.ts → sim/scenario/json-text.ts):
 * a key given twice is refused with both lines, invalid JSON with its line and column, and a leading UTF-8
 * byte-order mark (RFC 8259 §8.1) is skipped, so a file saved by an editor that writes one loads as it is.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { artifacts, repoRoot, runCount, startHarness, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

async function freshPage(): Promise<Page> {
  const context = await harness.browser.newContext({ viewport: { width: 1400, height: 900 } });
  const page = await context.newPage();
  await page.goto(harness.url);
  await waitForDone(page);
  return page;
}

const demoText = readFileSync(`${repoRoot}examples/bench-coupon.json`, 'utf8');

async function noticeAfterLoading(page: Page, name: string, text: string): Promise<string> {
  writeFileSync(`${artifacts}/${name}`, text);
  await page.setInputFiles('[data-testid="load-json"]', `${artifacts}/${name}`);
  await page.waitForFunction(() => !(document.getElementById('notice')?.hidden ?? true));
  return page.$eval('#notice', (e) => e.textContent ?? '');
}

describe('loading a scenario file the view refuses', () => {
  it('a file with a key given twice is not loaded, and the notice names the key and both lines', async () => {
    const page = await freshPage();
    const twice = demoText.replace('"duration_s": 3600,', '"duration_s": -5,\n  "duration_s": 3600,');
    const line = twice.split('\n').findIndex((l) => l.includes('"duration_s": -5')) + 1;
    const notice = await noticeAfterLoading(page, 'twice.json', twice);
    expect(notice).toContain(`twice.json: duration_s: this key is given twice in the same object (lines ${line} and ${line + 1})`);
    await page.context().close();
  });

  it('a file with a missing comma is not loaded, and the notice gives the line and column', async () => {
    const page = await freshPage();
    const broken = demoText.replace('"duration_s": 3600,', '"duration_s": 3600');
    const line = broken.split('\n').findIndex((l) => l.includes('"duration_s": 3600')) + 2;
    const notice = await noticeAfterLoading(page, 'broken.json', broken);
    expect(notice).toMatch(new RegExp(`broken\\.json is not valid JSON: line ${line}, column 3: .*comma missing`));
    await page.context().close();
  });

  it('a file that starts with a byte-order mark loads and runs', async () => {
    const page = await freshPage();
    const before = await runCount(page);
    const edited = demoText.replace('"duration_s": 3600,', '"duration_s": 3000,');
    const notice = await noticeAfterLoading(page, 'marked.json', `\uFEFF${edited}`);
    expect(notice).toBe('Loaded marked.json.');
    await waitForDone(page, before);
    await page.context().close();
  });
});
