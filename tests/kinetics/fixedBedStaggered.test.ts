import { describe, expect, it } from 'vitest';
import { blendedOutlet, filterAges, runLengthForCompound, runLengthForIndicators, runAveragedRemoval, worstBlend, allowedCOverC0, PHASES_PER_CYCLE } from '../../src/kinetics/staggeredFilters.js';
import { gacCarbonUse } from '../../src/kinetics/staggeredFiltersCarbon.js';
import { curveAt, firstCrossing, type BreakthroughCurve } from '../../src/kinetics/breakthroughCurve.js';
import { ebctRatio, largeGrainDs, smallColumnEbctMin, largeBedEbctMin } from '../../src/kinetics/smallColumnScaling.js';
import { wilsonGeankoplisKf } from '../../src/kinetics/filmCorrelation.js';
import { waterProperties } from '../../src/kinetics/waterProperties.js';
import { InputError } from '../../src/core/errors.js';

/** A smooth invented breakthrough curve: logistic in BV around 20 000 BV, sampled every 250 BV. */
function logisticCurve(mid = 20000, width = 3000, end = 60000): BreakthroughCurve {
  const bv: number[] = [], c: number[] = [];
  for (let b = 0; b <= end; b += 250) { bv.push(b); c.push(1 / (1 + Math.exp(-(b - mid) / width))); }
  return { bedVolumes: bv, cOverC0: c };
}

/** Independent linear interpolation (recomputed here, not the library's). */
function interp(curve: BreakthroughCurve, x: number): number {
  const { bedVolumes: b, cOverC0: c } = curve;
  for (let i = 1; i < b.length; i++) if (x <= b[i]!) return c[i - 1]! + ((c[i]! - c[i - 1]!) * (x - b[i - 1]!)) / (b[i]! - b[i - 1]!);
  throw new Error('beyond the curve');
}

describe('staggered filters', () => {
  const curve = logisticCurve();
  it('the blend is the mean of the single filter outlet at the N ages (recomputed independently)', () => {
    for (const N of [1, 2, 3, 5]) for (const phase of [0.1, 0.5, 1]) {
      const T = 30000;
      let s = 0;
      for (let k = 0; k < N; k++) s += interp(curve, ((phase + k) / N) * T);
      expect(blendedOutlet(curve, N, T, phase)).toBeCloseTo(s / N, 12);
    }
    expect(filterAges(4, 40000, 1)).toEqual([10000, 20000, 30000, 40000]);
  });

  it('one filter: the run length is the first crossing of the allowed c/c0', () => {
    const r = runLengthForCompound(curve, 1, 0.2);
    expect(r.bedVolumes!).toBeCloseTo(firstCrossing(curve, 0.2)!, -1);
    expect(r.atCurveEnd).toBe(false);
  });

  it('N filters: the blend meets the goal at every phase at the run length and not just beyond it; more filters run longer', () => {
    let prev = 0;
    for (const N of [1, 2, 4, 6]) {
      const r = runLengthForCompound(curve, N, 0.2);
      const T = r.bedVolumes!;
      expect(worstBlend(curve, N, T)).toBeLessThanOrEqual(0.2 + 1e-12);
      expect(worstBlend(curve, N, T * (1 + 1e-4))).toBeGreaterThan(0.2);
      expect(T).toBeGreaterThan(prev);
      prev = T;
    }
  });

  it('run-averaged removal is 1 − (1/T)∫c/c0 dBV (mean of the blend over a cycle)', () => {
    const T = 30000, N = 3;
    let s = 0;
    const M = 3000;
    for (let k = 1; k <= M; k++) s += blendedOutlet(curve, N, T, k / M);
    expect(runAveragedRemoval(curve, T)).toBeCloseTo(1 - s / M, 3);
  });

  it('indicator rule: the run length at which the mean blended removal of 6 indicators (4 + 2) reaches the goal', () => {
    const ind = [
      { id: 'a', category: 1 as const, curve: logisticCurve(30000) }, { id: 'b', category: 1 as const, curve: logisticCurve(25000) },
      { id: 'c', category: 1 as const, curve: logisticCurve(35000) }, { id: 'd', category: 1 as const, curve: logisticCurve(28000) },
      { id: 'e', category: 2 as const, curve: logisticCurve(15000) }, { id: 'f', category: 2 as const, curve: logisticCurve(20000) },
    ];
    const r = runLengthForIndicators(ind, 3, 80);
    const T = r.bedVolumes!;
    const meanAt = (t: number) => {
      let worst = Infinity;
      for (let k = 1; k <= PHASES_PER_CYCLE; k++) {
        const m = ind.reduce((s, x) => s + 100 * (1 - blendedOutlet(x.curve, 3, t, k / PHASES_PER_CYCLE)), 0) / ind.length; // SR 814.201.231 Art. 3: arithmetic mean
        worst = Math.min(worst, m);
      }
      return worst;
    };
    expect(meanAt(T)).toBeGreaterThanOrEqual(80 - 1e-9);
    expect(meanAt(T * 1.001)).toBeLessThan(80);
    expect(() => runLengthForIndicators(ind.slice(0, 5), 3, 80)).toThrow(/not admissible/);
  });

  it('goals and bad inputs', () => {
    expect(allowedCOverC0({ removalFraction: 0.8 })).toBeCloseTo(0.2, 15);
    expect(allowedCOverC0({ limitMgPerL: 5e-4, c0MgPerL: 2e-3 })).toBeCloseTo(0.25, 15);
    expect(() => runLengthForCompound(curve, 0, 0.2)).toThrow(InputError);
    expect(() => runLengthForCompound(curve, 1.5, 0.2)).toThrow(InputError);
    expect(() => allowedCOverC0({ removalFraction: 1.2 })).toThrow(InputError);
    expect(() => curveAt(curve, 70000)).toThrow(/ends at 60000/);
    expect(runLengthForCompound(logisticCurve(1e6), 2, 0.2)).toEqual({ bedVolumes: 60000, atCurveEnd: true });
  });
});

describe('GAC carbon use (mass balances)', () => {
  it('CUR = ρ_bed/BV, yearly mass = CUR·Q·365 d, cost = mass·price', () => {
    const r = gacCarbonUse({ runBedVolumes: 15000, bedDensityKgPerM3: 450, flowM3PerD: 15000, ebctMin: 20, pricePerKg: 2.1 });
    expect(r.carbonUsageGPerM3).toBeCloseTo(30, 12); // 450 g/L / 15000 → 0.03 g/L = 30 g/m³
    expect(r.yearlyCarbonKg!).toBeCloseTo((30 * 15000 * 365) / 1000, 6);
    expect(r.yearlyCost!).toBeCloseTo(r.yearlyCarbonKg! * 2.1, 6);
    expect(r.costPerM3!).toBeCloseTo(0.063, 12);
    expect(r.filterLifeDays!).toBeCloseTo((15000 * 20) / 1440, 9);
    expect(() => gacCarbonUse({ runBedVolumes: 0, bedDensityKgPerM3: 450 })).toThrow(InputError);
  });
});

describe('small-column scaling (Crittenden, Berrigan & Hand 1986; Crittenden et al. 1991, from memory)', () => {
  it('EBCT ratio (d_SC/d_LC)^(2 − X) and Ds ratio (d_SC/d_LC)^X', () => {
    const pd = { smallGrainSize: 0.1, largeGrainSize: 1.0, scaling: 'proportional' as const };
    const cd = { ...pd, scaling: 'constant' as const };
    expect(ebctRatio(pd)).toBeCloseTo(0.1, 15);
    expect(ebctRatio(cd)).toBeCloseTo(0.01, 15);
    expect(smallColumnEbctMin(pd, 20)).toBeCloseTo(2, 12);
    expect(largeBedEbctMin(cd, 0.2)).toBeCloseTo(20, 12);
    expect(largeGrainDs(pd, 1e-15)).toBeCloseTo(1e-14, 25);
    expect(largeGrainDs(cd, 1e-15)).toBeCloseTo(1e-15, 25);
    expect(() => ebctRatio({ ...pd, scaling: 'linear' as never })).toThrow(InputError);
  });
});

describe('film coefficient (Wilson & Geankoplis 1966) and water properties', () => {
  it('water at the CRC table points and between them', () => {
    expect(waterProperties(10).viscosityPaS).toBeCloseTo(1.3059e-3, 9);
    expect(waterProperties(20).densityKgPerM3).toBeCloseTo(998.21, 6);
    const mid = waterProperties(12.5).viscosityPaS;
    expect(mid).toBeLessThan(1.3059e-3);
    expect(mid).toBeGreaterThan(1.1375e-3);
    expect(() => waterProperties(50)).toThrow(InputError);
  });
  it('Sh = (1.09/ε)·Re^(1/3)·Sc^(1/3) recomputed by hand; a warning outside 0.0016 < Re < 55', () => {
    const inp = { superficialVelocityMPerS: 2 / 1200, particleRadiusM: 0.5e-3, porosity: 0.4, dlM2PerS: 7e-10, viscosityPaS: 1.2e-3, densityKgPerM3: 999.5 };
    const re = (999.5 * (2 / 1200) * 1e-3) / 1.2e-3;
    const sc = 1.2e-3 / (999.5 * 7e-10);
    const kf = ((1.09 / 0.4) * Math.cbrt(re * sc) * 7e-10) / 1e-3;
    const r = wilsonGeankoplisKf(inp);
    expect(r.reynolds).toBeCloseTo(re, 12);
    expect(r.kfMPerS).toBeCloseTo(kf, 15);
    expect(r.warning).toBeUndefined();
    expect(wilsonGeankoplisKf({ ...inp, superficialVelocityMPerS: 0.1 }).warning).toMatch(/outside the range/);
    expect(() => wilsonGeankoplisKf({ ...inp, porosity: 1 })).toThrow(InputError);
  });
});

describe('staggered run against every goal', () => {
  it('the run is the shortest of the compound and indicator run lengths, and names what governs it', async () => {
    const { staggeredRun } = await import('../../src/kinetics/staggeredFiltersRun.js');
    const curves = { a: logisticCurve(30000), b: logisticCurve(25000), c: logisticCurve(35000), d: logisticCurve(28000), e: logisticCurve(15000), f: logisticCurve(20000) };
    const substances = [{ id: 'a', category: 1 as const }, { id: 'b', category: 1 as const }, { id: 'c', category: 1 as const }, { id: 'd', category: 1 as const }, { id: 'e', category: 2 as const }, { id: 'f', category: 2 as const }];
    const r = staggeredRun({ curves, goals: { b: 0.2, c: 0.2 }, indicator: { substances, goalPercent: 80 }, filters: 3 });
    const lb = runLengthForCompound(curves.b, 3, 0.2).bedVolumes!;
    const ind = runLengthForIndicators(substances.map((s) => ({ ...s, curve: curves[s.id as keyof typeof curves] })), 3, 80).bedVolumes!;
    expect(r.runBedVolumes).toBe(Math.min(lb, ind));
    expect(r.governedBy).toBe(lb < ind ? 'b' : 'indicator mean');
    expect(r.compounds.map((c) => c.id)).toEqual(['b', 'c']);
    const only = staggeredRun({ curves, goals: { e: 0.2 }, filters: 2 });
    expect(only.governedBy).toBe('e');
    expect(only.runBedVolumes).toBe(runLengthForCompound(curves.e, 2, 0.2).bedVolumes);
    expect(() => staggeredRun({ curves, goals: { z: 0.2 }, filters: 2 })).toThrow(/no breakthrough curve for "z"/);
    expect(() => staggeredRun({ curves, goals: {}, filters: 2 })).toThrow(InputError);
  });
});
