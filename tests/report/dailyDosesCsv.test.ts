/**
 * daily_doses.csv is written as bytes for speed: it must be the same text as the table written by
 * the generic CSV writer (toCsv: RFC 4180 quoting, formula neutralising, 8 significant digits),
 * for ASCII texts and for texts that are not ASCII (written as strings). Invented rows.
 */
import { describe, expect, it } from 'vitest';
import { dailyDosesCsv, toCsv } from '../../src/output/outputTables.js';

const HEADERS = ['date', 'carbon', 'DOC (mg/L)', 'flow (m3/d)', 'dose (mg/L)', 'governed by', 'carbon (kg/d)', 'carbon cost per day', 'currency'];

function fake(name: string, currency: string, governedBy: string, date: string) {
  const rows = Array.from({ length: 40 }, (_, k) => ({
    date: k === 3 ? date : `2001-01-${String(k + 1).padStart(2, '0')}`, docMgPerL: 4 + k / 7, flowM3PerD: 12000 + k,
    doseMgPerL: k === 5 ? null : 10 / (k + 3), governedBy: k === 6 ? governedBy : 'compound X', carbonKgPerD: k === 8 ? NaN : k * 1.1e-7, cost: k === 9 ? null : k * 1234.5678901,
  }));
  return { carbons: [{ carbon: { name, currency }, daily: { rows } }, { carbon: { name: 'B', currency: 'EUR' } }] };
}

function expected(f: ReturnType<typeof fake>): string {
  const c = f.carbons[0]!;
  return toCsv(HEADERS, c.daily!.rows.map((d) => [d.date, c.carbon.name, d.docMgPerL, d.flowM3PerD, d.doseMgPerL, d.governedBy, d.carbonKgPerD, d.cost, c.carbon.currency]));
}

describe('dailyDosesCsv', () => {
  it('is the generic CSV writer\'s table (ASCII texts, quoting, formulas, empty cells)', () => {
    const f = fake('Carbon "A", wood', 'CHF', '=SUM(A1)', '2001-01-04');
    expect(dailyDosesCsv(f as never)).toBe(expected(f));
  });
  it('is the same table when a text is not ASCII', () => {
    for (const f of [fake('Kohle ä', 'EUR', 'x', '2001-01-04'), fake('A', '€', 'x', '2001-01-04'), fake('A', 'EUR', 'Verbindung ö', '2001-01-04'), fake('A', 'EUR', 'x', '4. Jänner')]) {
      expect(dailyDosesCsv(f as never)).toBe(expected(f));
    }
  });
});
