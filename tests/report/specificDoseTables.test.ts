/**
 * Specific dose (mg carbon per mg DOC) in the Monte Carlo percentile table and the indicator
 * captions, and no unit echoed in both the unit column and the cells of the percentile table.
 * Demo project (invented data, a scenario only); expected values are recomputed here from the
 * pipeline's own numbers: the specific dose is dose ÷ design DOC (closed form).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { headlineFigures } from '../../src/output/headlineFigures.js';
import { fmtNumber } from '../../src/output/formatting.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';
import type { ReportModel, ReportTable } from '../../src/output/reportModel.js';
import { sharedDemoPipelineWithDraws } from '../helpers/sharedDemoPipeline.js';

let r: PipelineResult;
let model: ReportModel;

beforeAll(async () => {
  r = await sharedDemoPipelineWithDraws(); // the worker's shared demo run with 40 Monte Carlo draws (seed 3), read only
  model = buildReportModel(r, 'test');
}, 120_000);

const tables = (): ReportTable[] => model.sections.flatMap((s) => s.tables ?? []);

describe('Monte Carlo percentile table', () => {
  it('gives each dose with its specific dose (dose ÷ design DOC) and carries units only in the unit column', () => {
    const doc = r.project.site.docMgPerL;
    const withU = r.carbons.filter((c) => c.uncertainty);
    expect(withU.length).toBeGreaterThan(0);
    for (const cr of withU) {
      const t = tables().find((x) => x.caption.startsWith(`${cr.carbon.name}: point estimate and P10 / P50 / P90`))!;
      expect(t.caption).toContain(`design DOC (${fmtNumber(doc, 3)} mg/L)`);
      const qs = cr.uncertainty!.result.quantities;
      expect(t.rows).toHaveLength(qs.length);
      qs.forEach((q, i) => {
        const row = t.rows[i]!;
        expect(row[0]).toBe(q.label);
        const cells = row.slice(2);
        // no cell repeats a unit: bare numbers (with grouping) or "dose (specific dose)"
        for (const c of cells) expect(c).toMatch(/^(unreachable|[-\d.,]+( \([\d.,]+\))?)$/);
        if (q.unit === 'mg/L') {
          expect(row[1]).toBe('mg/L (mg/mg DOC)');
          [q.pointEstimate, q.p10, q.p50, q.p90].forEach((x, j) => {
            if (Number.isFinite(x)) expect(cells[j]).toBe(`${fmtNumber(x, 3)} (${fmtNumber(x / doc, 3)})`);
          });
        }
        if (q.unit === 'fraction') expect(row[1]).toBe('%');
        if (q.unit === 'kg/a') {
          expect(row[1]).toBe('t/a');
          expect(cells[0]).toBe(fmtNumber(q.pointEstimate / 1000, 3));
        }
        if (q.unit === 'currency/a') expect(row[1]).toBe(`${cr.carbon.currency}/a`);
      });
    }
  });
});

describe('indicator captions', () => {
  it('give the dose with its specific dose in the table caption and the headline note', () => {
    const doc = r.project.site.docMgPerL;
    const withInd = r.carbons.filter((c) => c.indicator);
    expect(withInd.length).toBeGreaterThan(0);
    for (const cr of withInd) {
      const d = cr.indicator!.doseMgPerL;
      const want = `${cr.carbon.name} at ${fmtNumber(d, 3)} mg/L (${fmtNumber(d / doc, 3)} mg/mg DOC):`;
      expect(tables().some((t) => t.caption.startsWith(want))).toBe(true);
    }
    const head = headlineFigures(r).find((f) => f.label === 'Indicator mean')!;
    const first = withInd[0]!;
    expect(head.note).toContain(`at ${fmtNumber(first.indicator!.doseMgPerL, 3)} mg/L (${fmtNumber(first.indicator!.doseMgPerL / doc, 3)} mg/mg DOC)`);
  });
});
