/**
 * Column calibration: the surface diffusivity Ds of one target (and optionally a factor on its
 * film coefficient) fitted to pilot or small-column breakthrough data with the fixed-bed model
 * (src/kinetics/fixedBed.ts: film, HSDM grains, reverse IAST with the background).
 *
 *   residual_k = c/c0_model(BV_k; Ds, f_kf) − c/c0_measured,k        (absolute, in c/c0)
 *   parameters fitted as ln Ds and ln f_kf; a coarse scan of ln Ds over 1e-17 … 1e-11 m²/s picks
 *   the start unless one is given; then fitLeastSquares (Nelder–Mead and Levenberg–Marquardt, src/numerics).
 *   95 % intervals from the linearised covariance s²·(JᵀJ)⁻¹ with Student's t (Bates & Watts 1988,
 *   Nonlinear Regression Analysis, §2.3), mapped back from the logarithms (asymmetric on Ds).
 * The background (fictive DOC components) takes its own Ds and kf as given; the target's trace
 * form makes its fit independent of its own c0.
 *
 * Units: Ds m²/s, bed volumes dimensionless, c/c0 fraction.
 * @throws InputError for bad data or inputs; ComputationError when the fit does not converge
 */
import { ComputationError, InputError } from '../core/errors.js';
import { simulateFixedBed } from '../kinetics/fixedBed.js';
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
  const predict = (x: readonly number[]): number[] => {
    // the factor applies to the target's film only, so it is passed as the target's own kf
    const comp: FixedBedComponent = { ...target, dsM2PerS: Math.exp(x[0]!) };
    if (fitKf) comp.kfMPerS = baseKf * Math.exp(x[1]!);
    // the fit keeps the tighter tolerances 1e-4/1e-7 (ours): its difference-quotient Jacobian needs smooth predictions
    const r = simulateFixedBed({ components: [...input.background, comp], bed }, { toBedVolumes: toBv, outputBedVolumes: data.bedVolumes, rtol: 1e-4, atol: 1e-7, ...(input.grid ?? {}) });
    return r.components[r.components.length - 1]!.cOverC0.slice(1);
  };
  const residuals = (x: readonly number[]) => {
    const pred = predict(x);
    return pred.map((v, k) => v - data.cOverC0[k]!);
  };
  // coarse scan of ln Ds for the start (each point one simulation)
  let bestX = [Math.log(1e-14), ...(fitKf ? [0] : [])];
  let bestS = Infinity;
  if (input.startDsM2PerS !== undefined) {
    if (!(input.startDsM2PerS > 0)) throw new InputError(`expected a start Ds > 0, got ${input.startDsM2PerS}`, { path: 'startDsM2PerS' });
    bestX = [Math.log(input.startDsM2PerS), ...(fitKf ? [0] : [])];
  } else for (let e = -17; e <= -11; e += 0.5) {
    const x = [e * Math.LN10, ...(fitKf ? [0] : [])];
    try {
      const s = residuals(x).reduce((a, r) => a + r * r, 0);
      if (s < bestS) { bestS = s; bestX = x; }
    } catch (err) {
      if (!(err instanceof ComputationError)) throw err;
    }
  }
  const fit = fitLeastSquares({
    residuals,
    starts: [bestX],
    lower: [Math.log(1e-19), ...(fitKf ? [Math.log(0.05)] : [])],
    upper: [Math.log(1e-9), ...(fitKf ? [Math.log(20)] : [])],
    residualScale: 1,
    maxIterations: 12 * p,
    what: `column calibration of ${target.id}`,
  });
  if (!fit.converged) throw new ComputationError(`column calibration of ${target.id} did not converge (${fit.stop})`);
  const dof = n - p;
  const s2 = dof > 0 ? fit.sse / dof : NaN;
  const warnings: string[] = [];
  const ci: ColumnFitResult['ci95'] = { Ds_m2_per_s: null };
  if (fitKf) ci.kf_factor = null;
  if (dof > 0) {
    const J = centralJacobian((x) => { try { return residuals(x); } catch (e) { if (e instanceof ComputationError) return undefined; throw e; } }, fit.x, fit.residuals, 1e-4);
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
