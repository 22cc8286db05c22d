/**
 * The Monte Carlo of a GAC carbon's kinetic run length (src/pipeline/gacUncertainty.ts): draws of
 * the target's K, 1/n and Ds with the background at its point value, each draw integrating the
 * compounds against the stored background (traceBed) and taking the staggered run like the run.
 * Checks: with every deviation zero the draws reproduce the run's own figures (closed form: a
 * lognormal draw with σ = 0 is its median, so every draw is the run; the only difference is the
 * trace shortcut against the coupled solve, within 0.5 %); a fitted Ds takes its 95 % interval
 * (SD of ln Ds = ln(hi/lo)/(2·1.96), normal approximation — computed from a published rule, the
 * normal 97.5 % quantile); `uncertainty.gac_draws` in the validator and the schema.
 * Fixture: fixtures/project/gac-column-test (invented, one GAC carbon and carbamazepine).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { gacDrawCount, gacUncertainty, startGacUncertainty, withGacUncertainty, DEFAULT_GAC_DRAWS } from '../../src/pipeline/gacUncertainty.js';
import { runRecord } from '../../src/output/runRecord.js';
import { gacBreakthroughSection } from '../../src/output/gacBreakthroughSection.js';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from '../project/jsonSchemaCheck.js';
import type { PipelineInput } from '../../src/pipeline/pipelineTypes.js';

const DIR = join(process.cwd(), 'fixtures/project/gac-column-test');
const NOW = { now: new Date('2026-01-01T00:00:00Z') };
const BASE = { draws: 500, seed: 7, KRelSd: 0, oneOverNRelSd: 0, docRelSd: 0, fractionRelSd: 0, backgroundKRelSd: 0, dsRelSd: 0, source: 'test' };

/** The fixture without its column test (the given Ds of CBZ stays): no fit, a quick run. */
function withoutTests(input: PipelineInput): PipelineInput {
  const carbon = input.project.carbons[0]!;
  const k = { ...carbon.bedKinetics! };
  delete k.columnTests;
  const rest = { ...input };
  delete rest.columnTests;
  return { ...rest, project: { ...input.project, carbons: [{ ...carbon, bedKinetics: k }] } };
}

describe('GAC Monte Carlo of the run length', () => {
  const loaded = loadProject(join(DIR, 'project.json'));
  const r = runPipeline(withoutTests(loaded), NOW);
  const cr = r.carbons[0]!;
  const k = cr.gacKinetic!;

  it('with every deviation zero the bands collapse onto the run\'s figures (within the trace shortcut\'s 0.5 %)', () => {
    const u = gacUncertainty(r.project, cr, 0, { ...BASE, gacDraws: 3 });
    if ('skipped' in u) throw new Error(u.skipped);
    expect(u.draws).toBe(3);
    expect(u.parameters).toEqual([]);
    expect(u.atCurveEndDraws).toBe(0);
    expect(u.noRunDraws).toBe(0);
    const run = u.quantities.find((q) => q.key === 'run_bed_volumes')!;
    expect(run.pointEstimate).toBe(k.run.runBedVolumes);
    for (const q of u.quantities) {
      expect(Number.isFinite(q.pointEstimate)).toBe(true);
      for (const p of [q.p10, q.p50, q.p90]) expect(Math.abs(p / q.pointEstimate - 1)).toBeLessThan(0.005);
    }
    expect(u.quantities.find((q) => q.key === 'cost_per_m3')!.pointEstimate).toBe(k.use!.costPerM3);
  });

  it('with spread: ordered percentiles, the sampled parameters listed, the background said to stay at its point value', () => {
    const out = withGacUncertainty(r, { ...BASE, KRelSd: 0.2, oneOverNRelSd: 0.05, dsRelSd: 0.3, gacDraws: 6 });
    const u = out.carbons[0]!.gacUncertainty!;
    expect(u.draws).toBe(6);
    expect(u.parameters.map((p) => p.parameter)).toEqual(["compounds' K (fixed bed)", "compounds' 1/n (fixed bed)", 'Ds of CBZ (fixed bed)']);
    expect(u.notSampled).toMatch(/background .* point value/);
    const run = u.quantities.find((q) => q.key === 'run_bed_volumes')!;
    expect(run.p10).toBeLessThan(run.p90);
    expect(run.p10).toBeLessThanOrEqual(run.p50);
    expect(run.p50).toBeLessThanOrEqual(run.p90);
    const use = u.quantities.find((q) => q.key === 'carbon_usage_g_per_m3')!;
    expect(use.p10).toBeLessThan(use.p90); // a longer run, less carbon per m³
    expect(out.timingMs['GAC Monte Carlo']).toBeGreaterThan(0);
    const rec = runRecord(out, { toolVersion: 'test', nodeVersion: 'test' }) as { results: { carbons: Array<{ gac_kinetic: Record<string, any> }> } }; // eslint-disable-line @typescript-eslint/no-explicit-any
    const g = rec.results.carbons[0]!.gac_kinetic;
    expect(g.monte_carlo_draws).toBe(6);
    expect(g.summary.run_bed_volumes_p10).toBe(run.p10);
    expect(g.monte_carlo.quantities[0]).toMatchObject({ key: 'run_bed_volumes', point_estimate: run.pointEstimate, p90: run.p90 });
    const sec = gacBreakthroughSection(out)!;
    expect(sec.paragraphs!.join(' ')).toMatch(/6 draws per GAC carbon/);
    expect(sec.tables!.some((t) => t.caption.includes('P10 / P50 / P90 of 6 draws'))).toBe(true);
  });

  it('begun beside other work (startGacUncertainty, a worker thread sharing the outlets) it gives withGacUncertainty\'s figures', async () => {
    const settings = { ...BASE, KRelSd: 0.2, dsRelSd: 0.3, gacDraws: 2 };
    const strip = (x: typeof r) => ({ ...x.carbons[0]!.gacUncertainty!, timingMs: 0 });
    const one = withGacUncertainty(r, settings);
    const started = startGacUncertainty(r, settings);
    const shared = await started.finish(r);
    expect(strip(shared)).toEqual(strip(one));
    expect(shared.carbons[0]!.warnings).toEqual(one.carbons[0]!.warnings);
  }, 60_000);

  it('a Ds fitted to a column test takes its 95 % interval: SD of ln Ds = ln(hi/lo)/(2·1.96)', () => {
    const fitted = runPipeline(loaded, NOW);
    const c = fitted.carbons[0]!;
    const ci = c.columnCalibration!.fits[0]!.ci95M2PerS!;
    const u = gacUncertainty(fitted.project, c, 0, { ...BASE, gacDraws: 1 });
    if ('skipped' in u) throw new Error(u.skipped);
    const p = u.parameters.find((x) => x.parameter === 'Ds of CBZ (fixed bed)')!;
    const sigma = Math.log(ci[1] / ci[0]) / (2 * 1.959963984540054);
    expect(p.sd).toBeCloseTo(Math.sqrt(Math.expm1(sigma * sigma)), 12);
    expect(p.basis).toMatch(/column fit 95 % interval/);
  });

  it('uncertainty.gac_draws: default 20, at most draws, 0 switches it off; validator and schema', () => {
    expect(DEFAULT_GAC_DRAWS).toBe(20);
    expect(gacDrawCount({ draws: 500 })).toBe(20);
    expect(gacDrawCount({ draws: 5 })).toBe(5);
    expect(gacDrawCount({ draws: 500, gacDraws: 40 })).toBe(40);
    expect(withGacUncertainty(r, { ...BASE, gacDraws: 0 })).toBe(r);
    const raw = JSON.parse(readFileSync(join(DIR, 'project.json'), 'utf8'));
    raw.uncertainty = { draws: 100, gac_draws: 12 };
    expect(validateProject(raw).uncertainty!.gacDraws).toBe(12);
    const schema = JSON.parse(readFileSync(join(process.cwd(), 'schema/project.schema.json'), 'utf8'));
    delete raw.$schema;
    expect(validateAgainstSchema(schema, raw)).toEqual([]);
    raw.uncertainty.gac_draws = -1;
    expect(validateAgainstSchema(schema, raw)).not.toEqual([]);
    const err = (() => { try { validateProject(raw); } catch (e) { return e; } return undefined; })();
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).location.path).toBe('uncertainty.gac_draws');
  });
});
