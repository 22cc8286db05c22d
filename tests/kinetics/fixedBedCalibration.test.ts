import { describe, expect, it } from 'vitest';
import { simulateFixedBed } from '../../src/kinetics/fixedBed.js';
import { fitColumn } from '../../src/calibration/columnFit.js';
import { readBreakthroughData } from '../../src/calibration/breakthroughData.js';
import { seededRng } from '../../src/uncertainty/prng.js';
import { NormalSampler } from '../../src/uncertainty/distributions.js';
import { InputError } from '../../src/core/errors.js';
import { BED, TARGET, background } from './fixedBedCases.js';

const data = (bvs: number[], c: number[]) => ({ rows: bvs.map((_, k) => k + 2), bedVolumes: bvs, cOverC0: c });

describe('column calibration: Ds recovery from model-generated breakthrough data', () => {
  it('noise-free data in the site water: Ds recovered within 1e-3 relative', () => {
    const grid = { cells: 12, interiorPoints: 3 }; // data and fit on the same grid: this checks the fitter
    const truthDs = 1.7e-14;
    const target = { ...TARGET, K: 110, dsM2PerS: truthDs };
    const bvs = Array.from({ length: 14 }, (_, k) => 8000 + 2500 * k);
    const sim = simulateFixedBed({ components: [...background(4), target], bed: BED }, { toBedVolumes: bvs[bvs.length - 1]!, outputBedVolumes: bvs, ...grid });
    const c = sim.components[3]!.cOverC0.slice(1);
    expect(Math.max(...c)).toBeGreaterThan(0.5); // the data show the breakthrough
    const r = fitColumn({ data: data(bvs, c), target: { ...target, dsM2PerS: undefined }, background: background(4), bed: BED, grid });
    expect(Math.abs(r.parameters.Ds_m2_per_s / truthDs - 1)).toBeLessThan(1e-3);
    expect(r.fit.converged).toBe(true);
    expect(r.fit.rmse).toBeLessThan(1e-4);
  });

  it('noise-free data in the site water, Ds and a factor on kf: both recovered within 1e-2 relative', () => {
    const grid = { cells: 12, interiorPoints: 3 }; // data and fit on the same grid: this checks the fitter (trace evaluations, two parameters)
    const truthDs = 1.7e-14;
    const target = { ...TARGET, K: 110, dsM2PerS: truthDs };
    const bvs = Array.from({ length: 14 }, (_, k) => 8000 + 2500 * k);
    const sim = simulateFixedBed({ components: [...background(4), { ...target, kfMPerS: 1.5 * TARGET.kfMPerS! }], bed: BED }, { toBedVolumes: bvs[bvs.length - 1]!, outputBedVolumes: bvs, ...grid });
    const c = sim.components[3]!.cOverC0.slice(1);
    const r = fitColumn({ data: data(bvs, c), target: { ...target, dsM2PerS: undefined }, background: background(4), bed: BED, grid, fitKfFactor: true, startDsM2PerS: 1e-14 });
    expect(Math.abs(r.parameters.Ds_m2_per_s / truthDs - 1)).toBeLessThan(1e-2);
    expect(Math.abs(r.parameters.kf_factor! / 1.5 - 1)).toBeLessThan(1e-2);
  });

  it('3 % noise: the 95 % interval covers the true Ds in at least 9 of 12 seeded trials', () => {
    // Noise: c/c0 + N(0, 0.03²), i.e. 3 % of c0, independent. With a true coverage of 95 % the
    // number covered is Binomial(12, 0.95); P(X ≤ 8) = 0.0022 (computed from the binomial
    // distribution), so fewer than 9 would reject 95 % coverage at the 0.3 % level. The trial
    // count is kept small so that the suite stays fast.
    const grid = { cells: 12, interiorPoints: 3 };
    const truthDs = 5e-14;
    const comp = { id: 'S', c0MgPerL: 0.5, K: 40, oneOverN: 0.3, dsM2PerS: truthDs, kfMPerS: 3e-5 };
    const bvs = Array.from({ length: 15 }, (_, k) => 14000 + 2000 * k);
    const sim = simulateFixedBed({ components: [comp], bed: BED }, { toBedVolumes: bvs[bvs.length - 1]!, outputBedVolumes: bvs, ...grid });
    const clean = sim.components[0]!.cOverC0.slice(1);
    expect(clean[0]!).toBeLessThan(0.1);
    expect(clean[clean.length - 1]!).toBeGreaterThan(0.9);
    const normal = new NormalSampler(seededRng(20261202));
    let covered = 0;
    const trials = 12;
    for (let t = 0; t < trials; t++) {
      const noisy = clean.map((v) => Math.min(1.2, Math.max(0, v + 0.03 * normal.next())));
      const r = fitColumn({ data: data(bvs, noisy), target: { ...comp, dsM2PerS: undefined }, background: [], bed: BED, grid, startDsM2PerS: 1.5 * truthDs });
      const ci = r.ci95.Ds_m2_per_s!;
      expect(ci[0]).toBeLessThan(r.parameters.Ds_m2_per_s);
      expect(ci[1]).toBeGreaterThan(r.parameters.Ds_m2_per_s);
      if (ci[0] <= truthDs && truthDs <= ci[1]) covered++;
    }
    expect(covered).toBeGreaterThanOrEqual(9);
  });
});

describe('breakthrough data', () => {
  it('reads c/c0 in % or fractions, and c with C0', () => {
    const a = readBreakthroughData('bed volumes (-),c/c0 (%)\n1000,5\n2000,12.5\n');
    expect(a.cOverC0).toEqual([0.05, 0.125]);
    const b = readBreakthroughData('BV (-),c (ng/L),C0 (ng/L)\n1000,20,400\n2000,100,400\n');
    expect(b.cOverC0[1]).toBeCloseTo(0.25, 15);
    expect(b.c0MgPerL).toBeCloseTo(4e-4, 15);
    const c = readBreakthroughData('BV (-),c (ug/L)\n1000,0.1\n2000,0.3\n', { c0MgPerL: 1e-3 });
    expect(c.cOverC0[0]).toBeCloseTo(0.1, 12);
    expect(c.cOverC0[1]).toBeCloseTo(0.3, 12);
  });
  it('names file, row and column of bad rows', () => {
    expect(() => readBreakthroughData('bed volumes (-),c/c0 (-)\n1000,0.1\n900,0.2\n', { file: 'p.csv' })).toThrow(/p\.csv, row 3, column "bed volumes \(-\)": bed volumes not increasing/);
    expect(() => readBreakthroughData('bed volumes (-),c/c0 (-)\n1000,0.1\n2000,1.3\n', { file: 'p.csv' })).toThrow(/row 3, column "c\/c0 \(-\)": c\/c0 = 1.3 is outside 0–1.2/);
    expect(() => readBreakthroughData('bed volumes (-),c (ng/L)\n1000,3\n2000,5\n', { file: 'p.csv' })).toThrow(/without C0/);
    expect(() => readBreakthroughData('bed volumes (-),c/c0 (-)\n0,0.1\n2000,0.2\n')).toThrow(InputError);
  });
});
