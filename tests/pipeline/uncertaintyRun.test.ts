/**
 * The Monte Carlo step in the run (capability 13): reproducible with a seed, collapsing to the
 * point estimate without uncertainty, and the settings resolved from project and command line.
 * Properties only (the fixtures are invented); percentiles are Hyndman & Fan (1996) type 7.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipelineWithUncertainty } from '../../src/pipeline/runWithUncertainty.js';
import { resolveUncertaintySettings, Z95 } from '../../src/pipeline/uncertaintyStep.js';
import { monteCarloProgress } from '../../src/cli/commands/projectRun.js';
import { DEFAULT_UNCERTAINTY } from '../../src/project/projectTypes.js';

const FIXTURE = join(__dirname, '../../fixtures/project/surrogates-gac-mc/project.json');
const DEMO = join(__dirname, '../../fixtures/demo/project.json');
const NOW = { now: new Date('2026-01-01T00:00:00Z'), workers: 0 };
/** The demo without the GAC carbon's run-length draws (slow; tests/pipeline/gacUncertainty.test.ts checks them): these tests are about the PAC draws. */
function demoWithoutGacDraws() {
  const input = loadProject(DEMO);
  return { ...input, project: { ...input.project, uncertainty: { ...input.project.uncertainty!, gacDraws: 0 } } };
}

describe('Monte Carlo in the run', () => {
  it('the same seed gives the same percentiles; another seed gives others', async () => {
    const a = await runPipelineWithUncertainty(demoWithoutGacDraws(), { ...NOW, draws: 30, seed: 5 });
    const b = await runPipelineWithUncertainty(demoWithoutGacDraws(), { ...NOW, draws: 30, seed: 5 });
    const c = await runPipelineWithUncertainty(demoWithoutGacDraws(), { ...NOW, draws: 30, seed: 6 });
    const q = (r: typeof a) => r.carbons.filter((x) => x.uncertainty).map((x) => x.uncertainty!.result.quantities);
    expect(q(a).length).toBe(2);
    expect(q(b)).toEqual(q(a));
    expect(q(c)).not.toEqual(q(a));
    expect(a.carbons[0]!.uncertainty!.governingCurve).toEqual(b.carbons[0]!.uncertainty!.governingCurve);
    // the fitted fractions enter with SD = (upper − lower)/(2·1.96)
    const f1 = a.background.background!.components[1]!;
    const p = a.carbons[0]!.uncertainty!.parameters.find((x) => x.parameter === `fraction of ${f1.id}`)!;
    expect(p.sd).toBeCloseTo((f1.fraction_ci95![1] - f1.fraction_ci95![0]) / (2 * Z95), 15);
    expect(Z95).toBeCloseTo(1.959964, 6); // standard normal 97.5 % quantile (any table)
  });

  it('with zero uncertainty the bands collapse to the point estimate, which is the run\'s own result', async () => {
    const r = await runPipelineWithUncertainty(loadProject(FIXTURE), NOW); // fixture: all relative SDs 0, no fitted intervals
    const cr = r.carbons[0]!;
    const u = cr.uncertainty!;
    expect(u.parameters).toEqual([]);
    for (const q of u.result.quantities) {
      expect(q.p10).toBe(q.pointEstimate);
      expect(q.p50).toBe(q.pointEstimate);
      expect(q.p90).toBe(q.pointEstimate);
    }
    const get = (k: string) => u.result.quantities.find((q) => q.key === k)!.pointEstimate;
    cr.required!.compounds.forEach((d) => expect(get(`dose:${d.compoundId}`) / d.doseMgPerL! - 1).toBeCloseTo(0, 7));
    expect(get('uv254_setpoint')).toBeCloseTo(cr.surrogates!.governing!.uv254Reduction!, 7);
    expect(get('yearly_carbon') / cr.yearly!.carbonKg - 1).toBeCloseTo(0, 7); // no series: design dose × flow × 365
    const band = u.governingCurve!;
    band.p10Percent.forEach((v, i) => {
      expect(v).toBe(band.p90Percent[i]);
      expect(v).toBeCloseTo(cr.curves!.removalPercent[band.compoundId]![i]!, 9);
    });
    expect(u.governingDoseRatio).toEqual({ p10: 1, p90: 1 });
  });

  it('draws 0 switches it off: the result is the plain run', async () => {
    const r = await runPipelineWithUncertainty(loadProject(FIXTURE), { ...NOW, draws: 0 });
    expect(r.uncertainty).toBeUndefined();
    expect(r.carbons.every((c) => c.uncertainty === undefined)).toBe(true);
  });
});

describe('Monte Carlo settings and progress', () => {
  it('the command line overrides the project; without a section only --draws switches it on', () => {
    const spec = { ...DEFAULT_UNCERTAINTY, draws: 100, seed: 3, KRelSd: 0.2 };
    expect(resolveUncertaintySettings(spec, {})).toMatchObject({ draws: 100, seed: 3, KRelSd: 0.2, source: 'project file' });
    expect(resolveUncertaintySettings(spec, { draws: 7, seed: 9 })).toMatchObject({ draws: 7, seed: 9, KRelSd: 0.2 });
    expect(resolveUncertaintySettings(spec, { draws: 0 })).toBeUndefined();
    expect(resolveUncertaintySettings(undefined, {})).toBeUndefined();
    expect(resolveUncertaintySettings(undefined, { draws: 20 })).toMatchObject({ draws: 20, KRelSd: 0 });
  });

  // Common practice (no source): the bar appears only once the draws have run for a second, on stderr.
  it('the progress bar stays silent on short runs and draws on stderr on long ones', () => {
    let t = 0;
    const err: string[] = [];
    const ctx = { out: () => undefined, err: (s: string) => err.push(s), isTTY: false };
    const quick = monteCarloProgress(ctx, 1000, () => t);
    quick.update(250, 500); t = 300; quick.update(500, 500); quick.finish();
    expect(err).toEqual([]);
    t = 0;
    const slow = monteCarloProgress(ctx, 1000, () => t);
    slow.update(250, 2000); t = 1500; slow.update(1000, 2000); t = 3000; slow.update(2000, 2000); slow.finish();
    expect(err.length).toBeGreaterThan(0);
    expect(err.join('')).toMatch(/sorbshare: Monte Carlo \[#+\.*\] +50 % 1000\/2000/);
    expect(err.join('')).toMatch(/100 % 2000\/2000/);
  });
});
