/**
 * Editing a heater body in the view (a face row of the kind "heater body", ui/heater-editor.ts): a loaded heater row
 * shows every value of its file, saves back unchanged, and a power change moves the run the way the energy balance
 * says; a new heater row starts "to fill in", runs once filled, and books ∫P dt as the heater's energy.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { runnerDefaults } from '../../ui/runner.ts';
import { assertClose } from '../support/assert-close.ts';
import { artifacts, freshPage as openPage, repoRoot, runCount, shown, startHarness, text, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const EXAMPLE = `${repoRoot}examples/heater-plate-lift-off.json`;
const ID = 'bottom-heater-0';
const value = (page: Page, what: string): Promise<string> =>
  page.$eval(`[data-testid="${ID}-${what}"]`, (e) => (e as HTMLInputElement | HTMLSelectElement).value);
const runsStarted = (page: Page): Promise<number> => page.evaluate(() => performance.getEntriesByName('freezeline:run-start').length);

async function loadExample(page: Page): Promise<void> {
  const before = await runCount(page);
  await page.setInputFiles('[data-testid="load-json"]', EXAMPLE);
  await waitForDone(page, before, 60_000);
}

async function saveText(page: Page, saveAs: string): Promise<string> {
  const [download] = await Promise.all([page.waitForEvent('download'), page.click('[data-testid="save-json"]')]);
  await download.saveAs(saveAs);
  return readFileSync(saveAs, 'utf8');
}

describe('the heater-body row of the face editor', () => {
  it('shows every value of examples/heater-plate-lift-off.json, saves it back unchanged, and less power melts later', async () => {
    const page = await openPage(harness);
    await loadExample(page);
    const file = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { bottom: { heater?: unknown }[] };
    expect(await page.$eval('[data-testid="bottom-row-0-kind"]', (e) => (e as HTMLSelectElement).value)).toBe('heater');
    // the file's heater: 150 W, 6 mm stainless-304 plate, 2000 W/(m²·K) contact, 10 W/(m²·K) loss, on-off at 420 °C, 5 K band, on the plate
    expect({
      power: await value(page, 'power'), material: await value(page, 'material'), thickness: await value(page, 'thickness'),
      contact: await value(page, 'contact'), loss: await value(page, 'loss'), control: await value(page, 'control'),
      setPoint: await value(page, 'set-point'), band: await value(page, 'band'), sensor: await value(page, 'sensor'),
    }).toEqual({ power: '150', material: 'stainless-304', thickness: '6', contact: '2000', loss: '10', control: 'on-off', setPoint: '420', band: '5', sensor: 'plate' });
    // the lift-off row: a 10 mm ceramic tile through 500 W/(m²·K), from ambient (no start_C in the file)
    expect(await page.$eval('[data-testid="bottom-row-1-kind"]', (e) => (e as HTMLSelectElement).value)).toBe('bench');
    expect(await page.$$eval('[data-testid^="bottom-bench-1-"]', (es) => es.map((e) => (e as HTMLInputElement).value)))
      .toEqual(['ceramic-tile', '500', '', '10']);
    expect(await page.$$eval('[data-testid="field-todo"]', (es) => es.length)).toBe(0);
    expect(await text(page, 'run-status')).toBe('done');
    await page.locator('[data-testid="bottom-row-0"]').screenshot({ path: `${artifacts}/heater-row-loaded.png` });
    // a save round-trips the file: the heater key (and every other) as loaded
    const saved = JSON.parse(await saveText(page, `${artifacts}/saved-heater.json`)) as typeof file;
    expect(saved.bottom[0]!.heater).toEqual(file.bottom[0]!.heater);
    expect(saved).toEqual(file);
    // less power heats the plate, and through it the salt, more slowly (energy balance of the plate: c′·dT/dt ≤ P/A
    // while the heater is on; common practice, no source beyond that balance): the separator is molten later
    const molten150 = await shown(page, 'verdict-molten-at');
    const before = await runCount(page);
    await page.fill(`[data-testid="${ID}-power"]`, '100');
    await waitForDone(page, before, 60_000);
    const molten100 = await shown(page, 'verdict-molten-at');
    expect(Number.isFinite(molten150)).toBe(true);
    expect(molten100).toBeGreaterThan(molten150);
    await page.context().close();
  });

  it('names the core\'s error beside the heater field it is about', async () => {
    const page = await openPage(harness);
    await loadExample(page);
    await page.fill(`[data-testid="${ID}-power"]`, '-5');
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'error');
    const beside = await page.$$eval(`[data-testid="${ID}-power"] ~ [data-testid="field-error"]`, (es) => es.map((e) => e.textContent ?? ''));
    expect(beside).toEqual(['must be > 0, got -5']);
    // switched to PI with a zero integral time: the core's message stands beside that field
    await page.fill(`[data-testid="${ID}-power"]`, '150');
    await page.selectOption(`[data-testid="${ID}-control"]`, 'pi');
    await page.fill(`[data-testid="${ID}-gain"]`, '5');
    await page.fill(`[data-testid="${ID}-integral"]`, '0');
    await page.waitForFunction((id) => document.querySelector(`[data-testid="${id}-integral"] ~ [data-testid="field-error"]`) !== null, ID);
    expect(await page.$eval(`[data-testid="${ID}-integral"] ~ [data-testid="field-error"]`, (e) => e.textContent)).toBe('must be > 0, got 0');
    const pageText = await page.evaluate(() => document.body.innerText);
    expect(pageText).not.toMatch(/NaN|Infinity/);
    await page.context().close();
  });

  it('turns the set-point into a schedule of (time, °C) points that saves as heater.set_points', async () => {
    const page = await openPage(harness);
    await loadExample(page);
    await page.selectOption(`[data-testid="${ID}-set-point-mode"]`, 'schedule');
    // the value given so far becomes the first point, at 0 s
    expect([await value(page, 'point-0-at'), await value(page, 'point-0-C')]).toEqual(['0', '420']);
    await page.click(`[data-testid="${ID}-add-point"]`);
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'waiting');
    expect(await page.$$eval('[data-testid="bottom-row-0"] [data-testid="field-todo"]', (es) => es.length)).toBe(2);
    const before = await runCount(page);
    await page.fill(`[data-testid="${ID}-point-1-at"]`, '600');
    await page.fill(`[data-testid="${ID}-point-1-C"]`, '400');
    await waitForDone(page, before, 60_000);
    await page.locator('[data-testid="bottom-row-0"]').screenshot({ path: `${artifacts}/heater-row-schedule.png` });
    const saved = JSON.parse(await saveText(page, `${artifacts}/saved-heater-schedule.json`)) as { bottom: { heater: Record<string, unknown> }[] };
    expect(saved.bottom[0]!.heater.set_points).toEqual([{ at_s: 0, set_point_C: 420 }, { at_s: 600, set_point_C: 400 }]);
    expect(saved.bottom[0]!.heater.control).toEqual({ kind: 'on-off', band_K: 5, sensor: 'plate' });
    // a schedule with no point left: the core's message stands beside the button that adds one
    await page.click('[data-testid="bottom-row-0"] [data-testid="bottom-heater-0-point-1"] button');
    await page.click('[data-testid="bottom-row-0"] [data-testid="bottom-heater-0-point-0"] button');
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'error');
    expect(await page.$eval(`[data-testid="${ID}-add-point"] ~ [data-testid="field-error"]`, (e) => e.textContent)).toMatch(/^must hold at least one point, got /);
    await page.context().close();
  });

  it('a demo row made a heater body starts "to fill in", runs once filled and books ∫P dt as the heater energy; a bench row too', async () => {
    const page = await openPage(harness);
    const started = await runsStarted(page);
    await page.selectOption('[data-testid="bottom-row-0-kind"]', 'heater');
    await page.waitForTimeout(4 * runnerDefaults.debounceMs);
    expect(await runsStarted(page), 'no run while fields are empty').toBe(started);
    expect(await text(page, 'run-status')).toBe('waiting');
    // power, plate material, plate thickness, contact conductance; constant power needs nothing more
    expect(await page.$$eval('[data-testid="bottom-row-0"] [data-testid="field-todo"]', (es) => es.length)).toBe(4);
    expect(await page.$$eval('[data-testid="field-error"]', (es) => es.length), 'an empty new field is not an error').toBe(0);
    await page.locator('[data-testid="bottom-row-0"]').screenshot({ path: `${artifacts}/heater-row-new.png` });
    const before = await runCount(page);
    await page.fill(`[data-testid="${ID}-power"]`, '10');
    await page.selectOption(`[data-testid="${ID}-material"]`, 'stainless-304');
    await page.fill(`[data-testid="${ID}-thickness"]`, '6');
    await page.fill(`[data-testid="${ID}-contact"]`, '2000');
    await waitForDone(page, before, 60_000);
    expect(await page.$$eval('[data-testid="field-todo"]', (es) => es.length)).toBe(0);
    // constant power while the cell is on the heater (0 to 900 s, the demo's second bottom row): ∫P dt = 10 W × 900 s
    // = 9.00 kJ, exact; the page prints 3 significant figures, so the tolerance is half the last digit, 0.005 kJ
    const note = await text(page, 'heater-summary');
    const m = /^Heater: ([\d.]+) kJ over 900 s under the stack, duty cycle ([\d.]+) %/.exec(note);
    expect(m, note).not.toBeNull();
    assertClose(Number(m![1]), 9, { abs: 0.005 }, 'heater energy, kJ');
    // full power all the time under the stack: duty cycle 100 %, printed to 0.1 %
    assertClose(Number(m![2]), 100, { abs: 0.05 }, 'duty cycle, %');
    await page.screenshot({ path: `${artifacts}/heater-editor-page.png`, fullPage: true });
    // the lift-off row made a bench surface: its material is "to fill in", then it runs and the face loses heat to it
    const runs = await runCount(page);
    await page.selectOption('[data-testid="bottom-row-1-kind"]', 'bench');
    await page.waitForFunction(() => document.querySelector('[data-testid="run-status"]')?.textContent === 'waiting');
    expect(await page.$$eval('[data-testid="bottom-row-1"] [data-testid="field-todo"]', (es) => es.length)).toBe(1);
    await page.selectOption('[data-testid="bottom-bench-1-material"]', 'ceramic-tile');
    await waitForDone(page, runs, 60_000);
    await page.locator('[data-testid="bottom-row-1"]').screenshot({ path: `${artifacts}/bench-row-new.png` });
    await page.context().close();
  });
});
