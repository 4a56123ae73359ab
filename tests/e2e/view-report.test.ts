/**
 * What a reader of the view relies on: the cross-section's slider moves in time; the cautions that apply to the
 * scenario appear beside its verdict; the verdict stays in view on a 900 px screen; the view speaks the words of the
 * one wording table (sim/observe/wording.ts), as the CLI does; the printed report fits one page.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { parseScenarioText, scenarioDefaults } from '../../sim/scenario/scenario.ts';
import { runProblem } from '../../sim/run.ts';
import { hazards, predictionNotCertification, verdictTerms, windowStatusWords } from '../../sim/observe/wording.ts';
import { cautionDefaults } from '../../ui/cautions.ts';
import { assertClose } from '../support/assert-close.ts';
import {
  artifacts, freshPage as openPage, printedHalfStep, repoRoot, runCount, shownNumber, startHarness, text, waitForCharts, waitForDone,
  type Harness,
} from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const freshPage = (): Promise<Page> => openPage(harness);
const demoText = readFileSync(`${repoRoot}examples/bench-coupon.json`, 'utf8');

async function edit(page: Page, selector: string, value: string): Promise<void> {
  const before = await runCount(page);
  await page.fill(selector, value);
  await waitForDone(page, before);
}

/** The demo with the hot plate at `plateC`, solved in Node: the solver's own margin for the anode. */
function anodeMarginAt(plateC: number): number {
  const demo = JSON.parse(demoText) as { bottom: { plate?: { temperature_C: number } }[] };
  demo.bottom[0]!.plate!.temperature_C = plateC;
  const parsed = parseScenarioText(JSON.stringify(demo));
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  const run = runProblem(parsed.problem);
  if (run.status !== 'ok') throw new Error(run.status);
  return run.summary.layers.anode!.margin_K!;
}

describe('the browser view as a reader relies on it', () => {
  it('the cross-section slider moves in time: its middle is the middle of the run, not of the solver steps', async () => {
    const page = await freshPage();
    await page.$eval('[data-testid="time-slider"]', (e) => {
      const s = e as HTMLInputElement;
      s.value = String((Number(s.min) + Number(s.max)) / 2);
      s.dispatchEvent(new Event('input', { bubbles: true }));
    });
    const shownS = shownNumber(await page.$eval('#time-value', (e) => e.textContent ?? ''));
    // the demo runs 3600 s; the drawing shows the recorded step nearest 1800 s, and no step is longer than
    // the default largest step (scenarioDefaults.maxStepShare of the duration: 1 %, 36 s): within half of that, plus the printed rounding (1 s)
    const halfStep = 0.5 * 3600 * scenarioDefaults.maxStepShare;
    assertClose(shownS, 1800, { abs: halfStep + 0.5 }, 'time shown at the middle of the slider, s');
    // the drawing itself says the time it shows, the same time as the slider's readout
    const drawn = await page.$eval('.stack-drawing svg', (e) => e.getAttribute('aria-label') ?? '');
    expect(shownNumber(drawn.replace(/^.* t = /, ''))).toBe(shownS);
    await page.context().close();
  });

  it('a thin magnesium layer gets a caution beside its margin, a thick one does not', async () => {
    const page = await freshPage();
    // the demo's anode is 2 mm: above the stated threshold
    expect(await page.$$eval('[data-testid="caution-thin-magnesium-anode"]', (es) => es.length)).toBe(0);
    await edit(page, '[data-testid="layer-thickness-2"]', String(cautionDefaults.thinMagnesiumMm));
    const note = await text(page, 'caution-thin-magnesium-anode');
    expect(note).toMatch(/thin magnesium/);
    expect(note).toContain(`${cautionDefaults.thinMagnesiumIgnitionC} °C`);
    const box = await text(page, 'scenario-cautions');
    expect(box).toMatch(/anode is thin magnesium/);
    expect(box).toMatch(/DOE-HDBK-1081-94/);
    // the general hazards and the closing sentence stay beside the verdict
    const cautions = await page.$eval('.verdict-panel [data-testid="cautions"]', (e) => e.textContent ?? '');
    for (const z of hazards) expect(cautions).toContain(z.term);
    expect(cautions).toContain(predictionNotCertification);
    await page.screenshot({ path: `${artifacts}/view-thin-magnesium.png`, fullPage: true });
    await page.context().close();
  });

  it('a margin of a few tens of kelvin is flagged as no margin, by the threshold the view states', async () => {
    // a hotter plate brings the anode close to ignition; the solver, run here in Node, gives the margin to expect
    const plateC = 740;
    const nodeMargin = anodeMarginAt(plateC);
    expect(nodeMargin).toBeGreaterThan(0);
    expect(nodeMargin).toBeLessThan(cautionDefaults.noMarginK);
    const page = await freshPage();
    await edit(page, 'input[data-path="bottom[0].plate.temperature_C"]', String(plateC));
    const printed = await text(page, 'verdict-margin-anode');
    // Chromium and Node land their adaptive steps differently: the margin agrees within 0.1 K (tests/e2e/demo.test.ts)
    assertClose(shownNumber(printed), nodeMargin, { abs: printedHalfStep(printed) + 0.1 }, 'anode margin, K');
    expect(await text(page, 'caution-no-margin-anode')).toMatch(/no margin/);
    expect(await text(page, 'scenario-cautions')).toMatch(/treat this as no margin/);
    await page.context().close();
  });

  it('at 900 px wide the verdict stays in view while the editor is scrolled', async () => {
    const context = await harness.browser.newContext({ viewport: { width: 900, height: 800 } });
    const page = await context.newPage();
    await page.goto(harness.url);
    await waitForDone(page);
    await page.locator('[data-testid="layer-row-0"]').scrollIntoViewIfNeeded();
    await page.evaluate(() => window.scrollBy(0, 600));
    const bar = await page.$eval('[data-testid="summary-bar"]', (e) => {
      const r = e.getBoundingClientRect();
      return { top: r.top, bottom: r.bottom, visible: getComputedStyle(e).display !== 'none', text: e.textContent ?? '' };
    });
    expect(await page.evaluate(() => window.scrollY)).toBeGreaterThan(500);
    expect(bar.visible).toBe(true);
    expect(bar.top).toBeGreaterThanOrEqual(0);
    expect(bar.bottom).toBeLessThanOrEqual(800);
    expect(bar.text).toContain(verdictTerms.safe_window_s.term);
    expect(bar.text).toContain(await text(page, 'verdict-window'));
    await page.screenshot({ path: `${artifacts}/view-900-scrolled.png` });
    await context.close();
  });

  it('the verdict speaks the wording table: the same terms as the CLI, and words where a value is missing', async () => {
    const page = await freshPage();
    const labels = await page.$$eval('#verdict .card-label', (es) => es.map((e) => e.textContent ?? ''));
    for (const key of ['safe_window_s', 'molten_at_s', 'half_frozen_at_s', 'frozen_at_s'] as const) {
      expect(labels, key).toContain(verdictTerms[key].term);
    }
    expect(await page.$eval('.card.window', (e) => e.textContent ?? '')).toContain(windowStatusWords.ok.sentence);
    // the old words of the view are gone
    const all = await page.evaluate(() => document.body.innerText);
    expect(all).not.toMatch(/heater removed|safe window|\bnodes\b|NaN|Infinity|undefined/);
    await page.context().close();
  });

  it('the printed report is one A4 page with the scenario, the verdict, four charts and the cautions', async () => {
    const page = await freshPage();
    await waitForCharts(page);
    // window.print() fires beforeprint in a real browser; page.pdf() prints without it, so the test fires it
    await page.evaluate(() => window.dispatchEvent(new Event('beforeprint')));
    await page.waitForFunction(() => (document.querySelector('[data-testid="plot-margin"]') as HTMLElement & { layout?: { width?: number } }).layout?.width === 350);
    await page.emulateMedia({ media: 'print' });
    const visible = (sel: string) => page.$eval(sel, (e) => getComputedStyle(e).display !== 'none' && (e as HTMLElement).offsetHeight > 0);
    expect(await visible('[data-testid="print-scenario"]')).toBe(true);
    expect(await text(page, 'print-scenario')).toContain('licl-kcl-eutectic');
    for (const sel of ['#verdict', '[data-testid="cautions"]', '[data-testid="plot-temperatures"]', '[data-testid="plot-liquid-fraction"]',
      '[data-testid="plot-freeze"]', '[data-testid="plot-margin"]']) expect(await visible(sel), sel).toBe(true);
    expect(await visible('.editor')).toBe(false);
    const pdf = await page.pdf({ preferCSSPageSize: true });
    const pages = pdf.toString('latin1').match(/\/Type\s*\/Page\b(?!s)/g) ?? [];
    expect(pages.length).toBe(1);
    await page.context().close();
  });
});
