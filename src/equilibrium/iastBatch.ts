/**
 * Batch IAST equilibrium for Freundlich components (closed vessel, carbon dose D).
 *
 * Ideal adsorbed solution theory (Radke & Prausnitz 1972, AIChE J. 18(4):761–768) with the
 * Freundlich reduced spreading pressure ψ = K·c°^(1/n)/(1/n) = n·q°, so the single-solute
 * reference concentration is c°_i(ψ) = (ψ·β_i/K_i)^(n_i) (β = 1/n). Conditions:
 *   c_i = z_i·c°_i(ψ),  q_i = z_i·q_T,  Σ z_i = 1,  1/q_T = Σ z_i/q°_i,  c0_i = c_i + D·q_i,
 * which is the batch form of Crittenden et al. 1985 (Environ. Sci. Technol. 19(11):1037–1043),
 * with ψ = Σ n_j q_j.
 *
 * Formulation used here (ours, exact rearrangement): with x = D·q_T (mg/L adsorbed) the mass
 * balance gives z_i = c0_i/(c°_i + x), hence c_i = c0_i·σ(t_i) and D·q_i = c0_i·σ(−t_i) with
 * t_i = ln(c°_i/x) = n_i·ln ψ + a_i − ln x and σ the logistic function. Mass balance therefore
 * holds to rounding by construction. Two unknowns remain, u = ln ψ and θ = logit(x/C) with
 * C = Σ c0_i; x = C·σ(θ) and the liquid total S = C·σ(−θ) both keep full relative precision:
 *   F1: ln Σ c0_i σ(−t_i) − ln x = 0   (θ < 0)   or   ln Σ c0_i σ(t_i) − ln S = 0   (θ ≥ 0)
 *   F2: ln Σ n_i c0_i σ(−t_i) − ln D − u = 0
 * Newton's method on (u, θ) with an analytic Jacobian and backtracking; if it fails, a bracketed
 * nested solve (F1 monotone in u for fixed θ; F2 changes sign in θ from −∞ to +∞) cannot lose
 * the root.
 *
 * Units: c0 mg/L, K (mg/g)/(mg/L)^(1/n), D g/L, q mg/g. Non-adsorbable components (K = 0) stay
 * in solution. Throws ComputationError if no converged root is found.
 */
import { ComputationError, InputError } from '../core/errors.js';
import { brentRoot, bracketMonotone } from '../numerics/brent.js';
import { softplus } from '../core/logistic.js';
import type { PreparedMixture } from './preparedMixture.js';
import { directIastPrepared } from './iastDirect.js';

/** The solver's state: u = ln ψ and θ = logit(x/C) (see the file comment). */
export interface IastState {
  u: number;
  theta: number;
}

export interface BatchSolution {
  /** Carbon dose, g/L. */
  doseGPerL: number;
  /** Equilibrium liquid concentrations, mg/L, in the mixture's component order. */
  cMgPerL: Float64Array;
  /** Equilibrium loadings, mg/g. */
  qMgPerG: Float64Array;
  /** Reduced spreading pressure ψ, mg/g (NaN when nothing adsorbable). */
  psiMgPerG: number;
  /** Internal state, for warm starts of nearby solves. */
  state: { u: number; theta: number };
  iterations: number;
  method: 'newton' | 'bracketed' | 'trivial';
}

const F_TOL = 2e-14;

interface Eval {
  f1: number; f2: number; j11: number; j12: number; j21: number; j22: number;
}

/** Where `scratch` was last evaluated (a repeated evaluation at the same point is skipped). */
const last = { pm: undefined as PreparedMixture | undefined, lnD: NaN, u: NaN, theta: NaN };

/** `evaluate` into `scratch`, unless scratch already holds that point. */
function evaluateScratch(pm: PreparedMixture, lnD: number, u: number, theta: number): void {
  if (last.pm === pm && last.lnD === lnD && last.u === u && last.theta === theta) return;
  evaluate(pm, lnD, u, theta, scratch);
}

/** Residuals and Jacobian at (u, θ); non-finite values signal a bad iterate. */
function evaluate(pm: PreparedMixture, lnD: number, u: number, theta: number, out: Eval): void {
  if (out === scratch) { last.pm = pm; last.lnD = lnD; last.u = u; last.theta = theta; } else last.pm = undefined;
  const { c0, n, a } = pm;
  const m = c0.length;
  // σ(−θ) and softplus(−θ) from one exponential (the same values as the two-branch forms)
  const eTheta = Math.exp(-Math.abs(theta));
  const p = theta >= 0 ? eTheta / (1 + eTheta) : 1 / (1 + eTheta); // σ(−θ)
  const sTheta = 1 - p;
  const lnx = pm.lnCTotal - (theta >= 0 ? Math.log1p(eTheta) : -theta + Math.log1p(eTheta)); // ln C − softplus(−θ)
  let A = 0, B = 0, N = 0, W = 0, Wn = 0, Wnn = 0;
  for (let i = 0; i < m; i++) {
    const ni = n[i]!;
    const t = ni * u + a[i]! - lnx;
    const e = Math.exp(-Math.abs(t));
    const inv = 1 / (1 + e);
    let sp: number, sm: number;
    if (t >= 0) { sp = inv; sm = e * inv; } else { sp = e * inv; sm = inv; }
    const ci = c0[i]!;
    const adsorbed = ci * sm;
    A += adsorbed;
    B += ci * sp;
    N += ni * adsorbed;
    const w = adsorbed * sp;
    W += w;
    Wn += w * ni;
    Wnn += w * ni * ni;
  }
  if (theta < 0) {
    out.f1 = Math.log(A) - lnx;
    out.j11 = -Wn / A;
    out.j12 = p * (W / A - 1);
  } else {
    const lnS = pm.lnCTotal - softplus(theta);
    out.f1 = Math.log(B) - lnS;
    out.j11 = Wn / B;
    out.j12 = -p * (W / B) + sTheta;
  }
  out.f2 = Math.log(N) - lnD - u;
  out.j21 = -Wnn / N - 1;
  out.j22 = p * (Wn / N);
}

/** Starting point from one lumped Freundlich solute (c0-weighted exponent and ln K). */
function lumpedStart(pm: PreparedMixture, doseGPerL: number): { u: number; theta: number } {
  const { c0, beta, lnK } = pm;
  let b = 0, lk = 0;
  for (let i = 0; i < c0.length; i++) { b += c0[i]! * beta[i]!; lk += c0[i]! * lnK[i]!; }
  b /= pm.cTotal; lk /= pm.cTotal;
  // f + α f^b = 1 with α = D·K·C^(b−1); solve h(g) = ln(e^g + α e^(b g)) = 0 for g = ln f.
  const lnAlpha = Math.log(doseGPerL) + lk + (b - 1) * pm.lnCTotal;
  let g = Math.min(0, -lnAlpha / Math.max(b, 1e-3) * 0.5);
  if (!Number.isFinite(g)) g = 0;
  for (let k = 0; k < 60; k++) {
    const l1 = g, l2 = lnAlpha + b * g;
    const mx = Math.max(l1, l2);
    const e1 = Math.exp(l1 - mx), e2 = Math.exp(l2 - mx);
    const h = mx + Math.log(e1 + e2);
    const dh = (e1 + b * e2) / (e1 + e2);
    const step = h / dh;
    g -= step;
    if (Math.abs(step) < 1e-10) break;
  }
  if (g > -1e-300) g = Math.min(g, -1e-12);
  const theta = Math.log(-Math.expm1(g)) - g; // logit(1 − f)
  const u = lk - Math.log(b) + b * (g + pm.lnCTotal); // ψ = K c^b / b
  return { u, theta: Number.isFinite(theta) ? theta : 0 };
}

const scratch: Eval = { f1: 0, f2: 0, j11: 0, j12: 0, j21: 0, j22: 0 };

/** Where `newton` leaves a converged root (one object for every solve: nothing allocated per call). */
const newtonRoot = { u: 0, theta: 0, iterations: 0 };

/** Newton's method from (u0, θ0); true with the root in `newtonRoot`, false when it fails. */
function newton(pm: PreparedMixture, lnD: number, u0: number, th0: number): boolean {
  let u = u0, th = th0;
  const ev = scratch;
  evaluate(pm, lnD, u, th, ev);
  if (!Number.isFinite(ev.f1) || !Number.isFinite(ev.f2)) return false;
  let merit = ev.f1 * ev.f1 + ev.f2 * ev.f2;
  for (let it = 1; it <= 80; it++) {
    const det = ev.j11 * ev.j22 - ev.j12 * ev.j21;
    if (!Number.isFinite(det) || det === 0) return false;
    let du = (-ev.f1 * ev.j22 + ev.f2 * ev.j12) / det;
    let dth = (-ev.f2 * ev.j11 + ev.f1 * ev.j21) / det;
    const big = Math.max(Math.abs(du) / 4, Math.abs(dth) / 8);
    if (big > 1) { du /= big; dth /= big; }
    let lambda = 1;
    let accepted = false;
    for (let k = 0; k < 40; k++) {
      const un = u + lambda * du, thn = th + lambda * dth;
      evaluate(pm, lnD, un, thn, ev);
      const mn = ev.f1 * ev.f1 + ev.f2 * ev.f2;
      if (Number.isFinite(mn) && (mn < merit || mn < 1e-30)) {
        u = un; th = thn; merit = mn; accepted = true;
        break;
      }
      lambda *= 0.5;
    }
    if (!accepted) {
      evaluate(pm, lnD, u, th, ev);
      if (!(Math.max(Math.abs(ev.f1), Math.abs(ev.f2)) < F_TOL * 50)) return false;
      newtonRoot.u = u; newtonRoot.theta = th; newtonRoot.iterations = it;
      return true;
    }
    if (Math.abs(ev.f1) < F_TOL && Math.abs(ev.f2) < F_TOL) { newtonRoot.u = u; newtonRoot.theta = th; newtonRoot.iterations = it; return true; }
  }
  return false;
}

/** F1 for fixed θ, as a function of u (decreasing for θ < 0 form, increasing for θ ≥ 0). */
function f1At(pm: PreparedMixture, lnD: number, u: number, theta: number): number {
  evaluate(pm, lnD, u, theta, scratch);
  return scratch.f1;
}

function innerU(pm: PreparedMixture, lnD: number, theta: number, uGuess: number): number {
  const increasing = theta >= 0;
  const g = (u: number) => f1At(pm, lnD, u, theta);
  const br = bracketMonotone(g, uGuess, 1, increasing, [-2000, 2000], 'IAST inner solve (Σz = 1)');
  if (br.a === br.b) return br.a;
  return brentRoot(g, br.a, br.b, { fa: br.fa, fb: br.fb, xTol: 1e-15, what: 'IAST inner solve (Σz = 1)' }).x;
}

function bracketed(pm: PreparedMixture, lnD: number, start: { u: number; theta: number }): { u: number; theta: number; iterations: number } {
  let uLast = start.u;
  let evals = 0;
  const G = (theta: number) => {
    uLast = innerU(pm, lnD, theta, uLast);
    evals++;
    evaluate(pm, lnD, uLast, theta, scratch);
    return scratch.f2;
  };
  const br = bracketMonotone(G, start.theta, 2, true, [-1400, 1400], 'IAST outer solve (spreading pressure)');
  let theta = br.a;
  if (br.a !== br.b) theta = brentRoot(G, br.a, br.b, { fa: br.fa, fb: br.fb, xTol: 1e-13, what: 'IAST outer solve (spreading pressure)' }).x;
  const u = innerU(pm, lnD, theta, uLast);
  return { u, theta, iterations: evals };
}

/**
 * Solve the batch IAST problem for a prepared mixture at carbon dose `doseGPerL` (g/L).
 * @param warm optional (u, θ) of a nearby solve (e.g. the previous dose of a sweep).
 * @param options.forceBracketed skip Newton (tests of the fallback path).
 * @throws ComputationError if neither Newton nor the bracketed solve converges.
 */
export function solveBatchPrepared(
  pm: PreparedMixture,
  doseGPerL: number,
  warm?: { u: number; theta: number },
  options: { forceBracketed?: boolean } = {},
): BatchSolution {
  if (!(doseGPerL >= 0) || !Number.isFinite(doseGPerL)) throw new InputError(`expected a non-negative finite carbon dose, got ${doseGPerL}`, { path: 'dose' });
  const size = pm.size;
  const c = new Float64Array(size);
  const q = new Float64Array(size);
  for (let i = 0; i < size; i++) c[i] = (pm.source[i] as { c0MgPerL: number }).c0MgPerL;
  const m = pm.c0.length;
  if (m === 0) return { doseGPerL, cMgPerL: c, qMgPerG: q, psiMgPerG: NaN, state: { u: 0, theta: 0 }, iterations: 0, method: 'trivial' };
  if (doseGPerL === 0) {
    const d = directIastPrepared(pm, pm.c0);
    for (let j = 0; j < m; j++) q[pm.active[j]!] = d.qMgPerG[j]!;
    return { doseGPerL, cMgPerL: c, qMgPerG: q, psiMgPerG: d.psiMgPerG, state: { u: Math.log(d.psiMgPerG), theta: -Infinity }, iterations: d.iterations, method: 'trivial' };
  }
  const { u, theta } = solveState(pm, doseGPerL, warm, options.forceBracketed === true);
  const { iterations, method } = lastSolve;
  const lnx = pm.lnCTotal - softplus(-theta);
  for (let j = 0; j < m; j++) {
    const t = pm.n[j]! * u + pm.a[j]! - lnx;
    const e = Math.exp(-Math.abs(t));
    const inv = 1 / (1 + e);
    const sp = t >= 0 ? inv : e * inv; // σ(t): fraction remaining
    const sm = t >= 0 ? e * inv : inv; // σ(−t): fraction adsorbed
    const idx = pm.active[j]!;
    c[idx] = pm.c0[j]! * sp;
    q[idx] = (pm.c0[j]! * sm) / doseGPerL;
  }
  return { doseGPerL, cMgPerL: c, qMgPerG: q, psiMgPerG: Math.exp(u), state: { u, theta }, iterations, method };
}

/**
 * The converged state (u = ln ψ, θ) of the batch problem at a dose > 0 (g/L), without the
 * concentration arrays: what `solveBatchPrepared` solves, for hot loops (dose searches, Monte
 * Carlo draws) that need one component's fraction only (`remainingAtState`). Needs at least one
 * adsorbable component. @throws ComputationError if no converged root is found.
 */
export function solveBatchState(pm: PreparedMixture, doseGPerL: number, warm?: IastState): IastState {
  return solveState(pm, doseGPerL, warm, false);
}

/** c/c0 of active component j (index into pm.c0) at a converged state: σ(t_j). */
export function remainingAtState(pm: PreparedMixture, j: number, state: { u: number; theta: number }): number {
  const lnx = pm.lnCTotal - softplus(-state.theta);
  const t = pm.n[j]! * state.u + pm.a[j]! - lnx;
  if (t >= 0) return 1 / (1 + Math.exp(-t));
  const e = Math.exp(t);
  return e / (1 + e);
}

/** Iterations and method of the last `solveState` (kept aside so that every state is one plain {u, θ}). */
const lastSolve: { iterations: number; method: BatchSolution['method'] } = { iterations: 0, method: 'newton' };

function solveState(pm: PreparedMixture, doseGPerL: number, warm: IastState | undefined, forceBracketed: boolean): IastState {
  const lnD = Math.log(doseGPerL);
  const start = warm && Number.isFinite(warm.u) && Number.isFinite(warm.theta) ? warm : lumpedStart(pm, doseGPerL);
  let ok = forceBracketed ? false : newton(pm, lnD, start.u, start.theta);
  let method: BatchSolution['method'] = 'newton';
  if (!ok && warm && !forceBracketed) {
    const lumped = lumpedStart(pm, doseGPerL);
    ok = newton(pm, lnD, lumped.u, lumped.theta);
  }
  let u: number, theta: number, iterations: number;
  if (ok) {
    u = newtonRoot.u; theta = newtonRoot.theta; iterations = newtonRoot.iterations;
  } else {
    const sol = bracketed(pm, lnD, start);
    method = 'bracketed';
    u = sol.u; theta = sol.theta; iterations = sol.iterations;
    if (!forceBracketed && newton(pm, lnD, u, theta)) {
      u = newtonRoot.u; theta = newtonRoot.theta; iterations = newtonRoot.iterations + sol.iterations;
    }
  }
  evaluateScratch(pm, lnD, u, theta);
  if (!(Math.abs(scratch.f1) < 1e-11 && Math.abs(scratch.f2) < 1e-11)) {
    throw new ComputationError(`batch IAST did not converge at dose ${doseGPerL * 1000} mg/L (residuals ${scratch.f1.toExponential(2)}, ${scratch.f2.toExponential(2)})`);
  }
  lastSolve.iterations = iterations;
  lastSolve.method = method;
  return { u, theta };
}

/**
 * d ln(c_j/c0_j)/d ln D of active component j at a converged state (u, θ) at dose D (g/L): the
 * implicit-function derivative of the batch conditions F(u, θ; ln D) = 0, with ∂F1/∂ln D = 0 and
 * ∂F2/∂ln D = −1, so (du, dθ)/d ln D = J⁻¹·(0, 1); then d ln σ(t_j) = σ(−t_j)·(n_j du − σ(−θ) dθ).
 * Used by dose searches that step with Newton's method. @throws ComputationError on a singular Jacobian.
 */
export function remainingSlopeAtState(pm: PreparedMixture, doseGPerL: number, j: number, state: { u: number; theta: number }): number {
  const { u, theta } = state;
  evaluateScratch(pm, Math.log(doseGPerL), u, theta); // usually where the solve ended: no new evaluation
  const det = scratch.j11 * scratch.j22 - scratch.j12 * scratch.j21;
  if (!(Number.isFinite(det) && det !== 0)) throw new ComputationError(`batch IAST: singular Jacobian at dose ${doseGPerL * 1000} mg/L`);
  const du = -scratch.j12 / det;
  const dth = scratch.j11 / det;
  const p = theta >= 0 ? Math.exp(-theta) / (1 + Math.exp(-theta)) : 1 / (1 + Math.exp(theta)); // σ(−θ)
  const f = remainingAtState(pm, j, state);
  return (1 - f) * (pm.n[j]! * du - p * dth);
}
