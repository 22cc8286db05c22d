/**
 * Reverse IAST at the particle surface: the liquid concentrations c_s in equilibrium with given
 * surface loadings q, explicit for Freundlich isotherms (Radke & Prausnitz 1972, AIChE J.
 * 18(4):761–768). With β_i = 1/n_i the Freundlich exponent, q°_i = ψ·β_i and
 *   ψ = Σ_j q_j/β_j,  Q = Σ_j q_j,  z_i = q_i/Q,  c°_i = (β_i·ψ/K_i)^(1/β_i),  c_s,i = z_i·c°_i,
 * all zero when every q is zero. Jacobian (analytic, from the same equations):
 *   ∂c_s,i/∂q_j = c°_i·(δ_ij/Q − q_i/Q²) + c_s,i/(β_i·β_j·ψ).
 * At Q = 0 the Jacobian is returned as zero (its limit for β < 1, the case of activated carbon).
 *
 * Trace form (the trace argument of Knappe et al. 1998, Environ. Sci. Technol. 32:1694, applied at
 * the surface): a target whose loading is negligible in ψ and Q leaves the background's surface
 * equilibrium unchanged, and its own c_s is linear in its loading:
 *   c_s,T = κ_T·q_T,  κ_T = c°_T(ψ_B)/Q_B,  ∂κ_T/∂q_j = κ_T·(1/(β_T·β_j·ψ_B) − 1/Q_B) (j background).
 *
 * Units: q mg/g, K (mg/g)/(mg/L)^β, c mg/L. Loadings below zero (rounding in an integrator) count
 * as zero. Pure; never throws.
 */

export interface SurfaceIsotherms {
  /** Freundlich K of each adsorbable component, (mg/g)/(mg/L)^β (> 0). */
  readonly K: Float64Array;
  /** Freundlich exponent β = 1/n of each component (> 0). */
  readonly beta: Float64Array;
  /** ln(β/K) of each component, when the caller keeps it (the same values reverseIast computes otherwise). */
  readonly lnBetaOverK?: Float64Array;
}

export interface ReverseIastState {
  /** ψ = Σ q_j/β_j, mg/g. */
  psi: number;
  /** Q = Σ q_j, mg/g. */
  total: number;
}

/**
 * c_s for loadings q (length m); fills `cs` and, when given, the m×m row-major Jacobian `jac`.
 * @returns ψ and Q of the surface phase (written into `out` when given, so that an integrator's
 *          inner loop allocates nothing).
 */
export function reverseIast(iso: SurfaceIsotherms, q: ArrayLike<number>, cs: Float64Array, jac?: Float64Array, out?: ReverseIastState): ReverseIastState {
  const m = iso.K.length;
  let psi = 0, total = 0;
  for (let j = 0; j < m; j++) {
    const qj = q[j]! > 0 ? q[j]! : 0;
    psi += qj / iso.beta[j]!;
    total += qj;
  }
  if (!(total > 0)) {
    cs.fill(0, 0, m);
    if (jac) jac.fill(0, 0, m * m);
    if (out) { out.psi = 0; out.total = 0; return out; }
    return { psi: 0, total: 0 };
  }
  const lnPsi = Math.log(psi);
  const lnBetaOverK = iso.lnBetaOverK;
  for (let i = 0; i < m; i++) {
    const qi = q[i]! > 0 ? q[i]! : 0;
    const b = iso.beta[i]!;
    const cStar = Math.exp(((lnBetaOverK ? lnBetaOverK[i]! : Math.log(b / iso.K[i]!)) + lnPsi) / b); // c°_i = (β_i ψ/K_i)^(1/β_i)
    const csi = (qi / total) * cStar; // c_s,i = z_i c°_i
    cs[i] = csi;
    if (jac) {
      for (let j = 0; j < m; j++) {
        let v = -cStar * qi / (total * total) + csi / (b * iso.beta[j]! * psi);
        if (i === j) v += cStar / total;
        jac[i * m + j] = v;
      }
    }
  }
  if (out) { out.psi = psi; out.total = total; return out; }
  return { psi, total };
}

/**
 * Trace factor κ_T = c°_T(ψ_B)/Q_B of a trace target at a background surface state, so that
 * c_s,T = κ_T·q_T; with `dKappa` (length m_B) also ∂κ_T/∂q_j over the background loadings.
 * Zero (and zero derivatives) when the background carries no loading.
 */
export function traceSurfaceFactor(K: number, beta: number, background: ReverseIastState, backgroundBeta: Float64Array, dKappa?: Float64Array): number {
  const { psi, total } = background;
  if (!(total > 0) || !(psi > 0)) {
    if (dKappa) dKappa.fill(0);
    return 0;
  }
  const kappa = traceKappa(Math.log(beta / K), beta, Math.log(psi), total);
  if (dKappa) {
    for (let j = 0; j < backgroundBeta.length; j++) dKappa[j] = kappa * (1 / (beta * backgroundBeta[j]! * psi) - 1 / total);
  }
  return kappa;
}

/**
 * κ_T = c°_T(ψ_B)/Q_B = exp((ln(β_T/K_T) + ln ψ_B)/β_T)/Q_B from its logarithms, for loops that
 * share ln ψ_B over many targets and keep ln(β_T/K_T) per target (the same arithmetic as
 * traceSurfaceFactor, which calls it). Needs ψ_B > 0 and Q_B > 0.
 */
export function traceKappa(lnBetaOverK: number, beta: number, lnPsi: number, total: number): number {
  return Math.exp((lnBetaOverK + lnPsi) / beta) / total;
}
