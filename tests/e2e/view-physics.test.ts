/**
 * The view's controls for the newer physics: side-wall losses (the `edges` key), "heat off at" moving every heat input
 * that ends then, and the accuracy asked of the event times (`numerics.event_accuracy_s`) with the run's stated
 * accuracy beside the verdict. The scenario the page writes is read back from its autosave (ui/persist.ts).
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifacts, freshPage as open, repoRoot, runCount, shown, shownNumber, startHarness, text, waitForDone, type Harness } from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const freshPage = (): Promise<Page> => open(harness);

const statusIs = (page: Page, word: string) =>
  page.waitForFunction((w) => document.querySelector('[data-testid="run-status"]')?.textContent === w, word, { timeout: 60_000 });

/** Types into a test hook's input and waits for the run that follows. */
async function edit(page: Page, testid: string, value: string): Promise<void> {
  const before = await runCount(page);
  await page.fill(`[data-testid="${testid}"]`, value);
  await waitForDone(page, before, 60_000);
}

/** The scenario as the page saved it. */
const saved = (page: Page): Promise<Record<string, unknown>> =>
  page.evaluate(() => JSON.parse(localStorage.getItem('freezeline.scenario.v1') ?? '{}') as Record<string, unknown>);

const ledgerRows = (page: Page): Promise<string[]> => page.$$eval('#ledger th', (es) => es.map((e) => e.textContent ?? ''));

/** The field error shown inside the field that holds a test hook. */
const errorBeside = (page: Page, testid: string): Promise<string[]> =>
  page.$$eval(`[data-testid="${testid}"]`, (es) => es.flatMap((e) =>
    [...(e.closest('.field')?.querySelectorAll('[data-testid="field-error"]') ?? [])].map((x) => x.textContent ?? '')));

describe('the view and the newer physics', () => {
  it('the side-wall control writes the edges key, waits for the emissivity, names a bad one beside it, and a sleeve loses less than bare walls', async () => {
    const page = await freshPage();
    const adiabatic = await shown(page, 'verdict-half-frozen-at');
    expect(await ledgerRows(page)).not.toContain('heat out, side walls (edges)');
    await page.check('[data-testid="edges-loss"]');
    // the emissivity has no default (it is the user's surface): "to fill in", and no run until it is given
    await statusIs(page, 'waiting');
    expect(await page.$$eval('#edges [data-testid="field-todo"]', (es) => es.length)).toBe(1);
    await page.fill('[data-testid="edges-emissivity"]', '1.5');
    await statusIs(page, 'error');
    expect((await errorBeside(page, 'edges-emissivity')).join(' ')).toMatch(/\[0, 1\]/);
    await edit(page, 'edges-emissivity', '0.7');
    expect((await saved(page)).edges).toEqual({ loss: true, convection_W_m2K: 'natural', emissivity: 0.7 });
    expect(await ledgerRows(page)).toContain('heat out, side walls (edges)');
    const bare = await shown(page, 'verdict-half-frozen-at');
    // more heat leaves than with insulated sides, so the separator half-freezes earlier (comparison principle for
    // the heat equation: a larger loss term gives a pointwise cooler solution)
    expect(bare).toBeLessThan(adiabatic);

    const before = await runCount(page);
    await page.check('[data-testid="edges-sleeve"]');
    await statusIs(page, 'waiting');
    await page.selectOption('[data-testid="edges-sleeve-material"]', 'ceramic-fibre-blanket');
    await page.fill('[data-testid="edges-sleeve-thickness"]', '3');
    await waitForDone(page, before, 60_000);
    expect((await saved(page)).edges).toEqual({ loss: true, convection_W_m2K: 'natural', emissivity: 0.7, sleeve: { material: 'ceramic-fibre-blanket', thickness_mm: 3 } });
    const sleeved = await shown(page, 'verdict-half-frozen-at');
    // a sleeve adds a resistance in series with the wall's film, so less heat leaves than through bare walls
    // (and some still does): the half-freeze comes between the two
    expect(sleeved).toBeGreaterThan(bare);
    expect(sleeved).toBeLessThanOrEqual(adiabatic);
    await page.screenshot({ path: `${artifacts}/view-edges.png`, fullPage: false });

    // switching off keeps the settings with "loss": false (the format's own off switch)
    const last = await runCount(page);
    await page.uncheck('[data-testid="edges-loss"]');
    await waitForDone(page, last, 60_000);
    expect(((await saved(page)).edges as Record<string, unknown>).loss).toBe(false);
    expect(await shown(page, 'verdict-half-frozen-at')).toBe(adiabatic);
    await page.context().close();
  });

  it('"heat off at" on examples/soaked-cloth-cell.json moves the W/kg and Joule heat with the bottom row, so the verdict\'s heat off follows', async () => {
    const page = await freshPage();
    const before = await runCount(page);
    await page.setInputFiles('[data-testid="load-json"]', `${repoRoot}examples/soaked-cloth-cell.json`);
    await waitForDone(page, before, 60_000);
    // the file: the plate row ends at bottom[1].from_s = 900, and the collector's W/kg heat and the anode's Joule heat
    // both end at to_s = 900
    const note = await text(page, 'heat-off-note');
    expect(note).toMatch(/bottom row 2 start/);
    expect(note).toMatch(/collector W\/kg heat 1 end/);
    expect(note).toMatch(/anode Joule heat end/);
    await edit(page, 'heat-off-s', '600');
    const draft = await saved(page);
    const layers = draft.layers as { heat_W_kg?: { to_s: number }[]; joule?: { to_s: number } }[];
    expect((draft.bottom as { from_s: number }[])[1]!.from_s).toBe(600);
    expect(layers[0]!.heat_W_kg![0]!.to_s).toBe(600);
    expect(layers[3]!.joule!.to_s).toBe(600);
    // heat off is the end of the last heat input (DESIGN.md); with only the bottom row moved it would stay at 900 s
    const windowNote = await page.$eval('.card.window .card-note', (e) => e.textContent ?? '');
    const printed = /heat off at (.+)\)$/.exec(windowNote)?.[1] ?? '';
    expect(shownNumber(printed)).toBe(600);
    await page.context().close();
  });

  it('the event-time accuracy field shows the core\'s default for the run\'s duration, and the line beside the verdict states what a run asked for', async () => {
    const page = await freshPage();
    // README "Accuracy in seconds": without the key a run states max(0.5 s, (1.9e-4 + 0.7e-4) × duration); the demo
    // runs 3600 s → 0.936 s
    expect(await page.$eval('[data-testid="event-accuracy-s"]', (e) => (e as HTMLInputElement).placeholder)).toBe('default 0.936');
    expect(await text(page, 'verdict-accuracy')).toMatch(/^Accuracy: event times to 0\.936 s, default grid and tolerances/);
    // 0.2 s of an hour: the plan is grid level 2 and tolerance level 4 (cells × 4, tolerances ÷ 81), and the run climbs
    // the ladder below it, (0, 0), (1, 1), (2, 2) (sim/run.ts): the line states the rung it stopped at and its estimate
    // (in Node it stops at (2, 2), cells × 4 and tolerances ÷ 9, estimate 0.0035 s; the browser's last bits may stop it
    // at another rung)
    await edit(page, 'event-accuracy-s', '0.2');
    expect((await saved(page)).numerics).toEqual({ event_accuracy_s: 0.2 });
    expect(await text(page, 'verdict-accuracy')).toMatch(/^Accuracy: event times to 0\.2 s, cells ×(2|4), tolerances ÷(3|9|81) .*; estimated [0-9.]+ s from the runs below it\)/);
    // below the smallest accuracy one may ask (1e-3 s) the core refuses, named beside the field
    await page.fill('[data-testid="event-accuracy-s"]', '0.0001');
    await statusIs(page, 'error');
    expect((await errorBeside(page, 'event-accuracy-s')).length).toBe(1);
    // clearing the field removes the key and the run is back at the default
    await edit(page, 'event-accuracy-s', '');
    expect((await saved(page)).numerics).toBeUndefined();
    expect(await text(page, 'verdict-accuracy')).toMatch(/event times to 0\.936 s/);
    await page.context().close();
  });
});
