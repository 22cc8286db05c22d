import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gacEstimate, GAC_UPPER_BOUND_CAUTION } from '../../src/gac/gacEstimate.js';
import type { FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { InputError } from '../../src/core/errors.js';

/** Invented background (non-adsorbable + 3 fictive components, common 1/n = 0.2). */
function background(docMgPerL: number): FreundlichComponent[] {
  return [
    { id: 'NA', K: 0, oneOverN: 1, c0MgPerL: 0.25 * docMgPerL },
    { id: 'F1', K: 2, oneOverN: 0.2, c0MgPerL: 0.35 * docMgPerL },
    { id: 'F2', K: 15, oneOverN: 0.2, c0MgPerL: 0.25 * docMgPerL },
    { id: 'F3', K: 60, oneOverN: 0.2, c0MgPerL: 0.15 * docMgPerL },
  ];
}

describe('GAC equilibrium estimate', () => {
  it('single solute: BV = ρ·K·c0^(1/n)/c0 (Freundlich closed form); TCE on bituminous GAC', () => {
    // K = 28.0 (mg/g)(L/mg)^0.62, 1/n = 0.62: Love et al. 1983 as tabulated in Hendricks, Water
    // Treatment Unit Processes (docs/references.md). c0 = 0.5 mg/L → q = 28.0 · 0.5^0.62 = 18.2188 mg/g (computed).
    const tce = { id: 'TCE', K: 28.0, oneOverN: 0.62, c0MgPerL: 0.5 };
    const r = gacEstimate({ targets: [tce], background: [{ id: 'NA', K: 0, oneOverN: 1, c0MgPerL: 5 }], bedDensityKgPerM3: 450, ebctMin: 15, flowM3PerD: 10000 });
    const t = r.targets[0]!;
    expect(t.qCompetitiveMgPerG).toBeCloseTo(18.2188, 3);
    expect(t.qSingleMgPerG).toBeCloseTo(18.2188, 3);
    const bv = (450 * 28.0 * Math.pow(0.5, 0.62)) / 0.5; // recomputed independently
    expect(t.bedVolumes).toBeCloseTo(bv, 8);
    // CUR = c0/q g/L = 1000·c0/q g/m³; equals 1000·ρ/BV
    expect(t.carbonUsageGPerM3).toBeCloseTo((0.5 / (28.0 * Math.pow(0.5, 0.62))) * 1000, 10);
    expect(t.carbonUsageGPerM3).toBeCloseTo((1000 * 450) / bv, 9);
    expect(t.lifeDays).toBeCloseTo((bv * 15) / 1440, 9); // BV × EBCT
    expect(r.bedVolumeM3).toBeCloseTo((15 / 1440) * 10000, 9);
    expect(r.bedCarbonTonnes).toBeCloseTo(r.bedVolumeM3! * 0.45, 9);
    expect(t.carbonTonnesPerYear).toBeCloseTo((t.carbonUsageGPerM3 * 10000 * 365) / 1e6, 9);
    expect(r.upperBound).toBe(true);
    expect(r.caution).toBe(GAC_UPPER_BOUND_CAUTION);
    expect(r.caution).toMatch(/preloading by DOC/);
  });

  it('with one common exponent equals the Sheindorf–Rebhun–Sheintuch closed form (1981)', () => {
    // q_i = c_i·K_i^(1/β)·(Σ_j c_j K_j^(1/β))^(β − 1), β = 0.2 for target and background (Sheindorf et al. 1981)
    const target = { id: 'T', K: 30, oneOverN: 0.2, c0MgPerL: 2e-4 };
    const bg = background(8);
    const r = gacEstimate({ targets: [target], background: bg, bedDensityKgPerM3: 480 });
    const beta = 0.2;
    const all = [target, ...bg].filter((c) => c.K > 0);
    const S = all.reduce((s, c) => s + c.c0MgPerL * Math.pow(c.K, 1 / beta), 0);
    const qT = target.c0MgPerL * Math.pow(target.K, 1 / beta) * Math.pow(S, beta - 1);
    expect(r.targets[0]!.qCompetitiveMgPerG / qT).toBeCloseTo(1, 10);
    expect(r.targets[0]!.bedVolumes / ((480 * qT) / target.c0MgPerL)).toBeCloseTo(1, 10);
  });

  it('bed volumes fall as the DOC rises', () => {
    const target = { id: 'CBZ', K: 60, oneOverN: 0.3, c0MgPerL: 1e-4 };
    const bvs = [2, 5, 8, 12, 15].map((doc) => gacEstimate({ targets: [target], background: background(doc), bedDensityKgPerM3: 450 }).targets[0]!.bedVolumes);
    for (let i = 1; i < bvs.length; i++) expect(bvs[i]!).toBeLessThan(bvs[i - 1]!);
  });

  it('never exceeds the single-solute estimate (property)', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.5, max: 500, noNaN: true }), fc.double({ min: 0.1, max: 0.9, noNaN: true }),
      fc.double({ min: 1e-6, max: 1e-2, noNaN: true }), fc.double({ min: 1, max: 20, noNaN: true }),
      fc.double({ min: 0.1, max: 0.6, noNaN: true }),
      (K, n, c0, doc, nBg) => {
        const bg = background(doc).map((c) => (c.K > 0 ? { ...c, oneOverN: nBg } : c));
        const t = gacEstimate({ targets: [{ id: 'T', K, oneOverN: n, c0MgPerL: c0 }], background: bg, bedDensityKgPerM3: 450 }).targets[0]!;
        return t.bedVolumes <= t.bedVolumesSingleSolute * (1 + 1e-12) && t.carbonUsageGPerM3 >= t.carbonUsageSingleSoluteGPerM3 * (1 - 1e-12);
      },
    ), { numRuns: 200 });
  });

  it('names the governing target (fewest bed volumes)', () => {
    const r = gacEstimate({
      targets: [{ id: 'strong', K: 200, oneOverN: 0.3, c0MgPerL: 1e-4 }, { id: 'weak', K: 5, oneOverN: 0.4, c0MgPerL: 1e-4 }],
      background: background(8), bedDensityKgPerM3: 450,
    });
    expect(r.governing).toBe('weak');
  });

  it('rejects bad inputs with InputError naming the field', () => {
    const base = { targets: [{ id: 'T', K: 10, oneOverN: 0.3, c0MgPerL: 1e-4 }], background: background(8), bedDensityKgPerM3: 450 };
    expect(() => gacEstimate({ ...base, bedDensityKgPerM3: 0 })).toThrow(/bedDensityKgPerM3/);
    expect(() => gacEstimate({ ...base, ebctMin: -5 })).toThrow(/ebctMin/);
    expect(() => gacEstimate({ ...base, flowM3PerD: NaN })).toThrow(/flowM3PerD/);
    expect(() => gacEstimate({ ...base, targets: [{ id: 'T', K: 0, oneOverN: 1, c0MgPerL: 1e-4 }] })).toThrow(/targets\[0\]\.K/);
    expect(() => gacEstimate({ ...base, targets: [{ id: 'T', K: 10, oneOverN: 0.3, c0MgPerL: 0 }] })).toThrow(InputError);
    expect(() => gacEstimate({ ...base, targets: [] })).toThrow(/at least one target/);
  });
});
