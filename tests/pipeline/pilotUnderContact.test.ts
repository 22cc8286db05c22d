/**
 * The pilot check under the plant's PAC contact conditions: the model relation between UV254
 * reduction and removal comes from the carbon's contact model (the run's removal model), not from
 * equilibrium. Checks: the generic path traced on the equilibrium model equals the batch-IAST
 * relation (internal consistency, 1e-9); a plug-flow contact time of 60 days gives the equilibrium
 * relation back (HSDM tends to the batch IAST equilibrium at long times, Crank 1975 ch. 6 for the
 * particle; closed form of the limit); 30 minutes gives a different relation, and the run no longer
 * warns that the pilot check is an equilibrium prediction. Fixture and kinetic data invented.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { predictedRelations, relationsFromModel, MODEL_RELATION_DOSES_MG_PER_L } from '../../src/pipeline/pilotStep.js';
import { carbonModel } from '../../src/design/carbonModel.js';
import { removalAtUv254Reduction } from '../../src/surrogates/pilotCheck.js';
import { logSpaced } from '../../src/numerics/logSpace.js';
import type { CarbonKinetics } from '../../src/project/readCarbonKinetics.js';

const FIXTURE = join(process.cwd(), 'fixtures/project/surrogates-gac-mc/project.json');
const NOW = new Date('2026-01-01T00:00:00Z');
// invented kinetic data (orders of magnitude common for PAC)
const KINETICS: CarbonKinetics = {
  particleRadiusM: 10e-6, particleDensityGPerL: 650,
  dsM2PerS: { CBZ: 2e-15, T20: 3e-15, BTZ: 3e-15 }, dlM2PerS: { CBZ: 7e-10, T20: 7e-10, BTZ: 9e-10 },
  docDsM2PerS: 1e-15, docDlM2PerS: 5e-10,
};
const KIN_OPTIONS = { interiorPoints: 4, rtol: 1e-5 };

function withContact(contactTimeS: number) {
  const loaded = loadProject(FIXTURE);
  delete loaded.series;
  const project = {
    ...loaded.project,
    site: { ...loaded.project.site, pacContact: { kind: 'plug-flow' as const, contactTimeS } },
    carbons: loaded.project.carbons.map((c) => (c.type === 'PAC' ? { ...c, kinetics: KINETICS } : c)),
  };
  return runPipeline({ ...loaded, project }, { now: NOW, kinetic: KIN_OPTIONS });
}

describe('pilot check under PAC contact conditions', () => {
  it('traced on the equilibrium model, the generic relation equals the batch-IAST one (1e-9)', () => {
    const loaded = loadProject(FIXTURE);
    delete loaded.series;
    const r = runPipeline(loaded, { now: NOW });
    const cr = r.carbons[0]!;
    const sm = cr.surrogates!.model;
    const doc = r.project.site.docMgPerL;
    const ids = r.project.compounds.map((c) => c.id);
    const eq = predictedRelations(sm, cr.systems, doc, ids);
    const generic = relationsFromModel(carbonModel(cr.systems, doc, sm.background), sm.uv254AbsorbancePerM!, ids, [0, ...logSpaced(0.1, 2000, 160)]);
    expect(generic.map((g) => g.compound)).toEqual(eq.map((e) => e.compound));
    generic.forEach((g, k) => {
      g.uv254Reduction.forEach((u, i) => expect(u).toBeCloseTo(eq[k]!.uv254Reduction[i]!, 9));
      g.removal.forEach((x, i) => expect(x).toBeCloseTo(eq[k]!.removal[i]!, 9));
    });
    expect(r.pilot!.relations).toEqual(eq); // without contact conditions the run keeps the batch-IAST relation
    expect(r.pilot!.relationModel).toBe('batch IAST (equilibrium)');
  });

  it('60 days of contact give the equilibrium relation back; 30 minutes a different one, from the contact model', () => {
    const plain = (() => { const l = loadProject(FIXTURE); delete l.series; return runPipeline(l, { now: NOW }); })();
    const long = withContact(60 * 86400);
    const short = withContact(1800);
    expect(long.pilot!.relations[0]!.removal.length).toBe(MODEL_RELATION_DOSES_MG_PER_L.length);
    const xs = [0.05, 0.1, 0.2, 0.3, 0.4];
    let shortGap = 0;
    for (const rel of plain.pilot!.relations) {
      const lr = long.pilot!.relations.find((x) => x.compound === rel.compound)!;
      const sr = short.pilot!.relations.find((x) => x.compound === rel.compound)!;
      for (const u of xs) {
        const e = removalAtUv254Reduction(rel, u).removal;
        // 40 doses against 160: the interpolation between nodes differs by well under 1e-2
        expect(Math.abs(removalAtUv254Reduction(lr, u).removal - e)).toBeLessThan(1e-2);
        shortGap = Math.max(shortGap, Math.abs(removalAtUv254Reduction(sr, u).removal - e));
      }
    }
    expect(shortGap).toBeGreaterThan(0.02);
    for (const [r, t] of [[long, 60 * 86400], [short, 1800]] as const) {
      expect(r.warnings.some((w) => /pilot check: the predictions are equilibrium/.test(w))).toBe(false);
      expect(r.pilot!.relationModel).toBe(`contact time ${t} s, plug flow (HSDM with IAST at the surface)`);
    }
    // the pilot residuals are measured against the contact relation
    const res = short.pilot!.check.residuals[0]!;
    const rel = short.pilot!.relations.find((x) => x.compound === res.compound)!;
    expect(res.predictedRemoval).toBeCloseTo(removalAtUv254Reduction(rel, res.uv254Reduction).removal, 12);
  }, 300_000);
});
