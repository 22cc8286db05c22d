/**
 * Trace targets from one solve of the background alone (src/equilibrium/traceTargets.ts) against
 * the exact batch IAST of target + background (iastBatch.ts): the first-order correction leaves
 * an error of second order in the target's concentration (halving c0_T divides it by about 4),
 * far below the uncorrected trace value's first-order error; the background's d(u, ln x)/d ln D
 * equals a central difference of solves. Properties of the model (no outside values); the
 * mixture is invented.
 */
import { describe, expect, it } from 'vitest';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchState, remainingAtState } from '../../src/equilibrium/iastBatch.js';
import { backgroundResponse, traceTarget, type BackgroundResponse, type TraceTarget } from '../../src/equilibrium/traceTargets.js';
import { softplus } from '../../src/core/logistic.js';

const bg: FreundlichComponent[] = [
  { id: 'F0', c0MgPerL: 2.5, K: 0, oneOverN: 1 },
  { id: 'F1', c0MgPerL: 2.0, K: 8, oneOverN: 0.2 },
  { id: 'F2', c0MgPerL: 1.5, K: 30, oneOverN: 0.2 },
  { id: 'F3', c0MgPerL: 0.8, K: 110, oneOverN: 0.2 },
];
const pb = prepareMixture(bg);
const r: BackgroundResponse = { u: 0, lnX: 0, j11: 0, j12: 0, j21: 0, j22: 0, det: 0, du: 0, dLnX: 0 };
const tt: TraceTarget = { t: 0, dt: 0, u: 0, lnX: 0 };
const lnSigma = (t: number) => -softplus(-t);

describe('trace targets beside one background solve', () => {
  for (const doseGPerL of [0.005, 0.02, 0.08]) {
    it(`corrected estimate: second order in c0_T, far below the plain trace value (dose ${doseGPerL * 1000} mg/L)`, () => {
      backgroundResponse(pb, solveBatchState(pb, doseGPerL), r);
      const errs: number[] = [];
      for (const c0 of [4e-3, 2e-3, 1e-3]) {
        const target: FreundlichComponent = { id: 'T', c0MgPerL: c0, K: 150, oneOverN: 0.3 };
        const pm = prepareMixture([target, ...bg]);
        const exact = Math.log(remainingAtState(pm, 0, solveBatchState(pm, doseGPerL)));
        traceTarget(r, pm.n[0]!, pm.a[0]!, c0, tt);
        const plain = lnSigma(pm.n[0]! * r.u + pm.a[0]! - r.lnX);
        const err = Math.abs(lnSigma(tt.t) - exact);
        expect(err).toBeLessThan(Math.abs(plain - exact) / 20);
        errs.push(err);
      }
      // halving c0_T divides a second-order error by about 4 (3 to 5 allowed)
      expect(errs[0]! / errs[1]!).toBeGreaterThan(3);
      expect(errs[0]! / errs[1]!).toBeLessThan(5);
      expect(errs[1]! / errs[2]!).toBeGreaterThan(3);
      expect(errs[1]! / errs[2]!).toBeLessThan(5);
    });
  }

  it('the background\'s d u/d ln D and d ln x/d ln D equal central differences of solves', () => {
    const D = 0.02, h = 1e-4;
    backgroundResponse(pb, solveBatchState(pb, D), r);
    const at = (d: number) => { const s = solveBatchState(pb, d); const q = { ...r }; backgroundResponse(pb, s, q); return q; };
    const up = at(D * Math.exp(h)), dn = at(D * Math.exp(-h));
    expect(Math.abs((up.u - dn.u) / (2 * h) - r.du)).toBeLessThan(1e-6 * Math.max(1, Math.abs(r.du)));
    expect(Math.abs((up.lnX - dn.lnX) / (2 * h) - r.dLnX)).toBeLessThan(1e-6 * Math.max(1, Math.abs(r.dLnX)));
  });
});
