/**
 * Quantiles of Student's t distribution, for confidence intervals of fitted parameters.
 *
 * CDF through the regularised incomplete beta function,
 *   P(T ≤ t) = 1 − ½·I_{ν/(ν+t²)}(ν/2, ½)   for t ≥ 0
 * (Abramowitz & Stegun 1964, Handbook of Mathematical Functions, eq. 26.7.1 and 26.5.27), with
 * I evaluated by its continued fraction (A&S eq. 26.5.8, modified Lentz method) and inverted by
 * bisection. Accurate to about 1e-10; checked against A&S Table 26.10.
 */

function logGamma(x: number): number {
  // Lanczos approximation (g = 7, n = 9), Press et al., Numerical Recipes, 3rd ed. 2007, §6.1
  const c = [0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
    12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7];
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  x -= 1;
  let a = c[0]!;
  const t = x + 7.5;
  for (let i = 1; i < 9; i++) a += c[i]! / (x + i);
  return 0.5 * Math.log(2 * Math.PI) + (x + 0.5) * Math.log(t) - t + Math.log(a);
}

function betaContinuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  let c = 1, d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d; if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c; if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d; h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d; if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c; if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-15) break;
  }
  return h;
}

/** Regularised incomplete beta I_x(a, b), 0 ≤ x ≤ 1 (A&S 26.5.8). */
export function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const lnFront = logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log1p(-x);
  if (x < (a + 1) / (a + b + 2)) return (Math.exp(lnFront) * betaContinuedFraction(a, b, x)) / a;
  return 1 - (Math.exp(lnFront) * betaContinuedFraction(b, a, 1 - x)) / b;
}

/** P(T ≤ t) for Student's t with ν degrees of freedom. */
export function studentTCdf(t: number, dof: number): number {
  const tail = 0.5 * incompleteBeta(dof / (dof + t * t), dof / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/** The p-quantile of Student's t (0.5 < p < 1), ν ≥ 1 (non-integer allowed). */
export function studentTQuantile(p: number, dof: number): number {
  if (!(p > 0.5 && p < 1) || !(dof > 0)) throw new RangeError(`studentTQuantile needs 0.5 < p < 1 and dof > 0, got p=${p}, dof=${dof}`);
  let lo = 0, hi = 1;
  while (studentTCdf(hi, dof) < p) hi *= 2;
  for (let k = 0; k < 200 && hi - lo > 1e-12 * hi; k++) {
    const mid = 0.5 * (lo + hi);
    if (studentTCdf(mid, dof) < p) lo = mid; else hi = mid;
  }
  return 0.5 * (lo + hi);
}
