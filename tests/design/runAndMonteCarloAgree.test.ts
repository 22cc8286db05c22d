/**
 * The run and the Monte Carlo design a carbon with the same model: with every uncertainty zero,
 * each band collapses onto the run's own figure (and the printed point estimate is that figure).
 * Project: the invented demo (a year of DOC), with the per-compound removal goal lowered to 60 % so
 * that the indicator mean (goal 80 %) governs the required dose, plus two invented compounds: one whose goal (a limit
 * a hair below its feed concentration) is met below the smallest dose searched, and one so weakly
 * adsorbing that no dose up to 5 g/L meets its limit. Properties only; no value here is a check
 * value from outside the project.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { resolveUncertaintySettings, uncertaintyStep, withUncertainty } from '../../src/pipeline/uncertaintyStep.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';

let run: PipelineResult;
let mc: PipelineResult;

beforeAll(async () => {
  const input = loadProject(join(__dirname, '../../fixtures/demo/project.json'), { demo: true });
  const p = input.project;
  p.goals.removalPercent = 60;
  p.compounds.push(
    { ...p.compounds[2]!, id: 'EASY', name: 'invented: limit a hair below c0', c0MgPerL: 1e-3, limitMgPerL: 1e-3 * (1 - 1e-13), indicatorCategory: undefined as never },
    { ...p.compounds[2]!, id: 'WEAK', name: 'invented: weakly adsorbing', K: 0.01, oneOverN: 0.9, c0MgPerL: 1e-3, limitMgPerL: 1e-5, indicatorCategory: undefined as never },
  );
  for (const c of p.compounds.slice(-2)) { delete (c as { indicatorCategory?: unknown }).indicatorCategory; delete (c as { jarTests?: unknown }).jarTests; }
  for (const c of p.carbons) delete c.bedKinetics; // PAC designs are what this test compares; the GAC run length is not drawn
  run = runPipeline(input, { now: new Date('2026-01-01T00:00:00Z') });
  // zero uncertainty: no relative SDs and no fitted intervals on the background
  for (const c of run.background.background!.components) { delete c.fraction_ci95; delete c.K_ci95; }
  const settings = resolveUncertaintySettings({ ...p.uncertainty!, KRelSd: 0, oneOverNRelSd: 0, docRelSd: 0, fractionRelSd: 0, backgroundKRelSd: 0 }, { draws: 12, seed: 3 })!;
  mc = withUncertainty(run, await uncertaintyStep(run, input, settings, { workers: 0 }));
}, 120_000);

describe('run and Monte Carlo agree with zero uncertainty', () => {
  it('the project has what the check needs: a series, an indicator-governed carbon, a goal met below the smallest dose, an unreachable goal', () => {
    const pac = run.carbons.filter((c) => c.required);
    expect(run.series!.dates.length).toBe(365);
    expect(pac.some((c) => c.required!.governedBy === 'indicator mean')).toBe(true);
    for (const c of pac) {
      expect(c.required!.compounds.find((d) => d.compoundId === 'EASY')!.status).toBe('met below the smallest dose');
      expect(c.required!.compounds.find((d) => d.compoundId === 'WEAK')!.status).toBe('unreachable');
    }
  });

  it('every band collapses onto the run\'s figure; the point estimate is the run\'s figure itself', () => {
    for (const cr of mc.carbons.filter((c) => c.required)) {
      const u = cr.uncertainty!;
      const q = (k: string) => u.result.quantities.find((x) => x.key === k)!;
      const req = cr.required!;
      const figures: Record<string, number> = {
        governing_dose: req.doseMgPerL!,
        indicator_dose: req.indicator!.doseMgPerL!,
        doc_reduction: req.surrogate!.docReduction,
        uv254_setpoint: req.surrogate!.uv254Reduction!,
        cost_per_m3: req.costPerM3!,
        yearly_carbon: cr.yearly!.carbonKg,
        yearly_cost: cr.yearly!.cost,
      };
      req.compounds.forEach((d) => { figures[`dose:${d.compoundId}`] = d.doseMgPerL ?? Infinity; });
      expect(figures['dose:EASY']).toBe(0);
      expect(figures['dose:WEAK']).toBe(Infinity);
      expect(Object.keys(figures).sort()).toEqual(u.result.quantities.map((x) => x.key).sort());
      for (const [key, value] of Object.entries(figures)) {
        const b = q(key);
        expect(b.pointEstimate, key).toBe(value);
        expect(b.p10, key).toBe(b.p90);
        expect(b.p50, key).toBe(b.p90);
        if (value === Infinity || value === 0) expect(b.p50, key).toBe(value);
        else expect(Math.abs(b.p50 / value - 1), key).toBeLessThan(1e-9);
      }
      expect(q('dose:WEAK').unreachableDraws).toBe(12);
      // the governing goal of every draw is the run's
      const share = u.result.governingShare.find((s) => s.id === (req.governedBy === 'indicator mean' ? 'indicator mean' : req.governing!.compoundId))!;
      expect(share.share).toBe(1);
    }
  });

  it('a year of days is not annualised; the labels say "yearly" in the run and the Monte Carlo alike', () => {
    const cr = mc.carbons[0]!;
    expect(cr.yearly!.annualised).toBe(false);
    expect(cr.yearly!.basis).toBe('DOC series');
    expect(cr.uncertainty!.result.quantities.find((x) => x.key === 'yearly_carbon')!.label).toBe('yearly carbon mass');
  });
});

describe('annualised yearly figures are labelled the same way in the run and the Monte Carlo', () => {
  it('a 10-day series: run basis and Monte Carlo labels both say "annualised from 10 days"; the point estimate is the run\'s figure', async () => {
    const input = loadProject(join(__dirname, '../../fixtures/project/background-file/project.json'));
    const r = runPipeline(input);
    const cr = r.carbons.find((c) => c.daily)!;
    expect(r.series!.dates.length).toBe(10);
    expect(cr.yearly!.basis).toBe('DOC series (annualised from 10 days)');
    const settings = resolveUncertaintySettings(undefined, { draws: 3, seed: 1 })!;
    const out = withUncertainty(r, await uncertaintyStep(r, input, settings, { workers: 0 }));
    const u = out.carbons.find((c) => c.carbon.name === cr.carbon.name)!.uncertainty!;
    const y = u.result.quantities.find((q) => q.key === 'yearly_carbon')!;
    expect(y.label).toBe('yearly carbon mass (annualised from 10 days)');
    expect(y.pointEstimate).toBe(cr.yearly!.carbonKg);
  });
});
