/**
 * The report as a PDF, printed by the installed Chromium (playwright-core drives the browser the
 * system already has; nothing is downloaded). A4 pages, the report's print CSS (page breaks
 * between sections). The browser is found at SORBSHARE_CHROMIUM, else /usr/bin/chromium or
 * /usr/bin/chromium-browser.
 *
 * @throws ComputationError when no Chromium is installed or printing fails (with the reason)
 */
import { existsSync } from 'node:fs';
import { ComputationError } from '../core/errors.js';

export const CHROMIUM_CANDIDATES = ['/usr/bin/chromium', '/usr/bin/chromium-browser'];

/** Path of the browser to print with, or undefined when none is installed. */
export function findChromium(env: NodeJS.ProcessEnv = process.env): string | undefined {
  const own = env.SORBSHARE_CHROMIUM;
  if (own !== undefined && own !== '') return existsSync(own) ? own : undefined;
  return CHROMIUM_CANDIDATES.find((p) => existsSync(p));
}

/**
 * Path of the browser to print with. `run --pdf` and `demo --pdf` call it before the run, so that a
 * missing browser fails at once instead of after minutes of computing.
 * @throws ComputationError when none is installed (with where it looked and what to install)
 */
export function requireChromium(env: NodeJS.ProcessEnv = process.env): string {
  const exe = findChromium(env);
  if (!exe) {
    const where = env.SORBSHARE_CHROMIUM ? `SORBSHARE_CHROMIUM=${env.SORBSHARE_CHROMIUM}` : CHROMIUM_CANDIDATES.join(' or ');
    throw new ComputationError(`--pdf needs Chromium to print the report, and none was found (${where}); install the Debian package "chromium" or set SORBSHARE_CHROMIUM to the browser's path`);
  }
  return exe;
}

/** Print `html` to PDF bytes. */
export async function reportPdf(html: string, env: NodeJS.ProcessEnv = process.env): Promise<Uint8Array> {
  const exe = requireChromium(env);
  const { chromium } = await import('playwright-core');
  let browser;
  try {
    browser = await chromium.launch({ executablePath: exe, args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'] });
    const page = await browser.newPage();
    await page.setContent(html, { waitUntil: 'load' });
    const pdf = await page.pdf({ format: 'A4', printBackground: true, preferCSSPageSize: true });
    return new Uint8Array(pdf);
  } catch (e) {
    throw new ComputationError(`printing the report to PDF with ${exe} failed: ${(e as Error).message.split('\n')[0]}`);
  } finally {
    await browser?.close();
  }
}
