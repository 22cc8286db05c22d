/**
 * The fixed-bed model as a stiff ODE system for the implicit integrator: method of lines in
 * dimensionless form, time in bed volumes τ = t/EBCT, depth ζ = z/L, u = c/c0 and w = q/q_ref
 * (q_ref = K·c0^β, the single-solute loading in equilibrium with the feed, only a scale).
 *
 *   liquid, cell j:  ε·du_j/dτ = −(F_{j+1/2} − F_{j−1/2})/Δζ − St·(u_j − c_s/c0)
 *   grain nodes i<N: dw_i/dτ   = Dτ·(B·w)_i                      (HSDM, sphere collocation)
 *   grain mean:      dw̄/dτ     = Φ·(u_j − c_s/c0),  w̄ = Σ_k ω_k w_k   → the surface node's ODE
 *   outflow:         dO/dτ     = F_{N+1/2}                        (cumulative outflow, BV)
 * with St = (1 − ε)·3·kf·EBCT/R, Dτ = Ds·EBCT/R², Φ = 3·kf·EBCT·c0/(R·ρp·q_ref). These are the
 * bed equation ε∂c/∂t + v∂c/∂z = −(1 − ε)(3/R)kf(c − c_s) with v = L/EBCT and the HSDM with the
 * film at the surface (Crittenden & Weber 1978, J. Environ. Eng. Div. 104; Hand, Crittenden &
 * Thacker 1983, J. Environ. Eng. 109:82, from memory), written with the grain balance
 * ρp·dq̄/dt = (3/R)·kf·(c − c_s) in place of the collocated surface condition (the two agree
 * through the discrete divergence identity Σ ω_i(Bw)_i = 3·g·w of the collocation).
 *
 * Axial faces: F_{1/2} = 1 (feed), F_{3/2} = u_1, F_{j+1/2} = u_j + ½·δ·φ, δ = u_j − u_{j−1}
 * (second-order upwind, linear extrapolation from upstream; Warming & Beam 1976, AIAA J. 14:1241,
 * from memory). Ahead of a front (δ < 0) the extrapolation is limited, φ = θ²/(1 + θ²) with
 * θ = 2u_j/|δ| (our smooth positivity limiter, regularised as δ² + 4u² + η² with η = 1e-5: F ≥ u_j/2 ≥ 0, and φ = 1 − O(Δζ²) where the
 * profile is resolved, so the scheme stays second order there); δ ≥ 0 uses φ = 1. Every flux
 * depends only on upstream cells, so the Newton matrix (I − γh·J) is block lower triangular along
 * the bed and is solved by forward block substitution, cell by cell.
 *
 * Components: "background" ones (bulk, e.g. fictive DOC) are coupled by reverse IAST at the grain
 * surface; "trace" ones take the trace form c_s,T = κ_T(background)·q_T (src/kinetics/reverseIast.ts),
 * so within a cell each trace block depends on the background block and not the reverse: the
 * background block is factorised whole, then each trace block on its own.
 *
 * Mass balance: the discrete system conserves Σ_j Δζ(ε u_j + (1 − ε)ρp q_ref w̄_j/c0) + O − τ
 * exactly, and TR-BDF2 with this Newton matrix keeps a linear invariant to rounding, so the
 * mass-balance error measures the linear solves, not the step size.
 */
import { ComputationError } from '../core/errors.js';
import { denseLu, luFactorAt, luSolveAt } from './denseLu.js';
import type { NewtonSolve, StiffSystem } from './implicitIntegrator.js';
import type { BedBackgroundHistory } from './fixedBedBackground.js';
import { reverseIast, traceKappa, traceSurfaceFactor, type ReverseIastState } from './reverseIast.js';
import { sphereCollocation, type SphereCollocation } from './sphereCollocation.js';

/** One adsorbable component in the dimensionless model. */
export interface BedComponentScales {
  c0MgPerL: number;
  K: number;
  beta: number;
  /** q_ref = K·c0^β, mg/g. */
  qRefMgPerG: number;
  /** St = (1 − ε)·3·kf·EBCT/R. */
  stanton: number;
  /** Dτ = Ds·EBCT/R². */
  diffusion: number;
  /** Φ = 3·kf·EBCT·c0/(R·ρp·q_ref). */
  film: number;
}

export interface BedGrid {
  /** Axial cells (≥ 3). */
  cells: number;
  /** Interior collocation points in the grain (≥ 1). */
  interiorPoints: number;
}

export interface BedModel extends StiffSystem {
  readonly grid: BedGrid;
  /** Number of background components (first in `components`). */
  readonly backgroundCount: number;
  readonly components: readonly BedComponentScales[];
  readonly porosity: number;
  /** Values per component in one cell: u and w_0 … w_N. */
  readonly perComponent: number;
  /** Values per cell. */
  readonly perCell: number;
  /** Index of the cumulative outflow O of component m. */
  outflowIndex(m: number): number;
  /** Outlet u = F_{N+1/2} of component m in state y. */
  outlet(y: Float64Array, m: number): number;
  /** Dimensionless amount held in the bed (pores and grains) of component m, in bed volumes of feed. */
  held(y: Float64Array, m: number): number;
  /** ρp·q_ref/c0 of component m (grain capacity scale, L of water per L of grain). */
  capacity(m: number): number;
  readonly collocation: SphereCollocation;
}

/**
 * Build the model. `components` lists the background components first (`backgroundCount` ≥ 1),
 * then the traces. `particleDensityGPerL` = ρp (kg/m³ = g/L).
 *
 * With `background` (a background solved once, src/kinetics/fixedBedBackground.ts) the model holds
 * only trace components (`backgroundCount` 0): their κ_T comes from the stored background surface
 * state at the time asked, so each trace is a one-way-coupled system of its own (the same equations).
 * @throws ComputationError for a grid below 3 cells or 1 interior point
 */
export function fixedBedModel(components: readonly BedComponentScales[], backgroundCount: number, porosity: number, particleDensityGPerL: number, grid: BedGrid, background?: BedBackgroundHistory): BedModel {
  const Nz = grid.cells;
  if (!Number.isInteger(Nz) || Nz < 3) throw new ComputationError(`fixed bed: at least 3 axial cells are needed, got ${Nz}`);
  if (background) {
    if (backgroundCount !== 0 || components.length < 1) throw new ComputationError('fixed bed: with a stored background the model holds trace components only');
    if (background.cells !== Nz) throw new ComputationError(`fixed bed: the stored background has ${background.cells} cells, the model ${Nz}`);
  } else if (!(backgroundCount >= 1 && backgroundCount <= components.length)) throw new ComputationError('fixed bed: at least one background component is needed');
  const col = sphereCollocation(grid.interiorPoints);
  const N = col.interiorPoints;
  const P = N + 2; // u, w_0..w_N
  const na = components.length;
  const nb = backgroundCount;
  const S = na * P;
  const size = Nz * S + na;
  const eps = porosity;
  const dz = 1 / Nz;
  const B = col.laplacian, wt = col.weights;
  const wN = wt[N]!;
  // Σ_{i<N} ω_i B_ik: the interior part of the mean, for the surface node's equation
  const interiorMeanB = new Float64Array(N + 1);
  for (let k = 0; k <= N; k++) { let s = 0; for (let i = 0; i < N; i++) s += wt[i]! * B[i * (N + 1) + k]!; interiorMeanB[k] = s; }
  const bgIso = background ? background.iso : { K: Float64Array.from(components.slice(0, nb), (c) => c.K), beta: Float64Array.from(components.slice(0, nb), (c) => c.beta) };
  // with a stored background: its surface state per cell at time `tNow` (the time of the last rhs or factor call)
  let tNow = 0;
  const storedSt: ReverseIastState = { psi: 0, total: 0 };
  const surfaceSt: ReverseIastState = { psi: 0, total: 0 };
  const qRef = Float64Array.from(components, (c) => c.qRefMgPerG);
  const c0 = Float64Array.from(components, (c) => c.c0MgPerL);

  // the limiter is regularised below c/c0 ~ 1e-5 (ETA2 = η²), where it falls back to first order
  const ETA2 = 1e-10;
  // relative move of the Newton iterate that refreshes the Newton matrix (ours: 0.05 halves the
  // refreshes of 0 at the same step count on the demo water; 0.1 lets Newton stall again)
  const REFRESH_MOVE = 0.05;
  // smallest relative background surface loading in the Newton matrix (see `surface`)
  const JAC_FLOOR = 1e-12;
  // ∂F_{j+1/2}/∂u_j and ∂F_{j+1/2}/∂u_{j−1} per cell and component (filled by `factor`)
  const faceOwn = new Float64Array(Nz * na);
  const faceUp = new Float64Array(Nz * na);

  const qS = new Float64Array(nb);
  const cs = new Float64Array(na);
  const jacBg = new Float64Array(nb * nb);
  const dKappa = new Float64Array(nb);

  // ln(β/K) per component, so that κ_T shares ln ψ_B over the traces of a cell (traceKappa)
  const lnBetaOverK = Float64Array.from(components, (c) => Math.log(c.beta / c.K));
  // with a stored background κ_T depends on the time and the cell only: kept for the last time
  // asked (the Newton iterations of a stage and its matrix refreshes share one time)
  const storedKappa = background ? new Float64Array(Nz * na) : undefined;
  let storedKappaTime = NaN;
  const fillStoredKappa = (): void => {
    if (tNow === storedKappaTime) return;
    for (let j = 0; j < Nz; j++) {
      background!.surfaceAt(tNow, j, storedSt);
      const ok = storedSt.total > 0 && storedSt.psi > 0;
      const lnPsi = ok ? Math.log(storedSt.psi) : 0;
      for (let m = 0; m < na; m++) storedKappa![j * na + m] = ok ? traceKappa(lnBetaOverK[m]!, components[m]!.beta, lnPsi, storedSt.total) : 0;
    }
    storedKappaTime = tNow;
  };

  /**
   * Surface concentrations of all components in cell j from reverse IAST of the background (and
   * its Jacobian when asked); without a stored background only (with one, κ_T comes from
   * fillStoredKappa).
   */
  const surface = (y: Float64Array, j: number, withJac: boolean, kappas?: Float64Array, dKappas?: Float64Array): void => {
    const base = j * S;
    // for the Newton matrix the loadings are floored at JAC_FLOOR·q_ref: reverse IAST's Jacobian
    // overflows at loadings near the smallest doubles (c°/Σq), and any finite approximation will do
    if (withJac) for (let b = 0; b < nb; b++) qS[b] = qRef[b]! * Math.max(y[base + b * P + 1 + N]!, JAC_FLOOR);
    else for (let b = 0; b < nb; b++) qS[b] = qRef[b]! * y[base + b * P + 1 + N]!;
    const st = reverseIast(bgIso, qS, cs, withJac ? jacBg : undefined, surfaceSt);
    const ok = st.total > 0 && st.psi > 0;
    const lnPsi = ok && !dKappas ? Math.log(st.psi) : 0;
    for (let m = nb; m < na; m++) {
      const comp = components[m]!;
      // c_s,T = κ_T·q_T (trace form); with its derivatives for the Newton matrix
      const kappa = dKappas ? traceSurfaceFactor(comp.K, comp.beta, st, bgIso.beta, dKappa) : ok ? traceKappa(lnBetaOverK[m]!, comp.beta, lnPsi, st.total) : 0;
      if (kappas) kappas[m] = kappa;
      if (dKappas) for (let b = 0; b < nb; b++) dKappas[(m - nb) * nb + b] = dKappa[b]!;
      cs[m] = kappa * qRef[m]! * y[base + m * P + 1 + N]!;
    }
  };

  /** F_{j+1/2} of component m (j = −1: the feed). */
  const face = (y: Float64Array, j: number, m: number): number => {
    if (j < 0) return 1;
    const u = y[j * S + m * P]!;
    if (j === 0) return u;
    return limitedFace(u, y[(j - 1) * S + m * P]!, ETA2);
  };


  // the state of the last rhs call (Newton's current iterate), for refreshing the Newton matrix:
  // the integrator solves with the matrix of the step's start (simplified Newton); with the steep
  // reverse IAST of the DOC components that stalls often and each stall cuts the step by 4, so the
  // solver refreshes its state-dependent blocks at the current iterate when it has moved (a
  // Newton matrix nearer the iterate; the integrator's contract holds, any nonsingular
  // approximation of I − γh·J is allowed, and the linear invariant is kept)
  const lastState = new Float64Array(size);
  let rhsCalls = 0;
  let solvesSinceFactor = 0;
  const builtState = new Float64Array(size);
  /**
   * Has y moved from the state of the Newton matrix by more than REFRESH_MOVE (relative, floor
   * 1e-3) in any u or any background surface loading? Those carry the nonlinearity (the limiter,
   * and reverse IAST, c_s ∝ q^(1/β) with 1/β up to 5).
   */
  const moved = (y: Float64Array): boolean => {
    for (let j = 0; j < Nz; j++) {
      const base = j * S;
      for (let m = 0; m < na; m++) {
        const o = base + m * P;
        if (Math.abs(y[o]! - builtState[o]!) > REFRESH_MOVE * (Math.abs(builtState[o]!) + 1e-3)) return true;
        if (m < nb && Math.abs(y[o + 1 + N]! - builtState[o + 1 + N]!) > REFRESH_MOVE * (Math.abs(builtState[o + 1 + N]!) + 1e-3)) return true;
      }
    }
    return false;
  };
  let lastT = 0;
  // the components' scales as typed arrays for the inner loops, and F_{j+1/2} of the last rhs call
  // (each face is computed once and used by the cells on both sides)
  const stantonOf = Float64Array.from(components, (c) => c.stanton);
  const diffusionOf = Float64Array.from(components, (c) => c.diffusion);
  const filmOf = Float64Array.from(components, (c) => c.film);
  const faces = new Float64Array(Nz * na);
  // c_s/c0 per cell and component at the state of the rhs call
  const csOverC0 = new Float64Array(Nz * na);
  const rhs = (t: number, y: Float64Array, dy: Float64Array): void => {
    lastState.set(y);
    lastT = t;
    tNow = t;
    rhsCalls++;
    if (background) {
      fillStoredKappa();
      for (let j = 0; j < Nz; j++) for (let m = 0; m < na; m++) csOverC0[j * na + m] = (storedKappa![j * na + m]! * qRef[m]! * y[j * S + m * P + 1 + N]!) / c0[m]!;
    } else {
      for (let j = 0; j < Nz; j++) {
        surface(y, j, false);
        for (let m = 0; m < na; m++) csOverC0[j * na + m] = cs[m]! / c0[m]!;
      }
    }
    transportRhs(y, dy, csOverC0, faces, stantonOf, diffusionOf, filmOf, B, wt, Nz, na, N, eps, dz, ETA2);
  };

  const kappas = new Float64Array(na);
  const dKappas = new Float64Array(Math.max(1, (na - nb) * nb));

  const scratch = new Float64Array(N);
  const pBuf = new Float64Array(na * N);
  const rBg = new Float64Array(2 * nb);

  /**
   * Newton matrix (I − gh·J) and its solver. The grain-interior rows are linear and the same in
   * every cell, I − gh·Dτ·B_int, so they are eliminated first (a Schur complement): w_int =
   * A⁻¹(b_int) + e·w_N with A = I − gh·Dτ·B_int,int and e = gh·Dτ·A⁻¹·B_int,N, factorised once
   * per component and step. What remains per cell and component is (u, w_N): a 2·n_B system for
   * the background and a 2×2 system per trace.
   */
  const nt = na - nb;
  const n2 = 2 * nb;
  // buffers of the Newton matrix, reused: the integrator uses one factorisation at a time
  const aInv = new Float64Array(na * N * N);
  const e = new Float64Array(na * N);
  const sig = new Float64Array(na);
  const bgMat = new Float64Array(Nz * n2 * n2); // per cell the background block, then its LU factors
  const bgPiv = new Int32Array(Nz * n2);
  const tr = new Float64Array(Nz * Math.max(1, nt) * 4);
  const coupling = new Float64Array(Nz * Math.max(1, nt) * 2 * nb);
  // per cell: κ of each trace, the background's reverse-IAST Jacobian, and ∂κ_T/∂q_b (from `surface`)
  const kappaAll = new Float64Array(Nz * na);
  const jacAll = new Float64Array(Nz * nb * nb);
  const dKappaAll = new Float64Array(Nz * Math.max(1, nt * nb));
  const factor = (t0: number, y: Float64Array, gh: number): NewtonSolve => {
    solvesSinceFactor = 0;
    for (let m = 0; m < na; m++) {
      const dTau = components[m]!.diffusion;
      const A = new Float64Array(N * N);
      for (let i = 0; i < N; i++) for (let k = 0; k < N; k++) A[i * N + k] = (i === k ? 1 : 0) - gh * dTau * B[i * (N + 1) + k]!;
      const lu = denseLu(A, N, 'fixed bed (grain block)');
      for (let k = 0; k < N; k++) { // columns of A⁻¹ (N is small)
        scratch.fill(0); scratch[k] = 1;
        lu.solve(scratch, 0);
        for (let i = 0; i < N; i++) aInv[m * N * N + i * N + k] = scratch[i]!;
      }
      for (let i = 0; i < N; i++) scratch[i] = gh * dTau * B[i * (N + 1) + N]!;
      lu.solve(scratch, 0);
      let s2 = interiorMeanB[N]!;
      for (let i = 0; i < N; i++) { e[m * N + i] = scratch[i]!; s2 += interiorMeanB[i]! * scratch[i]!; }
      sig[m] = 1 + (gh * dTau * s2) / wN;
    }
    // the state-dependent blocks at y: per cell the background block's LU, and per trace its 2×2
    // matrix (4 values) and the coupling of its u and w_N rows to the background w_N (2·nb)
    const blocks = (y: Float64Array): void => {
      faceDerivativesOf(y, faceOwn, faceUp, Nz, na, N, ETA2);
      if (background) {
        fillStoredKappa();
        assembleBlocks(y, gh, storedKappa!, jacAll, dKappaAll, faceOwn, sig, stantonOf, filmOf, qRef, c0, bgMat, bgPiv, tr, coupling, Nz, na, nb, N, eps, dz, wN);
        return;
      }
      for (let j = 0; j < Nz; j++) {
        surface(y, j, true, kappas, dKappas);
        for (let m = nb; m < na; m++) kappaAll[j * na + m] = kappas[m]!;
        jacAll.set(jacBg, j * nb * nb);
        if (nt > 0) dKappaAll.set(dKappas.subarray(0, nt * nb), j * nt * nb);
      }
      assembleBlocks(y, gh, kappaAll, jacAll, dKappaAll, faceOwn, sig, stantonOf, filmOf, qRef, c0, bgMat, bgPiv, tr, coupling, Nz, na, nb, N, eps, dz, wN);
    };
    tNow = t0;
    blocks(y);
    builtState.set(y);
    let builtT = t0;
    let builtAt = rhsCalls;
    return (x: Float64Array, filter?: boolean): void => {
      // a later Newton iteration whose iterate (the state of the last rhs call) has moved: refresh
      // the blocks there, so the reverse-IAST nonlinearity does not stall Newton into step cuts
      // (with a stored background at every new iterate: the trace blocks are cheap to rebuild, κ_T
      // moves with time, and the limiter at tiny c/c0 otherwise slows Newton to a crawl)
      if (!filter && rhsCalls !== builtAt && (background !== undefined || (solvesSinceFactor++ > 0 && moved(lastState)))) {
        builtAt = rhsCalls;
        try {
          tNow = lastT;
          blocks(lastState);
          builtState.set(lastState);
          builtT = lastT;
        } catch (err) {
          if (!(err instanceof ComputationError)) throw err;
          tNow = builtT;
          blocks(builtState); // singular at a wild iterate: keep the last good matrix
        }
      }
      blockSolve(x, gh, faceOwn, faceUp, aInv, e, pBuf, interiorMeanB, diffusionOf, bgMat, bgPiv, rBg, tr, coupling, Nz, na, nb, N, eps, dz, wN);
    };
  };

  return {
    size,
    what: 'fixed-bed breakthrough',
    rhs,
    factor,
    grid: { cells: Nz, interiorPoints: N },
    backgroundCount: nb,
    components,
    porosity: eps,
    perComponent: P,
    perCell: S,
    collocation: col,
    outflowIndex: (m) => Nz * S + m,
    outlet: (y, m) => face(y, Nz - 1, m),
    capacity: (m) => (particleDensityGPerL * qRef[m]!) / c0[m]!,
    held(y, m) {
      const cap = (particleDensityGPerL * qRef[m]!) / c0[m]!;
      let s = 0;
      for (let j = 0; j < Nz; j++) {
        const o = j * S + m * P;
        let mean = 0;
        for (let k = 0; k <= N; k++) mean += wt[k]! * y[o + 1 + k]!;
        s += eps * y[o]! + (1 - eps) * cap * mean;
      }
      return s * dz;
    },
  };
}

/**
 * F_{j+1/2} of a cell with u = c/c0 and its upstream neighbour's uUp (j ≥ 1): u + ½·δ·φ with
 * δ = u − uUp, φ = 1 for δ ≥ 0, else the limiter θ²/(1 + θ²), θ = 2u/|δ|, regularised by eta2
 * (see the file comment).
 */
function limitedFace(u: number, uUp: number, eta2: number): number {
  const d = u - uUp;
  if (d >= 0) return u + 0.5 * d;
  return u + (2 * u * u * d) / (d * d + 4 * u * u + eta2); // ½·δ·θ²/(1 + θ²), regularised
}

/**
 * The model's right-hand side given c_s/c0 per cell and component (`csOverC0`), written into `dy`
 * (see the file comment: the liquid with the limited second-order upwind faces, the grain's
 * collocation rows and the surface node's grain balance, and the cumulative outflows); `faces`
 * receives F_{j+1/2}. A function of its arguments only, so that the compiler keeps them in
 * registers across the loops.
 */
function transportRhs(y: Float64Array, dy: Float64Array, csOverC0: Float64Array, faces: Float64Array, stantonOf: Float64Array, diffusionOf: Float64Array, filmOf: Float64Array, B: Float64Array, wt: Float64Array, Nz: number, na: number, N: number, eps: number, dz: number, eta2: number): void {
  const P = N + 2, S = na * P, N1 = N + 1;
  const wN = wt[N]!;
  for (let j = 0; j < Nz; j++) {
    const base = j * S;
    for (let m = 0; m < na; m++) {
      const o = base + m * P;
      const u = y[o]!;
      // F_{j+1/2}, and F_{j−1/2} from the cell upstream (the feed's 1 at j = 0)
      let F: number;
      if (j === 0) F = u;
      else F = limitedFace(u, y[o - S]!, eta2);
      const Fup = j === 0 ? 1 : faces[(j - 1) * na + m]!;
      faces[j * na + m] = F;
      const film = u - csOverC0[j * na + m]!;
      const dTau = diffusionOf[m]!;
      dy[o] = (-(F - Fup) / dz - stantonOf[m]! * film) / eps;
      let interior = 0;
      for (let i = 0; i < N; i++) {
        let s = 0;
        const row = i * N1;
        for (let k = 0; k <= N; k++) s += B[row + k]! * y[o + 1 + k]!;
        interior += wt[i]! * s;
        dy[o + 1 + i] = dTau * s;
      }
      dy[o + 1 + N] = (filmOf[m]! * film - dTau * interior) / wN;
    }
  }
  for (let m = 0; m < na; m++) dy[Nz * S + m] = faces[(Nz - 1) * na + m]!;
}

/**
 * Solve (I − gh·J)·x = b in place with the blocks of the Newton matrix (see `factor` in
 * fixedBedModel): forward block substitution along the bed, cell by cell, the grain interior
 * eliminated through A⁻¹ (`aInv`, `e`), the background block's LU (`bgMat`, `bgPiv`) and each
 * trace's 2×2 block (`tr`) with its coupling to the background. A function of its arguments only,
 * so that the compiler keeps them in registers across the loops.
 */
function blockSolve(x: Float64Array, gh: number, faceOwn: Float64Array, faceUp: Float64Array, aInv: Float64Array, e: Float64Array, pBuf: Float64Array, interiorMeanB: Float64Array, diffusionOf: Float64Array, bgMat: Float64Array, bgPiv: Int32Array, rBg: Float64Array, tr: Float64Array, coupling: Float64Array, Nz: number, na: number, nb: number, N: number, eps: number, dz: number, wN: number): void {
  const P = N + 2, S = na * P, n2 = 2 * nb, nt = na - nb;
  for (let j = 0; j < Nz; j++) {
    const base = j * S;
    for (let m = 0; m < na; m++) {
      const o = base + m * P;
      // F_{j+1/2} − F_{j−1/2} through u_{j−1} and u_{j−2}
      let up = 0;
      if (j >= 1) up += (faceUp[j * na + m]! - faceOwn[(j - 1) * na + m]!) * x[(j - 1) * S + m * P]!;
      if (j >= 2) up -= faceUp[(j - 1) * na + m]! * x[(j - 2) * S + m * P]!;
      x[o] = x[o]! - (gh * up) / (eps * dz);
      // grain interior: p = A⁻¹·b_int, and the surface row's right side
      let corr = 0;
      const ai = m * N * N;
      for (let i = 0; i < N; i++) {
        let v = 0;
        for (let k = 0; k < N; k++) v += aInv[ai + i * N + k]! * x[o + 1 + k]!;
        pBuf[m * N + i] = v;
        corr += interiorMeanB[i]! * v;
      }
      x[o + 1 + N] = x[o + 1 + N]! - (gh * diffusionOf[m]! * corr) / wN;
    }
    for (let m = 0; m < nb; m++) { rBg[2 * m] = x[base + m * P]!; rBg[2 * m + 1] = x[base + m * P + 1 + N]!; }
    if (nb > 0) luSolveAt(bgMat, j * n2 * n2, n2, bgPiv, j * n2, rBg, 0);
    for (let m = 0; m < nb; m++) { x[base + m * P] = rBg[2 * m]!; x[base + m * P + 1 + N] = rBg[2 * m + 1]!; }
    for (let m = nb; m < na; m++) {
      const o = base + m * P;
      const t = j * nt + (m - nb);
      const cOff = t * 2 * nb;
      let bu = x[o]!, bs = x[o + 1 + N]!;
      for (let b = 0; b < nb; b++) {
        const xb = x[base + b * P + 1 + N]!;
        bu += gh * coupling[cOff + b]! * xb;
        bs += gh * coupling[cOff + nb + b]! * xb;
      }
      const a11 = tr[4 * t]!, a12 = tr[4 * t + 1]!, a21 = tr[4 * t + 2]!, a22 = tr[4 * t + 3]!;
      const det = a11 * a22 - a12 * a21;
      x[o] = (a22 * bu - a12 * bs) / det;
      x[o + 1 + N] = (a11 * bs - a21 * bu) / det;
    }
    for (let m = 0; m < na; m++) {
      const o = base + m * P;
      const wS = x[o + 1 + N]!;
      for (let i = 0; i < N; i++) x[o + 1 + i] = pBuf[m * N + i]! + e[m * N + i]! * wS;
    }
  }
  const last = (Nz - 1) * S, prev = (Nz - 2) * S;
  for (let m = 0; m < na; m++) x[Nz * S + m] = x[Nz * S + m]! + gh * (faceOwn[(Nz - 1) * na + m]! * x[last + m * P]! + faceUp[(Nz - 1) * na + m]! * x[prev + m * P]!);
}

/** Fill ∂F_{j+1/2}/∂u_j (`faceOwn`) and ∂F_{j+1/2}/∂u_{j−1} (`faceUp`) per cell and component at y (the faces of fixedBedModel). */
function faceDerivativesOf(y: Float64Array, faceOwn: Float64Array, faceUp: Float64Array, Nz: number, na: number, N: number, eta2: number): void {
  const S = na * (N + 2), P = N + 2;
  for (let j = 0; j < Nz; j++) for (let m = 0; m < na; m++) {
    const k = j * na + m;
    if (j === 0) { faceOwn[k] = 1; faceUp[k] = 0; continue; }
    const u = y[j * S + m * P]!;
    const d = u - y[(j - 1) * S + m * P]!;
    if (d >= 0) { faceOwn[k] = 1.5; faceUp[k] = -0.5; continue; }
    const D = d * d + 4 * u * u + eta2;
    const gU = (4 * u * d) / D - (16 * u * u * u * d) / (D * D); // ∂G/∂u at fixed δ
    const gD = (2 * u * u * (D - 2 * d * d)) / (D * D); // ∂G/∂δ
    faceOwn[k] = 1 + gU + gD;
    faceUp[k] = -gD;
  }
}

/**
 * The state-dependent blocks of the Newton matrix (I − gh·J) at y (see `factor` in fixedBedModel):
 * per cell the background block, LU-factorised in place (`bgMat`, `bgPiv`), and per trace its 2×2
 * matrix (`tr`, 4 values) and the coupling of its u and w_N rows to the background w_N (`coupling`,
 * 2·nb values), from κ of each trace (`kappaAll`), the background's reverse-IAST Jacobian
 * (`jacAll`) and ∂κ_T/∂q_b (`dKappaAll`) per cell.
 * @throws ComputationError when a block is singular or not finite
 */
function assembleBlocks(y: Float64Array, gh: number, kappaAll: Float64Array, jacAll: Float64Array, dKappaAll: Float64Array, faceOwn: Float64Array, sig: Float64Array, stantonOf: Float64Array, filmOf: Float64Array, qRef: Float64Array, c0: Float64Array, bgMat: Float64Array, bgPiv: Int32Array, tr: Float64Array, coupling: Float64Array, Nz: number, na: number, nb: number, N: number, eps: number, dz: number, wN: number): void {
  const P = N + 2, S = na * P, n2 = 2 * nb, nt = na - nb;
  for (let j = 0; j < Nz; j++) {
    const base = j * S;
    const mo = j * n2 * n2;
    const jo = j * nb * nb;
    if (nb > 0) bgMat.fill(0, mo, mo + n2 * n2);
    for (let m = 0; m < nb; m++) {
      const stanton = stantonOf[m]!, film = filmOf[m]!;
      const ru = 2 * m, rs = 2 * m + 1;
      bgMat[mo + ru * n2 + ru] = 1 + gh * (faceOwn[j * na + m]! / (eps * dz) + stanton / eps);
      bgMat[mo + rs * n2 + ru] = -gh * film / wN;
      bgMat[mo + rs * n2 + rs] = sig[m]!;
      for (let b = 0; b < nb; b++) {
        const dFilm = -(jacAll[jo + m * nb + b]! * qRef[b]!) / c0[m]!; // ∂(u − c_s/c0)/∂w_b,N
        bgMat[mo + ru * n2 + 2 * b + 1] = bgMat[mo + ru * n2 + 2 * b + 1]! + gh * (stanton / eps) * dFilm;
        bgMat[mo + rs * n2 + 2 * b + 1] = bgMat[mo + rs * n2 + 2 * b + 1]! - gh * (film / wN) * dFilm;
      }
    }
    if (nb > 0) luFactorAt(bgMat, mo, n2, bgPiv, j * n2, 'fixed bed (background block)');
    for (let m = nb; m < na; m++) {
      const stanton = stantonOf[m]!, film = filmOf[m]!;
      const t = j * nt + (m - nb);
      const dFilmOwn = -(kappaAll[j * na + m]! * qRef[m]!) / c0[m]!;
      tr[4 * t] = 1 + gh * (faceOwn[j * na + m]! / (eps * dz) + stanton / eps);
      tr[4 * t + 1] = gh * (stanton / eps) * dFilmOwn;
      tr[4 * t + 2] = -gh * film / wN;
      tr[4 * t + 3] = sig[m]! - gh * (film / wN) * dFilmOwn;
      const det = tr[4 * t]! * tr[4 * t + 3]! - tr[4 * t + 1]! * tr[4 * t + 2]!;
      if (!(Math.abs(det) > 0) || !Number.isFinite(det)) throw new ComputationError('fixed bed: the Newton matrix of a trace block is singular or not finite');
      const wT = y[base + m * P + 1 + N]!;
      const cOff = t * 2 * nb;
      const dOff = t * nb;
      for (let b = 0; b < nb; b++) {
        const dFilm = -(qRef[m]! * wT * dKappaAll[dOff + b]! * qRef[b]!) / c0[m]!;
        coupling[cOff + b] = -(stanton / eps) * dFilm; // J(u_T, w_b,N)
        coupling[cOff + nb + b] = (film / wN) * dFilm; // J(w_T,N, w_b,N)
      }
    }
  }
}
