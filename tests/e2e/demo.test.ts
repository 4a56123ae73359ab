/**
 * The view opens on the demo already computed. The verdict it prints is checked against the solver's own summary
 * for the same file, run here in Node (the result contract of DESIGN.md): the page must show the solver's numbers,
 * rounded to 0.1 s, not numbers of its own. Timings from a cold preview server are printed, not asserted.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseScenarioText } from '../../sim/scenario/scenario.ts';
import { runProblem } from '../../sim/run.ts';
import { noValueWords, windowStatusWords } from '../../sim/observe/wording.ts';
import { runnerDefaults } from '../../ui/runner.ts';
import { assertClose } from '../support/assert-close.ts';
import {
  artifacts, printedHalfStep, repoRoot, shownNumber, startHarness, text, traceCount, waitForCharts, waitForDone, type Harness,
} from './harness.ts';

let harness: Harness;
beforeAll(async () => { harness = await startHarness(); });
afterAll(async () => { await harness?.close(); });

const demoText = readFileSync(`${repoRoot}examples/bench-coupon.json`, 'utf8');

function solverSummary() {
  const parsed = parseScenarioText(demoText);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  const run = runProblem(parsed.problem);
  if (run.status !== 'ok') throw new Error(`demo run ${run.status}`);
  return run.summary;
}

/**
 * The page prints event times to 0.1 s (to 1 s as min:s from 10 min) and margins to 1 K (sim/observe/format.ts); the solver's
 * own value, computed here in Node, must lie within half the last printed digit of what is printed, plus the solver's
 * stated accuracy: Chromium and Node differ in the last bits of Math functions, so the
 * adaptive steps differ and each engine's result lands elsewhere within that accuracy (TOOLCHAIN.md). For event times
 * it is the promise of the defaults, max(0.1 %, 0.5 s) (tests/convergence/accuracy-promise.test.ts); for margins in
 * kelvin, 0.1 K (peak temperatures move < 0.04 K between a default and a 25× tighter run).
 */
function printedAs(printed: string, solver: number | null, label: string, whenNull: string, floor = 0.5): void {
  if (solver === null) { expect(printed, label).toBe(whenNull); return; }
  assertClose(shownNumber(printed), solver, { abs: printedHalfStep(printed) + Math.max(floor, 1e-3 * Math.abs(solver)) }, label);
}

describe('the browser view on the demo scenario', () => {
  it('opens computed: run-status is done, the verdict matches the solver, and every chart holds traces', async () => {
    const context = await harness.browser.newContext({ viewport: { width: 1500, height: 1000 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    const t0 = Date.now();
    await page.goto(harness.url);
    await page.waitForSelector('[data-testid="layer-row-0"]');
    const editorMs = Date.now() - t0;
    await waitForDone(page);
    const verdictMs = Date.now() - t0;
    await waitForCharts(page);
    const chartsMs = Date.now() - t0;
    const marks = await page.evaluate(() => {
      const at = (name: string) => performance.getEntriesByName(name)[0]?.startTime ?? -1;
      return { fcp: at('first-contentful-paint'), editor: at('freezeline:editor'), verdict: at('freezeline:verdict'), charts: at('freezeline:plotted') };
    });
    console.log(`[timing] cold preview server, from navigation start (page clock): first contentful paint ${marks.fcp.toFixed(0)} ms, `
      + `editor drawn ${marks.editor.toFixed(0)} ms, verdict numbers shown (first meaningful paint) ${marks.verdict.toFixed(0)} ms, `
      + `all charts drawn ${marks.charts.toFixed(0)} ms (target ≤ 1500 ms); seen from the test (wall clock incl. Playwright): `
      + `editor ${editorMs} ms, verdict ${verdictMs} ms, charts ${chartsMs} ms`);

    expect(await text(page, 'run-status')).toBe('done');
    const s = solverSummary();
    printedAs(await text(page, 'verdict-molten-at'), s.separator.molten_at_s, 'molten at, s', noValueWords.molten_at_s);
    printedAs(await text(page, 'verdict-half-frozen-at'), s.separator.half_frozen_at_s, 'half-frozen at, s', noValueWords.half_frozen_at_s);
    printedAs(await text(page, 'verdict-frozen-at'), s.separator.frozen_at_s, 'frozen at, s', noValueWords.frozen_at_s);
    printedAs(await text(page, 'verdict-window'), s.safe_window_s, 'usable window, s', windowStatusWords[s.safe_window_status].label);
    printedAs(await text(page, 'verdict-margin-anode'), s.layers.anode!.margin_K, 'anode margin, K', noValueWords.margin_K, 0.1);
    // the demo file's own stated check (examples/bench-coupon.json "expect"): more than 100 K to ignition
    expect(shownNumber(await text(page, 'verdict-margin-anode'))).toBeGreaterThan(100);
    // three layers: a band (2 traces) and a mean line each
    expect(await traceCount(page, 'plot-temperatures')).toBe(9);
    expect(await traceCount(page, 'plot-liquid-fraction')).toBeGreaterThanOrEqual(1);
    expect(await traceCount(page, 'plot-map')).toBe(1);
    await page.waitForFunction(() => ['plot-freeze', 'plot-margin'].every((id) =>
      ((document.querySelector(`[data-testid="${id}"]`) as (HTMLElement & { data?: unknown[] }) | null)?.data?.length ?? 0) > 0));
    // the freeze chart: a mean line per layer and the separator's liquid fraction; the margin chart: the two layers
    // with a limit (nickel's melt, magnesium's ignition; the salt has none on file)
    expect(await traceCount(page, 'plot-freeze')).toBe(4);
    expect(await traceCount(page, 'plot-margin')).toBe(2);
    await page.screenshot({ path: `${artifacts}/view-demo.png`, fullPage: true });
    // every chart offers PNG export and zoom in its mode bar, and answers hover
    for (const id of ['plot-temperatures', 'plot-liquid-fraction', 'plot-freeze', 'plot-margin', 'plot-map']) {
      const titles = await page.$$eval(`[data-testid="${id}"] .modebar-btn`, (es) => es.map((e) => e.getAttribute('data-title') ?? ''));
      expect(titles.some((t) => /png/i.test(t)), `${id} PNG export`).toBe(true);
      expect(titles.some((t) => /zoom/i.test(t)), `${id} zoom`).toBe(true);
      const drag = page.locator(`[data-testid="${id}"] .nsewdrag`).first();
      const size = await drag.boundingBox();
      // a hover is a mouse move: on a loaded machine one move was once not answered in 30 s (clean-clone run of
      // a60cd92; it passed on every rerun), so the pointer moves again, a little further along, before the test gives up
      let answered = false;
      for (let attempt = 0; attempt < 4 && !answered; attempt++) {
        await drag.hover({ position: { x: (size?.width ?? 100) * (0.3 + 0.1 * attempt), y: (size?.height ?? 100) * 0.5 }, force: true });
        answered = await page.waitForFunction((sel) => (document.querySelector(sel)?.childElementCount ?? 0) > 0,
          `[data-testid="${id}"] .hoverlayer`, { timeout: 10_000 }).then(() => true, () => false);
      }
      expect(answered, `${id} answers hover`).toBe(true);
    }
    const [png] = await Promise.all([
      page.waitForEvent('download'),
      page.click('[data-testid="plot-temperatures"] .modebar-btn[data-title*="png" i]'),
    ]);
    expect(png.suggestedFilename()).toBe('freezeline-temperatures.png');
    await png.saveAs(`${artifacts}/chart-temperatures.png`);
    // the cautions stay beside the verdict
    const cautions = await page.$eval('.verdict-panel .cautions', (e) => e.textContent ?? '');
    expect(cautions).toMatch(/prediction, not a safety certification/);
    expect(cautions).toMatch(/class D/);
    expect(await page.evaluate(() => document.body.innerText)).not.toMatch(/NaN|Infinity|undefined/);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('re-runs after an edit and reports the edit-to-updated-chart time', async () => {
    const context = await harness.browser.newContext({ viewport: { width: 1500, height: 1000 } });
    const page = await context.newPage();
    await page.goto(harness.url);
    await waitForDone(page);
    await waitForCharts(page);
    const totals: number[] = [];
    const afterDebounce: number[] = [];
    const firstChart: number[] = [];
    const solves: number[] = [];
    for (const ambient of [20, 24, 18, 26, 22, 21, 23]) {
      const before = await page.$eval('[data-testid="run-status"]', (e) => Number((e as HTMLElement).dataset.run));
      await page.evaluate(() => performance.clearMarks());
      await page.fill('[data-testid="ambient-c"]', String(ambient));
      await waitForDone(page, before);
      await page.waitForFunction(() => performance.getEntriesByName('freezeline:plotted').length > 0);
      const m = await page.evaluate(() => {
        const at = (name: string) => performance.getEntriesByName(name).at(-1)?.startTime ?? NaN;
        return {
          edit: performance.getEntriesByName('freezeline:edit')[0]?.startTime ?? NaN, start: at('freezeline:run-start'),
          result: at('freezeline:result'), first: at('freezeline:temperatures-plotted'), plotted: at('freezeline:plotted'),
        };
      });
      totals.push(m.plotted - m.edit);
      afterDebounce.push(m.plotted - m.start);
      firstChart.push(m.first - m.start);
      solves.push(m.result - m.start);
    }
    const median = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)]!;
    console.log(`[timing] edit → updated charts, median of ${totals.length}: ${median(totals).toFixed(0)} ms from the keystroke `
      + `(including the ${runnerDefaults.debounceMs} ms debounce); after the debounce: solve + transfer ${median(solves).toFixed(0)} ms, `
      + `temperature chart updated at ${median(firstChart).toFixed(0)} ms, all charts at ${median(afterDebounce).toFixed(0)} ms (target ≤ 50 ms)`);
    expect(await text(page, 'run-status')).toBe('done');
    await context.close();
  });
});
