/**
 * Kinetic calibration: the surface diffusivity Ds fitted to kinetic jar tests (concentration
 * against time at known doses) with the PAC batch model (HSDM with film transfer and IAST at the
 * particle surface, src/kinetics/pacBatch.ts).
 *
 *   surface-diffusion      Ds of one target beside the fractionated background (whose Ds, DL and
 *                          the particle are given); data time, dose, C0, c.
 *   surface-diffusion-doc  the one Ds shared by the fictive DOC components; data time, dose, DOC
 *                          (predicted DOC = Σ of the background components, non-adsorbable included).
 *
 * Fit of x = ln Ds by least squares on r = ln c_pred − ln c_meas (fitLeastSquares: Nelder–Mead
 * then Levenberg–Marquardt), 95 % interval exp(x ± t(0.975, n − 1)·se) with se from the Jacobian
 * (s²·(JᵀJ)⁻¹, the usual linearised interval). The particle runs of each series replay the steps
 * and orders of a first run in logarithmic time s = ln(1 + t/t_c), where t_c ∝ R²/Ds follows the
 * diffusion clock (src/kinetics/logTimeSystem.ts), so the residuals are smooth in Ds for the
 * difference quotients; a second round takes them again at the first answer with a tight tolerance
 * (1e-7; the first round 1e-5) and polishes from there. Warnings: poor fit (RMSE of ln c above 0.3, as for the other
 * fits), Ds not determined within a decade, Ds at the search bound.
 *
 * Units: Ds, DL m²/s; times s; doses and concentrations mg/L (internally g/L for the dose).
 * @throws InputError for missing kinetic inputs; ComputationError when the fit fails.
 */
import { ComputationError, InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { fitLeastSquares, forwardJacobian } from '../numerics/leastSquares.js';
import { studentTQuantile } from '../numerics/studentT.js';
import { prepareKinetics, type CarbonParticle, type KineticComponent } from '../kinetics/kineticMixture.js';
import { pacBatch } from '../kinetics/pacBatch.js';
import { POOR_FIT_RMSE_LN } from './calibrate.js';
import { readKineticTests, type KineticSeries } from './kineticTestData.js';
import type { CsvTable } from '../tables/csvTable.js';

export type KineticCalibrationModel = 'surface-diffusion' | 'surface-diffusion-doc';

export interface KineticCalibrateOptions {
  model: KineticCalibrationModel;
  /** The target (surface-diffusion): K, exponent and optionally its DL or kf; c0 comes from the data. */
  target?: KineticComponent;
  /** The fictive background components at `docMgPerL` (non-adsorbable included). */
  background: readonly FreundlichComponent[];
  /** DOC of the background as given, mg/L (the reference for a DOC0 column). */
  docMgPerL: number;
  particle: CarbonParticle;
  /** Ds of the background components (surface-diffusion), m²/s. */
  backgroundDsM2PerS?: number;
  /** Liquid diffusivity of every component without its own DL or kf, m²/s. */
  dlM2PerS?: number;
  /** File name for messages. */
  file?: string;
  /** Particle grid of the model runs (default 16 interior points). */
  interiorPoints?: number;
}

export interface KineticCalibrationRow {
  row: number;
  time_s: number;
  dose_mg_per_L: number;
  c0_mg_per_L: number;
  c_measured_mg_per_L: number;
  c_predicted_mg_per_L: number;
  residual_ln: number;
}

export interface KineticCalibrationResult {
  model: KineticCalibrationModel;
  compound: string;
  parameters: { Ds_m2_per_s: number };
  ci95: { Ds_m2_per_s: [number, number] | null };
  fit: { rmse: number; residual: string; points: number; parameters: number; degrees_of_freedom: number; max_abs_residual: number; converged: boolean; stop: string; evaluations: number };
  table: KineticCalibrationRow[];
  warnings: string[];
}

/** Search range of Ds, m²/s (ours: far beyond the 1e-18–1e-13 reported for carbons). */
const DS_MIN = 1e-21, DS_MAX = 1e-11;
const DS_START = [1e-16];

/** Fits the surface diffusivity of a target, or the one of the fictive DOC components, to kinetic jar tests; see the file's opening comment.
 * @param data the kinetic tests as CSV text or a table already read (src/io/readTableFile.ts) */
export function calibrateKinetics(data: string | CsvTable, options: KineticCalibrateOptions): KineticCalibrationResult {
  const { model, particle } = options;
  const series = readKineticTests(data, model === 'surface-diffusion' ? 'target' : 'doc', options.file);
  const dl = options.dlM2PerS;
  const withFilm = (c: KineticComponent): KineticComponent => (c.kfMPerS === undefined && c.dlM2PerS === undefined && dl !== undefined ? { ...c, dlM2PerS: dl } : c);
  let target: KineticComponent | undefined;
  if (model === 'surface-diffusion') {
    target = options.target;
    if (!target) throw new InputError('model surface-diffusion needs the target compound (--compound FILE)', { option: '--compound' });
    if (!(options.backgroundDsM2PerS! > 0)) throw new InputError('model surface-diffusion needs the surface diffusivity of the background components (--doc-ds, e.g. "5e-17 m2/s", from a surface-diffusion-doc fit)', { option: '--doc-ds' });
  }
  /** The mixture of one series at a trial Ds. */
  const mixture = (s: KineticSeries, ds: number): KineticComponent[] => {
    if (model === 'surface-diffusion') {
      const bg = options.background.map((c) => withFilm({ ...c, dsM2PerS: options.backgroundDsM2PerS! }));
      return [...bg, withFilm({ ...target!, c0MgPerL: s.c0MgPerL!, dsM2PerS: ds })];
    }
    const f = s.c0MgPerL !== undefined ? s.c0MgPerL / options.docMgPerL : 1;
    return options.background.map((c) => withFilm({ ...c, c0MgPerL: c.c0MgPerL * f, dsM2PerS: ds }));
  };
  // check the kinetic inputs once, with the component and field named
  prepareKinetics(mixture(series[0]!, DS_START[0]!), particle);

  const n = series.reduce((a, s) => a + s.timesS.length, 0);
  const lnMeas = Float64Array.from(series.flatMap((s) => s.cMgPerL.map((c) => Math.log(c))));
  let kept: { steps: number[]; orders: number[] }[] = [];
  let stepsRtol = 1e-5;
  const grid = options.interiorPoints !== undefined ? { interiorPoints: options.interiorPoints } : {};
  const predict = (ds: number): Float64Array => {
    const out = new Float64Array(n);
    let k = 0;
    series.forEach((s, j) => {
      const pk = prepareKinetics(mixture(s, ds), particle);
      let rec = kept[j];
      let run;
      if (!rec) {
        run = pacBatch(pk, s.doseMgPerL / 1000, s.timesS, { rtol: stepsRtol, ...grid });
        rec = kept[j] = { steps: run.stepTimes, orders: run.stepOrders };
      }
      try {
        run = pacBatch(pk, s.doseMgPerL / 1000, s.timesS, { stepTimes: rec.steps, stepOrders: rec.orders, ...grid });
      } catch (e) {
        if (!(e instanceof ComputationError)) throw e;
        run = pacBatch(pk, s.doseMgPerL / 1000, s.timesS, { rtol: 1e-6, ...grid }); // the replay does not suit this Ds
      }
      for (const c of run.cMgPerL) {
        out[k++] = model === 'surface-diffusion' ? c[c.length - 1]! : c.reduce((a, x) => a + x, 0);
      }
    });
    return out;
  };
  const residuals = (x: readonly number[]) => {
    const c = predict(Math.exp(x[0]!));
    const r = new Float64Array(n);
    for (let i = 0; i < n; i++) r[i] = Math.log(c[i]!) - lnMeas[i]!;
    return r;
  };
  const what = `${model} calibration`;
  const first = fitLeastSquares({ residuals, starts: DS_START.map((d) => [Math.log(d)]), lower: [Math.log(DS_MIN)], upper: [Math.log(DS_MAX)], residualScale: 1, maxIterations: 8, what });
  if (!first.converged) throw new ComputationError(`${what} did not converge (${first.stop})`);
  // second round: steps kept at the first answer with a tight tolerance, polished from there
  kept = [];
  stepsRtol = 1e-7;
  const fit = fitLeastSquares({ residuals, starts: [first.x], lower: [Math.log(DS_MIN)], upper: [Math.log(DS_MAX)], residualScale: 1, maxIterations: 4, what });
  if (!fit.converged) throw new ComputationError(`${what} did not converge (${fit.stop})`);
  const x = fit.x[0]!;
  const ds = Math.exp(x);
  const dof = n - 1;
  const rmse = Math.sqrt(fit.sse / n);
  const warnings: string[] = [];
  let ci: [number, number] | null = null;
  if (dof > 0) {
    const safe = (th: readonly number[]) => { try { return residuals(th); } catch (e) { if (e instanceof ComputationError) return undefined; throw e; } };
    const J = forwardJacobian(safe, [x], fit.residuals, 0, 1e-4);
    const jtj = J ? J.reduce((a, row) => a + row[0]! * row[0]!, 0) : 0;
    if (jtj > 0) {
      const se = Math.sqrt(fit.sse / dof / jtj);
      const t = studentTQuantile(0.975, dof);
      ci = [Math.exp(x - t * se), Math.exp(x + t * se)];
      if (se > Math.LN10) warnings.push('Ds is not determined within a decade by these data; add times where the concentration still changes, or more doses');
    } else warnings.push('the data do not depend on Ds (no interval): the film or equilibrium controls every point');
  } else warnings.push('a single data point: no confidence interval');
  if (rmse > POOR_FIT_RMSE_LN) warnings.push(`poor fit: RMSE of ln(c) is ${rmse.toFixed(2)} (about ${Math.round((Math.exp(rmse) - 1) * 100)} %); the model may not describe these tests`);
  if (x <= Math.log(DS_MIN) + 0.05 || x >= Math.log(DS_MAX) - 0.05) warnings.push(`Ds ended at the edge of the search range (${DS_MIN}–${DS_MAX} m2/s)`);
  const pred = predict(ds);
  let k = 0;
  const table: KineticCalibrationRow[] = [];
  for (const s of series) {
    s.timesS.forEach((t, i) => {
      const c0 = s.c0MgPerL ?? options.docMgPerL;
      table.push({ row: s.rows[i]!, time_s: t, dose_mg_per_L: s.doseMgPerL, c0_mg_per_L: c0, c_measured_mg_per_L: s.cMgPerL[i]!, c_predicted_mg_per_L: pred[k]!, residual_ln: fit.residuals[k]! });
      k++;
    });
  }
  return {
    model,
    compound: model === 'surface-diffusion' ? target!.id : 'DOC',
    parameters: { Ds_m2_per_s: ds },
    ci95: { Ds_m2_per_s: ci },
    fit: { rmse, residual: 'ln c', points: n, parameters: 1, degrees_of_freedom: dof, max_abs_residual: fit.residuals.reduce((a, r) => Math.max(a, Math.abs(r)), 0), converged: fit.converged, stop: fit.stop, evaluations: fit.evaluations },
    table,
    warnings,
  };
}
