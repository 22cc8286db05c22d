/**
 * The carbon dose at which one component of a batch IAST mixture reaches a given removal, solved
 * directly from the equilibrium conditions instead of searching the dose (the same equations as
 * src/equilibrium/iastBatch.ts, read the other way round).
 *
 * Batch IAST with Freundlich isotherms (Radke & Prausnitz 1972, AIChE J. 18(4):761–768; batch form
 * Crittenden et al. 1985, Environ. Sci. Technol. 19(11):1037–1043), in the variables of
 * iastBatch.ts: u = ln ψ, x = D·q_T (mg/L adsorbed), t_i = n_i·u + a_i − ln x, remaining fraction
 * c_i/c0_i = σ(t_i), adsorbed D·q_i = c0_i·σ(−t_i). When the remaining fraction of component T is
 * fixed at f = 1 − R, t_T = logit(f) is known, so ln x = n_T·u + a_T − t_T and one unknown is left:
 *   G(u) = ln( c0_T·R + Σ_{k≠T} c0_k·σ(−t_k) ) − ln x = 0        (adsorbed mass balance, F1)
 * G is strictly decreasing in u (G' = −Σ w_k n_k/S − n_T·(1 − Σ w_k/S) < 0 with
 * w_k = c0_k σ(t_k)σ(−t_k), S the sum above), so the root is unique; safeguarded Newton finds it.
 * Then the dose follows explicitly from ψ·D = Σ n_i·D·q_i (F2):
 *   D = ( n_T·c0_T·R + Σ_{k≠T} n_k·c0_k·σ(−t_k) ) / e^u.
 * For a trace target this is the fixed point of the target in its background at the goal.
 *
 * Units: c0 mg/L, K (mg/g)/(mg/L)^(1/n), dose g/L. 0 < R < 1. Throws ComputationError when the
 * Newton iteration does not converge (residual above 1e-12).
 */
import { ComputationError } from '../core/errors.js';
import type { PreparedMixture } from './preparedMixture.js';

export interface DoseAtRemoval {
  /** Dose at which component T is removed by R, g/L. */
  doseGPerL: number;
  /** The solver state (u, θ) of iastBatch.ts at that dose (a warm start for nearby solves). */
  state: { u: number; theta: number };
  iterations: number;
}

/**
 * @param pm             the prepared mixture
 * @param j              index of the component among the active (adsorbable, c0 > 0) ones
 * @param removalFraction R, 0 < R < 1
 * @param uStart         a starting ln ψ (e.g. from a nearby solve); optional
 */
export function iastDoseForRemoval(pm: PreparedMixture, j: number, removalFraction: number, uStart?: number): DoseAtRemoval {
  const R = removalFraction;
  if (!(R > 0 && R < 1)) throw new ComputationError(`dose for a removal: expected 0 < R < 1, got ${R}`);
  const { c0, n, a } = pm;
  const m = c0.length;
  const nT = n[j]!, aT = a[j]!, c0T = c0[j]!;
  const tT = Math.log1p(-R) - Math.log(R); // logit(1 − R)
  const adsorbedT = c0T * R;
  const base = aT - tT; // ln x = n_T u + base
  let u = uStart !== undefined && Number.isFinite(uStart) ? uStart : (Math.log(0.5 * pm.cTotal) - base) / nT;
  let lo = -Infinity, hi = Infinity;
  let G = NaN, iterations = 0;
  for (; iterations < 200; iterations++) {
    const lnx = nT * u + base;
    let S = adsorbedT, W = 0, Wn = 0;
    for (let k = 0; k < m; k++) {
      if (k === j) continue;
      const t = n[k]! * u + a[k]! - lnx;
      const e = Math.exp(-Math.abs(t));
      const inv = 1 / (1 + e);
      const sm = t >= 0 ? e * inv : inv; // σ(−t): adsorbed fraction
      const ads = c0[k]! * sm;
      S += ads;
      const w = ads * (1 - sm);
      W += w;
      Wn += w * n[k]!;
    }
    G = Math.log(S) - lnx;
    if (!Number.isFinite(G)) throw new ComputationError(`dose for ${(R * 100).toPrecision(6)} % removal: the IAST residual is not finite at ln ψ = ${u}`);
    if (Math.abs(G) <= 4e-15) break;
    if (G > 0) lo = u; else hi = u;
    const dG = -(Wn - nT * W) / S - nT;
    let next = u - G / dG;
    if (!(next > lo && next < hi)) next = Number.isFinite(lo) && Number.isFinite(hi) ? 0.5 * (lo + hi) : u + (G > 0 ? 4 : -4);
    else if (Math.abs(next - u) > 8) next = u + Math.sign(next - u) * 8;
    if (Math.abs(next - u) <= 1e-15 * Math.max(1, Math.abs(u))) { u = next; break; }
    u = next;
  }
  // the state at the final u (dose from F2, liquid total for θ)
  const lnx = nT * u + base;
  let S = adsorbedT, N = nT * adsorbedT, L = c0T * (1 - R);
  for (let k = 0; k < m; k++) {
    if (k === j) continue;
    const t = n[k]! * u + a[k]! - lnx;
    const e = Math.exp(-Math.abs(t));
    const inv = 1 / (1 + e);
    const sp = t >= 0 ? inv : e * inv;
    const sm = t >= 0 ? e * inv : inv;
    S += c0[k]! * sm;
    N += n[k]! * c0[k]! * sm;
    L += c0[k]! * sp;
  }
  G = Math.log(S) - lnx;
  if (!(Math.abs(G) < 1e-12)) throw new ComputationError(`dose for ${(R * 100).toPrecision(6)} % removal: the IAST mass balance did not converge (residual ${G.toExponential(2)} after ${iterations} iterations)`);
  const doseGPerL = N / Math.exp(u); // F2: ψ·D = Σ n_i·D·q_i
  return { doseGPerL, state: { u, theta: lnx - Math.log(L) }, iterations };
}
