/**
 * results.xlsx writes a number cell's text as it stands when the text is already JavaScript's own
 * shortest round-trip form of its number, and converts it otherwise: checked against
 * String(Number(text)) itself (ECMA-262 Number::toString, the reference) over wide random inputs;
 * the CSV tables write numbers to 8 significant digits through significant8, checked the same way.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { numberText } from '../../src/report/resultsWorkbook.js';
import { AsciiText, significant8 } from '../../src/output/outputTables.js';

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

describe('significant8 between 1e-6 and 1e8 (its digits from one product, toPrecision near a half)', () => {
  const reference = (v: number) => String(Number(v.toPrecision(8)));
  /** The text AsciiText.cell writes for v (its digits straight into bytes). */
  const inBytes = (v: number) => { const t = new AsciiText(8); t.cell(v); return t.text(); };
  /** Values around the cases the product can get wrong: a half at the 9th digit, powers of ten, carries to 1e8. */
  const hard = (e: number, m: number) => {
    const p = 10 ** (e - 7);
    const base = (Math.floor(m) + 0.5) * p;
    return [base, base * (1 + 2 ** -52), base * (1 - 2 ** -53), Number(`${Math.floor(m)}5e${e - 8}`), Number(base.toPrecision(9)), Number(base.toPrecision(12)), 10 ** e, 10 ** e * (1 - 2 ** -53), 10 ** e * 0.999999995, 10 ** e * 0.99999999500001];
  };
  it('equals String(Number(v.toPrecision(8))) on near-halves, powers of ten and carries, both signs, as a string and as bytes', () => {
    for (const v of [1e-6, 9.99999995e-7, 9.999999950000001e-7, 99999999.5, 99999999.49, 99999999.51, 12345678.5, 1234567.85, 0.1, 0.2, 0.3, 1 / 3, 2 / 3, 13497, 9.42])
      for (const x of [v, -v]) { expect(significant8(x), String(x)).toBe(reference(x)); expect(inBytes(x), String(x)).toBe(reference(x)); }
    fc.assert(fc.property(fc.integer({ min: -7, max: 8 }), fc.double({ min: 1e7, max: 99999999, noNaN: true }), (e, m) => {
      for (const v of hard(e, m)) for (const x of [v, -v]) { expect(significant8(x), String(x)).toBe(reference(x)); expect(inBytes(x), String(x)).toBe(reference(x)); }
    }), { numRuns: 3000 });
  });
  it('equals the reference on random values of every magnitude from 1e-8 to 1e9 and on decimals with few digits', () => {
    fc.assert(fc.property(fc.double({ min: -8, max: 9, noNaN: true }), fc.double({ min: 1, max: 10, noNaN: true }), fc.boolean(), (e, m, neg) => {
      const v = (neg ? -1 : 1) * m * 10 ** e;
      expect(significant8(v), String(v)).toBe(reference(v));
      expect(inBytes(v), String(v)).toBe(reference(v));
    }), { numRuns: 20000 });
    fc.assert(fc.property(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 0, max: 9 }), (k, d) => {
      const v = k / 10 ** d;
      expect(significant8(v), String(v)).toBe(reference(v));
      expect(inBytes(v), String(v)).toBe(reference(v));
    }), { numRuns: 20000 });
  });
  it('AsciiText.cell writes nothing for a non-finite number or null, and a text cell as cell() does', () => {
    const t = new AsciiText(4);
    for (const v of [NaN, Infinity, -Infinity, null, undefined]) t.cell(v);
    expect(t.text()).toBe('');
    expect(t.cell('=1+2')).toBe(true);
    expect(t.text()).toBe("'=1+2");
    expect(new AsciiText(4).cell('µg')).toBe(false);
  });
});

