import { describe, expect, it } from 'vitest';
import { parseSiteSeries } from '../../src/siteSeries/siteSeries.js';
import { median, quantile, summarise } from '../../src/siteSeries/seriesStats.js';
import { dailyDoses } from '../../src/design/dailyDoses.js';
import type { DoseTable } from '../../src/design/doseTable.js';

/** A dose table with the given dose at each DOC node (doses linear in DOC are then exact). */
const tableOf = (docs: number[], dose: (doc: number) => number): DoseTable => ({ docMgPerL: docs, nodes: docs.map((d) => ({ docMgPerL: d, doseMgPerL: dose(d), governedBy: 'compound T' })), midpointErrorRel: 0, toleranceRel: 1e-3 });

describe('percentiles (Hyndman & Fan 1996, definition 7 — the default of R quantile(type = 7) and NumPy)', () => {
  // Values from definition 7 worked by hand: h = (n − 1)·p, linear between order statistics.
  it('matches definition 7 on small samples', () => {
    expect(quantile([1, 2, 3, 4], 0.9)).toBeCloseTo(3.7, 14); // h = 2.7 → 3 + 0.7·(4 − 3)
    expect(quantile([10, 20, 30, 40, 50], 0.9)).toBeCloseTo(46, 14); // h = 3.6
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(quantile([7], 0.9)).toBe(7);
  });
  it('summarises n, min, max, mean, sum', () => {
    const s = summarise([2, 4, 6, 8]);
    expect(s).toMatchObject({ n: 4, min: 2, max: 8, mean: 5, sum: 20, median: 5 });
    expect(() => summarise([])).toThrow(/no values/);
  });
});

describe('site series CSV', () => {
  it('reads date, DOC and flow with units from the header', () => {
    const s = parseSiteSeries('date,DOC (mg/L),flow (m3/h)\n2025-01-01,7.5,500\n2025-01-02,8,600\n', 12000, 's.csv');
    expect(s.dates).toEqual(['2025-01-01', '2025-01-02']);
    expect(s.docMgPerL).toEqual([7.5, 8]);
    expect(s.flowM3PerD).toEqual([12000, 14400]); // m³/h × 24
    expect(s.flowFromDesign).toBe(false);
  });
  it('uses the design flow without a flow column', () => {
    const s = parseSiteSeries('date,DOC (ug/L)\n2025-01-01,7500\n', 12000);
    expect(s.flowM3PerD).toEqual([12000]);
    expect(s.docMgPerL[0]).toBeCloseTo(7.5, 12);
    expect(s.flowFromDesign).toBe(true);
  });
  it('names file, row and column of bad input', () => {
    expect(() => parseSiteSeries('day,DOC (mg/L)\n2025-02-30,7\n', 1, 's.csv')).toThrow(/s\.csv, row 2, column "day": "2025-02-30" is not a date/);
    expect(() => parseSiteSeries('DOC (mg/L)\n7\n', 1, 's.csv')).toThrow(/missing the "date" column/);
    expect(() => parseSiteSeries('date,DOC\n2025-01-01,7\n', 1, 's.csv')).toThrow(/header without a unit/);
    expect(() => parseSiteSeries('date,DOC (mg/L)\n2025-01-01,0\n', 1, 's.csv')).toThrow(/row 2, column "DOC \(mg\/L\)": DOC of 0 mg\/L; expected a positive DOC/);
  });
});

describe('daily doses arithmetic', () => {
  it('kg/d = dose × flow / 1000; totals are sums; 366 days count as a year; shorter series are scaled to 365 days', () => {
    const dates = Array.from({ length: 366 }, (_, k) => new Date(Date.UTC(2024, 0, 1 + k)).toISOString().slice(0, 10));
    const series = { dates, docMgPerL: dates.map((_, k) => 6 + (k % 5)), flowM3PerD: dates.map(() => 10000), flowFromDesign: true };
    const d = dailyDoses({ name: 'X', currency: 'EUR', pricePerKg: 2 }, series, tableOf([6, 7, 8, 9, 10], (doc) => 2 * doc));
    const kg = series.docMgPerL.reduce((s, doc) => s + (2 * doc * 10000) / 1000, 0);
    expect(d.totalCarbonKg).toBeCloseTo(kg, 9);
    expect(d.yearlyCarbonKg).toBe(d.totalCarbonKg);
    expect(d.totalCost).toBeCloseTo(2 * kg, 9);
    expect(d.annualised).toBe(false);
    d.rows.forEach((row) => expect(row.doseMgPerL).toBe(2 * row.docMgPerL)); // at the nodes: exact
    const short = dailyDoses({ name: 'X', currency: 'EUR', pricePerKg: 2 }, { ...series, dates: dates.slice(0, 73), docMgPerL: series.docMgPerL.slice(0, 73), flowM3PerD: series.flowM3PerD.slice(0, 73) }, tableOf([6, 10], () => 10));
    expect(short.yearlyCarbonKg).toBeCloseTo(100 * 365, 9); // 10 mg/L × 10 000 m³/d / 1000 = 100 kg/d
    expect(short.annualised).toBe(true);
  });
});
