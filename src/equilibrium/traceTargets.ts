/**
 * Trace targets beside a background, from one solve of the background alone: the remaining
 * fraction of each target in closed form, corrected to first order for the target's own loading.
 *
 * Trace argument (Knappe et al., Environ. Sci. Technol. 1998): a target at
 * ng/L–µg/L beside mg/L of DOC does not change the background's equilibrium measurably. In the
 * variables of iastBatch.ts (u = ln ψ, L = ln x with x = D·q_T, t_i = n_i·u + a_i − L) the batch
 * conditions of a mixture are
 *   E1 = Σ c0_k σ(−t_k) − e^L = 0            (adsorbed mass balance)
 *   E2 = Σ n_k c0_k σ(−t_k) − D·e^u = 0      (ψ·D = Σ n_k·D·q_k)
 * and a target T left out of the background sums has c_T/c0_T = σ(t_T) at the background's (u, L).
 * Adding the target's terms c0_T·σ(−t_T) and n_T·c0_T·σ(−t_T) moves the state by the linear
 * response J·(δu, δL) = −c0_T·σ(−t_T)·(1, n_T), with J the Jacobian of (E1, E2) in (u, L):
 *   J = [ −W_n       W − x   ]     W = Σ c0_k σ(t_k)σ(−t_k),  W_n = Σ n_k(…),  W_nn = Σ n_k²(…),
 *       [ −W_nn − N   W_n    ]     N = Σ n_k c0_k σ(−t_k) = D·ψ
 * (ours, first-order perturbation of the batch conditions above), so that
 *   t_T ≈ n_T(u + δu) + a_T − (L + δL),   c_T/c0_T ≈ σ(t_T),
 * with an error of second order in the target's share of the adsorbed phase c0_T/x. The same J
 * gives the background's change with the dose, (du, dL)/d ln D = J⁻¹·(0, N).
 * Only an approximation: the design layer uses it to start exact solves and searches, never as
 * a result. Units: c0 mg/L, dose g/L.
 */
import type { IastState } from './iastBatch.js';
import type { PreparedMixture } from './preparedMixture.js';

/** The background at a converged state: what the closed forms need. */
export interface BackgroundResponse {
  u: number;
  /** ln x, x = D·q_T of the background (mg/L adsorbed). */
  lnX: number;
  /** J (row-major j11, j12, j21, j22) and its determinant. */
  j11: number; j12: number; j21: number; j22: number; det: number;
  /** d u/d ln D and d ln x/d ln D of the background. */
  du: number; dLnX: number;
}

/** The background's response at a converged state of the background alone (state of iastBatch.ts). */
export function backgroundResponse(bg: PreparedMixture, state: IastState, out: BackgroundResponse): BackgroundResponse {
  const { c0, n, a } = bg;
  const u = state.u;
  const lnX = bg.lnCTotal - (state.theta >= 0 ? Math.log1p(Math.exp(-state.theta)) : -state.theta + Math.log1p(Math.exp(state.theta)));
  const x = Math.exp(lnX);
  let W = 0, Wn = 0, Wnn = 0, N = 0;
  for (let k = 0; k < c0.length; k++) {
    const t = n[k]! * u + a[k]! - lnX;
    const e = Math.exp(-Math.abs(t));
    const inv = 1 / (1 + e);
    const sm = t >= 0 ? e * inv : inv; // σ(−t)
    const ads = c0[k]! * sm;
    const w = ads * (1 - sm);
    W += w; Wn += w * n[k]!; Wnn += w * n[k]! * n[k]!; N += n[k]! * ads;
  }
  out.u = u; out.lnX = lnX;
  out.j11 = -Wn; out.j12 = W - x; out.j21 = -Wnn - N; out.j22 = Wn;
  out.det = out.j11 * out.j22 - out.j12 * out.j21;
  out.du = (-out.j12 * N) / out.det;
  out.dLnX = (out.j11 * N) / out.det;
  return out;
}

/** One trace target: corrected t_T, and the state (u, ln x) of target + background it implies. */
export interface TraceTarget {
  /** t_T with the first-order correction; c/c0 = σ(t). */
  t: number;
  /** d t/d ln D from the background's change alone (the correction's change is of higher order). */
  dt: number;
  u: number;
  lnX: number;
}

/**
 * @param r   the background's response (backgroundResponse)
 * @param nT  the target's n = 1/(1/n), aT its a = n·ln(β/K) (preparedMixture.ts), c0T mg/L
 */
export function traceTarget(r: BackgroundResponse, nT: number, aT: number, c0T: number, out: TraceTarget): TraceTarget {
  const t0 = nT * r.u + aT - r.lnX;
  const e = Math.exp(-Math.abs(t0));
  const sm = t0 >= 0 ? e / (1 + e) : 1 / (1 + e); // σ(−t0)
  const r1 = -c0T * sm, r2 = -nT * c0T * sm;
  const du = (r1 * r.j22 - r.j12 * r2) / r.det;
  const dL = (r.j11 * r2 - r.j21 * r1) / r.det;
  out.u = r.u + du;
  out.lnX = r.lnX + dL;
  out.t = nT * out.u + aT - out.lnX;
  out.dt = nT * r.du - r.dLnX;
  return out;
}
