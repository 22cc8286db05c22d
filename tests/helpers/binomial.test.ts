/** The binomial tail used by the coverage tests, against exact values. */
import { describe, expect, it } from 'vitest';
import { binomialCdf, binomialLowerBound } from './binomial.js';

describe('binomial bounds', () => {
  it('the cumulative distribution matches exact fractions', () => {
    expect(binomialCdf(4, 10, 0.5)).toBeCloseTo(386 / 1024, 14); // (1 + 10 + 45 + 120 + 210)/2^10
    expect(binomialCdf(0, 50, 0.95) / 0.05 ** 50).toBeCloseTo(1, 12); // (1 − p)^n
    expect(binomialCdf(49, 50, 0.95)).toBeCloseTo(1 - 0.95 ** 50, 12); // 1 − p^n (a sum of 50 terms: rounding ~1e-13)
    expect(binomialCdf(-1, 5, 0.3)).toBe(0);
    expect(binomialCdf(5, 5, 0.3)).toBe(1);
  });
  it('the lower bound is the smallest count whose lower tail exceeds alpha', () => {
    for (const [n, p, a] of [[50, 0.95, 0.001], [50, 0.95, 0.00025], [200, 0.9, 0.01], [20, 0.5, 0.05]] as const) {
      const c = binomialLowerBound(n, p, a);
      expect(binomialCdf(c - 1, n, p)).toBeLessThanOrEqual(a);
      expect(binomialCdf(c, n, p)).toBeGreaterThan(a);
    }
    expect(binomialLowerBound(20, 0.5, 0.05)).toBe(6); // P(X ≤ 5) = 21700/2^20 = 0.0207, P(X ≤ 6) = 0.0577
  });
});
