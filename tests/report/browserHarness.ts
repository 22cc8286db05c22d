/**
 * Opening a rendered report in headless Chromium (the system's /usr/bin/chromium through
 * playwright-core; never a downloaded browser), collecting console and page errors and any
 * request that would leave the file. Browser tests are declared with `itWithChromium`: without
 * Chromium they fail in CI (CI=true) and are skipped with a warning elsewhere. Chromium is
 * launched once per test worker (its start-up costs seconds on a loaded machine); each report
 * opens in a fresh browser context (its own page, storage and viewport), closed by the test.
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { existsSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { expect, it } from 'vitest';

/** The system Chromium; SORBSHARE_CHROMIUM overrides the path (e.g. to check the missing-browser path). */
export const CHROMIUM = process.env.SORBSHARE_CHROMIUM || '/usr/bin/chromium';
export const HAVE_CHROMIUM = existsSync(CHROMIUM);

/** True when CI is set to anything but "", "0" or "false" (CI services set CI=true). */
export function isCi(value: string | undefined): boolean {
  return value !== undefined && !['', '0', 'false'].includes(value.trim().toLowerCase());
}
export const IN_CI = isCi(process.env.CI);

/** What a browser test does: run with Chromium; without it, fail in CI and skip elsewhere. */
export function chromiumTestMode(haveChromium: boolean, inCi: boolean): 'run' | 'fail' | 'skip' {
  return haveChromium ? 'run' : inCi ? 'fail' : 'skip';
}

let warned = false;
/** Declare a test that needs Chromium (see chromiumTestMode). */
export function itWithChromium(name: string, fn: () => Promise<void>, timeout?: number): void {
  const mode = chromiumTestMode(HAVE_CHROMIUM, IN_CI);
  if (mode === 'run') it(name, fn, timeout);
  else if (mode === 'fail') it(name, () => expect.fail(`${CHROMIUM} is missing; CI must install it (apt-get install -y chromium)`));
  else {
    if (!warned) console.warn(`[browser tests] SKIPPED: ${CHROMIUM} not found (apt-get install -y chromium to run them; in CI they fail).`);
    warned = true;
    it.skip(name, fn);
  }
}

export interface OpenedReport {
  page: Page;
  /** Close the report's browser context (the worker's Chromium stays up for the next report). */
  close: () => Promise<void>;
  /** Console errors, page errors and dialogs seen while loading. */
  errors: string[];
  /** Requests to anything but the report file itself (all aborted). */
  requests: string[];
}

let launched: Promise<Browser> | undefined;
/** The worker's Chromium, launched on first use (playwright kills it when the worker exits). */
function workerBrowser(): Promise<Browser> {
  launched ??= import('playwright-core').then(({ chromium }) => chromium.launch({
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  }));
  const browser = launched;
  browser.catch(() => { if (launched === browser) launched = undefined; }); // a failed launch is retried by the next test
  return browser;
}

/** Write `html` to a temp file and open it in a fresh browser context; the caller calls `close`. */
export async function openReport(html: string, viewport = { width: 1100, height: 900 }): Promise<OpenedReport> {
  const file = join(mkdtempSync(join(tmpdir(), 'sorbshare-report-')), 'report.html');
  writeFileSync(file, html);
  const context = await (await workerBrowser()).newContext({ viewport });
  const page = await context.newPage();
  const errors: string[] = [];
  const requests: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(`console: ${m.text()}`);
  });
  page.on('pageerror', (e) => errors.push(`page: ${e.message}`));
  page.on('dialog', async (d) => {
    errors.push(`dialog: ${d.message()}`);
    await d.dismiss();
  });
  await page.route('**/*', async (route) => {
    const url = route.request().url();
    if (url.startsWith('file:')) return route.continue();
    requests.push(url);
    return route.abort();
  });
  await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
  return { page, close: () => context.close(), errors, requests };
}

/** Minimal DOM shapes for code that runs inside the page (the project's lib has no DOM types). */
export interface PageNode {
  textContent: string | null;
  getAttribute(name: string): string | null;
  getBoundingClientRect(): { width: number; height: number };
  getBBox(): { width: number; height: number };
  querySelectorAll(selector: string): ArrayLike<PageNode> & Iterable<PageNode>;
}
export interface PageDocument {
  body: PageNode;
  querySelector(s: string): PageNode | null;
  querySelectorAll(s: string): ArrayLike<PageNode> & Iterable<PageNode>;
}
declare const document: PageDocument;

export interface PlotInspection {
  id: string;
  present: boolean;
  /** Rendered width and height of the svg, px. */
  w: number;
  h: number;
  /** Drawn shapes with a non-empty box: one count per requested series, or one total when none named. */
  drawn: number[];
}

/** Find each `svg.plot` by its data-plot-id and count what is drawn in its series groups. */
export function inspectPlots(page: Page, specs: Array<{ id: string; series?: number[] }>): Promise<PlotInspection[]> {
  return page.evaluate((want) => want.map(({ id, series }) => {
    const svg = [...document.querySelectorAll('svg.plot')].find((e) => e.getAttribute('data-plot-id') === id);
    if (!svg) return { id, present: false, w: 0, h: 0, drawn: [] as number[] };
    const r = svg.getBoundingClientRect();
    const count = (sel: string) => [...svg.querySelectorAll(['path', 'rect', 'circle', 'line'].map((t) => `${sel} ${t}`).join(', '))]
      .filter((s) => { const b = s.getBBox(); return b.width > 0 || b.height > 0; }).length;
    const drawn = series ? series.map((k) => count(`[data-series="${k}"]`)) : [count('[data-series]')];
    return { id, present: true, w: r.width, h: r.height, drawn };
  }), specs);
}

/** Full-page screenshot into tests/.artifacts/NAME; returns its path. */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  const dir = fileURLToPath(new URL('../.artifacts/', import.meta.url));
  mkdirSync(dir, { recursive: true });
  const path = join(dir, name);
  await page.screenshot({ path, fullPage: true });
  return path;
}
