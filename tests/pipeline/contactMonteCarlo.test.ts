/**
 * The Monte Carlo under the plant's PAC contact conditions (src/pipeline/contactUncertainty.ts):
 * every draw designs the carbon with the contact model and drawn surface diffusivities. Small
 * kinetic settings (6 interior collocation points, rtol 1e-6; coarser settings leave the dose search's check of 4 digits unmet here;
 * the kinetic core is being made faster on another branch) and a few draws keep it to seconds.
 * The fixture's kinetic jar tests are left out here (their fits are checked in
 * kineticTestsRun.test.ts), so the given Ds are the run's.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipelineWithUncertainty } from '../../src/pipeline/runWithUncertainty.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { runRecord } from '../../src/output/runRecord.js';
import type { PipelineInput } from '../../src/pipeline/pipelineTypes.js';
import type { UncertaintySpec } from '../../src/project/projectTypes.js';

const FIXTURE = join(process.cwd(), 'fixtures/project/pac-kinetic-tests/project.json');
const FAST = { kinetic: { interiorPoints: 6, rtol: 1e-6 }, workers: 1, now: new Date('2026-01-01T00:00:00Z') };
const ZERO: UncertaintySpec = { draws: 50, seed: 5, KRelSd: 0, oneOverNRelSd: 0, docRelSd: 0, fractionRelSd: 0, backgroundKRelSd: 0, dsRelSd: 0, contactDraws: 3 };

/** The fixture without its kinetic jar tests, with the given uncertainty section. */
function given(uncertainty: UncertaintySpec): PipelineInput {
  const input = loadProject(FIXTURE);
  const carbons = input.project.carbons.map((c) => { const k = { ...c.kinetics! }; delete k.tests; return { ...c, kinetics: k }; });
  const out: PipelineInput = { ...input, project: { ...input.project, carbons, uncertainty } };
  delete out.kineticTests;
  return out;
}

describe('Monte Carlo under PAC contact conditions', () => {
  it('with every deviation zero (Ds_rel_sd 0 too) each band collapses onto the run\'s figure under contact', async () => {
    const r = await runPipelineWithUncertainty(given(ZERO), FAST);
    const cr = r.carbons[0]!;
    expect(cr.contact).toBeDefined();
    const u = cr.uncertainty!;
    expect(u).toBeDefined();
    expect(u.result.draws).toBe(3); // contact_draws, below draws
    expect(u.problem.kinetics).toBeDefined();
    // the point estimate printed beside each band is the run's own figure under contact (runFigures)
    expect(u.result.quantities.find((q) => q.key === 'governing_dose')!.pointEstimate).toBe(cr.required!.doseMgPerL);
    expect(u.result.quantities.find((q) => q.key === 'dose:CBZ')!.pointEstimate).toBe(cr.required!.compounds[0]!.doseMgPerL);
    for (const q of u.result.quantities) {
      // zero deviations: every draw is the point estimate through the same arithmetic (the draws
      // build the background as fraction × DOC, the run from the background file: equal to rounding,
      // and the dose search stops at |Δ ln D| ≤ 1e-12), hence 1e-9 relative
      for (const p of [q.p10, q.p50, q.p90]) expect(Math.abs(p - q.pointEstimate)).toBeLessThanOrEqual(1e-9 * Math.abs(q.pointEstimate) + 1e-15);
    }
  }, 300_000);

  it('with a Ds spread the doses spread, the Ds are listed with their basis, and the report states the contact draws', async () => {
    const r = await runPipelineWithUncertainty(given({ ...ZERO, dsRelSd: 0.5, contactDraws: 4 }), FAST);
    const cr = r.carbons[0]!;
    const u = cr.uncertainty!;
    expect(u.result.draws).toBe(4);
    expect(u.parameters.map((p) => p.parameter)).toEqual(['Ds of CBZ', 'Ds of the fictive DOC components (doc_Ds)']);
    expect(u.parameters.every((p) => p.basis === 'project uncertainty.Ds_rel_sd' && p.sd === 0.5)).toBe(true);
    const gov = u.result.quantities.find((q) => q.key === 'governing_dose')!;
    expect(gov.p90).toBeGreaterThan(gov.p10); // a 50 % spread of Ds moves the dose under a 30-minute contact
    expect(gov.pointEstimate).toBe(cr.required!.doseMgPerL);
    const model = buildReportModel(r, 'test');
    const text = JSON.stringify(model.sections.find((s) => s.id === 'uncertainty'));
    expect(text).toContain('this carbon ran 4 draws (uncertainty.contact_draws');
    expect(text).toContain('Ds of CBZ (project uncertainty.Ds_rel_sd)');
    const rec = runRecord(r, { toolVersion: 'test', nodeVersion: 'v0' }) as { results: { carbons: Array<{ monte_carlo: { problem: { kinetics: Record<string, unknown> } } }> } };
    const k = rec.results.carbons[0]!.monte_carlo.problem.kinetics as { targets: Array<Record<string, unknown>>; contact: Record<string, unknown> };
    expect(Object.keys(k.targets[0]!).sort()).toEqual(['DL_m2_per_s', 'Ds_m2_per_s', 'ln_Ds_sd']);
    expect(k.contact.contact_time_s).toBe(1800);
    // the whole run.json of a contact Monte Carlo is snake_case (a key with a lower-case letter or
    // digit before a capital is camelCase; compound ids are not camelCase in this fixture)
    const camel: string[] = [];
    const walk = (v: unknown, path: string): void => {
      if (Array.isArray(v)) v.forEach((x) => walk(x, `${path}[]`));
      else if (v !== null && typeof v === 'object') for (const [key, x] of Object.entries(v)) { if (/[a-z0-9][A-Z]/.test(key)) camel.push(`${path}.${key}`); walk(x, `${path}.${key}`); }
    };
    walk(rec, '$');
    expect(camel).toEqual([]);
  }, 300_000);

  it('contact_draws 0 skips the Monte Carlo under contact with the reason; equilibrium carbons keep draws', async () => {
    const r = await runPipelineWithUncertainty(given({ ...ZERO, contactDraws: 0 }), FAST);
    expect(r.carbons[0]!.uncertainty).toBeUndefined();
    expect(r.warnings.some((w) => w.includes('uncertainty.contact_draws is 0'))).toBe(true);
    const plain = given({ ...ZERO, contactDraws: 0 });
    const site = { ...plain.project.site };
    delete site.pacContact;
    const eq = await runPipelineWithUncertainty({ ...plain, project: { ...plain.project, site } }, FAST);
    expect(eq.carbons[0]!.uncertainty!.result.draws).toBe(50); // contact_draws only limits contact carbons
    expect(runPipeline({ ...plain, project: { ...plain.project, site } }, FAST).carbons[0]!.required!.doseMgPerL).toBe(eq.carbons[0]!.required!.doseMgPerL);
  }, 300_000);
});
