/**
 * The demo's own report (the whole job on the invented plant, with hostile text put into the
 * user-supplied names) in headless Chromium: it loads with no console or page errors and no
 * outside request, every plot the report model lists is present with a real size and something
 * drawn, user-supplied text is shown as text (HTML-escaped), and a full-page screenshot is kept in
 * tests/.artifacts/demo-report.png.
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect } from 'vitest';
import { itWithChromium, inspectPlots, openReport, saveScreenshot, type PageDocument } from './browserHarness.js';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipelineWithUncertainty } from '../../src/pipeline/runWithUncertainty.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { renderHtmlReport } from '../../src/report/htmlReport.js';
import { reportPlotIds } from '../../src/report/reportPlotIds.js';

declare const document: PageDocument;

const EVIL = '<script>alert("x")</script> & <b>bold</b>';

describe('the demo report in headless Chromium', () => {
  itWithChromium('loads cleanly, shows every plot with content, escapes names, and is screenshotted', async () => {
    const input = loadProject(fileURLToPath(new URL('../../fixtures/demo/project.json', import.meta.url)), { demo: true });
    input.project.name = `Demo ${EVIL}`;
    const oldName = input.project.carbons[0]!.name;
    input.project.carbons[0]!.name = `Carbon ${EVIL}`;
    if (input.project.pilot?.carbon === oldName) input.project.pilot.carbon = input.project.carbons[0]!.name;
    input.project.compounds[0]!.name = `compound ${EVIL}`;
    input.project.uncertainty = { ...input.project.uncertainty!, gacDraws: 2 }; // the GAC run-length table with 2 draws (each integrates every compound again)
    const result = await runPipelineWithUncertainty(input, { draws: 60, seed: 1 });
    const model = buildReportModel(result, 'test');
    const ids = reportPlotIds(model);
    expect(ids.length).toBeGreaterThanOrEqual(10); // isotherm, fractions, removal, loadings, surrogates, pilot, daily dose, DOC, bands …
    const { page, close, errors, requests } = await openReport(renderHtmlReport(model), { width: 1200, height: 900 });
    try {
      const plots = await inspectPlots(page, ids.map((id) => ({ id })));
      for (const p of plots) {
        expect(p.present, `plot ${p.id} present`).toBe(true);
        expect(p.w, `plot ${p.id} width`).toBeGreaterThan(100);
        expect(p.h, `plot ${p.id} height`).toBeGreaterThan(100);
        expect(p.drawn[0], `plot ${p.id} has drawn data`).toBeGreaterThan(0);
      }
      const dom = await page.evaluate(() => ({
        scripts: document.querySelectorAll('script').length,
        bold: document.querySelectorAll('b').length,
        body: document.body.textContent ?? '',
      }));
      expect(dom.scripts).toBe(0);
      expect(dom.bold).toBe(0);
      expect(dom.body).toContain(`Carbon ${EVIL}`);
      expect(dom.body).toContain(`compound ${EVIL}`);
      expect(dom.body).toMatch(/licensed engineer/);
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);
      expect(existsSync(await saveScreenshot(page, 'demo-report.png'))).toBe(true);
    } finally {
      await close();
    }
  });
});
