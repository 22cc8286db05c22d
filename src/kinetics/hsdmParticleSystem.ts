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
 * stirred reactor); `fixed` adds I_i = ∫₀ᵗ q̄_i(s)·exp(−s/θ)/θ ds, the age-weighted mean loading.
 * Trace targets (kineticMixture) follow the background: c_s,T = κ_T(q_B)·q_T, so the Jacobian is
 * block lower-triangular: the background block is factorised densely, each target on its own.
 * States are scaled loadings y = q/(c0/D) (fraction of the component that the carbon could hold).
 *
 * Units: t s, q mg/g, c mg/L, D g/L, R m, ρp g/L, Ds m²/s, kf m/s.
 * Throws ComputationError (from the LU) when a Newton matrix is singular.
 */
import type { StiffSystem, NewtonSolve } from './implicitIntegrator.js';
import type { SphereCollocation } from './sphereCollocation.js';
import type { PreparedKinetics } from './kineticMixture.js';
import { reverseIast, traceSurfaceFactor, type SurfaceIsotherms } from './reverseIast.js';
import { denseLu } from './denseLu.js';

export type LiquidSpec =
  | { kind: 'batch' }
  /** Every particle at `cMgPerL` (per component of the mixture); θ the mean carbon age, s. */
  | { kind: 'fixed'; cMgPerL: Float64Array; meanAgeS: number };

export interface ParticleSystem extends StiffSystem {
  /** Component index (into the mixture) of each block: coupled first, then trace. */
  readonly blocks: readonly number[];
  /** Nodes per component (N + 1). */
  readonly nodes: number;
  /** Loading scale of each block, mg/g (y = q/scale). */
  readonly scale: Float64Array;
  /** Mean loading q̄ of block b from a state, mg/g. */
  meanLoading(y: Float64Array, b: number): number;
  /** Age-weighted mean loading ∫q̄·E dt of block b (fixed liquid only), mg/g. */
  ageIntegral(y: Float64Array, b: number): number;
  /** Initial state (clean carbon). */
  initialState(): Float64Array;
}

export function hsdmParticleSystem(pk: PreparedKinetics, doseGPerL: number, col: SphereCollocation, liquid: LiquidSpec): ParticleSystem {
  const blocks = [...pk.coupled, ...pk.trace];
  const nB = pk.coupled.length;
  const nBlocks = blocks.length;
  const M = col.interiorPoints + 1;
  const N = M - 1;
  const { radiusM: R, densityGPerL: rho } = pk.particle;
  const fixed = liquid.kind === 'fixed';
  const size = nBlocks * M + (fixed ? nBlocks : 0);
  const comps = blocks.map((i) => pk.components[i]!);
  const scale = Float64Array.from(comps, (c) => c.c0MgPerL / doseGPerL);
  const a = Float64Array.from(comps, (c) => c.dsM2PerS! / (R * R));
  const phi = Float64Array.from(blocks, (i) => (3 * pk.kfMPerS[i]!) / (R * rho)); // 3kf/(Rρp)
  const c0 = Float64Array.from(comps, (c) => c.c0MgPerL);
  const cFixed = fixed ? Float64Array.from(blocks, (i) => liquid.cMgPerL[i]!) : undefined;
  const theta = fixed ? liquid.meanAgeS : 0;
  const iso: SurfaceIsotherms = { K: Float64Array.from(comps.slice(0, nB), (c) => c.K), beta: Float64Array.from(comps.slice(0, nB), (c) => c.oneOverN) };
  const B = col.laplacian;
  const w = col.weights;
  const wN = w[N]!;
  // wB_l = Σ_(j<N) w_j B_jl: the interior part of the mean-loading rate
  const wB = new Float64Array(M);
  for (let l = 0; l < M; l++) { let s = 0; for (let j = 0; j < N; j++) s += w[j]! * B[j * M + l]!; wB[l] = s; }

  const qs = new Float64Array(nB);
  const cs = new Float64Array(nB);
  const jrev = new Float64Array(nB * nB);
  const dKappa = new Float64Array(nB);
  const q = new Float64Array(M);

  const meanLoading = (y: Float64Array, b: number): number => {
    let s = 0;
    for (let j = 0; j < M; j++) s += w[j]! * y[b * M + j]!;
    return s * scale[b]!;
  };
  const liquidC = (y: Float64Array, b: number): number => (fixed ? cFixed![b]! : c0[b]! - doseGPerL * meanLoading(y, b));

  const rhs = (t: number, y: Float64Array, dy: Float64Array): void => {
    for (let b = 0; b < nB; b++) qs[b] = y[b * M + N]! * scale[b]!;
    const state = reverseIast(iso, qs, cs);
    const E = fixed ? Math.exp(-t / theta) / theta : 0;
    for (let b = 0; b < nBlocks; b++) {
      const off = b * M;
      const s = scale[b]!;
      for (let j = 0; j < M; j++) q[j] = y[off + j]! * s;
      let csb: number;
      if (b < nB) csb = cs[b]!;
      else {
        const c = comps[b]!;
        csb = traceSurfaceFactor(c.K, c.oneOverN, state, iso.beta) * Math.max(q[N]!, 0);
      }
      const flux = phi[b]! * (liquidC(y, b) - csb);
      let interior = 0;
      for (let j = 0; j < N; j++) {
        let lap = 0;
        for (let l = 0; l < M; l++) lap += B[j * M + l]! * q[l]!;
        const r = a[b]! * lap;
        interior += w[j]! * r;
        dy[off + j] = r / s;
      }
      dy[off + N] = (flux - interior) / wN / s;
      if (fixed) dy[nBlocks * M + b] = (meanLoading(y, b) * E) / s;
    }
  };

  // Newton matrix (I − g·J): each component's own block A_p (diffusion, its liquid, its own surface
  // term) plus the coupling of the coupled components' surface rows through reverse IAST,
  // M = A + U·C·Vᵀ with U, V picking surface rows/nodes. Surface values z = Vᵀx solve the small
  // system (I + diag(S)·C)·z = Vᵀ·A⁻¹b with S_p = (A_p⁻¹)_NN; then x = A⁻¹b − A⁻¹U·(C·z).
  const ownMats = Array.from({ length: nBlocks }, () => new Float64Array(M * M));
  const unitCols = Array.from({ length: nB }, () => new Float64Array(M));
  const coupling = new Float64Array(nB * nB);
  const small = new Float64Array(nB * nB);
  const zBuf = new Float64Array(nB);
  const czBuf = new Float64Array(nB);
  const factor = (t: number, y: Float64Array, g: number): NewtonSolve => {
    for (let b = 0; b < nB; b++) qs[b] = y[b * M + N]! * scale[b]!;
    const state = reverseIast(iso, qs, cs, jrev);
    const E = fixed ? Math.exp(-t / theta) / theta : 0;
    const lus: ReturnType<typeof denseLu>[] = [];
    const traceCross: Float64Array[] = [];
    for (let b = 0; b < nBlocks; b++) {
      const A = ownMats[b]!;
      fillOwnBlock(A, M, 0, b, g);
      if (b < nB) {
        A[N * M + N] = A[N * M + N]! + g * phi[b]! * jrev[b * nB + b]! / wN; // own surface term
        for (let k = 0; k < nB; k++) {
          coupling[b * nB + k] = k === b ? 0 : g * phi[b]! * jrev[b * nB + k]! / wN * scale[k]! / scale[b]!;
        }
      } else {
        const c = comps[b]!;
        const kappa = traceSurfaceFactor(c.K, c.oneOverN, state, iso.beta, dKappa);
        A[N * M + N] = A[N * M + N]! + g * phi[b]! * kappa / wN;
        const qT = Math.max(y[b * M + N]! * scale[b]!, 0);
        // g·J_y[(b,N),(k,N)] for the background surface nodes k
        traceCross.push(Float64Array.from(dKappa, (dk, k) => g * (-phi[b]! * qT * dk / wN) * scale[k]! / scale[b]!));
      }
      lus.push(denseLu(A, M, 'HSDM Newton matrix'));
    }
    let smallLu: ReturnType<typeof denseLu> | undefined;
    if (nB > 1) {
      for (let p = 0; p < nB; p++) {
        const u = unitCols[p]!;
        u.fill(0); u[N] = 1;
        lus[p]!.solve(u);
        for (let k = 0; k < nB; k++) small[p * nB + k] = (p === k ? 1 : 0) + u[N]! * coupling[p * nB + k]!;
      }
      smallLu = denseLu(small, nB, 'HSDM surface coupling');
    }
    return (x: Float64Array) => {
      for (let b = 0; b < nB; b++) lus[b]!.solve(x, b * M);
      if (smallLu) {
        for (let p = 0; p < nB; p++) zBuf[p] = x[p * M + N]!;
        smallLu.solve(zBuf);
        for (let p = 0; p < nB; p++) {
          let s = 0;
          for (let k = 0; k < nB; k++) s += coupling[p * nB + k]! * zBuf[k]!;
          czBuf[p] = s;
        }
        for (let p = 0; p < nB; p++) {
          const u = unitCols[p]!;
          const cz = czBuf[p]!;
          if (cz !== 0) for (let l = 0; l < M; l++) x[p * M + l] = x[p * M + l]! - u[l]! * cz;
        }
      }
      for (let b = nB; b < nBlocks; b++) {
        const cross = traceCross[b - nB]!;
        let add = 0;
        for (let k = 0; k < nB; k++) add += cross[k]! * x[k * M + N]!;
        x[b * M + N] = x[b * M + N]! + add;
        lus[b]!.solve(x, b * M);
      }
      if (fixed) {
        for (let b = 0; b < nBlocks; b++) {
          let s = 0;
          for (let l = 0; l < M; l++) s += w[l]! * x[b * M + l]!;
          x[nBlocks * M + b] = x[nBlocks * M + b]! + g * E * s;
        }
      }
    };
  };

  /** I − g·J for the block's own rows: diffusion and (batch) the liquid's dependence on q̄. */
  function fillOwnBlock(mat: Float64Array, ld: number, off: number, b: number, g: number): void {
    const ab = a[b]!;
    for (let j = 0; j < M; j++) {
      for (let l = 0; l < M; l++) {
        let jq: number;
        if (j < N) jq = ab * B[j * M + l]!;
        else jq = (-(fixed ? 0 : phi[b]! * doseGPerL * w[l]!) - ab * wB[l]!) / wN;
        mat[(off + j) * ld + off + l] = (j === l ? 1 : 0) - g * jq;
      }
    }
  }

  return {
    size,
    what: fixed ? 'PAC particle at a fixed liquid concentration (HSDM)' : 'PAC batch contact (HSDM)',
    rhs,
    factor,
    blocks,
    nodes: M,
    scale,
    meanLoading,
    ageIntegral: (y, b) => y[nBlocks * M + b]! * scale[b]!,
    initialState: () => new Float64Array(size),
  };
}
