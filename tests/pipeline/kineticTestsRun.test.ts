/**
 * Kinetic jar tests in the whole job (src/pipeline/kineticCalibrationStep.ts): the project's
 * `carbons[i].kinetics.kinetic_tests` are fitted with the same kinetic calibration as
 * `sorbshare calibrate --model surface-diffusion[-doc]`, and the fitted Ds replace the given ones.
 * The fixture (fixtures/project/pac-kinetic-tests, invented) uses a background file at DOC0 8 mg/L,
 * the site's design DOC, so the CLI's background file and the run's background are the same water.
 * The run here is under equilibrium contact (the fits do not depend on the contact conditions and
 * the equilibrium design is quick); the contact model's use of the fitted Ds is checked through
 * the carbon's kinetic data, which the contact factory reads (src/pipeline/contactModel.ts).
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { runRecord } from '../../src/output/runRecord.js';
import { kineticCalibrationCsv } from '../../src/output/kineticCalibrationRecord.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import type { PipelineInput } from '../../src/pipeline/pipelineTypes.js';
import { runBin, scratchDir } from '../helpers/cliHarness.js';

const DIR = join(process.cwd(), 'fixtures/project/pac-kinetic-tests');
const FIXTURE = join(DIR, 'project.json');

function underEquilibrium(input: PipelineInput): PipelineInput {
  const site = { ...input.project.site };
  delete site.pacContact;
  return { ...input, project: { ...input.project, site } };
}

describe('kinetic jar tests fitted in the run', () => {
  const r = runPipeline(underEquilibrium(loadProject(FIXTURE)), { now: new Date('2026-01-01T00:00:00Z') });
  const cr = r.carbons[0]!;
  const fits = cr.kineticCalibration!.fits;
  const doc = fits.find((f) => f.parameter === 'doc_Ds')!;
  const cbz = fits.find((f) => f.parameter === 'Ds' && f.compoundId === 'CBZ')!;

  it('reproduce the Ds of sorbshare calibrate --model surface-diffusion-doc and surface-diffusion on the same tables', () => {
    const common = ['--background', join(DIR, 'background.json'), '--particle-radius', '12 um', '--particle-density', '650 kg/m3', '--dl', '4e-10 m2/s', '--json'];
    const cliDoc = runBin('calibrate', join(DIR, 'kinetic_tests_doc.csv'), '--model', 'surface-diffusion-doc', ...common);
    expect(cliDoc.code, cliDoc.err).toBe(0);
    const docDs = JSON.parse(cliDoc.out).parameters.Ds_m2_per_s as number;
    // the same fit on the same table: the run's background is fraction × DOC, the file's c0 the
    // same numbers to rounding, so the two fits agree far inside the fit's own precision (1e-6 relative)
    expect(Math.abs(doc.result.parameters.Ds_m2_per_s / docDs - 1)).toBeLessThan(1e-6);
    // the target's fit uses the fitted doc_Ds, as the CLI does with --doc-ds
    const cliCbz = runBin('calibrate', join(DIR, 'kinetic_tests_cbz.csv'), '--model', 'surface-diffusion', '--compound', join(DIR, 'cbz.json'), '--doc-ds', `${doc.result.parameters.Ds_m2_per_s} m2/s`, ...common);
    expect(cliCbz.code, cliCbz.err).toBe(0);
    const cli = JSON.parse(cliCbz.out);
    expect(Math.abs(cbz.result.parameters.Ds_m2_per_s / cli.parameters.Ds_m2_per_s - 1)).toBeLessThan(1e-6);
    expect(cbz.result.ci95.Ds_m2_per_s![0] / cli.ci95.Ds_m2_per_s[0]).toBeCloseTo(1, 5);
    expect(cbz.result.fit.points).toBe(cli.fit.points);
  }, 600_000);

  it('the fitted values replace the given ones in the carbon\'s kinetic data; the given ones are kept beside them', () => {
    expect(cr.carbon.kinetics!.dsM2PerS.CBZ).toBe(cbz.result.parameters.Ds_m2_per_s);
    expect(cr.carbon.kinetics!.docDsM2PerS).toBe(doc.result.parameters.Ds_m2_per_s);
    expect(cbz.givenM2PerS).toBe(2e-15); // the project's "2e-15 m2/s"
    expect(doc.givenM2PerS).toBe(2e-15);
    // the invented tests were generated with Ds 3e-15 (CBZ) and 1e-15 m²/s (DOC) plus 3 % and 1 % scatter
    // (fixtures/demo/generateKineticTests.ts): the fits land near them, far from the given 2e-15
    expect(doc.result.ci95.Ds_m2_per_s![0]).toBeLessThan(1e-15);
    expect(doc.result.ci95.Ds_m2_per_s![1]).toBeGreaterThan(1e-15);
    expect(cbz.result.ci95.Ds_m2_per_s![0]).toBeLessThan(3e-15);
    expect(cbz.result.ci95.Ds_m2_per_s![1]).toBeGreaterThan(3e-15);
  });

  it('are listed in run.json (snake_case), kinetic_calibration.csv and the report\'s calibration section with the measured-against-fitted figures', () => {
    const rec = runRecord(r, { toolVersion: 'test', nodeVersion: 'v0' }) as { results: { carbons: Array<{ kinetic_calibration: Array<Record<string, unknown>> }> } };
    const k = rec.results.carbons[0]!.kinetic_calibration;
    expect(k.map((x) => [x.parameter, x.compound])).toEqual([['doc_Ds', 'DOC'], ['Ds', 'CBZ']]);
    expect(k[1]!.fitted_m2_per_s).toBe(cbz.result.parameters.Ds_m2_per_s);
    expect(k[1]!.given_m2_per_s).toBe(2e-15);
    const csv = kineticCalibrationCsv(r).trim().split('\n');
    expect(csv).toHaveLength(3);
    expect(csv[2]!.startsWith('Test PAC (invented),Ds,CBZ,surface-diffusion,')).toBe(true);
    const sec = buildReportModel(r, 'test').sections.find((s) => s.id === 'calibration')!;
    expect(sec.heading).toBe('Calibration to kinetic jar tests');
    expect(sec.tables![0]!.rows).toHaveLength(2);
    expect(sec.plots!.map((p) => p.id)).toEqual(['kinetic-calibration-1', 'kinetic-calibration-2']);
  });
});

describe('sorbshare run with a bad kinetic test reference', () => {
  it('exits 2 naming the JSON path of the missing table, and writes nothing', () => {
    const { dir, write } = scratchDir('sorbshare-kinrun-');
    const raw = JSON.parse(readFileSync(FIXTURE, 'utf8'));
    raw.background.file = join(DIR, 'background.json');
    raw.carbons[0].kinetics.kinetic_tests = { Ds: { CBZ: 'nowhere.csv' }, doc_Ds: join(DIR, 'kinetic_tests_doc.csv') };
    const file = write('project.json', raw);
    const out = join(dir, 'out');
    const run = runBin('run', file, '--out', out);
    expect(run.code).toBe(2);
    expect(run.err).toContain('carbons[0].kinetics.kinetic_tests.Ds.CBZ');
    expect(existsSync(out)).toBe(false);
  });
});
