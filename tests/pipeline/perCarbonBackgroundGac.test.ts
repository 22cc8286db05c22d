/**
 * Per-carbon background on a GAC carbon with fixed-bed kinetics (issue 11, capability 21), on the
 * invented fixture fixtures/project/gac-kinetic. The carbon's K factor 0.9 is pinned off the
 * compounds by per-compound isotherms equal to the reference ones, so it acts on the background
 * only. Expected (closed form of the rule "own background: factor 1 on its K"): with the project's
 * background file as the carbon's own, the run equals the run of the same carbon at K factor 1
 * without an own background — the same fixed-bed problem, so equal to 1e-12 — and differs from
 * the run at K factor 0.9 on the project's background.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import type { PipelineInput } from '../../src/pipeline/pipelineTypes.js';

const PROJECT = join(process.cwd(), 'fixtures/project/gac-kinetic/project.json');

/** The fixture's GAC carbon alone, with K factor `f`, the reference isotherms pinned, and optionally the background file as its own. */
function gacOnly(f: number, ownBackground: boolean): PipelineInput {
  const input = loadProject(PROJECT);
  const gac = input.project.carbons.find((c) => c.type === 'GAC')!;
  const isotherms = Object.fromEntries(input.project.compounds.map((c) => [c.id, { K: c.K, oneOverN: c.oneOverN }]));
  const carbon = { ...gac, kFactor: f, isotherms, ...(ownBackground ? { background: { kind: 'file' as const, file: 'background.json' } } : {}) };
  const out: PipelineInput = { ...input, project: { ...input.project, carbons: [carbon] } };
  if (ownBackground) out.carbonBackgrounds = { [carbon.name]: { backgroundFile: input.backgroundFile! } };
  return out;
}

describe('a GAC carbon with fixed-bed kinetics and its own background', () => {
  it('its fixed bed takes its own components unscaled: equal to K factor 1 (1e-12), unlike K factor 0.9 on the project\'s background', () => {
    const own = runPipeline(gacOnly(0.9, true)).carbons[0]!;
    const ref = runPipeline(gacOnly(1, false)).carbons[0]!;
    const scaled = runPipeline(gacOnly(0.9, false)).carbons[0]!;
    expect(own.background!.source).toBe('own file');
    const a = own.gacKinetic!.simulation;
    const b = ref.gacKinetic!.simulation;
    const c = scaled.gacKinetic!.simulation;
    expect(a.components.map((x) => x.id)).toEqual(b.components.map((x) => x.id));
    a.components.forEach((x, i) => x.cOverC0.forEach((v, k) => expect(Math.abs(v - b.components[i]!.cOverC0[k]!)).toBeLessThan(1e-12)));
    expect(own.gacKinetic!.run.runBedVolumes).toBe(ref.gacKinetic!.run.runBedVolumes);
    // on the project's background the factor 0.9 weakens the DOC: a different run
    expect(c.components.some((x, i) => x.cOverC0.some((v, k) => Math.abs(v - a.components[i]!.cOverC0[k]!) > 1e-3))).toBe(true);
  }, 300_000);
});
