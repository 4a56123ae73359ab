/**
 * Browser-test harness: serves the built view (dist/) with Vite's preview server on a free port of 127.0.0.1 and
 * drives Debian's Chromium, headless and without a GPU, through playwright-core.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { AddressInfo } from 'node:net';
import { chromium, type Browser, type Page } from 'playwright-core';
import { preview, type PreviewServer } from 'vite';

export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
export const artifacts = `${repoRoot}test-artifacts`;

const CHROMIUM_FLAGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

function chromiumPath(): string {
  if (existsSync('/usr/bin/chromium')) return '/usr/bin/chromium';
  return execFileSync('which', ['chromium'], { encoding: 'utf8' }).trim();
}

export interface Harness {
  readonly url: string;
  readonly browser: Browser;
  readonly close: () => Promise<void>;
}

export async function startHarness(): Promise<Harness> {
  if (!existsSync(`${repoRoot}dist/index.html`)) {
    throw new Error('dist/index.html is missing: run `npx vite build` first (npm test does).');
  }
  mkdirSync(artifacts, { recursive: true });
  const server: PreviewServer = await preview({
    root: `${repoRoot}ui`, configFile: `${repoRoot}vite.config.ts`, logLevel: 'warn',
    preview: { host: '127.0.0.1', port: 0, strictPort: false, open: false },
  });
  const address = server.httpServer.address() as AddressInfo;
  const url = `http://127.0.0.1:${address.port}/`;
  const browser = await chromium.launch({ executablePath: chromiumPath(), args: CHROMIUM_FLAGS });
  return {
    url, browser,
    close: async () => {
      await browser.close();
      await new Promise<void>((resolve, reject) => server.httpServer.close((e) => (e ? reject(e) : resolve())));
    },
  };
}

/** Waits until run-status says `done` with a run counter above `after`; returns the counter. */
export async function waitForDone(page: Page, after = 0, timeout = 30_000): Promise<number> {
  await page.waitForFunction((n) => {
    const e = document.querySelector('[data-testid="run-status"]');
    return e?.textContent === 'done' && Number((e as HTMLElement).dataset.run) > n;
  }, after, { timeout });
  return runCount(page);
}

export const runCount = (page: Page): Promise<number> =>
  page.$eval('[data-testid="run-status"]', (e) => Number((e as HTMLElement).dataset.run));

export const text = (page: Page, testid: string): Promise<string> =>
  page.$eval(`[data-testid="${testid}"]`, (e) => (e.textContent ?? '').trim());

/** Number of traces Plotly holds in a chart (0 until the chart library has drawn it). */
export const traceCount = (page: Page, testid: string): Promise<number> =>
  page.$eval(`[data-testid="${testid}"]`, (e) => ((e as HTMLElement & { data?: unknown[] }).data ?? []).length);

export async function waitForCharts(page: Page, timeout = 60_000): Promise<void> {
  await page.waitForFunction(() => ['plot-temperatures', 'plot-liquid-fraction', 'plot-map'].every((id) => {
    const e = document.querySelector(`[data-testid="${id}"]`) as (HTMLElement & { data?: unknown[] }) | null;
    return (e?.data?.length ?? 0) > 0;
  }), undefined, { timeout });
}

/** A fresh browser context on the view, with the demo computed. */
export async function freshPage(harness: Harness): Promise<Page> {
  const context = await harness.browser.newContext({ viewport: { width: 1500, height: 1000 } });
  const page = await context.newPage();
  await page.goto(harness.url);
  await waitForDone(page);
  return page;
}

/**
 * The number in a value the page prints with its unit (sim/observe/format.ts): "84.9 s", "15:59 min:s" (seconds returned),
 * "257 K", "392.9 °C". NaN for words ("never fully molten"), so a comparison with a number fails loudly.
 */
export function shownNumber(printed: string): number {
  const t = printed.trim();
  const ms = /^(-?\d+):(\d{2}) min:s$/.exec(t);
  if (ms) return (ms[1]!.startsWith('-') ? -1 : 1) * (Math.abs(Number(ms[1])) * 60 + Number(ms[2]));
  const unit = /^(-?\d+(?:\.\d+)?) (s|K|°C)$/.exec(t);
  return unit ? Number(unit[1]) : Number.NaN;
}

/** Half the last printed digit of a value the page prints (`15:59 min:s` → 0.5 s, `84.9 s` → 0.05 s, `257 K` → 0.5). */
export function printedHalfStep(printed: string): number {
  if (/min:s$/.test(printed.trim())) return 0.5;
  const decimals = /\.(\d+)/.exec(printed)?.[1]?.length ?? 0;
  return 0.5 * 10 ** -decimals;
}

/** The printed number of a test hook (see shownNumber). */
export const shown = async (page: Page, testid: string): Promise<number> => shownNumber(await text(page, testid));
