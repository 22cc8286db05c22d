/**
 * Opening a rendered report in headless Chromium (the system's /usr/bin/chromium through
 * playwright-core; never a downloaded browser), collecting console and page errors and any
 * request that would leave the file.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { existsSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';
export const HAVE_CHROMIUM = existsSync(CHROMIUM);
export const IN_CI = Boolean(process.env.CI);

export interface OpenedReport {
  browser: Browser;
  page: Page;
  /** Console errors, page errors and dialogs seen while loading. */
  errors: string[];
  /** Requests to anything but the report file itself (all aborted). */
  requests: string[];
}

/** Write `html` to a temp file and open it; the caller closes `browser`. */
export async function openReport(html: string, viewport = { width: 1100, height: 900 }): Promise<OpenedReport> {
  const { chromium } = await import('playwright-core');
  const file = join(mkdtempSync(join(tmpdir(), 'sorbshare-report-')), 'report.html');
  writeFileSync(file, html);
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const page = await browser.newPage({ viewport });
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
  return { browser, page, errors, requests };
}
