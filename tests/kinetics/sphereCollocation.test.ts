/**
 * Orthogonal collocation in a sphere (Villadsen & Michelsen 1978): the points, the quadrature of
 * the volume mean, the Laplacian and the surface gradient on polynomials where they are exact,
 * and the discrete divergence identity Σ w_j (Bq)_j = 3·(g·q).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { sphereCollocation } from '../../src/kinetics/sphereCollocation.js';
import { ComputationError } from '../../src/core/errors.js';

describe('sphere collocation', () => {
  it('N = 1: the interior point is x = 3/7 (closed form: root of P_1^(1,1/2)(2x − 1) = 0)', () => {
    const c = sphereCollocation(1);
    expect(c.x[0]).toBeCloseTo(3 / 7, 14);
    expect(c.x[1]).toBe(1);
  });

  for (const N of [1, 3, 6, 12, 24, 40]) {
    it(`N = ${N}: quadrature exact for x^k, k = 0…2N (Radau points; closed form 3/(2k + 3))`, () => {
      const c = sphereCollocation(N);
      for (let k = 0; k <= 2 * N; k++) {
        let s = 0;
        c.x.forEach((xi, j) => { s += c.weights[j]! * xi ** k; });
        expect(Math.abs(s - 3 / (2 * k + 3))).toBeLessThan(1e-12);
      }
    });

    it(`N = ${N}: Laplacian and surface gradient exact on x^k, k ≤ N (∇²x^k = 2k(2k+1)x^(k−1), ∂x^k/∂u|₁ = 2k)`, () => {
      const c = sphereCollocation(N);
      const m = N + 1;
      for (let k = 0; k <= Math.min(N, 8); k++) {
        const q = Array.from(c.x, (xi) => xi ** k);
        let g = 0;
        for (let j = 0; j < m; j++) g += c.surfaceGradient[j]! * q[j]!;
        expect(Math.abs(g - 2 * k)).toBeLessThan(1e-8 * Math.max(1, 2 * k) * m * m);
        for (let i = 0; i < m; i++) {
          let b = 0;
          for (let j = 0; j < m; j++) b += c.laplacian[i * m + j]! * q[j]!;
          const expected = k === 0 ? 0 : 2 * k * (2 * k + 1) * c.x[i]! ** (k - 1);
          expect(Math.abs(b - expected)).toBeLessThan(1e-7 * Math.max(1, Math.abs(expected)) * m * m);
        }
      }
    });
  }

  it('discrete divergence identity Σ w_j (Bq)_j = 3·(g·q) for any nodal values (Gauss\' theorem, exact in the polynomial space)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 30 }), fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 31, maxLength: 31 }), (N, vals) => {
      const c = sphereCollocation(N);
      const m = N + 1;
      const q = vals.slice(0, m);
      let lhs = 0, rhs = 0, scale = 0;
      for (let i = 0; i < m; i++) {
        let b = 0;
        for (let j = 0; j < m; j++) { b += c.laplacian[i * m + j]! * q[j]!; scale += Math.abs(c.weights[i]! * c.laplacian[i * m + j]! * q[j]!); }
        lhs += c.weights[i]! * b;
        rhs += 3 * c.surfaceGradient[i]! * q[i]!;
      }
      return Math.abs(lhs - rhs) <= 1e-11 * Math.max(1, scale);
    }), { numRuns: 200, seed: 9 });
  });

  it('weights are positive and points ascend inside (0, 1]', () => {
    for (const N of [2, 10, 30]) {
      const c = sphereCollocation(N);
      c.weights.forEach((w) => expect(w).toBeGreaterThan(0));
      for (let i = 1; i <= N; i++) expect(c.x[i]!).toBeGreaterThan(c.x[i - 1]!);
    }
  });

  it('rejects N outside 1…40 with a reason', () => {
    expect(() => sphereCollocation(0)).toThrow(ComputationError);
    expect(() => sphereCollocation(41)).toThrow(/1 to 40/);
  });
});
