/**
 * The small numerical tools behind the fitters: Student's t quantiles, non-negative least squares,
 * the linear solvers and the least-squares driver.
 */
import { describe, expect, it } from 'vitest';
import { studentTQuantile, studentTCdf } from '../../src/numerics/studentT.js';
import { nnls } from '../../src/numerics/nnls.js';
import { invertSymmetric, solveLinear, symmetricEigen } from '../../src/numerics/linearSystem.js';
import { fitLeastSquares } from '../../src/numerics/leastSquares.js';

describe('Student t quantiles', () => {
  it('match Abramowitz & Stegun (1964) Table 26.10, two-sided 95 % (Q = 0.025 per tail)', () => {
    const table: Array<[number, number]> = [[1, 12.706], [2, 4.303], [3, 3.182], [5, 2.571], [10, 2.228], [20, 2.086], [30, 2.042], [120, 1.980]];
    for (const [dof, t] of table) expect(studentTQuantile(0.975, dof)).toBeCloseTo(t, 3);
  });
  it('closed forms: ν = 1 is Cauchy, t = tan(π(p − ½)); ν = 2 gives t = (2p − 1)·√(2/(4p(1 − p)))', () => {
    for (const p of [0.6, 0.9, 0.99]) {
      expect(studentTQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 8);
      expect(studentTQuantile(p, 2)).toBeCloseTo((2 * p - 1) * Math.sqrt(2 / (4 * p * (1 - p))), 8);
    }
    expect(studentTCdf(0, 7)).toBeCloseTo(0.5, 14);
  });
});

describe('nnls (Lawson & Hanson 1974)', () => {
  it('returns an unconstrained solution when it is non-negative', () => {
    const A = [[1, 0], [0, 2], [1, 1]];
    const x = [0.5, 1.5];
    const b = A.map((r) => r[0]! * x[0]! + r[1]! * x[1]!);
    const res = nnls(A, b);
    expect(res.x[0]).toBeCloseTo(0.5, 12);
    expect(res.x[1]).toBeCloseTo(1.5, 12);
  });
  it('satisfies the Karush–Kuhn–Tucker conditions on random problems (x ≥ 0, w = Aᵀ(b − Ax) ≤ 0, x·w = 0)', () => {
    let s = 7;
    const r = () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 2 ** 32 - 0.5; };
    for (let k = 0; k < 30; k++) {
      const A = Array.from({ length: 8 }, () => Array.from({ length: 4 }, r));
      const b = Array.from({ length: 8 }, r);
      const { x } = nnls(A, b);
      const res = b.map((bi, i) => bi - A[i]!.reduce((t, a, j) => t + a * x[j]!, 0));
      const w = x.map((_, j) => A.reduce((t, row, i) => t + row[j]! * res[i]!, 0));
      x.forEach((xj, j) => {
        expect(xj).toBeGreaterThanOrEqual(0);
        expect(w[j]!).toBeLessThan(1e-10);
        expect(Math.abs(xj * w[j]!)).toBeLessThan(1e-10);
      });
    }
  });
});

describe('linear algebra', () => {
  it('solves, inverts and diagonalises a small symmetric matrix', () => {
    const A = [[4, 1, 0.5], [1, 3, 0.2], [0.5, 0.2, 2]];
    const x = solveLinear(A, [1, 2, 3])!;
    A.forEach((row, i) => expect(row.reduce((t, a, j) => t + a * x[j]!, 0)).toBeCloseTo([1, 2, 3][i]!, 12));
    const inv = invertSymmetric(A)!;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(A[i]!.reduce((t, a, k) => t + a * inv[k]![j]!, 0)).toBeCloseTo(i === j ? 1 : 0, 12);
    const { values } = symmetricEigen(A);
    expect(values.reduce((a, b) => a + b, 0)).toBeCloseTo(9, 12); // trace
    expect(invertSymmetric([[1, 1], [1, 1]])).toBeUndefined();
  });
});

describe('fitLeastSquares', () => {
  it('fits y = a·exp(−k·t) to noise-free data from several starts (exact fit) and reports convergence', () => {
    const t = [0, 1, 2, 3, 4, 5, 6];
    const y = t.map((v) => 3 * Math.exp(-0.4 * v));
    const fit = fitLeastSquares({ residuals: ([la, lk]) => t.map((v, i) => Math.exp(la!) * Math.exp(-Math.exp(lk!) * v) - y[i]!), starts: [[0, 0], [2, -3], [-1, 1]], residualScale: 1, what: 'test' });
    expect(fit.converged).toBe(true);
    expect(Math.exp(fit.x[0]!)).toBeCloseTo(3, 9);
    expect(Math.exp(fit.x[1]!)).toBeCloseTo(0.4, 9);
  });
  it('throws a ComputationError when no start is feasible', () => {
    expect(() => fitLeastSquares({ residuals: () => [NaN], starts: [[0]], what: 'test' })).toThrow(/no starting point/);
  });
});
