/**
 * The fast paths of unit parsing (per-kind factor caches, numbers already in the internal unit,
 * K in the default unit pair) give exactly what the general path gives.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unitFactor, parseQuantity, freundlichKToInternal, mathjsFactor, normaliseUnitText, InputError } from '../../src/index.js';

describe('unit lookup caches', () => {
  it('a unit cached for one kind is not taken for another kind', () => {
    expect(unitFactor('mg/g', 'massLoading')).toBe(1);
    expect(() => unitFactor('mg/g', 'massConcentration')).toThrow(InputError);
    expect(unitFactor('mM', 'molarConcentration')).toBe(1);
    expect(() => unitFactor('mM', 'massConcentration')).toThrow(/mass concentration/);
  });
  it('repeated lookups return the first factor (exact table and mathjs paths)', () => {
    for (const [u, kind] of [['ng/L', 'massConcentration'], ['µg/L', 'massConcentration'], ['lb/ft^3', 'massConcentration'], ['L/s', 'flow']] as const) {
      const first = unitFactor(u, kind);
      expect(unitFactor(u, kind)).toBe(first);
      expect(first).toBe(mathjsFactor(normaliseUnitText(u), kind)); // the table agrees with mathjs (exact definitions)
    }
  });
});

describe('numbers are already in the internal unit', () => {
  it('parseQuantity(number) equals parseQuantity of the same number written with the internal unit', () => {
    fc.assert(fc.property(fc.double({ min: 1e-12, max: 1e6, noNaN: true }), (x) => {
      expect(parseQuantity(x, 'massConcentration')).toBe(parseQuantity(`${x} mg/L`, 'massConcentration'));
      expect(parseQuantity(x, 'flow')).toBe(x);
    }));
  });
  it('zero, negative and non-finite numbers still go through the checks', () => {
    expect(parseQuantity(0, 'massConcentration')).toBe(0);
    expect(() => parseQuantity(0, 'massConcentration', { allowZero: false })).toThrow(/positive/);
    expect(() => parseQuantity(-1, 'massConcentration')).toThrow(/non-negative/);
    expect(() => parseQuantity(Infinity, 'massConcentration')).toThrow(/finite/);
    expect(() => parseQuantity(NaN, 'massConcentration')).toThrow(/finite/);
  });
  it('a bare number with an explicit default unit is converted', () => {
    expect(parseQuantity(50, 'massConcentration', { defaultUnit: 'ng/L' })).toBeCloseTo(5e-5, 18);
  });
  it('K in the default unit pair is returned unchanged; explicit mg/g and mg/L give the same', () => {
    fc.assert(fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), fc.double({ min: 0.05, max: 1.5, noNaN: true }), (K, b) => {
      expect(freundlichKToInternal(K, b)).toBe(K);
      expect(freundlichKToInternal(K, b, { q: 'mg/g', c: 'mg/L' })).toBe(K);
    }));
  });
});
