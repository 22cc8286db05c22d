/**
 * Variable-step, variable-order implicit integrator for stiff method-of-lines systems y' = f(t, y):
 * the numerical differentiation formulas NDF1–NDF5 in backward-difference form (Shampine &
 * Reichelt 1997, "The MATLAB ODE Suite", SIAM J. Sci. Comput. 18(1):1–22, §2.1–2.3; Klopfenstein
 * 1971, RCA Review 32:447 for the NDFs).
 *
 * With ∇ʲy the backward differences of the interpolating polynomial, γ_k = Σ_(j=1..k) 1/j and
 * κ_k the NDF constants (−0.1850, −1/9, −0.0823, −0.0415, 0; Shampine & Reichelt 1997, Table 1),
 * a step of size h and order k solves for d = y_(n+1) − y⁽⁰⁾_(n+1) (y⁽⁰⁾ the predictor Σ_(j=0..k) ∇ʲy_n):
 *   (1 − κ_k)·γ_k·d − h·f(t_(n+1), y⁽⁰⁾ + d) + Σ_(j=1..k) γ_j·∇ʲy_n = 0    (eq. 2.5 form),
 * by simplified Newton with the matrix (I − c·J), c = h/((1 − κ_k)γ_k). The Newton matrix is kept
 * across steps while h and k stay the same and Newton converges; it is refactorised when the step
 * changes and the Jacobian re-evaluated after a Newton failure. Local error estimate
 * (κ_k·γ_k + 1/(k + 1))·d (eq. 2.6); steps of equal size are kept k + 1 times before the step and
 * the order (k − 1, k, k + 1, estimates from ∇ᵏ and ∇ᵏ⁺² of eq. 2.7) are changed, at most by a
 * factor 10; a rejected step shrinks by at least 5. A step change re-interpolates the difference
 * array (the matrices R, U of Shampine & Reichelt 1997, §2.3). Output at requested times between
 * steps comes from the interpolating polynomial (order k, the method's own); the last requested
 * time is stepped onto exactly.
 *
 * Replay (`stepTimes` with `stepOrders` of an earlier run, stretched to end at the last output
 * time when they end elsewhere): the same steps and orders without error control, each corrector
 * solved to `replayTolerance` (default 1e-4) of the scaled norm, so that the results are smooth
 * functions of the model's parameters (for difference quotients); the Newton matrix is
 * refactorised where the step changes, or at every step with `replayFactorEveryStep` (a choice
 * that does not depend on the model, so the results stay smooth). A Newton failure then throws.
 *
 * The model owns its Jacobian through `StiffSystem.factor(t, y, c)` (a solver for (I − c·J)x = b).
 *
 * Units: whatever the model uses.
 * @throws ComputationError on step-size underflow, repeated Newton failure, non-finite values,
 *         too many steps, or an invalid replay, naming the time reached.
 */
import { ComputationError } from '../core/errors.js';
import type { IntegratorOptions, IntegratorStats, NewtonSolve, StiffSystem } from './implicitIntegrator.js';

export interface BdfOptions extends IntegratorOptions {
  /** Orders of the replayed steps (with `stepTimes`; one per step). */
  stepOrders?: readonly number[];
  /** Highest order (1–5, default 5). */
  maxOrder?: number;
  /**
   * A replay's corrector tolerance, relative to the scaled norm (default 1e-4). The corrector's
   * error relative to y stays below it times rtol, which is what a difference quotient over a
   * replay resolves.
   */
  replayTolerance?: number;
  /**
   * Refactorise the Newton matrix (with the Jacobian at the predictor) at every replayed step,
   * not only where the step changes: fewer corrector iterations, for systems whose factorisation
   * costs about what an iteration does (default false).
   */
  replayFactorEveryStep?: boolean;
}

export interface BdfResult {
  times: number[];
  states: Float64Array[];
  stats: IntegratorStats;
  /** End time of every accepted step (for a replay). */
  stepTimes: number[];
  /** Order of every accepted step (for a replay). */
  stepOrders: number[];
}

const MAX_ORDER = 5;
/** Shampine & Reichelt 1997, Table 1: κ of NDF1–NDF5 (index = order). */
const KAPPA = [0, -0.185, -1 / 9, -0.0823, -0.0415, 0];
const GAMMA_K = [0, 1, 1.5, 11 / 6, 25 / 12, 137 / 60]; // Σ_(j ≤ k) 1/j
const ALPHA_K = KAPPA.map((k, i) => (1 - k) * GAMMA_K[i]!);
const ERROR_CONST = KAPPA.map((k, i) => k * GAMMA_K[i]! + 1 / (i + 1));
const NEWTON_MAXITER = 4;

/** R(k, ρ) of Shampine & Reichelt 1997 §2.3: R_ij = Π_(m=1..i) (m − 1 − ρ·j)/m, (k+1)×(k+1), into R. */
function rMatrix(k: number, rho: number, R: Float64Array): Float64Array {
  const m = k + 1;
  for (let j = 0; j < m; j++) R[j] = 1;
  for (let i = 1; i < m; i++) for (let j = 0; j < m; j++) R[i * m + j] = j === 0 ? 0 : R[(i - 1) * m + j]! * (i - 1 - rho * j) / i;
  return R;
}

/** U = R(k, 1) for every order (constant). */
const U_BY_ORDER = Array.from({ length: MAX_ORDER + 1 }, (_, k) => rMatrix(k, 1, new Float64Array((k + 1) * (k + 1))));
const R_BUF = new Float64Array((MAX_ORDER + 1) * (MAX_ORDER + 1));
const RU_BUF = new Float64Array((MAX_ORDER + 1) * (MAX_ORDER + 1));

/** Re-interpolate the differences ∇⁰…∇ᵏ for a step ratio ρ: D ← (R·U)ᵀ·D. */
function changeDifferences(Dif: Float64Array[], k: number, rho: number, tmp: Float64Array[]): void {
  if (rho === 1) return;
  const m = k + 1;
  const R = rMatrix(k, rho, R_BUF);
  const U = U_BY_ORDER[k]!;
  const RU = RU_BUF;
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) {
    let s = 0;
    for (let l = 0; l < m; l++) s += R[i * m + l]! * U[l * m + j]!;
    RU[i * m + j] = s;
  }
  const n = Dif[0]!.length;
  for (let i = 0; i < m; i++) {
    const out = tmp[i]!;
    out.fill(0);
    for (let j = 0; j < m; j++) {
      const c = RU[j * m + i]!;
      if (c === 0) continue;
      const d = Dif[j]!;
      for (let e = 0; e < n; e++) out[e] = out[e]! + c * d[e]!;
    }
  }
  for (let i = 0; i < m; i++) Dif[i]!.set(tmp[i]!);
}

// The per-element loops live in small functions of their own, so that the engine optimises them
// whatever happens to the long driver function.

/** Predictor y⁽⁰⁾ = Σ_(j≤k) ∇ʲy and ψ = Σ_(1≤j≤k) γ_j·∇ʲy/α_k. */
function predict(Dif: Float64Array[], k: number, yPred: Float64Array, psi: Float64Array): void {
  const n = yPred.length;
  const inv = 1 / ALPHA_K[k]!;
  const d0 = Dif[0]!, d1 = Dif[1]!, d2 = Dif[2]!, d3 = Dif[3]!, d4 = Dif[4]!, d5 = Dif[5]!;
  const g1 = GAMMA_K[1]! * inv, g2 = GAMMA_K[2]! * inv, g3 = GAMMA_K[3]! * inv, g4 = GAMMA_K[4]! * inv, g5 = GAMMA_K[5]! * inv;
  // element by element, the sums in the order of j (as one pass per difference would take them)
  for (let i = 0; i < n; i++) {
    let y = d0[i]!, p = 0;
    let x = d1[i]!; y = y + x; p = p + g1 * x;
    if (k >= 2) { x = d2[i]!; y = y + x; p = p + g2 * x; }
    if (k >= 3) { x = d3[i]!; y = y + x; p = p + g3 * x; }
    if (k >= 4) { x = d4[i]!; y = y + x; p = p + g4 * x; }
    if (k >= 5) { x = d5[i]!; y = y + x; p = p + g5 * x; }
    yPred[i] = y; psi[i] = p;
  }
}

/** out = c·a. */
function scaleInto(out: Float64Array, a: Float64Array, c: number): void {
  const n = out.length;
  for (let i = 0; i < n; i++) out[i] = c * a[i]!;
}

/** After an accepted step of order k with correction d: ∇ᵏ⁺² = d − ∇ᵏ⁺¹, ∇ᵏ⁺¹ = d, then ∇ʲ += ∇ʲ⁺¹ for j = k…0. */
function updateDifferences(Dif: Float64Array[], k: number, d: Float64Array): void {
  const n = d.length;
  const Dk2 = Dif[k + 2]!, Dk1 = Dif[k + 1]!;
  const d0 = Dif[0]!, d1 = Dif[1]!, d2 = Dif[2]!, d3 = Dif[3]!, d4 = Dif[4]!, d5 = Dif[5]!;
  // element by element, ∇ʲ += ∇ʲ⁺¹ from j = k down (as one pass per difference would take them)
  for (let i = 0; i < n; i++) {
    const x = d[i]!;
    Dk2[i] = x - Dk1[i]!;
    Dk1[i] = x;
    let up = x;
    if (k >= 5) { up = d5[i]! + up; d5[i] = up; }
    if (k >= 4) { up = d4[i]! + up; d4[i] = up; }
    if (k >= 3) { up = d3[i]! + up; d3[i] = up; }
    if (k >= 2) { up = d2[i]! + up; d2[i] = up; }
    if (k >= 1) { up = d1[i]! + up; d1[i] = up; }
    d0[i] = d0[i]! + up;
  }
}

/** Weights 1/(atol + rtol·|y|) of the scaled RMS norm. */
function weightsInto(w: Float64Array, y: Float64Array, atol: Float64Array, rtol: number): void {
  const n = w.length;
  for (let i = 0; i < n; i++) w[i] = 1 / (atol[i]! + rtol * Math.abs(y[i]!));
}

/** Scaled RMS norm of v with weights w. */
function rmsNorm(v: Float64Array, w: Float64Array): number {
  const n = v.length;
  let s = 0;
  for (let i = 0; i < n; i++) { const x = v[i]! * w[i]!; s += x * x; }
  return Math.sqrt(s / Math.max(n, 1));
}

/** Newton residual c·f − ψ − d into out. */
function newtonResidual(out: Float64Array, f: Float64Array, psi: Float64Array, d: Float64Array, c: number): void {
  const n = out.length;
  for (let i = 0; i < n; i++) out[i] = c * f[i]! - psi[i]! - d[i]!;
}

/** y += dy and d += dy. */
function addCorrection(y: Float64Array, d: Float64Array, dy: Float64Array): void {
  const n = y.length;
  for (let i = 0; i < n; i++) { const x = dy[i]!; y[i] = y[i]! + x; d[i] = d[i]! + x; }
}

/** True when every value is finite. */
function allFinite(v: Float64Array): boolean {
  const n = v.length;
  for (let i = 0; i < n; i++) if (!Number.isFinite(v[i]!)) return false;
  return true;
}

/**
 * Integrate `system` from (t0, y0) and return the state at every time of `outputTimes`
 * (increasing, each ≥ t0; t0 itself returns y0).
 */
export function integrateBdf(system: StiffSystem, t0: number, y0: Float64Array, outputTimes: readonly number[], options: BdfOptions = {}): BdfResult {
  const n = system.size;
  const what = system.what ?? 'implicit integration';
  if (y0.length !== n) throw new ComputationError(`${what}: initial state has ${y0.length} values, expected ${n}`);
  const rtol = options.rtol ?? 1e-6;
  const atolOpt = options.atol ?? 1e-10;
  const atol = typeof atolOpt === 'number' ? new Float64Array(n).fill(atolOpt) : atolOpt;
  if (atol.length !== n) throw new ComputationError(`${what}: atol has ${atol.length} values, expected ${n}`);
  for (let k = 0; k < outputTimes.length; k++) {
    const tk = outputTimes[k]!;
    if (!Number.isFinite(tk) || tk < t0 || (k > 0 && !(tk > outputTimes[k - 1]!))) {
      throw new ComputationError(`${what}: output times must be finite, increasing and not before the start (got ${tk})`);
    }
  }
  const maxOrder = Math.min(MAX_ORDER, Math.max(1, Math.floor(options.maxOrder ?? MAX_ORDER)));
  const stats: IntegratorStats = { steps: 0, rejectedSteps: 0, newtonIterations: 0, newtonFailures: 0, factorizations: 0, rhsEvaluations: 0, maxAcceptedError: 0 };
  const times: number[] = [];
  const states: Float64Array[] = [];
  const stepTimes: number[] = [];
  const stepOrders: number[] = [];
  let outIdx = 0;
  while (outIdx < outputTimes.length && outputTimes[outIdx]! <= t0) {
    times.push(outputTimes[outIdx]!);
    states.push(Float64Array.from(y0));
    outIdx++;
  }
  if (outIdx >= outputTimes.length) return { times, states, stats, stepTimes, stepOrders };
  const tEnd = outputTimes[outputTimes.length - 1]!;
  const span = tEnd - t0;
  const maxStep = options.maxStep ?? span;
  const maxSteps = options.maxSteps ?? 100_000;
  const replayOrders = options.stepOrders;
  let replay = options.stepTimes;
  if (replay && (!replayOrders || replayOrders.length !== replay.length)) throw new ComputationError(`${what}: a replay needs one order per step time`);
  if (replay) {
    const last = replay[replay.length - 1];
    if (!(last !== undefined && last > t0)) throw new ComputationError(`${what}: a replay needs steps after the start`);
    // steps taken over another span are stretched to end at the last output time (a smooth
    // map, so that results stay smooth in a parameter that moves the end, e.g. t_c of logTime)
    if (last !== tEnd) {
      const f = (tEnd - t0) / (last - t0);
      replay = replay.map((x, k) => (k === replay!.length - 1 ? tEnd : t0 + (x - t0) * f));
    }
  }

  const Dif = Array.from({ length: MAX_ORDER + 3 }, () => new Float64Array(n));
  const tmp = Array.from({ length: MAX_ORDER + 1 }, () => new Float64Array(n));
  const yPred = new Float64Array(n);
  const yNew = new Float64Array(n);
  const psi = new Float64Array(n);
  const d = new Float64Array(n);
  const dy = new Float64Array(n);
  const f = new Float64Array(n);
  const w = new Float64Array(n);
  const err = new Float64Array(n);

  const rhs = (t: number, state: Float64Array, out: Float64Array): boolean => {
    stats.rhsEvaluations++;
    system.rhs(t, state, out);
    return allFinite(out);
  };
  const setWeights = (a: Float64Array) => weightsInto(w, a, atol, rtol);
  const norm = (v: Float64Array): number => rmsNorm(v, w);

  let t = t0;
  Dif[0]!.set(y0);
  if (!rhs(t, y0, f)) throw new ComputationError(`${what}: the derivative is not finite at the start (t = ${t})`);
  let h: number;
  if (replay) h = replay[0]! - t0;
  else {
    h = options.initialStep ?? 0;
    if (!(h > 0)) {
      setWeights(y0);
      const d0 = norm(y0), d1 = norm(f);
      h = d0 > 1e-5 && d1 > 1e-5 ? 0.01 * d0 / d1 : 1e-6 * span;
      h = Math.min(h, 1e-3 * span);
      if (!(h > 0)) h = 1e-6 * span;
    }
    h = Math.min(h, maxStep, span);
  }
  scaleInto(Dif[1]!, f, h);
  let order = 1;
  let equalSteps = 0;
  let errorFailures = 0;
  let solve: NewtonSolve | undefined;
  let solveC = 0;
  let jacFresh = false;
  // a replay solves each corrector to replayTolerance (1e-4) of the scaled norm (1e-10 relative
  // at the default rtol), far below what difference quotients resolve; otherwise Shampine &
  // Reichelt's test
  const newtonTol = replay ? options.replayTolerance ?? 1e-4 : Math.max((10 * Number.EPSILON) / rtol, Math.min(0.03, Math.sqrt(rtol)));
  const maxIter = replay ? 12 : NEWTON_MAXITER;

  /** Simplified Newton for d; returns the iterations used, or 0 on failure. The first
   *  iteration may end it when the contraction rate of the previous step, η = max(ρ_prev, ε)^0.8,
   *  says the remaining error is below the tolerance (Hairer & Wanner, Solving ODEs II, 2nd ed.
   *  1996, §IV.8, eq. 8.10–8.11 and the rate carried across steps). */
  const lastRate = Float64Array.of(0.5);
  const corrector = (tNew: number, c: number, s: NewtonSolve): number => {
    d.fill(0);
    yNew.set(yPred);
    let prev = 0;
    for (let it = 0; it < maxIter; it++) {
      if (!rhs(tNew, yNew, f)) return 0;
      newtonResidual(dy, f, psi, d, c);
      s(dy);
      stats.newtonIterations++;
      const dn = norm(dy);
      if (!Number.isFinite(dn)) return 0;
      const rate = it > 0 ? dn / prev : -1; // −1: not known yet
      if (rate >= 0 && (rate >= 1 || (!replay && (rate ** (maxIter - it)) / (1 - rate) * dn > newtonTol))) return 0;
      addCorrection(yNew, d, dy);
      if (rate >= 0) lastRate[0] = rate;
      const eta = rate >= 0 ? rate / (1 - rate) : Math.max(lastRate[0]!, 1e-3) ** 0.8;
      if (dn === 0 || eta * dn < newtonTol) return it + 1;
      prev = dn;
    }
    return 0;
  };

  const emitOutputs = (tPrev: number, tNew: number, hk: number, k: number) => {
    // the interpolating polynomial through the last k + 1 steps (Shampine & Reichelt 1997 §2.3)
    while (outIdx < outputTimes.length && outputTimes[outIdx]! <= tNew) {
      const to = outputTimes[outIdx]!;
      const out = new Float64Array(n);
      if (to === tNew) out.set(Dif[0]!);
      else {
        out.set(Dif[0]!);
        let p = 1;
        for (let j = 0; j < k; j++) {
          p *= (to - (tNew - hk * j)) / (hk * (j + 1));
          const dj = Dif[j + 1]!;
          for (let i = 0; i < n; i++) out[i] = out[i]! + p * dj[i]!;
        }
      }
      times.push(to);
      states.push(out);
      outIdx++;
    }
    void tPrev;
  };

  let replayIdx = 0;
  while (t < tEnd) {
    if (stats.steps + stats.rejectedSteps >= maxSteps) throw new ComputationError(`${what}: more than ${maxSteps} steps before t = ${tEnd} (reached t = ${t})`);
    if (replay) {
      const next = replay[replayIdx]!;
      const k = replayOrders![replayIdx]!;
      if (!(next > t) || !Number.isInteger(k) || k < 1 || k > Math.min(order + 1, MAX_ORDER)) throw new ComputationError(`${what}: invalid replayed step ${replayIdx + 1} (t = ${next}, order ${k})`);
      order = k;
      const hNew = next - t;
      if (hNew !== h) { changeDifferences(Dif, order, hNew / h, tmp); h = hNew; }
    } else {
      let hNew = Math.min(h, maxStep);
      if (t + hNew >= tEnd || t + 1.05 * hNew >= tEnd) hNew = tEnd - t;
      if (hNew !== h) { changeDifferences(Dif, order, hNew / h, tmp); h = hNew; equalSteps = 0; }
    }
    const hMin = 16 * Number.EPSILON * Math.max(Math.abs(t), 1e-3 * Math.abs(span), 1e-300);
    if (!(h > hMin)) throw new ComputationError(`${what}: step size underflow at t = ${t} (h = ${h})`);
    const tNew = replay ? replay[replayIdx]! : (t + h >= tEnd * (1 - 4 * Number.EPSILON) ? tEnd : t + h);
    predict(Dif, order, yPred, psi);
    setWeights(yPred);
    const c = h / ALPHA_K[order]!;
    let iters = 0;
    let refactor = !!replay && options.replayFactorEveryStep === true;
    for (;;) {
      // the Newton matrix of a nearby c is kept (within 30 %, as in variable-coefficient codes):
      // simplified Newton still converges, and the rate test catches it when it does not; a
      // replay, whose corrector is solved tightly, refactorises whenever the step changes
      if (!solve || refactor || Math.abs(c / solveC - 1) > (replay ? 1e-9 : 0.3)) {
        refactor = false;
        stats.factorizations++;
        try { solve = system.factor(tNew, yPred, c); } catch (e) {
          if (!(e instanceof ComputationError) || replay) throw e;
          solve = undefined;
          break;
        }
        solveC = c;
        jacFresh = true;
      }
      iters = corrector(tNew, c, solve);
      if (iters > 0 || jacFresh) break;
      solve = undefined; // stale Jacobian: re-evaluate and retry once
    }
    if (iters === 0) {
      if (replay) throw new ComputationError(`${what}: Newton failure in a replayed step at t = ${t} (h = ${h})`);
      stats.newtonFailures++;
      stats.rejectedSteps++;
      // a corrector that fails from a fresh Jacobian is started too far off: halve the step and
      // lower the order (a lower-order predictor extrapolates less), as the order decrease below
      if (order > 1) order--;
      changeDifferences(Dif, order, 0.5, tmp);
      h *= 0.5; equalSteps = 0; solve = undefined;
      continue;
    }
    jacFresh = false;
    setWeights(yNew);
    scaleInto(err, d, ERROR_CONST[order]!);
    const en = norm(err);
    const safety = (0.9 * (2 * NEWTON_MAXITER + 1)) / (2 * NEWTON_MAXITER + Math.min(iters, NEWTON_MAXITER));
    if (!replay && !(en <= 1)) {
      stats.rejectedSteps++;
      // repeated error-test failures: the higher differences are not to be trusted, lower the
      // order (CVODE's rule, Hindmarsh et al. 2005, ACM TOMS 31:363, §2.1)
      if (++errorFailures >= 2 && order > 1) order--;
      const factor = Number.isFinite(en) ? Math.max(0.2, safety * en ** (-1 / (order + 1))) : 0.2;
      changeDifferences(Dif, order, factor, tmp);
      h *= factor; equalSteps = 0;
      continue;
    }
    errorFailures = 0;
    // accepted: update the differences (∇ᵏ⁺¹y_(n+1) = d, ∇ᵏ⁺² = d − old ∇ᵏ⁺¹)
    stats.steps++;
    if (en > stats.maxAcceptedError) stats.maxAcceptedError = en;
    updateDifferences(Dif, order, d);
    const tPrev = t;
    t = tNew;
    stepTimes.push(t);
    stepOrders.push(order);
    emitOutputs(tPrev, t, h, order);
    if (replay) { replayIdx++; continue; }
    equalSteps++;
    if (equalSteps < order + 1) continue;
    // order and step for the next steps (Shampine & Reichelt 1997 §2.2)
    let em = Infinity, ep = Infinity;
    if (order > 1) { scaleInto(err, Dif[order]!, ERROR_CONST[order - 1]!); em = norm(err); }
    if (order < maxOrder) { scaleInto(err, Dif[order + 2]!, ERROR_CONST[order + 1]!); ep = norm(err); }
    const fm = em === 0 ? Infinity : em ** (-1 / order);
    const f0 = en === 0 ? Infinity : en ** (-1 / (order + 1));
    const fp = ep === 0 ? Infinity : ep ** (-1 / (order + 2));
    let best = f0, delta = 0;
    if (fm > best) { best = fm; delta = -1; }
    if (fp > best) { best = fp; delta = 1; }
    order += delta;
    const factor = Math.min(10, safety * best);
    changeDifferences(Dif, order, factor, tmp);
    h *= factor;
    equalSteps = 0;
  }
  return { times, states, stats, stepTimes, stepOrders };
}
