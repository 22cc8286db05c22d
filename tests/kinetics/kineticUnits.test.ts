/**
 * Units of the kinetic inputs (time, length, density, diffusivity, velocity): exact SI factors
 * (1 min = 60 s, 1 h = 3600 s, 1 d = 86 400 s, 1 um = 1e-6 m, 1 g/L = 1 kg/m³, 1 cm² = 1e-4 m²),
 * agreement with mathjs (the general-purpose reference) wherever mathjs knows the spelling, round
 * trips, and the CLI parsers of times.
 */
import { describe, expect, it } from 'vitest';
import { mathjsFactor, normaliseUnitText, unitFactor, type UnitKind } from '../../src/units/unitFactor.js';
import { parseQuantity } from '../../src/units/parseQuantity.js';
import { positiveTime, timeList, positiveLength, positiveDensity, positiveDiffusivity } from '../../src/cli/optionParsers.js';

const CASES: [string, UnitKind, number][] = [
  ['s', 'time', 1], ['min', 'time', 60], ['h', 'time', 3600], ['day', 'time', 86400], ['ms', 'time', 1e-3],
  ['m', 'length', 1], ['cm', 'length', 1e-2], ['mm', 'length', 1e-3], ['um', 'length', 1e-6], ['µm', 'length', 1e-6],
  ['kg/m3', 'density', 1], ['g/L', 'density', 1], ['g/cm3', 'density', 1e3], ['g/mL', 'density', 1e3],
  ['m2/s', 'diffusivity', 1], ['cm2/s', 'diffusivity', 1e-4], ['mm2/s', 'diffusivity', 1e-6], ['m²/s', 'diffusivity', 1],
  ['m/s', 'velocity', 1], ['cm/s', 'velocity', 1e-2], ['m/h', 'velocity', 1 / 3600], ['m/d', 'velocity', 1 / 86400],
];

describe('kinetic units', () => {
  for (const [unit, kind, factor] of CASES) {
    it(`${unit} (${kind}) = ${factor} × the internal unit (SI definition), as mathjs computes it`, () => {
      expect(unitFactor(unit, kind)).toBe(factor);
      let ref: number | undefined;
      try { ref = mathjsFactor(normaliseUnitText(unit), kind); } catch { ref = undefined; } // e.g. "d" is not a mathjs unit
      if (ref !== undefined) expect(Math.abs(ref / factor - 1)).toBeLessThan(1e-14);
    });
  }

  it('round trips: value·f / f gives the value back to the last bit for every unit', () => {
    for (const [unit, kind] of CASES) for (const v of [2e-17, 0.65, 12, 3.7e5]) {
      const internal = parseQuantity(`${v} ${unit}`, kind);
      expect(internal / unitFactor(unit, kind)).toBeCloseTo(v, 12 - Math.log10(Math.abs(v)));
    }
  });

  it('rejects a unit of the wrong kind, naming the kind expected', () => {
    expect(() => parseQuantity('2e-17 m/s', 'diffusivity')).toThrow(/is not a diffusivity/);
    expect(() => parseQuantity('10 kg', 'length')).toThrow(/length/);
  });

  it('CLI parsers: times with units, lists with one trailing unit or one unit each', () => {
    expect(positiveTime('30 min')).toBe(1800);
    expect(positiveTime('3 d')).toBe(259200);
    expect(() => positiveTime('30')).toThrow(/with its unit/);
    expect(timeList('1,5,15,30,60 min')).toEqual([60, 300, 900, 1800, 3600]);
    expect(timeList('30 s, 2 min, 1 h')).toEqual([30, 120, 3600]);
    expect(() => timeList('0,5 min')).toThrow(/positive times/);
    expect(() => timeList('5,10')).toThrow(/with a unit/);
    expect(positiveLength('10 um')).toBeCloseTo(1e-5, 20);
    expect(positiveDensity('650 kg/m3')).toBe(650);
    expect(positiveDiffusivity('1e-5 cm2/s')).toBeCloseTo(1e-9, 24);
    expect(() => positiveDiffusivity('2e-17')).toThrow(/with its unit/);
  });
});
