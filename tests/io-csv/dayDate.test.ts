/**
 * Day dates of the site series: ISO YYYY-MM-DD (read without Date objects in the common case) and
 * day.month.year. The reference is the proleptic Gregorian calendar as ECMA-262 Date.UTC counts it
 * (a day is valid when Date.UTC gives back the same year, month and day); leap-year rule from
 * memory (divisible by 4, not by 100 unless by 400).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseDayDate } from '../../src/tables/dayDate.js';

function reference(y: number, m: number, d: number): boolean {
  const t = new Date(Date.UTC(y, m - 1, d));
  return y >= 100 && t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === d;
}
const pad = (n: number, w: number) => String(n).padStart(w, '0');

describe('parseDayDate', () => {
  it('accepts exactly the valid days (leap years included) in both forms, as ISO', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 9999 }), fc.integer({ min: 0, max: 13 }), fc.integer({ min: 0, max: 32 }), (y, m, d) => {
      const iso = `${pad(y, 4)}-${pad(m, 2)}-${pad(d, 2)}`;
      const want = reference(y, m, d) ? iso : undefined;
      expect(parseDayDate(iso), iso).toBe(want);
      if (y >= 1000) expect(parseDayDate(`${d}.${m}.${y}`), `${d}.${m}.${y}`).toBe(want);
    }), { numRuns: 3000 });
    expect(parseDayDate('2024-02-29')).toBe('2024-02-29');
    expect(parseDayDate('2100-02-29')).toBeUndefined();
    expect(parseDayDate('2000-02-29')).toBe('2000-02-29');
    expect(parseDayDate(' 2024-03-01 ')).toBe('2024-03-01');
    expect(parseDayDate('2024-03-01T00:00:00Z')).toBe('2024-03-01');
    expect(parseDayDate('2024-3-01')).toBeUndefined();
  });
});
