import { describe, expect, it } from 'vitest';
import { monteCarlo } from '../../src/uncertainty/monteCarlo.js';
import { parallelMonteCarlo, resolveWorkerEntry } from '../../src/uncertainty/parallelMonteCarlo.js';
import { compileDrawModel, sampleParameters } from '../../src/uncertainty/monteCarloDraw.js';
import { seriesCarbon, seriesSegments } from '../../src/design/doseTable.js';
import { doseForRemoval } from '../../src/design/doseForRemoval.js';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';

/** Dose (mg/L) for a removal goal by the dose search on the full mixture; +Infinity when unreachable. */
function doseOrInfinity(target: FreundlichComponent, background: readonly FreundlichComponent[], goal: number): number {
  try {
    return doseForRemoval(prepareMixture([target, ...background]), 0, goal).doseGPerL * 1000;
  } catch (e) {
    if (e instanceof InputError) return Infinity;
    throw e;
  }
}
import type { MonteCarloProblem } from '../../src/uncertainty/monteCarloProblem.js';
import { InputError } from '../../src/core/errors.js';
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';

/** Invented parameters (realistic magnitudes for a nitrified effluent): non-adsorbable part plus 4 fictive DOC components with 1/n = 0.2, two trace targets. */
function problem(sd = true): MonteCarloProblem {
  const r = (v: number) => (sd ? v : 0);
  return {
    targets: [
      { id: 'CBZ', K: 60, oneOverN: 0.3, c0MgPerL: 1e-4, removalGoal: 0.8, KRelSd: r(0.2), oneOverNRelSd: r(0.05) },
      { id: 'BTA', K: 25, oneOverN: 0.35, c0MgPerL: 5e-3, removalGoal: 0.8, KRelSd: r(0.2), oneOverNRelSd: r(0.05) },
    ],
    background: [
      { id: 'NA', K: 0, oneOverN: 1, fraction: 0.25, fractionRelSd: r(0.1) },
      { id: 'F1', K: 1, oneOverN: 0.2, fraction: 0.25, KRelSd: r(0.1), fractionRelSd: r(0.1) },
      { id: 'F2', K: 10, oneOverN: 0.2, fraction: 0.2, KRelSd: r(0.1), fractionRelSd: r(0.1) },
      { id: 'F3', K: 40, oneOverN: 0.2, fraction: 0.2, KRelSd: r(0.1), fractionRelSd: r(0.1) },
      { id: 'F4', K: 90, oneOverN: 0.2, fraction: 0.1, KRelSd: r(0.1), fractionRelSd: r(0.1) },
    ],
    docMgPerL: 8,
    docRelSd: r(0.1),
    uv254AbsorbancePerM: [1.0, 1.5, 2.5, 3.5, 4.5],
  };
}

const byKey = (r: ReturnType<typeof monteCarlo>, key: string) => r.quantities.find((q) => q.key === key)!;

describe('Monte Carlo', () => {
  it('gives the same percentiles for the same seed, and different ones for another seed', () => {
    const a = monteCarlo(problem(), { draws: 600, seed: 2024 });
    const b = monteCarlo(problem(), { draws: 600, seed: 2024 });
    const c = monteCarlo(problem(), { draws: 600, seed: 2025 });
    expect(a.quantities).toEqual(b.quantities);
    expect(byKey(c, 'governing_dose').p50).not.toBe(byKey(a, 'governing_dose').p50);
    const g = byKey(a, 'governing_dose');
    expect(g.p10).toBeLessThan(g.p50);
    expect(g.p50).toBeLessThan(g.p90);
    expect(a.governingShare.reduce((s, x) => s + x.share, 0)).toBeCloseTo(1, 12);
  });

  it('collapses to the point estimate with zero uncertainty (which equals a direct dose search)', () => {
    const r = monteCarlo(problem(false), { draws: 300, seed: 1 });
    for (const q of r.quantities) {
      expect(q.p10).toBe(q.pointEstimate);
      expect(q.p90).toBe(q.pointEstimate);
    }
    const p = problem(false);
    const bg = p.background.map((b) => ({ id: b.id, K: b.K, oneOverN: b.oneOverN, c0MgPerL: b.fraction * p.docMgPerL }));
    const direct = doseOrInfinity({ id: 'CBZ', K: 60, oneOverN: 0.3, c0MgPerL: 1e-4 }, bg, 0.8);
    expect(byKey(r, 'dose:CBZ').pointEstimate).toBeCloseTo(direct, 9);
  });

  it('converges: the median governing dose at 2,000 and 20,000 draws agree within 3 %', () => {
    // Sampling error of the median ≈ 1.25·σ/√N (Kendall & Stuart); with σ ≈ 30 % of the median,
    // 2,000 draws give ≈ 0.9 %: 3 % is more than 3 standard errors.
    const small = byKey(monteCarlo(problem(), { draws: 2000, seed: 99 }), 'governing_dose');
    const large = byKey(monteCarlo(problem(), { draws: 20000, seed: 7 }), 'governing_dose');
    expect(Math.abs(small.p50 / large.p50 - 1)).toBeLessThan(0.03);
    expect(Math.abs(small.p90 / large.p90 - 1)).toBeLessThan(0.05);
  }, 120_000);

  it('reports progress per chunk and keeps samples when asked', () => {
    const seen: number[] = [];
    const r = monteCarlo(problem(), { draws: 620, seed: 5, keepSamples: true, onProgress: (d) => seen.push(d) });
    expect(seen).toEqual([250, 500, 620]);
    expect(r.samples!['governing_dose']!.length).toBe(620);
  });

  it('counts draws whose goal is unreachable as +Infinity', () => {
    const p = problem(false);
    p.targets = [{ id: 'X', K: 0.001, oneOverN: 0.9, c0MgPerL: 1e-4, removalGoal: 0.99 }];
    const r = monteCarlo(p, { draws: 10, seed: 1 });
    expect(byKey(r, 'governing_dose').unreachableDraws).toBe(10);
    expect(byKey(r, 'governing_dose').p50).toBe(Infinity);
  });

  it('uses a covariance for named parameters', () => {
    const p = problem(false);
    p.covariance = { parameters: ['lnK:F3', 'fraction:F3'], matrix: [[0.04, -0.002], [-0.002, 0.0004]] };
    const model = compileDrawModel(p);
    const point = sampleParameters(model, undefined);
    expect(point.background.find((c) => c.id === 'F3')!.K).toBe(40);
    const r = monteCarlo(p, { draws: 500, seed: 3 });
    const g = byKey(r, 'governing_dose');
    expect(g.p90).toBeGreaterThan(g.p10);
  });

  it('rejects bad problems and options with InputError naming the field', () => {
    const bad = (mut: (p: MonteCarloProblem) => void, re: RegExp) => {
      const p = problem();
      mut(p);
      expect(() => monteCarlo(p, { draws: 10, seed: 1 })).toThrow(re);
    };
    bad((p) => { p.targets[0]!.removalGoal = 1.2; }, /targets\[0\]\.removalGoal/);
    bad((p) => { p.targets[0]!.KRelSd = -0.1; }, /targets\[0\]\.KRelSd/);
    bad((p) => { p.background[1]!.fraction = -1; }, /background\[1\]\.fraction/);
    bad((p) => { p.docMgPerL = 0; }, /docMgPerL/);
    bad((p) => { p.uv254AbsorbancePerM = [1, 2]; }, /uv254AbsorbancePerM/);
    bad((p) => { p.covariance = { parameters: ['lnK:ZZ'], matrix: [[0.1]] }; }, /unknown component id "ZZ"/);
    bad((p) => { p.covariance = { parameters: ['lnK:F1', 'lnK:F2'], matrix: [[1, 2], [2, 1]] }; }, /positive semi-definite/);
    bad((p) => { p.yearly = { docSeriesMgPerL: [5, -1], flowM3PerD: 1000, carbonPricePerKg: 2 }; }, /yearly\.docSeriesMgPerL\[1\]/);
    expect(() => monteCarlo(problem(), { draws: 0, seed: 1 })).toThrow(InputError);
    expect(() => monteCarlo(problem(), { draws: 10, seed: -3 })).toThrow(/seed/);
  });
});

describe('yearly cost from the dose table', () => {
  it('is within the table\'s tolerance (0.1 %) of exact daily dose searches; cost = mass × price', () => {
    const p = problem(false);
    // Invented year: DOC between 5 and 13 mg/L (effluent range, common practice), flows 8,000–14,000 m³/d.
    const days = 120;
    const doc = Array.from({ length: days }, (_, i) => 9 + 4 * Math.sin(i / 9) * Math.cos(i / 31));
    const flow = Array.from({ length: days }, (_, i) => 11000 + 3000 * Math.sin(i / 17));
    p.yearly = { docSeriesMgPerL: doc, flowM3PerD: flow, carbonPricePerKg: 2.5 };
    const r = monteCarlo(p, { draws: 1, seed: 1 });
    const bgAt = (d: number) => p.background.map((b) => ({ id: b.id, K: b.K, oneOverN: b.oneOverN, c0MgPerL: b.fraction * d }));
    const targets = p.targets.map((t) => ({ id: t.id, K: t.K, oneOverN: t.oneOverN, c0MgPerL: t.c0MgPerL }));
    let grams = 0;
    doc.forEach((d, i) => { grams += Math.max(...targets.map((t) => doseOrInfinity(t, bgAt(d), 0.8))) * flow[i]!; });
    const exact = (grams / 1000) * (365 / days);
    const approx = byKey(r, 'yearly_carbon').pointEstimate;
    // a 120-day series is annualised: × 365/120, and the label says so
    expect(byKey(r, 'yearly_carbon').label).toBe('yearly carbon mass (annualised from 120 days)');
    expect(Math.abs(approx / exact - 1)).toBeLessThan(1e-3);
    expect(byKey(r, 'yearly_cost').pointEstimate).toBeCloseTo(approx * 2.5, 6);
  }, 20000);

  it('computes the yearly mass from dose × flow (mg/L × m³/d = g/d), linear in the node doses', () => {
    // nodes at the series' own DOC values: no interpolation; 10 g/m³·1000 + 20·3000 = 70 kg over 2 days
    const seg = seriesSegments([5, 10], [5, 10], [1000, 3000]);
    const y = seriesCarbon(seg, [10, 20]);
    expect(y.totalKg).toBeCloseTo(70, 12);
    expect(y.annualised).toBe(true);
    expect(y.yearlyKg).toBeCloseTo(35 * 365, 9);
    // a day halfway between nodes takes the mean of the node doses (linear in DOC)
    expect(seriesCarbon(seriesSegments([5, 10], [7.5], [1000]), [10, 20]).totalKg).toBeCloseTo(15, 12);
    // a segment whose node has no dose leaves its days out
    expect(seriesCarbon(seg, [10, null]).daysWithDose).toBe(0);
  });
});

describe('parallel Monte Carlo', () => {
  it('gives percentiles identical to the in-thread run (workers from the TypeScript sources via tsx)', async () => {
    expect(resolveWorkerEntry()).toBeDefined();
    const serial = monteCarlo(problem(), { draws: 1100, seed: 77 });
    const par = await parallelMonteCarlo(problem(), { draws: 1100, seed: 77, workers: 2, force: true });
    expect(par.execution.mode).toBe('workers');
    expect(par.quantities).toEqual(serial.quantities);
    expect(par.governingShare).toEqual(serial.governingShare);
    const three = await parallelMonteCarlo(problem(), { draws: 1100, seed: 77, workers: 3, force: true });
    expect(three.quantities).toEqual(serial.quantities);
  }, 20000);

  it('runs in this thread below the threshold and rethrows worker input errors', async () => {
    const small = await parallelMonteCarlo(problem(), { draws: 100, seed: 1 });
    expect(small.execution.mode).toBe('in-thread');
    const p = problem();
    p.targets[0]!.removalGoal = 2;
    await expect(parallelMonteCarlo(p, { draws: 600, seed: 1, force: true })).rejects.toThrow(/removalGoal/);
  });
});

describe('parallel Monte Carlo from the compiled library', () => {
  const distModule = fileURLToPath(new URL('../../dist/uncertainty/parallelMonteCarlo.js', import.meta.url));
  const distWorker = fileURLToPath(new URL('../../dist/uncertainty/monteCarloWorker.js', import.meta.url));
  it.skipIf(!existsSync(distModule) || !existsSync(distWorker))('loads dist/…/monteCarloWorker.js and gives the in-thread percentiles (needs npm run build)', () => {
    const script = `import { parallelMonteCarlo } from ${JSON.stringify(pathToFileURL(distModule).href)};
      const r = await parallelMonteCarlo(JSON.parse(process.env.MC_PROBLEM), { draws: 1100, seed: 77, workers: 2, force: true });
      process.stdout.write(JSON.stringify({ mode: r.execution.mode, quantities: r.quantities }));`;
    const out = execFileSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', env: { ...process.env, MC_PROBLEM: JSON.stringify(problem()) } });
    const r = JSON.parse(out) as { mode: string; quantities: unknown };
    expect(r.mode).toBe('workers');
    expect(r.quantities).toEqual(monteCarlo(problem(), { draws: 1100, seed: 77 }).quantities);
  }, 20000);
});
