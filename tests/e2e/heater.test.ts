/**
 * The heater in the browser view: a scenario with a heater body loads from a file, runs, and the temperature chart
 * shows the plate temperature and the heater power (W, on its own axis) beside the layers; the energy panel its summary.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { repoRoot, startHarness, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

describe('heater in the view', () => {
  it('the temperature chart draws the heater plate and the heater power of examples/heater-plate-lift-off.json', async () => {
    const context = await harness.browser.newContext({ viewport: { width: 1400, height: 900 } });
    const page = await context.newPage();
    await page.goto(harness.url);
    const before = await waitForDone(page);
    await page.setInputFiles('[data-testid="load-json"]', `${repoRoot}examples/heater-plate-lift-off.json`);
    await waitForDone(page, before, 60_000);
    await page.waitForFunction(() => {
      const el = document.querySelector('[data-testid="plot-temperatures"]') as (HTMLElement & { data?: { name?: string }[] }) | null;
      return (el?.data ?? []).some((t) => t.name === 'heater power, W');
    }, undefined, { timeout: 30_000 });
    const traces = await page.$eval('[data-testid="plot-temperatures"]', (e) =>
      ((e as HTMLElement & { data?: { name?: string; y?: (number | null)[]; yaxis?: string }[] }).data ?? [])
        .filter((t) => t.name?.startsWith('heater')).map((t) => ({ name: t.name, yaxis: t.yaxis ?? 'y', y: t.y ?? [] })));
    const power = traces.find((t) => t.name === 'heater power, W')!;
    const plate = traces.find((t) => t.name === 'heater plate, °C')!;
    expect(power.yaxis).toBe('y2');
    // the file's heater: 150 W when on, 0 when off (an on-off thermostat), and nothing after the lift-off at 15 min
    expect(new Set(power.y)).toEqual(new Set([150, 0]));
    // the plate is drawn while the cell is on it, and left out (a gap) after the lift-off
    expect(plate.y.some((v) => v === null)).toBe(true);
    expect(Math.max(...plate.y.filter((v): v is number => v !== null))).toBeLessThanOrEqual(420.1);
    // the energy panel names the heater's channel and its summary (energy, time under the stack, duty cycle)
    const note = await page.$eval('[data-testid="heater-summary"]', (e) => e.textContent ?? '');
    expect(note).toMatch(/^Heater: [\d.]+ kJ over 900 s under the stack, duty cycle [\d.]+ %, plate up to 420\.0 °C\.$/);
    await context.close();
  });
});
