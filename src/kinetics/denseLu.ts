/**
 * Dense LU factorisation with partial pivoting, factor once and solve many right-hand sides
 * (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §3.2 and §3.4). Used for the Newton
 * matrices (I − γh·J) of the implicit integrators; the matrix is a row-major Float64Array.
 * `luFactorAt`/`luSolveAt` work in place on a matrix stored at an offset of a larger array (no
 * allocation, for the integrators' inner loops); `denseLu` wraps them. `luSolveBlocksAt` solves
 * several such blocks stored one after another. `luFactorLastRowAt` factorises a matrix whose rows
 * but the last are those of one already factorised, by eliminating only its last row (ours: the
 * same arithmetic as luFactorAt, element by element, where the pivots allow it), and
 * `luSolveSharedBlocksAt` solves blocks that share those rows.
 */
import { ComputationError } from '../core/errors.js';

export interface DenseLu {
  readonly n: number;
  /** Solve A·x = b in place (b is overwritten with x). */
  solve(b: Float64Array, offset?: number): void;
}

/**
 * Factorise the n×n row-major matrix stored at a[off …] in place, pivots into piv[pOff …].
 * With `upperBest`, the largest |a_ik| of the rows k ≤ i < n − 1 at step k (the pivot candidates
 * but the last row) goes to upperBest[uOff + k] for k < n − 1 (for luFactorLastRowAt).
 * @throws ComputationError when a pivot is zero or not finite (numerically singular matrix).
 */
export function luFactorAt(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number, what = 'linear system', upperBest?: Float64Array, uOff = 0): void {
  const last = n - 1;
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[off + k * n + k]!);
    for (let i = k + 1; i < last; i++) {
      const v = Math.abs(a[off + i * n + k]!);
      if (v > best) { best = v; p = i; }
    }
    if (k < last) {
      if (upperBest) upperBest[uOff + k] = best;
      const v = Math.abs(a[off + last * n + k]!);
      if (v > best) { best = v; p = last; }
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
    const rk = off + k * n;
    const inv = 1 / a[rk + k]!;
    // the rows below, two at a time where both have a multiplier (each element's arithmetic is
    // that of eliminateRow)
    let i = k + 1;
    for (; i + 1 < n; i += 2) {
      const ri = off + i * n, ri2 = ri + n;
      const f = a[ri + k]! * inv, f2 = a[ri2 + k]! * inv;
      if (f !== 0 && f2 !== 0) {
        a[ri + k] = f;
        a[ri2 + k] = f2;
        for (let j = k + 1; j < n; j++) {
          const akj = a[rk + j]!;
          a[ri + j] = a[ri + j]! - f * akj;
          a[ri2 + j] = a[ri2 + j]! - f2 * akj;
        }
      } else {
        eliminateRow(a, rk, ri, k, n, f);
        eliminateRow(a, rk, ri2, k, n, f2);
      }
    }
    if (i < n) eliminateRow(a, rk, off + i * n, k, n, a[off + i * n + k]! * inv);
  }
}

/**
 * Factorise in place the n×n matrix at a[off …] whose rows but the last (and their pivots,
 * piv[pOff …]) already hold luFactorAt's factorisation of a matrix with the same rows but the
 * last, that factorisation having chosen no pivot in the last row and given `upperBest` (luFactorAt),
 * and whose last row holds this matrix's own: the last row is eliminated with the factorised rows
 * in order, each element with luFactorAt's arithmetic, so that the result is luFactorAt's bit for
 * bit. Returns false, with the last row partly eliminated, where luFactorAt would choose a pivot in
 * the last row before the last column or meets a zero multiplier there (then factorise the whole
 * matrix with luFactorAt).
 * @throws ComputationError when the last pivot is zero or not finite, as luFactorAt.
 */
export function luFactorLastRowAt(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number, upperBest: Float64Array, uOff: number, what = 'linear system'): boolean {
  const last = n - 1;
  const rl = off + last * n;
  for (let k = 0; k < last; k++) {
    const v = a[rl + k]!;
    if (!(Math.abs(v) <= upperBest[uOff + k]!)) return false;
    const rk = off + k * n;
    const f = v * (1 / a[rk + k]!);
    if (f === 0) return false;
    eliminateRow(a, rk, rl, k, n, f);
  }
  const best = Math.abs(a[rl + last]!);
  if (!(best > 0) || !Number.isFinite(best)) throw new ComputationError(`${what}: the Newton matrix is singular or not finite (column ${last})`);
  piv[pOff + last] = last;
  return true;
}

/** One step of Gaussian elimination on the row at a[ri …] with the pivot row at a[rk …] (column k, multiplier f; nothing when f is 0). */
function eliminateRow(a: Float64Array, rk: number, ri: number, k: number, n: number, f: number): void {
  if (f === 0) return;
  a[ri + k] = f;
  for (let j = k + 1; j < n; j++) a[ri + j] = a[ri + j]! - f * a[rk + j]!;
}

/** The row exchanges of a factorisation (pivots at piv[pOff …]) applied to b[bOff … bOff + n), in order. */
function applyPivots(piv: Int32Array, pOff: number, b: Float64Array, bOff: number, n: number): void {
  for (let k = 0; k < n; k++) {
    const p = piv[pOff + k]!;
    if (p !== k) {
      const t = b[bOff + k]!;
      b[bOff + k] = b[bOff + p]!;
      b[bOff + p] = t;
    }
  }
}

/** Solve with a factorisation from luFactorAt: b[bOff … bOff + n) is overwritten with x. */
export function luSolveAt(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number, b: Float64Array, bOff: number): void {
  applyPivots(piv, pOff, b, bOff, n);
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
 * Solve `count` independent systems factorised by luFactorAt and stored one after another: block
 * q has its matrix at a[off + q·n² …], its pivots at piv[pOff + q·n …] and its right-hand side at
 * b[bOff + q·n …] (overwritten with x). Every block gets exactly the arithmetic of luSolveAt, in
 * the same order; four blocks at a time go through the rows together, so that their independent
 * chains of dependent operations overlap in the processor (the rest one by one, by luSolveAt).
 */
export function luSolveBlocksAt(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number, b: Float64Array, bOff: number, count: number): void {
  const nn = n * n;
  let q = 0;
  for (; q + 3 < count; q += 4) {
    for (let u = q; u < q + 4; u++) applyPivots(piv, pOff + u * n, b, bOff + u * n, n);
    const b0 = bOff + q * n, b1 = b0 + n, b2 = b1 + n, b3 = b2 + n;
    const a0 = off + q * nn, a1 = a0 + nn, a2 = a1 + nn, a3 = a2 + nn;
    for (let i = 1; i < n; i++) {
      let s0 = b[b0 + i]!, s1 = b[b1 + i]!, s2 = b[b2 + i]!, s3 = b[b3 + i]!;
      const r = i * n;
      for (let j = 0; j < i; j++) {
        s0 -= a[a0 + r + j]! * b[b0 + j]!;
        s1 -= a[a1 + r + j]! * b[b1 + j]!;
        s2 -= a[a2 + r + j]! * b[b2 + j]!;
        s3 -= a[a3 + r + j]! * b[b3 + j]!;
      }
      b[b0 + i] = s0; b[b1 + i] = s1; b[b2 + i] = s2; b[b3 + i] = s3;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s0 = b[b0 + i]!, s1 = b[b1 + i]!, s2 = b[b2 + i]!, s3 = b[b3 + i]!;
      const r = i * n;
      for (let j = i + 1; j < n; j++) {
        s0 -= a[a0 + r + j]! * b[b0 + j]!;
        s1 -= a[a1 + r + j]! * b[b1 + j]!;
        s2 -= a[a2 + r + j]! * b[b2 + j]!;
        s3 -= a[a3 + r + j]! * b[b3 + j]!;
      }
      b[b0 + i] = s0 / a[a0 + r + i]!; b[b1 + i] = s1 / a[a1 + r + i]!; b[b2 + i] = s2 / a[a2 + r + i]!; b[b3 + i] = s3 / a[a3 + r + i]!;
    }
  }
  for (; q < count; q++) luSolveAt(a, off + q * nn, n, piv, pOff + q * n, b, bOff + q * n);
}

/**
 * luSolveBlocksAt for blocks whose factorisations share every row but the last with the first
 * block (its rows 0 … n − 2 and pivots; luFactorLastRowAt): each block gets exactly the arithmetic
 * of luSolveAt, in the same order, the shared rows' coefficients read once from the first block
 * for four blocks at a time.
 */
export function luSolveSharedBlocksAt(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number, b: Float64Array, bOff: number, count: number): void {
  const nn = n * n;
  const last = n - 1;
  let q = 0;
  for (; q + 3 < count; q += 4) {
    for (let u = q; u < q + 4; u++) applyPivots(piv, pOff, b, bOff + u * n, n); // the first block's pivots: shared
    const b0 = bOff + q * n, b1 = b0 + n, b2 = b1 + n, b3 = b2 + n;
    const a0 = off + q * nn, a1 = a0 + nn, a2 = a1 + nn, a3 = a2 + nn;
    for (let i = 1; i < last; i++) {
      let s0 = b[b0 + i]!, s1 = b[b1 + i]!, s2 = b[b2 + i]!, s3 = b[b3 + i]!;
      const r = off + i * n;
      for (let j = 0; j < i; j++) {
        const c = a[r + j]!;
        s0 -= c * b[b0 + j]!;
        s1 -= c * b[b1 + j]!;
        s2 -= c * b[b2 + j]!;
        s3 -= c * b[b3 + j]!;
      }
      b[b0 + i] = s0; b[b1 + i] = s1; b[b2 + i] = s2; b[b3 + i] = s3;
    }
    if (last > 0) {
      let s0 = b[b0 + last]!, s1 = b[b1 + last]!, s2 = b[b2 + last]!, s3 = b[b3 + last]!;
      const r = last * n;
      for (let j = 0; j < last; j++) {
        s0 -= a[a0 + r + j]! * b[b0 + j]!;
        s1 -= a[a1 + r + j]! * b[b1 + j]!;
        s2 -= a[a2 + r + j]! * b[b2 + j]!;
        s3 -= a[a3 + r + j]! * b[b3 + j]!;
      }
      const d = last * n + last;
      b[b0 + last] = s0 / a[a0 + d]!; b[b1 + last] = s1 / a[a1 + d]!; b[b2 + last] = s2 / a[a2 + d]!; b[b3 + last] = s3 / a[a3 + d]!;
    } else {
      b[b0] = b[b0]! / a[a0]!; b[b1] = b[b1]! / a[a1]!; b[b2] = b[b2]! / a[a2]!; b[b3] = b[b3]! / a[a3]!;
    }
    for (let i = last - 1; i >= 0; i--) {
      let s0 = b[b0 + i]!, s1 = b[b1 + i]!, s2 = b[b2 + i]!, s3 = b[b3 + i]!;
      const r = off + i * n;
      for (let j = i + 1; j < n; j++) {
        const c = a[r + j]!;
        s0 -= c * b[b0 + j]!;
        s1 -= c * b[b1 + j]!;
        s2 -= c * b[b2 + j]!;
        s3 -= c * b[b3 + j]!;
      }
      const d = a[r + i]!;
      b[b0 + i] = s0 / d; b[b1 + i] = s1 / d; b[b2 + i] = s2 / d; b[b3 + i] = s3 / d;
    }
  }
  for (; q < count; q++) luSolveAt(a, off + q * nn, n, piv, pOff + q * n, b, bOff + q * n);
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
