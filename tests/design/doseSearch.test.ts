import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { doseForRemoval } from '../../src/design/doseForRemoval.js';
import { doseFor, equilibrium, equilibriumCurve, loadingsAt } from '../../src/api/equilibriumApi.js';
import { bisectIncreasing } from '../helpers/reference.js';

const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => Math.pow(10, e));

describe('dose search', () => {
  it('single solute: D = (c0 − c)/(K·c^(1/n)) with c = (1 − R)·c0 (Freundlich batch balance solved for D)', () => {
    for (const [c0, K, b, R] of [[1e-4, 40, 0.3, 0.8], [2, 5, 0.5, 0.5], [10, 100, 0.2, 0.99]] as const) {
      const c = (1 - R) * c0;
      const Dref = (c0 - c) / (K * Math.pow(c, b));
      const r = doseForRemoval(prepareMixture([{ id: 'A', c0MgPerL: c0, K, oneOverN: b }]), 0, R);
      expect(Math.abs(r.doseGPerL / Dref - 1)).toBeLessThan(1e-9);
    }
  });

  it('equal K and exponent with a background: D from f·(1 + D·K·((c0T + c0B)·f)^(β−1)) = 1 solved for D (closed form)', () => {
    const K = 30, beta = 0.3, c0B = 5, c0T = 1e-4, R = 0.9;
    const f = 1 - R;
    const Dref = (1 / f - 1) / (K * Math.pow((c0T + c0B) * f, beta - 1));
    const r = doseForRemoval(prepareMixture([{ id: 'T', c0MgPerL: c0T, K, oneOverN: beta }, { id: 'B', c0MgPerL: c0B, K, oneOverN: beta }]), 0, R);
    expect(Math.abs(r.doseGPerL / Dref - 1)).toBeLessThan(1e-9);
  });

  it('property: the dose found re-solved gives the goal, for random background + trace target mixtures', () => {
    fc.assert(fc.property(
      fc.array(fc.record({ c0MgPerL: logUniform(0.05, 5), K: logUniform(0.5, 300), oneOverN: fc.double({ min: 0.1, max: 0.6, noNaN: true }) }), { minLength: 1, maxLength: 5 }),
      logUniform(1e-6, 1e-3), logUniform(5, 500), fc.double({ min: 0.15, max: 0.9, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }),
      (bg, c0T, KT, bT, R) => {
        const comps: FreundlichComponent[] = [...bg.map((c, i) => ({ id: `B${i}`, ...c })), { id: 'T', c0MgPerL: c0T, K: KT, oneOverN: bT }];
        const pm = prepareMixture(comps);
        let res;
        try {
          res = doseForRemoval(pm, comps.length - 1, R);
        } catch (e) {
          expect((e as Error).message).toMatch(/not reached by any dose up to 5000 mg\/L/);
          return;
        }
        const s = solveBatchPrepared(pm, res.doseGPerL);
        expect(Math.abs(1 - s.cMgPerL[comps.length - 1]! / c0T - R)).toBeLessThan(1e-9);
      }), { numRuns: 300, seed: 5 });
  });

  it('the library functions return the --json shapes', () => {
    const mixture = { components: [{ id: 'B', c0: '5 mg/L', K: 20, one_over_n: 0.2 }, { id: 'T', c0: '100 ng/L', K: 40, one_over_n: 0.3 }] };
    const e = equilibrium(mixture, '10 mg/L');
    expect(e.dose_mg_per_L).toBe(10);
    expect(e.components.map((c) => c.id)).toEqual(['B', 'T']);
    const curve = equilibriumCurve(mixture, '1 mg/L', '100 mg/L', 3);
    expect(curve.curve).toHaveLength(3);
    expect(curve.curve[1]!.components[1]!.c_mg_per_L).toBeCloseTo(e.components[1]!.c_mg_per_L, 15);
    const d = doseFor(mixture, 'T', { removal: 80 });
    expect(d).toEqual({ target: 'T', dose_mg_per_L: expect.any(Number), removal_fraction: expect.closeTo(0.8, 10) });
    const l = doseFor(mixture, 'T', { limit: '20 ng/L' });
    expect(l.dose_mg_per_L).toBeCloseTo(d.dose_mg_per_L, 8);
  });

  it('loadingsAt (direct IAST) reproduces the SRS closed form for a common exponent (Sheindorf et al. 1981)', () => {
    const comps = [{ id: 'A', K: 10, one_over_n: 0.4 }, { id: 'B', K: 60, one_over_n: 0.4 }, { id: 'T', K: 25, one_over_n: 0.4, K_unit: { q: 'mg/g', c: 'mg/L' } }];
    const c = { A: '2 mg/L', B: '0.3 mg/L', T: '500 ng/L' };
    const r = loadingsAt(comps, c);
    const cs = [2, 0.3, 5e-4];
    const Ks = [10, 60, 25];
    const S = cs.reduce((s, ci, i) => s + ci * Math.pow(Ks[i]!, 1 / 0.4), 0);
    r.components.forEach((rc, i) => {
      const qRef = cs[i]! * Math.pow(Ks[i]!, 1 / 0.4) * Math.pow(S, 0.4 - 1);
      expect(Math.abs(rc.q_mg_per_g / qRef - 1)).toBeLessThan(1e-12);
    });
    // a single solute gives Freundlich itself
    const one = loadingsAt([{ id: 'A', K: 10, one_over_n: 0.5 }], ['4 mg/L']);
    expect(one.components[0]!.q_mg_per_g).toBeCloseTo(20, 12);
    expect(bisectIncreasing((x) => x - 1, 0, 2)).toBeCloseTo(1, 12);
  });
});
