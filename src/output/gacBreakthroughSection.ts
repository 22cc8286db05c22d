/**
 * The report's GAC breakthrough section (capability 18): per GAC carbon with fixed-bed inputs,
 *   - the breakthrough curves c/c0 of one filter against bed volumes, with each compound's
 *     allowed c/c0 (goal lines) and the run length of the staggered filters;
 *   - DOC and UV254 breakthrough (the fictive DOC components' sum and absorbances);
 *   - the blended effluent of the N staggered filters over one cycle at the run length
 *     (blendOverCycle, src/kinetics/staggeredFilters.ts), against the bed volumes since the last
 *     filter change (phase·T/N);
 * and a table of each goal's run length. Presentation only: the curves come from gacKineticStep.
 */
import { blendOverCycle } from '../kinetics/staggeredFilters.js';
import type { CarbonResult, PipelineResult } from '../pipeline/pipelineTypes.js';
import { GAC_NOT_SAMPLED } from '../pipeline/gacUncertainty.js';
import { fmtNumber as fn, fmtWhole } from './formatting.js';
import type { PlotSeries, ReportSection, ReportTable, XYPlotSpec } from './reportModel.js';

const GREY = '#555555';

function curvesPlot(cr: CarbonResult, ci: number): XYPlotSpec {
  const k = cr.gacKinetic!;
  const s = k.simulation;
  const ids = new Set(Object.keys(k.goals));
  const series: PlotSeries[] = s.components.filter((c) => !c.id.startsWith('DOC ')).map((c) => ({
    name: c.id, key: c.id, emphasis: c.id === k.run.governedBy, points: s.bedVolumes.map((b, i) => [b, c.cOverC0[i]!] as [number, number]),
  }));
  const goalValues = [...new Set([...ids].map((id) => k.goals[id]!))];
  const plot: XYPlotSpec = {
    kind: 'xy', id: `gac-breakthrough-${ci}`, title: `${cr.carbon.name}: breakthrough of one filter`, xLabel: 'bed volumes', yLabel: 'c/c0 at the filter outlet',
    yRange: [0, 1.2], series,
    hLines: goalValues.map((g) => ({ y: g, label: `allowed c/c0 ${fn(g, 3)} (${[...ids].filter((id) => k.goals[id] === g).join(', ')})` })),
  };
  if (k.run.runBedVolumes !== null) plot.vLines = [{ x: k.run.runBedVolumes, label: `run length ${fmtWhole(k.run.runBedVolumes)} BV (${k.filters} filters)` }];
  return plot;
}

function surrogatePlot(cr: CarbonResult, ci: number): XYPlotSpec | undefined {
  const s = cr.gacKinetic!.simulation;
  const series: PlotSeries[] = [];
  if (s.doc) series.push({ name: 'DOC', key: 'DOC', colour: GREY, points: s.bedVolumes.map((b, i) => [b, s.doc!.cOverC0[i]!] as [number, number]) });
  if (s.uv254) series.push({ name: 'UV254', key: 'UV254', colour: GREY, style: 'dashed', points: s.bedVolumes.map((b, i) => [b, s.uv254!.ratio[i]!] as [number, number]) });
  if (series.length === 0) return undefined;
  return { kind: 'xy', id: `gac-doc-uv254-${ci}`, title: `${cr.carbon.name}: DOC and UV254 breakthrough of one filter`, xLabel: 'bed volumes', yLabel: 'c/c0 (DOC), a/a0 (UV254)', yRange: [0, 1.1], series };
}

function blendPlot(cr: CarbonResult, ci: number): XYPlotSpec | undefined {
  const k = cr.gacKinetic!;
  const T = k.run.runBedVolumes;
  if (T === null || !(T > 0)) return undefined;
  const s = k.simulation;
  const series: PlotSeries[] = s.components.filter((c) => c.id in k.goals).map((c) => {
    const b = blendOverCycle({ bedVolumes: s.bedVolumes, cOverC0: c.cOverC0 }, k.filters, T);
    return { name: c.id, key: c.id, emphasis: c.id === k.run.governedBy, points: b.phase.map((p, i) => [(p * T) / k.filters, b.cOverC0[i]!] as [number, number]) };
  });
  const goalValues = [...new Set(Object.values(k.goals))];
  return {
    kind: 'xy', id: `gac-blend-${ci}`, title: `${cr.carbon.name}: blended effluent of ${k.filters} staggered filter(s) at the run length`, xLabel: 'bed volumes since the last filter change', yLabel: 'blended c/c0',
    series, hLines: goalValues.map((g) => ({ y: g, label: `allowed c/c0 ${fn(g, 3)}` })),
  };
}

function runTable(cr: CarbonResult): ReportTable {
  const k = cr.gacKinetic!;
  const bv = (x: number | null, end: boolean) => (x === null ? 'not met' : `${end ? '≥ ' : ''}${fmtWhole(x)}`);
  const rows: Array<Array<string | number>> = k.run.compounds.map((c) => [c.id, fn(c.maxCOverC0, 3), bv(c.bedVolumes, c.atCurveEnd), c.id === k.run.governedBy ? 'governing' : '']);
  if (k.run.indicator) rows.push(['indicator mean', '—', bv(k.run.indicator.bedVolumes, k.run.indicator.atCurveEnd), k.run.governedBy === 'indicator mean' ? 'governing' : '']);
  return { caption: `${cr.carbon.name}: run length of ${k.filters} staggered filter(s) for each goal (bed volumes of one filter)`, columns: ['goal', 'allowed blended c/c0', 'run length (BV)', 'role'], rows };
}

/** P10 / P50 / P90 of the GAC Monte Carlo beside the run's figures. */
function monteCarloTable(cr: CarbonResult): ReportTable | undefined {
  const u = cr.gacUncertainty;
  if (!u) return undefined;
  const cell = (key: string, x: number) => {
    if (!Number.isFinite(x)) return 'no run';
    if (key === 'run_bed_volumes' || key === 'yearly_carbon_kg' || key === 'yearly_cost') return fmtWhole(x);
    return fn(x, 3);
  };
  const notes = [u.atCurveEndDraws ? `${u.atCurveEndDraws} draw(s) at the end of the simulated curves: their run length is a lower bound` : '', u.noRunDraws ? `${u.noRunDraws} draw(s) with no run meeting every goal` : ''].filter((x) => x);
  return {
    caption: `${cr.carbon.name}: run length and carbon use, point (the run) and P10 / P50 / P90 of ${u.draws} draws${notes.length ? ` (${notes.join('; ')})` : ''}`,
    columns: ['quantity', 'unit', 'point', 'P10', 'P50', 'P90'],
    rows: u.quantities.map((q) => [q.label, q.unit.replace(/m3$/, 'm³'), cell(q.key, q.pointEstimate), cell(q.key, q.p10), cell(q.key, q.p50), cell(q.key, q.p90)]),
  };
}

/** The section, or undefined when no GAC carbon has fixed-bed inputs. */
export function gacBreakthroughSection(r: PipelineResult): ReportSection | undefined {
  const withK = r.carbons.map((cr, ci) => ({ cr, ci })).filter((x) => x.cr.gacKinetic);
  if (withK.length === 0) return undefined;
  const paragraphs = ['Fixed-bed model of each GAC filter: plug flow, film transfer (Wilson & Geankoplis 1966 unless given), surface diffusion in the grains and IAST at their surface for every fictive DOC component and every compound, so that the weakly adsorbing DOC loads the carbon ahead of the trace compounds. The staggered filters are replaced in turn; the run length is the longest one that keeps the blended effluent within every goal (and the indicator-mean rule) at every moment of the cycle.'];
  const mc = withK.filter((x) => x.cr.gacUncertainty);
  paragraphs.push(mc.length === 0
    ? 'The GAC run length has no Monte Carlo band in this run (no draws: the Monte Carlo is off or uncertainty.gac_draws is 0).'
    : `Monte Carlo of the run length: ${mc[0]!.cr.gacUncertainty!.draws} draws per GAC carbon (uncertainty.gac_draws), seed ${mc[0]!.cr.gacUncertainty!.seed}; sampled, lognormal around the run's values: each compound's K and 1/n and each compound's Ds (a Ds fitted to a column test with its 95 % interval, a given Ds with uncertainty.Ds_rel_sd). Not sampled: ${GAC_NOT_SAMPLED}. Each draw integrates every compound against the stored background and takes the run length of the staggered filters like the run; the point figures are the run's.${mc[0]!.cr.gacUncertainty!.draws < 100 ? ` With ${mc[0]!.cr.gacUncertainty!.draws} draws the percentiles are indicative only (each draw is a fixed-bed solve of every compound); raise uncertainty.gac_draws (100 or more) before relying on the band.` : ''}`);
  const plots: XYPlotSpec[] = [];
  const tables: ReportTable[] = [];
  for (const { cr, ci } of withK) {
    const k = cr.gacKinetic!;
    const u = k.use;
    paragraphs.push(`${cr.carbon.name}: ${k.run.runBedVolumes === null ? 'no run meets every goal' : `run length ${k.run.atCurveEnd ? 'at least ' : ''}${fmtWhole(k.run.runBedVolumes)} bed volumes per filter${u?.filterLifeDays !== undefined ? ` (${fn(u.filterLifeDays, 3)} days)` : ''}, governed by ${k.run.governedBy}`}${u ? `; carbon use ${fn(u.carbonUsageGPerM3, 3)} g/m³` : ''}. Equilibrium estimate beside it: ${fmtWhole(k.equilibriumBedVolumes)} bed volumes (a reference, not a bound). Simulated to ${fmtWhole(k.toBedVolumes)} bed volumes on ${k.simulation.grid.cells} axial cells × ${k.simulation.grid.interiorPoints} grain points; mass-balance error ${k.simulation.massBalanceError.toExponential(1)}.`);
    plots.push(curvesPlot(cr, ci));
    const sp = surrogatePlot(cr, ci);
    if (sp) plots.push(sp);
    const bp = blendPlot(cr, ci);
    if (bp) plots.push(bp);
    tables.push(runTable(cr));
    const mt = monteCarloTable(cr);
    if (mt) tables.push(mt);
  }
  return { id: 'gac-breakthrough', heading: 'GAC breakthrough and run length (fixed-bed model)', paragraphs, tables, plots, warnings: ['Model estimate from isotherms and invented or assumed diffusivities: confirm the run length with rapid small-scale column tests or pilot columns before design.'] };
}
