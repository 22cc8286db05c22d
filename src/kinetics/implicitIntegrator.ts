/**
 * Implicit integrator for stiff method-of-lines systems y' = f(t, y): TR-BDF2.
 *
 * One step of size h (Bank et al. 1985, IEEE Trans. Electron Devices 32:1992; Hosea & Shampine
 * 1996, Appl. Numer. Math. 20:21), with γ = 2 − √2 and d = γ/2:
 *   stage 1 (trapezoidal rule to t + γh):  y_γ − d·h·f(y_γ) = y_n + d·h·f(y_n)
 *   stage 2 (BDF2 over t, t + γh, t + h):  y_1 − d·h·f(y_1) = a·y_γ − b·y_n,
 *       a = 1/(γ(2 − γ)), b = (1 − γ)²/(γ(2 − γ)); (1 − γ)/(2 − γ) = d for this γ,
 * so both stages share one Newton matrix (I − d·h·J). The method is L-stable and second order.
 * Local error estimate (Bank et al. 1985): e = 2·k·h·(f_n/γ − f_γ/(γ(1 − γ)) + f_1/(1 − γ)),
 * k = (−3γ² + 4γ − 2)/(12(2 − γ)), i.e. k·h³·y''' with y''' from the second divided difference
 * of f; it is filtered through the Newton matrix, e ← (I − d·h·J)⁻¹e, so that stiff components
 * do not force tiny steps (Hosea & Shampine 1996, §3; the same filtering as Shampine's).
 * Simplified Newton with the Jacobian at the start of the step and a rate-based convergence test
 * (Hairer & Wanner, Solving ODEs II, 2nd ed. 1996, §IV.8, eq. 8.10–8.11); step control with the
 * scaled RMS norm, safety 0.9 and the exponent 1/3.
 *
 * The model owns its Jacobian: `factor(t, y, gammaH)` returns a solver for (I − gammaH·J)·x = b,
 * so a dense particle and a block-triangular bed each factorise their own structure.
 * Output is produced by stepping exactly onto each requested time.
 *
 * Units: whatever the model uses (t and y are passed through unchanged).
 * @throws ComputationError on step-size underflow, repeated Newton failure, non-finite values,
 *         or too many steps, naming the time reached.
 */
import { ComputationError } from '../core/errors.js';

/**
 * Solve (I − gammaH·J)·x = b in place: on return `b` holds x. `filter` is true for the error
 * estimate's filtering (any nonsingular approximation of the matrix will do there: a model that
 * refreshes its matrix between Newton iterations need not refresh it for that solve).
 */
export type NewtonSolve = (b: Float64Array, filter?: boolean) => void;

export interface StiffSystem {
  /** Number of state variables. */
  readonly size: number;
  /** dy/dt at (t, y), written into `dydt`. */
  rhs(t: number, y: Float64Array, dydt: Float64Array): void;
  /** Factorise (I − gammaH·J(t, y)) and return its solver. May throw ComputationError. */
  factor(t: number, y: Float64Array, gammaH: number): NewtonSolve;
  /** What is being integrated, for messages. */
  readonly what?: string;
}

export interface IntegratorOptions {
  /** Relative tolerance (default 1e-6). */
  rtol?: number;
  /** Absolute tolerance, one number or one per state (default 1e-10). */
  atol?: number | Float64Array;
  /** First step size (default from the size of f at the start). */
  initialStep?: number;
  /** Largest step size (default the whole span). */
  maxStep?: number;
  /** Most accepted + rejected steps (default 100 000). */
  maxSteps?: number;
  /**
   * Replay: step exactly onto these times (increasing, ending at the last output time) without
   * error control, e.g. the `stepTimes` of an earlier run. Gives results that are smooth in the
   * model's parameters, for difference quotients. A Newton failure then throws.
   */
  stepTimes?: readonly number[];
  /**
   * Called at the start and after every accepted step with the time, the state and its derivative
   * (views into the integrator's buffers: copy what you keep), e.g. to store a dense history.
   */
  onStep?: (t: number, y: Float64Array, dydt: Float64Array) => void;
}

export interface IntegratorStats {
  steps: number;
  rejectedSteps: number;
  newtonIterations: number;
  newtonFailures: number;
  factorizations: number;
  rhsEvaluations: number;
  /** Largest scaled error estimate of an accepted step (≤ 1). */
  maxAcceptedError: number;
}

export interface IntegrationResult {
  /** The requested output times, in order. */
  times: number[];
  /** The state at each output time (a copy). */
  states: Float64Array[];
  stats: IntegratorStats;
  /** End time of every accepted step (for a replay). */
  stepTimes: number[];
}

const GAMMA = 2 - Math.SQRT2;
const D = GAMMA / 2;
const A2 = 1 / (GAMMA * (2 - GAMMA));
const B2 = ((1 - GAMMA) * (1 - GAMMA)) / (GAMMA * (2 - GAMMA));
/** Bank et al. 1985: LTE coefficient of TR-BDF2, (−3γ² + 4γ − 2)/(12(2 − γ)). */
export const TRBDF2_ERROR_CONSTANT = (-3 * GAMMA * GAMMA + 4 * GAMMA - 2) / (12 * (2 - GAMMA));
const E0 = 2 * TRBDF2_ERROR_CONSTANT / GAMMA;
const EG = -2 * TRBDF2_ERROR_CONSTANT / (GAMMA * (1 - GAMMA));
const E1 = 2 * TRBDF2_ERROR_CONSTANT / (1 - GAMMA);
const MAX_NEWTON = 7;

/**
 * Integrate `system` from (t0, y0) and return the state at every time of `outputTimes`
 * (increasing, each > t0; t0 itself may be listed first and returns y0).
 */
export function integrateImplicit(
  system: StiffSystem,
  t0: number,
  y0: Float64Array,
  outputTimes: readonly number[],
  options: IntegratorOptions = {},
): IntegrationResult {
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
  const stats: IntegratorStats = { steps: 0, rejectedSteps: 0, newtonIterations: 0, newtonFailures: 0, factorizations: 0, rhsEvaluations: 0, maxAcceptedError: 0 };
  const tEnd = outputTimes.length ? outputTimes[outputTimes.length - 1]! : t0;
  const span = tEnd - t0;
  const maxStep = options.maxStep ?? span;
  const maxSteps = options.maxSteps ?? 100_000;

  const y = Float64Array.from(y0);
  const f0 = new Float64Array(n);
  const fg = new Float64Array(n);
  const f1 = new Float64Array(n);
  const yg = new Float64Array(n);
  const y1 = new Float64Array(n);
  const rhsVec = new Float64Array(n);
  const delta = new Float64Array(n);
  const err = new Float64Array(n);
  const w = new Float64Array(n);

  const rhs = (t: number, state: Float64Array, out: Float64Array): boolean => evalRhs(system, stats, t, state, out);
  const setWeights = (a: Float64Array, b: Float64Array) => errorWeights(w, atol, rtol, a, b);
  const norm = (v: Float64Array): number => scaledRms(v, w);

  const times: number[] = [];
  const states: Float64Array[] = [];
  const stepTimes: number[] = [];
  const replay = options.stepTimes;
  let replayIdx = 0;
  let t = t0;
  let outIdx = 0;
  while (outIdx < outputTimes.length && outputTimes[outIdx]! <= t0) {
    times.push(outputTimes[outIdx]!);
    states.push(Float64Array.from(y));
    outIdx++;
  }
  if (outIdx >= outputTimes.length) return { times, states, stats, stepTimes };

  if (!rhs(t, y, f0)) throw new ComputationError(`${what}: the derivative is not finite at the start (t = ${t})`);
  const onStep = options.onStep;
  onStep?.(t, y, f0);
  let h = options.initialStep ?? 0;
  if (!(h > 0)) {
    setWeights(y, y);
    const d0 = norm(y), d1 = norm(f0);
    h = d0 > 1e-5 && d1 > 1e-5 ? 0.01 * d0 / d1 : 1e-6 * span;
    h = Math.min(h, 1e-3 * span);
    if (!(h > 0)) h = 1e-6 * span;
  }
  h = Math.min(h, maxStep);

  const newton = (ts: number, z: Float64Array, fz: Float64Array, solve: NewtonSolve, dh: number): boolean => simplifiedNewton(system, stats, ts, z, fz, solve, dh, rhsVec, delta, w, replay !== undefined);

  const hMinFloor = 16 * Number.EPSILON;
  while (outIdx < outputTimes.length) {
    if (stats.steps + stats.rejectedSteps >= maxSteps) {
      throw new ComputationError(`${what}: more than ${maxSteps} steps before t = ${outputTimes[outIdx]} (reached t = ${t})`);
    }
    const target = outputTimes[outIdx]!;
    let hStep = Math.min(h, maxStep);
    let hitsOutput = false;
    if (replay) {
      while (replayIdx < replay.length && !(replay[replayIdx]! > t)) replayIdx++;
      hStep = Math.min(replay[replayIdx] ?? target, target) - t;
      hitsOutput = t + hStep >= target;
    } else if (t + hStep >= target || t + 1.05 * hStep >= target) { hStep = target - t; hitsOutput = true; }
    const hMin = hMinFloor * Math.max(Math.abs(t), 1e-3 * Math.abs(span), 1e-300);
    if (!(hStep > hMin)) throw new ComputationError(`${what}: step size underflow at t = ${t} (h = ${hStep})`);

    const dh = D * hStep;
    stats.factorizations++;
    let solve: NewtonSolve;
    try {
      solve = system.factor(t, y, dh);
    } catch (e) {
      if (e instanceof ComputationError && !replay) { h = hStep / 4; stats.rejectedSteps++; continue; }
      throw e;
    }
    setWeights(y, y);
    // stage 1: trapezoidal rule to t + γh
    for (let i = 0; i < n; i++) { rhsVec[i] = y[i]! + dh * f0[i]!; yg[i] = y[i]! + GAMMA * hStep * f0[i]!; }
    let ok = newton(t + GAMMA * hStep, yg, fg, solve, dh);
    if (ok) {
      // stage 2: BDF2 to t + h
      for (let i = 0; i < n; i++) {
        rhsVec[i] = A2 * yg[i]! - B2 * y[i]!;
        y1[i] = y[i]! + (yg[i]! - y[i]!) / GAMMA;
      }
      ok = newton(t + hStep, y1, f1, solve, dh);
    }
    if (!ok && replay) throw new ComputationError(`${what}: Newton failure in a replayed step at t = ${t} (h = ${hStep})`);
    if (!ok) {
      stats.newtonFailures++;
      stats.rejectedSteps++;
      h = hStep / 4;
      continue;
    }
    for (let i = 0; i < n; i++) err[i] = hStep * (E0 * f0[i]! + EG * fg[i]! + E1 * f1[i]!);
    solve(err, true);
    setWeights(y, y1);
    const en = norm(err);
    if (!Number.isFinite(en)) {
      if (replay) throw new ComputationError(`${what}: non-finite error estimate in a replayed step at t = ${t}`);
      stats.rejectedSteps++;
      h = hStep / 4;
      continue;
    }
    const factor = en === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * Math.pow(en, -1 / 3)));
    if (en > 1 && !replay) {
      stats.rejectedSteps++;
      h = hStep * Math.min(0.9, factor);
      continue;
    }
    stats.steps++;
    stepTimes.push(hitsOutput ? target : t + hStep);
    if (en > stats.maxAcceptedError) stats.maxAcceptedError = en;
    t = hitsOutput ? target : t + hStep;
    y.set(y1);
    f0.set(f1);
    onStep?.(t, y, f0);
    // keep the step the controller wants; a step shortened to hit an output does not shrink it
    h = hitsOutput ? Math.max(h, hStep) * (en === 0 ? 1 : Math.min(1, factor)) : hStep * factor;
    if (hitsOutput) {
      times.push(target);
      states.push(Float64Array.from(y));
      outIdx++;
    }
  }
  return { times, states, stats, stepTimes };
}

/** f(t, state) into `out`, counted; false when a value is not finite. */
function evalRhs(system: StiffSystem, stats: IntegratorStats, t: number, state: Float64Array, out: Float64Array): boolean {
  stats.rhsEvaluations++;
  system.rhs(t, state, out);
  const n = out.length;
  for (let i = 0; i < n; i++) if (!Number.isFinite(out[i]!)) return false;
  return true;
}

/** The error weights w_i = 1/(atol_i + rtol·max(|a_i|, |b_i|)). */
function errorWeights(w: Float64Array, atol: Float64Array, rtol: number, a: Float64Array, b: Float64Array): void {
  const n = w.length;
  for (let i = 0; i < n; i++) w[i] = 1 / (atol[i]! + rtol * Math.max(Math.abs(a[i]!), Math.abs(b[i]!)));
}

/** The scaled RMS norm √(Σ(v_i·w_i)²/n). */
function scaledRms(v: Float64Array, w: Float64Array): number {
  const n = v.length;
  let s = 0;
  for (let i = 0; i < n; i++) { const x = v[i]! * w[i]!; s += x * x; }
  return Math.sqrt(s / Math.max(n, 1));
}

/**
 * Simplified Newton for z − dh·f(ts, z) = rhsVec, starting at z, with the solver of the step's
 * Newton matrix; on success fz = f(ts, z). Returns false on failure (a non-finite value, a rate
 * ≥ 0.9, or no convergence in MAX_NEWTON iterations). A replay solves each stage to 1e-4 of the
 * tolerance, so that its result is smooth in the model's parameters; otherwise the usual rate
 * test (Hairer & Wanner eq. 8.10).
 */
function simplifiedNewton(system: StiffSystem, stats: IntegratorStats, ts: number, z: Float64Array, fz: Float64Array, solve: NewtonSolve, dh: number, rhsVec: Float64Array, delta: Float64Array, w: Float64Array, replay: boolean): boolean {
  const n = z.length;
  let prevNorm = 0;
  const maxIt = replay ? 4 * MAX_NEWTON : MAX_NEWTON;
  const done = replay ? 1e-4 : 0.03;
  for (let it = 0; it < maxIt; it++) {
    if (!evalRhs(system, stats, ts, z, fz)) return false;
    for (let i = 0; i < n; i++) delta[i] = rhsVec[i]! - z[i]! + dh * fz[i]!;
    solve(delta);
    stats.newtonIterations++;
    // z += delta, with the scaled RMS norm of delta in the same pass (as scaledRms)
    let sq = 0;
    for (let i = 0; i < n; i++) { const di = delta[i]!; z[i] = z[i]! + di; const x = di * w[i]!; sq += x * x; }
    const dn = Math.sqrt(sq / Math.max(n, 1));
    if (!Number.isFinite(dn)) return false;
    if (dn <= Math.min(1e-10, done)) { return evalRhs(system, stats, ts, z, fz); }
    if (it > 0) {
      const rate = dn / prevNorm;
      if (rate >= (replay ? 0.99 : 0.9)) return false;
      if ((rate / (1 - rate)) * dn <= done) return evalRhs(system, stats, ts, z, fz);
    } else if (dn <= 1e-3 * done / 0.03) {
      return evalRhs(system, stats, ts, z, fz);
    }
    prevNorm = dn;
  }
  return false;
}
