/**
 * The merged dose search returns the doses of the searches it replaced (within 1e-10, relative):
 * fixtures/design/dose-baseline.json was written by scripts/recordDoseBaseline.ts from the old
 * searches before they were merged. Each search solves to |Δ ln D| ≤ 1e-12, so two correct
 * searches from different brackets agree to about 2e-12; 1e-10 leaves room for the IAST solver's
 * own tolerance. These are regression checks against the project's previous figures (not
 * outside references); the outside checks of the dose are in doseSearch.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { fileURLToPath } from 'node:url';
import { doseForRemoval } from '../../src/design/doseForRemoval.js';
import { designDose } from '../../src/design/designDose.js';
import { loadProject } from '../../src/io/loadProject.js';
import { designProblem, runPipeline } from '../../src/pipeline/runPipeline.js';
import { carbonModel } from '../../src/design/carbonModel.js';
import { sharedDemoPipeline } from '../helpers/sharedDemoPipeline.js';

interface Baseline {
  random: Array<{ components: FreundlichComponent[]; removalFraction: number; doseGPerL: number | null }>;
}
const baseline = JSON.parse(readFileSync(new URL('../../fixtures/design/dose-baseline.json', import.meta.url), 'utf8')) as Baseline;

describe('merged dose search against the stored doses', () => {
  it('the 300 random problems of the property test: same doses within 1e-10, same unreachable cases', () => {
    expect(baseline.random).toHaveLength(300);
    let compared = 0;
    for (const p of baseline.random) {
      const pm = prepareMixture(p.components);
      if (p.doseGPerL === null) {
        expect(() => doseForRemoval(pm, p.components.length - 1, p.removalFraction)).toThrow(/not reached by any dose up to 5000 mg\/L/);
        continue;
      }
      const d = doseForRemoval(pm, p.components.length - 1, p.removalFraction).doseGPerL;
      expect(Math.abs(d / p.doseGPerL - 1)).toBeLessThan(1e-10);
      compared++;
    }
    expect(compared).toBe(292);
  });
});

interface BaselineRun {
  project: string;
  carbons: Array<{
    carbon: string;
    compounds: Array<{ id: string; status: string; doseMgPerL: number | null }>;
    indicatorDoseMgPerL: number | null;
    requiredDoseMgPerL: number | null;
    governedBy: string;
    daily: Array<[number, number | null, string]> | null;
  }>;
}
const runs = (JSON.parse(readFileSync(new URL('../../fixtures/design/dose-baseline.json', import.meta.url), 'utf8')) as { runs: BaselineRun[] }).runs;
const rel = (a: number, b: number) => Math.abs(a / b - 1);
const oldStatus: Record<string, string> = { ok: 'met', 'no-carbon-needed': 'met without carbon', unreachable: 'unreachable' };

describe('the design layer against the doses stored from the old pipeline', () => {
  for (const run of runs) {
    it(`${run.project}: compound, indicator and required doses within 1e-10; exact daily designs within 1e-10; the run's interpolated days within the table's tolerance`, () => {
      // the demo is the worker's shared plain demo run (the same input; its date is not a result)
      const res = run.project === 'fixtures/demo/project.json' ? sharedDemoPipeline() : runPipeline(loadProject(fileURLToPath(new URL(`../../${run.project}`, import.meta.url))));
      for (const old of run.carbons) {
        const cr = res.carbons.find((c) => c.carbon.name === old.carbon)!;
        const req = cr.required!;
        old.compounds.forEach((oc, i) => {
          const nc = req.compounds[i]!;
          expect(nc.compoundId).toBe(oc.id);
          expect(nc.status).toBe(oldStatus[oc.status]);
          if (oc.doseMgPerL === null) expect(nc.doseMgPerL).toBeNull();
          else if (oc.doseMgPerL === 0) expect(nc.doseMgPerL).toBe(0);
          else expect(rel(nc.doseMgPerL!, oc.doseMgPerL)).toBeLessThan(1e-10);
        });
        if (old.indicatorDoseMgPerL === null) expect(req.indicator?.doseMgPerL ?? null).toBeNull();
        else expect(rel(req.indicator!.doseMgPerL!, old.indicatorDoseMgPerL)).toBeLessThan(1e-10);
        expect(rel(req.doseMgPerL!, old.requiredDoseMgPerL!)).toBeLessThan(1e-10);
        expect(req.governedBy).toBe(old.governedBy);
        if (!old.daily) continue;
        // exact designs at every distinct DOC of the series (the search the table's nodes use)
        const model = carbonModel(cr.systems, res.project.site.docMgPerL);
        const problem = designProblem(res.project, cr.carbon, res.project.compounds.map((c) => res.goals[c.id]!), res.background);
        const byDoc = new Map<number, [number | null, string]>();
        for (const [doc, dose, gov] of old.daily) byDoc.set(doc, [dose, gov]);
        for (const [doc, [dose, gov]] of byDoc) {
          const d = designDose(model.atDoc(doc), problem, req);
          expect(rel(d.doseMgPerL!, dose!)).toBeLessThan(1e-10);
          expect(d.governedBy).toBe(gov);
        }
        // the run's days, interpolated from the table, within its stated tolerance
        const tol = cr.daily!.table.toleranceRel;
        cr.daily!.rows.forEach((row, k) => {
          expect(row.docMgPerL).toBe(old.daily![k]![0]);
          expect(rel(row.doseMgPerL!, old.daily![k]![1]!)).toBeLessThanOrEqual(tol);
        });
      }
    });
  }
});
