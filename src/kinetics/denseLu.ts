/**
 * Dense LU factorisation with partial pivoting, factor once and solve many right-hand sides
 * (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §3.2 and §3.4). Used for the Newton
 * matrices (I − γh·J) of the implicit integrator; the matrix is a row-major Float64Array.
 */
import { ComputationError } from '../core/errors.js';

export interface DenseLu {
  readonly n: number;
  /** Solve A·x = b in place (b is overwritten with x). */
  solve(b: Float64Array, offset?: number): void;
}

/**
 * Factorise the n×n row-major matrix `a` in place.
 * @throws ComputationError when a pivot is zero or not finite (numerically singular matrix).
 */
export function denseLu(a: Float64Array, n: number, what = 'linear system'): DenseLu {
  const piv = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]!);
      if (v > best) { best = v; p = i; }
    }
    if (!(best > 0) || !Number.isFinite(best)) throw new ComputationError(`${what}: the Newton matrix is singular or not finite (column ${k})`);
    piv[k] = p;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]!;
        a[k * n + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
    }
    const inv = 1 / a[k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const f = a[i * n + k]! * inv;
      if (f === 0) continue;
      a[i * n + k] = f;
      for (let j = k + 1; j < n; j++) a[i * n + j] = a[i * n + j]! - f * a[k * n + j]!;
    }
  }
  return {
    n,
    solve(b: Float64Array, offset = 0): void {
      for (let k = 0; k < n; k++) {
        const p = piv[k]!;
        if (p !== k) {
          const t = b[offset + k]!;
          b[offset + k] = b[offset + p]!;
          b[offset + p] = t;
        }
      }
      for (let i = 1; i < n; i++) {
        let s = b[offset + i]!;
        for (let j = 0; j < i; j++) s -= a[i * n + j]! * b[offset + j]!;
        b[offset + i] = s;
      }
      for (let i = n - 1; i >= 0; i--) {
        let s = b[offset + i]!;
        for (let j = i + 1; j < n; j++) s -= a[i * n + j]! * b[offset + j]!;
        b[offset + i] = s / a[i * n + i]!;
      }
    },
  };
}
