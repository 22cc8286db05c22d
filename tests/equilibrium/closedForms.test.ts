/**
 * Batch IAST against closed forms from the literature.
 */
import { describe, expect, it } from 'vitest';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { bisectIncreasing, freundlichBatchC, iastResiduals } from '../helpers/reference.js';

const solve = (comps: FreundlichComponent[], D: number) => solveBatchPrepared(prepareMixture(comps), D);

describe('batch IAST closed forms', () => {
  it('one solute reduces to the Freundlich batch balance c0 = c + D·K·c^(1/n)', () => {
    for (const [c0, K, b, D] of [[3, 10, 0.5, 0.05], [1e-4, 40, 0.3, 0.02], [100, 0.5, 1.2, 5], [1e-9, 200, 0.05, 1e-4], [8, 25, 0.2, 0.3]] as const) {
      const s = solve([{ id: 'A', c0MgPerL: c0, K, oneOverN: b }], D);
      const cRef = freundlichBatchC(c0, K, b, D);
      expect(Math.abs(s.cMgPerL[0]! / cRef - 1)).toBeLessThan(1e-11);
      // Freundlich itself holds for the loading
      expect(Math.abs(s.qMgPerG[0]! / (K * Math.pow(s.cMgPerL[0]!, b)) - 1)).toBeLessThan(1e-11);
    }
  });

  it('worked number: c0 = 3 mg/L, K = 10, 1/n = 0.5, D = 50 mg/L gives c = 2.25 mg/L, q = 15 mg/g (hand-solvable quadratic in √c)', () => {
    // c + 0.05·10·√c = 3 → √c = 1.5 exactly
    const s = solve([{ id: 'A', c0MgPerL: 3, K: 10, oneOverN: 0.5 }], 0.05);
    expect(s.cMgPerL[0]).toBeCloseTo(2.25, 13);
    expect(s.qMgPerG[0]).toBeCloseTo(15, 12);
  });

  it('common exponent, 2–6 solutes: q_i = c_i·K_i^(1/β)·(Σ c_j K_j^(1/β))^(β−1) (Sheindorf, Rebhun & Sheintuch 1981, J. Colloid Interface Sci. 79:136)', () => {
    const Ks = [0.8, 5, 18, 60, 150, 35];
    const c0s = [2.0, 1.5, 1.0, 0.6, 0.3, 1e-4];
    for (const beta of [0.2, 0.45, 0.9]) {
      for (let m = 2; m <= 6; m++) {
        const comps = Array.from({ length: m }, (_, i) => ({ id: `S${i}`, c0MgPerL: c0s[i]!, K: Ks[i]!, oneOverN: beta }));
        for (const D of [0.002, 0.02, 0.2]) {
          const s = solve(comps, D);
          const S = comps.reduce((acc, c, j) => acc + s.cMgPerL[j]! * Math.pow(c.K, 1 / beta), 0);
          comps.forEach((c, i) => {
            const qSrs = s.cMgPerL[i]! * Math.pow(c.K, 1 / beta) * Math.pow(S, beta - 1);
            expect(Math.abs(s.qMgPerG[i]! / qSrs - 1), `β=${beta} m=${m} D=${D} i=${i}`).toBeLessThan(1e-10);
          });
        }
      }
    }
  });

  it('equal K and exponent: fraction remaining f solves f·(1 + D·K·((c0T + c0B)·f)^(β−1)) = 1 (Sheindorf et al. 1981 closed form), independent of c0T when c0T ≪ c0B', () => {
    const K = 30, beta = 0.3, c0B = 5, D = 0.03;
    const fRef = (c0T: number) => bisectIncreasing((f) => f * (1 + D * K * Math.pow((c0T + c0B) * f, beta - 1)) - 1, 1e-12, 1);
    const fs: number[] = [];
    for (const c0T of [1e-6, 1e-5, 1e-4, 0.5, 2]) {
      const s = solve([{ id: 'T', c0MgPerL: c0T, K, oneOverN: beta }, { id: 'B', c0MgPerL: c0B, K, oneOverN: beta }], D);
      const f = s.cMgPerL[0]! / c0T;
      expect(Math.abs(f / fRef(c0T) - 1)).toBeLessThan(1e-10);
      expect(Math.abs(s.cMgPerL[1]! / c0B / f - 1)).toBeLessThan(1e-10); // both remain in the same fraction
      fs.push(f);
    }
    // trace levels: same fraction to better than 1e-5 relative (c0T/c0B ≤ 2e-5)
    expect(Math.abs(fs[0]! / fs[2]! - 1)).toBeLessThan(1e-4);
  });

  it('trace-compound limit of Knappe et al. 1998 (Environ. Sci. Technol. 32:1694): q1 = C0_1/(D + (1/q2)·(n2 q2/(n1 K1))^n1)', () => {
    // background 2 alone sets q2 (single-solute batch); target 1 at trace level
    const K1 = 45, b1 = 0.35, K2 = 12, b2 = 0.25, c02 = 4, D = 0.015;
    const c2 = freundlichBatchC(c02, K2, b2, D);
    const q2 = K2 * Math.pow(c2, b2);
    const n1 = 1 / b1, n2 = 1 / b2;
    for (const c01 of [1e-9, 1e-8, 1e-7]) {
      const s = solve([{ id: 'T', c0MgPerL: c01, K: K1, oneOverN: b1 }, { id: 'B', c0MgPerL: c02, K: K2, oneOverN: b2 }], D);
      const q1 = c01 / (D + (1 / q2) * Math.pow((n2 * q2) / (n1 * K1), n1));
      // the formula is the c01 → 0 limit; relative deviation scales with c01/c02
      expect(Math.abs(s.qMgPerG[0]! / q1 - 1)).toBeLessThan(1e-6);
    }
  });

  it('percent removal of a trace compound does not depend on its C0 (Knappe et al. 1998; Westerhoff et al. 2005)', () => {
    const bg: FreundlichComponent[] = [
      { id: 'N', c0MgPerL: 1.2, K: 0, oneOverN: 1 },
      { id: 'B1', c0MgPerL: 2.5, K: 3, oneOverN: 0.2 },
      { id: 'B2', c0MgPerL: 2.0, K: 25, oneOverN: 0.2 },
      { id: 'B3', c0MgPerL: 1.3, K: 90, oneOverN: 0.2 },
    ];
    for (const D of [0.005, 0.02, 0.08]) {
      const removal = (c0: number) => {
        const s = solve([...bg, { id: 'T', c0MgPerL: c0, K: 50, oneOverN: 0.35 }], D);
        return 1 - s.cMgPerL[4]! / c0;
      };
      const r10 = removal(1e-5), r100 = removal(1e-4), r1000 = removal(1e-3);
      expect(Math.abs(r10 - r100)).toBeLessThan(2e-4);
      expect(Math.abs(r100 - r1000)).toBeLessThan(2e-3);
    }
  });

  it('non-adsorbable components stay in solution and do not change the others', () => {
    const a = solve([{ id: 'A', c0MgPerL: 2, K: 10, oneOverN: 0.4 }, { id: 'B', c0MgPerL: 1, K: 40, oneOverN: 0.3 }], 0.02);
    const b = solve([{ id: 'N', c0MgPerL: 3, K: 0, oneOverN: 1 }, { id: 'A', c0MgPerL: 2, K: 10, oneOverN: 0.4 }, { id: 'B', c0MgPerL: 1, K: 40, oneOverN: 0.3 }], 0.02);
    expect(b.cMgPerL[0]).toBe(3);
    expect(b.qMgPerG[0]).toBe(0);
    expect(b.cMgPerL[1]).toBeCloseTo(a.cMgPerL[0]!, 14);
    expect(b.qMgPerG[2]).toBeCloseTo(a.qMgPerG[1]!, 12);
  });

  it('component order does not matter; zero dose returns c0 with loadings in equilibrium with c0', () => {
    const comps: FreundlichComponent[] = [
      { id: 'A', c0MgPerL: 2, K: 10, oneOverN: 0.4 }, { id: 'B', c0MgPerL: 1e-4, K: 40, oneOverN: 0.3 }, { id: 'C', c0MgPerL: 0.7, K: 150, oneOverN: 0.2 },
    ];
    const s1 = solve(comps, 0.01);
    const s2 = solve([comps[2]!, comps[0]!, comps[1]!], 0.01);
    expect(s2.cMgPerL[1]! / s1.cMgPerL[0]! - 1).toBeCloseTo(0, 12);
    expect(s2.cMgPerL[2]! / s1.cMgPerL[1]! - 1).toBeCloseTo(0, 12);
    const z = solve(comps, 0);
    expect(Array.from(z.cMgPerL)).toEqual([2, 1e-4, 0.7]);
    expect(iastResiduals(comps, z.cMgPerL, z.qMgPerG, 0).psiSpread).toBeLessThan(1e-12);
  });

  it('removal rises monotonically with dose', () => {
    const comps: FreundlichComponent[] = [
      { id: 'N', c0MgPerL: 1, K: 0, oneOverN: 1 }, { id: 'B', c0MgPerL: 6, K: 20, oneOverN: 0.2 }, { id: 'T', c0MgPerL: 1e-4, K: 40, oneOverN: 0.3 },
    ];
    const pm = prepareMixture(comps);
    let prev = -1;
    for (let k = 0; k <= 60; k++) {
      const D = 1e-4 * Math.pow(10, k / 15);
      const r = 1 - solveBatchPrepared(pm, D).cMgPerL[2]! / 1e-4;
      expect(r).toBeGreaterThan(prev);
      prev = r;
    }
  });
});
