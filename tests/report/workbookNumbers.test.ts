/**
 * results.xlsx writes a number cell's text as it stands when the text is already JavaScript's own
 * shortest round-trip form of its number, and converts it otherwise: checked against
 * String(Number(text)) itself (ECMA-262 Number::toString, the reference) over wide random inputs;
 * the CSV tables write numbers to 8 significant digits through significant8, checked the same way.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { numberText } from '../../src/report/resultsWorkbook.js';
import { significant8 } from '../../src/output/outputTables.js';

describe('numberText', () => {
  it('equals String(Number(text)) on edge cases (trailing zeros, tiny and huge values, -0, 16 digits above 2^53)', () => {
    for (const t of ['0', '-0', '1.50', '1.', '.5', '0.000001', '0.0000001', '100', '1e5', '-0.5', '007', '123456789012345', '1234567890123456', '0.1234567890123456', '99999999999999999999', '1e21', '0.00000100',
      '9007199254740993', '9999999999999999', '-9007199254740993', '0.0000012', '0.00000012', '-0.000001', '1.5E3', '-.5e-3', '0.100000000000001'])
      expect(numberText(t), t).toBe(String(Number(t)));
  });

  it('equals String(Number(text)) for numbers written with toPrecision, toFixed and String', () => {
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e25, max: 1e25 }), fc.integer({ min: 1, max: 21 }), (x, p) => {
      for (const t of [String(x), x.toPrecision(p), String(Number(x.toPrecision(Math.min(p, 17)))), Math.abs(x) < 1e20 ? x.toFixed(p % 15) : '1']) expect(numberText(t), t).toBe(String(Number(t)));
    }), { numRuns: 1000 });
  });
});

describe('significant8 (CSV numbers)', () => {
  it('equals String(Number(v.toPrecision(8))) (the reference) over wide magnitudes, signs and edge values', () => {
    for (const v of [0, -0, 1e-7, 5e-7, -5e-7, 0.000001, 123456789, 99999999.5, 13497, -26.265643655445082, 1e21, 1e300, 5e-324])
      expect(significant8(v), String(v)).toBe(String(Number(v.toPrecision(8))));
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (v) => {
      expect(significant8(v)).toBe(String(Number(v.toPrecision(8))));
    }), { numRuns: 2000 });
  });
});
