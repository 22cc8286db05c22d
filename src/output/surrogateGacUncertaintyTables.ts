/**
 * The CSV tables of capabilities 11–13 (surrogates.csv, setpoints.csv, pilot_check.csv, gac.csv,
 * uncertainty.csv): plain text from the pipeline result, units in the headers. A table that does
 * not apply to the run (no pilot data, no GAC carbon, Monte Carlo off) is written with its header
 * only, so the set of files is always the same.
 */
import { toCsv } from './outputTables.js';
import type { PipelineResult } from '../pipeline/pipelineTypes.js';

type Cell = string | number | null | undefined;
const pct = (x: number | null | undefined): number | null => (x === null || x === undefined ? null : x * 100);

/** DOC and UV254 reduction beside each compound's removal at the sweep doses. */
export function surrogatesCsv(r: PipelineResult): string {
  const ids = r.project.compounds.map((c) => c.id);
  const rows: Cell[][] = [];
  for (const cr of r.carbons) {
    const s = cr.surrogates;
    if (!s) continue;
    for (const p of s.curve.points) rows.push([cr.carbon.name, p.doseMgPerL, p.docMgPerL, pct(p.docReduction), p.uv254PerM, pct(p.uv254Reduction), ...ids.map((id) => pct(p.removal[id]))]);
  }
  return toCsv(['carbon', 'dose (mg/L)', 'DOC (mg/L)', 'DOC reduction (%)', 'UV254 (1/m)', 'UV254 reduction (%)', ...ids.map((id) => `${id} removal (%)`)], rows);
}

/** The UV254-reduction set-point of every compound, the governing one and the one at the required dose. */
export function setpointsCsv(r: PipelineResult): string {
  const rows: Cell[][] = [];
  for (const cr of r.carbons) {
    const s = cr.surrogates;
    if (!s) continue;
    for (const sp of s.setPoints) {
      rows.push([cr.carbon.name, sp.compoundId, sp.goalText, pct(Math.max(0, sp.removalGoal)), sp.status, sp.doseMgPerL, pct(sp.uv254Reduction), pct(sp.docReduction), s.governing?.compoundId === sp.compoundId ? 'governing compound' : '']);
    }
    if (s.atRequiredDose) {
      const a = s.atRequiredDose;
      rows.push([cr.carbon.name, '(required dose)', `governed by ${a.governedBy}`, null, 'ok', a.doseMgPerL, pct(a.uv254Reduction), pct(a.docReduction), 'dose to this set-point']);
    }
  }
  return toCsv(['carbon', 'compound', 'goal', 'goal removal (%)', 'status', 'dose for goal (mg/L)', 'UV254 reduction set-point (%)', 'DOC reduction at that dose (%)', 'role'], rows);
}

/** Pilot residuals, one row per (sample, compound), with the compound's site and model curves. */
export function pilotCheckCsv(r: PipelineResult): string {
  const rows: Cell[][] = [];
  const p = r.pilot;
  if (p) {
    for (const x of p.check.residuals) {
      const c = p.check.compounds.find((k) => k.compound === x.compound)!;
      rows.push([p.carbonName, x.sample, x.row, x.compound, pct(x.uv254Reduction), pct(x.measuredRemoval), pct(x.predictedRemoval), pct(x.residual), x.outsideBand ? 'yes' : 'no', x.extrapolated ? 'yes' : 'no',
        p.bandPercent, c.siteCurve.k, c.modelCurve.k, p.check.outlierCompounds.includes(x.compound) ? 'yes' : 'no']);
    }
  }
  return toCsv(['carbon', 'sample', 'row', 'compound', 'UV254 reduction (%)', 'measured removal (%)', 'predicted removal (%)', 'residual (percentage points)', 'outside band', 'extrapolated',
    'band (± percentage points)', 'site curve k', 'model curve k', 'compound named as outlier'], rows);
}

/**
 * GAC equilibrium estimate per (GAC carbon, compound): a reference, not a bound (GAC_UPPER_BOUND_CAUTION);
 * for a carbon with fixed-bed inputs the note says the run length is the kinetic one (gac_kinetic).
 */
export function gacCsv(r: PipelineResult): string {
  const rows: Cell[][] = [];
  for (const cr of r.carbons) {
    const g = cr.gac;
    if (!g) continue;
    for (const t of g.estimate.targets) {
      rows.push([cr.carbon.name, t.id, t.c0MgPerL * 1e6, g.docMgPerL, g.bedDensityKgPerM3, g.ebctMin, t.qCompetitiveMgPerG, t.qSingleMgPerG, t.bedVolumes, t.bedVolumesSingleSolute,
        t.carbonUsageGPerM3, t.carbonUsageSingleSoluteGPerM3, t.lifeDays, t.lifeDaysSingleSolute, t.carbonTonnesPerYear, (t.carbonTonnesPerYear ?? 0) * 1000 * cr.carbon.pricePerKg, cr.carbon.currency,
        g.governing.id === t.id ? 'yes' : 'no', cr.gacKinetic ? 'reference (equilibrium, not a bound); the run length is the fixed-bed model\'s (GAC breakthrough)' : 'reference (equilibrium, not a bound; preloading and kinetics usually shorten real runs)']);
    }
  }
  return toCsv(['carbon', 'compound', 'c0 (ng/L)', 'DOC (mg/L)', 'bed density (kg/m3)', 'EBCT (min)', 'q with competition (mg/g)', 'q single-solute (mg/g)', 'bed volumes', 'bed volumes single-solute',
    'carbon usage (g/m3)', 'carbon usage single-solute (g/m3)', 'operating life (d)', 'operating life single-solute (d)', 'carbon at design flow (t/a)', 'carbon cost per year', 'currency', 'governing', 'note'], rows);
}

/** Monte Carlo percentiles per (carbon, quantity). */
export function uncertaintyCsv(r: PipelineResult): string {
  const rows: Cell[][] = [];
  for (const cr of r.carbons) {
    const u = cr.uncertainty;
    if (!u) continue;
    for (const q of u.result.quantities) {
      const f = q.unit === 'fraction' ? 100 : 1;
      const unit = q.unit === 'fraction' ? '%' : q.unit === 'currency/a' ? `${cr.carbon.currency}/a` : q.unit === 'currency/m3' ? `${cr.carbon.currency}/m3` : q.unit;
      const v = (x: number) => (Number.isFinite(x) ? x * f : 'unreachable');
      rows.push([cr.carbon.name, q.key, q.label, unit, v(q.pointEstimate), v(q.p10), v(q.p50), v(q.p90), q.unreachableDraws, u.result.draws, u.result.seed]);
    }
  }
  return toCsv(['carbon', 'quantity', 'label', 'unit', 'point estimate', 'P10', 'P50', 'P90', 'unreachable draws', 'draws', 'seed'], rows);
}
