/**
 * The kinetic run length of one GAC carbon (capability 18 in the whole job): the fixed-bed
 * IAST–surface-diffusion model of the site water (fictive DOC components with their specific
 * UV254 absorbances, and every compound as a trace target), the run length of the staggered
 * filters that keeps the blended effluent within every compound goal and the indicator-mean rule,
 * and the carbon use and cost at that run length — beside the equilibrium bound of gacStep.
 *
 *   components  background = backgroundComponents(bg, DOC)·K factor (doc: true, UV254 per mg/L);
 *               targets at c0 with K (after a calibrated factor), 1/n, Ds, DL or kf
 *   bed         EBCT, depth, ε, grain radius, grain density ρp = ρ_bed/(1 − ε) unless given
 *   run length  staggeredRun (src/kinetics/staggeredFiltersRun.ts) on the simulated curves
 *   carbon      CUR = ρ_bed/BV_run, yearly mass and cost, filter life BV_run·EBCT
 *               (src/kinetics/staggeredFiltersCarbon.ts)
 * The simulation covers at most 1.5 × the largest equilibrium bound (capped at GAC_MAX_BED_VOLUMES): a
 * target weaker than the strongest DOC fraction is displaced and can break through after its
 * bound, so the bound is not always an upper bound on the run (GAC_UPPER_BOUND_CAUTION). It
 * stops once the run length is settled and the curves reach GAC_FIGURE_MARGIN × the run length
 * (the run ends far earlier than the bounds: on the demo near 26 000 of up to 150 000 BV).
 * Units: EBCT min (s inside the model), ρ kg/m³, flow m³/d, concentrations mg/L, bed volumes.
 * @throws InputError when the background is not fractionated (the model needs the fictive DOC
 *   components) or a kinetic input is bad (JSON path under carbons[i].kinetics);
 *   ComputationError when the fixed-bed model fails
 */
import { InputError } from '../core/errors.js';
import type { CompoundGoal } from '../design/compoundGoal.js';
import { backgroundComponents } from '../fractionation/backgroundPrediction.js';
import type { BackgroundFile } from '../fractionation/backgroundFile.js';
import { simulateFixedBed, type FixedBedResult } from '../kinetics/fixedBed.js';
import type { FixedBedComponent } from '../kinetics/fixedBedInput.js';
import { allowedCOverC0 } from '../kinetics/staggeredFilters.js';
import { gacCarbonUse, type CarbonUse } from '../kinetics/staggeredFiltersCarbon.js';
import { staggeredRun, type StaggeredRun, type StaggeredRunInput } from '../kinetics/staggeredFiltersRun.js';
import type { CarbonSpec, ProjectSpec } from '../project/projectTypes.js';
import type { ComponentKinetics } from '../project/readGacKinetics.js';
import type { CompoundSystem } from '../design/competitionSystem.js';
import type { GacStepResult } from './gacStep.js';

/** Longest simulated run, bed volumes (a cap on 1.5 × the largest equilibrium bound). */
export const GAC_MAX_BED_VOLUMES = 300_000;
/** Output points of the simulated curves (evenly spaced, plus the model's early log-spaced points). */
export const GAC_CURVE_POINTS = 161;

export interface GacKineticResult {
  /** Simulated run length, bed volumes. */
  toBedVolumes: number;
  simulation: FixedBedResult;
  /** Allowed blended c/c0 per compound id (compounds whose goal needs carbon). */
  goals: Record<string, number>;
  run: StaggeredRun;
  filters: number;
  /** Carbon use at the run length (absent when no run meets the goals). */
  use?: CarbonUse;
  /** Equilibrium bound of the governing equilibrium compound, bed volumes. */
  equilibriumBedVolumes: number;
}

export function fractionatedBackground(bg: BackgroundFile | undefined, carbonIndex: number): BackgroundFile {
  if (!bg) throw new InputError('the GAC fixed-bed model needs a fractionated background ("isotherm" or "file"), not EBCs', { path: `carbons[${carbonIndex}].kinetics` });
  return bg;
}

/** The simulation goes on to GAC_FIGURE_MARGIN × the run length, so the figures show the curves past it. */
export const GAC_FIGURE_MARGIN = 1.25;

/**
 * Has the simulated run (curves so far) settled the run length? A cheap necessary condition first
 * (some single-filter outlet above its goal, or the indicator mean of the single filter below the
 * goal: until then every blend meets every goal), then the staggered run itself: settled when it
 * is not at the curves' end and the curves reach GAC_FIGURE_MARGIN × the run length.
 */
function runEnded(bedVolumes: readonly number[], byId: Readonly<Record<string, readonly number[]>>, allowed: Readonly<Record<string, number>>, indicator: { substances: ReadonlyArray<{ id: string }>; goalPercent: number } | undefined, runOf: (bv: readonly number[], byId: Readonly<Record<string, readonly number[]>>) => StaggeredRun): boolean {
  const last = bedVolumes.length - 1;
  let exceeded = Object.entries(allowed).some(([id, g]) => byId[id]!.some((c) => c > g));
  if (!exceeded && indicator) {
    const mean = indicator.substances.reduce((s, x) => s + 100 * (1 - byId[x.id]![last]!), 0) / indicator.substances.length;
    exceeded = mean < indicator.goalPercent; // a plain mean at the end: only a trigger for the exact check below
  }
  if (!exceeded) return false;
  const run = runOf(bedVolumes, byId);
  return !run.atCurveEnd && (run.runBedVolumes ?? 0) * GAC_FIGURE_MARGIN <= bedVolumes[last]!;
}

/** The fictive DOC components of the fixed bed at DOC `docMgPerL` (K times the carbon's K factor, UV254 per mg/L, the carbon's DOC diffusivities); also the column calibration's background. */
export function gacDocComponents(bg: BackgroundFile, docMgPerL: number, kFactor: number, film: ComponentKinetics): FixedBedComponent[] {
  return backgroundComponents(bg, docMgPerL).map((c, i) => {
    const out: FixedBedComponent = { id: `DOC ${c.id}`, c0MgPerL: c.c0MgPerL, K: c.K * kFactor, oneOverN: c.oneOverN, doc: true, ...film };
    const a = bg.components[i]!.specific_uv254_per_m_per_mg_per_L;
    if (a !== undefined && a > 0) out.uv254PerMgPerL = a;
    return out;
  });
}

/** The indicator-mean rule of the staggered run (undefined when the project sets no indicator goal or has no member). */
export type GacIndicatorRule = StaggeredRunInput['indicator'];

/** Allowed blended c/c0 per compound whose goal needs carbon (1 − removal, or limit/c0). */
export function gacAllowedCOverC0(project: ProjectSpec, goals: Readonly<Record<string, CompoundGoal>>): Record<string, number> {
  const allowed: Record<string, number> = {};
  for (const c of project.compounds) {
    const g = goals[c.id]!;
    if (!(g.removalFraction > 0)) continue; // met without carbon
    allowed[c.id] = g.kind === 'limit' ? allowedCOverC0({ limitMgPerL: g.limitMgPerL!, c0MgPerL: c.c0MgPerL }) : allowedCOverC0({ removalFraction: g.removalFraction });
  }
  return allowed;
}

/** The project's indicator-mean rule for the staggered run. */
export function gacIndicatorRule(project: ProjectSpec): GacIndicatorRule {
  const indicatorGoal = project.goals.indicator;
  const members = project.compounds.filter((c) => c.indicatorCategory !== undefined && (!indicatorGoal?.compounds || indicatorGoal.compounds.includes(c.id)));
  return indicatorGoal && members.length > 0 ? { substances: members.map((c) => ({ id: c.id, category: c.indicatorCategory! })), goalPercent: indicatorGoal.meanRemovalPercent } : undefined;
}

/** The staggered run of outlet curves on one bed-volume grid (the run length's rule; also the GAC Monte Carlo's). */
export function gacStaggeredRun(bedVolumes: readonly number[], byId: Readonly<Record<string, readonly number[]>>, allowed: Readonly<Record<string, number>>, filters: number, indicator: GacIndicatorRule): StaggeredRun {
  return staggeredRun({ curves: Object.fromEntries(Object.entries(byId).map(([id, c]) => [id, { bedVolumes, cOverC0: c }])), goals: allowed, filters, ...(indicator ? { indicator } : {}) });
}

/** Kinetic run length of a GAC carbon with `carbon.bedKinetics`; see the file comment. */
export function gacKineticStep(project: ProjectSpec, carbonIndex: number, carbon: CarbonSpec, systems: readonly CompoundSystem[], background: BackgroundFile | undefined, goals: Readonly<Record<string, CompoundGoal>>, equilibrium: GacStepResult): GacKineticResult {
  const k = carbon.bedKinetics!;
  const bg = fractionatedBackground(background, carbonIndex);
  const doc = project.site.docMgPerL;
  const docComponents = gacDocComponents(bg, doc, carbon.kFactor, k.doc);
  const targets: FixedBedComponent[] = systems.map((s) => ({ id: s.compoundId, c0MgPerL: s.c0MgPerL, K: s.inMixture.K, oneOverN: s.inMixture.oneOverN, ...k.compounds[s.compoundId]! }));
  const allowed = gacAllowedCOverC0(project, goals);
  const largestBound = Math.max(...equilibrium.estimate.targets.map((t) => t.bedVolumes));
  const longest = Math.min(GAC_MAX_BED_VOLUMES, Math.ceil(1.5 * largestBound));
  const indicator = gacIndicatorRule(project);
  const runOf = (bedVolumes: readonly number[], byId: Readonly<Record<string, readonly number[]>>) => gacStaggeredRun(bedVolumes, byId, allowed, k.filters, indicator);
  const simulation = simulateFixedBed(
    { components: [...docComponents, ...targets], bed: { ebctS: carbon.ebctMin! * 60, bedDepthM: k.bedDepthM, porosity: k.porosity, particleRadiusM: k.particleRadiusM, particleDensityKgPerM3: k.particleDensityKgPerM3, temperatureC: k.temperatureC } },
    { toBedVolumes: longest, points: GAC_CURVE_POINTS, goals: allowed, storedBackground: true, stopWhen: (bv, byId) => runEnded(bv, byId, allowed, indicator, runOf) },
  );
  const toBedVolumes = simulation.bedVolumes[simulation.bedVolumes.length - 1]!;
  const run = runOf(simulation.bedVolumes, Object.fromEntries(simulation.components.map((c) => [c.id, c.cOverC0])));
  const out: GacKineticResult = { toBedVolumes, simulation, goals: allowed, run, filters: k.filters, equilibriumBedVolumes: equilibrium.governing.bedVolumes };
  if (run.runBedVolumes !== null && run.runBedVolumes > 0) {
    out.use = gacCarbonUse({ runBedVolumes: run.runBedVolumes, bedDensityKgPerM3: carbon.bedDensityKgPerM3!, flowM3PerD: project.site.flowM3PerD, ebctMin: carbon.ebctMin!, pricePerKg: carbon.pricePerKg });
  }
  return out;
}
