/**
 * Reverse IAST at the particle surface (Radke & Prausnitz 1972): round trip with the batch IAST
 * solver, the single-solute Freundlich limit, the zero-loading limit, the analytic Jacobian
 * against central differences, and the trace form (Knappe et al. 1998) as the limit of the full one.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { reverseIast, traceSurfaceFactor } from '../../src/kinetics/reverseIast.js';
import { prepareMixture } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';

const iso = (K: number[], beta: number[]) => ({ K: Float64Array.from(K), beta: Float64Array.from(beta) });

describe('reverse IAST', () => {
  it('round trip: loadings of the batch IAST (src/equilibrium) give back its liquid concentrations within 1e-10 relative', () => {
    fc.assert(fc.property(
      fc.array(fc.record({ K: fc.double({ min: 1, max: 300, noNaN: true }), beta: fc.double({ min: 0.1, max: 0.9, noNaN: true }), c0: fc.double({ min: 1e-3, max: 10, noNaN: true }) }), { minLength: 1, maxLength: 6 }),
      fc.double({ min: 1e-3, max: 0.2, noNaN: true }),
      (comps, dose) => {
        const pm = prepareMixture(comps.map((c, i) => ({ id: `c${i}`, c0MgPerL: c.c0, K: c.K, oneOverN: c.beta })));
        const sol = solveBatchPrepared(pm, dose);
        const cs = new Float64Array(comps.length);
        reverseIast(iso(comps.map((c) => c.K), comps.map((c) => c.beta)), sol.qMgPerG, cs);
        return comps.every((_, i) => Math.abs(cs[i]! - sol.cMgPerL[i]!) <= 1e-10 * sol.cMgPerL[i]! + 1e-300);
      },
    ), { numRuns: 150, seed: 3 });
  });

  it('single solute reduces to the Freundlich isotherm c = (q/K)^(1/β) (closed form)', () => {
    const cs = new Float64Array(1);
    for (const [K, b, q] of [[20, 0.3, 5], [150, 0.2, 80], [3, 0.8, 1e-6]] as const) {
      reverseIast(iso([K], [b]), [q], cs);
      expect(cs[0]! / (q / K) ** (1 / b) - 1).toBeCloseTo(0, 12);
    }
  });

  it('zero loading gives zero concentrations and a zero Jacobian, ψ = Q = 0', () => {
    const cs = new Float64Array(3).fill(7);
    const J = new Float64Array(9).fill(7);
    const s = reverseIast(iso([10, 20, 30], [0.2, 0.3, 0.4]), [0, 0, 0], cs, J);
    expect(Array.from(cs)).toEqual([0, 0, 0]);
    expect(Array.from(J)).toEqual(new Array(9).fill(0));
    expect(s).toEqual({ psi: 0, total: 0 });
  });

  it('analytic Jacobian matches central differences within 1e-6 relative', () => {
    const I = iso([12, 40, 90, 5], [0.2, 0.25, 0.35, 0.6]);
    const q = [3, 10, 0.5, 7];
    const m = 4;
    const cs = new Float64Array(m), J = new Float64Array(m * m);
    reverseIast(I, q, cs, J);
    for (let j = 0; j < m; j++) {
      const h = 1e-6 * q[j]!;
      const up = new Float64Array(m), dn = new Float64Array(m);
      reverseIast(I, q.map((v, k) => (k === j ? v + h : v)), up);
      reverseIast(I, q.map((v, k) => (k === j ? v - h : v)), dn);
      for (let i = 0; i < m; i++) {
        const fd = (up[i]! - dn[i]!) / (2 * h);
        expect(Math.abs(J[i * m + j]! - fd)).toBeLessThan(1e-6 * Math.max(Math.abs(fd), Math.abs(cs[i]! / q[j]!)));
      }
    }
  });

  it('trace form is the limit of the full form as the target loading → 0, with its derivatives', () => {
    const bgK = [12, 40, 90], bgB = [0.2, 0.25, 0.35];
    const tK = 200, tB = 0.4;
    const qB = [3, 10, 0.5];
    const full = new Float64Array(4);
    const qT = 1e-9;
    reverseIast(iso([...bgK, tK], [...bgB, tB]), [...qB, qT], full);
    const bgOnly = new Float64Array(3);
    const state = reverseIast(iso(bgK, bgB), qB, bgOnly);
    const dK = new Float64Array(3);
    const kappa = traceSurfaceFactor(tK, tB, state, Float64Array.from(bgB), dK);
    expect(full[3]! / (kappa * qT) - 1).toBeLessThan(1e-8);
    for (let i = 0; i < 3; i++) expect(Math.abs(full[i]! / bgOnly[i]! - 1)).toBeLessThan(1e-8);
    // derivatives of κ by central differences
    for (let j = 0; j < 3; j++) {
      const h = 1e-6 * qB[j]!;
      const k = (d: number) => traceSurfaceFactor(tK, tB, reverseIast(iso(bgK, bgB), qB.map((v, i) => (i === j ? v + d : v)), new Float64Array(3)), Float64Array.from(bgB));
      const fd = (k(h) - k(-h)) / (2 * h);
      expect(Math.abs(dK[j]! - fd)).toBeLessThan(1e-6 * Math.abs(kappa / qB[j]!));
    }
    expect(traceSurfaceFactor(tK, tB, { psi: 0, total: 0 }, Float64Array.from(bgB))).toBe(0);
  });
});
