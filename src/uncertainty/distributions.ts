/**
 * Random draws for the Monte Carlo runs: standard normal (Box–Muller), lognormal for positive
 * parameters given a relative standard deviation, and multivariate normal from a covariance
 * matrix (Cholesky factor) for fitted parameters.
 */
import { ComputationError, InputError } from '../core/errors.js';
import type { Rng } from './prng.js';

/**
 * Standard normal draws by the Box–Muller transform (Box, G.E.P., Muller, M.E. (1958) Ann. Math.
 * Stat. 29(2):610–611): z1 = √(−2 ln u1)·cos(2π u2), z2 = √(−2 ln u1)·sin(2π u2) with u1 ∈ (0, 1],
 * u2 ∈ [0, 1). The second value of each pair is kept for the next call, so the sequence depends
 * only on the generator's stream.
 */
export class NormalSampler {
  private spare = 0;
  private hasSpare = false;
  constructor(private readonly rng: Rng) {}

  next(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    const u1 = 1 - this.rng.nextFloat(); // (0, 1]: ln u1 is finite
    const u2 = this.rng.nextFloat();
    const r = Math.sqrt(-2 * Math.log(u1));
    const phi = 2 * Math.PI * u2;
    this.spare = r * Math.sin(phi);
    this.hasSpare = true;
    return r * Math.cos(phi);
  }
}

/**
 * σ of ln X for a lognormal X whose coefficient of variation is `relSd`:
 * σ_ln = √(ln(1 + cv²)) (standard lognormal moments, e.g. Johnson, Kotz & Balakrishnan 1994,
 * Continuous Univariate Distributions vol. 1, ch. 14). relSd = 0 gives 0.
 */
export function lognormalSigma(relSd: number): number {
  if (!(relSd >= 0) || !Number.isFinite(relSd)) throw new InputError(`expected a relative standard deviation ≥ 0, got ${relSd}`);
  return Math.sqrt(Math.log1p(relSd * relSd));
}

/**
 * A lognormal draw with median `median` and log-space standard deviation `sigmaLn`:
 * X = median·exp(σ_ln·z). We centre on the median so that the point estimate stays the 50th
 * percentile of each parameter (our choice, stated in the Monte Carlo output). σ_ln = 0 returns
 * the median exactly.
 */
export function lognormalFromZ(median: number, sigmaLn: number, z: number): number {
  return sigmaLn === 0 ? median : median * Math.exp(sigmaLn * z);
}

/**
 * Lower Cholesky factor L of a symmetric positive semi-definite matrix A = L·Lᵀ
 * (Cholesky–Banachiewicz order; Golub & Van Loan, Matrix Computations, 4th ed. 2013, alg. 4.2.1).
 * Zero pivots (a parameter held fixed, or an exactly dependent one) are allowed and give a zero
 * column, so semi-definite covariances of fitted parameters work.
 * @throws InputError when A is not square, not symmetric or not positive semi-definite.
 */
export function cholesky(a: readonly (readonly number[])[]): number[][] {
  const n = a.length;
  const L: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  let scale = 0;
  for (let i = 0; i < n; i++) {
    const row = a[i];
    if (!row || row.length !== n) throw new InputError(`expected a square ${n}×${n} covariance matrix; row ${i + 1} has ${row?.length ?? 0} entries`, { path: `covariance.matrix[${i}]` });
    for (let j = 0; j < n; j++) {
      const v = row[j]!;
      if (!Number.isFinite(v)) throw new InputError(`expected finite covariance entries, got ${v}`, { path: `covariance.matrix[${i}][${j}]` });
      scale = Math.max(scale, Math.abs(v));
    }
  }
  const tol = 1e-12 * Math.max(scale, Number.MIN_VALUE);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      if (Math.abs(a[i]![j]! - a[j]![i]!) > tol * 10) throw new InputError('expected a symmetric covariance matrix', { path: `covariance.matrix[${i}][${j}]` });
    }
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i]![j]!;
      for (let k = 0; k < j; k++) s -= L[i]![k]! * L[j]![k]!;
      if (i === j) {
        if (s < -tol * 1e3) throw new InputError(`expected a positive semi-definite covariance matrix (pivot ${i + 1} is ${s.toExponential(3)})`, { path: `covariance.matrix[${i}][${i}]` });
        L[i]![i] = s > tol ? Math.sqrt(s) : 0;
      } else {
        const d = L[j]![j]!;
        L[i]![j] = d > 0 ? s / d : 0;
      }
    }
  }
  return L;
}

/**
 * Multivariate normal deviations δ = L·z (z standard normal), so cov(δ) = L·Lᵀ = Σ; add δ to the
 * mean. Writes into `out` and returns it.
 */
export function multivariateNormalDeviation(L: readonly (readonly number[])[], normal: NormalSampler, out: Float64Array): Float64Array {
  const n = L.length;
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) z[i] = normal.next();
  for (let i = 0; i < n; i++) {
    let s = 0;
    const row = L[i]!;
    for (let k = 0; k <= i; k++) s += row[k]! * z[k]!;
    out[i] = s;
  }
  for (let i = 0; i < n; i++) if (!Number.isFinite(out[i]!)) throw new ComputationError('multivariate normal draw is not finite');
  return out;
}
