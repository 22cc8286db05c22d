/**
 * The HTML report in a real browser (headless Chromium through playwright-core, the system's
 * /usr/bin/chromium; never a downloaded browser). Renders the synthetic fixture (invented numbers;
 * a rendering test, not check values) and checks: no console or page errors, no network request,
 * every plot of the model present as a visible svg.plot, something drawn for every non-empty
 * series, and injected <script> text shown as text. Leaves a full-page screenshot in
 * tests/.artifacts/report.png.
 *
 * Without /usr/bin/chromium the test is skipped, except in CI (CI=true), where it fails (itWithChromium).
 */
import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CHROMIUM, HAVE_CHROMIUM as HAVE, IN_CI, itWithChromium, inspectPlots, openReport, saveScreenshot, type PageDocument } from './browserHarness.js';
import { renderHtmlReport } from '../../src/report/htmlReport.js';
import type { PlotSpec } from '../../src/output/reportModel.js';
import { reportPlotIds } from '../../src/report/reportPlotIds.js';
import { syntheticModel } from './syntheticModel.js';

declare const document: PageDocument;

const EVIL = '<script>alert(1)</script>';

if (!HAVE && !IN_CI) console.warn(`[report browser test] SKIPPED: ${CHROMIUM} not found (apt-get install -y chromium to run it).`);

/** Indices of the series/stacks that have at least one drawable value (independent of the renderer). */
function nonEmptySeries(p: PlotSpec): number[] {
  if (p.kind === 'bars') return p.stacks.flatMap((s, k) => (s.values.some((v) => Number.isFinite(v) && v > 0) ? [k] : []));
  if (p.kind === 'tornado') return p.rows.length ? [0] : [];
  const ok = (v: number, log?: boolean) => Number.isFinite(v) && (!log || v > 0);
  return p.series.flatMap((s, k) => (s.points.some(([x, y]) => ok(x, p.xLog) && ok(y, p.yLog)) ? [k] : []));
}

describe('HTML report in headless Chromium', () => {
  itWithChromium('renders cleanly, draws every plot and series, escapes injected script', async () => {
    const model = syntheticModel();
    const { page, close, errors, requests } = await openReport(renderHtmlReport(model));
    try {
      const plots = model.sections.flatMap((s) => s.plots ?? []);
      expect(plots.map((p) => p.id)).toEqual(reportPlotIds(model));
      const found = await inspectPlots(page, plots.map((p) => ({ id: p.id, series: nonEmptySeries(p) })));
      for (const f of found) {
        expect(f.present, `plot ${f.id} present`).toBe(true);
        expect(f.w, `plot ${f.id} width`).toBeGreaterThan(100);
        expect(f.h, `plot ${f.id} height`).toBeGreaterThan(100);
        for (const n of f.drawn) expect(n, `plot ${f.id}: something drawn per non-empty series`).toBeGreaterThan(0);
      }
      expect(found.find((f) => f.id === 'removal-dose')!.drawn).toHaveLength(4);

      const dom = await page.evaluate(() => ({
        scripts: document.querySelectorAll('script').length,
        title: document.querySelector('h1')?.textContent ?? '',
        body: document.body.textContent ?? '',
        svgTitles: [...document.querySelectorAll('svg.plot > title')].map((t) => t.textContent),
      }));
      expect(dom.scripts).toBe(0);
      expect(dom.title).toBe(`Synthetic rendering test ${EVIL}`);
      expect(dom.body).toContain(`Paragraph with ${EVIL} & "quotes".`);
      expect(dom.svgTitles).toContain(`Zero and negative values on a log axis ${EVIL}`);
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);

      expect(existsSync(await saveScreenshot(page, 'report.png'))).toBe(true);
    } finally {
      await close();
    }
  });
});
