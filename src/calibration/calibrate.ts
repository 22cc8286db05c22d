/**
 * `calibrate`: fit a competition model to jar tests of one target compound in the site water —
 * the library entry point behind `sorbshare calibrate`; returns exactly what `--json` prints.
 *
 * Models (batch IAST, Crittenden et al. 1985, with the target's single-solute Freundlich K, 1/n):
 * - `ebc`: equivalent background compound with its own K_EBC, 1/n_EBC and C0_EBC (Najm, Snoeyink
 *   & Richard 1991, J. AWWA 83(8):65–76);
 * - `sebc`: simplified EBC, the EBC takes the target's K and 1/n and only C0_EBC is fitted
 *   (Qi et al. 2007, Water Research, from memory);
 * - `fictive-k`: target plus the fractionated DOC (background file) with a correction factor on
 *   the target's K (Schideman et al. 2006, Environ. Sci. Technol.; Worch 2010, J. Water Supply
 *   Res. Technol. AQUA; both from memory).
 * Residuals are r = ln(c_pred/c_meas) (equivalently differences of ln(c/C0)), because removals
 * span decades. Parameters are fitted as logarithms (1/n_EBC as ln 1/n); 95 % intervals from the
 * linearised covariance s²·(JᵀJ)⁻¹ with Student's t (Bates & Watts 1988, §2.3).
 *
 * Units: concentrations mg/L, K in (mg/g)/(mg/L)^(1/n). C0_EBC scales with DOC: when DOC is known
 * (`docMgPerL` or a DOC column) the ratio C0_EBC/DOC is reported (Zietzschmann et al. 2016, Water
 * Research 102:190, found C0_EBC correlated with DOC).
 * @throws InputError on bad data or options; ComputationError when the fit does not converge
 */
import { ComputationError, InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { readComponent } from '../scenario/readMixture.js';
import { calibrationPointsWarnings } from '../scenario/plausibility.js';
import { readBackground, type BackgroundFile } from '../fractionation/backgroundFile.js';
import { backgroundComponents } from '../fractionation/backgroundPrediction.js';
import { fitLeastSquares, forwardJacobian } from '../numerics/leastSquares.js';
import { invertSymmetric, normalEquations } from '../numerics/linearSystem.js';
import { studentTQuantile } from '../numerics/studentT.js';
import { readJarTests, type JarTestInput } from './jarTestData.js';
import { makeJarTestModel, type MixtureBuilder } from './jarTestModel.js';

export type CalibrationModel = 'ebc' | 'sebc' | 'fictive-k';

export interface CalibrateOptions {
  model: CalibrationModel;
  /** The target compound: a FreundlichComponent (internal units) or a compound object as in a compound file. */
  compound: FreundlichComponent | unknown;
  /** Background file object (fictive-k). */
  background?: BackgroundFile | unknown;
  /** Site DOC in mg/L (reference for C0_EBC/DOC and for scaling the background). */
  docMgPerL?: number;
  /** File name for messages. */
  file?: string;
}

export interface CalibrationRow {
  row: number;
  c0_mg_per_L: number;
  dose_mg_per_L: number;
  doc_mg_per_L?: number;
  c_measured_mg_per_L: number;
  c_predicted_mg_per_L: number;
  removal_measured: number;
  removal_predicted: number;
  residual_ln: number;
}

export interface CalibrationResult {
  model: CalibrationModel;
  compound: string;
  parameters: Record<string, number>;
  ci95: Record<string, [number, number] | null>;
  /** Reference site DOC, mg/L (null when unknown). */
  doc_mg_per_L: number | null;
  /** C0_EBC per mg DOC (ebc, sebc; null when DOC unknown). */
  c0_EBC_per_DOC?: number | null;
  target: { id: string; K: number; one_over_n: number; K_calibrated?: number };
  ebc_component?: { id: string; K: number; one_over_n: number; c0_mg_per_L: number };
  fit: {
    rmse: number;
    residual: string;
    points: number;
    parameters: number;
    degrees_of_freedom: number;
    max_abs_residual: number;
    converged: boolean;
    stop: string;
    evaluations: number;
    starts: number;
    agreeing_starts: number;
  };
  table: CalibrationRow[];
  warnings: string[];
}

/** Poor-fit threshold on the RMSE of ln(c_pred/c_meas): about 30 % (common practice for trace analyses). */
export const POOR_FIT_RMSE_LN = 0.3;

interface ParamSpec {
  names: string[];
  /** natural parameters → mixture builder */
  build(theta: readonly number[]): MixtureBuilder;
  /** transformed start points (natural = transformed here: all in logs) */
  starts: number[][];
  lower: number[];
  upper: number[];
  /** natural (log) parameter → reported value */
  report(theta: readonly number[]): Record<string, number>;
  /** reported CI from log-scale interval */
  ci(theta: readonly number[], se: number[], t: number): Record<string, [number, number]>;
}

function toTarget(raw: unknown): FreundlichComponent {
  const c = raw as FreundlichComponent;
  if (c && typeof c === 'object' && typeof c.K === 'number' && typeof c.oneOverN === 'number' && typeof c.id === 'string') {
    if (!(c.K > 0) || !(c.oneOverN > 0)) throw new InputError('expected an adsorbable target (K > 0 and one_over_n > 0)', { path: 'K' });
    return c;
  }
  const t = readComponent(raw, '$', false);
  if (!(t.K > 0)) throw new InputError('expected an adsorbable target compound (K > 0)', { path: '$.K' });
  return t;
}

export function calibrate(input: JarTestInput, options: CalibrateOptions): CalibrationResult {
  const data = readJarTests(input, options.file);
  const file = data.file;
  const model = options.model;
  if (!['ebc', 'sebc', 'fictive-k'].includes(model)) throw new InputError(`unknown model "${String(model)}"; expected ebc, sebc or fictive-k`, { path: 'model' });
  const target = toTarget(options.compound);
  if (options.docMgPerL !== undefined && (!(options.docMgPerL > 0) || !Number.isFinite(options.docMgPerL))) throw new InputError(`expected a site DOC > 0 mg/L, got ${options.docMgPerL}`, { path: 'doc' });
  const docCol = data.hasDoc ? data.rows.map((r) => r.docMgPerL!) : undefined;
  const docRef = options.docMgPerL ?? (docCol ? median(docCol) : undefined);
  const fitRows = data.rows.filter((r) => r.doseMgPerL > 0);
  const n = fitRows.length;
  const ratio = (doc: number | undefined) => (doc !== undefined && docRef !== undefined ? doc / docRef : 1);
  const lnKT = Math.log(target.K);
  const bT = target.oneOverN;
  const tgt = (c0: number, K = target.K): FreundlichComponent => ({ id: target.id, c0MgPerL: c0, K, oneOverN: bT });
  const ebcId = target.id === 'EBC' ? 'EBC-background' : 'EBC';
  let spec: ParamSpec;
  let background: BackgroundFile | undefined;
  if (model === 'ebc') {
    spec = {
      names: ['K_EBC', 'one_over_n_EBC', 'c0_EBC_mg_per_L'],
      build: ([lk, lb, lc]) => (c0, doc) => [tgt(c0), { id: ebcId, c0MgPerL: Math.exp(lc!) * ratio(doc), K: Math.exp(lk!), oneOverN: Math.exp(lb!) }],
      starts: [],
      lower: [Math.log(1e-4), Math.log(0.02), Math.log(1e-6)],
      upper: [Math.log(1e7), Math.log(1.5), Math.log(1e3)],
      report: ([lk, lb, lc]) => ({ K_EBC: Math.exp(lk!), one_over_n_EBC: Math.exp(lb!), c0_EBC_mg_per_L: Math.exp(lc!) }),
      ci: ([lk, lb, lc], se, t) => ({ K_EBC: expCi(lk!, se[0]!, t), one_over_n_EBC: expCi(lb!, se[1]!, t), c0_EBC_mg_per_L: expCi(lc!, se[2]!, t) }),
    };
    for (const dk of [-1.5, 1.5]) for (const b of [bT, 0.3]) for (const c of [0.3, 3]) spec.starts.push([lnKT + dk, Math.log(b), Math.log(c)]);
  } else if (model === 'sebc') {
    spec = {
      names: ['c0_EBC_mg_per_L'],
      build: ([lc]) => (c0, doc) => [tgt(c0), { id: ebcId, c0MgPerL: Math.exp(lc!) * ratio(doc), K: target.K, oneOverN: bT }],
      starts: [[Math.log(0.01)], [Math.log(0.3)], [Math.log(10)]],
      lower: [Math.log(1e-8)], upper: [Math.log(1e4)],
      report: ([lc]) => ({ c0_EBC_mg_per_L: Math.exp(lc!) }),
      ci: ([lc], se, t) => ({ c0_EBC_mg_per_L: expCi(lc!, se[0]!, t) }),
    };
  } else {
    if (options.background === undefined) throw new InputError('model fictive-k needs a background (the output of sorbshare fractionate; on the command line --background FILE)', { path: 'background' });
    const bg = readBackground(options.background);
    background = bg;
    spec = {
      names: ['K_factor'],
      build: ([lf]) => (c0, doc) => [tgt(c0, target.K * Math.exp(lf!)), ...backgroundComponents(bg, doc ?? docRef ?? bg.doc0_mg_per_L).map((c) => (c.id === target.id ? { ...c, id: `${c.id}-background` } : c))],
      starts: [[Math.log(0.1)], [0], [Math.log(10)]],
      lower: [Math.log(1e-6)], upper: [Math.log(1e6)],
      report: ([lf]) => ({ K_factor: Math.exp(lf!) }),
      ci: ([lf], se, t) => ({ K_factor: expCi(lf!, se[0]!, t) }),
    };
  }
  const p = spec.names.length;
  if (n < p) {
    const last = data.rows[data.rows.length - 1]!.row;
    throw new InputError(`only ${n} jar tests with a carbon dose > 0 for ${p} fitted parameter${p > 1 ? 's' : ''} (model ${model}); expected at least ${p}`, { ...(file ? { file } : {}), row: last, column: data.headers.c });
  }
  const jm = makeJarTestModel(fitRows);
  const lnMeas = Float64Array.from(fitRows, (r) => Math.log(r.cMgPerL));
  const residuals = (theta: readonly number[]) => {
    const c = jm.predict(spec.build(theta));
    const r = new Float64Array(n);
    for (let i = 0; i < n; i++) r[i] = Math.log(c[i]!) - lnMeas[i]!;
    return r;
  };
  const fit = fitLeastSquares({ residuals, starts: spec.starts, lower: spec.lower, upper: spec.upper, residualScale: 1, what: `${model} calibration` });
  if (!fit.converged) throw new ComputationError(`${model} calibration did not converge (${fit.stop})`);
  const theta = fit.x;
  const sse = fit.sse;
  const dof = n - p;
  const warnings: string[] = [];
  const ci95: Record<string, [number, number] | null> = Object.fromEntries(spec.names.map((k) => [k, null]));
  let identifiable = true;
  if (dof > 0) {
    const safe = (th: readonly number[]) => {
      try { return residuals(th); } catch (e) { if (e instanceof ComputationError) return undefined; throw e; }
    };
    const J = forwardJacobian(safe, theta, fit.residuals, 1e-6, 1e-6);
    const cov = J ? invertSymmetric(normalEquations(J, fit.residuals).JtJ, 1e-10) : undefined;
    if (cov) {
      const s2 = sse / dof;
      const se = cov.map((row, k) => Math.sqrt(Math.max(0, s2 * row[k]!)));
      Object.assign(ci95, spec.ci(theta, se, studentTQuantile(0.975, dof)));
      // a standard error above ln 10 on a log parameter: the data do not fix it within a decade
      if (se.some((v) => v > Math.LN10)) identifiable = false;
    } else identifiable = false;
  } else warnings.push(`as many parameters as jar tests (${n}): no confidence intervals`);
  warnings.push(...calibrationPointsWarnings(n, spec.names.length));
  const c0Values = [...new Set(fitRows.map((r) => r.c0MgPerL))];
  const oneC0 = Math.max(...c0Values) / Math.min(...c0Values) < 1.5;
  if (model === 'ebc' && oneC0) warnings.push(`all jar tests are at one C0 (${fmtConcText(c0Values[0]!)}): K_EBC, 1/n_EBC and C0_EBC cannot be separated (at trace level only a combination is fixed); use --model sebc`);
  if (!identifiable && dof > 0) warnings.push(`parameters not identifiable from these data (${model === 'ebc' ? 'K_EBC, 1/n_EBC and C0_EBC trade off against each other' : 'the interval spans more than a decade'}); ${model === 'ebc' ? 'use --model sebc or add jar tests at a higher C0' : 'add jar tests over a wider dose range'}`);
  const rmse = Math.sqrt(sse / n);
  const maxAbs = Math.max(...Array.from(fit.residuals, Math.abs));
  if (rmse > POOR_FIT_RMSE_LN) warnings.push(`poor fit: RMSE of ln(c) is ${rmse.toFixed(2)} (about ${Math.round((Math.exp(rmse) - 1) * 100)} %); the model may not describe these jar tests`);
  const parameters = spec.report(theta);
  if (!Object.values(parameters).every(Number.isFinite)) throw new ComputationError(`${model} calibration produced a non-finite parameter`);
  // predicted-against-measured table over all rows (dose-0 rows included)
  const allModel = makeJarTestModel(data.rows);
  const cAll = allModel.predict(spec.build(theta));
  const table: CalibrationRow[] = data.rows.map((r, i) => {
    const row: CalibrationRow = {
      row: r.row, c0_mg_per_L: r.c0MgPerL, dose_mg_per_L: r.doseMgPerL,
      c_measured_mg_per_L: r.cMgPerL, c_predicted_mg_per_L: cAll[i]!,
      removal_measured: 1 - r.cMgPerL / r.c0MgPerL, removal_predicted: 1 - cAll[i]! / r.c0MgPerL,
      residual_ln: r.doseMgPerL > 0 ? Math.log(cAll[i]! / r.cMgPerL) : 0,
    };
    if (r.docMgPerL !== undefined) row.doc_mg_per_L = r.docMgPerL;
    return row;
  });
  const result: CalibrationResult = {
    model,
    compound: target.id,
    parameters,
    ci95,
    doc_mg_per_L: docRef ?? null,
    target: { id: target.id, K: target.K, one_over_n: target.oneOverN },
    fit: {
      rmse, residual: 'ln(c_predicted/c_measured)', points: n, parameters: p, degrees_of_freedom: dof, max_abs_residual: maxAbs,
      converged: fit.converged, stop: fit.stop, evaluations: fit.evaluations, starts: fit.starts, agreeing_starts: fit.agreeing,
    },
    table,
    warnings,
  };
  if (model === 'ebc' || model === 'sebc') {
    const c0E = parameters.c0_EBC_mg_per_L!;
    result.c0_EBC_per_DOC = docRef !== undefined ? c0E / docRef : null;
    if (docRef === undefined) warnings.push('no site DOC given (--doc or a DOC column): C0_EBC cannot be scaled to other DOC values');
    result.ebc_component = model === 'ebc'
      ? { id: ebcId, K: parameters.K_EBC!, one_over_n: parameters.one_over_n_EBC!, c0_mg_per_L: c0E }
      : { id: ebcId, K: target.K, one_over_n: target.oneOverN, c0_mg_per_L: c0E };
  } else {
    result.target.K_calibrated = target.K * parameters.K_factor!;
    if (background && docRef === undefined) result.doc_mg_per_L = background.doc0_mg_per_L;
  }
  return result;
}

function expCi(lnValue: number, se: number, t: number): [number, number] {
  return [Math.exp(lnValue - t * se), Math.exp(lnValue + t * se)];
}

function median(v: readonly number[]): number {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : 0.5 * (s[m - 1]! + s[m]!);
}

function fmtConcText(mgPerL: number): string {
  if (mgPerL < 1e-3) return `${Number((mgPerL * 1e6).toPrecision(4))} ng/L`;
  if (mgPerL < 1) return `${Number((mgPerL * 1e3).toPrecision(4))} µg/L`;
  return `${Number(mgPerL.toPrecision(4))} mg/L`;
}
