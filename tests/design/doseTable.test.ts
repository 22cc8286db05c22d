/**
 * The dose table against a closed form. With one background component whose isotherm equals the
 * target's (K, exponent β), the fraction f of a trace target left solves
 *   f·(1 + D·K·((c0T + c0B)·f)^(β − 1)) = 1   (IAST with one isotherm; closed form,
 *   the Sheindorf–Rebhun–Sheintuch form with a_ij = 1, J. Colloid Interface Sci. 1981),
 * so the dose for a removal R is D = (1/f − 1)/(K·((c0T + c0B)·f)^(β − 1)) with f = 1 − R, and the
 * background c0B equals the DOC. The table must reproduce D exactly at its nodes and within its
 * stated tolerance on every day between them; its yearly sum must equal the sum of its days.
 */
import { describe, expect, it } from 'vitest';
import { EquilibriumRemoval } from '../../src/design/equilibriumRemoval.js';
import { doseTable, interpolateDose, seriesCarbon, seriesSegments } from '../../src/design/doseTable.js';
import type { DesignProblem } from '../../src/design/designDose.js';

const K = 30, beta = 0.3, c0T = 1e-4, R = 0.8;
const closedFormMgPerL = (doc: number) => {
  const f = 1 - R;
  return (1000 * (1 / f - 1)) / (K * Math.pow((c0T + doc) * f, beta - 1));
};
const model = new EquilibriumRemoval([{ target: { id: 'T', c0MgPerL: c0T, K, oneOverN: beta }, competitors: [{ id: 'B', c0MgPerL: 8, K, oneOverN: beta }] }], 8);
const problem: DesignProblem = { goals: [{ kind: 'removal', removalFraction: R, text: '80 % removal' }], pricePerKg: 2 };
// an invented year of DOC between 5 and 12 mg/L (effluent range, common practice)
const series = Array.from({ length: 365 }, (_, i) => 8.5 + 3.5 * Math.sin(i / 11) * Math.cos(i / 47));

describe('dose table', () => {
  const table = doseTable(model, problem, series);

  it('solves the closed-form dose exactly (1e-9) at every node', () => {
    expect(table.docMgPerL.length).toBeGreaterThanOrEqual(5);
    table.nodes.forEach((n, k) => expect(Math.abs(n.doseMgPerL! / closedFormMgPerL(table.docMgPerL[k]!) - 1)).toBeLessThan(1e-9));
  });

  it('is within its stated tolerance (0.1 %) of the closed form on every day, and says how close its midpoints came', () => {
    expect(table.toleranceRel).toBe(1e-3);
    expect(table.midpointErrorRel).toBeLessThanOrEqual(table.toleranceRel);
    const doses = table.nodes.map((n) => n.doseMgPerL);
    let worst = 0;
    for (const doc of series) worst = Math.max(worst, Math.abs(interpolateDose(table.docMgPerL, doses, doc)! / closedFormMgPerL(doc) - 1));
    expect(worst).toBeLessThanOrEqual(table.toleranceRel);
    // the midpoint check is where the error of linear interpolation of a smooth convex/concave curve is largest
    expect(worst).toBeLessThanOrEqual(table.midpointErrorRel * (1 + 1e-6) + 1e-12);
  });

  it('the yearly sum from segment sums equals the sum over the days of dose × flow / 1000', () => {
    const flow = series.map((_, i) => 10000 + 2000 * Math.cos(i / 13));
    const doses = table.nodes.map((n) => n.doseMgPerL);
    const y = seriesCarbon(seriesSegments(table.docMgPerL, series, flow), doses);
    const byDay = series.reduce((s, doc, i) => s + (interpolateDose(table.docMgPerL, doses, doc)! * flow[i]!) / 1000, 0);
    expect(Math.abs(y.totalKg / byDay - 1)).toBeLessThan(1e-12);
    expect(y.annualised).toBe(false);
    expect(y.yearlyKg).toBe(y.totalKg);
  });

  it('a series with few distinct DOC values is tabulated at exactly those values (no interpolation)', () => {
    const t = doseTable(model, problem, [6, 7, 6, 9, 7]);
    expect(t.docMgPerL).toEqual([6, 7, 9]);
    expect(t.midpointErrorRel).toBe(0);
    t.nodes.forEach((n, k) => expect(Math.abs(n.doseMgPerL! / closedFormMgPerL(t.docMgPerL[k]!) - 1)).toBeLessThan(1e-9));
  });
});
