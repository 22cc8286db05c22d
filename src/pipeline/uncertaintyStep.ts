/**
 * The Monte Carlo step (capability 13): per PAC carbon, the isotherm and background parameters
 * are drawn and the doses, the required dose, the indicator-mean dose, the UV254 set-point, the
 * cost per m³ and the yearly carbon and cost are solved again in every draw (src/uncertainty: monteCarlo / parallelMonteCarlo), giving the
 * 10th, 50th and 90th percentiles (Hyndman & Fan 1996, type 7).
 *
 * What is uncertain, and how (stated in the report and run.json):
 *   - fitted background parameters with a 95 % interval from the fractionation (fractions; K when
 *     fitted): the interval [lo, hi] is converted to a standard deviation (hi − lo)/(2·1.96)
 *     (normal approximation; for K on ln K: ln(hi/lo)/(2·1.96)), drawn normal and independent —
 *     the background file keeps no correlations between fitted parameters;
 *   - background parameters without an interval: the project's `fraction_rel_sd` and
 *     `background_K_rel_sd` (lognormal, median = point value);
 *   - each compound's K and 1/n: `K_rel_sd`, `one_over_n_rel_sd` (lognormal);
 *   - the DOC (design value and the whole series together): `doc_rel_sd` (lognormal).
 * Every carbon uses the same seed (common random numbers: differences between carbons are not
 * blurred by different draws). Every draw designs the carbon with the design layer's model
 * (src/design/designDose.ts) like the run: every compound is kept (a goal unreachable in a draw
 * counts as an unreachable draw, a goal met without carbon as 0), the indicator goal is designed
 * in every draw, and the yearly figures come from the run's dose-table nodes. Needs a
 * fractionated background and fictive-component competition for every compound; otherwise the
 * carbon is skipped with the reason.
 *
 * The removal band of the governing compound is traced from the first draws (at most
 * CURVE_BAND_DRAWS) of the same random streams, so it belongs to the same draws as the percentiles.
 */
import { ComputationError } from '../core/errors.js';
import type { BackgroundStep } from './backgroundStep.js';
import type { CarbonResult, PipelineInput, PipelineResult, UncertaintyRunOptions } from './pipelineTypes.js';
import type { CarbonUncertainty, UncertainParameter, UncertaintySettings } from './uncertaintyTypes.js';
import type { CompoundGoal } from '../design/compoundGoal.js';
import { indicatorPlan } from './runPipeline.js';
import type { ProjectSpec, UncertaintySpec } from '../project/projectTypes.js';
import { DEFAULT_UNCERTAINTY } from '../project/projectTypes.js';
import type { SiteSeries } from '../siteSeries/siteSeries.js';
import type { MonteCarloProblem, ParameterCovariance, UncertainBackgroundComponent, UncertainTarget } from '../uncertainty/monteCarloProblem.js';
import { planChunks } from '../uncertainty/monteCarlo.js';
import { parallelMonteCarlo } from '../uncertainty/parallelMonteCarlo.js';
import { compileDrawModel, drawModel, sampleParameters } from '../uncertainty/monteCarloDraw.js';
import type { WarmStart } from '../design/removalModel.js';
import { NormalSampler } from '../uncertainty/distributions.js';
import { chunkRng } from '../uncertainty/prng.js';
import { percentiles } from '../numerics/percentile.js';
import { prepareSystem } from '../design/competitionSystem.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { contactDrawCount, contactUncertainty } from './contactUncertainty.js';
import { contactFactory } from '../kinetics/contactModel.js';
import { carbonModel } from '../design/carbonModel.js';
import type { KineticSolverOptions } from '../kinetics/pacBatch.js';

/** Two-sided 95 % quantile of the standard normal distribution. */
export const Z95 = 1.959963984540054;
export const CI_TO_SD_NOTE = 'fitted 95 % intervals converted to standard deviations as (upper − lower)/(2 × 1.96), normal approximation; fitted parameters drawn independently';
/** Draws used for the removal band of the governing compound. */
export const CURVE_BAND_DRAWS = 400;

/**
 * The settings of the run: the project's section, with --draws / --seed overriding it. Undefined
 * when the Monte Carlo is off (no section and no --draws, or draws 0).
 */
export function resolveUncertaintySettings(spec: UncertaintySpec | undefined, o: { draws?: number; seed?: number }): UncertaintySettings | undefined {
  if (!spec && o.draws === undefined) return undefined;
  const base: UncertaintySpec = spec ?? { ...DEFAULT_UNCERTAINTY };
  const s: UncertaintySettings = { ...base, source: spec ? 'project file' : 'command line (no uncertainty section: relative SDs 0, fitted intervals only)' };
  if (o.draws !== undefined) { s.draws = o.draws; s.source += ', --draws'; }
  if (o.seed !== undefined) { s.seed = o.seed; s.source += ', --seed'; }
  return s.draws > 0 ? s : undefined;
}

/** The Monte Carlo problem of one PAC carbon, or the reason it cannot be set up. */
export function uncertaintyProblem(
  project: ProjectSpec, cr: CarbonResult, bg: Pick<BackgroundStep, 'background'>, goals: readonly CompoundGoal[], series: SiteSeries | undefined, s: UncertaintySettings, kinetic: KineticSolverOptions = {},
): { problem: MonteCarloProblem; parameters: UncertainParameter[]; excluded: string[] } | { skipped: string } {
  if (cr.contact && contactDrawCount(s) === 0) return { skipped: 'uncertainty.contact_draws is 0: no draws under the PAC contact conditions' };
  const bgFile = (cr.background ?? bg).background; // the carbon's own background, else the project's
  if (!bgFile) return { skipped: 'the Monte Carlo needs a fractionated background (fictive components); an EBC background is not sampled' };
  const ebc = cr.systems.filter((x) => x.competition !== 'fictive').map((x) => x.compoundId);
  if (ebc.length) return { skipped: `compound(s) ${ebc.join(', ')} compete with a calibrated EBC; the Monte Carlo samples the fictive DOC components only` };
  if (!cr.required) return { skipped: 'no batch dose on this carbon' };
  const parameters: UncertainParameter[] = [];
  const excluded: string[] = [];
  const targets: UncertainTarget[] = [];
  // every compound, whatever its status at the point estimate: unreachable goals count as
  // unreachable draws, goals met without carbon as 0, so each band sits beside the run's figure
  cr.systems.forEach((sys, i) => {
    targets.push({ id: sys.compoundId, K: sys.inMixture.K, oneOverN: sys.inMixture.oneOverN, c0MgPerL: sys.c0MgPerL, removalGoal: goals[i]!.removalFraction, KRelSd: s.KRelSd, oneOverNRelSd: s.oneOverNRelSd, ...(goals[i]!.kind === 'none' ? { reportOnly: true } : {}) });
  });
  if (targets.length === 0) return { skipped: 'no compound on this carbon' };
  if (s.KRelSd > 0) parameters.push({ parameter: "compounds' K", distribution: 'lognormal', sd: s.KRelSd, basis: 'project uncertainty.K_rel_sd' });
  if (s.oneOverNRelSd > 0) parameters.push({ parameter: "compounds' 1/n", distribution: 'lognormal', sd: s.oneOverNRelSd, basis: 'project uncertainty.one_over_n_rel_sd' });
  const cov: { names: string[]; variances: number[] } = { names: [], variances: [] };
  const f = cr.background?.backgroundKFactor ?? cr.carbon.kFactor;
  const background = bgFile.components.map((c): UncertainBackgroundComponent => {
    const id = `bg:${c.id}`;
    const comp: UncertainBackgroundComponent = { id, K: c.K * f, oneOverN: c.K > 0 ? c.one_over_n : 1, fraction: c.fraction };
    const fci = c.fraction_ci95;
    if (fci && fci[1] >= fci[0]) {
      const sd = (fci[1] - fci[0]) / (2 * Z95);
      cov.names.push(`fraction:${id}`); cov.variances.push(sd * sd);
      parameters.push({ parameter: `fraction of ${c.id}`, distribution: 'normal', sd, basis: `fractionation 95 % interval ${fci[0].toPrecision(3)}–${fci[1].toPrecision(3)}` });
    } else if (s.fractionRelSd > 0) {
      comp.fractionRelSd = s.fractionRelSd;
      parameters.push({ parameter: `fraction of ${c.id}`, distribution: 'lognormal', sd: s.fractionRelSd, basis: 'project uncertainty.fraction_rel_sd (no fitted interval)' });
    }
    const kci = c.K_ci95;
    if (c.K > 0 && kci && kci[0] > 0 && kci[1] >= kci[0]) {
      const sd = Math.log(kci[1] / kci[0]) / (2 * Z95);
      cov.names.push(`lnK:${id}`); cov.variances.push(sd * sd);
      parameters.push({ parameter: `ln K of ${c.id}`, distribution: 'normal', sd, basis: 'fractionation 95 % interval of K' });
    } else if (c.K > 0 && s.backgroundKRelSd > 0) {
      comp.KRelSd = s.backgroundKRelSd;
      parameters.push({ parameter: `K of ${c.id}`, distribution: 'lognormal', sd: s.backgroundKRelSd, basis: 'project uncertainty.background_K_rel_sd' });
    }
    return comp;
  });
  if (s.docRelSd > 0) parameters.push({ parameter: 'DOC (design value and series)', distribution: 'lognormal', sd: s.docRelSd, basis: 'project uncertainty.doc_rel_sd' });
  const doc = project.site.docMgPerL;
  const problem: MonteCarloProblem = { targets, background, docMgPerL: doc, docRelSd: s.docRelSd, carbonPricePerKg: cr.carbon.pricePerKg };
  if (cr.contact && project.site.pacContact) { // the draws use the contact model with sampled Ds (contactUncertainty.ts)
    const k = contactUncertainty(cr, project.site.pacContact, s, kinetic);
    if ('skipped' in k) return k;
    problem.kinetics = k.kinetics;
    parameters.push(...k.parameters);
  }
  const plan = indicatorPlan(project);
  if (plan) problem.indicator = { members: plan.members.map((m) => ({ index: m.index, category: m.category })), goalPercent: plan.goalPercent, ...(plan.chosen ? { chosen: plan.chosen } : {}) };
  if (cov.names.length) {
    const covariance: ParameterCovariance = { parameters: cov.names, matrix: cov.variances.map((v, i) => cov.variances.map((_, j) => (i === j ? v : 0))) };
    problem.covariance = covariance;
  }
  const a = bgFile.components.map((c) => c.specific_uv254_per_m_per_mg_per_L);
  if (a.every((v): v is number => typeof v === 'number') && a.some((v) => v > 0)) problem.uv254AbsorbancePerM = a;
  // the run's dose-table nodes and series, so that the draws' yearly figures use the run's arithmetic
  problem.yearly = series && cr.daily
    ? { docSeriesMgPerL: series.docMgPerL.slice(), flowM3PerD: series.flowM3PerD.slice(), carbonPricePerKg: cr.carbon.pricePerKg, docNodesMgPerL: cr.daily.table.docMgPerL.slice() }
    : { docSeriesMgPerL: [doc], flowM3PerD: project.site.flowM3PerD, carbonPricePerKg: cr.carbon.pricePerKg, docNodesMgPerL: [doc] };
  return { problem, parameters, excluded };
}

/** P10/P50/P90 of a target's removal (percent) over the sweep doses, from the first draws. */
export function removalBand(problem: MonteCarloProblem, seed: number, draws: number, targetId: string, dosesMgPerL: readonly number[]): NonNullable<CarbonUncertainty['governingCurve']> {
  const model = compileDrawModel(problem);
  const t = problem.targets.findIndex((x) => x.id === targetId);
  if (t < 0) throw new ComputationError(`removal band: "${targetId}" is not a Monte Carlo target`);
  const n = Math.min(draws, CURVE_BAND_DRAWS);
  const columns = dosesMgPerL.map(() => new Float64Array(n));
  let i = 0;
  for (const { chunk, count } of planChunks(n)) {
    const normal = new NormalSampler(chunkRng(seed, chunk)); // the streams of the Monte Carlo run
    for (let k = 0; k < count; k++, i++) {
      const removal = drawModel(model, sampleParameters(model, normal));
      let warm: WarmStart;
      dosesMgPerL.forEach((dose, j) => {
        const r = removal.remaining(t, dose / 1000, warm);
        warm = r.warm;
        columns[j]![i] = 100 * (1 - r.remainingFraction);
      });
    }
  }
  const q = columns.map((c) => percentiles(c, [0.1, 0.5, 0.9]));
  return { compoundId: targetId, draws: n, dosesMgPerL: dosesMgPerL.slice(), p10Percent: q.map((x) => x[0]!), p50Percent: q.map((x) => x[1]!), p90Percent: q.map((x) => x[2]!) };
}

/** A report-only compound's removal at the run's required dose (Infinity without a dose, as in the draws); under contact from the run's contact model. */
function reportOnlyRemoval(cr: CarbonResult, i: number, contact?: { project: ProjectSpec; kinetic: KineticSolverOptions }): number {
  const dose = cr.required!.doseMgPerL;
  if (dose === null) return Infinity;
  if (!(dose > 0)) return 0;
  const sys = cr.systems[i]!;
  if (cr.contact && contact?.project.site.pacContact) return 1 - carbonModel(cr.systems, cr.required!.docMgPerL, undefined, contactFactory(contact.project.site.pacContact, cr.carbon, contact.kinetic)).remaining(i, dose / 1000).remainingFraction;
  return 1 - solveBatchPrepared(prepareSystem(sys, cr.required!.docMgPerL), dose / 1000).cMgPerL[0]! / sys.c0MgPerL;
}

/** The run's own figure for each Monte Carlo quantity (the point estimate printed beside its band). */
export function runFigures(cr: CarbonResult, problem: MonteCarloProblem, contact?: { project: ProjectSpec; kinetic: KineticSolverOptions }): Record<string, number> {
  const req = cr.required!;
  const inf = (v: number | null | undefined) => (v === null || v === undefined ? Infinity : v);
  const out: Record<string, number> = {};
  problem.targets.forEach((t, i) => {
    if (t.reportOnly === true) out[`removal:${t.id}`] = reportOnlyRemoval(cr, i, contact);
    else out[`dose:${t.id}`] = inf(req.compounds[i]!.doseMgPerL);
  });
  out.governing_dose = inf(req.doseMgPerL);
  if (req.indicator) out.indicator_dose = inf(req.indicator.doseMgPerL);
  const required = req.doseMgPerL;
  out.doc_reduction = required === null ? Infinity : req.surrogate?.docReduction ?? 0;
  out.uv254_setpoint = required === null ? Infinity : req.surrogate?.uv254Reduction ?? 0;
  out.cost_per_m3 = inf(req.costPerM3);
  if (cr.yearly) { out.yearly_carbon = cr.yearly.carbonKg; out.yearly_cost = cr.yearly.cost; }
  return out;
}

export interface UncertaintyOutcome {
  settings: UncertaintySettings;
  /** Per carbon name: its Monte Carlo result, or why it was skipped. */
  carbons: Map<string, { uncertainty: CarbonUncertainty; warnings: string[] } | { skipped: string }>;
  timingMs: number;
}

/**
 * Run the Monte Carlo on every PAC carbon of a pipeline result. Returns the results (the caller
 * assembles the final result; nothing is patched). The point estimate of every quantity is the
 * run's own figure; with every deviation zero the draws reproduce it (tested).
 * @throws InputError for an invalid problem; ComputationError if a solve fails
 */
export async function uncertaintyStep(result: PipelineResult, input: PipelineInput, settings: UncertaintySettings, o: Pick<UncertaintyRunOptions, 'onMonteCarloProgress' | 'workers' | 'kinetic'> = {}): Promise<UncertaintyOutcome> {
  const goals = result.project.compounds.map((c) => result.goals[c.id]!);
  const kinetic = o.kinetic ?? {};
  const drawsOf = (cr: CarbonResult) => (cr.contact ? contactDrawCount(settings) : settings.draws); // kinetic solves are slow: fewer draws under contact
  const planned = result.carbons.filter((c) => c.carbon.type === 'PAC').map((cr) => ({ cr, setup: uncertaintyProblem(result.project, cr, result.background, goals, input.series, settings, kinetic) }));
  const runs = planned.filter((p) => !('skipped' in p.setup));
  const total = runs.reduce((a, p) => a + drawsOf(p.cr), 0);
  let offset = 0;
  const carbons: UncertaintyOutcome['carbons'] = new Map();
  const t0 = performance.now();
  for (const { cr, setup } of planned) {
    if ('skipped' in setup) { carbons.set(cr.carbon.name, { skipped: setup.skipped }); continue; }
    const base = offset;
    const draws = drawsOf(cr);
    const opts: Parameters<typeof parallelMonteCarlo>[1] = { draws, seed: settings.seed, keepSamples: true, onProgress: (done) => o.onMonteCarloProgress?.(base + done, total) };
    if (o.workers !== undefined) opts.workers = o.workers;
    const mc = await parallelMonteCarlo(setup.problem, opts);
    offset += draws;
    const figures = runFigures(cr, setup.problem, { project: result.project, kinetic });
    const quantities = mc.quantities.map((q) => (q.key in figures ? { ...q, pointEstimate: figures[q.key]! } : q));
    const { samples, ...kept } = mc; // keep run.json small; the percentiles are the result
    const cu: CarbonUncertainty = { carbonName: cr.carbon.name, parameters: setup.parameters, excluded: setup.excluded, problem: setup.problem, result: { ...kept, quantities } };
    const gov = quantities.find((q) => q.key === 'governing_dose')!;
    const govSamples = samples?.governing_dose;
    if (govSamples && gov.pointEstimate > 0 && Number.isFinite(gov.pointEstimate)) {
      const [p10, p90] = percentiles(Float64Array.from(govSamples, (v) => v / gov.pointEstimate), [0.1, 0.9]);
      cu.governingDoseRatio = { p10: p10!, p90: p90! };
    }
    const govId = cr.required?.governing?.compoundId;
    if (govId && cr.curves) cu.governingCurve = removalBand(setup.problem, settings.seed, draws, govId, cr.curves.dosesMgPerL);
    carbons.set(cr.carbon.name, { uncertainty: cu, warnings: setup.excluded.length ? [`Monte Carlo leaves out ${setup.excluded.join(', ')}`] : [] });
  }
  return { settings, carbons, timingMs: performance.now() - t0 };
}

/** The pipeline result with the Monte Carlo outcome added (a new object; `result` is unchanged). */
export function withUncertainty(result: PipelineResult, outcome: UncertaintyOutcome): PipelineResult {
  const warnings = result.warnings.slice();
  const carbons = result.carbons.map((cr): CarbonResult => {
    const o = outcome.carbons.get(cr.carbon.name);
    if (!o) return cr;
    if ('skipped' in o) {
      warnings.push(`${cr.carbon.name}: Monte Carlo skipped: ${o.skipped}`);
      return { ...cr, warnings: [...cr.warnings, `Monte Carlo skipped: ${o.skipped}`] };
    }
    return { ...cr, uncertainty: o.uncertainty, warnings: [...cr.warnings, ...o.warnings] };
  });
  const out: PipelineResult = { ...result, carbons, warnings, uncertainty: outcome.settings, timingMs: { ...result.timingMs } };
  if (outcome.carbons.size) out.timingMs['Monte Carlo'] = outcome.timingMs;
  return out;
}
