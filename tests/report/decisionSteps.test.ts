/**
 * Decision computations of capability 22 on the demo project (invented data, used here only as a
 * scenario, never as a check value): each figure's numbers are recomputed independently — through
 * the public `doseFor` API (its own dose search) on a mixture file built from the project's inputs
 * — or checked against a closed form (the specific-dose rule is a straight line through the
 * origin; the price enters the cost linearly).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import type { CarbonResult, PipelineResult } from '../../src/pipeline/pipelineTypes.js';
import { doseFor } from '../../src/api/equilibriumApi.js';
import { scaleAdsorbable } from '../../src/pipeline/sensitivityStep.js';
import { pacGacComparison } from '../../src/output/pacGacComparison.js';
import { specificDose } from '../../src/design/specificDose.js';
import { sharedDemoPipeline } from '../helpers/sharedDemoPipeline.js';

let r: PipelineResult;
let a: CarbonResult;

beforeAll(() => {
  r = sharedDemoPipeline(); // the worker's shared plain demo run (the demo project, { demo: true }, now 2026-01-01)
  a = r.carbons.find((c) => c.carbon.type === 'PAC')!;
}, 60_000);

/** Dose for the governing compound's goal via the public API, with its K and 1/n and the DOC scaled. */
function independentDose(kFactor: number, nFactor: number, docMgPerL: number): number {
  const gov = a.sensitivity!.governingCompound;
  const sys = a.systems.find((s) => s.compoundId === gov)!;
  const bg = r.background.background!;
  const f = a.carbon.kFactor;
  // background from the background file: c0 = share × DOC (Zietzschmann et al. 2016 scaling), K times the carbon factor
  const background = bg.components.map((c) => (c.K === 0 ? { id: c.id, c0: c.fraction * docMgPerL, K: 0 } : { id: c.id, c0: c.fraction * docMgPerL, K: c.K * f, one_over_n: c.one_over_n }));
  const mixture = { components: [{ id: gov, c0: sys.c0MgPerL, K: sys.inMixture.K * kFactor, one_over_n: sys.inMixture.oneOverN * nFactor }, ...background] };
  return doseFor(mixture, gov, { removal: r.goals[gov]!.removalFraction * 100 }).dose_mg_per_L;
}

describe('sensitivity (tornado) bars recomputed independently', () => {
  it('has the five inputs, the run\'s dose and yearly cost as base, and names what is not modelled', () => {
    const s = a.sensitivity!;
    expect(s.rows.map((x) => x.key)).toEqual(['K', 'one_over_n', 'doc', 'background', 'price']);
    expect(s.baseDoseMgPerL).toBe(a.required!.doseMgPerL);
    expect(s.baseYearlyCost).toBe(a.yearly!.cost);
    expect(s.notModelled).toEqual(['contact time', 'carbon age']);
  });

  it('K of the governing compound ±20 %: the dose bars equal a dose search through the public API', () => {
    const row = a.sensitivity!.rows.find((x) => x.key === 'K')!;
    // the governing compound may change when its K rises (another compound then needs more carbon)
    const others = Math.max(...a.required!.compounds.filter((c) => c.compoundId !== a.sensitivity!.governingCompound && c.doseMgPerL !== null).map((c) => c.doseMgPerL!));
    expect(row.doseLowMgPerL!).toBeCloseTo(Math.max(independentDose(0.8, 1, r.project.site.docMgPerL), others), 2);
    expect(row.doseHighMgPerL!).toBeCloseTo(Math.max(independentDose(1.2, 1, r.project.site.docMgPerL), others), 2);
    expect(row.doseLowMgPerL!).toBeGreaterThan(row.doseHighMgPerL!); // a weaker adsorbing compound needs more carbon
  });

  it('DOC ±20 %: the governing compound\'s dose at 0.8 and 1.2 times the DOC equals the public API\'s dose search', () => {
    const row = a.sensitivity!.rows.find((x) => x.key === 'doc')!;
    const doc = r.project.site.docMgPerL;
    // every compound is recomputed so that the largest dose is compared (the governing one may change)
    const doseAt = (d: number) => {
      const bg = r.background.background!;
      return Math.max(...a.systems.map((sys) => {
        const background = bg.components.map((c) => (c.K === 0 ? { id: c.id, c0: c.fraction * d, K: 0 } : { id: c.id, c0: c.fraction * d, K: c.K * a.carbon.kFactor, one_over_n: c.one_over_n }));
        return doseFor({ components: [{ id: sys.compoundId, c0: sys.c0MgPerL, K: sys.inMixture.K, one_over_n: sys.inMixture.oneOverN }, ...background] }, sys.compoundId, { removal: r.goals[sys.compoundId]!.removalFraction * 100 }).dose_mg_per_L;
      }));
    };
    const hasIndicatorGovernance = a.required!.governedBy === 'indicator mean';
    expect(hasIndicatorGovernance).toBe(false);
    expect(row.doseLowMgPerL!).toBeCloseTo(doseAt(doc * 0.8), 2);
    expect(row.doseHighMgPerL!).toBeCloseTo(doseAt(doc * 1.2), 2);
  });

  it('carbon price ±20 %: the dose is unchanged and the yearly cost scales linearly (closed form)', () => {
    const row = a.sensitivity!.rows.find((x) => x.key === 'price')!;
    expect(row.doseLowMgPerL).toBe(a.required!.doseMgPerL);
    expect(row.yearlyCostLow!).toBeCloseTo(a.yearly!.cost * 0.8, 6);
    expect(row.yearlyCostHigh!).toBeCloseTo(a.yearly!.cost * 1.2, 6);
  });

  it('scaleAdsorbable keeps the DOC and moves the difference to the non-adsorbable part', () => {
    const comps = [{ id: 'N', c0MgPerL: 2, K: 0, oneOverN: 1 }, { id: 'A', c0MgPerL: 3, K: 10, oneOverN: 0.2 }, { id: 'B', c0MgPerL: 1, K: 50, oneOverN: 0.2 }];
    const up = scaleAdsorbable(comps, 1.2);
    expect(up.map((c) => c.c0MgPerL)).toEqual([2 - 0.8, 3.6, 1.2].map((x) => expect.closeTo(x, 12)));
    expect(up.reduce((s, c) => s + c.c0MgPerL, 0)).toBeCloseTo(6, 12);
    const noInert = scaleAdsorbable(comps.slice(1), 0.8);
    expect(noInert.reduce((s, c) => s + c.c0MgPerL, 0)).toBeCloseTo(4, 12);
  });
});

describe('dose against DOC', () => {
  it('the constant-specific-dose rule is a line through the origin and the design point; IAST meets it at the design DOC', () => {
    const d = a.doseAgainstDoc!;
    expect(d.specificDoseAtDesign).toBeCloseTo(a.required!.doseMgPerL! / r.project.site.docMgPerL, 12);
    d.docMgPerL.forEach((x, i) => expect(d.constantRuleDoseMgPerL[i]).toBeCloseTo(d.specificDoseAtDesign * x, 10));
    // the series covers the site DOC range
    const docs = r.series!.docMgPerL;
    expect(d.docMgPerL[0]).toBeCloseTo(Math.min(...docs), 10);
    expect(d.docMgPerL.at(-1)).toBeCloseTo(Math.max(...docs), 10);
    // at a DOC of the grid the required dose equals an independent dose search for every compound (largest)
    const i = 3;
    const doc = d.docMgPerL[i]!;
    const bg = r.background.background!;
    const indep = Math.max(...a.systems.map((sys) => doseFor({ components: [{ id: sys.compoundId, c0: sys.c0MgPerL, K: sys.inMixture.K, one_over_n: sys.inMixture.oneOverN }, ...bg.components.map((c) => (c.K === 0 ? { id: c.id, c0: c.fraction * doc, K: 0 } : { id: c.id, c0: c.fraction * doc, K: c.K, one_over_n: c.one_over_n }))] }, sys.compoundId, { removal: r.goals[sys.compoundId]!.removalFraction * 100 }).dose_mg_per_L));
    expect(d.requiredDoseMgPerL[i]!).toBeCloseTo(indep, 2);
    // IAST against the rule: the required dose rises less than in proportion to DOC on this site
    expect(d.requiredDoseMgPerL[0]!).toBeGreaterThan(d.constantRuleDoseMgPerL[0]!);
  });

  it('specificDose is dose over DOC and refuses a DOC of zero', () => {
    expect(specificDose(20, 8)).toBe(2.5);
    expect(() => specificDose(20, 0)).toThrow(/positive DOC/);
  });
});

describe('PAC against GAC', () => {
  it('puts every carbon side by side and names a cheapest carbon only within one currency', () => {
    const cmp = pacGacComparison(r.carbons);
    expect(cmp.rows.map((x) => x.type)).toEqual(['PAC', 'PAC', 'GAC']);
    const gac = r.carbons.find((c) => c.gac)!;
    const g = cmp.rows[2]!;
    // the demo's GAC has fixed-bed inputs: cost per m³ = ρ_bed/BV_run × price (closed-form mass balance)
    expect(g.costPerM3!).toBeCloseTo((gac.carbon.bedDensityKgPerM3! / gac.gacKinetic!.run.runBedVolumes!) * gac.carbon.pricePerKg, 12);
    // without them, from the equilibrium carbon usage: usage (g/m³)/1000 × price
    const { gacKinetic: _k, ...equilibriumOnly } = gac;
    const e = pacGacComparison([equilibriumOnly]).rows[0]!;
    expect(e.costPerM3!).toBeCloseTo((gac.gac!.governing.carbonUsageGPerM3 / 1000) * gac.carbon.pricePerKg, 12);
    expect(cmp.cheapestByCurrency).toHaveLength(1);
    const mixed = r.carbons.map((c, i) => (i === 0 ? { ...c, carbon: { ...c.carbon, currency: 'CHF' } } : c));
    const m = pacGacComparison(mixed);
    expect(m.cheapestByCurrency.map((x) => x.currency)).toEqual(['EUR']);
    expect(m.cheapestByCurrency[0]!.of).toBe(2);
  });
});

describe('decision steps on a project with EBC backgrounds and no DOC series', () => {
  it('uses the design DOC ±50 %, yearly figures at the design DOC and flow, and renders every decision figure', async () => {
    const { buildReportModel } = await import('../../src/output/buildReportModel.js');
    const { yearlyAtOneDose: yearlyCarbonAtDose } = await import('../../src/design/doseTable.js');
    const res = runPipeline(loadProject(join(__dirname, '../../fixtures/project/ebc-background/project.json')), { now: new Date('2026-01-01T00:00:00Z') });
    const cr = res.carbons.find((c) => c.doseAgainstDoc)!;
    const doc = res.project.site.docMgPerL;
    expect(cr.doseAgainstDoc!.rangeSource).toBe('design DOC ±50 %');
    expect(cr.doseAgainstDoc!.docMgPerL[0]).toBeCloseTo(doc * 0.5, 12);
    expect(cr.doseAgainstDoc!.docMgPerL.at(-1)).toBeCloseTo(doc * 1.5, 12);
    const s = cr.sensitivity!;
    // closed form of the yearly figures without a series: dose × flow × 365 / 1000 × price
    const dr = s.rows.find((x) => x.key === 'doc')!;
    expect(dr.yearlyCostHigh!).toBeCloseTo(yearlyCarbonAtDose(dr.doseHighMgPerL!, res.project.site.flowM3PerD, cr.carbon.pricePerKg).cost, 6);
    expect(dr.doseHighMgPerL!).toBeGreaterThan(s.baseDoseMgPerL); // more DOC, more EBC, more carbon
    const model = buildReportModel(res, 'test');
    const ids = model.sections.flatMap((x) => (x.plots ?? []).map((p) => p.id));
    expect(ids).toEqual(expect.arrayContaining(['dose-against-doc-1', 'sensitivity-dose-1', 'sensitivity-cost-1']));
  }, 60_000);
});
