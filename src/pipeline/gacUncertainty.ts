/**
 * The Monte Carlo of a GAC carbon's kinetic run length (capability 13 for the fixed bed): draws of
 * the run length of the staggered filters, the filter life, the carbon usage rate, the cost per m³
 * and the yearly carbon and cost, with P10 / P50 / P90 (Hyndman & Fan 1996, type 7).
 *
 * Sampled, independently and lognormal around the run's value (median = point value,
 * σ_ln = √(ln(1 + cv²))): each compound's K (`uncertainty.K_rel_sd`) and 1/n
 * (`uncertainty.one_over_n_rel_sd`) in the fixed bed, and each compound's Ds — a Ds fitted to a
 * column test takes its 95 % interval (SD of ln Ds = ln(hi/lo)/(2·1.96), normal approximation on
 * ln Ds), a given Ds takes `uncertainty.Ds_rel_sd` (default DEFAULT_DS_REL_SD, ours, no source).
 * NOT sampled: the background (the fictive DOC components, their fractions, K, Ds, DL, and the
 * DOC stay at the point value), DL or kf, the bed and the grains. The compounds are traces against
 * the background, so their parameters do not change it: the run's stored background
 * (`simulation.storedBackground`; solved here with `traceBed` when absent) serves every draw, which
 * integrates every compound alone against it on the run's bed-volume grid; the draw's run length is
 * the staggered run of those curves (gacStaggeredRun, the run's rule) and its carbon use that of
 * gacCarbonUse. The draws are taken first, in one stream; their outlets may then be shared with a
 * worker thread (startGacUncertainty, src/uncertainty/sharedTraceOutlets.ts) with the same figures.
 *
 * A draw whose run reaches the end of the simulated curves has a run length of at least that end
 * (counted, the percentiles then a lower bound there); a draw in which no run meets the goals
 * counts as run length 0 and an unbounded carbon use. With every deviation zero the draws
 * reproduce the run's figures within the trace shortcut's tolerance (tested).
 * Units: bed volumes, days, g/m³, currency per m³ and per year, kg per year.
 * @throws ComputationError when a draw's integration fails
 */
import { InputError } from '../core/errors.js';
import { traceBed, type TraceBed } from '../kinetics/fixedBed.js';
import type { FixedBedComponent } from '../kinetics/fixedBedInput.js';
import { gacCarbonUse } from '../kinetics/staggeredFiltersCarbon.js';
import { percentiles } from '../numerics/percentile.js';
import type { ProjectSpec, UncertaintySpec } from '../project/projectTypes.js';
import { lognormalFromZ, lognormalSigma, NormalSampler } from '../uncertainty/distributions.js';
import { chunkRng } from '../uncertainty/prng.js';
import { sharedTraceOutlets, type StartedTraceWorker } from '../uncertainty/sharedTraceOutlets.js';
import { DEFAULT_DS_REL_SD } from './contactUncertainty.js';
import { fractionatedBackground, gacDocComponents, gacIndicatorRule, gacStaggeredRun } from './gacKineticStep.js';
import type { CarbonResult, PipelineResult } from './pipelineTypes.js';
import type { UncertainParameter, UncertaintySettings } from './uncertaintyTypes.js';

/** Draws of a GAC carbon when `uncertainty.gac_draws` is not given (ours: each draw integrates every compound again, about 0.2 s of CPU on the demo's nine compounds). */
export const DEFAULT_GAC_DRAWS = 20;
/** Random stream of the GAC draws (a chunk index of chunkRng apart from the PAC carbons' chunks). */
const GAC_STREAM = 0x6ac0;
const Z95 = 1.959963984540054;

/** Draws of a GAC carbon: gac_draws (default 20), at most `draws`. */
export function gacDrawCount(s: Pick<UncertaintySpec, 'draws' | 'gacDraws'>): number {
  return Math.min(s.draws, s.gacDraws ?? DEFAULT_GAC_DRAWS);
}

/** One quantity of the GAC Monte Carlo. */
export interface GacUncertainQuantity {
  key: 'run_bed_volumes' | 'filter_life_days' | 'carbon_usage_g_per_m3' | 'cost_per_m3' | 'yearly_carbon_kg' | 'yearly_cost';
  label: string;
  unit: string;
  /** The run's own figure. */
  pointEstimate: number;
  p10: number;
  p50: number;
  p90: number;
}

export interface GacUncertainty {
  draws: number;
  seed: number;
  parameters: UncertainParameter[];
  /** What stays at the point value, in words. */
  notSampled: string;
  quantities: GacUncertainQuantity[];
  /** Draws whose run reaches the end of the simulated curves (their run length is a lower bound). */
  atCurveEndDraws: number;
  /** Draws in which no run meets every goal. */
  noRunDraws: number;
  /** Wall time of the draws in this thread, ms (with a worker thread: planning, and from finishing on; the worker's part beside the PAC draws is not counted). */
  timingMs: number;
}

export const GAC_NOT_SAMPLED = 'the background (fictive DOC components: fractions, K, 1/n, Ds, DL) and the DOC stay at the point value; DL or kf, the bed and the grains are not sampled';

/** The draws of one GAC carbon before their outlets are computed (see gacUncertainty). */
interface GacDrawPlan {
  draws: number;
  /** The stored background of the run (or solved here). */
  bed: TraceBed;
  /** Compound ids, in the order of each draw's targets. */
  ids: string[];
  /** Drawn targets, draw by draw (ids.length per draw). */
  drawn: FixedBedComponent[];
  parameters: UncertainParameter[];
}

/** Plan the draws of GAC carbon `cr`: the random streams are read here, in this thread, in the order of the single-threaded run. */
function planGacDraws(project: ProjectSpec, cr: CarbonResult, carbonIndex: number, s: Pick<UncertaintySpec, 'draws' | 'gacDraws' | 'seed' | 'KRelSd' | 'oneOverNRelSd' | 'dsRelSd'>): GacDrawPlan | { skipped: string } {
  const k = cr.gacKinetic;
  const bk = cr.columnCalibration?.bedKinetics ?? cr.carbon.bedKinetics;
  if (!k || !bk) return { skipped: 'the GAC carbon has no fixed-bed inputs (kinetics): no kinetic run length to sample' };
  const draws = gacDrawCount(s);
  if (draws === 0) return { skipped: 'uncertainty.gac_draws is 0: no draws of the GAC run length' };
  const bg = gacDocComponents(fractionatedBackground(cr.background?.background, carbonIndex), project.site.docMgPerL, cr.background?.backgroundKFactor ?? cr.carbon.kFactor, bk.doc);
  const bedSpec = { ebctS: cr.carbon.ebctMin! * 60, bedDepthM: bk.bedDepthM, porosity: bk.porosity, particleRadiusM: bk.particleRadiusM, particleDensityKgPerM3: bk.particleDensityKgPerM3, temperatureC: bk.temperatureC };
  const grid = k.simulation.bedVolumes;
  // the run's background, solved once there (the same components, bed and grid), else solved here
  const tb = k.simulation.storedBackground ?? traceBed({ components: bg, bed: bedSpec }, { outputBedVolumes: grid.slice(1) });
  const sigK = lognormalSigma(s.KRelSd), sigN = lognormalSigma(s.oneOverNRelSd);
  const relDs = s.dsRelSd ?? DEFAULT_DS_REL_SD;
  const relBasis = s.dsRelSd === undefined ? `default ${DEFAULT_DS_REL_SD * 100} % (ours, no source; set uncertainty.Ds_rel_sd)` : 'project uncertainty.Ds_rel_sd';
  const parameters: UncertainParameter[] = [];
  if (s.KRelSd > 0) parameters.push({ parameter: "compounds' K (fixed bed)", distribution: 'lognormal', sd: s.KRelSd, basis: 'project uncertainty.K_rel_sd' });
  if (s.oneOverNRelSd > 0) parameters.push({ parameter: "compounds' 1/n (fixed bed)", distribution: 'lognormal', sd: s.oneOverNRelSd, basis: 'project uncertainty.one_over_n_rel_sd' });
  const targets = cr.systems.map((sys) => {
    const target: FixedBedComponent = { id: sys.compoundId, c0MgPerL: sys.c0MgPerL, K: sys.inMixture.K, oneOverN: sys.inMixture.oneOverN, ...bk.compounds[sys.compoundId]! };
    const fit = cr.columnCalibration?.fits.find((f) => f.compoundId === sys.compoundId);
    const ci = fit?.ci95M2PerS;
    let sigDs: number;
    if (ci && ci[0] > 0 && ci[1] >= ci[0]) {
      sigDs = Math.log(ci[1] / ci[0]) / (2 * Z95);
      parameters.push({ parameter: `Ds of ${sys.compoundId} (fixed bed)`, distribution: 'lognormal', sd: Math.sqrt(Math.expm1(sigDs * sigDs)), basis: `column fit 95 % interval ${ci[0].toPrecision(3)}–${ci[1].toPrecision(3)} m2/s (SD of ln Ds ${sigDs.toPrecision(3)})` });
    } else {
      sigDs = lognormalSigma(relDs);
      if (relDs > 0) parameters.push({ parameter: `Ds of ${sys.compoundId} (fixed bed)`, distribution: 'lognormal', sd: relDs, basis: fit ? `${relBasis} (the column fit has no interval)` : relBasis });
    }
    return { target, sigDs };
  });
  const normal = new NormalSampler(chunkRng(s.seed, GAC_STREAM));
  const drawn: FixedBedComponent[] = [];
  for (let d = 0; d < draws; d++) {
    for (const { target, sigDs } of targets) {
      const zK = normal.next(), zN = normal.next(), zD = normal.next(); // always three per compound: the streams do not depend on the SDs
      drawn.push({ ...target, K: lognormalFromZ(target.K, sigK, zK), oneOverN: lognormalFromZ(target.oneOverN, sigN, zN), ...(target.dsM2PerS !== undefined ? { dsM2PerS: lognormalFromZ(target.dsM2PerS, sigDs, zD) } : {}) });
    }
  }
  return { draws, bed: tb, ids: targets.map((t) => t.target.id), drawn, parameters };
}

/** The skip of a compound whose outlet the trace shortcut refuses: the first drawn target that fails, in draw order (as the single-threaded run meets it). */
function refused(plan: GacDrawPlan): { skipped: string } {
  for (const t of plan.drawn) {
    try {
      plan.bed.outlet(t);
    } catch (e) {
      if (e instanceof InputError) return { skipped: `${t.id}: ${e.message} (the GAC Monte Carlo integrates each compound alone against the background)` };
      throw e;
    }
  }
  throw new InputError('a GAC Monte Carlo outlet was refused, but no target fails alone');
}

/** The Monte Carlo's figures from the outlets of every drawn target (c/c0 on the run's grid, in plan order). */
function summariseGacDraws(project: ProjectSpec, cr: CarbonResult, plan: GacDrawPlan, outlets: readonly (readonly number[])[], seed: number, timingMs: number): GacUncertainty {
  const k = cr.gacKinetic!;
  const grid = k.simulation.bedVolumes;
  const allowed = k.goals;
  const indicator = gacIndicatorRule(project);
  const { draws, ids } = plan;
  const run = new Float64Array(draws);
  let atEnd = 0, noRun = 0;
  for (let d = 0; d < draws; d++) {
    const byId: Record<string, readonly number[]> = {};
    ids.forEach((id, m) => { byId[id] = outlets[d * ids.length + m]!; });
    const r = gacStaggeredRun(grid, byId, allowed, k.filters, indicator);
    if (r.runBedVolumes === null || !(r.runBedVolumes > 0)) { noRun++; run[d] = 0; continue; }
    if (r.atCurveEnd) atEnd++;
    run[d] = r.runBedVolumes;
  }
  const use = (bv: number) => (bv > 0 ? gacCarbonUse({ runBedVolumes: bv, bedDensityKgPerM3: cr.carbon.bedDensityKgPerM3!, flowM3PerD: project.site.flowM3PerD, ebctMin: cr.carbon.ebctMin!, pricePerKg: cr.carbon.pricePerKg }) : undefined);
  const uses = Array.from(run, use);
  const cur = cr.carbon.currency;
  const defs: Array<[GacUncertainQuantity['key'], string, string, (bv: number, u: ReturnType<typeof use>) => number]> = [
    ['run_bed_volumes', 'run length', 'bed volumes', (bv) => bv],
    ['filter_life_days', 'filter life', 'd', (bv, u) => (u ? u.filterLifeDays! : 0)],
    ['carbon_usage_g_per_m3', 'carbon usage rate', 'g/m3', (_, u) => (u ? u.carbonUsageGPerM3 : Infinity)],
    ['cost_per_m3', 'carbon cost per m³', `${cur}/m3`, (_, u) => (u ? u.costPerM3! : Infinity)],
    ['yearly_carbon_kg', 'carbon per year (design flow)', 'kg/a', (_, u) => (u ? u.yearlyCarbonKg! : Infinity)],
    ['yearly_cost', 'carbon cost per year (design flow)', `${cur}/a`, (_, u) => (u ? u.yearlyCost! : Infinity)],
  ];
  const runBv = k.run.runBedVolumes ?? 0;
  const pointUse = k.use;
  const quantities = defs.map(([key, label, unit, f]): GacUncertainQuantity => {
    const [p10, p50, p90] = percentiles(Float64Array.from(run, (bv, i) => f(bv, uses[i])), [0.1, 0.5, 0.9]);
    return { key, label, unit, pointEstimate: f(runBv, runBv > 0 ? pointUse : undefined), p10: p10!, p50: p50!, p90: p90! };
  });
  return { draws, seed, parameters: plan.parameters, notSampled: GAC_NOT_SAMPLED, quantities, atCurveEndDraws: atEnd, noRunDraws: noRun, timingMs };
}

/**
 * The Monte Carlo of the run length of GAC carbon `cr` (see the file comment), in this thread;
 * `{ skipped }` with the reason when the carbon has no kinetic run length or a compound is not a trace.
 */
export function gacUncertainty(project: ProjectSpec, cr: CarbonResult, carbonIndex: number, s: Pick<UncertaintySpec, 'draws' | 'gacDraws' | 'seed' | 'KRelSd' | 'oneOverNRelSd' | 'dsRelSd'>): GacUncertainty | { skipped: string } {
  const t0 = performance.now();
  const plan = planGacDraws(project, cr, carbonIndex, s);
  if ('skipped' in plan) return plan;
  const outlets: number[][] = [];
  for (const t of plan.drawn) {
    try {
      outlets.push(plan.bed.outlet(t).cOverC0);
    } catch (e) {
      if (e instanceof InputError) return refused(plan);
      throw e;
    }
  }
  return summariseGacDraws(project, cr, plan, outlets, s.seed, performance.now() - t0);
}

/** The pipeline result with each GAC carbon's Monte Carlo outcome (undefined: no GAC kinetic run) attached, with its warnings. */
function attachGacUncertainty(result: PipelineResult, outcomes: ReadonlyArray<GacUncertainty | { skipped: string } | undefined>): PipelineResult {
  const warnings = result.warnings.slice();
  let ms = 0;
  const carbons = result.carbons.map((cr, ci): CarbonResult => {
    const u = outcomes[ci];
    if (!cr.gacKinetic || !u) return cr;
    if ('skipped' in u) {
      warnings.push(`${cr.carbon.name}: GAC Monte Carlo skipped: ${u.skipped}`);
      return { ...cr, warnings: [...cr.warnings, `GAC Monte Carlo skipped: ${u.skipped}`] };
    }
    ms += u.timingMs;
    const w: string[] = [];
    if (u.atCurveEndDraws > 0) w.push(`GAC Monte Carlo: ${u.atCurveEndDraws} of ${u.draws} draws run to the end of the simulated curves (${Math.round(cr.gacKinetic.toBedVolumes)} bed volumes); their run length is a lower bound`);
    if (u.noRunDraws > 0) w.push(`GAC Monte Carlo: in ${u.noRunDraws} of ${u.draws} draws no run meets every goal (counted as run length 0, unbounded carbon use)`);
    return { ...cr, gacUncertainty: u, warnings: [...cr.warnings, ...w] };
  });
  return { ...result, carbons, warnings, timingMs: { ...result.timingMs, 'GAC Monte Carlo': ms } };
}

/**
 * The pipeline result with the GAC Monte Carlo of every GAC carbon with a kinetic run length
 * (a new object; `result` is unchanged), in this thread. Nothing happens with gac_draws 0.
 * @throws ComputationError when a draw's integration fails
 */
export function withGacUncertainty(result: PipelineResult, s: UncertaintySettings): PipelineResult {
  if (gacDrawCount(s) === 0 || !result.carbons.some((c) => c.gacKinetic)) return result;
  return attachGacUncertainty(result, result.carbons.map((cr, ci) => (cr.gacKinetic ? gacUncertainty(result.project, cr, ci, s) : undefined)));
}

/** GAC draws begun (startGacUncertainty). */
export interface StartedGacUncertainty {
  /** Finish the draws and attach them to `result` (the same run's result, e.g. after the PAC Monte Carlo): what withGacUncertainty gives. */
  finish(result: PipelineResult): Promise<PipelineResult>;
  /** Stop the worker thread (after a failure elsewhere). */
  cancel(): Promise<void>;
}

/**
 * Begin the GAC Monte Carlo of `result` with a worker thread that starts on the draws' outlets at
 * once (beside whatever this thread does next, e.g. the PAC draws); `finish` then shares what is
 * left with it (src/uncertainty/sharedTraceOutlets.ts). The outcome is identical to
 * withGacUncertainty's: the random draws are taken here in the same order, and each outlet is a
 * pure function of its drawn target. `workers` 0 keeps everything in this thread.
 */
export function startGacUncertainty(result: PipelineResult, s: UncertaintySettings, options: { workers?: number; /** A worker started ahead (startTraceOutletWorker), for the first carbon's outlets. */ started?: StartedTraceWorker } = {}): StartedGacUncertainty {
  const t0 = performance.now();
  const active = gacDrawCount(s) > 0 && result.carbons.some((c) => c.gacKinetic);
  const plans = active ? result.carbons.map((cr, ci) => (cr.gacKinetic ? planGacDraws(result.project, cr, ci, s) : undefined)) : [];
  // one shared run over the drawn targets of every carbon, carbon after carbon
  const ready = plans.filter((p): p is GacDrawPlan => p !== undefined && !('skipped' in p));
  const shared = ready.map((p, i) => sharedTraceOutlets(p.bed, p.drawn, { ...(options.workers !== undefined ? { workers: options.workers } : {}), ...(i === 0 && options.started ? { started: options.started } : {}) }));
  const planMs = performance.now() - t0;
  return {
    async finish(after) {
      if (!active) return after;
      const t1 = performance.now();
      const outcomes: Array<GacUncertainty | { skipped: string } | undefined> = [];
      let r = 0;
      for (let ci = 0; ci < plans.length; ci++) {
        const plan = plans[ci];
        if (plan === undefined || 'skipped' in plan) { outcomes.push(plan); continue; }
        const run = shared[r++]!;
        let outlets: number[][];
        try {
          outlets = await run.finish();
        } catch (e) {
          if (!(e instanceof InputError)) { await Promise.all(shared.map((x) => x.cancel())); throw e; }
          outcomes.push(refused(plan));
          continue;
        }
        outcomes.push(summariseGacDraws(result.project, result.carbons[ci]!, plan, outlets, s.seed, planMs + performance.now() - t1));
      }
      return attachGacUncertainty(after, outcomes);
    },
    async cancel() { await Promise.all(shared.map((x) => x.cancel())); },
  };
}
