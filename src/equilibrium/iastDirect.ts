/**
 * Direct IAST: loadings in equilibrium with given liquid concentrations (e.g. a GAC bed
 * saturated with its feed).
 *
 * Radke & Prausnitz 1972 (AIChE J. 18(4):761–768) with Freundlich isotherms: find ψ with
 *   Σ c_i / c°_i(ψ) = 1,   c°_i(ψ) = (ψ·β_i/K_i)^(n_i)
 * then z_i = c_i/c°_i, q°_i = β_i·ψ, 1/q_T = Σ z_i/q°_i, q_i = z_i·q_T.
 * In u = ln ψ the condition is F(u) = ln Σ exp(ln c_i − n_i·u − a_i) = 0, a convex decreasing
 * function; Newton from the left of the root rises monotonically to it (no overshoot).
 *
 * Units: c mg/L, K (mg/g)/(mg/L)^(1/n), q mg/g. Components with K = 0 or c = 0 have q = 0.
 */
import { ComputationError } from '../core/errors.js';
import type { PreparedMixture } from './preparedMixture.js';

export interface DirectSolution {
  /** Loadings of the active (adsorbable, c > 0) components, in `pm.active` order, mg/g. */
  qMgPerG: Float64Array;
  psiMgPerG: number;
  iterations: number;
}

/**
 * @param cActive liquid concentrations of the active components, mg/L (same order as pm.c0).
 */
export function directIastPrepared(pm: PreparedMixture, cActive: ArrayLike<number>): DirectSolution {
  const { n, a } = pm;
  const m = n.length;
  const lc = new Float64Array(m);
  const nz: number[] = [];
  for (let i = 0; i < m; i++) {
    const ci = cActive[i]!;
    if (!(ci >= 0) || !Number.isFinite(ci)) throw new ComputationError(`direct IAST: concentration ${ci} is not a finite non-negative number`);
    lc[i] = ci > 0 ? Math.log(ci) : -Infinity;
    if (ci > 0) nz.push(i);
  }
  const q = new Float64Array(m);
  if (nz.length === 0) return { qMgPerG: q, psiMgPerG: 0, iterations: 0 };
  // Start left of the root: the largest single term equals 1 there, so F ≥ 0.
  let u = Infinity;
  for (const i of nz) u = Math.min(u, (lc[i]! - a[i]!) / n[i]!);
  let it = 0;
  for (; it < 200; it++) {
    let mx = -Infinity;
    for (const i of nz) mx = Math.max(mx, lc[i]! - n[i]! * u - a[i]!);
    let s = 0, sn = 0;
    for (const i of nz) {
      const e = Math.exp(lc[i]! - n[i]! * u - a[i]! - mx);
      s += e;
      sn += n[i]! * e;
    }
    const F = mx + Math.log(s);
    const dF = -sn / s;
    const step = -F / dF;
    u += step;
    if (Math.abs(step) <= 1e-15 * Math.max(1, Math.abs(u)) || Math.abs(F) < 1e-15) break;
  }
  if (!Number.isFinite(u) || it >= 200) throw new ComputationError('direct IAST: spreading-pressure search did not converge');
  const psi = Math.exp(u);
  let sumZn = 0;
  const z = new Float64Array(m);
  for (const i of nz) {
    z[i] = Math.exp(lc[i]! - n[i]! * u - a[i]!);
    sumZn += z[i]! * n[i]!; // z_i/q°_i = z_i·n_i/ψ
  }
  const qT = psi / sumZn;
  for (const i of nz) q[i] = z[i]! * qT;
  return { qMgPerG: q, psiMgPerG: psi, iterations: it + 1 };
}
