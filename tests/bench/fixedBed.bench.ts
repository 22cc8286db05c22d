/**
 * Figures for issue 10: one breakthrough simulation of the invented demo water
 * (fixtures/column/demo-water.json: non-adsorbable part, 4 fictive DOC components, 9 trace
 * targets) to 100 000 bed volumes as `sorbshare column` runs it (the background once, each trace
 * target alone against it; the coupled solve of all components beside it), EBCT 20 min, bed depth 2 m, ε = 0.4, on the default grid and on
 * the doubled grid, with the mass-balance error, the integrator's step and Newton counts and the
 * grid beside the time. Time is wall time of the first (cold) run and of a second run in the same
 * process; CPU time of the second run beside it, and the 1-minute load average (the machine may
 * be shared: compare CPU times when the load is above the core count).
 *
 * Also one column calibration (Ds of a trace target against the fictive DOC background) on the
 * invented small-column test of fixtures/project/gac-column-test, as `sorbshare calibrate --model
 * column` runs it (no start value: the decade scan first), cold and warm, with its evaluations;
 * and the demo's GAC carbon in the run (column fit, breakthrough, one Monte Carlo draw's work).
 */
import { readFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join } from 'node:path';
import { readKineticMixture } from '../../src/scenario/readKineticInputs.js';
import { column } from '../../src/api/fixedBedApi.js';
import { simulateFixedBed } from '../../src/kinetics/fixedBed.js';
import type { FixedBedComponent } from '../../src/kinetics/fixedBedInput.js';
import { fitColumn } from '../../src/calibration/columnFit.js';
import { readBreakthroughData } from '../../src/calibration/breakthroughData.js';
import type { BackgroundFile } from '../../src/fractionation/backgroundFile.js';
import { gacDocComponents } from '../../src/pipeline/gacKineticStep.js';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import type { BenchFigure } from './run.js';

/**
 * The demo's GAC carbon in the run: CPU time of the GAC steps of runPipeline (column fit and the
 * breakthrough, the background once and each compound alone), second run in the process; then
 * one Monte Carlo draw's work (every compound integrated alone against the run's stored
 * background), best of three.
 */
function demoGacTimed() {
  const input = loadProject(join(process.cwd(), 'fixtures/demo/project.json'));
  runPipeline(input); // warm-up
  let c0 = process.cpuUsage();
  const r = runPipeline(input);
  const runCpu = process.cpuUsage(c0);
  const cr = r.carbons.find((c) => c.gacKinetic)!;
  const k = cr.gacKinetic!;
  const targets: FixedBedComponent[] = cr.systems.map((sys) => ({ id: sys.compoundId, c0MgPerL: sys.c0MgPerL, K: sys.inMixture.K, oneOverN: sys.inMixture.oneOverN, ...cr.carbon.bedKinetics!.compounds[sys.compoundId]! }));
  let drawMs = Infinity;
  for (let i = 0; i < 3; i++) {
    c0 = process.cpuUsage();
    for (const t of targets) k.simulation.storedBackground!.outlet(t);
    const d = process.cpuUsage(c0);
    drawMs = Math.min(drawMs, (d.user + d.system) / 1000);
  }
  return { runCpuMs: (runCpu.user + runCpu.system) / 1000, fitMs: r.timingMs['column calibration']!, breakthroughMs: r.timingMs['GAC breakthrough']!, drawMs, compounds: targets.length, steps: k.simulation.stats.steps };
}

/** The column fit of the gac-column-test fixture (its CLI inputs), timed. */
function columnFitTimed() {
  const dir = join(process.cwd(), 'fixtures/project/gac-column-test');
  const bg = JSON.parse(readFileSync(join(dir, 'background.json'), 'utf8')) as BackgroundFile;
  const background = gacDocComponents(bg, 8, 1, { dsM2PerS: 2e-15, dlM2PerS: 4e-10 });
  const data = readBreakthroughData(readFileSync(join(dir, 'breakthrough_cbz.csv'), 'utf8'), { c0MgPerL: 450e-6 });
  const target = { id: 'CBZ', c0MgPerL: 450e-6, K: 210, oneOverN: 0.3, dlM2PerS: 7e-10 };
  const bed = { ebctS: 120, bedDepthM: 0.2, porosity: 0.4, particleRadiusM: 1e-4, particleDensityKgPerM3: 750, temperatureC: 12 };
  const t = performance.now();
  const c0 = process.cpuUsage();
  const r = fitColumn({ data, target, background, bed });
  const cpu = process.cpuUsage(c0);
  return { ms: performance.now() - t, cpuMs: (cpu.user + cpu.system) / 1000, evaluations: r.fit.evaluations };
}

export async function bench(): Promise<BenchFigure[]> {
  const mixture = readKineticMixture(JSON.parse(readFileSync(join(process.cwd(), 'fixtures/column/demo-water.json'), 'utf8')));
  const opts = { ebctS: 1200, bedDepthM: 2, porosity: 0.4, toBedVolumes: 100000 };
  const timed = (grid?: { cells: number; interiorPoints: number }) => {
    const t = performance.now();
    const c0 = process.cpuUsage();
    const r = column(mixture, { ...opts, ...(grid ? { grid } : {}) });
    const cpu = process.cpuUsage(c0);
    return { ms: performance.now() - t, cpuMs: (cpu.user + cpu.system) / 1000, r };
  };
  const load = loadavg()[0]!;
  const cold = timed();
  const warm = timed();
  const fine = timed({ cells: 120, interiorPoints: 10 });
  const fitCold = columnFitTimed();
  const fitWarm = columnFitTimed();
  const gac = demoGacTimed();
  const bv = (r: typeof cold.r, id: string, k: number) => r.components.find((c) => c.id === id)!.breakthrough[k]!.bed_volumes ?? NaN;
  const g = warm.r.grid;
  const change = (id: string, k: number) => Math.abs(bv(warm.r, id, k) / bv(fine.r, id, k) - 1);
  const targets = ['CBZ', 'DCF', 'MET', 'CLA', 'VEN', 'HCT', 'BTZ', 'CAN', 'MBT'];
  // the integrator's counts (column's JSON does not carry them)
  const p = mixture.particle!;
  const comps: FixedBedComponent[] = mixture.components.map((c) => ({ id: c.id, c0MgPerL: c.c0MgPerL, K: c.K, oneOverN: c.oneOverN, ...(c.dsM2PerS !== undefined ? { dsM2PerS: c.dsM2PerS } : {}), ...(c.dlM2PerS !== undefined ? { dlM2PerS: c.dlM2PerS } : {}) }));
  const bedSpec = { ebctS: opts.ebctS, bedDepthM: opts.bedDepthM, porosity: opts.porosity, particleRadiusM: p.radiusM, particleDensityKgPerM3: p.densityGPerL, temperatureC: 12 };
  // as `column` runs it: the background once, each trace target alone against it (summed counts)
  const stats = simulateFixedBed({ components: comps, bed: bedSpec }, { toBedVolumes: opts.toBedVolumes, storedBackground: true }).stats;
  // the coupled solve of every component at once (the reference the trace shortcut is tested against)
  const tc = performance.now();
  const coupled = simulateFixedBed({ components: comps, bed: bedSpec }, { toBedVolumes: opts.toBedVolumes });
  const coupledMs = performance.now() - tc;
  const coupledChange = Math.max(0, ...targets.map((id) => { const a = coupled.components.find((c) => c.id === id)!.breakthrough[0]!.bedVolumes; const b = bv(warm.r, id, 0); return a ? Math.abs(b / a - 1) : 0; }));
  const worst = (k: number) => Math.max(0, ...targets.map((id) => change(id, k)).filter(Number.isFinite));
  return [
    { name: '  load average (1 min) at the start', value: load, unit: '-' },
    { name: `column, demo water to 100 000 BV, ${g.cells} cells × ${g.interior_points} grain points (first run)`, value: cold.ms, unit: 'ms', target: '≤ 2000 ms' },
    { name: `column, demo water to 100 000 BV, ${g.cells} cells × ${g.interior_points} grain points (second run)`, value: warm.ms, unit: 'ms', target: '≤ 2000 ms' },
    { name: '  CPU time of the second run', value: warm.cpuMs, unit: 'ms', target: '≤ 2000 ms' },
    { name: '  accepted steps (background, and each trace alone, summed)', value: stats.steps, unit: '-' },
    { name: '  rejected steps', value: stats.rejectedSteps, unit: '-' },
    { name: '  Newton failures', value: stats.newtonFailures, unit: '-' },
    { name: '  Newton iterations', value: stats.newtonIterations, unit: '-' },
    { name: '  mass-balance error (fed − left − held)/fed', value: warm.r.mass_balance_error, unit: '-', target: '≤ 1e-5' },
    { name: '  BV at c/c0 0.1 of HCT (first target through)', value: bv(warm.r, 'HCT', 0), unit: 'BV' },
    { name: '  BV at c/c0 0.1 of HCT, doubled grid (120 × 10)', value: bv(fine.r, 'HCT', 0), unit: 'BV' },
    { name: '  largest change of a target\'s BV at c/c0 0.1, doubled grid', value: worst(0), unit: '-', target: '< 0.005' },
    { name: '  largest change of a target\'s BV at c/c0 0.5, doubled grid', value: worst(2), unit: '-', target: '< 0.005' },
    { name: '  BV at c/c0 0.5 of F4, default and doubled grid, relative change', value: change('F4', 2), unit: '-', target: '< 0.005' },
    { name: '  BV at c/c0 0.5 of F1 (weakest DOC fraction), relative change (not resolved by 5 grain points)', value: change('F1', 2), unit: '-' },
    { name: '  doubled grid run time', value: fine.ms, unit: 'ms' },
    { name: '  coupled solve of all 13 adsorbable components at once (the reference), wall', value: coupledMs, unit: 'ms' },
    { name: '  largest relative change of a target\'s BV at c/c0 0.1, coupled against column', value: coupledChange, unit: '-' },
    { name: 'column fit of Ds (gac-column-test, 11 points, scan first), first in the process', value: fitCold.ms, unit: 'ms', target: '≤ 2000 ms' },
    { name: 'column fit of Ds, second', value: fitWarm.ms, unit: 'ms', target: '≤ 2000 ms' },
    { name: '  CPU time of the second', value: fitWarm.cpuMs, unit: 'ms', target: '≤ 2000 ms' },
    { name: '  model evaluations of the fit (scan included)', value: fitWarm.evaluations, unit: '-' },
    { name: 'demo pipeline without draws, CPU (second run; GAC C: column fit and breakthrough)', value: gac.runCpuMs, unit: 'ms' },
    { name: '  GAC C column fit (wall)', value: gac.fitMs, unit: 'ms' },
    { name: '  GAC C breakthrough: background once, each compound alone (wall)', value: gac.breakthroughMs, unit: 'ms' },
    { name: `one GAC Monte Carlo draw of the demo (${gac.compounds} compounds against the stored background), CPU, best of 3`, value: gac.drawMs, unit: 'ms' },
  ];
}
