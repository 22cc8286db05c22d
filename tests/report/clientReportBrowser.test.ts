/**
 * The demo report as a client receives it, in headless Chromium (issue 12): every figure of the
 * model present with drawn data; each compound keeps one colour and one marker in every figure
 * (read from the SVG: the group's data attributes and the fill/stroke actually drawn); month ticks
 * on the date axes; the References section present and no "from memory" anywhere in the text;
 * a screenshot at A4 size (210 × 297 mm at 96 px per inch: 794 × 1123 px).
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { HAVE_CHROMIUM, itWithChromium, inspectPlots, openReport, saveScreenshot, type PageDocument, type PageNode } from './browserHarness.js';
import { loadProject } from '../../src/io/loadProject.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { renderHtmlReport } from '../../src/report/htmlReport.js';
import { reportPlotIds } from '../../src/report/reportPlotIds.js';
import type { ReportModel } from '../../src/output/reportModel.js';
import { sharedDemoPipelineWithDraws } from '../helpers/sharedDemoPipeline.js';

declare const document: PageDocument;

/** A4 at the CSS reference resolution of 96 px per inch (CSS Values and Units: 1 in = 96 px = 25.4 mm). */
const A4_PX = { width: Math.round((210 / 25.4) * 96), height: Math.round((297 / 25.4) * 96) };

let model: ReportModel;
let compoundIds: string[];

beforeAll(async () => {
  if (!HAVE_CHROMIUM) return;
  const input = loadProject(fileURLToPath(new URL('../../fixtures/demo/project.json', import.meta.url)), { demo: true });
  // the worker's shared demo run with 40 Monte Carlo draws (seed 3), read only
  model = buildReportModel(await sharedDemoPipelineWithDraws(), 'test');
  compoundIds = input.project.compounds.map((c) => c.id);
}, 120_000);

describe('the client report in headless Chromium', () => {
  itWithChromium('every figure has data; one look per compound; month ticks; references; A4 screenshot', async () => {
    const ids = reportPlotIds(model);
    for (const want of ['calibration-1', 'dose-against-doc-1', 'sensitivity-dose-1', 'sensitivity-cost-1', 'pac-gac-mass', 'pac-gac-cost-m3', 'pac-gac-cost-year', 'daily-dose', 'daily-doc', 'background-fractions']) expect(ids).toContain(want);
    const { page, close, errors, requests } = await openReport(renderHtmlReport(model), A4_PX);
    try {
      // 1. every figure present, sized, with something drawn
      for (const p of await inspectPlots(page, ids.map((id) => ({ id })))) {
        expect(p.present, `plot ${p.id}`).toBe(true);
        expect(p.w, `plot ${p.id} width`).toBeGreaterThan(100);
        expect(p.drawn[0], `plot ${p.id} has drawn data`).toBeGreaterThan(0);
      }
      // 2. one colour and one marker per compound in every figure, as drawn
      const looks = await page.evaluate(() => {
        const out: Array<{ plot: string; key: string; colour: string; marker: string; drawn: string[] }> = [];
        for (const svg of [...document.querySelectorAll('svg.plot')]) {
          for (const g of [...svg.querySelectorAll('g.series[data-key]')]) {
            const drawn = [...g.querySelectorAll('path')].map((p: PageNode) => (p.getAttribute('fill') !== 'none' ? p.getAttribute('fill') : p.getAttribute('stroke')) ?? '');
            out.push({ plot: svg.getAttribute('data-plot-id') ?? '', key: g.getAttribute('data-key') ?? '', colour: g.getAttribute('data-colour') ?? '', marker: g.getAttribute('data-marker') ?? '', drawn });
          }
        }
        return out;
      });
      const byKey = new Map<string, Set<string>>();
      const plotsOf = new Map<string, Set<string>>();
      for (const l of looks.filter((x) => compoundIds.includes(x.key))) {
        if (!byKey.has(l.key)) (byKey.set(l.key, new Set()), plotsOf.set(l.key, new Set()));
        byKey.get(l.key)!.add(`${l.colour}/${l.marker}`);
        plotsOf.get(l.key)!.add(l.plot);
        for (const d of l.drawn) expect(d, `${l.key} in ${l.plot} drawn in its colour`).toBe(l.colour);
      }
      for (const id of compoundIds) {
        expect(byKey.get(id)?.size, `${id} has exactly one look`).toBe(1);
        expect(plotsOf.get(id)!.size, `${id} appears in several figures`).toBeGreaterThanOrEqual(3);
      }
      const distinct = new Set([...byKey.values()].map((s) => [...s][0]!.split('/')[0]));
      expect(distinct.size, 'compounds do not share a colour').toBe(Math.min(compoundIds.length, 8));
      const markers = new Set([...byKey.values()].map((s) => [...s][0]!.split('/')[1]));
      expect(markers.size, 'compounds do not share a marker').toBe(Math.min(compoundIds.length, 8));
      // DOC and UV254 reduction lines: neutral greys, not a compound colour
      const reductions = looks.filter((x) => x.key === 'doc-reduction' || x.key === 'uv254-reduction');
      expect(reductions.length).toBeGreaterThan(0);
      for (const rline of reductions) expect([...distinct]).not.toContain(rline.colour);
      // the governing compound is drawn heavier in the removal figure
      const emph = await page.evaluate(() => [...document.querySelectorAll('svg[data-plot-id="removal-1"] g.series[data-emphasis="true"]')].map((g) => g.getAttribute('data-key')));
      expect(emph).toHaveLength(1);
      // 3. month ticks on the date axes
      const ticks = await page.evaluate(() => ['daily-dose', 'daily-doc'].map((id) => [...document.querySelectorAll(`svg[data-plot-id="${id}"] g.tick-labels text`)].map((t) => t.textContent ?? '')));
      for (const t of ticks) {
        expect(t).toContain('Jan 2025');
        expect(t.filter((x) => /^(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)( \d{4})?$/.test(x)).length).toBeGreaterThanOrEqual(6);
      }
      // 4. references present, no "from memory" in the client text, cover block shown
      const dom = await page.evaluate(() => ({
        body: document.body.textContent ?? '',
        refs: document.querySelectorAll('ol.references li').length,
        cover: [...document.querySelectorAll('dl.cover dt')].map((d) => d.textContent ?? ''),
      }));
      expect(dom.refs).toBeGreaterThanOrEqual(8);
      expect(dom.body).toMatch(/References/);
      expect(dom.body).not.toMatch(/from memory/i);
      expect(dom.cover).toEqual(['Client', 'Project number', 'Author', 'Checked by', 'Revision', 'Date']);
      expect(dom.body).toMatch(/median governing dose .* above the point estimate/);
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);
      // 5. a screenshot at A4 size (first page of the screen layout)
      const path = await saveScreenshot(page, 'client-report-a4.png');
      expect(existsSync(path)).toBe(true);
      const png = await page.screenshot({ fullPage: false });
      expect(png.readUInt32BE(16)).toBe(A4_PX.width);
      expect(png.readUInt32BE(20)).toBe(A4_PX.height);
    } finally {
      await close();
    }
  }, 120_000);
});
