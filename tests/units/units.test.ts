import { describe, expect, it } from 'vitest';
import { mathjsFactor, normaliseUnitText, unitFactor, type UnitKind } from '../../src/units/unitFactor.js';
import { parseQuantity, splitHeader } from '../../src/units/parseQuantity.js';

describe('units', () => {
  it('the exact table agrees with mathjs (general-purpose reference library) for every entry', () => {
    const cases: Array<[string, UnitKind]> = [
      ['ng/L', 'massConcentration'], ['ug/L', 'massConcentration'], ['mg/L', 'massConcentration'], ['g/L', 'massConcentration'],
      ['g/m^3', 'massConcentration'], ['mg/m^3', 'massConcentration'], ['kg/m^3', 'massConcentration'], ['ug/mL', 'massConcentration'],
      ['ug/mg', 'massLoading'], ['mg/g', 'massLoading'], ['ug/g', 'massLoading'], ['g/kg', 'massLoading'], ['mg/kg', 'massLoading'],
      ['umol/L', 'molarConcentration'], ['nmol/L', 'molarConcentration'], ['mmol/L', 'molarConcentration'], ['mol/m^3', 'molarConcentration'],
      ['umol/g', 'molarLoading'], ['mmol/g', 'molarLoading'], ['mol/kg', 'molarLoading'],
      ['m^3/day', 'flow'], ['m^3/hour', 'flow'], ['L/s', 'flow'], ['m^3/s', 'flow'], ['L/min', 'flow'],
    ];
    for (const [u, kind] of cases) {
      const ref = mathjsFactor(u, kind);
      expect(unitFactor(u, kind), `${u}`).toBeCloseTo(ref, 12);
      expect(Math.abs(unitFactor(u, kind) / ref - 1), u).toBeLessThan(1e-14);
    }
  });

  it('parses quantities with units into mg/L and m³/d exactly', () => {
    expect(parseQuantity('20 mg/L', 'massConcentration')).toBe(20);
    expect(parseQuantity('20 g/m3', 'massConcentration')).toBe(20);
    expect(parseQuantity('20 g/m³', 'massConcentration')).toBe(20);
    expect(parseQuantity('0.02 g/L', 'massConcentration')).toBe(20);
    expect(parseQuantity('100 ng/L', 'massConcentration')).toBeCloseTo(1e-4, 18);
    expect(parseQuantity('1.5 µg/L', 'massConcentration')).toBeCloseTo(1.5e-3, 18);
    expect(parseQuantity(7, 'massConcentration')).toBe(7);
    expect(parseQuantity('12000 m3/d', 'flow')).toBe(12000);
    expect(parseQuantity('500 m3/h', 'flow')).toBe(12000);
    expect(parseQuantity('100 L/s', 'flow')).toBeCloseTo(8640, 9);
    expect(parseQuantity('1e3 ug/L', 'massConcentration')).toBe(1);
  });

  it('units mathjs knows beyond the table still work (lb/ft^3 → mg/L)', () => {
    // 1 lb/ft³ = 0.45359237 kg / 0.028316846592 m³ = 16018.46337 g/m³ (exact definitions)
    expect(parseQuantity('1 lbm/ft^3', 'massConcentration')).toBeCloseTo(16018.46337, 4);
  });

  it('rejects unknown units, units of the wrong kind, negatives and non-numbers with a clear message', () => {
    expect(() => parseQuantity('20 mg/furlong', 'massConcentration')).toThrow(/unknown unit "mg\/furlong"/);
    expect(() => parseQuantity('20 m3/d', 'massConcentration')).toThrow(/not a mass concentration/);
    expect(() => parseQuantity('-1 mg/L', 'massConcentration')).toThrow(/non-negative/);
    expect(() => parseQuantity('abc', 'massConcentration')).toThrow(/number with a unit/);
    expect(() => parseQuantity(Number.NaN, 'massConcentration')).toThrow(/finite/);
    expect(() => parseQuantity(null, 'massConcentration')).toThrow(/mass concentration/);
  });

  it('normalises spellings and splits CSV headers', () => {
    expect(normaliseUnitText('g/m³')).toBe('g/m^3');
    expect(normaliseUnitText('m3/d')).toBe('m^3/day');
    expect(normaliseUnitText('µg/l')).toBe('ug/L');
    expect(normaliseUnitText('mmol/L')).toBe('mmol/L');
    expect(splitHeader('C0 (ng/L)')).toEqual({ name: 'C0', unit: 'ng/L' });
    expect(splitHeader('dose [mg/L]')).toEqual({ name: 'dose', unit: 'mg/L' });
    expect(splitHeader('sample')).toEqual({ name: 'sample', unit: undefined });
  });
});
