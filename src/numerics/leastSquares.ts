/**
 * Nonlinear least squares: minimise S(x) = Σ r_i(x)² over transformed parameters x.
 *
 * Strategy (ours, common practice): Nelder–Mead simplex (Nelder & Mead 1965, Computer Journal
 * 7(4):308–313; the `fmin` package, 30 iterations per parameter from each start) from several
 * starting points, then a Levenberg–Marquardt polish (Marquardt 1963, J. SIAM 11(2):431–441) of
 * the best two simplex results, with a central-difference Jacobian and a truncated step that
 * leaves out directions the data do not determine (eigenvalue of the scaled JᵀJ below 1e-9 of the
 * largest). The polish stops when S no longer decreases by more than a relative 1e-12, when the
 * step is below 1e-10 relative, when no damped step decreases S (a stationary point to working
 * precision), or when S is negligible against `residualScale` (an exact fit); 200 iterations
 * without any of these is reported as not converged.
 *
 * Residual functions may throw a ComputationError (e.g. an unconverged equilibrium at absurd
 * trial parameters) or return non-finite values: such points count as infeasible (S = ∞).
 * @throws ComputationError when no start gives a finite S, or the best S is not finite.
 */
import { nelderMead } from './fminNelderMead.js';
import { ComputationError } from '../core/errors.js';
import { normalEquations, symmetricEigen } from './linearSystem.js';

export interface LeastSquaresProblem {
  /** Residuals at transformed parameters x. */
  residuals(x: readonly number[]): ArrayLike<number>;
  /** Starting points (transformed). */
  starts: number[][];
  /** Box on the transformed parameters (points outside are infeasible). */
  lower?: number[];
  upper?: number[];
  /** Typical size of one residual; S below n·(1e-13·scale)² counts as an exact fit. */
  residualScale?: number;
  /** Simplex iterations per start (default 30 per parameter). */
  maxIterations?: number;
  /** What is being fitted, for messages. */
  what: string;
}

export interface LeastSquaresFit {
  x: number[];
  residuals: Float64Array;
  sse: number;
  converged: boolean;
  /** How the polish stopped. */
  stop: string;
  /** Residual-function evaluations in total. */
  evaluations: number;
  /** Levenberg–Marquardt iterations of the chosen result. */
  iterations: number;
  /** Number of starting points. */
  starts: number;
  /** Polished candidates that reached the best S within a relative 1e-6. */
  agreeing: number;
}

/** Forward-difference Jacobian (rows = residuals) of `f` at x. */
export function forwardJacobian(f: (x: readonly number[]) => ArrayLike<number> | undefined, x: readonly number[], r0: ArrayLike<number>, relStep = 1e-7, absStep = 1e-7): number[][] | undefined {
  const n = r0.length;
  const p = x.length;
  const J = Array.from({ length: n }, () => new Array<number>(p).fill(0));
  for (let j = 0; j < p; j++) {
    const h = Math.max(absStep, relStep * Math.abs(x[j]!));
    const xp = [...x];
    xp[j] = x[j]! + h;
    const dh = xp[j]! - x[j]!;
    let r = f(xp);
    let sign = 1;
    if (!r) {
      xp[j] = x[j]! - h;
      r = f(xp);
      sign = -1;
      if (!r) return undefined;
    }
    for (let i = 0; i < n; i++) J[i]![j] = (sign * (r[i]! - r0[i]!)) / Math.abs(dh);
  }
  return J;
}

/**
 * Central-difference Jacobian (rows = residuals) of `f` at x, step h_j = relStep·max(1, |x_j|);
 * falls back to a one-sided difference where one side is infeasible.
 */
export function centralJacobian(f: (x: readonly number[]) => ArrayLike<number> | undefined, x: readonly number[], r0: ArrayLike<number>, relStep = 1e-5): number[][] | undefined {
  const n = r0.length;
  const p = x.length;
  const J = Array.from({ length: n }, () => new Array<number>(p).fill(0));
  for (let j = 0; j < p; j++) {
    const h = relStep * Math.max(1, Math.abs(x[j]!));
    const xp = [...x], xm = [...x];
    xp[j] = x[j]! + h;
    xm[j] = x[j]! - h;
    const rp = f(xp), rm = f(xm);
    if (rp && rm) for (let i = 0; i < n; i++) J[i]![j] = (rp[i]! - rm[i]!) / (xp[j]! - xm[j]!);
    else if (rp) for (let i = 0; i < n; i++) J[i]![j] = (rp[i]! - r0[i]!) / (xp[j]! - x[j]!);
    else if (rm) for (let i = 0; i < n; i++) J[i]![j] = (r0[i]! - rm[i]!) / (x[j]! - xm[j]!);
    else return undefined;
  }
  return J;
}

/** Fit a least-squares problem reliably; see the file comment. */
export function fitLeastSquares(problem: LeastSquaresProblem): LeastSquaresFit {
  let evaluations = 0;
  const lower = problem.lower, upper = problem.upper;
  const inBox = (x: readonly number[]) => x.every((v, j) => (lower === undefined || v >= lower[j]!) && (upper === undefined || v <= upper[j]!));
  const safeResiduals = (x: readonly number[]): Float64Array | undefined => {
    evaluations++;
    if (!inBox(x)) return undefined;
    let r: ArrayLike<number>;
    try {
      r = problem.residuals(x);
    } catch (e) {
      if (e instanceof ComputationError) return undefined;
      throw e;
    }
    const out = Float64Array.from(r as ArrayLike<number>);
    for (let i = 0; i < out.length; i++) if (!Number.isFinite(out[i]!)) return undefined;
    return out;
  };
  const sseOf = (r: Float64Array | undefined) => {
    if (!r) return Infinity;
    let s = 0;
    for (let i = 0; i < r.length; i++) s += r[i]! * r[i]!;
    return s;
  };
  const dim = problem.starts[0]?.length ?? 0;
  const maxIt = problem.maxIterations ?? 30 * dim;
  const simplexResults: Array<{ x: number[]; fx: number }> = [];
  for (const s of problem.starts) {
    const f0 = sseOf(safeResiduals(s));
    if (!Number.isFinite(f0)) continue;
    simplexResults.push(restartedSimplex((x) => sseOf(safeResiduals(x)), s, f0, maxIt));
  }
  if (simplexResults.length === 0) throw new ComputationError(`${problem.what}: no starting point gave a finite fit; the data may not fit this model`);
  simplexResults.sort((a, b) => a.fx - b.fx);
  const candidates = [simplexResults[0]!];
  const second = simplexResults.find((c) => c.x.some((v, j) => Math.abs(v - candidates[0]!.x[j]!) > 1e-3 * (1 + Math.abs(v))));
  if (second) candidates.push(second);
  const n = safeResiduals(candidates[0]!.x)?.length ?? 0;
  const exactSse = n * (1e-12 * (problem.residualScale ?? 1)) ** 2;
  const polished = candidates.map((c) => levenbergMarquardt(c.x, safeResiduals, sseOf, exactSse));
  polished.sort((a, b) => a.sse - b.sse);
  const best = polished[0]!;
  if (!Number.isFinite(best.sse)) throw new ComputationError(`${problem.what}: the fit did not reach a finite sum of squares`);
  const agreeing = polished.filter((p) => p.sse <= best.sse * (1 + 1e-6) + exactSse).length + Math.max(0, simplexResults.slice(candidates.length).filter((s) => s.fx <= best.sse * (1 + 1e-4) + exactSse).length);
  return { ...best, evaluations, starts: problem.starts.length, agreeing };
}

/**
 * Nelder–Mead from `fmin` with restarts. fmin 0.0.4's shrink step assigns an undeclared loop
 * variable, which throws in strict (ESM) code; with sigma = 1 the simplex stops instead of
 * shrinking, and we restart it around the best point (a restart is itself a standard remedy for
 * simplex stagnation: Kelley 1999, SIAM J. Optim. 10(1):43–55).
 */
function restartedSimplex(f: (x: number[]) => number, x0: number[], f0: number, maxIt: number): { x: number[]; fx: number } {
  let best = { x: [...x0], fx: f0 };
  let budget = maxIt;
  let delta = 1.1;
  for (let round = 0; round < 6 && budget > 0; round++) {
    const before = best.fx;
    const history: unknown[] = [];
    const res = nelderMead(f, best.x, { maxIterations: budget, nonZeroDelta: delta, zeroDelta: 0.05 * (delta - 1) / 0.1, minErrorDelta: 1e-12, minTolerance: 1e-8, sigma: 1, history });
    budget -= Math.max(history.length, 5);
    if (Number.isFinite(res.fx) && res.fx < best.fx) best = { x: [...res.x], fx: res.fx };
    if (!(before - best.fx > 1e-10 * Math.abs(before))) break;
    delta = 1 + (delta - 1) * 0.5;
  }
  return best;
}

function levenbergMarquardt(
  x0: number[],
  res: (x: readonly number[]) => Float64Array | undefined,
  sseOf: (r: Float64Array | undefined) => number,
  exactSse: number,
): { x: number[]; residuals: Float64Array; sse: number; converged: boolean; stop: string; iterations: number } {
  let x = [...x0];
  let r = res(x)!;
  let sse = sseOf(r);
  let lambda = 1e-3;
  for (let it = 1; it <= 200; it++) {
    if (sse <= exactSse) return { x, residuals: r, sse, converged: true, stop: 'exact fit', iterations: it - 1 };
    const J = centralJacobian(res, x, r);
    if (!J) return { x, residuals: r, sse, converged: false, stop: 'Jacobian could not be evaluated', iterations: it };
    const { JtJ, Jtr } = normalEquations(J, r);
    // Marquardt scaling to a unit diagonal, then an eigen-decomposition: directions the data do
    // not determine (eigenvalue below 1e-9 of the largest, below finite-difference accuracy) are
    // left out of the step (truncated Gauss–Newton; Hansen 1998, Rank-Deficient and Discrete
    // Ill-Posed Problems, SIAM, ch. 3).
    const d = JtJ.map((row, a) => Math.sqrt(Math.max(row[a]!, 1e-300)));
    const S = JtJ.map((row, a) => row.map((v, b) => v / (d[a]! * d[b]!)));
    const g = Jtr.map((v, a) => v / d[a]!);
    const eig = symmetricEigen(S);
    const lmax = Math.max(...eig.values);
    const proj = eig.values.map((_, k) => eig.vectors.reduce((s2, row, a) => s2 + row[k]! * g[a]!, 0));
    let accepted = false;
    let tinyStep = false;
    while (lambda < 1e16) {
      const delta = x.map((_, a) => -eig.values.reduce((s2, lk, k) => (lk > 1e-9 * lmax ? s2 + (eig.vectors[a]![k]! * proj[k]!) / (lk + lambda) : s2), 0) / d[a]!);
      if (!delta.every(Number.isFinite)) { lambda *= 10; continue; }
      const xn = x.map((v, j) => v + delta[j]!);
      tinyStep = delta.every((d, j) => Math.abs(d) <= 1e-10 * (1 + Math.abs(x[j]!)));
      const rn = res(xn);
      const ssen = sseOf(rn);
      if (ssen < sse) {
        const rel = (sse - ssen) / sse;
        x = xn; r = rn!; sse = ssen;
        lambda = Math.max(lambda / 3, 1e-12);
        accepted = true;
        if (rel < 1e-12 || tinyStep) return { x, residuals: r, sse, converged: true, stop: rel < 1e-12 ? 'relative decrease below 1e-12' : 'step below 1e-10', iterations: it };
        break;
      }
      if (tinyStep) break;
      lambda *= 4;
    }
    if (!accepted) {
      // No descent along any damped Gauss–Newton step: a stationary point to working precision.
      return { x, residuals: r, sse, converged: true, stop: 'no further decrease (stationary point)', iterations: it };
    }
  }
  return { x, residuals: r, sse, converged: false, stop: 'iteration limit (200) reached', iterations: 200 };
}
