/**
 * The GAC step in the run (capability 12) on the invented fixture project surrogates-gac-mc.
 *
 * Independent recomputation: the compound T20 has the fictive components' exponent (1/n = 0.2),
 * so with a common exponent β its loading in equilibrium with the feed has the closed form
 *   q_i = c_i·K_i^(1/β)·(Σ_j c_j·K_j^(1/β))^(β − 1)
 * (Sheindorf, Rebhun & Sheintuch, J. Colloid Interface Sci. 1981), and
 * BV = ρ_bed·q/c0, CUR = c0/q (mass balance of an ideal saturated column).
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { backgroundComponents } from '../../src/fractionation/backgroundPrediction.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';

const PROJECT = join(__dirname, '../../fixtures/project/surrogates-gac-mc/project.json');

function runAtDoc(docMgPerL?: number): PipelineResult {
  const input = loadProject(PROJECT);
  if (docMgPerL !== undefined) input.project.site.docMgPerL = docMgPerL;
  return runPipeline(input);
}

describe('GAC estimate in the run', () => {
  const r = runAtDoc();
  const gac = r.carbons.find((c) => c.carbon.type === 'GAC')!.gac!;

  it('bed volumes equal ρ_bed·q/c0 with q from the Sheindorf–Rebhun–Sheintuch closed form (to 1e-8)', () => {
    const t = gac.estimate.targets.find((x) => x.id === 'T20')!;
    const comp = r.project.compounds.find((c) => c.id === 'T20')!;
    const beta = 0.2;
    const bg = backgroundComponents(r.background.background!, r.project.site.docMgPerL).filter((c) => c.K > 0);
    const sum = comp.c0MgPerL * Math.pow(comp.K, 1 / beta) + bg.reduce((s, c) => s + c.c0MgPerL * Math.pow(c.K, 1 / beta), 0);
    const q = comp.c0MgPerL * Math.pow(comp.K, 1 / beta) * Math.pow(sum, beta - 1);
    expect(t.qCompetitiveMgPerG / q - 1).toBeCloseTo(0, 8);
    expect(t.bedVolumes / ((450 * q) / comp.c0MgPerL) - 1).toBeCloseTo(0, 8);
    expect(t.carbonUsageGPerM3 / ((comp.c0MgPerL / q) * 1000) - 1).toBeCloseTo(0, 8);
    expect(t.lifeDays! / (t.bedVolumes * 20 / 1440) - 1).toBeCloseTo(0, 12); // life = BV·EBCT
  });

  it('is never above the single-solute estimate, and the governing compound has the fewest bed volumes', () => {
    for (const t of gac.estimate.targets) {
      expect(t.bedVolumes).toBeLessThanOrEqual(t.bedVolumesSingleSolute);
      const comp = r.project.compounds.find((c) => c.id === t.id)!;
      expect(t.qSingleMgPerG).toBeCloseTo(comp.K * Math.pow(comp.c0MgPerL, comp.oneOverN), 12); // Freundlich
    }
    expect(gac.governing.bedVolumes).toBe(Math.min(...gac.estimate.targets.map((t) => t.bedVolumes)));
    expect(gac.estimate.upperBound).toBe(true);
    expect(r.warnings.join('\n')).toMatch(/a reference and not a bound/); // GAC_UPPER_BOUND_CAUTION: the estimate is not always a bound
  });

  it('falls as the DOC rises (more competition), for every compound', () => {
    const bv = [6, 8, 10].map((doc) => runAtDoc(doc).carbons[1]!.gac!.estimate.targets.map((t) => t.bedVolumes));
    for (let i = 0; i < bv[0]!.length; i++) {
      expect(bv[1]![i]!).toBeLessThan(bv[0]![i]!);
      expect(bv[2]![i]!).toBeLessThan(bv[1]![i]!);
    }
  });
});
