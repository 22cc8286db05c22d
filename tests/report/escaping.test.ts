/**
 * Escaping and self-containment of the HTML report and the Markdown summary (common practice:
 * OWASP's rule of escaping &, <, >, " and ' in HTML content and quoted attributes; from memory).
 */
import { describe, expect, it } from 'vitest';
import { escapeHtml } from '../../src/report/escapeHtml.js';
import { escapeMarkdown } from '../../src/report/escapeMarkdown.js';
import { renderHtmlReport } from '../../src/report/htmlReport.js';
import { renderMarkdownSummary } from '../../src/report/markdownSummary.js';
import type { ReportModel } from '../../src/output/reportModel.js';

const EVIL = '<script>alert(1)</script>';
const AMP = 'A&B "x"';

/** A small synthetic model with hostile text in every text slot (rendering test only). */
function hostileModel(): ReportModel {
  return {
    title: EVIL,
    subtitle: AMP,
    generatedAt: '2024-05-06T07:08:09Z',
    version: `1"><b>`,
    cautions: [EVIL, AMP],
    keyFigures: [{ label: EVIL, value: AMP, note: `<img src=x onerror=alert(1)>` }],
    sections: [
      {
        id: `"><script>`,
        heading: EVIL,
        paragraphs: [AMP],
        warnings: [EVIL],
        tables: [{ caption: EVIL, columns: [EVIL, AMP], rows: [[EVIL, 1.5], [AMP, 'x|y']] }],
        plots: [
          {
            kind: 'xy', id: `id"'<>&`, title: EVIL, xLabel: AMP, yLabel: EVIL,
            series: [{ name: EVIL, points: [[1, 2], [2, 3]], band: { lower: [1, 2], upper: [3, 4], label: AMP } }],
            hLines: [{ y: 2.5, label: EVIL }], vLines: [{ x: 1.5, label: AMP }],
          },
          { kind: 'bars', id: EVIL, title: AMP, yLabel: EVIL, categories: [EVIL, AMP], stacks: [{ name: EVIL, values: [1, 2] }] },
        ],
      },
    ],
  };
}

describe('escapeHtml', () => {
  it('escapes the five markup characters', () => {
    expect(escapeHtml(EVIL)).toBe('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(escapeHtml(AMP)).toBe('A&amp;B &quot;x&quot;');
    expect(escapeHtml("it's")).toBe('it&#39;s');
    expect(escapeHtml('a\u0000b\u0007c\td')).toBe('abc\td');
  });
});

describe('HTML report escaping', () => {
  const html = renderHtmlReport(hostileModel());
  it('contains no live script, image or injected attribute', () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<img/i);
    expect(html).not.toMatch(/<b>/);
    expect(html).toContain('sorbshare 1&quot;&gt;&lt;b&gt;');
  });
  it('shows the hostile text escaped, in text and attributes', () => {
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('A&amp;B &quot;x&quot;');
    expect(html).toContain('aria-label="&lt;script&gt;alert(1)&lt;/script&gt;"');
    expect(html).toContain('data-plot-id="id&quot;&#39;&lt;&gt;&amp;"');
    expect(html).toContain('<title>&lt;script&gt;alert(1)&lt;/script&gt;</title>');
  });
  it('anchors and clip-path ids are plain slugs', () => {
    for (const m of html.matchAll(/ id="([^"]*)"/g)) expect(m[1]).toMatch(/^[A-Za-z0-9_-]+$/);
    for (const m of html.matchAll(/href="#([^"]*)"/g)) expect(m[1]).toMatch(/^[A-Za-z0-9_-]+$/);
  });
  it('is self-contained: no scripts, links, images, imports or outside URLs', () => {
    expect(html).not.toMatch(/<(link|img|iframe|object|embed|image|use|foreignObject)\b/i);
    expect(html).not.toMatch(/<[a-z]+\s[^>]*\b(src|href|xlink:href)="(?!#)/i);
    expect(html).not.toMatch(/@import|url\((?!#)/i);
    const urls = [...html.matchAll(/https?:\/\/[^\s"')]+/g)].map((m) => m[0]);
    expect(new Set(urls)).toEqual(new Set(['http://www.w3.org/2000/svg']));
    expect(html).toContain("default-src 'none'");
  });
});

describe('Markdown escaping', () => {
  it('neutralises HTML, entities, emphasis, links and pipes', () => {
    expect(escapeMarkdown(EVIL)).toBe('\\<script\\>alert(1)\\</script\\>');
    expect(escapeMarkdown(AMP)).toBe('A&B "x"');
    expect(escapeMarkdown('&amp; *a* [b](c) x|y')).toBe('\\&amp; \\*a\\* \\[b\\](c) x\\|y');
    expect(escapeMarkdown('F_1 _x_')).toBe('F_1 \\_x\\_');
    expect(escapeMarkdown('1. a')).toBe('1\\. a');
    expect(escapeMarkdown('# a\nb')).toBe('\\# a b');
  });
  it('the summary has no raw tag', () => {
    const md = renderMarkdownSummary(hostileModel());
    expect(md).not.toMatch(/(^|[^\\])<(script|img|b)/i);
    expect(md).toContain('\\<script\\>alert(1)\\</script\\>');
    expect(md).toContain('x\\|y');
  });
});
