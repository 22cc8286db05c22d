import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { freundlichKToInternal, freundlichKFromInternal } from '../../src/units/freundlichK.js';

describe('Freundlich K unit conversion', () => {
  it('worked value computed from the Chen et al. 1999 rule: 10 (µg/mg)/(µg/L)^0.5 is 316.2 (mg/g)/(mg/L)^0.5 and both give q = 10 mg/g at 1 µg/L', () => {
    // K' = K·f_q/f_c^(1/n) with f_q(µg/mg→mg/g) = 1 and f_c(µg/L→mg/L) = 1e-3: 10/1e-3^0.5 = 316.227766…
    const K = freundlichKToInternal(10, 0.5, { q: 'ug/mg', c: 'ug/L' });
    expect(K).toBeCloseTo(316.2277660168, 9);
    const qMgPerG = K * Math.pow(1e-3, 0.5); // c = 1 µg/L = 1e-3 mg/L
    expect(qMgPerG).toBeCloseTo(10, 12);
  });

  it('Chen, Xing & McGill 1999 (J. Environ. Qual. 28:1422) rule, worked TCE values computed from it', () => {
    // TCE K = 28.0 (mg/g)(L/mg)^0.62 (Love et al. 1983 via Hendricks, Water Treatment Unit Processes)
    const Kug = freundlichKFromInternal(28.0, 0.62, { q: 'ug/g', c: 'ug/L' });
    expect(Kug).toBeCloseTo(386.51, 2); // 386.51 (µg/g)(L/µg)^0.62 to 5 digits, computed from the rule
    const Kmmol = freundlichKFromInternal(28.0, 0.62, { q: 'mmol/g', c: 'mmol/L' }, 131.39);
    expect(Kmmol).toBeCloseTo(4.3864, 4); // 4.3864 (mmol/g)(L/mmol)^0.62 to 5 digits, computed from the rule
    // all three give q = 18.2188 mg/g at c = 0.5 mg/L (computed: 28.0 · 0.5^0.62)
    expect(28.0 * Math.pow(0.5, 0.62)).toBeCloseTo(18.2188, 4);
    expect(Kug * Math.pow(500, 0.62) / 1000).toBeCloseTo(18.2188, 4); // µg/g → mg/g
    expect(Kmmol * Math.pow(0.5 / 131.39, 0.62) * 131.39).toBeCloseTo(18.2188, 4);
    // and back to the internal pair
    expect(freundlichKToInternal(Kug, 0.62, { q: 'ug/g', c: 'ug/L' })).toBeCloseTo(28.0, 10);
    expect(freundlichKToInternal(Kmmol, 0.62, { q: 'mmol/g', c: 'mmol/L' }, 131.39)).toBeCloseTo(28.0, 10);
  });

  it('µ, u and mixed spellings are the same unit', () => {
    const a = freundlichKToInternal(3, 0.4, { q: 'µg/mg', c: 'µg/L' });
    const b = freundlichKToInternal(3, 0.4, { q: 'ug/mg', c: 'ug/l' });
    expect(a).toBe(b);
  });

  it('property: any unit pair round-trips and predicts the same loading (Chen et al. 1999 rule)', () => {
    const qUnits = ['mg/g', 'ug/mg', 'ug/g', 'ng/mg', 'g/kg', 'mg/kg'];
    const cUnits = ['mg/L', 'ug/L', 'ng/L', 'g/m3', 'g/L'];
    const qf: Record<string, number> = { 'mg/g': 1, 'ug/mg': 1, 'ug/g': 1e-3, 'ng/mg': 1e-3, 'g/kg': 1, 'mg/kg': 1e-3 };
    const cf: Record<string, number> = { 'mg/L': 1, 'ug/L': 1e-3, 'ng/L': 1e-6, 'g/m3': 1, 'g/L': 1e3 };
    fc.assert(fc.property(
      fc.double({ min: 1e-3, max: 1e4, noNaN: true }), fc.double({ min: 0.05, max: 1.5, noNaN: true }),
      fc.constantFrom(...qUnits), fc.constantFrom(...cUnits), fc.double({ min: -6, max: 3, noNaN: true }),
      (K, b, qu, cu, lc) => {
        const Kint = freundlichKToInternal(K, b, { q: qu, c: cu });
        const back = freundlichKFromInternal(Kint, b, { q: qu, c: cu });
        expect(Math.abs(back / K - 1)).toBeLessThan(1e-12);
        // loading at a concentration given in the user's unit, computed both ways, in mg/g
        const cUser = Math.pow(10, lc);
        const qUserUnit = K * Math.pow(cUser, b);
        const qMgPerG = Kint * Math.pow(cUser * cf[cu]!, b);
        expect(Math.abs(qMgPerG / (qUserUnit * qf[qu]!) - 1)).toBeLessThan(1e-12);
      }), { numRuns: 300 });
  });

  it('rejects a molar unit without molar mass and a wrong kind of unit', () => {
    expect(() => freundlichKToInternal(1, 0.5, { q: 'mmol/g' })).toThrow(/molar_mass/);
    expect(() => freundlichKToInternal(1, 0.5, { q: 'mg/L' })).toThrow(/not a loading/);
    expect(() => freundlichKToInternal(1, 0.5, { c: 'mg/g' })).toThrow(/not a concentration/);
    expect(() => freundlichKToInternal(1, 0.5, { c: 'furlong' })).toThrow(/not a concentration/);
  });
});
