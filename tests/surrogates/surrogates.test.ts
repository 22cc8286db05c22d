import { describe, expect, it } from 'vitest';
import { surrogateCurve, uv254PerM } from '../../src/surrogates/surrogateCurve.js';
import { doseForUv254Reduction, governingSetPoint, uv254SetPoint } from '../../src/design/uv254SetPoint.js';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { InputError } from '../../src/core/errors.js';

/** Invented background at DOC 8 mg/L: non-adsorbable + 3 fictive components, common 1/n = 0.2. */
const background: FreundlichComponent[] = [
  { id: 'NA', K: 0, oneOverN: 1, c0MgPerL: 2.0 },
  { id: 'F1', K: 3, oneOverN: 0.2, c0MgPerL: 2.8 },
  { id: 'F2', K: 20, oneOverN: 0.2, c0MgPerL: 2.0 },
  { id: 'F3', K: 70, oneOverN: 0.2, c0MgPerL: 1.2 },
];
/** Known specific absorbances, 1/m per (mg/L) (invented; SUVA-like magnitudes 1–5 L/(mg·m)). */
const absorbances = [1.2, 2.0, 3.0, 4.5];
const model = { background, uv254AbsorbancePerM: absorbances };
const cbz: FreundlichComponent = { id: 'CBZ', K: 60, oneOverN: 0.3, c0MgPerL: 1e-4 };
const bta: FreundlichComponent = { id: 'BTA', K: 20, oneOverN: 0.35, c0MgPerL: 5e-3 };

/**
 * Independent equilibrium for one common exponent β: the Sheindorf–Rebhun–Sheintuch form (J.
 * Colloid Interface Sci. 1981) q_i = c_i K_i^(1/β) S^(β−1), S = Σ c_j K_j^(1/β), with the batch
 * balance c0_i = c_i + D q_i gives c_i = c0_i/(1 + D K_i^(1/β) S^(β−1)); S solved by bisection.
 */
function srsConcentrations(comps: FreundlichComponent[], doseGPerL: number, beta: number): number[] {
  const w = comps.map((c) => (c.K > 0 ? Math.pow(c.K, 1 / beta) : 0));
  const cOf = (S: number) => comps.map((c, i) => c.c0MgPerL / (1 + doseGPerL * w[i]! * Math.pow(S, beta - 1)));
  const h = (S: number) => cOf(S).reduce((s, c, i) => s + c * w[i]!, 0) - S;
  let lo = 1e-300, hi = comps.reduce((s, c, i) => s + c.c0MgPerL * w[i]!, 0);
  for (let k = 0; k < 3000 && hi / lo > 1 + 1e-15; k++) { const mid = Math.sqrt(lo * hi); if (h(mid) > 0) lo = mid; else hi = mid; }
  return cOf(Math.sqrt(lo * hi));
}

describe('surrogate curves', () => {
  it('reproduce a synthetic UV254 isotherm generated from known absorbances (SRS closed form, Beer–Lambert)', () => {
    const doses = [0, 2, 5, 10, 20, 40, 80];
    const curve = surrogateCurve(model, [cbz], doses);
    const uv0 = uv254PerM(background.map((c) => c.c0MgPerL), absorbances);
    expect(curve.uv254_0PerM).toBeCloseTo(uv0, 12);
    doses.forEach((d, k) => {
      const c = srsConcentrations(background, d / 1000, 0.2);
      const uv = c.reduce((s, ci, i) => s + absorbances[i]! * ci, 0);
      const doc = c.reduce((s, ci) => s + ci, 0);
      const p = curve.points[k]!;
      expect(p.uv254PerM! / uv).toBeCloseTo(1, 9);
      expect(p.uv254Reduction!).toBeCloseTo(1 - uv / uv0, 9);
      expect(p.docReduction).toBeCloseTo(1 - doc / 8, 9);
    });
    // monotone in dose; UV254 reduction above DOC reduction (the UV-absorbing fractions adsorb better)
    for (let k = 1; k < doses.length; k++) {
      expect(curve.points[k]!.uv254Reduction!).toBeGreaterThan(curve.points[k - 1]!.uv254Reduction!);
      expect(curve.points[k]!.removal['CBZ']!).toBeGreaterThan(curve.points[k - 1]!.removal['CBZ']!);
      expect(curve.points[k]!.uv254Reduction!).toBeGreaterThan(curve.points[k]!.docReduction);
    }
    // the UV254 reduction cannot pass the adsorbable share of the UV254
    expect(curve.points[doses.length - 1]!.uv254Reduction!).toBeLessThan(1 - (2.0 * 1.2) / uv0);
  });

  it('the set-point re-solved gives the goal', () => {
    const sp = uv254SetPoint(model, { target: cbz, removalGoal: 0.8 });
    expect(sp.uv254Reduction).toBeGreaterThan(0);
    expect(sp.uv254Reduction).toBeLessThan(1);
    // Operator doses to the set-point: find the dose that gives that UV254 reduction, then the removal there.
    const dose = doseForUv254Reduction(model, sp.uv254Reduction);
    expect(dose / sp.doseMgPerL).toBeCloseTo(1, 6);
    const s = solveBatchPrepared(prepareMixture([cbz, ...background]), dose / 1000);
    expect(1 - s.cMgPerL[0]! / cbz.c0MgPerL).toBeCloseTo(0.8, 6);
  });

  it('the governing set-point is that of the target needing the largest dose', () => {
    const g = governingSetPoint(model, [{ target: cbz, removalGoal: 0.8 }, { target: bta, removalGoal: 0.8 }]);
    expect(g.perTarget).toHaveLength(2);
    const max = Math.max(...g.perTarget.map((p) => p.doseMgPerL));
    expect(g.governing.doseMgPerL).toBe(max);
    expect(g.governing.uv254Reduction).toBe(Math.max(...g.perTarget.map((p) => p.uv254Reduction)));
  });

  it('rejects bad inputs', () => {
    expect(() => surrogateCurve({ background, uv254AbsorbancePerM: [1, 2] }, [], [0, 10])).toThrow(/one UV254 absorbance per background component/);
    expect(() => surrogateCurve({ background, uv254AbsorbancePerM: [1, -2, 3, 4] }, [], [10])).toThrow(/uv254AbsorbancePerM\[1\]/);
    expect(() => surrogateCurve(model, [], [-5])).toThrow(/doses\[0\]/);
    expect(() => uv254SetPoint({ background }, { target: cbz, removalGoal: 0.8 })).toThrow(/no UV254 absorbances/);
    expect(() => uv254SetPoint(model, { target: cbz, removalGoal: 1.5 })).toThrow(InputError);
    expect(() => doseForUv254Reduction(model, 0.99)).toThrow(/not reached/);
  });
});
