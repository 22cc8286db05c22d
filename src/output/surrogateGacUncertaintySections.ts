/**
 * Report sections of capabilities 11–13 (surrogate set-points, pilot check, GAC estimate,
 * Monte Carlo percentiles) and the loading plot of capability 8, filled from a pipeline result.
 * Presentation only: every number comes from the pipeline.
 */
import type { PlotSeries, PlotSpec, ReportSection, ReportTable, XYPlotSpec } from './reportModel.js';
import { siteCurveRemoval } from '../surrogates/siteCurveFit.js';
import { GAC_UPPER_BOUND_CAUTION } from '../gac/gacEstimate.js';
import { fmtConcentration as fc, fmtFixed, fmtMoney, fmtNumber as fn, fmtWhole } from './formatting.js';
import { contactMonteCarloNote } from './contactMonteCarloNote.js';
import { monteCarloNote } from './monteCarloNote.js';
import type { CarbonResult, PipelineResult } from '../pipeline/pipelineTypes.js';
import { CI_TO_SD_NOTE } from '../pipeline/uncertaintyStep.js';
import { specificDose } from '../design/specificDose.js';

const pct = (x: number | null | undefined, sig = 3) => (x === null || x === undefined ? '—' : `${fn(x * 100, sig)} %`);

/** Single-solute against site-water loading of every compound at the design dose (log axes, 1:1 line). */
export function loadingPlot(cr: CarbonResult, index: number): XYPlotSpec | undefined {
  const rl = cr.reducedLoadings;
  if (!rl || rl.length === 0) return undefined;
  const all = rl.flatMap((x) => [x.qSingleMgPerG, x.qSiteMgPerG]).filter((v) => v > 0 && Number.isFinite(v));
  if (all.length === 0) return undefined;
  const lo = Math.min(...all) / 1.5, hi = Math.max(...all) * 1.5;
  return {
    kind: 'xy', id: `loading-${index + 1}`, title: `Loading in the site water against single-solute loading at the same c — ${cr.carbon.name}, ${fn(cr.designDoseMgPerL!, 3)} mg/L`,
    xLabel: 'q single-solute at the same c (mg/g)', yLabel: 'q in the site water (mg/g)', xLog: true, yLog: true,
    series: [
      { name: 'equal loading (no competition)', points: [[lo, lo], [hi, hi]], style: 'dashed', key: 'reference' },
      ...rl.map((x): PlotSeries => ({ name: x.compoundId, key: x.compoundId, points: [[x.qSingleMgPerG, x.qSiteMgPerG]], style: 'points' })),
    ],
  };
}

/** Surrogate set-points and the removal / UV254 / DOC reduction plot per PAC carbon. */
export function surrogateSection(r: PipelineResult): ReportSection | undefined {
  const withS = r.carbons.filter((c) => c.surrogates);
  if (withS.length === 0) return undefined;
  const tables: ReportTable[] = [];
  const plots: PlotSpec[] = [];
  const paragraphs = [
    'DOC and UV254 reduction are predicted from the fictive DOC components (batch IAST; UV254 additive over the components with the absorbances fitted to the UV254 isotherm, Beer–Lambert). The set-point of a compound is the UV254 reduction at the dose that meets its goal; operators dose to the set-point of the required dose (UV254 reduction as a control parameter: Altmann et al. 2016, Water Research 94:240–245). Confirm the relation on site (pilot check below).',
  ];
  withS.forEach((cr, k) => {
    const s = cr.surrogates!;
    const a = s.atRequiredDose;
    if (a) paragraphs.push(`${cr.carbon.name}: dose to a UV254 reduction of ${pct(a.uv254Reduction)} (DOC reduction ${pct(a.docReduction)}) — the required dose ${fn(a.doseMgPerL, 3)} mg/L, governed by ${a.governedBy}.`);
    tables.push({
      caption: `${cr.carbon.name}: set-points per compound at DOC ${fn(r.project.site.docMgPerL, 3)} mg/L`,
      columns: ['compound', 'goal', 'dose (mg/L)', 'mg carbon per mg DOC', 'UV254 reduction', 'DOC reduction', 'role'],
      rows: s.setPoints.map((sp) => [sp.compoundId, sp.goalText, sp.status === 'met' ? fn(sp.doseMgPerL!, 3) : sp.status, sp.status === 'met' ? fn(sp.doseMgPerL! / r.project.site.docMgPerL, 3) : '—', pct(sp.uv254Reduction), pct(sp.docReduction), s.governing?.compoundId === sp.compoundId ? 'governing' : '']),
    });
    const pts = s.curve.points;
    const gov = s.governing?.compoundId;
    const series: PlotSeries[] = r.project.compounds.map((c) => ({ name: gov === c.id ? `${c.id} (governing)` : c.id, key: c.id, emphasis: gov === c.id, points: pts.map((p) => [p.doseMgPerL, 100 * p.removal[c.id]!] as [number, number]) }));
    if (s.hasUv254) series.push({ name: 'UV254 reduction', key: 'uv254-reduction', points: pts.map((p) => [p.doseMgPerL, 100 * p.uv254Reduction!] as [number, number]), style: 'dashed' });
    series.push({ name: 'DOC reduction', key: 'doc-reduction', points: pts.map((p) => [p.doseMgPerL, 100 * p.docReduction] as [number, number]), style: 'dashed' });
    const plot: XYPlotSpec = { kind: 'xy', id: `surrogates-${k + 1}`, title: `Removal, UV254 and DOC reduction against dose — ${cr.carbon.name}`, xLabel: 'carbon dose (mg/L)', yLabel: 'removal or reduction (%)', xLog: true, yRange: [0, 100], series };
    if (a) {
      plot.vLines = [{ x: a.doseMgPerL, label: `required ${fn(a.doseMgPerL, 3)} mg/L` }];
      if (a.uv254Reduction !== null) plot.hLines = [{ y: 100 * a.uv254Reduction, label: `set-point ${fn(100 * a.uv254Reduction, 3)} %` }];
    }
    plots.push(plot);
  });
  const warnings = withS.filter((c) => !c.surrogates!.hasUv254).map((c) => `${c.carbon.name}: no UV254 absorbances in the background; DOC reduction only.`);
  return { id: 'surrogates', heading: 'Surrogate set-points (UV254 and DOC reduction)', paragraphs, tables, plots, warnings };
}

/** Pilot pairs against the prediction, residuals, outliers and site curves. */
export function pilotSection(r: PipelineResult): ReportSection | undefined {
  const p = r.pilot;
  if (!p) return undefined;
  const ch = p.check;
  const rows = ch.compounds.map((c) => [c.compound, c.points, fmtFixed(c.meanResidual * 100, 1), fmtFixed(c.rmse * 100, 1), c.outliers.length ? c.outliers.map((o) => o.sample).join(', ') : '—',
    `${fn(c.siteCurve.k, 3)}${Number.isFinite(c.siteCurve.standardErrorK) ? ` ± ${fn(c.siteCurve.standardErrorK, 2)}` : ''}`, fn(c.modelCurve.k, 3)]);
  const maxUv = Math.min(1, Math.max(...ch.residuals.map((x) => x.uv254Reduction)) * 1.15);
  const xs = Array.from({ length: 41 }, (_, i) => (maxUv * i) / 40);
  const band = p.bandPercent;
  // A: measured against predicted, one series per compound (colours stay with the compound)
  const scatter: XYPlotSpec = {
    kind: 'xy', id: 'pilot-measured-predicted', title: `Measured against predicted removal at the pilot's UV254 reduction — ${p.carbonName}`,
    xLabel: 'predicted removal (%)', yLabel: 'measured removal (%)', xRange: [0, 100], yRange: [0, 100],
    series: [
      { name: 'measured = predicted', points: [[0, 0], [100, 100]], style: 'dashed', key: 'reference' },
      { name: `−${fn(band, 3)} percentage points`, points: [[band, 0], [100, 100 - band]], style: 'dashed', key: 'reference', dash: '2 3' },
      { name: `+${fn(band, 3)} percentage points`, points: [[0, band], [100 - band, 100]], style: 'dashed', key: 'reference', dash: '2 3' },
      ...ch.compounds.map((c): PlotSeries => ({ name: c.compound, key: c.compound, points: ch.residuals.filter((x) => x.compound === c.compound).map((x) => [100 * x.predictedRemoval, 100 * x.measuredRemoval] as [number, number]), style: 'points' })),
    ],
  };
  // B: against UV254 reduction for the compound that fits worst (an outlier when there is one)
  const worst = [...ch.compounds].sort((x, y) => (ch.outlierCompounds.includes(y.compound) ? 1 : 0) - (ch.outlierCompounds.includes(x.compound) ? 1 : 0) || y.rmse - x.rmse)[0]!;
  const rel = p.relations.find((x) => x.compound === worst.compound)!;
  const against: XYPlotSpec = {
    kind: 'xy', id: 'pilot-check', title: `Removal of ${worst.compound} against UV254 reduction: pilot, model and site curves — ${p.carbonName}`,
    xLabel: 'UV254 reduction (%)', yLabel: 'removal (%)', xRange: [0, 100 * maxUv], yRange: [0, 100],
    series: [
      { name: `${worst.compound} model`, key: worst.compound, points: rel.uv254Reduction.map((u, i) => [100 * u, 100 * rel.removal[i]!] as [number, number]).filter(([u]) => u <= 100 * maxUv) },
      { name: `${worst.compound} pilot`, key: worst.compound, points: ch.residuals.filter((x) => x.compound === worst.compound).map((x) => [100 * x.uv254Reduction, 100 * x.measuredRemoval] as [number, number]), style: 'points' },
      { name: `site curve ${worst.compound} (k = ${fn(worst.siteCurve.k, 3)})`, points: xs.map((u) => [100 * u, 100 * siteCurveRemoval(worst.siteCurve.k, u)] as [number, number]), style: 'dashed', key: worst.compound },
      { name: `site curve, all compounds (k = ${fn(ch.overall.siteCurve.k, 3)})`, key: 'reference', points: xs.map((u) => [100 * u, 100 * siteCurveRemoval(ch.overall.siteCurve.k, u)] as [number, number]), style: 'dashed' },
    ],
  };
  return {
    id: 'pilot', heading: 'Pilot check: measured against predicted removal',
    paragraphs: [
      `${ch.overall.points} pilot pairs${p.file ? ` (${p.file.split(/[\\/]/).pop()})` : ''} on ${p.carbonName}, compared with the model's removal at the same UV254 reduction (model: ${p.relationModel}). Band ±${p.bandPercent} percentage points (common practice). ${ch.outlierCompounds.length ? `Outside the band: ${ch.outlierCompounds.join(', ')} — use the site curve for ${ch.outlierCompounds.length > 1 ? 'these compounds' : 'this compound'} or find the cause before dosing by the model.` : 'Every compound lies within the band.'}`,
      `Site curve: ${ch.overall.siteCurve.form}; fitted to the pilot pairs (site k) and to the model's removals at the same UV254 reductions (model k), so the two can be compared.`,
    ],
    tables: [{ caption: 'Residuals per compound (measured − predicted, percentage points)', columns: ['compound', 'points', 'mean residual', 'RMSE', 'outside the band', 'site k', 'model k'], rows }],
    plots: [scatter, against],
    warnings: ch.outlierCompounds.map((id) => `${id}: measured removals outside ±${p.bandPercent} percentage points of the prediction`),
  };
}

/** GAC equilibrium estimate per GAC carbon: a reference (GAC_UPPER_BOUND_CAUTION). */
export function gacSection(r: PipelineResult): ReportSection | undefined {
  const withG = r.carbons.filter((c) => c.gac);
  if (withG.length === 0) return undefined;
  const paragraphs = ['Equilibrium column estimate: bed volumes BV = ρ_bed·q/c0 and carbon usage rate c0/q, with q in equilibrium with the feed (direct IAST of the compound with its competitors at the design DOC); single-solute beside it. Operating life = BV × EBCT.'];
  const tables: ReportTable[] = withG.map((cr) => {
    const g = cr.gac!;
    paragraphs.push(`${cr.carbon.name}: bed density ${fn(g.bedDensityKgPerM3, 3)} kg/m³, EBCT ${fn(g.ebctMin, 3)} min${g.estimate.bedVolumeM3 !== undefined ? `, bed ${fmtWhole(g.estimate.bedVolumeM3)} m³ holding ${fn(g.estimate.bedCarbonTonnes!, 3)} t of carbon at ${fmtWhole(g.flowM3PerD)} m³/d` : ''}. Governing: ${g.governing.id}, ${fmtWhole(g.governing.bedVolumes)} bed volumes (${fn(g.governing.lifeDays ?? NaN, 3)} days), ${fn(g.governing.carbonUsageGPerM3, 3)} g/m³ — ${fmtWhole(g.governing.carbonTonnesPerYear ?? 0)} t/a, ${fmtMoney(g.yearlyCost, g.currency)} per year at equilibrium (a reference, not a bound).`);
    return {
      caption: `${cr.carbon.name} — equilibrium estimate (a reference, not a bound)`,
      columns: ['compound', 'c0', 'q (mg/g)', 'q single (mg/g)', 'bed volumes', 'BV single', 'usage (g/m³)', 'life (d)', 'carbon (t/a)', 'role'],
      rows: g.estimate.targets.map((t) => [t.id, fc(t.c0MgPerL), fn(t.qCompetitiveMgPerG, 3), fn(t.qSingleMgPerG, 3), fmtWhole(t.bedVolumes), fmtWhole(t.bedVolumesSingleSolute), fn(t.carbonUsageGPerM3, 3), t.lifeDays !== undefined ? fn(t.lifeDays, 3) : '—', t.carbonTonnesPerYear !== undefined ? fn(t.carbonTonnesPerYear, 3) : '—', t.id === g.governing.id ? 'governing' : '']),
    };
  });
  return { id: 'gac', heading: 'GAC estimate (equilibrium, a reference)', paragraphs, tables, warnings: [GAC_UPPER_BOUND_CAUTION] };
}

/** Monte Carlo settings, parameters, percentiles and the removal band of the governing compound. */
export function uncertaintySection(r: PipelineResult): ReportSection | undefined {
  const withU = r.carbons.filter((c) => c.uncertainty);
  if (withU.length === 0 || !r.uncertainty) return undefined;
  const s = r.uncertainty;
  const first = withU[0]!.uncertainty!;
  const paragraphs = [
    `Monte Carlo: ${first.result.draws} draws per carbon, seed ${first.result.seed} (${s.source}); the same draws for every carbon. Sampling: ${first.result.sampling}. Percentiles: ${first.result.percentileMethod}. ${CI_TO_SD_NOTE[0]!.toUpperCase()}${CI_TO_SD_NOTE.slice(1)}. In each draw the required dose is the largest of the compound doses and, where the project sets one, the indicator-mean dose, as in the run.`,
    ...withU.flatMap((cr) => monteCarloNote(cr)),
    ...contactMonteCarloNote(r),
    ...r.carbons.filter((c) => c.gacUncertainty).map((c) => `${c.carbon.name} (GAC): ${c.gacUncertainty!.draws} draws of the run length and carbon use, with the background at its point value — see the GAC breakthrough section.`),
  ];
  const tables: ReportTable[] = [{
    caption: 'Uncertain parameters',
    columns: ['parameter', 'distribution', 'SD', 'basis'],
    rows: first.parameters.map((p) => [p.parameter, p.distribution, p.distribution === 'lognormal' ? `${fn(p.sd * 100, 3)} % (relative)` : fn(p.sd, 3), p.basis]),
  }];
  const plots: PlotSpec[] = [];
  withU.forEach((cr, k) => {
    const u = cr.uncertainty!;
    const docMgPerL = r.project.site.docMgPerL;
    tables.push({
      caption: `${cr.carbon.name}: point estimate and P10 / P50 / P90; doses also per mg of the design DOC (${fn(docMgPerL, 3)} mg/L) in brackets${u.excluded.length ? ` (left out: ${u.excluded.join(', ')})` : ''}`,
      columns: ['quantity', 'unit', 'point', 'P10', 'P50', 'P90'],
      rows: u.result.quantities.map((q) => {
        const cell = (x: number) => monteCarloCell(q.unit, x, docMgPerL);
        return [q.label, monteCarloUnit(q.unit, cr.carbon.currency), cell(q.pointEstimate), cell(q.p10), cell(q.p50), cell(q.p90)];
      }),
    });
    const gc = u.governingCurve;
    if (gc) {
      plots.push({
        kind: 'xy', id: `uncertainty-removal-${k + 1}`, title: `Removal of ${gc.compoundId} against dose, P10–P90 band of ${gc.draws} draws — ${cr.carbon.name}`,
        xLabel: 'carbon dose (mg/L)', yLabel: 'removal (%)', xLog: true, yRange: [0, 100],
        series: [{ name: `${gc.compoundId} (median of draws)`, key: gc.compoundId, points: gc.dosesMgPerL.map((d, i) => [d, gc.p50Percent[i]!] as [number, number]), band: { lower: gc.p10Percent, upper: gc.p90Percent, label: 'P10–P90' } }],
        hLines: [{ y: 100 * (u.problem.targets.find((t) => t.id === gc.compoundId)?.removalGoal ?? 0.8), label: 'goal' }],
      });
    }
  });
  return { id: 'uncertainty', heading: 'Uncertainty (Monte Carlo)', paragraphs, tables, plots, warnings: withU.flatMap((c) => (c.uncertainty!.result.quantities.some((q) => q.unreachableDraws > 0) ? [`${c.carbon.name}: some draws reach no goal up to 5 g/L (counted as unreachable)`] : [])) };
}

/** The unit column of the Monte Carlo table; the cells then carry bare numbers. */
function monteCarloUnit(unit: string, currency: string): string {
  if (unit === 'mg/L') return 'mg/L (mg/mg DOC)';
  if (unit === 'fraction') return '%';
  if (unit === 'currency/a') return `${currency}/a`;
  if (unit === 'currency/m3') return `${currency}/m³`;
  if (unit === 'kg/a') return 't/a';
  return unit;
}

/** A Monte Carlo cell in the unit of `monteCarloUnit`: a dose with its specific dose (dose ÷ design DOC) in brackets. */
function monteCarloCell(unit: string, x: number, docMgPerL: number): string {
  if (!Number.isFinite(x)) return 'unreachable';
  if (unit === 'mg/L') return `${fn(x, 3)} (${fn(specificDose(x, docMgPerL), 3)})`;
  if (unit === 'fraction') return fn(x * 100, 3);
  if (unit === 'currency/a' || unit === 'currency/m3') return fmtMoney(x, '').trim();
  if (unit === 'kg/a') return fn(x / 1000, 3);
  return fn(x, 3);
}
