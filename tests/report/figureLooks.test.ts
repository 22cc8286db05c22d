/**
 * Month ticks of the date axis, one look per compound across figures, the tornado renderer and
 * the sweep that covers the required dose. Expected values are calendar facts (ISO 8601 / the
 * Gregorian calendar) or follow from the rule each function states.
 */
import { describe, expect, it } from 'vitest';
import { dayNumber, monthTicks } from '../../src/report/svg/timeTicks.js';
import { compoundStyles } from '../../src/output/compoundStyles.js';
import { applyCompoundLooks } from '../../src/output/applyCompoundLooks.js';
import { renderTornadoPlot } from '../../src/report/svg/tornadoPlot.js';
import { renderXYPlot } from '../../src/report/svg/xyPlot.js';
import { sweepCovering } from '../../src/design/sweepCovering.js';
import type { ReportModel, XYPlotSpec } from '../../src/output/reportModel.js';

describe('date axis (month ticks)', () => {
  it('day numbers count days since 1970-01-01 (calendar facts)', () => {
    expect(dayNumber('1970-01-01')).toBe(0);
    expect(dayNumber('1970-02-01')).toBe(31);
    expect(dayNumber('2024-03-01') - dayNumber('2024-02-01')).toBe(29); // 2024 is a leap year
    expect(dayNumber('2025-03-01') - dayNumber('2025-02-01')).toBe(28);
    expect(() => dayNumber('01.02.2025')).toThrow(/ISO date/);
    for (const bad of ['2025-1-01', '2025-01-0x', '2025/01/01', ' 2025-01-01', '2025-01-01 ', '２０２５-01-01']) expect(() => dayNumber(bad), bad).toThrow(/ISO date/);
    // days of 1900–2100 (every 29th, all weekdays and months) against the date's own time value (ECMA-262 Date: ms since 1970-01-01 UTC)
    for (let t = Date.UTC(1900, 0, 1); t <= Date.UTC(2100, 11, 31); t += 86_400_000 * 29 + 3_600_000) {
      const day = Math.floor(t / 86_400_000);
      expect(dayNumber(new Date(day * 86_400_000).toISOString().slice(0, 10))).toBe(day);
    }
  });

  it('a calendar year gets ticks on the first of every month and at most eight labels', () => {
    const t = monthTicks(dayNumber('2025-01-01'), dayNumber('2025-12-31'));
    expect(t.domain).toEqual([dayNumber('2025-01-01'), dayNumber('2026-01-01')]);
    expect(t.ticks).toHaveLength(13);
    expect(t.ticks.map((k) => k.value)).toContain(dayNumber('2025-07-01'));
    const labels = t.ticks.filter((k) => k.label).map((k) => k.label);
    expect(labels.length).toBeLessThanOrEqual(8);
    expect(labels[0]).toBe('Jan 2025');
    expect(labels).toContain('Jan 2026');
    expect(labels).toContain('Mar');
  });

  it('a quarter gets a label on every month; the first carries the year', () => {
    const t = monthTicks(dayNumber('2025-04-10'), dayNumber('2025-06-20'));
    expect(t.ticks.map((k) => k.label)).toEqual(['Apr 2025', 'May', 'Jun', 'Jul']);
  });

  it('an x–y plot with xTime shows month names, not day counts', () => {
    const pts: Array<[number, number]> = Array.from({ length: 365 }, (_, k) => [dayNumber('2025-01-01') + k, 5 + Math.sin(k / 30)]);
    const svg = renderXYPlot({ kind: 'xy', id: 't', title: 't', xLabel: 'date', yLabel: 'DOC (mg/L)', xTime: true, series: [{ name: 'DOC', points: pts }] });
    expect(svg).toMatch(/>Jan 2025</);
    expect(svg).toMatch(/>Jul</);
    expect(svg).not.toMatch(/>400</);
  });
});

describe('one look per compound', () => {
  it('colours and markers are unique for up to eight compounds and pairs unique beyond', () => {
    const ids = Array.from({ length: 20 }, (_, i) => `C${i}`);
    const looks = compoundStyles(ids);
    const first8 = ids.slice(0, 8).map((id) => looks.get(id)!);
    expect(new Set(first8.map((l) => l.colour)).size).toBe(8);
    expect(new Set(first8.map((l) => l.marker)).size).toBe(8);
    expect(new Set(ids.map((id) => `${looks.get(id)!.colour}/${looks.get(id)!.marker}`)).size).toBe(20);
  });

  it('applyCompoundLooks gives a compound the same colour and marker in every figure, in table order, and greys for reductions', () => {
    const model: ReportModel = {
      title: 't', generatedAt: '2026-01-01T00:00:00Z', version: '0', cautions: [], keyFigures: [],
      sections: [{ id: 's', heading: 'h', plots: [
        { kind: 'xy', id: 'a', title: 'a', xLabel: 'x', yLabel: 'y', series: [{ name: 'B', key: 'B', points: [[1, 1]] }, { name: 'A', key: 'A', points: [[1, 2]] }, { name: 'DOC reduction', key: 'doc-reduction', points: [[1, 3]] }] },
        { kind: 'xy', id: 'b', title: 'b', xLabel: 'x', yLabel: 'y', series: [{ name: 'ref', key: 'reference', points: [[1, 1]] }, { name: 'B', key: 'B', points: [[1, 1]], style: 'points' }] },
      ] }],
    };
    const out = applyCompoundLooks(model, ['A', 'B']);
    const [a, b] = out.sections[0]!.plots! as XYPlotSpec[];
    expect(a!.series.map((s) => s.key)).toEqual(['A', 'B', 'doc-reduction']);
    const bInA = a!.series.find((s) => s.key === 'B')!;
    const bInB = b!.series.find((s) => s.key === 'B')!;
    expect(bInA.colour).toBe(bInB.colour);
    expect(bInA.marker).toBe(bInB.marker);
    const grey = a!.series.find((s) => s.key === 'doc-reduction')!.colour!;
    expect(compoundStylesColours(['A', 'B'])).not.toContain(grey);
    const svg = renderXYPlot(b!);
    expect(svg).toContain(`data-key="B"`);
    expect(svg).toContain(`data-colour="${bInB.colour}"`);
  });
});

function compoundStylesColours(ids: string[]): string[] {
  return [...compoundStyles(ids).values()].map((l) => l.colour);
}

describe('tornado figure', () => {
  it('draws one low and one high bar per row at the given values, the base line and the legend', () => {
    const svg = renderTornadoPlot({ kind: 'tornado', id: 'tor', title: 'T', xLabel: 'dose (mg/L)', base: 20, baseLabel: 'base 20 mg/L',
      rows: [{ label: 'K of CBZ', low: 26, high: 16 }, { label: 'DOC', low: 16, high: 24 }], lowName: 'input −20 %', highName: 'input +20 %' });
    expect(svg.match(/data-side="low"/g)).toHaveLength(2);
    expect(svg.match(/data-side="high"/g)).toHaveLength(2);
    expect(svg).toContain('data-value="26"');
    expect(svg).toContain('K of CBZ');
    expect(svg).toContain('base 20 mg/L');
  });
});

describe('removal sweep covering the required dose', () => {
  it('widens the last dose to twice the required dose and keeps the points per decade', () => {
    const s = sweepCovering({ fromMgPerL: 1, toMgPerL: 100, points: 41 }, 80);
    expect(s.toMgPerL).toBe(160);
    expect(s.points).toBeGreaterThanOrEqual(Math.ceil(20 * Math.log10(160)) + 1);
    expect(sweepCovering({ fromMgPerL: 1, toMgPerL: 100, points: 41 }, 20)).toEqual({ fromMgPerL: 1, toMgPerL: 100, points: 41 });
    expect(sweepCovering({ fromMgPerL: 1, toMgPerL: 100, points: 41 }, null).toMgPerL).toBe(100);
  });
});

describe('linear tick labels on client figures', () => {
  it('group thousands from 10,000 and keep exponents only for extreme magnitudes', async () => {
    const { formatLinearLabel } = await import('../../src/report/svg/linearTicks.js');
    expect(formatLinearLabel(300000, 0)).toBe('300,000');
    expect(formatLinearLabel(1250000, 0)).toBe('1,250,000');
    expect(formatLinearLabel(5000, 0)).toBe('5000');
    expect(formatLinearLabel(-20000, 0)).toBe('−20,000');
    expect(formatLinearLabel(2.5e13, 0)).toBe('2.5e+13');
  });
});
