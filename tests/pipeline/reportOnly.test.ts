/**
 * Report-only compounds (project `"goal": "none"`, issue 11): modelled and reported beside the
 * others, never governing the dose, also in the headline figures, the tables and the Monte Carlo.
 * Every expectation is a property of the design (the required dose is the largest dose of the
 * goals that remain), so no demo number is compared.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { runPipelineWithUncertainty } from '../../src/pipeline/runWithUncertainty.js';
import { compoundsCsv } from '../../src/output/outputTables.js';
import { headlineFigures } from '../../src/output/headlineFigures.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { prepareSystem } from '../../src/design/competitionSystem.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';

const demoDir = join(__dirname, '../../fixtures/demo');
const now = { now: new Date('2026-01-01T00:00:00Z') };
let dir: string;
let n = 0;

function project(change: (p: Record<string, any>) => void): string {
  const p = JSON.parse(readFileSync(join(demoDir, 'project.json'), 'utf8'));
  delete p.$schema; delete p.site.series; delete p.pilot; delete p.uncertainty;
  change(p);
  const file = join(dir, `project-${n++}.json`);
  writeFileSync(file, JSON.stringify(p));
  return file;
}
const pac = (r: PipelineResult) => r.carbons.filter((c) => c.required);

let plain: PipelineResult;
let governing: string;
let ro: PipelineResult;
let hard: PipelineResult;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sorbshare-report-only-'));
  for (const f of ['doc_isotherm.csv', 'jar_tests_cbz.csv', 'column_test_hct.csv']) copyFileSync(join(demoDir, f), join(dir, f));
  // without the indicator goal, so that a compound governs
  plain = runPipeline(loadProject(project((p) => { delete p.goals.indicator; })), now);
  governing = pac(plain)[0]!.required!.governing!.compoundId;
  ro = runPipeline(loadProject(project((p) => { delete p.goals.indicator; p.compounds.find((c: { id: string }) => c.id === governing).goal = 'none'; })), now);
  // a hard-to-remove compound (K 0.5, invented) that is only to be reported
  hard = runPipeline(loadProject(project((p) => { delete p.goals.indicator; p.compounds.push({ id: 'SUC', name: 'sucralose (invented values)', K: 0.5, one_over_n: 0.5, c0: '10 ug/L', goal: 'none' }); for (const c of p.carbons) if (c.kinetics?.Ds) { c.kinetics.Ds.SUC = '5e-15 m2/s'; if (c.kinetics.DL) c.kinetics.DL.SUC = '7e-10 m2/s'; } })), now);
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('report-only compounds never govern', () => {
  it('the governing compound made report-only gets the status "report only", no dose, and no longer governs', () => {
    for (const cr of pac(ro)) {
      const d = cr.required!.compounds.find((c) => c.compoundId === governing)!;
      expect(d).toMatchObject({ status: 'report only', doseMgPerL: null, removalFraction: null });
      expect(cr.required!.governing!.compoundId).not.toBe(governing);
    }
  });

  it('the required dose is then the largest dose of the other goals, which are unchanged (to 1e-12 relative)', () => {
    pac(ro).forEach((cr, k) => {
      const before = pac(plain)[k]!.required!;
      const others = before.compounds.filter((c) => c.compoundId !== governing);
      for (const c of others) expect(cr.required!.compounds.find((x) => x.compoundId === c.compoundId)!.doseMgPerL!).toBeCloseTo(c.doseMgPerL!, 9);
      expect(cr.required!.doseMgPerL!).toBeCloseTo(Math.max(...others.map((c) => c.doseMgPerL!)), 9);
      expect(cr.required!.doseMgPerL!).toBeLessThan(before.doseMgPerL!);
    });
  });

  it('a hard-to-remove report-only compound leaves the required dose as it was without it, and every daily dose too', () => {
    pac(hard).forEach((cr, k) => {
      expect(cr.required!.doseMgPerL!).toBeCloseTo(pac(plain)[k]!.required!.doseMgPerL!, 9);
      expect(cr.required!.governedBy).toBe(pac(plain)[k]!.required!.governedBy);
    });
  });

  it('is still modelled: its removal curve and its reduced loading at the design dose are reported', () => {
    const cr = pac(hard)[0]!;
    const i = cr.systems.findIndex((s) => s.compoundId === 'SUC');
    const rl = cr.reducedLoadings![i]!;
    // the reduced loading is the batch IAST at the design dose (re-solved here)
    const c = solveBatchPrepared(prepareSystem(cr.systems[i]!, hard.project.site.docMgPerL), cr.designDoseMgPerL! / 1000).cMgPerL[0]!;
    expect(rl.removalFraction).toBeCloseTo(1 - c / cr.systems[i]!.c0MgPerL, 9);
    expect(cr.curves!.removalPercent.SUC!.length).toBe(cr.curves!.dosesMgPerL.length);
  });

  it('reads right in the headline figures, compounds.csv and the report table', () => {
    const figs = headlineFigures(hard);
    const goals = figs.find((f) => f.label === 'Carbon A (coal-based): goals')!;
    expect(goals.value).toBe('all goals met');
    expect(goals.note).toContain('reported only, without a goal: SUC');
    const rows = compoundsCsv(hard).split('\n').filter((l) => l.includes(',SUC,'));
    expect(rows.length).toBe(2);
    for (const l of rows) expect(l).toContain(',report only (no goal),0,,report only,no,');
    const table = buildReportModel(hard, 'test').sections.find((s) => s.tables?.[0]?.columns.includes('dose for goal (mg/L)'))!.tables![0]!;
    const suc = table.rows.find((r) => r[0] === 'SUC')!;
    expect(suc[1]).toBe('report only (no goal)');
    expect(suc[2]).toBe('report only');
  });

  it('with only report-only compounds and no indicator goal the headline says there is no goal to design for', () => {
    const r = runPipeline(loadProject(project((p) => { delete p.goals.indicator; for (const c of p.compounds) { c.goal = 'none'; delete c.limit; } })), now);
    const f = headlineFigures(r).find((x) => x.label === 'Carbon A (coal-based): required dose')!;
    expect(f.value).toBe('no goal to design for');
    expect(f.note).toMatch(/^reported only, without a goal: CBZ, DCF/);
  });
});

describe('report-only compounds in the Monte Carlo', () => {
  it('their quantity is the removal at the required dose (point estimate re-solved by batch IAST); the draws give removals, not doses', async () => {
    const file = project((p) => { delete p.goals.indicator; p.compounds.find((c: { id: string }) => c.id === governing).goal = 'none'; p.uncertainty = { draws: 8, seed: 3 }; });
    const r = await runPipelineWithUncertainty(loadProject(file), { ...now, workers: 0 });
    const u = pac(r)[0]!.uncertainty!.result.quantities;
    expect(u.find((q) => q.key === `dose:${governing}`)).toBeUndefined();
    const q = u.find((x) => x.key === `removal:${governing}`)!;
    expect(q.unit).toBe('fraction');
    const cr = pac(r)[0]!;
    const i = cr.systems.findIndex((s) => s.compoundId === governing);
    const c = solveBatchPrepared(prepareSystem(cr.systems[i]!, r.project.site.docMgPerL), cr.required!.doseMgPerL! / 1000).cMgPerL[0]!;
    expect(q.pointEstimate).toBeCloseTo(1 - c / cr.systems[i]!.c0MgPerL, 12);
    // the fitted fractions are drawn from their intervals, so the draws spread; removals stay in (0, 1)
    expect(q.unreachableDraws).toBe(0);
    for (const x of [q.p10, q.p50, q.p90]) { expect(x).toBeGreaterThan(0); expect(x).toBeLessThan(1); }
    expect(q.p10).toBeLessThanOrEqual(q.p50);
    expect(q.p50).toBeLessThanOrEqual(q.p90);
    expect(u.find((x) => x.key === 'governing_dose')!.pointEstimate).toBeCloseTo(pac(ro)[0]!.required!.doseMgPerL!, 9);
  }, 120_000);
});
