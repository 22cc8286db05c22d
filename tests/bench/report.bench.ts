/**
 * Report rendering speed: a synthetic model (invented curves) with 20 plots of 3 series × 200
 * points (one with a band, log axes on half of them, goal and dose lines), rendered to HTML and
 * Markdown. Target: HTML well under 100 ms.
 */
import { renderHtmlReport } from '../../src/report/htmlReport.js';
import { renderMarkdownSummary } from '../../src/report/markdownSummary.js';
import type { ReportModel, XYPlotSpec } from '../../src/output/reportModel.js';

function benchModel(): ReportModel {
  const plots: XYPlotSpec[] = Array.from({ length: 20 }, (_, p) => {
    const log = p % 2 === 0;
    const xsOf = (i: number) => (log ? 10 ** (-1 + (3 * i) / 199) : (60 * i) / 199);
    return {
      kind: 'xy', id: `p${p}`, title: `Synthetic plot ${p}`, xLabel: 'dose (mg/L)', yLabel: 'value (–)', xLog: log, yLog: log,
      series: [0, 1, 2].map((s) => {
        const points = Array.from({ length: 200 }, (_, i) => [xsOf(i), (s + 1) * (1 + Math.sin(i / 15 + s)) + 0.5] as [number, number]);
        return {
          name: `series ${s}`, style: s === 2 ? ('dashed' as const) : ('line' as const), points,
          ...(s === 0 ? { band: { lower: points.map(([, y]) => y * 0.8), upper: points.map(([, y]) => y * 1.2), label: 'band' } } : {}),
        };
      }),
      hLines: [{ y: 2, label: 'Goal' }],
      vLines: [{ x: log ? 3 : 20, label: 'Chosen dose' }],
    };
  });
  return {
    title: 'Benchmark (synthetic)', generatedAt: '2024-01-01T00:00:00Z', version: 'bench', cautions: ['Synthetic.'],
    keyFigures: [{ label: 'a', value: '1' }],
    sections: [{ id: 's', heading: 'Plots', plots, tables: [{ caption: 't', columns: ['a', 'b'], rows: Array.from({ length: 100 }, (_, i) => [`r${i}`, i * 1.2345]) }] }],
  };
}

function medianMs(fn: () => void, runs: number): number {
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    t.push(performance.now() - t0);
  }
  t.sort((a, b) => a - b);
  return t[Math.floor(runs / 2)]!;
}

export async function bench(): Promise<Array<{ name: string; value: number; unit: string; target?: string }>> {
  const model = benchModel();
  for (let i = 0; i < 3; i++) renderHtmlReport(model); // warm-up
  const html = medianMs(() => renderHtmlReport(model), 15);
  const md = medianMs(() => renderMarkdownSummary(model), 15);
  const size = renderHtmlReport(model).length / 1024;
  return [
    { name: 'report: HTML, 20 plots × 3 series × 200 points (median)', value: Number(html.toFixed(2)), unit: 'ms', target: '< 100 ms' },
    { name: 'report: Markdown summary of the same model (median)', value: Number(md.toFixed(3)), unit: 'ms' },
    { name: 'report: HTML size of the same model', value: Number(size.toFixed(0)), unit: 'KiB' },
  ];
}
