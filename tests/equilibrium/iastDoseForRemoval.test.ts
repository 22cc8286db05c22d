/**
 * The batch IAST read at a fixed removal (iastDoseForRemoval) is the inverse of the forward solve
 * (solveBatchPrepared): over random mixtures of the envelope (1–8 components, non-adsorbable ones,
 * c0 1e-9–1e2 mg/L, exponents 0.05–1.5) and removal goals 1e-6–0.999, the forward solve at the dose
 * found removes the goal to 1e-10, and its state is the forward solve's state. The slope
 * d ln(c/c0)/d ln D at a state (remainingSlopeAtState) equals a central difference of forward
 * solves. Properties of the equations only; no outside values.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { remainingAtState, remainingSlopeAtState, solveBatchPrepared, solveBatchState } from '../../src/equilibrium/iastBatch.js';
import { iastDoseForRemoval } from '../../src/equilibrium/iastDoseForRemoval.js';

const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => Math.pow(10, e));
const component = fc.record({
  c0MgPerL: logUniform(1e-9, 1e2),
  K: fc.oneof({ weight: 1, arbitrary: fc.constant(0) }, { weight: 6, arbitrary: logUniform(0.1, 1000) }),
  oneOverN: fc.double({ min: 0.05, max: 1.5, noNaN: true }),
});
const target = fc.record({ c0MgPerL: logUniform(1e-9, 1e2), K: logUniform(0.1, 1000), oneOverN: fc.double({ min: 0.05, max: 1.5, noNaN: true }) });
const mixture = fc.tuple(target, fc.array(component, { minLength: 0, maxLength: 7 })).map(([t, cs]) => [{ id: 'T', ...t }, ...cs.map((c, i): FreundlichComponent => ({ id: `C${i}`, ...c }))]);

describe('iastDoseForRemoval (the batch IAST at a fixed removal)', () => {
  it('the forward solve at the dose found gives the goal (1e-10) and the same state', () => {
    let checked = 0;
    fc.assert(fc.property(mixture, logUniform(1e-6, 0.999), (comps, R) => {
      const pm = prepareMixture(comps);
      const r = iastDoseForRemoval(pm, 0, R);
      expect(r.doseGPerL).toBeGreaterThan(0);
      if (!(r.doseGPerL > 1e-12 && r.doseGPerL < 1e6)) return; // outside what a forward solve is checked for
      const s = solveBatchPrepared(pm, r.doseGPerL, r.state);
      // 1 − c/c0 is known to rounding (~2e-16) only, which is 2e-16/R relative for small goals
      expect(Math.abs(1 - s.cMgPerL[0]! / comps[0]!.c0MgPerL - R) / R).toBeLessThan(1e-10 + 4e-16 / R);
      expect(Math.abs(s.state.u - r.state.u)).toBeLessThan(1e-9 * Math.max(1, Math.abs(r.state.u)));
      checked++;
    }), { numRuns: 1500, seed: 20261202 });
    expect(checked).toBeGreaterThan(1000);
  });

  it('a trace target beside a background: the dose of a removal does not depend on its c0 (Knappe et al. 1998) to first order', () => {
    const bg: FreundlichComponent[] = [{ id: 'N', c0MgPerL: 2, K: 0, oneOverN: 1 }, { id: 'B1', c0MgPerL: 3, K: 10, oneOverN: 0.2 }, { id: 'B2', c0MgPerL: 1.5, K: 80, oneOverN: 0.2 }];
    const d = (c0: number) => iastDoseForRemoval(prepareMixture([{ id: 'T', c0MgPerL: c0, K: 150, oneOverN: 0.3 }, ...bg]), 0, 0.8).doseGPerL;
    expect(Math.abs(d(1e-7) / d(1e-6) - 1)).toBeLessThan(1e-5);
  });

  it('the slope at a state equals a central difference of forward solves (1e-6)', () => {
    fc.assert(fc.property(mixture, logUniform(1e-3, 1), (comps, D) => {
      const pm = prepareMixture(comps);
      const st = solveBatchState(pm, D);
      const h = 1e-4;
      const lnf = (d: number) => Math.log(remainingAtState(pm, 0, solveBatchState(pm, d, st)));
      const fd = (lnf(D * Math.exp(h)) - lnf(D * Math.exp(-h))) / (2 * h);
      const s = remainingSlopeAtState(pm, D, 0, st);
      expect(Math.abs(s - fd)).toBeLessThan(1e-6 * Math.max(1, Math.abs(fd)));
    }), { numRuns: 300, seed: 7 });
  });
});
