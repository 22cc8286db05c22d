/**
 * Dense LU factorisation with partial pivoting, factor once and solve many right-hand sides
 * (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §3.2 and §3.4). Used for the Newton
 * matrices (I − γh·J) of the implicit integrators; the matrix is a row-major Float64Array.
 * `luFactorAt`/`luSolveAt` work in place on a matrix stored at an offset of a larger array (no
 * allocation, for the integrators' inner loops); `denseLu` wraps them.
 */
import { ComputationError } from '../core/errors.js';

export interface DenseLu {
  readonly n: number;
  /** Solve A·x = b in place (b is overwritten with x). */
  solve(b: Float64Array, offset?: number): void;
}

/**
 * Factorise the n×n row-major matrix stored at a[off …] in place, pivots into piv[pOff …].
 * @throws ComputationError when a pivot is zero or not finite (numerically singular matrix).
 */
export function luFactorAt(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number, what = 'linear system'): void {
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[off + k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[off + i * n + k]!);
      if (v > best) { best = v; p = i; }
    }
    if (!(best > 0) || !Number.isFinite(best)) throw new ComputationError(`${what}: the Newton matrix is singular or not finite (column ${k})`);
    piv[pOff + k] = p;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[off + k * n + j]!;
        a[off + k * n + j] = a[off + p * n + j]!;
        a[off + p * n + j] = t;
      }
    }
    const inv = 1 / a[off + k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const f = a[off + i * n + k]! * inv;
      if (f === 0) continue;
      a[off + i * n + k] = f;
      for (let j = k + 1; j < n; j++) a[off + i * n + j] = a[off + i * n + j]! - f * a[off + k * n + j]!;
    }
  }
}

/** Solve with a factorisation from luFactorAt: b[bOff … bOff + n) is overwritten with x. */
export function luSolveAt(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number, b: Float64Array, bOff: number): void {
  for (let k = 0; k < n; k++) {
    const p = piv[pOff + k]!;
    if (p !== k) {
      const t = b[bOff + k]!;
      b[bOff + k] = b[bOff + p]!;
      b[bOff + p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    let s = b[bOff + i]!;
    const row = off + i * n;
    for (let j = 0; j < i; j++) s -= a[row + j]! * b[bOff + j]!;
    b[bOff + i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[bOff + i]!;
    const row = off + i * n;
    for (let j = i + 1; j < n; j++) s -= a[row + j]! * b[bOff + j]!;
    b[bOff + i] = s / a[row + i]!;
  }
}

/**
 * Factorise the n×n row-major matrix `a` in place.
 * @throws ComputationError when a pivot is zero or not finite (numerically singular matrix).
 */
export function denseLu(a: Float64Array, n: number, what = 'linear system'): DenseLu {
  const piv = new Int32Array(n);
  luFactorAt(a, 0, n, piv, 0, what);
  return {
    n,
    solve(b: Float64Array, offset = 0): void {
      luSolveAt(a, 0, n, piv, 0, b, offset);
    },
  };
}
