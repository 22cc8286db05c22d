/**
 * The report model (src/report/reportModel.ts) filled from a pipeline result: headline figures,
 * the cautions, and one section per step with its tables, plots and warnings. The renderers only
 * lay it out; every number here comes from the pipeline.
 */
import { predictDoc } from '../fractionation/backgroundPrediction.js';
import { annualisedNote, isAnnualised } from '../design/annualised.js';
import { logSpaced as logSpacedDoses } from '../numerics/logSpace.js';
import type { PlotSeries, PlotSpec, ReportModel, ReportSection, ReportTable } from './reportModel.js';
import { CAUTIONS } from './cautions.js';
import { applyCompoundLooks } from './applyCompoundLooks.js';
import { dayNumber } from './dayNumber.js';
import { decisionSection } from './decisionSections.js';
import { doseWithSpecific, headlineFigures, yearlyBasisText } from './headlineFigures.js';
import { referencesSection } from './referencesSection.js';
import { coverLines } from './coverLines.js';
import { carbonLook } from './carbonLooks.js';
import { calibrationPlot } from './calibrationPlots.js';
import { withKineticCalibration } from './kineticCalibrationRecord.js';
import { withColumnCalibration } from './columnCalibrationRecord.js';
import { contactSection, describeConditions } from './contactPlots.js';
import { fmtConcentration as fc, fmtMoney, fmtNumber as fn, fmtWhole } from './formatting.js';
import type { CarbonResult, PipelineResult } from '../pipeline/pipelineTypes.js';
import { gacBreakthroughSection } from './gacBreakthroughSection.js';
import { gacSection, loadingPlot, pilotSection, surrogateSection, uncertaintySection } from './surrogateGacUncertaintySections.js';
import { transferNote } from '../pipeline/calibrationTransferStep.js';
import { transferRows } from './transferRows.js';
import { carbonBackgroundParts } from './carbonBackgroundSection.js';

const pct = (x: number | null | undefined, sig = 4) => (x === null || x === undefined ? '—' : `${fn(x, sig)} %`);
const mgL = (x: number | null | undefined, sig = 3) => (x === null || x === undefined ? '—' : `${fn(x, sig)} mg/L`);

function pacCarbons(r: PipelineResult): CarbonResult[] {
  return r.carbons.filter((c) => c.required);
}

function siteSection(r: PipelineResult): ReportSection {
  const p = r.project;
  const rows = p.compounds.map((c) => [c.id, c.name, c.indicatorCategory ?? '—', fc(c.c0MgPerL), r.goals[c.id]!.text, fn(c.K, 4), fn(c.oneOverN, 3), c.jarTests ? `${c.jarTests.model} (${c.jarTests.file})` : '—']);
  const paragraphs = [
    `${p.site.name}: design flow ${fmtWhole(p.site.flowM3PerD)} m³/d, effluent DOC ${fn(p.site.docMgPerL, 3)} mg/L${p.site.uv254PerM !== undefined ? `, UV254 ${fn(p.site.uv254PerM, 3)} 1/m` : ''}.`,
    `Goal per compound: its effluent limit when given, otherwise ${p.goals.removalPercent} % removal.${p.goals.indicator ? ` Indicator goal: mean removal of at least ${p.goals.indicator.meanRemovalPercent} % (SR 814.201.231 Art. 3: at least 6 substances, category 1 to category 2 in the ratio 2:1, arithmetic mean).` : ''}`,
  ];
  if (p.note) paragraphs.push(p.note);
  return {
    id: 'site', heading: 'Site, compounds and goals', paragraphs,
    tables: [{ caption: 'Compounds (single-solute Freundlich on the reference carbon; K in (mg/g)/(mg/L)^(1/n))', columns: ['id', 'name', 'category', 'c0', 'goal', 'K', '1/n', 'jar tests'], rows }],
  };
}

function backgroundSection(r: PipelineResult): ReportSection {
  const bg = r.background;
  const sec: ReportSection = { id: 'background', heading: 'Background (effluent organic matter)', paragraphs: [], tables: [], plots: [], warnings: [...bg.warnings] };
  if (bg.background) {
    const b = bg.background;
    sec.paragraphs!.push(bg.source === 'isotherm'
      ? `The DOC isotherm was reduced to fictive components (adsorption analysis, Worch 2012; common exponent 1/n = ${fn(b.one_over_n, 3)}). Fractions scale with DOC on other days (Zietzschmann et al. 2016). Competition between the compounds and the background: IAST (Radke & Prausnitz 1972) with Freundlich isotherms in batch form (Crittenden et al. 1985).`
      : 'Fictive components taken from the background file as given.');
    sec.tables!.push({
      caption: `Fictive components at DOC0 = ${fn(b.doc0_mg_per_L, 3)} mg/L (fit RMSE ${fn(b.fit.rmse_mg_per_L, 3)} mg/L over ${b.fit.points} points)`,
      columns: ['component', 'K ((mg/g)/(mg/L)^(1/n))', '1/n', 'share of DOC', 'c0 (mg/L)'],
      rows: b.components.map((c) => [c.id, c.K === 0 ? '0 (non-adsorbable)' : fn(c.K, 4), c.K === 0 ? '—' : fn(c.one_over_n, 3), pct(c.fraction * 100), fn(c.c0_mg_per_L, 3)]),
    });
    sec.plots!.push({ kind: 'bars', compact: true, id: 'background-fractions', title: 'Fictive DOC components (mg/L at DOC0)', yLabel: 'DOC (mg/L)', categories: ['DOC0'], stacks: b.components.map((c) => ({ name: `${c.id} (K ${fn(c.K, 3)})`, values: [c.c0_mg_per_L] })) });
    const fr = bg.fractionation;
    if (fr) {
      const residuals = (fr.residuals ?? []) as Array<Record<string, number>>;
      const measured = residuals
        .map((row) => [row.dose_mg_per_L, row.doc_mg_per_L ?? row.doc_measured_mg_per_L] as const)
        .filter(([d, c]) => typeof d === 'number' && typeof c === 'number' && d > 0) as Array<[number, number]>;
      const maxDose = Math.max(100, ...measured.map(([d]) => d));
      const doses = logSpacedDoses(1, maxDose, 80);
      const plot: PlotSpec = {
        kind: 'xy', id: 'doc-isotherm', title: 'DOC against carbon dose: measured and fictive-component model', xLabel: 'carbon dose (mg/L)', yLabel: 'equilibrium DOC (mg/L)', xLog: true,
        series: [{ name: 'model (batch IAST)', points: doses.map((d) => [d, predictDoc(b, d)]) }],
      };
      if (measured.length) plot.series.push({ name: 'measured', points: measured, style: 'points', key: 'reference' });
      sec.plots!.push(plot);
    }
  } else {
    sec.paragraphs!.push('An equivalent background compound (EBC) per compound, as given in the project (Najm, Snoeyink & Richard 1991); EBC concentrations scale with DOC.');
  }
  const perCarbon = carbonBackgroundParts(r);
  sec.paragraphs!.push(...perCarbon.paragraphs); sec.tables!.push(...perCarbon.tables); sec.warnings!.push(...perCarbon.warnings);
  return sec;
}

function calibrationSection(r: PipelineResult): ReportSection | undefined {
  if (r.calibrations.length === 0) return withKineticCalibration(undefined, r);
  return withKineticCalibration({
    id: 'calibration', heading: 'Calibration to jar tests',
    paragraphs: ['Competition calibrated to jar tests of the compound spiked into the site water: EBC (Najm et al. 1991), simplified EBC (Qi et al. 2007) or a target-K factor beside the fictive DOC components (Schideman et al. 2006).'],
    tables: [{
      caption: 'Calibrated parameters',
      columns: ['compound', 'model', 'target K factor', 'K_EBC', '1/n_EBC', 'c0_EBC (mg/L)', 'at DOC (mg/L)'],
      rows: [...r.calibrations.map((c) => [c.compoundId, c.model, c.targetKFactor !== undefined ? fn(c.targetKFactor, 4) : '—', c.ebc ? fn(c.ebc.K, 4) : '—', c.ebc ? fn(c.ebc.oneOverN, 3) : '—', c.ebc ? fn(c.ebc.c0MgPerL, 4) : '—', c.ebc ? fn(c.ebc.docMgPerL, 3) : '—']), ...transferRows(r, fn)],
    }],
    warnings: [...r.calibrations.flatMap((c) => c.warnings.map((w) => `${c.compoundId}: ${w}`)), ...(r.calibrationTransfer ? [transferNote(r.calibrationTransfer)] : [])],
    plots: r.calibrations.flatMap((c, i) => calibrationPlot(c, i) ?? []),
  }, r);
}

function carbonSection(r: PipelineResult, cr: CarbonResult, index: number): ReportSection {
  const req = cr.required!;
  const rows = req.compounds.map((d, i) => {
    const comp = r.project.compounds[i]!;
    const rl = cr.reducedLoadings?.[i];
    return [comp.id, r.goals[comp.id]!.text, d.status === 'met' ? fn(d.doseMgPerL!, 3) : d.status === 'met without carbon' ? '0 (met without carbon)' : d.status === 'met below the smallest dose' ? '0 (met below the smallest dose)' : d.status === 'report only' ? 'report only' : 'unreachable', d.status === 'met' ? fn(d.doseMgPerL! / req.docMgPerL, 3) : '—', req.governing?.compoundId === comp.id ? 'governing' : '',
      rl ? pct(rl.removalFraction * 100, 3) : '—', rl ? fc(rl.cMgPerL) : '—', rl ? fn(rl.qSiteMgPerG, 3) : '—', rl ? fn(rl.qSingleMgPerG, 3) : '—', rl ? pct(rl.ratio * 100, 2) : '—'];
  });
  const tables: ReportTable[] = [{
    caption: `Dose per compound and reduced loading at the design dose ${mgL(cr.designDoseMgPerL)} (${cr.designDoseSource ?? '—'}), DOC ${fn(req.docMgPerL, 3)} mg/L`,
    columns: ['compound', 'goal', 'dose for goal (mg/L)', 'mg carbon per mg DOC', 'role', 'removal at design dose', 'c at design dose', 'q site water (mg/g)', 'q single-solute, same c (mg/g)', 'loading ratio (site / single)'],
    rows,
  }];
  const paragraphs = [
    `Required dose ${doseWithSpecific(req.doseMgPerL, req.docMgPerL)}${cr.contact ? ` under the plant's PAC contact conditions (${describeConditions(cr.contact)}; ${cr.contact.equilibriumDoseMgPerL === null ? 'no goal reachable at equilibrium' : `${mgL(cr.contact.equilibriumDoseMgPerL)} at equilibrium`}: see the section on PAC contact conditions)` : ''}, governed by ${req.governedBy}.${req.indicator?.doseMgPerL != null ? ` The indicator mean reaches its goal at ${mgL(req.indicator.doseMgPerL)}.` : ''}`,
    cr.contact
      ? "Reduced loading: the mean loading a compound reaches on the carbon in the site water under the plant's contact conditions (the contact model's removal and the balance q = (c0 − c)/D) against its single-solute equilibrium loading at the same liquid concentration; the ratio is the capacity lost to competition and to the limited contact."
      : 'Reduced loading: the loading a compound reaches in the site water (batch IAST beside the background) against its single-solute loading at the same liquid concentration; the ratio is the capacity lost to competition.',
  ];
  if (cr.costPerM3 !== undefined) paragraphs.push(`Carbon cost ${fmtMoney(cr.costPerM3, cr.carbon.currency)} per m³ treated (${fn(req.doseMgPerL!, 3)} g/m³ at ${fmtMoney(cr.carbon.pricePerKg, cr.carbon.currency)}/kg); ${fmtWhole(cr.carbonKgPerDAtDesign!)} kg/d at the design flow.`);
  const plots: PlotSpec[] = [];
  if (cr.curves) {
    const cv = cr.curves;
    const spec: PlotSpec = {
      kind: 'xy', id: `removal-${index + 1}`, title: `Removal against carbon dose — ${cr.carbon.name}`, xLabel: 'carbon dose (mg/L)', yLabel: 'removal (%)', xLog: true, yRange: [0, 100],
      series: r.project.compounds.map((c) => ({ name: req.governing?.compoundId === c.id ? `${c.id} (governing)` : c.id, key: c.id, emphasis: req.governing?.compoundId === c.id, points: cv.dosesMgPerL.map((d, k) => [d, cv.removalPercent[c.id]![k]!] as [number, number]) })),
      hLines: [{ y: r.project.goals.removalPercent, label: `${r.project.goals.removalPercent} % goal` }],
    };
    if (req.doseMgPerL !== null) spec.vLines = [{ x: req.doseMgPerL, label: `required ${fn(req.doseMgPerL, 3)} mg/L` }];
    plots.push(spec);
  }
  const lp = loadingPlot(cr, index);
  if (lp) plots.push(lp);
  return { id: `carbon-${index + 1}`, heading: `Doses and reduced loadings — ${cr.carbon.name}`, paragraphs, tables, plots, warnings: cr.warnings };
}

function indicatorSection(r: PipelineResult): ReportSection | undefined {
  const withInd = pacCarbons(r).filter((c) => c.indicator);
  if (withInd.length === 0) return undefined;
  const tables: ReportTable[] = [];
  const paragraphs: string[] = ['Swiss DETEC ordinance SR 814.201.231, Art. 3: at least 6 indicator substances, category 1 to category 2 in the ratio 2:1, result the arithmetic mean of their percentage removals. Removals here are modelled, not measured.'];
  for (const cr of withInd) {
    const ind = cr.indicator!;
    tables.push({
      caption: `${cr.carbon.name} at ${doseWithSpecific(ind.doseMgPerL, r.project.site.docMgPerL)}: ${ind.selection}, mean ${pct(ind.set.meanRemovalPercent)} (goal ${ind.goalPercent} %) — ${ind.set.admissible ? (ind.met ? 'goal met' : 'goal not met') : `not admissible: ${ind.set.reason}`}`,
      columns: ['compound', 'category', 'removal', 'in evaluated set', 'in best subset', 'in worst subset'],
      rows: ind.values.map((v) => [v.id, v.category, pct(v.removalPercent), ind.set.ids.includes(v.id) ? 'yes' : '', ind.range?.best.ids.includes(v.id) ? 'yes' : '', ind.range?.worst.ids.includes(v.id) ? 'yes' : '']),
    });
    if (ind.range) paragraphs.push(`${cr.carbon.name}: best admissible subset ${pct(ind.range.best.meanRemovalPercent)} (${ind.range.best.category1}+${ind.range.best.category2} substances), worst ${pct(ind.range.worst.meanRemovalPercent)} (${ind.range.worst.category1}+${ind.range.worst.category2}).`);
  }
  return { id: 'indicators', heading: 'Indicator check (SR 814.201.231)', paragraphs, tables };
}

function comparisonSection(r: PipelineResult): ReportSection {
  const doc = r.project.site.docMgPerL;
  const rows = r.carbons.map((cr) => [cr.carbon.name, cr.carbon.type, fmtMoney(cr.carbon.pricePerKg, cr.carbon.currency), mgL(cr.required?.doseMgPerL), cr.required?.doseMgPerL != null ? fn(cr.required.doseMgPerL / doc, 3) : '—', cr.required?.governedBy ?? (cr.gacKinetic ? `GAC run: ${cr.gacKinetic.run.governedBy}` : cr.gac ? 'GAC: see the GAC estimate' : '—'),
    cr.costPerM3 !== undefined ? fmtMoney(cr.costPerM3, cr.carbon.currency) : '—', cr.yearly ? fn(cr.yearly.carbonKg / 1000, 3) : '—', cr.yearly ? fmtMoney(cr.yearly.cost, cr.carbon.currency) : '—', cr.yearly ? yearlyBasisText(cr) : '—',
    cr.daily?.dose ? fn(cr.daily.dose.median, 3) : '—', cr.daily?.dose ? fn(cr.daily.dose.p90, 3) : '—']);
  return {
    id: 'carbons', heading: 'Carbons side by side',
    tables: [{ caption: 'Required dose and carbon cost per carbon (carbon only; no energy, handling or sludge costs)', columns: ['carbon', 'type', 'price per kg', 'required dose', 'mg carbon per mg DOC', 'governed by', 'cost per m³', 'carbon per year (t)', 'cost per year', 'yearly basis', 'daily dose median (mg/L)', 'daily dose P90 (mg/L)'], rows }],
  };
}

/**
 * The daily-dose series of one carbon; with a Monte Carlo, a P10–P90 band: each day's dose times
 * the P10 and P90 of (governing dose of a draw)/(point estimate) at the design DOC — the relative
 * spread taken as the same on every day (an approximation, said so in the section).
 */
function dailySeries(c: CarbonResult, dates: readonly string[], dayIndex: readonly number[], carbonIndex: number, position: () => ReadonlyMap<string, number>): PlotSeries {
  const all = c.daily!.rows;
  const rows: typeof all = [];
  const points: Array<[number, number]> = [];
  for (let k = 0; k < all.length; k++) {
    const d = all[k]!;
    if (d.doseMgPerL === null) continue;
    // the rows follow the series day by day; the date map is only for rows that do not
    const at = dates[k] === d.date ? k : position().get(d.date) ?? -1;
    rows.push(d);
    points.push([dayIndex[at] ?? rows.length, d.doseMgPerL]);
  }
  const series: PlotSeries = { name: c.carbon.name, ...carbonLook(carbonIndex), points };
  const ratio = c.uncertainty?.governingDoseRatio;
  if (ratio && Number.isFinite(ratio.p90)) series.band = { lower: rows.map((d) => d.doseMgPerL! * ratio.p10), upper: rows.map((d) => d.doseMgPerL! * ratio.p90), label: `${c.carbon.name} P10–P90` };
  return series;
}

function yearSection(r: PipelineResult): ReportSection | undefined {
  const s = r.series;
  if (!s) return undefined;
  const withDaily = r.carbons.filter((c) => c.daily);
  const dayIndex = s.dates.map((d) => dayNumber(d));
  let position: Map<string, number> | undefined;
  const datePosition = (): ReadonlyMap<string, number> => {
    if (!position) { const p = new Map<string, number>(); s.dates.forEach((date, k) => { if (!p.has(date)) p.set(date, k); }); position = p; }
    return position;
  };
  const medianDoc = s.docMgPerL.slice().sort((x, y) => x - y)[Math.floor(s.docMgPerL.length / 2)]!;
  const plots: PlotSpec[] = [
    { kind: 'xy', id: 'daily-dose', title: `Required dose over the DOC series${withDaily.some((c) => c.uncertainty?.governingDoseRatio) ? ' (band: Monte Carlo P10–P90)' : ''}`, xLabel: 'date', xTime: true, yLabel: 'dose (mg/L)', series: withDaily.map((c) => dailySeries(c, s.dates, dayIndex, r.carbons.indexOf(c), datePosition)) },
    { kind: 'xy', id: 'daily-doc', title: 'Effluent DOC over the series', xLabel: 'date', xTime: true, yLabel: 'DOC (mg/L)', series: [{ name: 'DOC', key: 'reference', points: s.docMgPerL.map((v, k) => [dayIndex[k]!, v] as [number, number]) }] },
  ];
  const annualised = isAnnualised(s.dates.length); // a whole year's totals are its yearly figures: no second column
  const rows = withDaily.map((c) => {
    const d = c.daily!;
    return [c.carbon.name, d.rows.length, `${fn(d.dose!.median, 3)} (${fn(d.dose!.median / medianDoc, 3)})`, fn(d.dose!.p90, 3), fn(d.dose!.max, 3), fmtWhole(d.carbonKgPerD!.median), fmtWhole(d.carbonKgPerD!.p90), fmtWhole(d.totalCarbonKg), fmtMoney(d.totalCost, d.currency), ...(annualised ? [`${fmtWhole(d.yearlyCarbonKg)} kg, ${fmtMoney(d.yearlyCost, d.currency)} (${yearlyBasisText(c)})`] : [])];
  });
  return {
    id: 'year', heading: 'Carbon over the year',
    paragraphs: [`${s.dates.length} days from ${s.dates[0]} to ${s.dates[s.dates.length - 1]}; the background is scaled to each day's DOC; the required dose is solved exactly at ${withDaily[0]?.daily!.table.docMgPerL.length ?? 0} DOC values spanning the series and read linearly in DOC between them (checked within ${fn(100 * (withDaily[0]?.daily!.table.toleranceRel ?? 0), 2)} % of the exact dose at every midpoint; the Monte Carlo reads the same table). Carbon kg/d = dose (mg/L) × flow (m³/d) / 1000; totals are sums over the days${isAnnualised(s.dates.length) ? `; yearly figures are ${annualisedNote(s.dates.length)} (× 365/${s.dates.length})` : ''}. Percentiles: Hyndman & Fan (1996) definition 7.${s.flowFromDesign ? ' The series has no flow column: the design flow is used every day.' : ''}${withDaily.some((c) => c.uncertainty?.governingDoseRatio) ? ' The band on the daily dose is the Monte Carlo P10–P90 of the governing dose relative to its point estimate at the design DOC, applied to every day (an approximation).' : ''}`],
    tables: [{ caption: 'Daily dose and carbon mass', columns: ['carbon', 'days', 'dose median (mg/L; mg/mg DOC at the median DOC)', 'dose P90 (mg/L)', 'dose max (mg/L)', 'carbon median (kg/d)', 'carbon P90 (kg/d)', 'carbon total over the series (kg)', 'carbon cost over the series', ...(annualised ? ['per year (annualised)'] : [])], rows }],
    plots,
  };
}

function inputsSection(r: PipelineResult): ReportSection {
  return {
    id: 'inputs', heading: 'Inputs and reproducibility',
    paragraphs: ['Every input resolved with units, all results, the tool and Node versions are in run.json; the tables are in the CSV files beside this report.'],
    tables: [{ caption: 'Input files (SHA-256; paths relative to the project file\'s folder, the full paths are in run.json)', columns: ['role', 'path', 'bytes', 'SHA-256'], rows: r.provenance.files.map((f) => [f.role, f.role === 'project' ? fileName(f.path) : f.path, f.bytes, f.sha256.slice(0, 16) + '…']) }],
  };
}

/** Fill the report model. */
export function buildReportModel(r: PipelineResult, version: string): ReportModel {
  const sections: ReportSection[] = [siteSection(r), backgroundSection(r)];
  const cal = withColumnCalibration(calibrationSection(r), r);
  if (cal) sections.push(cal);
  pacCarbons(r).forEach((cr) => sections.push(carbonSection(r, cr, r.carbons.indexOf(cr))));
  const contact = contactSection(r);
  if (contact) sections.push(contact);
  for (const sec of [surrogateSection(r), pilotSection(r), indicatorSection(r)]) if (sec) sections.push(sec);
  sections.push(comparisonSection(r));
  const decisions = decisionSection(r);
  if (decisions) sections.push(decisions);
  for (const sec of [gacSection(r), gacBreakthroughSection(r), yearSection(r), uncertaintySection(r)]) if (sec) sections.push(sec);
  sections.push(inputsSection(r));
  const model: ReportModel = {
    title: r.project.name,
    subtitle: `${r.project.site.name} — activated-carbon dose, cost, set-points and indicator check${r.provenance.demo ? ' (built-in demo; all data invented)' : ''}`,
    generatedAt: r.generatedAt,
    version,
    cautions: [...CAUTIONS],
    keyFigures: headlineFigures(r),
    sections,
  };
  const cover = coverLines(r.project.cover);
  if (cover.length) model.cover = cover;
  sections.push(referencesSection(model));
  return applyCompoundLooks(model, r.project.compounds.map((c) => c.id));
}

/** The last segment of a path (either separator), so that a report never shows the author's folders. */
function fileName(path: string): string {
  return path.split(/[\\/]/).pop() || path;
}
