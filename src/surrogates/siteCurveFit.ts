/**
 * A site-specific removal–UV254-reduction curve fitted to pilot pairs.
 *
 * Form (ours, a simple monotone curve through (0, 0) and (1, 1)):
 *   removal R = 1 − (1 − ΔUV)^k,   k > 0
 * k = 1 is removal equal to the UV254 reduction; k > 1 means the compound is removed more easily
 * than the UV-absorbing DOC. k is fitted by least squares in R (Σ (R_j − R(ΔUV_j; k))² minimal):
 * a scan of 241 values of ln k over [ln 0.02, ln 50] brackets the minimum, golden-section search
 * (Kiefer 1953, Proc. Am. Math. Soc. 4:502–506) refines it to |Δ ln k| < 1e-10. The standard
 * error of k is the Gauss–Newton one, s·(Σ J_j²)^(−1/2) with J = ∂R/∂k = −(1 − ΔUV)^k·ln(1 − ΔUV)
 * and s² = SSE/(N − 1).
 *
 * Units: reductions and removals are fractions.
 */
import { ComputationError } from '../core/errors.js';

export const SITE_CURVE_FORM = 'removal = 1 − (1 − UV254 reduction)^k, k fitted by least squares';

export interface SiteCurveFit {
  k: number;
  /** Gauss–Newton standard error of k (NaN-free: Infinity when not estimable). */
  standardErrorK: number;
  /** Root-mean-square residual, as a fraction (×100 for percentage points). */
  rmse: number;
  /** Coefficient of determination against the mean removal (may be < 0 for a poor fit). */
  r2: number;
  points: number;
  /** True when k sits at the end of the searched range (0.02 or 50): treat with care. */
  atBound: boolean;
  form: string;
}

const LN_K_MIN = Math.log(0.02);
const LN_K_MAX = Math.log(50);

/** Removal predicted by the site curve at a UV254 reduction. */
export function siteCurveRemoval(k: number, uv254Reduction: number): number {
  return 1 - Math.pow(1 - uv254Reduction, k);
}

/**
 * Fit k to pairs (UV254 reduction x_j in [0, 1], removal r_j).
 * @throws ComputationError when there are no points or the values are not finite
 */
export function fitSiteCurve(x: readonly number[], r: readonly number[]): SiteCurveFit {
  const n = x.length;
  if (n === 0 || r.length !== n) throw new ComputationError('site curve fit: expected at least one (UV254 reduction, removal) pair');
  for (let j = 0; j < n; j++) {
    if (!Number.isFinite(x[j]!) || !Number.isFinite(r[j]!) || x[j]! < 0 || x[j]! > 1) throw new ComputationError(`site curve fit: pair ${j + 1} is not a finite UV254 reduction in [0, 1] with a finite removal`);
  }
  const sse = (lnk: number) => {
    const k = Math.exp(lnk);
    let s = 0;
    for (let j = 0; j < n; j++) { const e = r[j]! - siteCurveRemoval(k, x[j]!); s += e * e; }
    return s;
  };
  const steps = 240;
  const h = (LN_K_MAX - LN_K_MIN) / steps;
  let best = 0, bestV = Infinity;
  for (let i = 0; i <= steps; i++) {
    const v = sse(LN_K_MIN + i * h);
    if (v < bestV) { bestV = v; best = i; }
  }
  let a = LN_K_MIN + Math.max(0, best - 1) * h;
  let b = LN_K_MIN + Math.min(steps, best + 1) * h;
  const g = (Math.sqrt(5) - 1) / 2; // golden section
  let c = b - g * (b - a), d = a + g * (b - a);
  let fc = sse(c), fd = sse(d);
  while (b - a > 1e-10) {
    if (fc < fd) { b = d; d = c; fd = fc; c = b - g * (b - a); fc = sse(c); }
    else { a = c; c = d; fc = fd; d = a + g * (b - a); fd = sse(d); }
  }
  let lnk = (a + b) / 2;
  if (sse(lnk) > bestV) lnk = LN_K_MIN + best * h;
  const k = Math.exp(lnk);
  const s = sse(lnk);
  let mean = 0;
  for (const v of r) mean += v / n;
  let sst = 0, jj = 0;
  for (let j = 0; j < n; j++) {
    sst += (r[j]! - mean) ** 2;
    const base = 1 - x[j]!;
    if (base > 0) { const J = -Math.pow(base, k) * Math.log(base); jj += J * J; }
  }
  const se = n > 1 && jj > 0 ? Math.sqrt(s / (n - 1) / jj) : Infinity;
  return {
    k,
    standardErrorK: se,
    rmse: Math.sqrt(s / n),
    r2: sst > 0 ? 1 - s / sst : s === 0 ? 1 : 0,
    points: n,
    atBound: lnk - LN_K_MIN < 1e-6 || LN_K_MAX - lnk < 1e-6,
    form: SITE_CURVE_FORM,
  };
}
