/**
 * SVG plots: required attributes, determinism, rounding, and odd data (empty series, one point,
 * zero/negative values on log axes, NaN and infinities, out-of-range reference lines). Properties
 * of the output, no published numbers involved (common practice).
 */
import { describe, expect, it } from 'vitest';
import type { BarPlotSpec, ReportModel, XYPlotSpec } from '../../src/output/reportModel.js';
import { reportPlotIds } from '../../src/report/reportPlotIds.js';
import { renderBarPlot } from '../../src/report/svg/barPlot.js';
import { SERIES_COLOURS } from '../../src/output/palette.js';
import { renderXYPlot } from '../../src/report/svg/xyPlot.js';
import { validRuns } from '../../src/report/svg/validRuns.js';

const xy = (over: Partial<XYPlotSpec> = {}): XYPlotSpec => ({
  kind: 'xy', id: 'p1', title: 'Removal against dose', xLabel: 'dose (mg/L)', yLabel: 'removal (%)',
  series: [{ name: 'A', points: [[0, 0], [10, 50], [20, 75]] }],
  ...over,
});

/** Number of elements carrying data-series="k". */
const seriesCount = (svg: string, k: number) => (svg.match(new RegExp(`data-series="${k}"`, 'g')) ?? []).length;

describe('svg root', () => {
  it('has role, aria-label, title, data-plot-id and class', () => {
    const svg = renderXYPlot(xy());
    expect(svg).toMatch(/^<svg [^>]*class="plot"/);
    expect(svg).toMatch(/^<svg [^>]*role="img"/);
    expect(svg).toMatch(/^<svg [^>]*aria-label="Removal against dose"/);
    expect(svg).toMatch(/^<svg [^>]*data-plot-id="p1"/);
    expect(svg).toContain('<title>Removal against dose</title>');
    expect(svg.endsWith('</svg>')).toBe(true);
  });
  it('is deterministic and rounds coordinates to two decimals', () => {
    const spec = xy({
      xLog: true,
      series: [{ name: 'A', points: Array.from({ length: 50 }, (_, i) => [1.2345678 * (i + 1), Math.PI * (i + 1)] as [number, number]) }],
      vLines: [{ x: 7.77777, label: 'D' }],
    });
    const a = renderXYPlot(spec);
    expect(renderXYPlot(spec)).toBe(a);
    for (const m of a.matchAll(/ (?:d|x|y|width|height)="([^"]*)"/g)) {
      for (const num of m[1]!.match(/-?\d+\.\d+/g) ?? []) expect(num.split('.')[1]!.length).toBeLessThanOrEqual(2);
    }
    expect(a).not.toMatch(/NaN|Infinity|undefined/);
  });
  it('clip-path ids follow the uid', () => {
    expect(renderXYPlot(xy(), { uid: 'fig-7' })).toContain('clip-path="url(#clip-fig-7)"');
  });
});

describe('series styles', () => {
  it('lines, dashed lines, markers and bands are drawn, one group per series', () => {
    const svg = renderXYPlot(
      xy({
        series: [
          { name: 'line', points: [[0, 1], [1, 2]], band: { lower: [0.5, 1.5], upper: [1.5, 2.5], label: 'band' } },
          { name: 'dashed', style: 'dashed', points: [[0, 2], [1, 3]] },
          { name: 'pts', style: 'points', points: [[0.5, 2]] },
        ],
      }),
    );
    expect(seriesCount(svg, 0)).toBe(1);
    expect(seriesCount(svg, 1)).toBe(1);
    expect(seriesCount(svg, 2)).toBe(1);
    expect(svg).toContain('stroke-dasharray="7 4"');
    expect(svg).toContain('class="band" data-band="0"');
    expect(svg).toContain(`fill="${SERIES_COLOURS[2]}"`);
  });
});

describe('odd data', () => {
  it('an empty series draws nothing and says so', () => {
    const svg = renderXYPlot(xy({ series: [{ name: 'none', points: [] }] }));
    expect(seriesCount(svg, 0)).toBe(0);
    expect(svg).toContain('No data to plot');
    expect(svg).toContain('none (no data)');
  });
  it('no series at all still gives axes', () => {
    const svg = renderXYPlot(xy({ series: [], xLog: true }));
    expect(svg).toContain('class="axis"');
    expect(svg).toContain('No data to plot');
  });
  it('a single point on a line series becomes a marker', () => {
    const svg = renderXYPlot(xy({ xLog: true, yLog: true, series: [{ name: 'one', points: [[3, 7]] }] }));
    expect(seriesCount(svg, 0)).toBe(1);
    expect(svg).toMatch(/data-series="0"><path d="M[\d.]+ [\d.]+a/);
  });
  it('zero and negative values on a log axis are skipped with a note; the line breaks there', () => {
    const pts: Array<[number, number]> = [[1, 100], [2, 40], [3, 0], [4, -2], [5, 5], [6, 2]];
    const runs = validRuns(pts, false, true);
    expect(runs.runs).toEqual([[[1, 100], [2, 40]], [[5, 5], [6, 2]]]);
    expect(runs.nonPositive).toBe(2);
    const svg = renderXYPlot(xy({ yLog: true, series: [{ name: 'z', points: pts }] }));
    expect(svg).toContain('2 points at or below zero omitted (log axis).');
    expect((svg.match(/data-series="0"><path d="M[^"]*"/)![0].match(/M/g) ?? []).length).toBe(2);
  });
  it('zero on a linear axis is fine and not noted', () => {
    expect(renderXYPlot(xy())).not.toContain('omitted');
  });
  it('NaN and infinities are skipped with a note', () => {
    const svg = renderXYPlot(xy({ series: [{ name: 'n', points: [[0, 1], [1, NaN], [2, Infinity], [NaN, 3], [4, 5]] }] }));
    expect(svg).toContain('3 points without a finite value omitted.');
    expect(svg).not.toMatch(/NaN|Infinity/);
  });
  it('band bounds at or below zero on a log axis are noted', () => {
    const svg = renderXYPlot(xy({ yLog: true, series: [{ name: 'b', points: [[0, 1], [1, 2], [2, 3]], band: { lower: [-1, 1, 2], upper: [2, 3, 4] } }] }));
    expect(svg).toContain('Band omitted at 1 point where a bound is at or below zero (log axis).');
  });
  it('reference lines out of a fixed range are named in a note', () => {
    const svg = renderXYPlot(xy({ xRange: [0, 30], vLines: [{ x: 100, label: 'Far dose' }, { x: 10, label: 'Near dose' }], hLines: [{ y: 80, label: 'Goal' }] }));
    expect(svg).toContain('Outside the plotted range, not drawn: Far dose.');
    expect(svg).toContain('>Near dose</text>');
    expect(svg).toContain('>Goal</text>');
  });
  it('reference lines widen an automatic range', () => {
    const svg = renderXYPlot(xy({ hLines: [{ y: 150, label: 'High' }] }));
    expect(svg).not.toContain('Outside the plotted range');
    expect(svg).toContain('>150</text>');
  });
});

describe('stacked bars', () => {
  const bars: BarPlotSpec = {
    kind: 'bars', id: 'b', title: 'Fractions', yLabel: 'fraction (–)', categories: ['S1', 'S2'],
    stacks: [{ name: 'F1', values: [0.2, 0.3] }, { name: 'F2', values: [0.8, NaN] }, { name: 'F3', values: [] }, { name: 'F4', values: [-1, 0.1] }],
  };
  it('stacks segments, skips what cannot be stacked, and says so', () => {
    const svg = renderBarPlot(bars);
    expect(svg).toMatch(/^<svg [^>]*data-plot-id="b"/);
    expect((svg.match(/data-series="0"[^>]*>(.*?)<\/g>/)![1]!.match(/<rect/g) ?? []).length).toBe(2);
    expect(seriesCount(svg, 2)).toBe(0);
    expect(svg).toContain('F3 (no data)');
    expect(svg).toContain('4 values that cannot be stacked (negative or not a finite number) omitted.');
    expect(svg).toContain('>0.8</text>');
  });
  it('no categories: empty plot with a message', () => {
    expect(renderBarPlot({ ...bars, categories: [], stacks: [] })).toContain('No data to plot');
  });
});

describe('reportPlotIds', () => {
  it('lists plot ids in document order', () => {
    const model: ReportModel = {
      title: 't', generatedAt: '', version: 'v', cautions: [], keyFigures: [],
      sections: [
        { id: 'a', heading: 'A', plots: [xy({ id: 'x1' }), { kind: 'bars', id: 'b1', title: 'B', yLabel: 'y', categories: [], stacks: [] }] },
        { id: 'b', heading: 'B' },
        { id: 'c', heading: 'C', plots: [xy({ id: 'x2' })] },
      ],
    };
    expect(reportPlotIds(model)).toEqual(['x1', 'b1', 'x2']);
  });
});
