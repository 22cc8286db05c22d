/**
 * Figures for issue 4: `sorbshare demo` wall time including Node start-up (target < 3 s), and
 * the in-process pipeline time of the demo (warm and cold) by step.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import type { BenchFigure } from './run.js';

export async function bench(): Promise<BenchFigure[]> {
  const bin = join(process.cwd(), 'dist/cli/bin.js');
  const dir = mkdtempSync(join(tmpdir(), 'sorbshare-bench-'));
  const times: number[] = [];
  try {
    for (let k = 0; k < 5; k++) {
      const t = performance.now();
      const r = spawnSync(process.execPath, [bin, 'demo', '--out', join(dir, `o${k}`)], { encoding: 'utf8' });
      if (r.status !== 0) throw new Error(r.stderr);
      times.push(performance.now() - t);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  times.sort((a, b) => a - b);
  const input = loadProject(join(process.cwd(), 'fixtures/demo/project.json'));
  let t0 = performance.now();
  const cold = runPipeline(input);
  const coldMs = performance.now() - t0;
  for (let k = 0; k < 3; k++) runPipeline(input);
  t0 = performance.now();
  const warm = runPipeline(input);
  const warmMs = performance.now() - t0;
  const figs: BenchFigure[] = [
    { name: 'sorbshare demo, wall time incl. start-up (median of 5)', value: times[2]! / 1000, unit: 's', target: '< 3 s' },
    { name: 'sorbshare demo, wall time (best of 5)', value: times[0]! / 1000, unit: 's' },
    { name: 'demo pipeline in-process, first run', value: coldMs, unit: 'ms' },
    { name: 'demo pipeline in-process, warm', value: warmMs, unit: 'ms' },
  ];
  for (const [step, ms] of Object.entries(cold.timingMs)) figs.push({ name: `  first run: ${step}`, value: ms, unit: 'ms' });
  const days = warm.carbons.reduce((s, c) => s + (c.daily?.table.docMgPerL.length ?? 0), 0);
  figs.push({ name: 'daily doses, DOC nodes of the dose tables (both carbons)', value: days, unit: 'nodes' });
  return figs;
}
