/**
 * Small dense linear algebra for the fitters: solving and inverting the few-by-few normal
 * matrices of least-squares problems (Gauss–Jordan elimination with partial pivoting on a
 * column-scaled matrix; Golub & Van Loan, Matrix Computations, 4th ed. 2013, §3.2 and §3.4).
 */

/** Solve A·x = b (A n×n, row-major arrays). Returns undefined when A is numerically singular. */
export function solveLinear(A: readonly (readonly number[])[], b: readonly number[], relTol = 1e-13): number[] | undefined {
  const n = b.length;
  const M = A.map((row, i) => [...row, b[i]!]);
  let scale = 0;
  for (const row of A) for (const v of row) scale = Math.max(scale, Math.abs(v));
  if (!(scale > 0) || !Number.isFinite(scale)) return undefined;
  for (let k = 0; k < n; k++) {
    let piv = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(M[i]![k]!) > Math.abs(M[piv]![k]!)) piv = i;
    if (!(Math.abs(M[piv]![k]!) > relTol * scale)) return undefined;
    [M[k], M[piv]] = [M[piv]!, M[k]!];
    const rowK = M[k]!;
    for (let i = 0; i < n; i++) {
      if (i === k) continue;
      const row = M[i]!;
      const f = row[k]! / rowK[k]!;
      if (f === 0) continue;
      for (let j = k; j <= n; j++) row[j] = row[j]! - f * rowK[j]!;
    }
  }
  const x = M.map((row, i) => row[n]! / row[i]!);
  return x.every(Number.isFinite) ? x : undefined;
}

/**
 * Inverse of a symmetric positive semi-definite matrix (a normal matrix JᵀJ), computed on the
 * unit-diagonal scaled matrix so that parameters of very different size do not spoil the pivots.
 * Returns undefined when singular (relative pivot below `relTol`).
 */
export function invertSymmetric(A: readonly (readonly number[])[], relTol = 1e-12): number[][] | undefined {
  const n = A.length;
  const d = A.map((row, i) => Math.sqrt(Math.abs(row[i]!)));
  if (d.some((v) => !(v > 0) || !Number.isFinite(v))) return undefined;
  const S = A.map((row, i) => row.map((v, j) => v / (d[i]! * d[j]!)));
  const inv: number[][] = [];
  for (let j = 0; j < n; j++) {
    const e = Array.from({ length: n }, (_, i) => (i === j ? 1 : 0));
    const col = solveLinear(S, e, relTol);
    if (!col) return undefined;
    inv.push(col);
  }
  // inv holds columns of S⁻¹ (symmetric); undo the scaling
  return inv.map((_, i) => inv.map((col, j) => col[i]! / (d[i]! * d[j]!)));
}

/** JᵀJ and Jᵀr for J given as rows (n×p). */
export function normalEquations(J: readonly (readonly number[])[], r: ArrayLike<number>): { JtJ: number[][]; Jtr: number[] } {
  const p = J[0]?.length ?? 0;
  const JtJ = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const Jtr = new Array<number>(p).fill(0);
  J.forEach((row, i) => {
    const ri = r[i]!;
    for (let a = 0; a < p; a++) {
      const ja = row[a]!;
      Jtr[a] = Jtr[a]! + ja * ri;
      const out = JtJ[a]!;
      for (let b = a; b < p; b++) out[b] = out[b]! + ja * row[b]!;
    }
  });
  for (let a = 0; a < p; a++) for (let b = 0; b < a; b++) JtJ[a]![b] = JtJ[b]![a]!;
  return { JtJ, Jtr };
}

/**
 * Eigen-decomposition of a small symmetric matrix by the cyclic Jacobi method (Golub & Van Loan
 * 2013, §8.5). Returns eigenvalues and the eigenvectors as columns of `vectors` (vectors[i][k] is
 * component i of eigenvector k).
 */
export function symmetricEigen(A: readonly (readonly number[])[]): { values: number[]; vectors: number[][] } {
  const n = A.length;
  const a = A.map((row) => [...row]);
  const v: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0, total = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { const x = a[i]![j]! ** 2; total += x; if (i !== j) off += x; }
    if (off <= 1e-30 * total || off === 0) break;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p]![q]!;
        if (apq === 0) continue;
        const theta = (a[q]![q]! - a[p]![p]!) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1), s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k]![p]!, akq = a[k]![q]!;
          a[k]![p] = c * akp - s * akq;
          a[k]![q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p]![k]!, aqk = a[q]![k]!;
          a[p]![k] = c * apk - s * aqk;
          a[q]![k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k]![p]!, vkq = v[k]![q]!;
          v[k]![p] = c * vkp - s * vkq;
          v[k]![q] = s * vkp + c * vkq;
        }
      }
    }
  }
  return { values: a.map((row, i) => row[i]!), vectors: v };
}
