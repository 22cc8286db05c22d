/**
 * Speed of the Monte Carlo runs: 10,000 draws of the governing dose for a trace target
 * (100 ng/L, 1/n = 0.3) in a 5-component background (non-adsorbable + 4 fictive components with
 * 1/n = 0.2), with uncertain K, 1/n, fractions and DOC. Target: under 2 s on a 2-core machine.
 * Parameters invented (realistic magnitudes).
 */
import { monteCarlo } from '../../src/uncertainty/monteCarlo.js';
import { parallelMonteCarlo } from '../../src/uncertainty/parallelMonteCarlo.js';
import type { MonteCarloProblem } from '../../src/uncertainty/monteCarloProblem.js';

const problem: MonteCarloProblem = {
  targets: [{ id: 'CBZ', K: 60, oneOverN: 0.3, c0MgPerL: 1e-4, removalGoal: 0.8, KRelSd: 0.2, oneOverNRelSd: 0.05 }],
  background: [
    { id: 'NA', K: 0, oneOverN: 1, fraction: 0.25, fractionRelSd: 0.1 },
    { id: 'F1', K: 1, oneOverN: 0.2, fraction: 0.25, KRelSd: 0.1, fractionRelSd: 0.1 },
    { id: 'F2', K: 10, oneOverN: 0.2, fraction: 0.2, KRelSd: 0.1, fractionRelSd: 0.1 },
    { id: 'F3', K: 40, oneOverN: 0.2, fraction: 0.2, KRelSd: 0.1, fractionRelSd: 0.1 },
    { id: 'F4', K: 90, oneOverN: 0.2, fraction: 0.1, KRelSd: 0.1, fractionRelSd: 0.1 },
  ],
  docMgPerL: 8,
  docRelSd: 0.1,
};

export async function bench(): Promise<Array<{ name: string; value: number; unit: string; target?: string }>> {
  const draws = 10_000;
  monteCarlo(problem, { draws: 500, seed: 1 }); // warm-up (JIT)
  let t = performance.now();
  monteCarlo(problem, { draws, seed: 2024 });
  const serialS = (performance.now() - t) / 1000;
  t = performance.now();
  const par = await parallelMonteCarlo(problem, { draws, seed: 2024, workers: 2, force: true });
  const parallelS = (performance.now() - t) / 1000;
  return [
    { name: 'Monte Carlo, 10,000 draws of the governing dose (in-thread)', value: +serialS.toFixed(3), unit: 's', target: '< 2 s' },
    { name: `Monte Carlo, 10,000 draws (${par.execution.mode}, ${par.execution.workers} workers forced; below 30,000 searches the default stays in-thread)`, value: +parallelS.toFixed(3), unit: 's', target: '< 2 s' },
    { name: 'Monte Carlo, time per draw (in-thread)', value: +((serialS / draws) * 1e6).toFixed(1), unit: 'µs' },
  ];
}
