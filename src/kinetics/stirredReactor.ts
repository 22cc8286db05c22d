/**
 * Stirred PAC contact reactor at steady state with a mean carbon age θ ≥ τ (recirculated PAC).
 *
 * Every particle sees the outlet concentration c_out; carbon leaves with the age distribution
 * E(t) = exp(−t/θ)/θ (a continuous stirred tank; θ = τ without recirculation). Balance of every
 * component (water residence τ, dose D of fresh carbon per volume of water):
 *   c0_i − c_out,i = D·∫₀^∞ q̄_i(t; c_out)·E(t) dt,
 * with q̄_i(t; c_out) the HSDM mean loading of a particle of age t held at c_out (film transfer
 * and reverse IAST at its surface; hsdmParticleSystem, `fixed` liquid). The age integral is
 * written ∫q̄E dt = q_eq(c_out) − ∫(q_eq − q̄)E dt, q_eq from the direct IAST at c_out
 * (src/equilibrium/iastDirect.ts), and the deficit is one more state per component, integrated
 * in logarithmic time to 40·θ (the weight beyond is below e⁻⁴⁰): as θ grows the deficit vanishes
 * and the outlet tends to the batch IAST equilibrium at the same dose to the accuracy of that
 * solver, not of the time integration.
 * Coupled components: quasi-Newton on v = ln(c_out/c0) with Broyden updates (Broyden 1965, Math.
 * Comp. 19:577) and backtracking on the scaled residual. It is solved first on a coarse particle
 * grid (a fifth of the requested grid's points, at least 2; rtol 3e-4; cheap), whose outlet and
 * Jacobian start the solve on the requested grid (ours: the Jacobian hardly depends on the grid).
 * The coarse solve integrates with error control at its start, its replays refactorise the
 * Newton matrix at every step, and it takes its first Newton step from the equilibrium Jacobian
 * (ours): each component's age integral taken as its uptake fraction I_i/q_eq,i at the start times
 * q_eq,i(c_out) of the direct IAST, so ∂G_i/∂v_k = −δ_ik·e^v_i − (D/c0_i)·(I_i/q_eq,i)·∂q_eq,i/∂v_k
 * (no particle integration); later steps use Broyden updates, or forward differences over the
 * replayed steps where those are slow. The particle runs replay the steps of a run with error
 * control taken with every component at its feed concentration (the same steps for every dose,
 * so the outlet is smooth in the dose), so the residual is smooth in v; the last Newton step goes
 * past the tolerance, so that the answer hardly depends on the path of the iterations (ours): the
 * step that the last one's fall predicts to close the balance is final where it lands within a
 * quarter of the tolerance (CLOSING_FRACTION), else one more step follows once the balance closes
 * (quadratic: far below it). Trace targets are linear given the background:
 * c_out,T = c0_T/(1 + D·Φ_T), Φ_T = ∫q̄_T·E dt per unit c_out,T, one run at the solution: the run
 * of that last Newton step, which integrates every block (the trace targets too) on the same
 * steps. A warm start from a solved dose is carried to this dose by predictOutlet, with a second
 * solved dose correcting the slope along the curve of solutions.
 * Carbon held in the reactor: D·θ/τ.
 *
 * The particle grid: `options.interiorPoints`, else 8 to 24 interior points from the shortest
 * penetration Ds·θ/R² of the components (stirredGridPoints: more points for young carbon); the
 * integration's rtol: `options.rtol`, else a hundredth of the batch's.
 *
 * Units: τ, θ s; D g/L; c mg/L; q mg/g.
 * @throws InputError for τ ≤ 0 or θ < τ; ComputationError when the balance does not close within
 *         1e-7 of c0 for every component (with the residual), or an integration fails.
 */
import { ComputationError, InputError } from '../core/errors.js';
import { integrateBdf } from './bdfIntegrator.js';
import { hsdmParticleSystem, type ParticleSystem } from './hsdmParticleSystem.js';
import { logTime, logTimeSystem, particleTimeScale } from './logTimeSystem.js';
import { sphereCollocation, type SphereCollocation } from './sphereCollocation.js';
import { denseLu } from './denseLu.js';
import type { PreparedKinetics } from './kineticMixture.js';
import { prepareMixture } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { directIastPrepared } from '../equilibrium/iastDirect.js';
import { traceSurfaceFactor } from './reverseIast.js';
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
  /** ∂G/∂ln(c_out/c0) of the balance at the solution (coupled components, row-major), a start for a nearby solve. */
  balanceJacobian?: Float64Array;
}

/** Default rtol of the stirred reactor's particle integration: a hundredth of the batch's (ours; see stirredReactorFrom). */
export const STIRRED_DEFAULT_RTOL = DEFAULT_KINETIC_RTOL / 100;

/** Tolerance of the outer balance, relative to c0 (ours). */
const BALANCE_TOL = 1e-7;

/**
 * The final run closes the balance within this fraction of BALANCE_TOL (ours): 2.5e-8 of c0, by
 * which the answer may then depend on the path of the iterations, far below the 5e-7 in c/c0 to
 * which the dose searches meet a goal (see the file comment).
 */
const CLOSING_FRACTION = 0.25;

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
 * c_out/c0 in the order of pk.coupled, e.g. the result at a nearby dose of a dose search) and,
 * when given, the balance Jacobian of that result (`startJacobian`, StirredReactorResult.
 * balanceJacobian): the coarse-grid start is then skipped. With the dose of that result
 * (`startDoseGPerL`) the start is first carried to this dose (predictOutlet). The result does not
 * depend on the start beyond the balance tolerance.
 */
export function stirredReactorFrom(pk: PreparedKinetics, doseGPerL: number, contactTimeS: number, carbonAgeS: number = contactTimeS, options: KineticSolverOptions = {}, startRemaining?: Float64Array, startJacobian?: Float64Array, startDoseGPerL?: number, secondStart?: SolvedOutlet): StirredReactorResult {
  if (!(doseGPerL > 0) || !Number.isFinite(doseGPerL)) throw new InputError(`expected a positive carbon dose, got ${doseGPerL * 1000} mg/L`, { option: '--dose' });
  checkContactConditions(contactTimeS, carbonAgeS);
  const theta = Math.max(carbonAgeS, contactTimeS);
  const interior = options.interiorPoints ?? stirredGridPoints(pk, theta);
  // the age integral sums the errors of a long run, and a dose search compares solves started
  // from different outlets: a hundredth of the batch tolerance keeps c/c0 within ContactRemoval's
  // removalTolerance (1e-6) of the same grid integrated to rtol 1e-8 on the test waters (a tenth
  // was measured up to 8e-6 from it in one, a hundredth within 3e-7: tests/kinetics/
  // stirredShortAge.test.ts; see ContactRemoval.removalTolerance for where it does not hold)
  const rtol = options.rtol ?? STIRRED_DEFAULT_RTOL;
  const comps = pk.components;
  const m = comps.length;
  const nB = pk.coupled.length;
  const balance = new BalanceSolver(pk, doseGPerL, theta, rtol);
  const warm = !!startRemaining && startRemaining.length === nB && startRemaining.every((r) => r > 0 && r <= 1);
  let v = warm ? Float64Array.from(startRemaining!, (r) => Math.log(r)) : startGuess(pk, doseGPerL, theta);
  let J: Float64Array | undefined = warm && startJacobian && startJacobian.length === nB * nB && startJacobian.every(Number.isFinite) ? Float64Array.from(startJacobian) : undefined;
  if (J && startDoseGPerL !== undefined && startDoseGPerL > 0 && startDoseGPerL !== doseGPerL) {
    const second = secondStart && secondStart.dose > 0 && secondStart.dose !== startDoseGPerL && secondStart.remaining.length === nB && secondStart.remaining.every((r) => r > 0 && r <= 1)
      ? { v: Float64Array.from(secondStart.remaining, (r) => Math.log(r)), dose: secondStart.dose } : undefined;
    ({ v, J } = predictOutlet(v, J, startDoseGPerL, doseGPerL, second));
  }
  // the steps of the requested grid are pinned with every component at its feed concentration
  // (v = 0), the same for every dose: error-controlled step sequences react to the smallest change
  // of their input through discrete decisions (rejected steps, order changes, a kept Newton
  // matrix), so steps pinned at a dose-dependent start would make the outlet jump between doses
  // 1e-12 apart, and a dose search would land on such a jump
  const pinAt = new Float64Array(nB);
  const coarsePoints = Math.max(COARSE_POINTS, Math.round(interior / 5));
  if (nB > 0 && interior > coarsePoints && !J) {
    try {
      // only a start: its steps pinned at the start itself, whose run is the first evaluation
      const coarseBalance = new BalanceSolver(pk, doseGPerL, theta, COARSE_RTOL, true);
      const coarse = coarseBalance.solve(sphereCollocation(coarsePoints), v, undefined, COARSE_TOL, false, v, false, { pinAtStart: true, equilibriumStart: true });
      balance.iterations += coarseBalance.iterations;
      balance.integrations += coarseBalance.integrations;
      v = coarse.v;
      J = coarse.J;
    } catch (e) {
      if (!(e instanceof ComputationError)) throw e; // only a start: solve on the requested grid alone
    }
  }
  // the polishing step runs every block (the trace targets too), so that it is also the final run
  const fine = nB > 0 ? balance.solve(sphereCollocation(interior), v, J, BALANCE_TOL, false, pinAt, true) : undefined;
  if (fine) v = fine.v;
  // the trace targets (linear given the background): one run of everything at the solution
  const fin = fine?.all ?? balance.evaluate(sphereCollocation(interior), v, fine ? 'replay-all' : 'pin');
  const c = Float64Array.from(comps, (comp) => comp.c0MgPerL);
  const qMean = new Float64Array(m);
  fin.blocks.forEach((i, b) => {
    const c0 = comps[i]!.c0MgPerL;
    if (b < nB) {
      c[i] = c0 * Math.exp(v[b]!);
      qMean[i] = fin.I[b]!;
    } else {
      const phiT = fin.I[b]! / c0; // integrated at c_out,T = c0_T: Φ_T = I/c0
      c[i] = c0 / (1 + doseGPerL * phiT);
      qMean[i] = phiT * c[i]!;
    }
  });
  return { doseGPerL, contactTimeS, carbonAgeS: theta, cMgPerL: c, qMeanMgPerG: qMean, carbonHeldGPerL: (doseGPerL * theta) / contactTimeS, iterations: balance.iterations, integrations: balance.integrations, ...(fine ? { balanceJacobian: fine.J } : {}) };
}

/**
 * Interior points of the stirred reactor's default particle grid (ours), from the smallest
 * penetration number x = Ds·θ/R² of the coupled and trace components: LONG_AGE_POINTS from
 * x ≥ LONG_AGE_NUMBER, DEFAULT_INTERIOR_POINTS (the batch's grid) from x ≥ SHORT_AGE_NUMBER,
 * SHORT_AGE_POINTS below, VERY_SHORT_AGE_POINTS below VERY_SHORT_AGE_NUMBER. The grid error lives
 * in the steep profiles of young particles (penetration depth about √(Ds·t)), which the age
 * distribution exp(−t/θ)/θ weighs by about their age over θ, so the shorter the carbon age the
 * more points the surface layer needs. Measured on the bench waters (DOC Ds 5e-17 m²/s, targets
 * 2e-17 to 6e-16, R 10 µm, doses up to 60 mg/L; tests/kinetics/pacKinetics.test.ts and
 * stirredShortAge.test.ts): doubling the grid changes c/c0 by < 1e-4 (the grid
 * criterion) on the 8-point grid from x = 0.1, on 16 points from x = 3e-3 (below it 16 points
 * were off by up to 3.8e-4), on 20 points from x ≈ 2e-4; below that 24 points stay within 7e-5
 * of 40 points (the largest collocation grid) down to x = 6e-5 (θ = τ = 5 min at Ds 2e-17).
 */
export function stirredGridPoints(pk: PreparedKinetics, thetaS: number): number {
  const ds = [...pk.coupled, ...pk.trace].map((i) => pk.components[i]!.dsM2PerS!).filter((d) => d > 0);
  if (!ds.length) return DEFAULT_INTERIOR_POINTS;
  const R = pk.particle.radiusM;
  const x = (Math.min(...ds) * thetaS) / (R * R);
  if (x >= LONG_AGE_NUMBER) return LONG_AGE_POINTS;
  if (x >= SHORT_AGE_NUMBER) return DEFAULT_INTERIOR_POINTS;
  return x >= VERY_SHORT_AGE_NUMBER ? SHORT_AGE_POINTS : VERY_SHORT_AGE_POINTS;
}

/** Ds·θ/R² from which the default grid of the stirred reactor is LONG_AGE_POINTS (ours; stirredGridPoints). */
export const LONG_AGE_NUMBER = 0.1;
const LONG_AGE_POINTS = 8;
/** Ds·θ/R² below which the default grid is SHORT_AGE_POINTS, and VERY_SHORT_AGE_POINTS (ours; stirredGridPoints). */
export const SHORT_AGE_NUMBER = 3e-3;
export const VERY_SHORT_AGE_NUMBER = 2e-4;
const SHORT_AGE_POINTS = 20;
const VERY_SHORT_AGE_POINTS = 24;

/** Steps pinned at the feed (v = 0) per prepared mixture and `grid|age|rtol` (BalanceSolver.pinSteps). */
const PINNED_STEPS = new WeakMap<PreparedKinetics, Map<string, { times: number[]; orders: number[] }>>();

/** Dose that scales the particle's loadings in the reactor's runs, g/L (ours; 10 mg/L). */
const SCALE_DOSE_G_PER_L = 0.01;

/** Interior points of the coarse grid that starts the balance (at least COARSE_POINTS, a fifth of
 *  the requested grid's: the short-age grids of 20 and 24 points, whose young particles 2 points
 *  describe poorly, then start 4 or 5, which saved the requested grid one to two runs on the bench
 *  waters), its balance tolerance and its integration tolerance (ours: only a start; rtol 3e-4
 *  takes ~25 % fewer steps than 1e-4, 1e-3 left the requested grid's solve a worse start). */
const COARSE_POINTS = 2;
const COARSE_TOL = 1e-4;
const COARSE_RTOL = 3e-4;

interface Evaluation {
  /** Residual (c0 − c_out − D·∫q̄E)/c0 of the coupled components. */
  G: Float64Array;
  /** ∫q̄E of every block, mg/g. */
  I: Float64Array;
  blocks: readonly number[];
  /** q_eq of the coupled components at c_out, mg/g. */
  qB: Float64Array;
}

/** The outer balance of the stirred reactor on a given particle grid (see the file comment). */
class BalanceSolver {
  iterations = 0;
  integrations = 0;
  private readonly background;
  private readonly pmB;
  private readonly pkB: PreparedKinetics;
  private readonly cFixed: Float64Array;
  private readonly qEq: Float64Array;
  private readonly tc: number;
  private readonly sEnd: number;
  private steps: { times: number[]; orders: number[]; col: SphereCollocation } | undefined;
  /**
   * Corrector tolerance of the replays, of the scaled norm (ours): 1e-9/rtol within [1e-4, 1e-3],
   * so that where it is looser than bdfIntegrator's default 1e-4 the corrector's error relative
   * to the loadings, this times rtol, stays at most 1e-9, a thousandth of the difference step of
   * differenceJacobian (1e-3 at the default rtol 1e-6; the default from rtol 1e-5 up, the coarse
   * start's 3e-4 included).
   */
  private readonly replayTolerance: number;

  /** `factorEveryStep`: replays refactorise at every step (the coarse start; see evaluate). */
  constructor(private readonly pk: PreparedKinetics, private readonly dose: number, private readonly theta: number, private readonly rtol: number, private readonly factorEveryStep = false) {
    this.background = pk.coupled.map((i) => pk.components[i]!);
    this.pmB = this.background.length ? prepareMixture(this.background) : undefined;
    this.pkB = { ...pk, trace: [] };
    this.cFixed = Float64Array.from(pk.components, (c) => c.c0MgPerL);
    this.qEq = new Float64Array(pk.components.length);
    this.tc = particleTimeScale(pk.particle.radiusM, [...pk.coupled, ...pk.trace].map((i) => pk.components[i]!.dsM2PerS!));
    this.sEnd = logTime(40 * theta, this.tc);
    this.replayTolerance = Math.min(1e-3, Math.max(1e-4, 1e-9 / rtol));
  }

  /** Loadings in equilibrium with the coupled outlet c0·exp(v) (direct IAST), mg/g, in pk.coupled order. */
  equilibriumAt(v: Float64Array): Float64Array {
    return this.pmB ? directIastPrepared(this.pmB, Float64Array.from(this.background, (c, p) => c.c0MgPerL * Math.exp(v[p]!))).qMgPerG : new Float64Array(0);
  }

  /**
   * Age integrals of every block with the coupled components at c_out = c0·exp(v) and the trace
   * targets at their c0. `pin` integrates everything with error control and keeps the steps;
   * `replay` replays them on the background alone, `replay-all` on everything (smooth in v).
   */
  evaluate(col: SphereCollocation, v: Float64Array, mode: 'pin' | 'replay' | 'replay-all'): Evaluation {
    const { pk, background, qEq, cFixed } = this;
    const comps = pk.components;
    const qB = this.equilibriumAt(v);
    pk.coupled.forEach((i, p) => { cFixed[i] = comps[i]!.c0MgPerL * Math.exp(v[p]!); qEq[i] = qB[p]!; });
    if (pk.trace.length) {
      let psi = 0, total = 0;
      background.forEach((c, p) => { psi += qB[p]! / c.oneOverN; total += qB[p]!; });
      const betas = Float64Array.from(background, (c) => c.oneOverN);
      for (const i of pk.trace) {
        const kappa = traceSurfaceFactor(comps[i]!.K, comps[i]!.oneOverN, { psi, total }, betas);
        qEq[i] = kappa > 0 ? comps[i]!.c0MgPerL / kappa : 0; // c_s,T = κ_T·q_T at equilibrium
      }
    }
    // a particle at a fixed liquid does not depend on the dose; its loadings are scaled by c0/D
    // for a fixed reference D, so that the pinned steps do not change with the dose either
    const particleFor = (which: PreparedKinetics) => hsdmParticleSystem(which, SCALE_DOSE_G_PER_L, col, { kind: 'fixed', cMgPerL: cFixed, meanAgeS: this.theta, equilibriumMgPerG: qEq });
    let part: ParticleSystem | undefined;
    let y: Float64Array | undefined;
    if (mode !== 'pin' && this.steps && this.steps.col === col) {
      part = particleFor(mode === 'replay' ? this.pkB : pk);
      try {
        // the corrector is solved to replayTolerance of the pinned run's own error norm
        // (bdfIntegrator); on the coarse start's grid, whose blocks factorise for about the cost of
        // an iteration, with the Newton matrix refactorised at every step (ours: ~40 % less CPU on
        // 2 points, ~30 % more on the requested 8)
        y = integrateBdf(logTimeSystem(part, this.tc), 0, part.initialState(), [this.sEnd], { stepTimes: this.steps.times, stepOrders: this.steps.orders, rtol: this.rtol, atol: this.rtol * 1e-3, replayTolerance: this.replayTolerance, replayFactorEveryStep: this.factorEveryStep }).states[0]!;
      } catch (e) {
        if (!(e instanceof ComputationError)) throw e; // the pinned steps do not suit v: this one runs with error control
      }
    }
    if (!y) {
      part = particleFor(pk);
      const run = integrateBdf(logTimeSystem(part, this.tc), 0, part.initialState(), [this.sEnd], { rtol: this.rtol, atol: this.rtol * 1e-3 });
      // only a pinning run sets the steps that later evaluations replay (a failed replay does not
      // change the residual function in the middle of a solve)
      if (mode === 'pin' || !this.steps || this.steps.col !== col) this.steps = { times: run.stepTimes, orders: run.stepOrders, col };
      y = run.states[0]!;
    }
    this.integrations++;
    const p = part!;
    const I = Float64Array.from(p.blocks, (_i, b) => p.ageIntegral(y!, b));
    const G = new Float64Array(background.length);
    for (let q = 0; q < background.length; q++) G[q] = 1 - Math.exp(v[q]!) - (this.dose * I[q]!) / background[q]!.c0MgPerL;
    return { G, I, blocks: p.blocks, qB };
  }

  /**
   * Pins the steps at v (evaluate's 'pin'). The steps pinned at v = 0 (every component at
   * its feed) do not depend on the dose, so they are kept per mixture, grid, age and tolerance
   * (PINNED_STEPS) and a later solve of the same mixture at another dose replays them without
   * integrating again.
   */
  pinSteps(col: SphereCollocation, v: Float64Array): void {
    const atFeed = v.every((x) => x === 0);
    const key = `${col.interiorPoints}|${this.theta}|${this.rtol}`;
    const kept = atFeed ? PINNED_STEPS.get(this.pk)?.get(key) : undefined;
    if (kept) { this.steps = { times: kept.times, orders: kept.orders, col }; return; }
    this.evaluate(col, v, 'pin');
    if (atFeed && this.steps) {
      let byKey = PINNED_STEPS.get(this.pk);
      if (!byKey) { byKey = new Map(); PINNED_STEPS.set(this.pk, byKey); }
      byKey.set(key, { times: this.steps.times, orders: this.steps.orders });
    }
  }

  /**
   * The equilibrium Jacobian ∂G/∂v at v (see the file comment; ours): the uptake fractions
   * I_p/q_eq,p of the evaluation `at` (at v) times the derivative of q_eq by forward differences
   * of the direct IAST. No particle integration; a start for the quasi-Newton iteration.
   */
  equilibriumJacobian(v: Float64Array, at: Evaluation): Float64Array {
    const nB = v.length;
    const J = new Float64Array(nB * nB);
    const h = 1e-6;
    for (let k = 0; k < nB; k++) {
      const vp = Float64Array.from(v);
      vp[k] = vp[k]! + h;
      const qp = this.equilibriumAt(vp);
      for (let p = 0; p < nB; p++) {
        const q = at.qB[p]!;
        const uptake = q > 0 ? at.I[p]! / q : 0;
        J[p * nB + k] = (-this.dose * uptake * (qp[p]! - q)) / (h * this.background[p]!.c0MgPerL) - (p === k ? Math.exp(v[p]!) : 0);
      }
    }
    return J;
  }

  /** Forward differences of G over the replayed steps (smooth in v). */
  private differenceJacobian(col: SphereCollocation, v: Float64Array, G: Float64Array): Float64Array {
    const nB = G.length;
    const J = new Float64Array(nB * nB);
    const h = 1e-6;
    for (let k = 0; k < nB; k++) {
      const vp = Float64Array.from(v);
      vp[k] = vp[k]! + h;
      const Gp = this.evaluate(col, vp, 'replay').G;
      for (let p = 0; p < nB; p++) J[p * nB + k] = (Gp[p]! - G[p]!) / h;
    }
    return J;
  }

  /**
   * Newton–Broyden on v from `v0` (with the Jacobian `J0`, else the equilibrium Jacobian once when
   * `equilibriumStart`, else differences) until the balance closes. `pinAtStart`: the steps are
   * pinned at v0 itself (not on the pin grid), and that run is the first evaluation.
   */
  solve(col: SphereCollocation, v0: Float64Array, J0: Float64Array | undefined, tol = BALANCE_TOL, rePin = true, pinAt: Float64Array = v0, polish = false, start: { pinAtStart?: boolean; equilibriumStart?: boolean } = {}): { v: Float64Array; J: Float64Array; I: Float64Array; all?: Evaluation } {
    const nB = v0.length;
    const normOf = (G: Float64Array) => G.reduce((s, g) => Math.max(s, Math.abs(g)), 0);
    let v = Float64Array.from(v0);
    let pinnedAt = start.pinAtStart ? Float64Array.from(v0) : onPinGrid(pinAt);
    let J: Float64Array | undefined = J0 ? Float64Array.from(J0) : undefined;
    // pin the steps, then evaluate by replay, so that every residual of the solve (and the
    // difference Jacobian) comes from the same smooth function of v
    let cur: Evaluation;
    if (start.pinAtStart) cur = this.evaluate(col, v, 'pin');
    else { this.pinSteps(col, pinnedAt); cur = this.evaluate(col, v, 'replay'); }
    let equilibriumJ = !!start.equilibriumStart;
    let iterations = 0;
    for (let round = 0; round < 3; round++) {
      if (round > 0) {
        if (!rePin || !v.some((x, p) => Math.abs(x - pinnedAt[p]!) > 0.05)) break;
        pinnedAt = onPinGrid(v);
        this.evaluate(col, pinnedAt, 'pin');
        cur = this.evaluate(col, v, 'replay');
      }
      let lastNorm = Infinity;
      let freshJ = false; // J is a fresh difference Jacobian
      let fall = Infinity; // the residual's fall in the last accepted step (new over old largest residual)
      while (normOf(cur.G) > tol) {
        if (++iterations > 60) throw new ComputationError(`stirred reactor balance did not close in 60 iterations (largest residual ${normOf(cur.G).toExponential(2)} of c0)`);
        this.iterations++;
        if (!J && equilibriumJ) { J = this.equilibriumJacobian(v, cur); equilibriumJ = false; }
        else if (!J) { J = this.differenceJacobian(col, v, cur.G); freshJ = true; }
        const Jn: Float64Array = J;
        const step = Float64Array.from(cur.G, (g) => -g);
        denseLu(Float64Array.from(Jn), nB, 'stirred reactor Newton step').solve(step);
        // a step of at most 2 in ln c (ours), halved up to 8 times while the largest residual
        // does not fall
        const longest = step.reduce((a, x) => Math.max(a, Math.abs(x)), 0);
        let lambda = longest > 2 ? 2 / longest : 1;
        let accepted = false;
        // the step that the last one's fall predicts to close the balance runs every block
        // (replay-all): where it lands within CLOSING_FRACTION of the tolerance it is the final
        // run, in place of the polishing step below
        const closing = polish && normOf(cur.G) * fall <= tol;
        for (let k = 0; k < 8 && !accepted; k++, lambda /= 2) {
          const vn = Float64Array.from(v, (x, p) => Math.min(0, x + lambda * step[p]!));
          const next = this.evaluate(col, vn, closing && k === 0 ? 'replay-all' : 'replay');
          if (normOf(next.G) < normOf(cur.G)) {
            fall = normOf(next.G) / normOf(cur.G);
            broyden(Jn, Float64Array.from(vn, (x, p) => x - v[p]!), next.G, cur.G);
            if (closing && k === 0 && normOf(next.G) <= CLOSING_FRACTION * tol) return { v: vn, J: Jn, I: next.I, all: next };
            v = vn; cur = next; accepted = true;
          }
        }
        if (accepted) {
          freshJ = false;
          if (normOf(cur.G) > 0.5 * lastNorm) J = undefined; // slow: a fresh difference Jacobian
          lastNorm = normOf(cur.G);
          continue;
        }
        if (!freshJ) { J = undefined; continue; } // the updated or equilibrium Jacobian misled: differences
        // no step helps even with a fresh Jacobian: accept when the balance already closes to the
        // particle integration's own accuracy (10 × rtol of c0), the rest being integration noise
        if (normOf(cur.G) <= 10 * this.rtol) break;
        throw new ComputationError(`stirred reactor balance: no step reduces the residual (largest ${normOf(cur.G).toExponential(2)} of c0)`);
      }
    }
    const Jend = J ?? this.differenceJacobian(col, v, cur.G);
    if (polish && nB > 0) {
      // one more Newton step past the tolerance (quadratic: the residual falls far below it), so
      // that the answer does not depend on the path the iterations took; it runs every block
      // (replay-all, the same steps), so that it gives the trace targets too
      const step = Float64Array.from(cur.G, (g) => -g);
      denseLu(Float64Array.from(Jend), nB, 'stirred reactor Newton step').solve(step);
      const vn = Float64Array.from(v, (x, p) => Math.min(0, x + step[p]!));
      const next = this.evaluate(col, vn, 'replay-all');
      if (normOf(next.G) <= Math.max(normOf(cur.G), 1e-2 * tol)) return { v: vn, J: Jend, I: next.I, all: next };
    }
    return { v, J: Jend, I: cur.I };
  }
}

/** A solved outlet of the same mixture and conditions: the dose, g/L, and c_out/c0 of the coupled components. */
export interface SolvedOutlet { dose: number; remaining: Float64Array }

/**
 * The outlet at dose D predicted from a solution (v0, its balance Jacobian J0) at dose D0 (ours).
 * The age integral I(v) = ∫q̄E dt of a particle held at c_out does not depend on the dose, so the
 * balance G(v) = 1 − e^v − D·I(v)/c0 at D follows from the one at D0: I(v0)/c0 = (1 − e^v0)/D0
 * and ∂(I/c0)/∂v = −(J0 + diag(e^v0))/D0. Newton on G with I linear in v about v0 (no particle
 * integration) gives the start and its Jacobian; the original start where that fails.
 * With a second solution (v1 at D1, `second`), where I(v1)/c0 = (1 − e^v1)/D1 is known too, the
 * slope of I is first corrected by Broyden's rank-one update (Broyden 1965) so that the linear
 * model passes through both solutions: the solutions of a dose search lie on one curve v(D), and
 * the secant along it is what the prediction needs most.
 */
export function predictOutlet(v0: Float64Array, J0: Float64Array, d0GPerL: number, dGPerL: number, second?: { v: Float64Array; dose: number }): { v: Float64Array; J: Float64Array } {
  const n = v0.length;
  const a = Float64Array.from(v0, (x) => -Math.expm1(x) / d0GPerL);
  const B = Float64Array.from(J0, (x, pk) => -(x + (pk % (n + 1) === 0 ? Math.exp(v0[Math.floor(pk / n)]!) : 0)) / d0GPerL);
  if (second && second.v.length === n && second.v.every(Number.isFinite)) {
    const s = Float64Array.from(second.v, (x, p) => x - v0[p]!);
    const ss = s.reduce((t, x) => t + x * x, 0);
    if (ss > 0) {
      for (let p = 0; p < n; p++) {
        let bs = 0;
        for (let q = 0; q < n; q++) bs += B[p * n + q]! * s[q]!;
        const r = -Math.expm1(second.v[p]!) / second.dose - a[p]! - bs;
        for (let q = 0; q < n; q++) B[p * n + q] = B[p * n + q]! + (r * s[q]!) / ss;
      }
    }
  }
  const jacobianAt = (v: Float64Array) => Float64Array.from(B, (b, pk) => -dGPerL * b - (pk % (n + 1) === 0 ? Math.exp(v[Math.floor(pk / n)]!) : 0));
  const residual = (v: Float64Array) => Float64Array.from(v, (x, p) => {
    let lin = a[p]!;
    for (let k = 0; k < n; k++) lin += B[p * n + k]! * (v[k]! - v0[k]!);
    return -Math.expm1(x) - dGPerL * lin;
  });
  const fallback = { v: Float64Array.from(v0), J: jacobianAt(v0) };
  let v = Float64Array.from(v0);
  try {
    for (let it = 0; it < 30; it++) {
      const G = residual(v);
      const norm = G.reduce((s, g) => Math.max(s, Math.abs(g)), 0);
      if (!Number.isFinite(norm)) return fallback;
      if (norm < 1e-12) break;
      const step = Float64Array.from(G, (g) => -g);
      denseLu(jacobianAt(v), n, 'stirred reactor predictor').solve(step);
      const longest = step.reduce((m, x) => Math.max(m, Math.abs(x)), 0);
      const lambda = longest > 1 ? 1 / longest : 1;
      v = Float64Array.from(v, (x, p) => Math.min(0, x + lambda * step[p]!));
    }
  } catch (e) {
    if (e instanceof ComputationError) return fallback;
    throw e;
  }
  return v.every(Number.isFinite) && v.every((x) => x > -50) ? { v, J: jacobianAt(v) } : fallback;
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

/**
 * Where steps are pinned (ours): v rounded to multiples of 0.05. Error-controlled step sequences
 * react to the smallest change of their input through discrete decisions (rejected steps, order
 * changes, a kept Newton matrix), so steps pinned at the exact start would make the outlet jump
 * between doses 1e-12 apart; on this grid the steps, and so the outlet, are smooth in the dose
 * except at the rare cell boundaries. The steps still suit the particle (5 % in c_out).
 */
function onPinGrid(v: Float64Array): Float64Array {
  return Float64Array.from(v, (x) => Math.min(0, Math.round(x / 0.05) * 0.05));
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
