/**
 * The accuracy ContactRemoval states (`removalTolerance`, used by the dose search's final check)
 * holds: c/c0 at the default tolerance against a run 1e4 times tighter, over doses and both
 * contact conditions. Reference: the same model integrated to rtol 1e-8 (a convergence check, no
 * published value). The water is invented, as in the kinetics bench.
 */
import { describe, expect, it } from 'vitest';
import { ContactRemoval, type ContactConditions } from '../../src/kinetics/contactRemoval.js';
import type { CompetitionSet } from '../../src/design/removalModel.js';

const doc = { oneOverN: 0.2, dsM2PerS: 5e-17, dlM2PerS: 5e-10 };
const competitors = [
  { id: 'F1', c0MgPerL: 1, K: 5, ...doc },
  { id: 'F2', c0MgPerL: 1.5, K: 20, ...doc },
  { id: 'F3', c0MgPerL: 1, K: 60, ...doc },
  { id: 'F4', c0MgPerL: 0.5, K: 150, ...doc },
];
const sets: CompetitionSet[] = [{ target: { id: 'T', c0MgPerL: 1e-4, K: 200, oneOverN: 0.4, dsM2PerS: 2e-16, dlM2PerS: 7e-10 } as CompetitionSet['target'], competitors }];
const particle = { radiusM: 10e-6, densityGPerL: 650 };
const CONDITIONS: ContactConditions[] = [{ kind: 'plug-flow', contactTimeS: 1800 }, { kind: 'stirred', contactTimeS: 1800, carbonAgeS: 2 * 86400 }];

describe('ContactRemoval states its accuracy', () => {
  for (const cond of CONDITIONS) {
    it(`${cond.kind}: c/c0 within removalTolerance of a run 1e4 times tighter`, () => {
      const model = new ContactRemoval(sets, 5, particle, cond);
      const fine = new ContactRemoval(sets, 5, particle, cond, undefined, { rtol: 1e-8 });
      expect(model.removalTolerance).toBeGreaterThanOrEqual(1e-9);
      expect(model.removalTolerance).toBeLessThanOrEqual(1e-5);
      for (const dGPerL of [0.005, 0.01, 0.02, 0.04]) {
        const a = model.remaining(0, dGPerL).remainingFraction;
        const b = fine.remaining(0, dGPerL).remainingFraction;
        expect(Math.abs(a - b), `dose ${dGPerL * 1000} mg/L`).toBeLessThanOrEqual(model.removalTolerance);
      }
    }, 60_000);
  }
});
