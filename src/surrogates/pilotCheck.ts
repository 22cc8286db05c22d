/**
 * Pilot pairs (UV254 reduction, measured removal) checked against the model's prediction.
 *
 * For each measured pair the model's removal is read from the predicted relation between UV254
 * reduction and removal (both computed over a dose sweep by `surrogateCurve`; both rise with the
 * dose, so removal is a function of UV254 reduction), by linear interpolation in the UV254
 * reduction. Residual = measured − predicted removal. A point is outside the band when
 * |residual| > band (default ±10 percentage points, common practice — cf. the ±10 % spread of
 * DOC-normalised removals across effluents in Zietzschmann et al. 2016, Water Research 102:190).
 * A compound with any point outside the band is named as an outlier, with its samples.
 * Beside the model, a site curve removal = 1 − (1 − ΔUV)^k is fitted per compound and over all
 * compounds (siteCurveFit.ts), and the same form is fitted to the model's removals at the same
 * UV254 reductions, so the two k can be compared over the range the pilot covered.
 *
 * Units: reductions and removals are fractions; the band is in percentage points.
 */
import { InputError } from '../core/errors.js';
import { fitSiteCurve, type SiteCurveFit } from './siteCurveFit.js';
import type { SurrogateCurve } from './surrogateCurve.js';

export interface PilotPair {
  sample: string;
  /** Spreadsheet row of the pair in its file (header = row 1), when read from a file. */
  row?: number;
  doseMgPerL?: number;
  /** UV254 reduction, fraction 0–1. */
  uv254Reduction: number;
  /** Measured removal of each compound (fraction); missing when not measured in this sample. */
  removals: Record<string, number | undefined>;
}

/** The model's removal of one compound against UV254 reduction (ascending UV254 reduction). */
export interface PredictedRelation {
  compound: string;
  uv254Reduction: number[];
  removal: number[];
}

export interface PilotResidual {
  sample: string;
  row?: number;
  compound: string;
  uv254Reduction: number;
  measuredRemoval: number;
  predictedRemoval: number;
  /** measured − predicted, fraction. */
  residual: number;
  outsideBand: boolean;
  /** The measured UV254 reduction lies beyond the predicted relation (value at its end used). */
  extrapolated: boolean;
}

export interface PilotCompoundCheck {
  compound: string;
  points: number;
  meanResidual: number;
  rmse: number;
  outliers: Array<{ sample: string; row?: number; residual: number }>;
  /** Site curve fitted to this compound's pilot pairs. */
  siteCurve: SiteCurveFit;
  /** The same form fitted to the model's removals at the measured UV254 reductions (compare k). */
  modelCurve: SiteCurveFit;
}

export interface PilotCheckResult {
  bandPercentagePoints: number;
  residuals: PilotResidual[];
  compounds: PilotCompoundCheck[];
  /** Compounds with at least one point outside the band. */
  outlierCompounds: string[];
  /** Site curve over all compounds' pairs together. */
  overall: { siteCurve: SiteCurveFit; rmse: number; points: number };
}

/** The predicted relations of every target from a surrogate curve (needs UV254 absorbances). */
export function relationsFromCurve(curve: SurrogateCurve): PredictedRelation[] {
  const pts = curve.points.filter((p) => p.uv254Reduction !== undefined).sort((a, b) => a.uv254Reduction! - b.uv254Reduction!);
  if (pts.length < 2) throw new InputError('the surrogate curve has no UV254 reduction; expected UV254 absorbances and at least two doses', { path: 'uv254AbsorbancePerM' });
  const ids = Object.keys(pts[0]!.removal);
  return ids.map((id) => ({ compound: id, uv254Reduction: pts.map((p) => p.uv254Reduction!), removal: pts.map((p) => p.removal[id]!) }));
}

/** Removal of the relation at UV254 reduction x, linear interpolation (clamped at the ends). */
export function removalAtUv254Reduction(rel: PredictedRelation, x: number): { removal: number; extrapolated: boolean } {
  const xs = rel.uv254Reduction;
  const ys = rel.removal;
  const n = xs.length;
  if (x <= xs[0]!) return { removal: ys[0]!, extrapolated: x < xs[0]! };
  if (x >= xs[n - 1]!) return { removal: ys[n - 1]!, extrapolated: x > xs[n - 1]! };
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) { const mid = (lo + hi) >> 1; if (xs[mid]! <= x) lo = mid; else hi = mid; }
  const x0 = xs[lo]!, x1 = xs[hi]!;
  const t = x1 > x0 ? (x - x0) / (x1 - x0) : 0;
  return { removal: ys[lo]! + t * (ys[hi]! - ys[lo]!), extrapolated: false };
}

/**
 * Check pilot pairs against the model's relations.
 * @param bandPct half-width of the acceptance band in percentage points (default 10)
 * @throws InputError for a compound in the pilot data without a predicted relation, or a bad band
 */
export function checkPilotPairs(pairs: readonly PilotPair[], relations: readonly PredictedRelation[], bandPct = 10): PilotCheckResult {
  if (!(bandPct > 0 && bandPct < 100)) throw new InputError(`expected a band between 0 and 100 percentage points, got ${bandPct}`, { path: 'bandPct' });
  if (pairs.length === 0) throw new InputError('expected at least one pilot pair', { path: 'pairs' });
  const band = bandPct / 100;
  const byId = new Map(relations.map((r) => [r.compound, r]));
  const compoundsInData: string[] = [];
  for (const p of pairs) for (const id of Object.keys(p.removals)) if (!compoundsInData.includes(id)) compoundsInData.push(id);
  if (compoundsInData.length === 0) throw new InputError('the pilot pairs have no measured removals; expected "removal <compound id> (%)" columns', { path: 'pairs' });
  for (const id of compoundsInData) {
    if (!byId.has(id)) throw new InputError(`pilot data name compound "${id}", which has no prediction; expected one of ${[...byId.keys()].map((k) => `"${k}"`).join(', ')}`, { column: `removal ${id}` });
  }
  const residuals: PilotResidual[] = [];
  for (const p of pairs) {
    for (const id of compoundsInData) {
      const m = p.removals[id];
      if (m === undefined) continue;
      const pred = removalAtUv254Reduction(byId.get(id)!, p.uv254Reduction);
      const residual = m - pred.removal;
      const r: PilotResidual = {
        sample: p.sample, compound: id, uv254Reduction: p.uv254Reduction, measuredRemoval: m,
        predictedRemoval: pred.removal, residual, outsideBand: Math.abs(residual) > band, extrapolated: pred.extrapolated,
      };
      if (p.row !== undefined) r.row = p.row;
      residuals.push(r);
    }
  }
  const compounds = compoundsInData.map((id): PilotCompoundCheck => {
    const rs = residuals.filter((r) => r.compound === id);
    const n = rs.length;
    return {
      compound: id,
      points: n,
      meanResidual: rs.reduce((s, r) => s + r.residual, 0) / n,
      rmse: Math.sqrt(rs.reduce((s, r) => s + r.residual ** 2, 0) / n),
      outliers: rs.filter((r) => r.outsideBand).map((r) => ({ sample: r.sample, ...(r.row !== undefined ? { row: r.row } : {}), residual: r.residual })),
      siteCurve: fitSiteCurve(rs.map((r) => r.uv254Reduction), rs.map((r) => r.measuredRemoval)),
      modelCurve: fitSiteCurve(rs.map((r) => r.uv254Reduction), rs.map((r) => r.predictedRemoval)),
    };
  });
  return {
    bandPercentagePoints: bandPct,
    residuals,
    compounds,
    outlierCompounds: compounds.filter((c) => c.outliers.length > 0).map((c) => c.compound),
    overall: {
      siteCurve: fitSiteCurve(residuals.map((r) => r.uv254Reduction), residuals.map((r) => r.measuredRemoval)),
      rmse: Math.sqrt(residuals.reduce((s, r) => s + r.residual ** 2, 0) / residuals.length),
      points: residuals.length,
    },
  };
}
