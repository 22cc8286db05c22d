import { describe, expect, it } from 'vitest';
import { EquilibriumRemoval, equilibriumRemoval } from '../../src/design/equilibriumRemoval.js';
import { searchDose } from '../../src/design/doseSearch.js';
import { removalExcess } from '../../src/design/removalExcess.js';

describe('equilibrium removal model', () => {
  // Equal K and exponent for target and background: the fraction remaining f solves
  // f·(1 + D·K·((c0T + c0B)·f)^(β − 1)) = 1 (closed form from the IAST with one isotherm,
  // Sheindorf, Rebhun & Sheintuch 1981 with a_ij = 1), so D = (1/f − 1)/(K·((c0T + c0B)·f)^(β − 1)).
  const K = 30, beta = 0.3, c0T = 1e-4, c0B = 5;
  const model = new EquilibriumRemoval([{ target: { id: 'T', c0MgPerL: c0T, K, oneOverN: beta }, competitors: [{ id: 'B', c0MgPerL: c0B, K, oneOverN: beta }] }], c0B, [{ id: 'B', c0MgPerL: c0B, K, oneOverN: beta }]);

  it('remaining fraction at a dose matches the closed form (equal isotherms)', () => {
    for (const f of [0.5, 0.2, 0.05]) {
      const D = (1 / f - 1) / (K * Math.pow((c0T + c0B) * f, beta - 1));
      expect(Math.abs(model.remaining(0, D).remainingFraction / f - 1)).toBeLessThan(1e-10);
    }
    expect(model.remaining(0, 0).remainingFraction).toBe(1);
  });

  it('the one dose search on the model returns the closed-form dose within 1e-9', () => {
    const R = 0.9, f = 1 - R;
    const Dref = (1 / f - 1) / (K * Math.pow((c0T + c0B) * f, beta - 1));
    let warm: unknown;
    const r = searchDose((d) => { const x = model.remaining(0, d, warm); warm = x.warm; return removalExcess(x.remainingFraction, R); });
    expect(r.status).toBe('met');
    expect(Math.abs(r.doseGPerL / Dref - 1)).toBeLessThan(1e-9);
  });

  it('atDoc scales the competitors with the DOC: doubling the DOC matches a model built at twice the background', () => {
    const m2 = model.atDoc(10);
    const direct = equilibriumRemoval([{ target: { id: 'T', c0MgPerL: c0T, K, oneOverN: beta }, competitors: [{ id: 'B', c0MgPerL: 2 * c0B, K, oneOverN: beta }] }], 10);
    expect(m2.docMgPerL).toBe(10);
    expect(m2.remaining(0, 0.02).remainingFraction).toBeCloseTo(direct.remaining(0, 0.02).remainingFraction, 14);
    // more DOC competes more: less removal at the same dose
    expect(m2.remaining(0, 0.02).remainingFraction).toBeGreaterThan(model.remaining(0, 0.02).remainingFraction);
  });

  it('background remaining closes the batch balance and falls with dose', () => {
    const a = model.backgroundRemaining!(0.01).cMgPerL[0]!;
    const b = model.backgroundRemaining!(0.05).cMgPerL[0]!;
    expect(a).toBeLessThan(c0B);
    expect(b).toBeLessThan(a);
    // single solute Freundlich: c0 = c + D·K·c^β (Freundlich batch balance)
    expect(Math.abs(a + 0.01 * K * Math.pow(a, beta) - c0B)).toBeLessThan(1e-10 * c0B);
  });

  it('the search reports unreachable and met-below-the-smallest-dose as statuses', () => {
    const weak = new EquilibriumRemoval([{ target: { id: 'W', c0MgPerL: 1e-4, K: 0.001, oneOverN: 0.9 }, competitors: [{ id: 'B', c0MgPerL: 5, K: 100, oneOverN: 0.2 }] }], 5);
    const r = searchDose((d) => removalExcess(weak.remaining(0, d).remainingFraction, 0.99));
    expect(r.status).toBe('unreachable');
    expect(r.excess).toBeLessThan(0);
    const trivial = searchDose(() => 1);
    expect(trivial.status).toBe('met below the smallest dose');
  });
});
