/**
 * Orthogonal collocation in a sphere in the symmetric variable x = (r/R)² (Villadsen & Stewart
 * 1967, Chem. Eng. Sci. 22:1483; Villadsen & Michelsen 1978, Solution of Differential Equation
 * Models by Polynomial Approximation, Prentice-Hall, ch. 3–4).
 *
 * A profile symmetric about the centre is a polynomial of degree N in x, fixed by its values at
 * N interior points and the surface x = 1. The interior points are the roots of the Jacobi
 * polynomial orthogonal on [0, 1] with the weight x^(1/2)·(1 − x) (the sphere's volume element
 * x^(1/2)dx times (1 − x): Radau points with the surface included), so the quadrature for the
 * volume mean q̄ = (3/2)∫₀¹ q(x)·x^(1/2) dx is exact for polynomials of degree 2N in x.
 *
 * With u = r/R:  ∂q/∂u = 2u·dq/dx,  ∇²q = (1/u²)∂/∂u(u²∂q/∂u) = 4x·q''(x) + 6·q'(x).
 * Matrices (all for R = 1; divide the Laplacian by R² and the gradient by R for a radius R):
 *   `laplacian`        B_ij = 4x_i·L''_j(x_i) + 6·L'_j(x_i)      ((N+1)×(N+1), row-major)
 *   `surfaceGradient`  g_j = 2·L'_j(1)                            (∂q/∂u at the surface)
 *   `weights`          w_j with Σw_j = 1 and q̄ = Σ w_j q_j
 * Discrete divergence identity (exact for every q in the polynomial space, Gauss' theorem):
 *   Σ_j w_j (Bq)_j = 3·(g·q).
 * Roots by the Golub–Welsch eigenvalue method on the Jacobi matrix of the three-term recurrence
 * (Golub & Welsch 1969, Math. Comp. 23:221), polished by Newton's method on the recurrence.
 *
 * @throws ComputationError for N outside 1…40 (the roots lose accuracy beyond that).
 */
import { ComputationError } from '../core/errors.js';
import { symmetricEigen } from '../numerics/linearSystem.js';

export interface SphereCollocation {
  /** Interior points N. */
  readonly interiorPoints: number;
  /** Collocation points x = (r/R)², interior ascending, the surface x = 1 last. */
  readonly x: Float64Array;
  /** Quadrature weights of the volume mean (Σ = 1). */
  readonly weights: Float64Array;
  /** First derivative d/dx, (N+1)×(N+1) row-major. */
  readonly dx: Float64Array;
  /** Laplacian for R = 1, (N+1)×(N+1) row-major. */
  readonly laplacian: Float64Array;
  /** ∂/∂u at the surface for R = 1, N+1 values. */
  readonly surfaceGradient: Float64Array;
}

/** Jacobi exponents for the sphere: weight (1 − t)^α (1 + t)^β on t = 2x − 1. */
const ALPHA = 1;
const BETA = 0.5;

/** P_n^(α,β)(t) and its derivative, by the three-term recurrence (Abramowitz & Stegun 22.7.1). */
function jacobiValue(n: number, t: number, al: number, be: number): { p: number; dp: number } {
  let p0 = 1;
  let p1 = (al + 1) + (al + be + 2) * (t - 1) / 2;
  if (n === 0) return { p: 1, dp: 0 };
  // derivative via d/dt P_n^(α,β) = (n + α + β + 1)/2 · P_(n−1)^(α+1,β+1) (A&S 22.8.1 form)
  for (let k = 2; k <= n; k++) {
    const s = 2 * k + al + be;
    const a1 = 2 * k * (k + al + be) * (s - 2);
    const a2 = (s - 1) * (al * al - be * be);
    const a3 = (s - 2) * (s - 1) * s;
    const a4 = 2 * (k + al - 1) * (k + be - 1) * s;
    const p2 = ((a2 + a3 * t) * p1 - a4 * p0) / a1;
    p0 = p1; p1 = p2;
  }
  const dp = n >= 1 ? ((n + al + be + 1) / 2) * (n === 1 ? 1 : jacobiValue(n - 1, t, al + 1, be + 1).p) : 0;
  return { p: p1, dp };
}

/** Roots of P_N^(α,β) on (−1, 1), ascending. */
function jacobiRoots(N: number, al: number, be: number): number[] {
  const diag: number[] = [];
  const off: number[] = [];
  for (let k = 0; k < N; k++) {
    const s = 2 * k + al + be;
    diag.push(k === 0 ? (be - al) / (al + be + 2) : (be * be - al * al) / (s * (s + 2)));
    if (k >= 1) {
      off.push(Math.sqrt((4 * k * (k + al) * (k + be) * (k + al + be)) / (s * s * (s + 1) * (s - 1))));
    }
  }
  const M = Array.from({ length: N }, (_, i) => Array.from({ length: N }, (_, j) => (i === j ? diag[i]! : Math.abs(i - j) === 1 ? off[Math.min(i, j)]! : 0)));
  const roots = symmetricEigen(M).values.sort((a, b) => a - b);
  return roots.map((r0) => {
    let r = r0;
    for (let it = 0; it < 8; it++) {
      const { p, dp } = jacobiValue(N, r, al, be);
      const step = p / dp;
      if (!Number.isFinite(step)) break;
      r -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    return r;
  });
}

const cache = new Map<number, SphereCollocation>();

/** Collocation in a sphere with N interior points (cached; the arrays must not be modified). */
export function sphereCollocation(N: number): SphereCollocation {
  if (!Number.isInteger(N) || N < 1 || N > 40) throw new ComputationError(`sphere collocation: interior points must be an integer from 1 to 40, got ${N}`);
  const hit = cache.get(N);
  if (hit) return hit;
  const m = N + 1;
  const x = new Float64Array(m);
  jacobiRoots(N, ALPHA, BETA).forEach((t, i) => { x[i] = (t + 1) / 2; });
  x[N] = 1;
  for (let i = 0; i < m; i++) {
    if (!(x[i]! > 0 && x[i]! <= 1) || (i > 0 && !(x[i]! > x[i - 1]!))) throw new ComputationError(`sphere collocation: root finding failed for N = ${N}`);
  }
  // barycentric weights and the first-derivative matrix of the Lagrange basis
  const bw = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    let p = 1;
    for (let k = 0; k < m; k++) if (k !== j) p *= x[j]! - x[k]!;
    bw[j] = 1 / p;
  }
  const dx = new Float64Array(m * m);
  for (let i = 0; i < m; i++) {
    let diag = 0;
    for (let j = 0; j < m; j++) {
      if (i === j) continue;
      const v = (bw[j]! / bw[i]!) / (x[i]! - x[j]!);
      dx[i * m + j] = v;
      diag -= v;
    }
    dx[i * m + i] = diag;
  }
  const d2 = new Float64Array(m * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) {
    let s = 0;
    for (let k = 0; k < m; k++) s += dx[i * m + k]! * dx[k * m + j]!;
    d2[i * m + j] = s;
  }
  const laplacian = new Float64Array(m * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) laplacian[i * m + j] = 4 * x[i]! * d2[i * m + j]! + 6 * dx[i * m + j]!;
  const surfaceGradient = new Float64Array(m);
  for (let j = 0; j < m; j++) surfaceGradient[j] = 2 * dx[N * m + j]!;
  // weights w_j = 3∫₀¹ L_j(u²)·u² du, an integrand of degree 2N + 2 in u: Gauss–Legendre with
  // N + 2 points is exact (weights 2/((1 − t²)·P'(t)²), Abramowitz & Stegun 25.4.29)
  const weights = new Float64Array(m);
  const G = N + 2;
  for (const t of jacobiRoots(G, 0, 0)) {
    const { dp } = jacobiValue(G, t, 0, 0);
    const gw = 2 / ((1 - t * t) * dp * dp) / 2; // mapped to u ∈ [0, 1]
    const u = (t + 1) / 2;
    const xu = u * u;
    // barycentric Lagrange values at xu
    let denom = 0;
    const terms = new Float64Array(m);
    for (let j = 0; j < m; j++) { terms[j] = bw[j]! / (xu - x[j]!); denom += terms[j]!; }
    for (let j = 0; j < m; j++) weights[j] = weights[j]! + 3 * gw * u * u * (terms[j]! / denom);
  }
  const result: SphereCollocation = { interiorPoints: N, x, weights, dx, laplacian, surfaceGradient };
  cache.set(N, result);
  return result;
}
