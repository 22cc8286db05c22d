/**
 * Per-carbon background (issue 11, capability 21), on the invented fixture
 * fixtures/project/per-carbon-background: Carbon Q has its own DOC/UV254 isotherm, Carbons P
 * (reference) and R (K factor 1.15) use the project's. Expected values:
 *   - Q's fictive components are those of a standalone fractionation of its table (the library's
 *     `fractionate`, which `sorbshare fractionate` prints; same options: the project's, which are
 *     the defaults) — the same deterministic computation, so equal exactly;
 *   - Q's competitors are its own components unscaled (closed form: K factor 1 on its own
 *     background), its compounds keep the K factor 0.8;
 *   - P and R are unchanged to 1e-12 against the same project without Q's own background;
 *   - on R the UV254 set-point equals P's (closed form: a K factor on every K is the same carbon
 *     at f times the dose, so the background at the dose meeting a goal is the same), while Q's
 *     differs — the point of a carbon's own isotherm.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { runPipelineWithUncertainty } from '../../src/pipeline/runWithUncertainty.js';
import { fractionate } from '../../src/fractionation/fractionate.js';
import { backgroundComponents } from '../../src/fractionation/backgroundPrediction.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { runRecord } from '../../src/output/runRecord.js';
import { carbonsCsv } from '../../src/output/outputTables.js';
import type { CarbonResult, PipelineResult } from '../../src/pipeline/pipelineTypes.js';
import { runBin, scratchDir } from '../helpers/cliHarness.js';
import { surrogatesAtDose } from '../../src/pipeline/surrogateStep.js';
import type { CarbonKinetics } from '../../src/project/readCarbonKinetics.js';

const root = join(__dirname, '../..');
const fixtureDir = join(root, 'fixtures/project/per-carbon-background');
const qCsv = join(fixtureDir, 'doc_isotherm_carbon_q.csv');
const now = { now: new Date('2026-01-01T00:00:00Z') };
const scratch = scratchDir('sorbshare-per-carbon-bg-');

/** The fixture without its Monte Carlo, changed, written to the scratch folder beside copies of its tables. */
function project(change: (p: any) => void = () => undefined): string {
  const p = JSON.parse(readFileSync(join(fixtureDir, 'project.json'), 'utf8'));
  delete p.$schema; delete p.uncertainty;
  change(p);
  return scratch.write(`project-${Math.random().toString(36).slice(2)}.json`, p);
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
let own: PipelineResult;
let without: PipelineResult;
beforeAll(() => {
  for (const f of ['doc_isotherm.csv', 'doc_isotherm_carbon_q.csv']) copyFileSync(join(fixtureDir, f), join(scratch.dir, f));
  own = runPipeline(loadProject(project()), now);
  without = runPipeline(loadProject(project((p) => { delete p.carbons[1].background; })), now);
}, 120_000);
afterAll(() => rmSync(scratch.dir, { recursive: true, force: true }));

const byName = (r: PipelineResult, name: string): CarbonResult => r.carbons.find((c) => c.carbon.name.startsWith(name))!;

describe('a carbon with its own DOC isotherm', () => {
  it('has the fractionation of a standalone fractionate of its table (exactly)', () => {
    const alone = fractionate(readFileSync(qCsv, 'utf8'), { file: qCsv });
    const q = byName(own, 'Carbon Q').background!;
    expect(q.source).toBe('own isotherm');
    expect(q.backgroundKFactor).toBe(1);
    expect(q.background!.components).toEqual(alone.components);
    expect(q.background!.doc0_mg_per_L).toBe(alone.doc0_mg_per_L);
    expect(q.fractionation!.fit.rmse_mg_per_L).toBe(alone.fit.rmse_mg_per_L);
    // and it is not the project's background
    expect(q.background!.components.map((c) => c.fraction)).not.toEqual(own.background.background!.components.map((c) => c.fraction));
  });

  it('competes with its own components unscaled, while its compounds keep the K factor 0.8', () => {
    const cr = byName(own, 'Carbon Q');
    const doc = own.project.site.docMgPerL;
    const mine = backgroundComponents(cr.background!.background!, doc);
    for (const s of cr.systems) {
      expect(s.background(doc)).toEqual(mine);
      const comp = own.project.compounds.find((c) => c.id === s.compoundId)!;
      expect(s.single.K).toBeCloseTo(comp.K * 0.8, 12);
      expect(s.description).toMatch(/^this carbon's own fractionated DOC \(4 fictive components\), carbon K factor 0\.8 on the compounds$/);
    }
    expect(cr.surrogates!.model.background.map((c) => c.K)).toEqual(mine.map((c) => c.K));
  });

  it('gets UV254 and DOC set-points that differ from the reference carbon\'s (R, with a K factor only, keeps P\'s to 1e-9)', () => {
    const p = byName(own, 'Carbon P').surrogates!;
    const q = byName(own, 'Carbon Q').surrogates!;
    const r = byName(own, 'Carbon R').surrogates!;
    expect(q.hasUv254).toBe(true);
    expect(Math.abs(q.atRequiredDose!.uv254Reduction! - p.atRequiredDose!.uv254Reduction!)).toBeGreaterThan(0.02);
    expect(Math.abs(q.atRequiredDose!.docReduction - p.atRequiredDose!.docReduction)).toBeGreaterThan(0.02);
    q.setPoints.forEach((s, i) => { if (s.uv254Reduction !== null) expect(Math.abs(s.uv254Reduction - p.setPoints[i]!.uv254Reduction!)).toBeGreaterThan(0.02); });
    // closed form: a K factor on every K scales the dose, not the background at the goal
    expect(rel(r.atRequiredDose!.uv254Reduction!, p.atRequiredDose!.uv254Reduction!)).toBeLessThan(1e-9);
    // the own background gives its own doses, not those of K factor 0.8 on P's background
    expect(rel(byName(own, 'Carbon Q').required!.doseMgPerL!, byName(without, 'Carbon Q').required!.doseMgPerL!)).toBeGreaterThan(0.01);
  });

  it('the carbons without one are unchanged to 1e-12 (doses, curves, set-points, loadings, yearly figures)', () => {
    for (const name of ['Carbon P', 'Carbon R']) {
      const a = byName(own, name);
      const b = byName(without, name);
      expect(a.background!.source).toBe('K factor');
      a.required!.compounds.forEach((c, i) => expect(rel(c.doseMgPerL!, b.required!.compounds[i]!.doseMgPerL!)).toBeLessThan(1e-12));
      expect(rel(a.required!.doseMgPerL!, b.required!.doseMgPerL!)).toBeLessThan(1e-12);
      for (const [id, v] of Object.entries(a.curves!.removalPercent)) v.forEach((x, k) => expect(Math.abs(x - b.curves!.removalPercent[id]![k]!)).toBeLessThan(1e-12 * 100));
      expect(rel(a.surrogates!.atRequiredDose!.uv254Reduction!, b.surrogates!.atRequiredDose!.uv254Reduction!)).toBeLessThan(1e-12);
      a.reducedLoadings!.forEach((l, i) => expect(rel(l.qSiteMgPerG, b.reducedLoadings![i]!.qSiteMgPerG)).toBeLessThan(1e-12));
      expect(rel(a.yearly!.cost, b.yearly!.cost)).toBeLessThan(1e-12);
      expect(rel(a.costPerM3!, b.costPerM3!)).toBeLessThan(1e-12);
    }
  });

  it('the report, run.json and carbons.csv say which background each carbon uses', () => {
    const sec = buildReportModel(own, 'test').sections.find((s) => s.id === 'background')!;
    const t = sec.tables!.find((x) => x.caption === 'Background of each carbon')!;
    expect(t.rows.map((r) => [r[0], r[2]])).toEqual([
      ['Carbon P (coal-based)', "the project's background (reference carbon, K factor 1)"],
      ['Carbon Q (wood-based)', 'its own DOC isotherm (doc_isotherm_carbon_q.csv), fractionated into 3 adsorbable fictive components'],
      ['Carbon R (coconut-based)', "K factor 1.15 on the reference carbon's background"],
    ]);
    expect(sec.tables!.some((x) => x.caption.startsWith('Fictive components of Carbon Q (wood-based) (its own'))).toBe(true);
    // without any own background the section is as before (no per-carbon table)
    expect(buildReportModel(without, 'test').sections.find((s) => s.id === 'background')!.tables!.some((x) => x.caption === 'Background of each carbon')).toBe(false);
    const rec = runRecord(own, { toolVersion: 'test', nodeVersion: 'test' }) as any;
    expect(rec.results.carbons.map((c: any) => c.background.source)).toEqual(['K factor', 'own isotherm', 'K factor']);
    expect(rec.results.carbons[1].background.background.components).toEqual(byName(own, 'Carbon Q').background!.background!.components);
    expect(rec.results.carbons[0].background.background).toBeNull();
    expect(rec.inputs.carbons[1].background).toEqual({ kind: 'isotherm', file: 'doc_isotherm_carbon_q.csv', fractionation: { components: 3, exponent: 0.2, fit_k: false } });
    const csv = carbonsCsv(own).split('\n');
    expect(csv[0]).toMatch(/^carbon,type,price per kg,currency,K factor,background,/);
    expect(csv[2]).toContain(',0.8,"its own DOC isotherm (doc_isotherm_carbon_q.csv), fractionated into 3 adsorbable fictive components",'); // quoted: the text holds a comma (RFC 4180)
  });

  it('the Monte Carlo of each carbon draws its own background (Q: its own components and intervals, unscaled)', async () => {
    const r = await runPipelineWithUncertainty(loadProject(project((p) => { p.uncertainty = { draws: 16, seed: 3, K_rel_sd: 0.2 }; })), { ...now, workers: 0 });
    const q = byName(r, 'Carbon Q');
    const mine = q.background!.background!.components;
    expect(q.uncertainty!.problem.background.map((b) => [b.K, b.fraction])).toEqual(mine.map((c) => [c.K, c.fraction]));
    const rr = byName(r, 'Carbon R');
    expect(rr.uncertainty!.problem.background.map((b) => [b.K, b.fraction])).toEqual(r.background.background!.components.map((c) => [c.K * 1.15, c.fraction]));
    expect(q.uncertainty!.parameters.some((x) => x.basis.startsWith('fractionation 95 % interval'))).toBe(true);
  }, 120_000);
});

describe('with a target-K factor calibrated to jar tests (the demo\'s CBZ, model fictive-k)', () => {
  it('the factor fitted beside the project\'s background is applied on the carbon with its own, and said so', () => {
    const demoDir = join(root, 'fixtures/demo');
    for (const f of ['doc_isotherm.csv', 'jar_tests_cbz.csv']) copyFileSync(join(demoDir, f), join(scratch.dir, f));
    const p = JSON.parse(readFileSync(join(demoDir, 'project.json'), 'utf8'));
    delete p.$schema; delete p.site.series; delete p.pilot; delete p.uncertainty;
    p.carbons = p.carbons.filter((c: { type: string }) => c.type === 'PAC');
    p.carbons[1].background = { isotherm: 'doc_isotherm_carbon_q.csv' };
    const r = runPipeline(loadProject(scratch.write('demo-own.json', p)), now);
    const factor = r.calibrations[0]!.targetKFactor!;
    const b = r.carbons[1]!.systems.find((x) => x.compoundId === 'CBZ')!;
    expect(b.inMixture.K).toBeCloseTo(b.single.K * factor, 12);
    expect(b.description).toContain(`target K × ${Number(factor.toPrecision(4))} from jar tests (calibrated beside the reference carbon's background)`);
    expect(r.carbons[0]!.systems.find((x) => x.compoundId === 'CBZ')!.description).not.toContain('calibrated beside');
  }, 120_000);
});

describe('under PAC contact conditions', () => {
  it('a carbon\'s own background is the one its contact model competes with: equilibrium dose as the run without contact, contact DOC reduction below its own equilibrium one', () => {
    // invented kinetic data of the usual order for PAC (as in fixtures/project/pac-contact); small solver settings keep it to seconds
    const kinetics: CarbonKinetics = {
      particleRadiusM: 10e-6, particleDensityGPerL: 650,
      dsM2PerS: { CBZ: 2e-15, DCF: 2e-15, MET: 2e-15, BTZ: 3e-15 }, dlM2PerS: { CBZ: 7e-10, DCF: 6.5e-10, MET: 6.5e-10, BTZ: 9e-10 },
      docDsM2PerS: 1e-15, docDlM2PerS: 5e-10,
    };
    const loaded = loadProject(project());
    const q = loaded.project.carbons[1]!;
    const input = { ...loaded, project: { ...loaded.project, site: { ...loaded.project.site, pacContact: { kind: 'plug-flow' as const, contactTimeS: 1800 } }, carbons: [{ ...q, kinetics }] } };
    const cr = runPipeline(input, { ...now, kinetic: { interiorPoints: 4, rtol: 1e-4 } }).carbons[0]!;
    expect(cr.background!.source).toBe('own isotherm');
    expect(cr.contact!.equilibriumDoseMgPerL).toBe(byName(own, 'Carbon Q').required!.doseMgPerL);
    expect(cr.required!.doseMgPerL!).toBeGreaterThan(cr.contact!.equilibriumDoseMgPerL!);
    const s = cr.surrogates!.atRequiredDose!;
    // the batch IAST of Q's own background at the same dose (surrogatesAtDose): contact leaves more DOC and UV254
    const eq = surrogatesAtDose(cr.surrogates!.model, s.doseMgPerL);
    expect(cr.surrogates!.model.background.map((c) => c.K)).toEqual(cr.background!.background!.components.map((c) => c.K));
    expect(s.docReduction).toBeGreaterThan(0);
    expect(s.docReduction).toBeLessThan(eq.docReduction);
    expect(s.uv254Reduction!).toBeLessThan(eq.uv254Reduction!);
  }, 600_000);
});

describe('a GAC carbon with its own background file', () => {
  it('competes with the file\'s components unscaled (source "own file"); its equilibrium bed volumes differ from the same carbon on the reference background', () => {
    scratch.write('q_background.json', fractionate(readFileSync(qCsv, 'utf8'), { file: qCsv }));
    const gac = { name: 'GAC S (invented)', type: 'GAC', price_per_kg: 2.0, currency: 'EUR', bed_density_kg_per_m3: 450, ebct_min: 20 };
    const r = runPipeline(loadProject(project((p) => { p.carbons = [p.carbons[0], { ...gac, background: { file: 'q_background.json' } }, { ...gac, name: 'GAC T (invented)' }]; })), now);
    const s = byName(r, 'GAC S');
    const t = byName(r, 'GAC T');
    expect(s.background!.source).toBe('own file');
    expect(s.background!.description).toBe('its own background file (q_background.json), 3 adsorbable fictive components');
    const doc = r.project.site.docMgPerL;
    for (const sys of s.systems) expect(sys.background(doc)).toEqual(backgroundComponents(s.background!.background!, doc));
    expect(t.background!.source).toBe('K factor');
    s.gac!.estimate.targets.forEach((x, i) => expect(rel(x.bedVolumes, t.gac!.estimate.targets[i]!.bedVolumes)).toBeGreaterThan(1e-3));
  });
});

describe('sorbshare run with a per-carbon background', () => {
  it('exits 0; run.json holds Q\'s components as `sorbshare fractionate --json` prints them for its table', () => {
    const out = join(scratch.dir, 'out');
    const r = runBin('run', project(), '--out', out);
    expect(r.code).toBe(0);
    const rec = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    const f = runBin('fractionate', qCsv, '--json');
    expect(f.code).toBe(0);
    expect(rec.results.carbons[1].background.background.components).toEqual(JSON.parse(f.out).components);
    expect(readFileSync(join(out, 'summary.md'), 'utf8')).toContain('its own DOC isotherm (doc_isotherm_carbon_q.csv)');
    expect(existsSync(join(out, 'report.html'))).toBe(true);
    writeFileSync(join(scratch.dir, 'done'), '');
  }, 120_000);
});
