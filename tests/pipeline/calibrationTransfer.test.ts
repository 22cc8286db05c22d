/**
 * Calibration transfer (issue 11, capability 21): compounds without jar tests take the site's
 * correction from the compounds with jar tests. The expected doses are computed by hand from the
 * transferred factor with the library's public `doseFor` (one batch IAST of the compound beside
 * its competitors), so the pipeline must reproduce them to the dose search's tolerance.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { doseFor } from '../../src/api/equilibriumApi.js';
import { backgroundComponents } from '../../src/fractionation/backgroundPrediction.js';
import { prepareMixture } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { compoundsCsv } from '../../src/output/outputTables.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';

const root = join(__dirname, '../..');
const demoDir = join(root, 'fixtures/demo');
const now = { now: new Date('2026-01-01T00:00:00Z') };
let dir: string;

/** The demo project without its series, pilot and Monte Carlo (not needed here), with changes. */
function demoProject(change: (p: Record<string, any>) => void): string {
  const p = JSON.parse(readFileSync(join(demoDir, 'project.json'), 'utf8'));
  delete p.$schema; delete p.site.series; delete p.pilot; delete p.uncertainty;
  change(p);
  const file = join(dir, `project-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(file, JSON.stringify(p));
  return file;
}

/** Exact jar tests of MET with its K times `factor` beside the demo's fractionated DOC at 8 mg/L. */
function metJarTests(r: PipelineResult, factor: number): string {
  const met = r.project.compounds.find((c) => c.id === 'MET')!;
  const bg = backgroundComponents(r.background.background!, 8);
  const lines = ['C0 (ng/L),DOC0 (mg/L),dose (mg/L),c (ng/L)'];
  for (const dose of [5, 10, 20, 40, 60]) {
    const pm = prepareMixture([{ id: 'MET', c0MgPerL: 600e-6, K: met.K * factor, oneOverN: met.oneOverN }, ...bg]);
    lines.push(`600,8,${dose},${solveBatchPrepared(pm, dose / 1000).cMgPerL[0]! * 1e6}`);
  }
  return lines.join('\n') + '\n';
}

let plain: PipelineResult;
let mean: PipelineResult;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sorbshare-transfer-'));
  for (const f of ['doc_isotherm.csv', 'jar_tests_cbz.csv', 'column_test_hct.csv']) copyFileSync(join(demoDir, f), join(dir, f));
  plain = runPipeline(loadProject(demoProject(() => undefined)), now);
  writeFileSync(join(dir, 'jar_tests_met.csv'), metJarTests(plain, 0.6));
  mean = runPipeline(loadProject(demoProject((p) => {
    p.compounds.find((c: { id: string }) => c.id === 'MET').jar_tests = { file: 'jar_tests_met.csv', model: 'fictive-k' };
    p.calibration_transfer = 'mean';
  })), now);
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('calibration transfer "mean" (target-K factors)', () => {
  it('the exact MET jar tests give back the factor they were made with (0.6, to 1e-4)', () => {
    // the jar tests are exact IAST values at K × 0.6, so the fit recovers 0.6 up to its tolerance
    expect(mean.calibrations.find((c) => c.compoundId === 'MET')!.targetKFactor!).toBeCloseTo(0.6, 4);
  });

  it('the transferred factor is the geometric mean of the CBZ and MET factors (closed form)', () => {
    const f = mean.calibrations.map((c) => c.targetKFactor!);
    expect(f.length).toBe(2);
    expect(mean.calibrationTransfer!.targetKFactor!).toBeCloseTo(Math.sqrt(f[0]! * f[1]!), 12);
    expect(mean.calibrationTransfer!.fromIds).toEqual(['CBZ', 'MET']);
    expect(mean.calibrationTransfer!.toIds).toEqual(['DCF', 'CLA', 'VEN', 'HCT', 'BTZ', 'CAN', 'MBT']);
  });

  it('every untested compound on every PAC carbon gets the dose computed by hand with doseFor from that factor (to 1e-6 relative)', () => {
    const f = mean.calibrationTransfer!.targetKFactor!;
    const doc = mean.project.site.docMgPerL;
    for (const cr of mean.carbons.filter((c) => c.required)) {
      const bg = backgroundComponents(mean.background.background!, doc).map((c) => ({ id: c.id, c0: c.c0MgPerL, K: c.K * cr.carbon.kFactor, one_over_n: c.oneOverN }));
      for (const id of mean.calibrationTransfer!.toIds) {
        const comp = mean.project.compounds.find((c) => c.id === id)!;
        const own = cr.carbon.isotherms[id];
        const K = (own ? own.K : comp.K * cr.carbon.kFactor) * f;
        const goal = comp.limitMgPerL !== undefined ? { limit: comp.limitMgPerL } : { removal: 80 };
        const hand = doseFor({ components: [{ id, c0: comp.c0MgPerL, K, one_over_n: own ? own.oneOverN : comp.oneOverN }, ...bg] }, id, goal);
        const got = cr.required!.compounds.find((c) => c.compoundId === id)!;
        expect(got.status).toBe('met');
        expect(Math.abs(got.doseMgPerL! / hand.dose_mg_per_L - 1)).toBeLessThan(1e-6);
      }
    }
  });

  it('the transferred factor changes the untested doses against the run without transfer (direction of the factor)', () => {
    // a factor below 1 weakens the target in the IAST, so its dose rises; above 1 it falls
    const f = mean.calibrationTransfer!.targetKFactor!;
    const a = (r: PipelineResult) => r.carbons[0]!.required!.compounds.find((c) => c.compoundId === 'DCF')!.doseMgPerL!;
    expect(f).not.toBeCloseTo(1, 2);
    expect(Math.sign(a(mean) - a(plain))).toBe(f < 1 ? 1 : -1);
  });

  it('is flagged "transferred from …" in compounds.csv, the systems, the warnings and the report', () => {
    const csv = compoundsCsv(mean).split('\n');
    expect(csv[0]).toMatch(/,site calibration$/);
    const dcfRows = csv.filter((l) => l.includes(',DCF,'));
    expect(dcfRows.length).toBe(2);
    for (const l of dcfRows) expect(l.endsWith(',"transferred from the geometric mean of CBZ, MET"')).toBe(true); // quoted: the text holds a comma (RFC 4180)
    for (const l of csv.filter((x) => x.includes(',CBZ,'))) expect(l).toMatch(/,jar tests \(model fictive-k\)$/);
    expect(mean.carbons[0]!.systems.find((s) => s.compoundId === 'VEN')!.description).toContain('transferred from the geometric mean of CBZ, MET');
    expect(mean.warnings.some((w) => w.startsWith('calibration transferred from the geometric mean of CBZ, MET') && w.includes('DCF, CLA, VEN, HCT, BTZ, CAN, MBT'))).toBe(true);
    const sec = buildReportModel(mean, 'test').sections.find((s) => s.id === 'calibration')!;
    const rows = sec.tables![0]!.rows;
    expect(rows.map((x) => x[0])).toEqual(['CBZ', 'MET', 'DCF', 'CLA', 'VEN', 'HCT', 'BTZ', 'CAN', 'MBT']);
    expect(rows[2]![1]).toBe('transferred from the geometric mean of CBZ, MET');
  });

  it('without the key nothing is transferred (untested compounds keep their single-solute K) and nothing is flagged', () => {
    expect(plain.calibrationTransfer).toBeUndefined();
    const s = plain.carbons[0]!.systems.find((x) => x.compoundId === 'DCF')!;
    expect(s.inMixture.K).toBe(s.single.K);
    expect(compoundsCsv(plain).split('\n').filter((l) => l.includes(',DCF,')).every((l) => l.endsWith(',none'))).toBe(true);
  });
});

describe('calibration transfer from a named compound with an EBC (simplified-EBC rule)', () => {
  let r: PipelineResult;
  beforeAll(() => {
    const src = join(root, 'fixtures/project/ebc-background');
    const p = JSON.parse(readFileSync(join(src, 'project.json'), 'utf8'));
    delete p.$schema;
    p.calibration_transfer = 'CBZ';
    copyFileSync(join(src, 'jar_tests_cbz.csv'), join(dir, 'jar_tests_cbz.csv'));
    const file = join(dir, 'ebc-project.json');
    writeFileSync(file, JSON.stringify(p));
    r = runPipeline(loadProject(file), now);
  }, 120_000);

  it('each untested compound competes with an EBC of c0 = (c0_EBC/DOC of CBZ) × DOC on its own isotherm; doses by hand with doseFor (to 1e-6 relative)', () => {
    const cal = r.calibrations[0]!;
    const ratio = cal.ebc!.c0MgPerL / cal.ebc!.docMgPerL;
    expect(r.calibrationTransfer!.ebcC0PerDoc!).toBeCloseTo(ratio, 14);
    const doc = r.project.site.docMgPerL;
    const cr = r.carbons.find((c) => c.required)!;
    for (const id of ['DCF', 'MET', 'VEN']) {
      const comp = r.project.compounds.find((c) => c.id === id)!;
      const hand = doseFor({ components: [
        { id, c0: comp.c0MgPerL, K: comp.K, one_over_n: comp.oneOverN },
        { id: 'EBC', c0: ratio * doc, K: comp.K, one_over_n: comp.oneOverN },
      ] }, id, { removal: 80 });
      const got = cr.required!.compounds.find((c) => c.compoundId === id)!;
      expect(Math.abs(got.doseMgPerL! / hand.dose_mg_per_L - 1)).toBeLessThan(1e-6);
      expect(cr.systems.find((s) => s.compoundId === id)!.calibration).toBe('transferred from CBZ');
    }
  });
});
