/**
 * Speed of one Monte Carlo draw under PAC contact conditions (src/pipeline/contactUncertainty.ts):
 * the whole design of one carbon with the contact model and drawn Ds, on the small invented
 * fixture fixtures/project/pac-kinetic-tests (one compound, a 30-minute plug-flow tank, 6 interior
 * points and rtol 1e-6 as tests/pipeline/contactMonteCarlo.test.ts: at the default settings this
 * fixture's dose search misses its 1e-9 check on the removal, a matter of the kinetic core; its
 * kinetic jar tests left out). No target in the issue; the figure
 * tells how many `uncertainty.contact_draws` a run can afford while the kinetic core is slow.
 */
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { resolveUncertaintySettings, uncertaintyProblem } from '../../src/pipeline/uncertaintyStep.js';
import { monteCarlo } from '../../src/uncertainty/monteCarlo.js';

export async function bench(): Promise<Array<{ name: string; value: number; unit: string; target?: string }>> {
  const input = loadProject(join(import.meta.dirname, '../../fixtures/project/pac-kinetic-tests/project.json'));
  input.project.carbons = input.project.carbons.map((c) => { const k = { ...c.kinetics! }; delete k.tests; return { ...c, kinetics: k }; });
  delete input.kineticTests;
  const kinetic = { interiorPoints: 6, rtol: 1e-6 };
  const run = runPipeline(input, { kinetic });
  const settings = resolveUncertaintySettings(input.project.uncertainty, {})!;
  const cr = run.carbons[0]!;
  const setup = uncertaintyProblem(input.project, cr, run.background, input.project.compounds.map((c) => run.goals[c.id]!), input.series, settings, kinetic);
  if ('skipped' in setup) throw new Error(setup.skipped);
  const draws = 10;
  const cpuMs = (f: () => void) => { const c = process.cpuUsage(); f(); const d = process.cpuUsage(c); return (d.user + d.system) / 1000; };
  const perDraw = cpuMs(() => monteCarlo(setup.problem, { draws, seed: 2026 })) / draws;
  return [
    { name: 'Monte Carlo draw under PAC contact (1 compound, plug-flow 30 min, 6 points, rtol 1e-6, sampled Ds; CPU time, in-thread)', value: +perDraw.toFixed(0), unit: 'ms' },
  ];
}
