/**
 * Column calibration: the surface diffusivity Ds of one target (and optionally a factor on its
 * film coefficient) fitted to pilot or small-column breakthrough data with the fixed-bed model
 * (src/kinetics/fixedBed.ts: film, HSDM grains, reverse IAST with the background).
 *
 *   residual_k = c/c0_model(BV_k; Ds, f_kf) − c/c0_measured,k        (absolute, in c/c0)
 *   parameters fitted as ln Ds and ln f_kf; a coarse scan of ln Ds over 1e-17 … 1e-11 m²/s picks
 *   the start unless one is given (on the fast path below with the target integrated at rtol 1e-3:
 *   the scan only picks a decade).
 * A trace target against an adsorbable background (the usual case): the background is solved once
 *   (src/kinetics/fixedBed.ts, traceBed) and each evaluation integrates only the target against it
 *   (otherwise each evaluation is the coupled model). Ds alone: a one-dimensional
 *   Levenberg–Marquardt on ln Ds (Marquardt 1963, J. SIAM 11(2):431–441) whose derivative is a
 *   difference quotient over replayed integrator steps (smooth in Ds), the scan in whole decades.
 *   With f_kf: fitLeastSquares (Nelder–Mead and Levenberg–Marquardt, src/numerics).
 *   95 % intervals from the linearised covariance s²·(JᵀJ)⁻¹ with Student's t (Bates & Watts 1988,
 *   Nonlinear Regression Analysis, §2.3), mapped back from the logarithms (asymmetric on Ds).
 * The background (fictive DOC components) takes its own Ds and kf as given; the target's trace
 * form makes its fit independent of its own c0.
 *
 * Units: Ds m²/s, bed volumes dimensionless, c/c0 fraction.
 * @throws InputError for bad data or inputs; ComputationError when the fit does not converge
 */
import { ComputationError, InputError } from '../core/errors.js';
import { simulateFixedBed, traceBed } from '../kinetics/fixedBed.js';
import { filmCoefficients, type FixedBedComponent, type FixedBedSpec } from '../kinetics/fixedBedInput.js';
import { centralJacobian, fitLeastSquares } from '../numerics/leastSquares.js';
import { invertSymmetric, normalEquations } from '../numerics/linearSystem.js';
import { studentTQuantile } from '../numerics/studentT.js';
import type { BreakthroughData } from './breakthroughData.js';

export interface ColumnFitInput {
  data: BreakthroughData;
  /** The target; its Ds (if any) is ignored, its kf or DL sets the film. */
  target: FixedBedComponent;
  /** Background components (fictive DOC and non-adsorbable) with their Ds and kf or DL. */
  background: readonly FixedBedComponent[];
  bed: FixedBedSpec;
  /** Fit a factor on the target's film coefficient as well (default false). */
  fitKfFactor?: boolean;
  /** Start of the Ds search, m²/s (default: the best of a scan over 1e-17 … 1e-11 m²/s). */
  startDsM2PerS?: number;
  /** Grid of the fixed-bed model (default the model's). */
  grid?: { cells: number; interiorPoints: number };
}

export interface ColumnFitRow {
  row: number;
  bed_volumes: number;
  c_over_c0_measured: number;
  c_over_c0_predicted: number;
  residual: number;
}

export interface ColumnFitResult {
  model: 'column';
  compound: string;
  parameters: { Ds_m2_per_s: number; kf_factor?: number };
  ci95: { Ds_m2_per_s: [number, number] | null; kf_factor?: [number, number] | null };
  fit: { rmse: number; residual: string; points: number; parameters: number; degrees_of_freedom: number; max_abs_residual: number; converged: boolean; stop: string; evaluations: number };
  table: ColumnFitRow[];
  warnings: string[];
}

/** Fit the target's Ds (and f_kf) to breakthrough data; see the file comment. */
export function fitColumn(input: ColumnFitInput): ColumnFitResult {
  const { data, target, bed } = input;
  if (!(target.K > 0)) throw new InputError(`expected an adsorbable target (K > 0), got K = ${target.K}`, { path: 'K' });
  if (!(target.c0MgPerL > 0)) throw new InputError('expected the target feed concentration c0 > 0', { path: 'c0' });
  if (target.kfMPerS === undefined && target.dlM2PerS === undefined) throw new InputError(`target "${target.id}" has neither kf nor DL; expected DL (liquid diffusivity) or kf`, { path: 'DL' });
  const fitKf = input.fitKfFactor ?? false;
  const p = fitKf ? 2 : 1;
  const n = data.bedVolumes.length;
  if (n <= p) throw new InputError(`expected more than ${p} data rows to fit ${p} parameter${p > 1 ? 's' : ''}`, { path: 'data' });
  const toBv = data.bedVolumes[n - 1]!;
  const baseKf = filmCoefficients([{ ...target, dsM2PerS: 1 }], { ...bed, kfFactor: 1 })[0]!.kfMPerS; // given kf or the correlation's
  if (input.startDsM2PerS !== undefined && !(input.startDsM2PerS > 0)) throw new InputError(`expected a start Ds > 0, got ${input.startDsM2PerS}`, { path: 'startDsM2PerS' });
  const component = (x: readonly number[]): FixedBedComponent => {
    // the factor applies to the target's film only, so it is passed as the target's own kf
    const comp: FixedBedComponent = { ...target, dsM2PerS: Math.exp(x[0]!) };
    if (fitKf) comp.kfMPerS = baseKf * Math.exp(x[1]!);
    return comp;
  };
  const bgAdsorbed = input.background.filter((c) => c.K > 0).reduce((s, c) => s + c.c0MgPerL, 0);
  const isTrace = bgAdsorbed > 0 && target.c0MgPerL < TRACE_FRACTION * (bgAdsorbed + target.c0MgPerL);
  // a trace target: the background solved once (its own tolerances), the target alone per evaluation
  const traced = isTrace ? traceBed({ components: input.background, bed }, { outputBedVolumes: data.bedVolumes, ...(input.grid ?? {}) }) : undefined;
  const predict = (x: readonly number[], stepTimes?: readonly number[], loose = false): { c: number[]; stepTimes?: number[] } => {
    if (traced) {
      const o = traced.outlet(component(x), { ...(loose ? SCAN_TOLERANCES : TARGET_TOLERANCES), traceFraction: TRACE_FRACTION, ...(stepTimes ? { stepTimes } : {}) });
      return { c: o.cOverC0.slice(1), stepTimes: o.stepTimes };
    }
    // the coupled model keeps the tighter tolerances 1e-4/1e-7 (ours): fitLeastSquares' difference-quotient Jacobian needs smooth predictions
    const r = simulateFixedBed({ components: [...input.background, component(x)], bed }, { toBedVolumes: toBv, outputBedVolumes: data.bedVolumes, rtol: 1e-4, atol: 1e-7, ...(input.grid ?? {}), ...(stepTimes ? { stepTimes } : {}) });
    return { c: r.components[r.components.length - 1]!.cOverC0.slice(1), ...(r.stepTimes ? { stepTimes: r.stepTimes } : {}) };
  };
  const residuals = (x: readonly number[], stepTimes?: readonly number[], loose = false) => {
    const pred = predict(x, stepTimes, loose);
    return { r: pred.c.map((v, k) => v - data.cOverC0[k]!), stepTimes: pred.stepTimes };
  };
  const sumSq = (r: readonly number[]) => r.reduce((a, v) => a + v * v, 0);
  // coarse scan of ln Ds for the start (each point one simulation; whole decades on the fast path)
  let bestX = [Math.log(input.startDsM2PerS ?? 1e-14), ...(fitKf ? [0] : [])];
  let bestS = Infinity;
  const scan = () => {
    for (let e = -17; e <= -11; e += fitKf ? 0.5 : 1) {
      const x = [e * Math.LN10, ...(fitKf ? [0] : [])];
      try {
        const s = sumSq(residuals(x, undefined, true).r);
        if (s < bestS) { bestS = s; bestX = x; }
      } catch (err) {
        if (!(err instanceof ComputationError)) throw err;
      }
    }
  };
  const lower = [Math.log(1e-19), ...(fitKf ? [Math.log(0.05)] : [])];
  const upper = [Math.log(1e-9), ...(fitKf ? [Math.log(20)] : [])];
  let fit: { x: number[]; residuals: Float64Array; sse: number; converged: boolean; stop: string; evaluations: number };
  let J: number[][] | undefined;
  if (!fitKf) {
    const one = fitLnDs(residuals, bestX[0]!, input.startDsM2PerS === undefined ? scan : undefined, () => bestX[0]!, lower[0]!, upper[0]!);
    fit = one.fit;
    J = one.jacobian;
  } else {
    if (input.startDsM2PerS === undefined) scan();
    const f = fitLeastSquares({
      residuals: (x) => residuals(x).r,
      starts: [bestX],
      lower,
      upper,
      residualScale: 1,
      maxIterations: 12 * p,
      what: `column calibration of ${target.id}`,
    });
    fit = f;
    if (n > p) J = centralJacobian((x) => { try { return residuals(x).r; } catch (e) { if (e instanceof ComputationError) return undefined; throw e; } }, f.x, f.residuals, 1e-4);
  }
  if (!fit.converged) throw new ComputationError(`column calibration of ${target.id} did not converge (${fit.stop})`);
  const dof = n - p;
  const s2 = dof > 0 ? fit.sse / dof : NaN;
  const warnings: string[] = [];
  const ci: ColumnFitResult['ci95'] = { Ds_m2_per_s: null };
  if (fitKf) ci.kf_factor = null;
  if (dof > 0) {
    const cov = J ? invertSymmetric(normalEquations(J, fit.residuals).JtJ, 1e-10) : undefined;
    if (cov) {
      const t = studentTQuantile(0.975, dof);
      const half = (j: number) => t * Math.sqrt(Math.max(0, s2 * cov[j]![j]!));
      ci.Ds_m2_per_s = [Math.exp(fit.x[0]! - half(0)), Math.exp(fit.x[0]! + half(0))];
      if (fitKf) ci.kf_factor = [Math.exp(fit.x[1]! - half(1)), Math.exp(fit.x[1]! + half(1))];
    } else {
      warnings.push('the data do not determine the parameters (singular Jacobian): no intervals; the breakthrough may not have started within the data');
    }
  }
  const pred = fit.residuals.map((r, k) => r + data.cOverC0[k]!);
  if (Math.max(...data.cOverC0) < 0.05) warnings.push('the measured c/c0 stays below 0.05: the data hardly show the breakthrough, so Ds is poorly determined');
  const parameters: ColumnFitResult['parameters'] = { Ds_m2_per_s: Math.exp(fit.x[0]!) };
  if (fitKf) parameters.kf_factor = Math.exp(fit.x[1]!);
  return {
    model: 'column',
    compound: target.id,
    parameters,
    ci95: ci,
    fit: {
      rmse: Math.sqrt(fit.sse / n),
      residual: 'c/c0 predicted − measured',
      points: n,
      parameters: p,
      degrees_of_freedom: dof,
      max_abs_residual: Math.max(...Array.from(fit.residuals, Math.abs)),
      converged: fit.converged,
      stop: fit.stop,
      evaluations: fit.evaluations,
    },
    table: data.rows.map((row, k) => ({ row, bed_volumes: data.bedVolumes[k]!, c_over_c0_measured: data.cOverC0[k]!, c_over_c0_predicted: pred[k]!, residual: fit.residuals[k]! })),
    warnings,
  };
}

/** Feed share of the adsorbable total below which the target is a trace (as simulateFixedBed's default). */
const TRACE_FRACTION = 1e-3;
/** Tolerances of the target's own integration on the fast path (those the coupled fit used; smoothness comes from the replayed steps). */
const TARGET_TOLERANCES = { rtol: 1e-4, atol: 1e-7 } as const;
/**
 * Tolerances of the target's integration in the decade scan on the fast path (ours: the scan only
 * picks the start decade, whose sums of squares differ by far more than this tolerance moves them).
 */
const SCAN_TOLERANCES = { rtol: 1e-3, atol: 1e-6 } as const;
/** Step in ln Ds of the difference quotients over replayed steps (ours). */
const LN_DS_STEP = 1e-3;
/** Trial steps in ln Ds below which the integrator's steps are replayed (ours). */
const FREEZE_STEPS_BELOW = 0.05;
/** Converged step in ln Ds (ours). */
const LN_DS_DONE = 1e-4;

/**
 * One-dimensional Levenberg–Marquardt on x = ln Ds: the derivative of the residuals is a forward
 * difference over the replayed steps of the evaluation at x (smooth in x), each trial step at most
 * one decade, with the steps of the current point replayed for trial steps below 0.05; converged
 * when the Gauss–Newton step is below 1e-4 in ln Ds (Ds to 1e-4 relative, far inside any interval)
 * or no damped step decreases S. `scan` (when no start is given) picks the start first.
 * Returns the fit and the Jacobian at the result (the last forward difference when the iteration
 * ended on a small Gauss–Newton step there, else a central difference over replayed steps).
 */
function fitLnDs(
  residuals: (x: readonly number[], stepTimes?: readonly number[]) => { r: number[]; stepTimes?: number[] },
  start: number,
  scan: (() => void) | undefined,
  scanned: () => number,
  lower: number,
  upper: number,
): { fit: { x: number[]; residuals: Float64Array; sse: number; converged: boolean; stop: string; evaluations: number }; jacobian: number[][] } {
  let evaluations = 0;
  const at = (x: number, stepTimes?: readonly number[]) => { evaluations++; return residuals([x], stepTimes); };
  const sumSq = (r: readonly number[]) => r.reduce((a, v) => a + v * v, 0);
  /** Residuals at x + dx over the replayed steps of `cur` (at x); its own steps if the replay fails. */
  const shifted = (x: number, dx: number, cur: { r: number[]; stepTimes?: number[] }): number[] => {
    try {
      return at(x + dx, cur.stepTimes).r;
    } catch (e) {
      if (!(e instanceof ComputationError) || !cur.stepTimes) throw e;
      return at(x + dx).r;
    }
  };
  const slope = (x: number, cur: { r: number[]; stepTimes?: number[] }): number[] => shifted(x, LN_DS_STEP, cur).map((v, k) => (v - cur.r[k]!) / LN_DS_STEP);
  if (scan) { scan(); evaluations += 7; start = scanned(); }
  let x = start;
  let cur = at(x);
  let S = sumSq(cur.r);
  let lambda = 1e-3;
  let stop = '';
  let converged = false;
  let g: number[] = [];
  for (let it = 0; it < 40 && !converged; it++) {
    g = slope(x, cur);
    const JtJ = sumSq(g);
    const Jtr = g.reduce((a, v, k) => a + v * cur.r[k]!, 0);
    if (!(JtJ > 0)) {
      if (it === 0 && scan === undefined) throw new ComputationError('column calibration: the model does not move with Ds at the start value (c/c0 flat over the data); give no start so that a scan picks one');
      converged = true; stop = 'the data do not move with Ds'; break;
    }
    if (Math.abs(Jtr / JtJ) < LN_DS_DONE) { converged = true; stop = 'Gauss–Newton step below 1e-4 in ln Ds'; break; }
    for (;;) {
      let dx = -Jtr / (JtJ * (1 + lambda));
      dx = Math.max(-Math.LN10, Math.min(Math.LN10, dx));
      const xn = Math.max(lower, Math.min(upper, x + dx));
      let trial: { r: number[]; stepTimes?: number[] } | undefined;
      // near the result the steps are frozen (replayed from the current point), so that S is
      // smooth in x and the iteration converges below the adaptive steps' noise
      try { trial = Math.abs(xn - x) < FREEZE_STEPS_BELOW ? at(xn, cur.stepTimes) : at(xn); } catch (e) { if (!(e instanceof ComputationError)) throw e; }
      const Sn = trial ? sumSq(trial.r) : Infinity;
      if (trial && Sn <= S) {
        x = xn; cur = trial; S = Sn;
        lambda = Math.max(1e-6, lambda / 10);
        break;
      }
      lambda *= 10;
      if (lambda > 1e4 || Math.abs(xn - x) < LN_DS_DONE) { converged = true; stop = 'no damped step decreases S (stationary to working precision)'; break; }
    }
  }
  if (!converged) stop = 'too many iterations';
  // the Jacobian at the result: the forward difference over its replayed steps, when the last
  // iteration computed it there; else a central one
  let jacobian: number[][];
  if (converged && g.length > 0 && stop.startsWith('Gauss')) jacobian = g.map((v) => [v]);
  else {
    const up = shifted(x, LN_DS_STEP, cur), down = shifted(x, -LN_DS_STEP, cur);
    jacobian = up.map((v, k) => [(v - down[k]!) / (2 * LN_DS_STEP)]);
  }
  return { fit: { x: [x], residuals: Float64Array.from(cur.r), sse: S, converged, stop, evaluations }, jacobian };
}
