/**
 * Exact binomial bounds for coverage tests of confidence intervals (Clopper & Pearson 1934 use
 * the same tail sums; docs/references.md). If an interval procedure covers the truth with
 * probability p in each of n independent trials, the number of covering trials X is
 * Binomial(n, p). A test asserts X ≥ `binomialLowerBound(n, p, alpha)`: a procedure whose true
 * coverage is at least p fails that with probability at most alpha.
 */

/** P(X ≤ k) for X ~ Binomial(n, p), summed from the probability mass function. */
export function binomialCdf(k: number, n: number, p: number): number {
  if (k < 0) return 0;
  if (k >= n) return 1;
  // pmf(0) = (1 − p)^n, pmf(i + 1) = pmf(i)·(n − i)/(i + 1)·p/(1 − p), in logs to avoid underflow
  let logPmf = n * Math.log1p(-p);
  let sum = 0;
  for (let i = 0; i <= k; i++) {
    sum += Math.exp(logPmf);
    logPmf += Math.log((n - i) / (i + 1)) + Math.log(p) - Math.log1p(-p);
  }
  return Math.min(1, sum);
}

/** The smallest count c with P(X < c) ≤ alpha, X ~ Binomial(n, p): a count below c rejects "coverage ≥ p" at level alpha. */
export function binomialLowerBound(n: number, p: number, alpha: number): number {
  let c = 0;
  while (c < n && binomialCdf(c, n, p) <= alpha) c++;
  return c; // P(X ≤ c − 1) ≤ alpha < P(X ≤ c)
}
