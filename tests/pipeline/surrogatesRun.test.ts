/**
 * Surrogates in the run (capability 11) on the invented demo: the predicted UV254 reduction is
 * the fitted UV254 isotherm, and every set-point re-solved gives its compound's goal. The demo
 * data are invented, so every check is a property, with the source of the
 * relation it checks.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { surrogatesAtDose } from '../../src/pipeline/surrogateStep.js';
import { prepareSystem } from '../../src/design/competitionSystem.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { doseForUv254Reduction } from '../../src/design/uv254SetPoint.js';
import { predictUv254Reduction } from '../../src/fractionation/backgroundPrediction.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';

let r: PipelineResult;
beforeAll(() => {
  const input = loadProject(join(__dirname, '../../fixtures/demo/project.json'), { demo: true });
  r = runPipeline(input, { now: new Date('2026-01-01T00:00:00Z') });
});

const removalAt = (sys: Parameters<typeof prepareSystem>[0], doc: number, dose: number) => 1 - solveBatchPrepared(prepareSystem(sys, doc), dose / 1000).cMgPerL[0]! / sys.c0MgPerL;

describe('predicted DOC and UV254 reduction in the run', () => {
  it('reproduces the fitted UV254 isotherm at every isotherm dose (Beer–Lambert additivity over the fictive components)', () => {
    const fr = r.background.fractionation!;
    const s = r.carbons[0]!.surrogates!; // carbon A is the reference carbon (K factor 1) the isotherm was measured with
    expect(s.hasUv254).toBe(true);
    const uv0 = s.curve.uv254_0PerM!;
    expect(uv0).toBeCloseTo(fr.uv254!.uv254_0_per_m, 9);
    let checked = 0;
    for (const row of fr.residuals) {
      const dose = row.dose_mg_per_L!;
      if (!(dose > 0) || row.uv254_predicted_per_m === undefined) continue;
      const red = surrogatesAtDose(s.model, dose).uv254Reduction!;
      // the fit's own prediction at the same dose, to solver precision
      expect(uv0 * (1 - red)).toBeCloseTo(row.uv254_predicted_per_m, 6);
      // and the measured isotherm within the fit's error (3 × RMSE of the UV254 fit: common practice)
      expect(Math.abs(uv0 * (1 - red) - row.uv254_measured_per_m!)).toBeLessThan(3 * fr.uv254!.rmse_per_m + 1e-9);
      checked++;
    }
    expect(checked).toBe(7);
  });

  it('the curve in the run equals the background prediction at each sweep dose, rising with the dose', () => {
    const bgFile = r.background.background!;
    const pts = r.carbons[0]!.surrogates!.curve.points;
    expect(pts.length).toBe(r.project.goals.sweep.points);
    for (const p of pts) expect(p.uv254Reduction!).toBeCloseTo(predictUv254Reduction(bgFile, p.doseMgPerL), 9);
    for (let k = 1; k < pts.length; k++) {
      expect(pts[k]!.uv254Reduction!).toBeGreaterThan(pts[k - 1]!.uv254Reduction!);
      expect(pts[k]!.docReduction).toBeGreaterThan(pts[k - 1]!.docReduction);
    }
  });

  it('on a carbon with K factor f the reductions at dose D equal the reference carbon at f·D (q = f·q_ref in c0 = c + D·q)', () => {
    const a = r.carbons[0]!.surrogates!;
    const b = r.carbons[1]!.surrogates!;
    const f = r.carbons[1]!.carbon.kFactor;
    for (const d of [3, 12, 40]) {
      expect(surrogatesAtDose(b.model, d).uv254Reduction!).toBeCloseTo(surrogatesAtDose(a.model, f * d).uv254Reduction!, 9);
      expect(surrogatesAtDose(b.model, d).docReduction).toBeCloseTo(surrogatesAtDose(a.model, f * d).docReduction, 9);
    }
  });

  it('removal beside the reductions is the removal curve of the dose table', () => {
    const cr = r.carbons[0]!;
    cr.surrogates!.curve.points.forEach((p, k) => {
      for (const c of r.project.compounds) expect(100 * p.removal[c.id]!).toBeCloseTo(cr.curves!.removalPercent[c.id]![k]!, 12);
    });
  });
});

describe('UV254-reduction set-points', () => {
  it('each set-point re-solved (dose for that UV254 reduction, then batch IAST) gives the compound\'s goal', () => {
    const doc = r.project.site.docMgPerL;
    for (const cr of r.carbons.filter((c) => c.surrogates)) {
      const s = cr.surrogates!;
      s.setPoints.forEach((sp, i) => {
        expect(sp.status).toBe('met');
        const dose = doseForUv254Reduction(s.model, sp.uv254Reduction!);
        expect(Math.abs(dose / sp.doseMgPerL! - 1)).toBeLessThan(1e-7);
        expect(Math.abs(removalAt(cr.systems[i]!, doc, dose) - sp.removalGoal)).toBeLessThan(1e-6);
      });
    }
  });

  it('the governing set-point is that of the compound needing the most carbon; at the required dose it is the dose applied', () => {
    for (const cr of r.carbons.filter((c) => c.surrogates)) {
      const s = cr.surrogates!;
      expect(s.governing!.compoundId).toBe(cr.required!.governing!.compoundId);
      const maxUv = Math.max(...s.setPoints.map((x) => x.uv254Reduction!));
      expect(s.governing!.uv254Reduction).toBe(maxUv); // UV254 reduction rises with the dose
      expect(s.atRequiredDose!.doseMgPerL).toBe(cr.required!.doseMgPerL);
      expect(s.atRequiredDose!.uv254Reduction!).toBeGreaterThanOrEqual(maxUv - 1e-12);
    }
  });
});
