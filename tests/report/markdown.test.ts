/**
 * The Markdown summary carries the same content as the HTML report: headline figures, cautions,
 * warnings, tables (numeric columns right-aligned) and the plots by title. Structure checks on the
 * synthetic fixture (a rendering test; the numbers are invented).
 */
import { describe, expect, it } from 'vitest';
import { renderMarkdownSummary } from '../../src/report/markdownSummary.js';
import { reportPlotIds } from '../../src/report/reportPlotIds.js';
import { syntheticModel } from './syntheticModel.js';

describe('renderMarkdownSummary', () => {
  const model = syntheticModel();
  const md = renderMarkdownSummary(model);
  it('starts with the title and the run line', () => {
    expect(md.split('\n')[0]).toBe('# Synthetic rendering test \\<script\\>alert(1)\\</script\\>');
    expect(md).toContain('sorbshare 0.0.0-test · generated 2024-05-06 07:08 UTC');
  });
  it('quotes every caution', () => {
    for (const c of model.cautions.slice(0, 4)) expect(md).toContain(`> - ${c}`);
  });
  it('has the key figures as a table', () => {
    expect(md).toContain('| Figure | Value | Note |');
    expect(md).toContain('| Dose for 80 % removal | 23 mg/L | synthetic number |');
  });
  it('numbers sections and tables, right-aligns numeric columns, formats numbers', () => {
    expect(md).toContain('## 2. Removal against dose (synthetic)');
    expect(md).toContain('**Table 1.** Dose for the goal per compound (synthetic)');
    expect(md).toContain('| --- | ---: | ---: | --- |');
    expect(md).toContain('| Compound A | 12.35 | 80 | ok |');
    expect(md).toContain('*No rows.*');
  });
  it('shows warnings and lists every plot by title', () => {
    expect(md).toContain('> **Warning:** Synthetic warning text with \\<script\\>alert(1)\\</script\\>.');
    const figures = md.split('\n').filter((l) => /^- Figure \d+\. /.test(l));
    expect(figures).toHaveLength(reportPlotIds(model).length);
    expect(figures[0]).toBe('- Figure 1. Synthetic DOC isotherm with fitted curve and band');
  });
  it('is deterministic and ends with a newline', () => {
    expect(renderMarkdownSummary(syntheticModel())).toBe(md);
    expect(md.endsWith('\n')).toBe(true);
  });
});

describe('default cautions', () => {
  it('a model without cautions still shows the default cautions, in HTML and Markdown', async () => {
    const { renderHtmlReport } = await import('../../src/report/htmlReport.js');
    const { DEFAULT_CAUTIONS } = await import('../../src/report/defaultCautions.js');
    const model = { ...syntheticModel(), cautions: [] };
    const html = renderHtmlReport(model);
    const md = renderMarkdownSummary(model);
    for (const c of DEFAULT_CAUTIONS) {
      expect(html).toContain(`<li>${c}</li>`);
      expect(md).toContain(`> - ${c}`);
    }
  });
});
