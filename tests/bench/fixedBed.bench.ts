/**
 * Figures for issue 10: one breakthrough simulation of the invented demo water
 * (fixtures/column/demo-water.json: non-adsorbable part, 4 fictive DOC components, 9 trace
 * targets) to 100 000 bed volumes, EBCT 20 min, bed depth 2 m, ε = 0.4, on the default grid and on
 * the doubled grid, with the mass-balance error, the integrator's step counts and the grid beside
 * the time. Time is wall time of the first (cold) run and of a second run in the same process;
 * CPU time of the second run beside it (the machine may be shared).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readKineticMixture } from '../../src/scenario/readKineticInputs.js';
import { column } from '../../src/api/fixedBedApi.js';
import type { BenchFigure } from './run.js';

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
  const cold = timed();
  const warm = timed();
  const fine = timed({ cells: 60, interiorPoints: 10 });
  const bv = (r: typeof cold.r, id: string, k: number) => r.components.find((c) => c.id === id)!.breakthrough[k]!.bed_volumes ?? NaN;
  const g = warm.r.grid;
  return [
    { name: `column, demo water to 100 000 BV, ${g.cells} cells × ${g.interior_points} grain points (first run)`, value: cold.ms, unit: 'ms', target: '≤ 2000 ms' },
    { name: `column, demo water to 100 000 BV, ${g.cells} cells × ${g.interior_points} grain points (second run)`, value: warm.ms, unit: 'ms', target: '≤ 2000 ms' },
    { name: '  CPU time of the second run', value: warm.cpuMs, unit: 'ms' },
    { name: '  mass-balance error (fed − left − held)/fed', value: warm.r.mass_balance_error, unit: '-', target: '≤ 1e-5' },
    { name: '  BV at c/c0 0.1 of HCT (first target through)', value: bv(warm.r, 'HCT', 0), unit: 'BV' },
    { name: '  BV at c/c0 0.1 of HCT, doubled grid (60 × 10)', value: bv(fine.r, 'HCT', 0), unit: 'BV' },
    { name: '  BV at c/c0 0.5 of F4, default and doubled grid, relative change', value: Math.abs(bv(warm.r, 'F4', 2) / bv(fine.r, 'F4', 2) - 1), unit: '-', target: '< 0.005' },
    { name: '  doubled grid run time', value: fine.ms, unit: 'ms' },
  ];
}
