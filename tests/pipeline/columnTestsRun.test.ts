/**
 * Column tests in the whole job (src/pipeline/columnCalibrationStep.ts): a GAC carbon's
 * `carbons[i].kinetics.column_tests` are fitted with the same column calibration as
 * `sorbshare calibrate --model column`, scaled to the carbon's grains, and the fitted Ds replaces
 * the given one in the kinetic run length. The fixture (fixtures/project/gac-column-test, invented)
 * is one GAC carbon and carbamazepine at the design DOC of its background file (8 mg/L), so the
 * CLI's background file and the run's background are the same water.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { pipelineOutputs } from '../../src/outputFiles/pipelineOutputs.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import type { PipelineInput } from '../../src/pipeline/pipelineTypes.js';
import { runBin, scratchDir } from '../helpers/cliHarness.js';

const DIR = join(process.cwd(), 'fixtures/project/gac-column-test');
const FIXTURE = join(DIR, 'project.json');
const NOW = { now: new Date('2026-01-01T00:00:00Z') };

/** The same project without column tests and with the given Ds of CBZ (m²/s). */
function withoutTests(input: PipelineInput, dsM2PerS: number): PipelineInput {
  const carbon = input.project.carbons[0]!;
  const k = { ...carbon.bedKinetics!, compounds: { ...carbon.bedKinetics!.compounds, CBZ: { ...carbon.bedKinetics!.compounds.CBZ!, dsM2PerS } } };
  delete k.columnTests;
  const rest = { ...input };
  delete rest.columnTests;
  return { ...rest, project: { ...input.project, carbons: [{ ...carbon, bedKinetics: k }] } };
}

describe('a GAC carbon\'s column test fitted in the run', () => {
  const input = loadProject(FIXTURE);
  const r = runPipeline(input, NOW);
  const cr = r.carbons[0]!;
  const fit = cr.columnCalibration!.fits[0]!;

  it('reproduces sorbshare calibrate --model column on the same table and inputs', () => {
    const cli = runBin('calibrate', join(DIR, 'breakthrough_cbz.csv'), '--model', 'column', '--compound', join(DIR, 'cbz.json'),
      '--background', join(DIR, 'background.json'), '--doc', '8 mg/L', '--doc-ds', '2e-15 m2/s', '--dl', '4e-10 m2/s',
      '--ebct', '2 min', '--bed-depth', '0.2 m', '--grain-radius', '0.1 mm', '--grain-density', '750 kg/m3', '--porosity', '0.4', '--json');
    expect(cli.code, cli.err).toBe(0);
    const c = JSON.parse(cli.out);
    // the same fit on the same data: the run's background is fraction × DOC and the CLI's the file's
    // c0 at the same DOC (equal to rounding), so the two agree far inside the fit's precision (1e-6 relative)
    expect(Math.abs(fit.result.parameters.Ds_m2_per_s / c.parameters.Ds_m2_per_s - 1)).toBeLessThan(1e-6);
    expect(Math.abs(fit.result.ci95.Ds_m2_per_s![0] / c.ci95.Ds_m2_per_s[0] - 1)).toBeLessThan(1e-5);
    expect(Math.abs(fit.result.fit.rmse / c.fit.rmse - 1)).toBeLessThan(1e-5);
    expect(fit.result.fit.points).toBe(c.fit.points);
    expect(fit.result.fit.points).toBe(11);
  }, 600_000);

  it('scales the test\'s Ds to the carbon\'s grains with proportional diffusivity, and the interval with it', () => {
    // Ds_LC = Ds_SC·(R_LC/R_SC)^1 = 5·Ds_SC for 0.5 mm against 0.1 mm (Crittenden et al. 1986, from memory; closed form)
    expect(fit.dsM2PerS / fit.result.parameters.Ds_m2_per_s).toBeCloseTo(5, 12);
    expect(fit.ci95M2PerS![0] / fit.result.ci95.Ds_m2_per_s![0]).toBeCloseTo(5, 12);
    expect(fit.ci95M2PerS![1] / fit.result.ci95.Ds_m2_per_s![1]).toBeCloseTo(5, 12);
    // the invented test was generated with 1e-14 m²/s on the full-size grains (generate.ts) with
    // 0.02 scatter in c/c0: the interval covers it, and excludes the given 3e-14
    expect(fit.ci95M2PerS![0]).toBeLessThan(1e-14);
    expect(fit.ci95M2PerS![1]).toBeGreaterThan(1e-14);
    expect(fit.ci95M2PerS![1]).toBeLessThan(3e-14);
    expect(fit.givenM2PerS).toBe(3e-14);
  });

  it('the fitted Ds reaches the carbon\'s run length: the same as a run given that Ds, unlike a run with the given one', () => {
    expect(cr.carbon.bedKinetics!.compounds.CBZ!.dsM2PerS).toBe(fit.dsM2PerS);
    const run = cr.gacKinetic!.run.runBedVolumes!;
    expect(run).toBeGreaterThan(0);
    const same = runPipeline(withoutTests(input, fit.dsM2PerS), NOW).carbons[0]!.gacKinetic!.run.runBedVolumes!;
    expect(same).toBe(run);
    const given = runPipeline(withoutTests(input, 3e-14), NOW).carbons[0]!.gacKinetic!.run.runBedVolumes!;
    // a larger Ds spreads the front less: the run lasts longer (model property; here about 5 % for
    // 3.2 times the Ds, since film and preloading share the control); 2 % is four times the grid
    // error the fixed-bed tests allow (< 0.5 % on refining both grids)
    expect(given / run).toBeGreaterThan(1.02);
  }, 600_000);

  it('is listed in run.json (snake_case), column_calibration.csv and the report\'s calibration section', () => {
    const texts = pipelineOutputs(r, { toolVersion: 'test', nodeVersion: 'v0' });
    const rec = JSON.parse(texts['run.json']);
    const k = rec.results.carbons[0].column_calibration;
    expect(k).toHaveLength(1);
    expect([k[0].parameter, k[0].compound, k[0].model, k[0].file, k[0].scale_up]).toEqual(['Ds', 'CBZ', 'column', 'breakthrough_cbz.csv', 'proportional']);
    expect(k[0].fitted_m2_per_s).toBe(fit.dsM2PerS);
    expect(k[0].given_m2_per_s).toBe(3e-14);
    expect(k[0].result.parameters.Ds_m2_per_s).toBe(fit.result.parameters.Ds_m2_per_s);
    const csv = texts['column_calibration.csv']!.trim().split('\n');
    expect(csv).toHaveLength(2);
    expect(csv[1]!.startsWith('Test GAC (invented),CBZ,')).toBe(true);
    const sec = buildReportModel(r, 'test').sections.find((s) => s.id === 'calibration')!;
    expect(sec.heading).toBe('Calibration to column tests');
    expect(sec.tables![0]!.rows).toHaveLength(1);
    const plot = sec.plots![0]! as { id: string; series: Array<{ points: Array<[number, number]> }> };
    expect(plot.id).toBe('column-calibration-1');
    // measured and fitted c/c0 at the table's bed volumes
    expect(plot.series.map((s) => s.points.length)).toEqual([11, 11]);
    expect(plot.series[1]!.points[10]).toEqual([140000, 0.7485]);
  });
});

describe('sorbshare run with a bad column test', () => {
  const raw = JSON.parse(readFileSync(FIXTURE, 'utf8'));
  raw.background.file = join(DIR, 'background.json');
  const cases: Array<[string, (d: string) => void, string]> = [
    ['a missing table', () => { raw.carbons[0].kinetics.column_tests.Ds.CBZ.file = 'nowhere.csv'; }, 'carbons[0].kinetics.column_tests.Ds.CBZ.file'],
    ['bed volumes not increasing', (d) => { writeFileSync(join(d, 'bt.csv'), 'bed volumes (-),c/c0 (-)\n1000,0.1\n900,0.2\n2000,0.3\n'); raw.carbons[0].kinetics.column_tests.Ds.CBZ.file = 'bt.csv'; }, 'carbons[0].kinetics.column_tests.Ds.CBZ.file'],
    ['a text in a number column', (d) => { writeFileSync(join(d, 'bt.csv'), 'bed volumes (-),c/c0 (-)\n1000,0.1\n2000,abc\n3000,0.3\n'); raw.carbons[0].kinetics.column_tests.Ds.CBZ.file = 'bt.csv'; }, 'carbons[0].kinetics.column_tests.Ds.CBZ.file'],
    ['c/c0 above 1.2', (d) => { writeFileSync(join(d, 'bt.csv'), 'bed volumes (-),c/c0 (-)\n1000,0.1\n2000,1.5\n3000,0.3\n'); raw.carbons[0].kinetics.column_tests.Ds.CBZ.file = 'bt.csv'; }, 'carbons[0].kinetics.column_tests.Ds.CBZ.file'],
    ['a zero EBCT', () => { raw.carbons[0].kinetics.column_tests.Ds.CBZ.ebct = '0 min'; }, 'carbons[0].kinetics.column_tests.Ds.CBZ.ebct'],
  ];
  for (const [what, mutate, path] of cases) {
    it(`${what}: exits 2 naming ${path}, and writes nothing`, () => {
      const saved = JSON.stringify(raw);
      const { dir, write } = scratchDir('sorbshare-colrun-');
      mutate(dir);
      const file = write('project.json', raw);
      Object.assign(raw, JSON.parse(saved));
      const out = join(dir, 'out');
      const run = runBin('run', file, '--out', out);
      expect(run.code, run.err).toBe(2);
      expect(run.err).toContain(path);
      expect(existsSync(out)).toBe(false);
    }, 120_000);
  }
});
