/** Figures for issue 2: batch solves per second, one dose search, CLI start-up. */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { doseForRemoval } from '../../src/design/doseForRemoval.js';
import type { BenchFigure } from './run.js';

/** The mixture: non-adsorbable + 4 fictive DOC components (1/n = 0.2) + trace target 100 ng/L (1/n = 0.3). */
export const SIX: FreundlichComponent[] = [
  { id: 'DOC-n', c0MgPerL: 1.2, K: 0, oneOverN: 1 },
  { id: 'DOC-1', c0MgPerL: 2.0, K: 2, oneOverN: 0.2 },
  { id: 'DOC-2', c0MgPerL: 1.8, K: 18, oneOverN: 0.2 },
  { id: 'DOC-3', c0MgPerL: 1.3, K: 55, oneOverN: 0.2 },
  { id: 'DOC-4', c0MgPerL: 0.7, K: 140, oneOverN: 0.2 },
  { id: 'target', c0MgPerL: 1e-4, K: 40, oneOverN: 0.3 },
];

export async function bench(): Promise<BenchFigure[]> {
  const pm = prepareMixture(SIX);
  // warm up the JIT
  for (let k = 0; k < 20000; k++) solveBatchPrepared(pm, 0.001 + (k % 200) * 0.0005);
  const N = 300000;
  let acc = 0;
  let t0 = performance.now();
  for (let k = 0; k < N; k++) acc += solveBatchPrepared(pm, 0.001 + (k % 200) * 0.0005).cMgPerL[5]!; // cold starts, 1–100 mg/L
  const solvesPerS = N / ((performance.now() - t0) / 1000);
  const M = 20000;
  for (let k = 0; k < 2000; k++) doseForRemoval(pm, 5, 0.5 + (k % 40) * 0.01);
  t0 = performance.now();
  for (let k = 0; k < M; k++) acc += doseForRemoval(pm, 5, 0.5 + (k % 40) * 0.01).doseGPerL;
  const usPerSearch = ((performance.now() - t0) * 1000) / M;
  const bin = join(process.cwd(), 'dist/cli/bin.js');
  const fixture = join(process.cwd(), 'fixtures/equilibrium/six-component.json');
  const times: number[] = [];
  for (let k = 0; k < 7; k++) {
    const t = performance.now();
    const r = spawnSync(process.execPath, [bin, 'equilibrium', fixture, '--dose', '15 mg/L'], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(r.stderr);
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  if (!Number.isFinite(acc)) throw new Error('non-finite result');
  return [
    { name: 'batch IAST solves, 6 components', value: solvesPerS, unit: 'solves/s', target: '≥ 200,000 /s' },
    { name: 'dose search (80 % class goals), 6 comp.', value: usPerSearch, unit: 'µs', target: '< 100 µs' },
    { name: 'sorbshare equilibrium wall time (median of 7)', value: times[3]! / 1000, unit: 's', target: '< 0.5 s' },
  ];
}
