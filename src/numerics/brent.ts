/**
 * Brent's bracketed root finder (Brent 1973, Algorithms for Minimization without Derivatives,
 * ch. 4): inverse quadratic interpolation and secant steps kept inside a sign-changing bracket,
 * with bisection whenever they stall, so the root cannot be lost.
 */
import { ComputationError } from '../core/errors.js';

export interface RootResult {
  x: number;
  fx: number;
  iterations: number;
}

/**
 * Root of f in [a, b] where f(a) and f(b) have opposite signs (or one is zero).
 * @throws ComputationError when the bracket is invalid, f is not finite, or it does not converge.
 */
export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  opts: { xTol?: number; maxIterations?: number; fa?: number; fb?: number; what?: string } = {},
): RootResult {
  const what = opts.what ?? 'root search';
  const xTol = opts.xTol ?? 1e-14;
  const maxIt = opts.maxIterations ?? 200;
  let fa = opts.fa ?? f(a);
  let fb = opts.fb ?? f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) throw new ComputationError(`${what}: the function is not finite at the bracket ends`);
  if (fa === 0) return { x: a, fx: 0, iterations: 0 };
  if (fb === 0) return { x: b, fx: 0, iterations: 0 };
  if (fa * fb > 0) throw new ComputationError(`${what}: no sign change between ${a} and ${b}`);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let it = 1; it <= maxIt; it++) {
    if (fb * fc > 0) {
      c = a; fc = fa; d = b - a; e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xTol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return { x: b, fx: fb, iterations: it };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m; e = m;
      }
    } else {
      d = m; e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) throw new ComputationError(`${what}: the function is not finite at ${b}`);
  }
  throw new ComputationError(`${what}: no convergence in ${maxIt} iterations`);
}

/**
 * Expand [a, b] geometrically from a starting guess until f changes sign.
 * `increasing` tells the direction in which f grows, so the search goes the right way.
 */
export function bracketMonotone(
  f: (x: number) => number,
  x0: number,
  step: number,
  increasing: boolean,
  limits: [number, number],
  what: string,
): { a: number; b: number; fa: number; fb: number } {
  let f0 = f(x0);
  if (!Number.isFinite(f0)) throw new ComputationError(`${what}: not finite at the start ${x0}`);
  if (f0 === 0) return { a: x0, b: x0, fa: 0, fb: 0 };
  // Move towards the root: if f0 < 0 and f increasing, go up.
  const dir = (f0 < 0) === increasing ? 1 : -1;
  let xPrev = x0;
  let fPrev = f0;
  let h = step;
  for (let k = 0; k < 200; k++) {
    let x = xPrev + dir * h;
    if (x > limits[1]) x = limits[1];
    if (x < limits[0]) x = limits[0];
    const fx = f(x);
    if (!Number.isFinite(fx)) throw new ComputationError(`${what}: not finite at ${x}`);
    if (fx === 0 || fx * fPrev < 0) {
      return dir > 0 ? { a: xPrev, b: x, fa: fPrev, fb: fx } : { a: x, b: xPrev, fa: fx, fb: fPrev };
    }
    if (x === limits[0] || x === limits[1]) break;
    xPrev = x;
    fPrev = fx;
    h *= 2;
  }
  f0 = fPrev;
  throw new ComputationError(`${what}: no sign change found within [${limits[0]}, ${limits[1]}]`);
}
