/**
 * Fit fictive DOC components to a DOC isotherm (adsorption analysis; Worch 2012, Adsorption
 * Technology in Water Treatment, from memory): a non-adsorbable share φ_0 plus M adsorbable
 * components with one common exponent 1/n and K either fixed on a grid or fitted, minimising
 *   S = Σ_rows ((DOC_pred − DOC_meas)/DOC_meas)²
 * with DOC_pred from batch IAST (see isothermModel.ts): relative residuals, because DOC analyses
 * carry a roughly constant relative error (common practice); the RMSE is also reported in mg/L. Shares are non-negative and sum to 1
 * (softmax transform); K is fitted as ln K. Several starts, Nelder–Mead, Levenberg–Marquardt
 * polish (leastSquares.ts).
 *
 * Uncertainty: linearised covariance s²·(JᵀJ)⁻¹ with s² = S/(n − p) and J the finite-difference
 * Jacobian in the natural parameters (the shares except the largest, which is 1 minus the rest,
 * and ln K); 95 % intervals use Student's t with n − p degrees of freedom (Bates & Watts 1988,
 * Nonlinear Regression Analysis and Its Applications, Wiley, §2.3), clipped to [0, 1]. A share
 * at the bound 0 gets the one-sided interval [0, t·se]; K of a share at 0 gets none (null).
 * @throws ComputationError when the fit does not converge
 */
import { ComputationError } from '../core/errors.js';
import { fitLeastSquares, forwardJacobian } from '../numerics/leastSquares.js';
import { invertSymmetric, normalEquations } from '../numerics/linearSystem.js';
import { studentTQuantile } from '../numerics/studentT.js';
import { makeIsothermModel, type IsothermModel } from './isothermModel.js';
import type { IsothermRow } from './isothermData.js';

export interface BackgroundFitOptions {
  oneOverN: number;
  /** K of the adsorbable components (fixed grid, or starting values when fitK), ascending. */
  kGrid: number[];
  fitK: boolean;
}

export interface BackgroundFitResult {
  /** Shares, index 0 = non-adsorbable; sum 1. */
  fractions: number[];
  /** K per component, K[0] = 0, (mg/g)/(mg/L)^(1/n); ascending for the adsorbable ones. */
  K: number[];
  /** Predicted DOC per fitted row, mg/L. */
  predicted: Float64Array;
  /** Component concentrations per fitted row, mg/L. */
  c: Float64Array[];
  /** Sum of squared relative residuals (the fitted objective). */
  sse: number;
  /** Root-mean-square DOC residual, mg/L. */
  rmse: number;
  /** Root-mean-square relative residual. */
  rmseRelative: number;
  maxRelativeError: number;
  points: number;
  parameters: number;
  dof: number;
  aicc: number | null;
  fractionCi: Array<[number, number] | null>;
  KCi: Array<[number, number] | null>;
  identifiable: boolean;
  converged: boolean;
  stop: string;
  evaluations: number;
  starts: number;
  agreeing: number;
}

const BOUND_SHARE = 1e-7;

function softmax(z: readonly number[]): number[] {
  const mx = Math.max(0, ...z);
  const e = [Math.exp(-mx), ...z.map((v) => Math.exp(v - mx))];
  const s = e.reduce((a, b) => a + b, 0);
  return e.map((v) => v / s);
}

function logits(f: readonly number[]): number[] {
  return f.slice(1).map((v) => Math.log(Math.max(v, 1e-12) / Math.max(f[0]!, 1e-12)));
}

/** Corrected Akaike criterion for least squares (Hurvich & Tsai 1989, Biometrika 76(2):297–307). */
export function aiccLeastSquares(sse: number, n: number, k: number): number | null {
  if (n - k - 1 <= 0) return null;
  return n * Math.log(Math.max(sse, 1e-300) / n) + 2 * k + (2 * k * (k + 1)) / (n - k - 1);
}

/** Fit one configuration (M = kGrid.length adsorbable components) to the rows with dose > 0. */
export function fitBackground(fitRows: readonly IsothermRow[], opts: BackgroundFitOptions): BackgroundFitResult {
  const M = opts.kGrid.length;
  const n = fitRows.length;
  const model: IsothermModel = makeIsothermModel(fitRows, opts.oneOverN);
  const meas = Float64Array.from(fitRows, (r) => r.docMgPerL);
  const resid = (fr: readonly number[], K: readonly number[]) => {
    const p = model.predict(fr, K).doc;
    for (let i = 0; i < n; i++) p[i] = (p[i]! - meas[i]!) / meas[i]!;
    return p;
  };
  const kOf = (x: readonly number[]) => [0, ...(opts.fitK ? x.slice(M).map(Math.exp) : opts.kGrid)];
  const problemResiduals = (x: readonly number[]) => resid(softmax(x.slice(0, M)), kOf(x));

  // starting points: equal shares; a non-adsorbable share from the highest-dose plateau with the
  // rest equal, weighted to weak, weighted to strong components
  const plateau = Math.min(...fitRows.map((r) => r.docMgPerL / r.doc0MgPerL));
  const f0 = Math.min(0.9, Math.max(0.02, 0.9 * plateau));
  const shareStarts: number[][] = [
    new Array(M + 1).fill(1 / (M + 1)),
    [f0, ...new Array(M).fill((1 - f0) / M)],
    weighted(f0, M, (j) => 2 ** -j),
    weighted(f0, M, (j) => 2 ** j),
  ];
  const lnGrid = opts.kGrid.map(Math.log);
  const starts: number[][] = [];
  for (const s of shareStarts) starts.push(opts.fitK ? [...logits(s), ...lnGrid] : logits(s));
  if (opts.fitK) for (const shift of [-1.5, 1.5]) starts.push([...logits(shareStarts[1]!), ...lnGrid.map((v) => v + shift)]);
  const p = opts.fitK ? 2 * M : M;
  const lower = [...new Array(M).fill(-30), ...(opts.fitK ? new Array(M).fill(Math.log(1e-4)) : [])];
  const upper = [...new Array(M).fill(30), ...(opts.fitK ? new Array(M).fill(Math.log(1e5)) : [])];
  const fit = fitLeastSquares({ residuals: problemResiduals, starts, lower, upper, residualScale: 1, what: `fractionation with ${M} adsorbable component${M > 1 ? 's' : ''}` });
  if (!fit.converged) throw new ComputationError(`fractionation with ${M} components did not converge (${fit.stop})`);

  // order adsorbable components by K
  let fractions = softmax(fit.x.slice(0, M));
  let K = kOf(fit.x);
  const order = Array.from({ length: M }, (_, j) => j + 1).sort((a, b) => K[a]! - K[b]!);
  fractions = [fractions[0]!, ...order.map((j) => fractions[j]!)];
  K = [0, ...order.map((j) => K[j]!)];
  const pred = model.predict(fractions, K);
  const residuals = pred.doc.map((v, i) => (v - meas[i]!) / meas[i]!);
  let sse = 0, sseAbs = 0, maxRel = 0;
  residuals.forEach((r, i) => { sse += r * r; sseAbs += (r * meas[i]!) ** 2; maxRel = Math.max(maxRel, Math.abs(r)); });

  // confidence intervals in natural parameters
  const dof = n - p;
  const fractionCi: Array<[number, number] | null> = fractions.map(() => null);
  const KCi: Array<[number, number] | null> = K.map(() => null);
  let identifiable = false;
  const dependent = fractions.indexOf(Math.max(...fractions));
  // shares at the bound 0 stay in (forward differences step into the feasible side), so their
  // interval is one-sided, [0, t·se]
  const freeShares = fractions.map((f, j) => j).filter((j) => j !== dependent);
  const freeK = opts.fitK ? K.map((_, j) => j).filter((j) => j > 0 && fractions[j]! > BOUND_SHARE) : [];
  const theta0 = [...freeShares.map((j) => fractions[j]!), ...freeK.map((j) => Math.log(K[j]!))];
  const natural = (th: readonly number[]): Float64Array | undefined => {
    const fr = [...fractions];
    freeShares.forEach((j, k) => { fr[j] = th[k]!; });
    fr[dependent] = 1 - fr.reduce((s, v, j) => (j === dependent ? s : s + v), 0);
    if (fr.some((v) => v < 0)) return undefined;
    const kk = [...K];
    freeK.forEach((j, k) => { kk[j] = Math.exp(th[freeShares.length + k]!); });
    try {
      return resid(fr, kk);
    } catch (e) {
      if (e instanceof ComputationError) return undefined;
      throw e;
    }
  };
  if (dof > 0 && theta0.length > 0) {
    const J = forwardJacobian(natural, theta0, residuals, 1e-6, 1e-8);
    const cov = J ? invertSymmetric(normalEquations(J, residuals).JtJ, 1e-13) : undefined;
    if (cov) {
      identifiable = true;
      const s2 = sse / dof;
      const t = studentTQuantile(0.975, dof);
      const clip = (v: number) => Math.min(1, Math.max(0, v));
      freeShares.forEach((j, k) => {
        const se = Math.sqrt(Math.max(0, s2 * cov[k]![k]!));
        fractionCi[j] = [clip(fractions[j]! - t * se), clip(fractions[j]! + t * se)];
      });
      let varDep = 0;
      for (let a = 0; a < freeShares.length; a++) for (let b = 0; b < freeShares.length; b++) varDep += cov[a]![b]!;
      const seDep = Math.sqrt(Math.max(0, s2 * varDep));
      fractionCi[dependent] = [clip(fractions[dependent]! - t * seDep), clip(fractions[dependent]! + t * seDep)];
      freeK.forEach((j, k) => {
        const idx = freeShares.length + k;
        const se = Math.sqrt(Math.max(0, s2 * cov[idx]![idx]!));
        KCi[j] = [K[j]! * Math.exp(-t * se), K[j]! * Math.exp(t * se)];
      });
    }
  }
  const finite = [...fractions, ...K, sse].every(Number.isFinite);
  if (!finite) throw new ComputationError('fractionation produced a non-finite result');
  return {
    fractions, K, predicted: pred.doc, c: pred.c, sse, rmse: Math.sqrt(sseAbs / n), rmseRelative: Math.sqrt(sse / n), maxRelativeError: maxRel,
    points: n, parameters: p, dof, aicc: aiccLeastSquares(sse, n, p + 1), fractionCi, KCi, identifiable,
    converged: fit.converged, stop: fit.stop, evaluations: fit.evaluations, starts: fit.starts, agreeing: fit.agreeing,
  };
}

function weighted(f0: number, M: number, w: (j: number) => number): number[] {
  const ws = Array.from({ length: M }, (_, j) => w(j));
  const s = ws.reduce((a, b) => a + b, 0);
  return [f0, ...ws.map((v) => ((1 - f0) * v) / s)];
}
