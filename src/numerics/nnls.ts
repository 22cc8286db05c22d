/**
 * Non-negative least squares: minimise ‖A·x − b‖² subject to x ≥ 0.
 *
 * Active-set algorithm of Lawson & Hanson (1974), Solving Least Squares Problems, Prentice-Hall,
 * ch. 23 (algorithm NNLS). The unconstrained sub-problems on the passive set are solved through
 * their normal equations, adequate for the few columns used here (one per fictive component).
 * @param A rows of the design matrix (m×n)
 * @param b right-hand side (length m)
 * @returns x ≥ 0, the residual norm and the iteration count
 * @throws ComputationError if the algorithm does not terminate within 30·n outer iterations
 */
import { ComputationError } from '../core/errors.js';
import { solveLinear } from './linearSystem.js';

export interface NnlsResult {
  x: number[];
  residualNorm: number;
  iterations: number;
}

export function nnls(A: readonly (readonly number[])[], b: readonly number[]): NnlsResult {
  const m = A.length;
  const n = A[0]?.length ?? 0;
  const x = new Array<number>(n).fill(0);
  const passive = new Array<boolean>(n).fill(false);
  const residual = () => b.map((bi, i) => bi - A[i]!.reduce((s, a, j) => s + a * x[j]!, 0));
  const gradient = () => {
    const r = residual();
    return Array.from({ length: n }, (_, j) => A.reduce((s, row, i) => s + row[j]! * r[i]!, 0));
  };
  let scale = 0;
  for (const row of A) for (const v of row) scale = Math.max(scale, Math.abs(v));
  const bScale = Math.max(...b.map(Math.abs), 0);
  const tol = 1e-12 * Math.max(1, scale * bScale * m);
  /** Least squares restricted to the passive columns. */
  const solvePassive = (): number[] | undefined => {
    const idx = passive.map((p, j) => (p ? j : -1)).filter((j) => j >= 0);
    const M = idx.map((a) => idx.map((c) => A.reduce((s, row) => s + row[a]! * row[c]!, 0)));
    const rhs = idx.map((a) => A.reduce((s, row, i) => s + row[a]! * b[i]!, 0));
    const sol = solveLinear(M, rhs, 1e-14);
    if (!sol) return undefined;
    const z = new Array<number>(n).fill(0);
    idx.forEach((j, k) => { z[j] = sol[k]!; });
    return z;
  };
  let iterations = 0;
  for (;;) {
    const w = gradient();
    let jMax = -1;
    for (let j = 0; j < n; j++) if (!passive[j] && w[j]! > tol && (jMax < 0 || w[j]! > w[jMax]!)) jMax = j;
    if (jMax < 0) break;
    if (++iterations > 30 * Math.max(n, 1)) throw new ComputationError('non-negative least squares did not terminate');
    passive[jMax] = true;
    for (;;) {
      const z = solvePassive();
      if (!z) { passive[jMax] = false; return finish(); }
      const bad = passive.map((p, j) => p && z[j]! <= 0);
      if (!bad.some(Boolean)) { for (let j = 0; j < n; j++) x[j] = z[j]!; break; }
      let alpha = Infinity;
      for (let j = 0; j < n; j++) if (bad[j]) alpha = Math.min(alpha, x[j]! / (x[j]! - z[j]!));
      for (let j = 0; j < n; j++) if (passive[j]) x[j] = x[j]! + alpha * (z[j]! - x[j]!);
      for (let j = 0; j < n; j++) if (passive[j] && x[j]! <= 1e-15 * (1 + Math.abs(x[j]!))) { passive[j] = false; x[j] = 0; }
    }
  }
  return finish();
  function finish(): NnlsResult {
    const r = residual();
    return { x: [...x], residualNorm: Math.sqrt(r.reduce((s, v) => s + v * v, 0)), iterations };
  }
}
