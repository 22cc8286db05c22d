/**
 * PAC contact kinetics speed (issue 9 targets): batch over 24 h of the 6-component water
 * (non-adsorbable + 4 fictive DOC components + one trace target), the stirred reactor at steady
 * state, and a dose under contact conditions. Best of a few rounds (the machine may be shared).
 * Invented water; figures only, not pass/fail.
 */
import { prepareKinetics, type KineticComponent } from '../../src/kinetics/kineticMixture.js';
import { pacBatch } from '../../src/kinetics/pacBatch.js';
import { stirredReactor } from '../../src/kinetics/stirredReactor.js';
import { doseUnderContact } from '../../src/kinetics/contactRemoval.js';
import type { BenchFigure } from './run.js';

const doc = { oneOverN: 0.2, dsM2PerS: 5e-17, dlM2PerS: 5e-10 };
const WATER: KineticComponent[] = [
  { id: 'N', c0MgPerL: 1, K: 0, oneOverN: 1 },
  { id: 'F1', c0MgPerL: 1, K: 5, ...doc },
  { id: 'F2', c0MgPerL: 1.5, K: 20, ...doc },
  { id: 'F3', c0MgPerL: 1, K: 60, ...doc },
  { id: 'F4', c0MgPerL: 0.5, K: 150, ...doc },
  { id: 'T', c0MgPerL: 1e-4, K: 200, oneOverN: 0.4, dsM2PerS: 2e-16, dlM2PerS: 7e-10 },
];
const particle = { radiusM: 10e-6, densityGPerL: 650 };

function bestMs(rounds: number, f: () => void): number {
  let best = Infinity;
  for (let k = 0; k < rounds; k++) {
    const t0 = performance.now();
    f();
    best = Math.min(best, performance.now() - t0);
  }
  return best;
}

export async function bench(): Promise<BenchFigure[]> {
  const pk = prepareKinetics(WATER, particle);
  const batch = bestMs(5, () => pacBatch(pk, 0.02, [60, 300, 900, 1800, 3600, 86400]));
  const reactor = bestMs(2, () => stirredReactor(pk, 0.02, 1800, 3 * 86400));
  const dose = bestMs(1, () => doseUnderContact(pk, 5, 0.8, { kind: 'plug-flow', contactTimeS: 1800 }));
  return [
    { name: 'PAC batch over 24 h, 6 components', value: batch, unit: 'ms', target: '≤ 5 ms' },
    { name: 'stirred contact reactor at steady state (θ = 3 d)', value: reactor, unit: 'ms', target: '≤ 20 ms' },
    { name: 'dose under contact conditions (plug flow, 30 min)', value: dose, unit: 'ms', target: '≤ 100 ms' },
  ];
}
