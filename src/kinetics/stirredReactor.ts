/**
 * Stirred PAC contact reactor at steady state with a mean carbon age θ ≥ τ (recirculated PAC).
 *
 * Every particle sees the outlet concentration c_out; carbon leaves with the age distribution
 * E(t) = exp(−t/θ)/θ (a continuous stirred tank; θ = τ without recirculation). Balance of every
 * component (water residence τ, dose D of fresh carbon per volume of water):
 *   c0_i − c_out,i = D·∫₀^∞ q̄_i(t; c_out)·E(t) dt,
 * with q̄_i(t; c_out) the HSDM mean loading of a particle of age t held at c_out (film transfer
 * and reverse IAST at its surface; hsdmParticleSystem, `fixed` liquid). The age integral is one
 * more state per component, integrated to 40·θ (the weight beyond is below e⁻⁴⁰). Coupled
 * components: quasi-Newton on ln(c_out/c0) from a diagonal
 * Jacobian (single-solute Freundlich scaling) with Broyden updates (Broyden 1965, Math. Comp. 19:577), backtracking on the scaled residual; the particle
 * runs replay the step times of a run with error control, so the residual is smooth in c_out, and
 * the solve is repeated once with steps recorded at the solution. Trace targets
 * are linear given the background: c_out,T = c0_T/(1 + D·Φ_T), Φ_T = ∫q̄_T·E dt per unit c_out,T.
 * As θ grows the outlet tends to the batch IAST equilibrium at the same dose. Carbon held in the
 * reactor: D·θ/τ.
 *
 * Units: τ, θ s; D g/L; c mg/L; q mg/g.
 * @throws InputError for τ ≤ 0 or θ < τ; ComputationError when the balance does not close within
 *         1e-7 of c0 for every component (with the residual), or an integration fails.
 */
import { ComputationError, InputError } from '../core/errors.js';
import { integrateImplicit } from './implicitIntegrator.js';
import { hsdmParticleSystem } from './hsdmParticleSystem.js';
import { sphereCollocation } from './sphereCollocation.js';
import { denseLu } from './denseLu.js';
import type { PreparedKinetics } from './kineticMixture.js';
import { prepareMixture } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { DEFAULT_INTERIOR_POINTS, DEFAULT_KINETIC_RTOL, type KineticSolverOptions } from './pacBatch.js';

export interface StirredReactorResult {
  doseGPerL: number;
  contactTimeS: number;
  carbonAgeS: number;
  /** Outlet concentration of every component, mg/L. */
  cMgPerL: Float64Array;
  /** Age-weighted mean loading of the carbon leaving the reactor, mg/g. */
  qMeanMgPerG: Float64Array;
  /** Carbon held in the reactor, g/L of reactor volume (D·θ/τ). */
  carbonHeldGPerL: number;
  /** Newton iterations and particle integrations used. */
  iterations: number;
  integrations: number;
}

/** Tolerance of the outer balance, relative to c0 (ours). */
const BALANCE_TOL = 1e-7;

/** Checks a contact time and a carbon age (both positive, the age at least the contact time); throws InputError otherwise. */
export function checkContactConditions(contactTimeS: number, carbonAgeS: number): void {
  if (!(contactTimeS > 0) || !Number.isFinite(contactTimeS)) throw new InputError(`expected a positive contact time, got ${contactTimeS} s`, { option: '--contact-time' });
  if (!(carbonAgeS > 0) || !Number.isFinite(carbonAgeS)) throw new InputError(`expected a positive carbon age, got ${carbonAgeS} s`, { option: '--carbon-age' });
  if (carbonAgeS < contactTimeS * (1 - 1e-12)) throw new InputError(`the mean carbon age (${carbonAgeS} s) cannot be below the contact time (${contactTimeS} s); without recirculation it equals the contact time`, { option: '--carbon-age' });
}

export function stirredReactor(pk: PreparedKinetics, doseGPerL: number, contactTimeS: number, carbonAgeS: number = contactTimeS, options: KineticSolverOptions = {}): StirredReactorResult {
  return stirredReactorFrom(pk, doseGPerL, contactTimeS, carbonAgeS, options);
}

/**
 * The stirred reactor started from a given outlet of the coupled components (`startRemaining`,
 * c_out/c0 in the order of pk.coupled, e.g. the result at a nearby dose of a dose search); the
 * result does not depend on the start beyond the balance tolerance.
 */
export function stirredReactorFrom(pk: PreparedKinetics, doseGPerL: number, contactTimeS: number, carbonAgeS: number = contactTimeS, options: KineticSolverOptions = {}, startRemaining?: Float64Array): StirredReactorResult {
  if (!(doseGPerL > 0) || !Number.isFinite(doseGPerL)) throw new InputError(`expected a positive carbon dose, got ${doseGPerL * 1000} mg/L`, { option: '--dose' });
  checkContactConditions(contactTimeS, carbonAgeS);
  const theta = Math.max(carbonAgeS, contactTimeS);
  const col = sphereCollocation(options.interiorPoints ?? DEFAULT_INTERIOR_POINTS);
  // the age integral accumulates the per-step error over the whole run: a tenth of the batch
  // tolerance keeps it near 1e-5 of c0 (tests/kinetics, the linear closed form)
  const rtol = options.rtol ?? DEFAULT_KINETIC_RTOL / 10;
  const comps = pk.components;
  const m = comps.length;
  const nB = pk.coupled.length;
  const cFixed = Float64Array.from(comps, (c) => c.c0MgPerL);
  let integrations = 0;

  /** Age integrals of every block with the coupled components at c_out = c0·exp(v); `record`
   *  runs with error control and keeps its step times, otherwise the recorded steps are replayed
   *  (so that the residual is a smooth function of v for the quasi-Newton updates). */
  let stepTimes: number[] | undefined;
  const evaluate = (v: Float64Array, record: boolean) => {
    pk.coupled.forEach((i, p) => { cFixed[i] = comps[i]!.c0MgPerL * Math.exp(v[p]!); });
    const sys = hsdmParticleSystem(pk, doseGPerL, col, { kind: 'fixed', cMgPerL: cFixed, meanAgeS: theta });
    let run;
    if (!record && stepTimes) {
      try {
        run = integrateImplicit(sys, 0, sys.initialState(), [40 * theta], { stepTimes });
      } catch (e) {
        if (!(e instanceof ComputationError)) throw e; // the recorded steps do not suit v: record anew
      }
    }
    if (!run) {
      run = integrateImplicit(sys, 0, sys.initialState(), [40 * theta], { rtol, atol: rtol * 1e-3 });
      stepTimes = run.stepTimes;
    }
    integrations++;
    const y = run.states[0]!;
    const I = Float64Array.from(sys.blocks, (_i, b) => sys.ageIntegral(y, b));
    const G = new Float64Array(nB);
    for (let p = 0; p < nB; p++) {
      const c0 = comps[pk.coupled[p]!]!.c0MgPerL;
      G[p] = 1 - Math.exp(v[p]!) - (doseGPerL * I[p]!) / c0; // (c0 − c_out − D·∫q̄E)/c0
    }
    return { G, I, blocks: sys.blocks };
  };
  const normOf = (G: Float64Array) => G.reduce((s, g) => Math.max(s, Math.abs(g)), 0);

  // start: the outlet estimated from the batch IAST equilibrium at the same dose (the limit
  // θ → ∞), c_out ≈ c0 − F·(c0 − c_eq) with F the age-weighted approach of a linear particle
  // (startFraction); solve with the steps recorded at the start, then, when the solution is
  // more than 5 % away from where the steps were recorded, record there and solve again
  let v = startRemaining && startRemaining.length === nB && startRemaining.every((r) => r > 0 && r <= 1)
    ? Float64Array.from(startRemaining, (r) => Math.log(r))
    : startGuess(pk, doseGPerL, theta);
  let recordedAt = Float64Array.from(v);
  let iterations = 0;
  let J: Float64Array | undefined;
  let fdJacobian = false;
  let cur = evaluate(v, true);
  for (let round = 0; round < 2; round++) {
    if (round > 0) {
      if (!v.some((x, p) => Math.abs(x - recordedAt[p]!) > 0.05)) break;
      recordedAt = Float64Array.from(v);
      cur = evaluate(v, true);
    }
    let lastNorm = Infinity;
    while (normOf(cur.G) > BALANCE_TOL) {
      if (++iterations > 60) throw new ComputationError(`stirred reactor balance did not close in 60 iterations (largest residual ${normOf(cur.G).toExponential(2)} of c0)`);
      if (!J) {
        J = new Float64Array(nB * nB);
        if (!fdJacobian) {
          // diagonal start (ours): single-solute Freundlich scaling I_p ∝ c_out,p^β_p gives
          // ∂G_p/∂v_p ≈ −c_out,p/c0_p − β_p·D·I_p/c0_p; Broyden updates add the coupling
          for (let p = 0; p < nB; p++) {
            const comp = comps[pk.coupled[p]!]!;
            J[p * nB + p] = -Math.exp(v[p]!) - (comp.oneOverN * doseGPerL * cur.I[p]!) / comp.c0MgPerL;
          }
        } else {
          // forward differences over the replayed steps (smooth in v)
          for (let k = 0; k < nB; k++) {
            const h = 1e-6;
            const vp = Float64Array.from(v);
            vp[k] = vp[k]! + h;
            const Gp = evaluate(vp, false).G;
            for (let p = 0; p < nB; p++) J[p * nB + k] = (Gp[p]! - cur.G[p]!) / h;
          }
        }
      }
      const step = Float64Array.from(cur.G, (g) => -g);
      denseLu(Float64Array.from(J), nB, 'stirred reactor Newton step').solve(step);
      let lambda = 1;
      let accepted = false;
      for (let k = 0; k < 12 && !accepted; k++, lambda /= 2) {
        const vn = Float64Array.from(v, (x, p) => Math.min(0, x + lambda * step[p]!));
        const next = evaluate(vn, false);
        if (normOf(next.G) < normOf(cur.G)) {
          broyden(J, Float64Array.from(vn, (x, p) => x - v[p]!), next.G, cur.G);
          v = vn; cur = next; accepted = true;
        }
      }
      // no step helps while the balance already closes to the particle integration's own accuracy
      // (10 × rtol of c0): the residual left is integration noise, not an open balance
      if (!accepted && normOf(cur.G) <= 10 * rtol) break;
      if (!accepted || normOf(cur.G) > 0.5 * lastNorm) { J = undefined; fdJacobian = true; } // slow: difference Jacobian
      if (!accepted && lastNorm === Infinity && iterations > 2) {
        throw new ComputationError(`stirred reactor balance: no step reduces the residual (largest ${normOf(cur.G).toExponential(2)} of c0)`);
      }
      lastNorm = accepted ? normOf(cur.G) : lastNorm;
    }
  }
  const c = Float64Array.from(comps, (comp) => comp.c0MgPerL);
  const qMean = new Float64Array(m);
  cur.blocks.forEach((i, b) => {
    const c0 = comps[i]!.c0MgPerL;
    if (b < nB) {
      c[i] = c0 * Math.exp(v[b]!);
      qMean[i] = cur.I[b]!;
    } else {
      const phiT = cur.I[b]! / c0; // integrated at c_out,T = c0_T: Φ_T = I/c0
      c[i] = c0 / (1 + doseGPerL * phiT);
      qMean[i] = phiT * c[i]!;
    }
  });
  return { doseGPerL, contactTimeS, carbonAgeS: theta, cMgPerL: c, qMeanMgPerG: qMean, carbonHeldGPerL: (doseGPerL * theta) / contactTimeS, iterations, integrations };
}

/**
 * Starting outlet of the coupled components, as v = ln(c_out/c0) (ours): the batch IAST
 * equilibrium at the same dose c_eq, approached by the fraction F = 1 − (6/π²)·Σ 1/(n²(1 + n²π²·Ds·θ/R²))
 * of a linear particle at constant concentration averaged over exp(−t/θ)/θ (Crank 1975 eq. 6.20
 * weighted by the age distribution; the smallest Ds of the coupled components). Only a start.
 */
function startGuess(pk: PreparedKinetics, doseGPerL: number, thetaS: number): Float64Array {
  const comps = pk.coupled.map((i) => pk.components[i]!);
  const nB = comps.length;
  if (nB === 0) return new Float64Array(0);
  const R = pk.particle.radiusM;
  const ds = Math.min(...comps.map((c) => c.dsM2PerS!));
  const x = (Math.PI * Math.PI * ds * thetaS) / (R * R);
  let sum = 0;
  for (let n = 1; n <= 400; n++) sum += 1 / (n * n * (1 + n * n * x));
  const F = Math.min(1, Math.max(0, 1 - (6 / (Math.PI * Math.PI)) * sum));
  let eq: Float64Array;
  try {
    eq = solveBatchPrepared(prepareMixture(comps), doseGPerL).cMgPerL;
  } catch (e) {
    if (e instanceof ComputationError) return new Float64Array(nB).fill(Math.log(0.75));
    throw e;
  }
  return Float64Array.from(comps, (c, p) => {
    const ratio = 1 - F * (1 - eq[p]! / c.c0MgPerL);
    return Math.log(Math.min(1, Math.max(1e-6, ratio)));
  });
}

/** Broyden's rank-one update of J (row-major n×n) for the step s and residuals gNew, gOld. */
function broyden(J: Float64Array, s: Float64Array, gNew: Float64Array, gOld: Float64Array): void {
  const n = s.length;
  const ss = s.reduce((a, x) => a + x * x, 0);
  if (!(ss > 0)) return;
  for (let p = 0; p < n; p++) {
    let js = 0;
    for (let q = 0; q < n; q++) js += J[p * n + q]! * s[q]!;
    const dy = gNew[p]! - gOld[p]! - js;
    for (let q = 0; q < n; q++) J[p * n + q] = J[p * n + q]! + (dy * s[q]!) / ss;
  }
}
