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
  luFactorInPlace(a, 0, n, piv, 0, what);
  return { n, solve: (b: Float64Array, offset = 0) => luSolveInPlace(a, 0, n, piv, 0, b, offset) };
}

/**
 * The same factorisation into caller-owned storage (no allocation): the n×n matrix at
 * `a[aOffset…]` is overwritten by its LU factors and `piv[pivOffset…]` receives the n pivots.
 * @throws ComputationError when a pivot is zero or not finite
 */
export function luFactorInPlace(a: Float64Array, aOffset: number, n: number, piv: Int32Array, pivOffset: number, what = 'linear system'): void {
  const o = aOffset, po = pivOffset;
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[o + k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[o + i * n + k]!);
      if (v > best) { best = v; p = i; }
    }
    if (!(best > 0) || !Number.isFinite(best)) throw new ComputationError(`${what}: the Newton matrix is singular or not finite (column ${k})`);
    piv[po + k] = p;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[o + k * n + j]!;
        a[o + k * n + j] = a[o + p * n + j]!;
        a[o + p * n + j] = t;
      }
    }
    const inv = 1 / a[o + k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const f = a[o + i * n + k]! * inv;
      if (f === 0) continue;
      a[o + i * n + k] = f;
      for (let j = k + 1; j < n; j++) a[o + i * n + j] = a[o + i * n + j]! - f * a[o + k * n + j]!;
    }
  }
}

/** Solve with factors from luFactorInPlace (same offsets): b[offset…] is overwritten by x. */
export function luSolveInPlace(a: Float64Array, aOffset: number, n: number, piv: Int32Array, pivOffset: number, b: Float64Array, offset = 0): void {
  const o = aOffset, po = pivOffset;
  for (let k = 0; k < n; k++) {
    const p = piv[po + k]!;
    if (p !== k) {
      const t = b[offset + k]!;
      b[offset + k] = b[offset + p]!;
      b[offset + p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    let s = b[offset + i]!;
    for (let j = 0; j < i; j++) s -= a[o + i * n + j]! * b[offset + j]!;
    b[offset + i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[offset + i]!;
    for (let j = i + 1; j < n; j++) s -= a[o + i * n + j]! * b[offset + j]!;
    b[offset + i] = s / a[o + i * n + i]!;
  }
}
