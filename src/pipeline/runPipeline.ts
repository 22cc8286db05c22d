/**
 * The whole job (capabilities 8–10): background → calibrations → per carbon the systems, the
 * required dose and governing compound at the design DOC, removal curves, reduced loadings and
 * the indicator check at the design dose, cost per m³, the daily doses over the DOC series, the
 * surrogates (DOC/UV254 reduction and set-points), the pilot check and, for GAC carbons, the
 * equilibrium GAC estimate (capabilities 11, 12). Pure: no file access; progress is reported
 * through a callback. Synchronous; the Monte Carlo step (capability 13) is added by the async
 * `runPipelineWithUncertainty` (runWithUncertainty.ts).
 *
 * @throws InputError on inconsistent inputs; ComputationError if a solver fails.
 */
import { backgroundStep } from './backgroundStep.js';
import { calibrationStep, type CompoundCalibration } from './calibrationStep.js';
import { buildSystems } from './buildSystems.js';
import { compoundGoal, type CompoundGoal } from './compoundGoal.js';
import { requiredDose } from './requiredDose.js';
import { reducedLoading } from './reducedLoading.js';
import { removalCurves } from './removalCurves.js';
import { indicatorCheckAt, type IndicatorPlan } from './indicatorCheck.js';
import { dailyDoses } from './dailyDoses.js';
import { dayDose } from './dayDose.js';
import type { CompoundSystem } from './competitionSystem.js';
import type { CarbonResult, PipelineInput, PipelineOptions, PipelineResult } from './pipelineTypes.js';
import type { ProjectSpec } from '../project/projectTypes.js';
import { fmtConcentration } from './formatting.js';
import { surrogateModel, surrogateStep } from './surrogateStep.js';
import { pilotStep, type PilotStepResult } from './pilotStep.js';
import { gacStep } from './gacStep.js';
import { GAC_UPPER_BOUND_CAUTION } from '../gac/gacEstimate.js';
import { InputError } from '../core/errors.js';

/** The indicator plan of one carbon, when the project sets an indicator goal. */
export function indicatorPlan(project: ProjectSpec, systems: readonly CompoundSystem[]): IndicatorPlan | undefined {
  const goal = project.goals.indicator;
  if (!goal) return undefined;
  const members = project.compounds
    .map((c, i) => ({ c, sys: systems[i]! }))
    .filter(({ c }) => c.indicatorCategory !== undefined)
    .map(({ c, sys }) => ({ system: sys, category: c.indicatorCategory! }));
  const plan: IndicatorPlan = { members, goalPercent: goal.meanRemovalPercent };
  if (goal.compounds) plan.chosen = goal.compounds;
  return plan;
}

export function runPipeline(input: PipelineInput, options: PipelineOptions = {}): PipelineResult {
  const { project } = input;
  const progress = options.onProgress ?? (() => undefined);
  const timing: Record<string, number> = {};
  const timed = <T>(name: string, f: () => T): T => {
    const t0 = performance.now();
    try { return f(); } finally { timing[name] = (timing[name] ?? 0) + performance.now() - t0; }
  };
  const warnings: string[] = [...(input.provenance.notes ?? [])];

  progress({ step: 'background', done: 0, total: 1 });
  const bg = timed('background', () => backgroundStep(project.background, input.isotherm, input.backgroundFile));
  warnings.push(...bg.warnings.map((w) => `background: ${w}`));

  const calibrations: CompoundCalibration[] = timed('calibration', () => calibrationStep(project, input.jarTests, bg));
  for (const c of calibrations) warnings.push(...c.warnings.map((w) => `calibration of ${c.compoundId}: ${w}`));
  const calMap = new Map(calibrations.map((c) => [c.compoundId, c] as const));

  const goals: Record<string, CompoundGoal> = {};
  for (const c of project.compounds) goals[c.id] = compoundGoal(c, project.goals, fmtConcentration);
  const goalList = project.compounds.map((c) => goals[c.id]!);
  const doc = project.site.docMgPerL;

  const carbons: CarbonResult[] = project.carbons.map((carbon, ci) => {
    const res: CarbonResult = { carbon, systems: [], warnings: [] };
    const systems = buildSystems(project, carbon, bg, calMap);
    res.systems = systems;
    if (carbon.type === 'GAC') {
      progress({ step: `${carbon.name}: GAC estimate`, done: ci, total: project.carbons.length });
      res.gac = timed('GAC', () => gacStep(carbon, systems, doc, project.site.flowM3PerD));
      res.warnings.push(`GAC: ${GAC_UPPER_BOUND_CAUTION}`);
      return res;
    }
    const plan = indicatorPlan(project, systems);
    progress({ step: `${carbon.name}: doses at the design DOC`, done: ci, total: project.carbons.length });
    const req = timed('doses', () => requiredDose(systems, goalList, plan, doc));
    res.required = req;
    for (const c of req.compounds) {
      if (c.status === 'unreachable') res.warnings.push(`${c.compoundId}: ${c.message}; it is left out of the required dose`);
      if (c.status === 'no-carbon-needed') res.warnings.push(`${c.compoundId}: ${c.message}`);
    }
    if (req.indicator && req.indicator.status !== 'ok') res.warnings.push(`indicator goal: ${req.indicator.message}`);
    const curves = timed('curves', () => removalCurves(carbon.name, systems, doc, project.goals.sweep));
    res.curves = curves;
    if (bg.background) {
      const background = bg.background;
      res.surrogates = timed('surrogates', () => surrogateStep(carbon.name, background, carbon.kFactor, doc, curves, req, goalList));
      if (!res.surrogates.hasUv254) res.warnings.push('the background has no UV254 absorbances: DOC reduction only, no UV254 set-point');
    }
    const design = project.goals.designDoseMgPerL ?? req.doseMgPerL ?? undefined;
    if (design !== undefined && design > 0) {
      res.designDoseMgPerL = design;
      res.designDoseSource = project.goals.designDoseMgPerL !== undefined ? 'goals.design_dose' : 'required dose';
      res.reducedLoadings = timed('reduced loading', () => systems.map((s) => reducedLoading(s, doc, design)));
      if (plan) res.indicator = timed('indicators', () => indicatorCheckAt(plan, doc, design));
    }
    if (req.doseMgPerL !== null) {
      res.costPerM3 = (req.doseMgPerL / 1000) * carbon.pricePerKg; // g/m³ → kg/m³ × price per kg
      res.carbonKgPerDAtDesign = (req.doseMgPerL * project.site.flowM3PerD) / 1000;
    } else {
      res.warnings.push('no goal is reachable with this carbon; no dose or cost');
    }
    if (input.series) {
      const series = input.series;
      res.daily = timed('daily doses', () => dailyDoses(carbon, series, (d, near) => dayDose(systems, goalList, plan, d, req, near), (done, total) => {
        if (done % 30 === 0 || done === total) progress({ step: `${carbon.name}: daily doses`, done, total });
      }));
      res.yearly = { carbonKg: res.daily.yearlyCarbonKg, cost: res.daily.yearlyCost, basis: 'DOC series' };
      const missing = res.daily.rows.length - res.daily.daysWithDose;
      if (missing > 0) res.warnings.push(`${missing} day(s) of the DOC series have no reachable goal and no dose; totals cover the other days`);
    } else if (req.doseMgPerL !== null) {
      const kg = (req.doseMgPerL * project.site.flowM3PerD * 365) / 1000;
      res.yearly = { carbonKg: kg, cost: kg * carbon.pricePerKg, basis: 'design DOC and flow' };
    }
    return res;
  });
  for (const c of carbons) warnings.push(...c.warnings.map((w) => `${c.carbon.name}: ${w}`));
  let pilot: PilotStepResult | undefined;
  if (project.pilot && input.pilot) {
    const spec = project.pilot;
    const pilotData = input.pilot;
    const cr = spec.carbon !== undefined ? carbons.find((c) => c.carbon.name === spec.carbon) : carbons.find((c) => c.carbon.type === 'PAC');
    if (!cr || !bg.background) throw new InputError('the pilot check needs a PAC carbon and a fractionated background ("isotherm" or "file")', { path: 'pilot' });
    const model = surrogateModel(bg.background, doc, cr.carbon.kFactor);
    pilot = timed('pilot check', () => pilotStep(cr.carbon.name, pilotData, spec.bandPercent, model, cr.systems, doc));
    for (const c of pilot.check.compounds) {
      if (c.outliers.length) warnings.push(`pilot check: ${c.compound} has ${c.outliers.length} of ${c.points} point(s) outside ±${spec.bandPercent} percentage points of the prediction (${c.outliers.map((o) => o.sample).join(', ')}); mean residual ${(c.meanResidual * 100).toFixed(1)} percentage points`);
    }
  }
  const out: PipelineResult = {
    project,
    generatedAt: (options.now ?? new Date()).toISOString(),
    background: bg,
    calibrations,
    goals,
    carbons,
    provenance: input.provenance,
    warnings,
    timingMs: timing,
  };
  if (input.series) out.series = input.series;
  if (pilot) out.pilot = pilot;
  return out;
}
