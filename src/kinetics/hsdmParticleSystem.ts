/**
 * The homogeneous surface diffusion model (HSDM) of PAC particles for every component at once,
 * as a method-of-lines system for the implicit integrator (Crittenden & Weber 1978, J. Environ.
 * Eng. Div. 104; Hand, Crittenden & Thacker 1983, J. Environ. Eng. 109:82, from memory):
 *   ∂q_i/∂t = Ds_i·(1/r²)∂/∂r(r²∂q_i/∂r),  ∂q_i/∂r = 0 at r = 0,
 *   ρp·Ds_i·∂q_i/∂r = kf_i·(c_i − c_s,i) at r = R,  c_s from reverse IAST of the surface loadings.
 * Discretisation: orthogonal collocation in x = (r/R)² (sphereCollocation). Interior points obey
 * dq_ij/dt = (Ds_i/R²)·(B q_i)_j; the surface point closes the particle's mass balance,
 *   Σ_j w_j·dq_ij/dt = dq̄_i/dt = (3/(R·ρp))·kf_i·(c_i − c_s,i),
 * so the mean loading q̄ = Σ w_j q_j follows the film flux exactly and (batch) the liquid
 * c_i = c0_i − D·q̄_i keeps the mass balance to rounding at every time.
 * Liquid: `batch` (closed vessel, dose D) or `fixed` (every particle at a given concentration, the
 * stirred reactor); `fixed` adds the age states X_i = ∫₀ᵗ (q_eq,i − q̄_i(s))·exp(−s/θ)/θ ds, so that
 * ∫₀ᵗ q̄_i·E ds = q_eq,i·(1 − exp(−t/θ)) − X_i (q_eq,i the loading in equilibrium with the fixed
 * liquid when given, else 0); the deficit form keeps the age integral accurate relative to what is
 * still missing from equilibrium, which vanishes as θ grows.
 * Trace targets (kineticMixture) follow the background: c_s,T = κ_T(q_B)·q_T, so the Jacobian is
 * block lower-triangular: the background block is factorised densely, each target on its own.
 * States are scaled loadings y = q/(c0/D) (fraction of the component that the carbon could hold).
 *
 * Units: t s, q mg/g, c mg/L, D g/L, R m, ρp g/L, Ds m²/s, kf m/s.
 * The hot paths (rhs, factor, solve) allocate nothing: the Newton matrices live in one array; they
 * are module-level kernels (hsdmRhs, hsdmFactor, hsdmSolve) that take every array and scalar as
 * arguments.
 * Throws ComputationError (from the LU) when a Newton matrix is singular.
 */
import type { StiffSystem, NewtonSolve } from './implicitIntegrator.js';
import type { SphereCollocation } from './sphereCollocation.js';
import type { PreparedKinetics } from './kineticMixture.js';
import { reverseIast, traceKappa, traceSurfaceFactor, type ReverseIastState, type SurfaceIsotherms } from './reverseIast.js';
import { luFactorAt, luFactorLastRowAt, luSolveAt, luSolveBlocksAt, luSolveSharedBlocksAt } from './denseLu.js';

export type LiquidSpec =
  | { kind: 'batch' }
  /**
   * Every particle at `cMgPerL` (per component of the mixture); θ the mean carbon age, s.
   * `equilibriumMgPerG` (per component, optional): the loading in equilibrium with `cMgPerL`;
   * the age states then hold the deficit ∫(q_eq − q̄)·E dt, small when θ is long.
   */
  | { kind: 'fixed'; cMgPerL: Float64Array; meanAgeS: number; equilibriumMgPerG?: Float64Array };

export interface ParticleSystem extends StiffSystem {
  /** Component index (into the mixture) of each block: coupled first, then trace. */
  readonly blocks: readonly number[];
  /** Nodes per component (N + 1). */
  readonly nodes: number;
  /** Loading scale of each block, mg/g (y = q/scale). */
  readonly scale: Float64Array;
  /** Mean loading q̄ of block b from a state, mg/g. */
  meanLoading(y: Float64Array, b: number): number;
  /** Age-weighted mean loading ∫₀ᵗ q̄·E ds of block b at time t (fixed liquid only), mg/g. */
  ageIntegral(y: Float64Array, b: number, tS?: number): number;
  /** Initial state (clean carbon). */
  initialState(): Float64Array;
}

export function hsdmParticleSystem(pk: PreparedKinetics, doseGPerL: number, col: SphereCollocation, liquid: LiquidSpec): ParticleSystem {
  const blocks = [...pk.coupled, ...pk.trace];
  const nB = pk.coupled.length;
  const nBlocks = blocks.length;
  const M = col.interiorPoints + 1;
  const N = M - 1;
  const MM = M * M;
  const { radiusM: R, densityGPerL: rho } = pk.particle;
  const fixed = liquid.kind === 'fixed';
  const size = nBlocks * M + (fixed ? nBlocks : 0);
  const comps = blocks.map((i) => pk.components[i]!);
  const scale = Float64Array.from(comps, (c) => c.c0MgPerL / doseGPerL);
  const a = Float64Array.from(comps, (c) => c.dsM2PerS! / (R * R));
  const phi = Float64Array.from(blocks, (i) => (3 * pk.kfMPerS[i]!) / (R * rho)); // 3kf/(Rρp)
  const c0 = Float64Array.from(comps, (c) => c.c0MgPerL);
  const traceK = Float64Array.from(comps, (c) => c.K);
  const traceBeta = Float64Array.from(comps, (c) => c.oneOverN);
  const cFixed = fixed ? Float64Array.from(blocks, (i) => liquid.cMgPerL[i]!) : new Float64Array(nBlocks);
  const theta = fixed ? liquid.meanAgeS : 0;
  const qEqScaled = Float64Array.from(blocks, (i, b) => (fixed && liquid.equilibriumMgPerG ? liquid.equilibriumMgPerG[i]! / scale[b]! : 0));
  const B = col.laplacian;
  const w = col.weights;
  const dose = doseGPerL;
  // wB_l = Σ_(j<N) w_j B_jl: the interior part of the mean-loading rate
  const wB = new Float64Array(M);
  for (let l = 0; l < M; l++) { let s = 0; for (let j = 0; j < N; j++) s += w[j]! * B[j * M + l]!; wB[l] = s; }

  const qs = new Float64Array(nB);
  const cs = new Float64Array(nB);
  const jrev = new Float64Array(nB * nB);
  const dKappa = new Float64Array(nB);
  const surf: ReverseIastState = { psi: 0, total: 0 };
  // ln(β/K) of each block, computed once: for reverse IAST of the coupled blocks and so that κ_T
  // shares ln ψ_B over the trace blocks (traceKappa)
  const lnBetaOverK = Float64Array.from(comps, (c) => Math.log(c.oneOverN / c.K));
  const iso: SurfaceIsotherms = { K: traceK.slice(0, nB), beta: traceBeta.slice(0, nB), lnBetaOverK: lnBetaOverK.slice(0, nB) };

  const meanLoading = (y: Float64Array, b: number): number => meanScaledAt(y, w, b * M, M) * scale[b]!;

  const rhs = (t: number, y: Float64Array, dy: Float64Array): void => {
    const E = fixed ? Math.exp(-t / theta) / theta : 0;
    hsdmRhs(y, dy, E, iso, qs, cs, surf, scale, a, phi, c0, cFixed, qEqScaled, lnBetaOverK, traceBeta, B, w, M, nB, nBlocks, fixed, dose);
  };

  // Newton matrix (I − g·J): each component's own block A_p (diffusion, its liquid, its own surface
  // term) plus the coupling of the coupled components' surface rows through reverse IAST,
  // M = A + U·C·Vᵀ with U, V picking surface rows/nodes. Surface values z = Vᵀx solve the small
  // system (I + diag(S)·C)·z = Vᵀ·A⁻¹b with S_p = (A_p⁻¹)_NN; then x = A⁻¹b − A⁻¹U·(C·z).
  const lu = new Float64Array(nBlocks * MM);
  const piv = new Int32Array(nBlocks * M);
  const upperBest = new Float64Array(nBlocks * M);
  // shareable[b]: block b's diffusion rows may serve later blocks; shareable[nBlocks]: every
  // coupled block shares the first one's (luSolveSharedBlocksAt)
  const shareable = new Uint8Array(nBlocks + 1);
  const unitCols = new Float64Array(nB * M);
  const coupling = new Float64Array(nB * nB);
  const small = new Float64Array(nB * nB);
  const smallPiv = new Int32Array(nB);
  const traceCross = new Float64Array(Math.max(nBlocks - nB, 0) * nB);
  const zBuf = new Float64Array(nB);
  const czBuf = new Float64Array(nB);
  let gCur = 0;
  let eCur = 0;

  const solve: NewtonSolve = (x: Float64Array) => {
    hsdmSolve(x, gCur * eCur, lu, piv, shareable[nBlocks] === 1, small, smallPiv, coupling, unitCols, traceCross, zBuf, czBuf, w, M, nB, nBlocks, fixed);
  };

  const factor = (t: number, y: Float64Array, g: number): NewtonSolve => {
    gCur = g;
    eCur = fixed ? Math.exp(-t / theta) / theta : 0;
    hsdmFactor(y, g, iso, qs, cs, surf, jrev, dKappa, lu, piv, upperBest, shareable, small, smallPiv, coupling, unitCols, traceCross, scale, a, phi, traceK, traceBeta, B, w, wB, M, nB, nBlocks, fixed ? 0 : dose);
    return solve;
  };

  return {
    size,
    what: fixed ? 'PAC particle at a fixed liquid concentration (HSDM)' : 'PAC batch contact (HSDM)',
    rhs,
    factor,
    blocks,
    nodes: M,
    scale,
    meanLoading,
    ageIntegral: (y, b, tS = Infinity) => (qEqScaled[b]! * (fixed ? -Math.expm1(-tS / theta) : 0) - y[nBlocks * M + b]!) * scale[b]!,
    initialState: () => new Float64Array(size),
  };
}

/** Scaled mean loading Σ_j w_j·y[off + j] over the M nodes of one block. */
function meanScaledAt(y: Float64Array, w: Float64Array, off: number, M: number): number {
  let s = 0;
  for (let j = 0; j < M; j++) s += w[j]! * y[off + j]!;
  return s;
}

/**
 * The right-hand side of hsdmParticleSystem into dy: the surface concentrations (reverse IAST of
 * the coupled blocks' surface loadings, κ_T·q_T for the trace blocks), then per block the interior
 * rows (Ds/R²)·(B y)_j, the surface row closing the mass balance with the film flux, and (fixed
 * liquid, E = exp(−t/θ)/θ) the age rows. A function of its arguments only, so that the compiler
 * keeps them in registers across the loops.
 */
function hsdmRhs(y: Float64Array, dy: Float64Array, E: number, iso: SurfaceIsotherms, qs: Float64Array, cs: Float64Array, surf: ReverseIastState, scale: Float64Array, a: Float64Array, phi: Float64Array, c0: Float64Array, cFixed: Float64Array, qEqScaled: Float64Array, lnBetaOverK: Float64Array, traceBeta: Float64Array, B: Float64Array, w: Float64Array, M: number, nB: number, nBlocks: number, fixed: boolean, dose: number): void {
  const N = M - 1;
  const wN = w[N]!;
  for (let b = 0; b < nB; b++) qs[b] = y[b * M + N]! * scale[b]!;
  reverseIast(iso, qs, cs, undefined, surf);
  // κ_T needs a loaded background (traceSurfaceFactor): zero otherwise
  const psi = surf.psi, total = surf.total;
  const loaded = total > 0 && psi > 0;
  const lnPsi = loaded && nBlocks > nB ? Math.log(psi) : 0;
  for (let b = 0; b < nBlocks; b++) {
    const off = b * M;
    const s = scale[b]!;
    const ab = a[b]!;
    let csb: number;
    if (b < nB) csb = cs[b]!;
    else {
      const qN = y[off + N]! * s;
      csb = (loaded ? traceKappa(lnBetaOverK[b]!, traceBeta[b]!, lnPsi, total) : 0) * (qN > 0 ? qN : 0);
    }
    const mean = meanScaledAt(y, w, off, M);
    const c = fixed ? cFixed[b]! : c0[b]! - dose * mean * s;
    const flux = phi[b]! * (c - csb);
    // interior rows, four at a time (independent sums, each in the order of l)
    let interior = 0;
    let j = 0;
    for (; j + 3 < N; j += 4) {
      let lap0 = 0, lap1 = 0, lap2 = 0, lap3 = 0;
      const r0 = j * M, r1 = r0 + M, r2 = r1 + M, r3 = r2 + M;
      for (let l = 0; l < M; l++) {
        const yl = y[off + l]!;
        lap0 += B[r0 + l]! * yl;
        lap1 += B[r1 + l]! * yl;
        lap2 += B[r2 + l]! * yl;
        lap3 += B[r3 + l]! * yl;
      }
      const d0 = ab * lap0, d1 = ab * lap1, d2 = ab * lap2, d3 = ab * lap3;
      interior += w[j]! * d0;
      interior += w[j + 1]! * d1;
      interior += w[j + 2]! * d2;
      interior += w[j + 3]! * d3;
      dy[off + j] = d0; dy[off + j + 1] = d1; dy[off + j + 2] = d2; dy[off + j + 3] = d3;
    }
    for (; j < N; j++) {
      let lap = 0;
      const row = j * M;
      for (let l = 0; l < M; l++) lap += B[row + l]! * y[off + l]!;
      const r = ab * lap;
      interior += w[j]! * r;
      dy[off + j] = r;
    }
    dy[off + N] = (flux / s - interior) / wN;
    if (fixed) dy[nBlocks * M + b] = (qEqScaled[b]! - mean) * E;
  }
}

/**
 * The Newton matrix (I − g·J) of hsdmParticleSystem at y, factorised: reverse IAST of the coupled
 * blocks' surface loadings with its Jacobian (`jrev`), then every block's own matrix
 * (diffusion, the batch liquid through φ·D with D = `liquidDoseGPerL`, 0 for a fixed liquid, and its own surface
 * term) LU-factorised in `lu`/`piv`; the coupled blocks' surface coupling through the reverse-IAST
 * Jacobian `jrev` (`coupling`, the columns A_p⁻¹·e_N in `unitCols`, and the small surface system
 * in `small`/`smallPiv`); each trace block's dependence on the background's surface nodes
 * (`traceCross`, from ∂κ_T/∂q into `dKappa`). Blocks differ only in their surface row where
 * their Ds is the same (the diffusion rows are I − g·(Ds/R²)·B): such a block takes the
 * factorised diffusion rows of the first block with its Ds and eliminates only its surface row
 * (luFactorLastRowAt, bit for bit luFactorAt's factorisation; `upperBest`, `shareable` per block);
 * where every coupled block shares the first one's, hsdmSolve reads them once (luSolveSharedBlocksAt).
 * @throws ComputationError when a block is singular or not finite
 */
function hsdmFactor(y: Float64Array, g: number, iso: SurfaceIsotherms, qs: Float64Array, cs: Float64Array, surf: ReverseIastState, jrev: Float64Array, dKappa: Float64Array, lu: Float64Array, piv: Int32Array, upperBest: Float64Array, shareable: Uint8Array, small: Float64Array, smallPiv: Int32Array, coupling: Float64Array, unitCols: Float64Array, traceCross: Float64Array, scale: Float64Array, a: Float64Array, phi: Float64Array, traceK: Float64Array, traceBeta: Float64Array, B: Float64Array, w: Float64Array, wB: Float64Array, M: number, nB: number, nBlocks: number, liquidDoseGPerL: number): void {
  const N = M - 1;
  const MM = M * M;
  const wN = w[N]!;
  for (let b = 0; b < nB; b++) qs[b] = y[b * M + N]! * scale[b]!;
  reverseIast(iso, qs, cs, jrev, surf);
  let coupledShared = nB > 1;
  for (let b = 0; b < nBlocks; b++) {
    const off = b * MM;
    const liq = phi[b]! * liquidDoseGPerL;
    let own: number; // the own surface term of the surface row's diagonal
    if (b < nB) {
      own = g * phi[b]! * jrev[b * nB + b]! / wN;
      for (let k = 0; k < nB; k++) {
        coupling[b * nB + k] = k === b ? 0 : g * phi[b]! * jrev[b * nB + k]! / wN * scale[k]! / scale[b]!;
      }
    } else {
      const kappa = traceSurfaceFactor(traceK[b]!, traceBeta[b]!, surf, iso.beta, dKappa);
      own = g * phi[b]! * kappa / wN;
      const qT = Math.max(y[b * M + N]! * scale[b]!, 0);
      // g·J_y[(b,N),(k,N)] for the background surface nodes k
      const cOff = (b - nB) * nB;
      for (let k = 0; k < nB; k++) traceCross[cOff + k] = g * (-phi[b]! * qT * dKappa[k]! / wN) * scale[k]! / scale[b]!;
    }
    let src = -1;
    for (let e = 0; e < b && src < 0; e++) if (shareable[e] === 1 && a[e] === a[b]) src = e;
    let factored = false;
    if (src >= 0) {
      lu.copyWithin(off, src * MM, src * MM + N * M);
      piv.copyWithin(b * M, src * M, src * M + N);
      fillOwnBlock(lu, off, g, a[b]!, liq, B, w, wB, M, N);
      lu[off + N * M + N] = lu[off + N * M + N]! + own;
      factored = luFactorLastRowAt(lu, off, M, piv, b * M, upperBest, src * M, 'HSDM Newton matrix');
    }
    shareable[b] = 0;
    if (b > 0 && b < nB && !(factored && src === 0)) coupledShared = false;
    if (!factored) {
      fillOwnBlock(lu, off, g, a[b]!, liq, B, w, wB, M, 0);
      lu[off + N * M + N] = lu[off + N * M + N]! + own;
      luFactorAt(lu, off, M, piv, b * M, 'HSDM Newton matrix', upperBest, b * M);
      let lastRowPivot = false;
      for (let k = 0; k < N; k++) if (piv[b * M + k] === N) lastRowPivot = true;
      shareable[b] = lastRowPivot ? 0 : 1;
    }
  }
  shareable[nBlocks] = coupledShared ? 1 : 0;
  if (nB > 1) {
    unitCols.fill(0);
    for (let p = 0; p < nB; p++) unitCols[p * M + N] = 1;
    if (coupledShared) luSolveSharedBlocksAt(lu, 0, M, piv, 0, unitCols, 0, nB);
    else luSolveBlocksAt(lu, 0, M, piv, 0, unitCols, 0, nB);
    for (let p = 0; p < nB; p++) {
      for (let k = 0; k < nB; k++) small[p * nB + k] = (p === k ? 1 : 0) + unitCols[p * M + N]! * coupling[p * nB + k]!;
    }
    luFactorAt(small, 0, nB, smallPiv, 0, 'HSDM surface coupling');
  }
}

/**
 * I − g·J for one block's own rows from row `fromRow` on into mat[off …]: diffusion (a = Ds/R²)
 * and, through `liq` = φ·D (0 for a fixed liquid), the batch liquid's dependence on q̄ in the
 * surface row.
 */
function fillOwnBlock(mat: Float64Array, off: number, g: number, ab: number, liq: number, B: Float64Array, w: Float64Array, wB: Float64Array, M: number, fromRow: number): void {
  const N = M - 1;
  const wN = w[N]!;
  for (let j = fromRow; j < M; j++) {
    for (let l = 0; l < M; l++) {
      const jq = j < N ? ab * B[j * M + l]! : (-liq * w[l]! - ab * wB[l]!) / wN;
      mat[off + j * M + l] = (j === l ? 1 : 0) - g * jq;
    }
  }
}

/**
 * Solve (I − g·J)·x = b in place with the factorisation of hsdmFactor: the coupled blocks
 * (A⁻¹b, then the surface values through the small system and the correction −A⁻¹U·(C·z)), then
 * each trace block with its background surface terms, then (fixed liquid, gE = g·E) the age rows.
 */
function hsdmSolve(x: Float64Array, gE: number, lu: Float64Array, piv: Int32Array, coupledShared: boolean, small: Float64Array, smallPiv: Int32Array, coupling: Float64Array, unitCols: Float64Array, traceCross: Float64Array, zBuf: Float64Array, czBuf: Float64Array, w: Float64Array, M: number, nB: number, nBlocks: number, fixed: boolean): void {
  const N = M - 1;
  const MM = M * M;
  if (coupledShared) luSolveSharedBlocksAt(lu, 0, M, piv, 0, x, 0, nB);
  else luSolveBlocksAt(lu, 0, M, piv, 0, x, 0, nB);
  if (nB > 1) {
    for (let p = 0; p < nB; p++) zBuf[p] = x[p * M + N]!;
    luSolveAt(small, 0, nB, smallPiv, 0, zBuf, 0);
    for (let p = 0; p < nB; p++) {
      let s = 0;
      for (let k = 0; k < nB; k++) s += coupling[p * nB + k]! * zBuf[k]!;
      czBuf[p] = s;
    }
    for (let p = 0; p < nB; p++) {
      const cz = czBuf[p]!;
      if (cz !== 0) for (let l = 0; l < M; l++) x[p * M + l] = x[p * M + l]! - unitCols[p * M + l]! * cz;
    }
  }
  for (let b = nB; b < nBlocks; b++) {
    const cOff = (b - nB) * nB;
    let add = 0;
    for (let k = 0; k < nB; k++) add += traceCross[cOff + k]! * x[k * M + N]!;
    x[b * M + N] = x[b * M + N]! + add;
  }
  if (nBlocks > nB) luSolveBlocksAt(lu, nB * MM, M, piv, nB * M, x, nB * M, nBlocks - nB);
  if (fixed) {
    // age rows: X_b' = (q_eq − q̄_b)·E, so x_X = b_X − g·E·Σ w_l x_l
    for (let b = 0; b < nBlocks; b++) x[nBlocks * M + b] = x[nBlocks * M + b]! - gE * meanScaledAt(x, w, b * M, M);
  }
}
