/**
 * Numerically safe logistic helpers used by the IAST solvers.
 * σ(t) = 1/(1 + e^(−t)); softplus(t) = ln(1 + e^t); ln σ(t) = −softplus(−t).
 */

/** ln(1 + e^t) without overflow or loss of precision. */
export function softplus(t: number): number {
  return t > 0 ? t + Math.log1p(Math.exp(-t)) : Math.log1p(Math.exp(t));
}

/** σ(t) = 1/(1 + e^(−t)). */
export function sigmoid(t: number): number {
  if (t >= 0) return 1 / (1 + Math.exp(-t));
  const e = Math.exp(t);
  return e / (1 + e);
}

/** logit(p) = ln(p/(1 − p)), for 0 < p < 1. */
export function logit(p: number): number {
  return Math.log(p) - Math.log1p(-p);
}
