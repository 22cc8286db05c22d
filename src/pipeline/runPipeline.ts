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
import { backgroundStep, type BackgroundStep } from './backgroundStep.js';
import { calibrationStep, type CompoundCalibration } from './calibrationStep.js';
import { buildSystems } from './buildSystems.js';
import { carbonBackground } from './carbonBackgroundStep.js';
import { calibrationTransfer, transferNote } from './calibrationTransferStep.js';
import { compoundGoal, type CompoundGoal } from '../design/compoundGoal.js';
import { designDose, type DesignProblem } from '../design/designDose.js';
import { reducedLoading } from '../design/reducedLoading.js';
import { removalCurves } from '../design/removalCurves.js';
import { indicatorCheckAt, type IndicatorGoal } from '../design/indicatorGoal.js';
import { dailyDoses } from '../design/dailyDoses.js';
import { doseTable, yearlyAtOneDose, type DoseTable } from '../design/doseTable.js';
import { carbonKgPerD } from '../design/carbonCost.js';
import { carbonModel } from '../design/carbonModel.js';
import { contactFactory } from '../kinetics/contactModel.js';
import { ContactSolveStore } from '../kinetics/sharedBackground.js';
import { contactFigures } from './contactStep.js';
import { contactCurvesStep } from './contactCurvesStep.js';
import { kineticCalibrationStep } from './kineticCalibrationStep.js';
import { modelBackgroundPoint } from '../design/modelSurrogates.js';
import { yearlyLabel } from '../design/annualised.js';
import type { CompoundSystem } from '../design/competitionSystem.js';
import type { ContactConditions } from '../kinetics/contactRemoval.js';
import type { CarbonResult, PipelineInput, PipelineOptions, PipelineResult } from './pipelineTypes.js';
import type { ProjectSpec } from '../project/projectTypes.js';
import { fmtConcentration } from '../units/formatQuantity.js';
import { surrogateModel, surrogateStep } from './surrogateStep.js';
import { pilotStep, type PilotStepResult } from './pilotStep.js';
import { gacStep } from './gacStep.js';
import { gacKineticStep } from './gacKineticStep.js';
import { columnCalibrationStep } from './columnCalibrationStep.js';
import { gacKineticFigures } from './gacKineticFigures.js';
import { sweepCovering } from '../design/sweepCovering.js';
import { docRange, doseAgainstDocStep, requiredAtDocs } from './doseAgainstDocStep.js';
import { sensitivityStep } from './sensitivityStep.js';
import { GAC_UPPER_BOUND_CAUTION } from '../gac/gacEstimate.js';
import { InputError } from '../core/errors.js';

/** The indicator goal of the project (compound indices in project order), when it sets one. */
export function indicatorPlan(project: ProjectSpec): IndicatorGoal | undefined {
  const goal = project.goals.indicator;
  if (!goal) return undefined;
  const members = project.compounds
    .map((c, index) => ({ index, category: c.indicatorCategory }))
    .filter((m): m is IndicatorGoal['members'][number] => m.category !== undefined);
  const plan: IndicatorGoal = { members, goalPercent: goal.meanRemovalPercent };
  if (goal.compounds) plan.chosen = goal.compounds;
  return plan;
}

/** The design problem of one carbon: the goals, the indicator goal, the price and UV254 absorbances. */
export function designProblem(project: ProjectSpec, carbon: { pricePerKg: number }, goals: readonly CompoundGoal[], bg: Pick<BackgroundStep, 'background'>): DesignProblem {
  const problem: DesignProblem = { goals, pricePerKg: carbon.pricePerKg };
  const plan = indicatorPlan(project);
  if (plan) problem.indicator = plan;
  const a = bg.background?.components.map((c) => c.specific_uv254_per_m_per_mg_per_L);
  if (a && a.every((v): v is number => typeof v === 'number') && a.some((v) => v > 0)) problem.uv254AbsorbancePerM = a;
  return problem;
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
  const transfer = calibrationTransfer(project.calibrationTransfer, calibrations, project.compounds.map((c) => c.id));
  if (transfer) warnings.push(transferNote(transfer));
  if (transfer?.ebcC0PerDoc !== undefined && project.background.kind === 'ebc') {
    const bgEbc = project.background.ebc;
    const overridden = transfer.toIds.filter((id) => bgEbc[id] !== undefined);
    if (overridden.length) warnings.push(`calibration ${transfer.label}: the transferred EBC replaces the project's own EBC of ${overridden.join(', ')} (background.ebc); set calibration_transfer to "none" to keep those`);
  }

  const goals: Record<string, CompoundGoal> = {};
  for (const c of project.compounds) goals[c.id] = compoundGoal(c, project.goals.removalPercent, fmtConcentration);
  const goalList = project.compounds.map((c) => goals[c.id]!);
  const doc = project.site.docMgPerL;

  const carbons: CarbonResult[] = project.carbons.map((carbon, ci) => {
    const res: CarbonResult = { carbon, systems: [], warnings: [] };
    const cb = timed('background', () => carbonBackground(carbon, ci, bg, input.carbonBackgrounds?.[carbon.name]));
    res.background = cb;
    res.warnings.push(...cb.warnings.map((w) => `own background: ${w}`));
    const systems = buildSystems(project, carbon, cb, calMap, transfer);
    res.systems = systems;
    if (carbon.type === 'GAC') {
      progress({ step: `${carbon.name}: GAC estimate`, done: ci, total: project.carbons.length });
      res.gac = timed('GAC', () => gacStep(carbon, systems, doc, project.site.flowM3PerD));
      res.warnings.push(`GAC: ${GAC_UPPER_BOUND_CAUTION}`);
      const colCal = timed('column calibration', () => columnCalibrationStep({ ...carbon, kFactor: cb.backgroundKFactor }, ci, systems, cb.background, doc, input.columnTests?.[carbon.name]));
      if (colCal) { // the fitted Ds replace the given ones in this carbon's fixed-bed inputs
        carbon = { ...carbon, bedKinetics: colCal.bedKinetics };
        res.carbon = carbon;
        res.columnCalibration = colCal;
        for (const f of colCal.fits) res.warnings.push(...f.warnings.map((w) => `column calibration of Ds of ${f.compoundId}: ${w}`));
      }
      const needsCarbon = project.goals.indicator !== undefined || goalList.some((g) => g.removalFraction > 0);
      if (carbon.bedKinetics && !needsCarbon) res.warnings.push('GAC breakthrough: no goal needs carbon (report-only compounds or limits already met); no run length');
      if (carbon.bedKinetics && needsCarbon) {
        progress({ step: `${carbon.name}: GAC breakthrough`, done: ci, total: project.carbons.length });
        const kin = timed('GAC breakthrough', () => gacKineticStep(project, ci, { ...carbon, kFactor: cb.backgroundKFactor }, systems, cb.background, goals, res.gac!));
        res.gacKinetic = kin;
        res.warnings.push(...gacKineticFigures(res, kin));
      }
      return res;
    }
    const kinCal = timed('kinetic calibration', () => kineticCalibrationStep(carbon, ci, systems, doc, input.kineticTests?.[carbon.name], options.kinetic));
    if (kinCal) { // the fitted Ds replace the given ones in this carbon's contact model
      carbon = { ...carbon, kinetics: kinCal.kinetics };
      res.carbon = carbon;
      res.kineticCalibration = kinCal;
      for (const f of kinCal.fits) res.warnings.push(...f.warnings.map((w) => `kinetic calibration of ${f.parameter === 'doc_Ds' ? 'doc_Ds' : `Ds of ${f.compoundId}`}: ${w}`));
    }
    const problem = designProblem(project, carbon, goalList, cb);
    // one store of contact solves per carbon, for the run's models and the sensitivity cases under other contact conditions
    const contactStore = new ContactSolveStore();
    const factory = contactFactory(project.site.pacContact, carbon, options.kinetic, contactStore);
    const bgAtDoc = cb.background ? surrogateModel(cb.background, doc, cb.backgroundKFactor).background : undefined;
    const model = carbonModel(systems, doc, bgAtDoc, factory);
    progress({ step: `${carbon.name}: doses at the design DOC`, done: ci, total: project.carbons.length });
    const eqDesign = factory ? timed('doses', () => designDose(carbonModel(systems, doc, bgAtDoc), problem)) : undefined;
    const req = timed('doses', () => designDose(model, problem, eqDesign));
    res.required = req;
    if (eqDesign) res.contact = contactFigures(project.site.pacContact!, model, eqDesign, req);
    for (const c of req.compounds) {
      if (c.status === 'unreachable') res.warnings.push(`${c.compoundId}: ${c.message}; it is left out of the required dose`);
      if (c.status === 'met without carbon' || c.status === 'met below the smallest dose') res.warnings.push(`${c.compoundId}: ${c.message}`);
    }
    if (req.indicator && req.indicator.status !== 'met') res.warnings.push(`indicator goal: ${req.indicator.message}`);
    const curves = timed('curves', () => removalCurves(carbon.name, model, sweepCovering(project.goals.sweep, req.doseMgPerL)));
    res.curves = curves;
    if (res.contact && req.governing) { const gov = req.governing; res.contact.curves = timed('contact curves', () => contactCurvesStep(project.site.pacContact!, carbon, systems, doc, gov.compoundId, req.doseMgPerL!, curves, carbonModel(systems, doc), options.kinetic)); }
    if (cb.background) {
      const background = cb.background;
      res.surrogates = timed('surrogates', () => surrogateStep(carbon.name, background, cb.backgroundKFactor, doc, curves, req, goalList, factory ? modelBackgroundPoint(model, problem.uv254AbsorbancePerM) : undefined));
      if (!res.surrogates.hasUv254) res.warnings.push('the background has no UV254 absorbances: DOC reduction only, no UV254 set-point');
    }
    const design = project.goals.designDoseMgPerL ?? req.doseMgPerL ?? undefined;
    if (design !== undefined && design > 0) {
      res.designDoseMgPerL = design;
      res.designDoseSource = project.goals.designDoseMgPerL !== undefined ? 'goals.design_dose' : 'required dose';
      res.reducedLoadings = timed('reduced loading', () => systems.map((s, i) => reducedLoading(model, i, s.c0MgPerL, s.single, design)));
      if (problem.indicator) { const plan = problem.indicator; res.indicator = timed('indicators', () => indicatorCheckAt(model, plan, design)); }
    }
    if (req.doseMgPerL !== null) {
      res.costPerM3 = req.costPerM3!;
      res.carbonKgPerDAtDesign = carbonKgPerD(req.doseMgPerL, project.site.flowM3PerD);
    } else {
      res.warnings.push('no goal is reachable with this carbon; no dose or cost');
    }
    let table: DoseTable | undefined;
    if (input.series) {
      const series = input.series;
      progress({ step: `${carbon.name}: daily doses`, done: 0, total: series.dates.length });
      table = timed('daily doses', () => doseTable(model, problem, series.docMgPerL, req));
      res.daily = timed('daily doses', () => dailyDoses(carbon, series, table!));
      progress({ step: `${carbon.name}: daily doses`, done: series.dates.length, total: series.dates.length });
      res.yearly = { carbonKg: res.daily.yearlyCarbonKg, cost: res.daily.yearlyCost, basis: yearlyLabel('DOC series', series.dates.length), annualised: res.daily.annualised };
      const missing = res.daily.rows.length - res.daily.daysWithDose;
      if (missing > 0) res.warnings.push(`${missing} day(s) of the DOC series have no reachable goal and no dose; totals cover the other days`);
    } else if (req.doseMgPerL !== null) {
      res.yearly = { ...yearlyAtOneDose(req.doseMgPerL, project.site.flowM3PerD, carbon.pricePerKg), basis: yearlyLabel('design DOC and flow', 1), annualised: true };
    }
    if (req.doseMgPerL !== null) {
      progress({ step: `${carbon.name}: dose against DOC and sensitivity`, done: ci, total: project.carbons.length });
      res.doseAgainstDoc = timed('dose against DOC', () => doseAgainstDocStep(carbon.name, req, requiredAtDocs(model, problem, req, table), docRange(doc, input.series?.docMgPerL)));
      const sens = timed('sensitivity', () => sensitivityStep({ carbon, systems, problem, modelOf: (s, d) => carbonModel(s, d, undefined, factory), ...(project.site.pacContact ? { contact: { conditions: project.site.pacContact, modelWith: (s: readonly CompoundSystem[], d: number, c: ContactConditions) => carbonModel(s, d, undefined, contactFactory(c, carbon, options.kinetic, contactStore)) } } : {}), docMgPerL: doc, flowM3PerD: project.site.flowM3PerD, ...(input.series ? { series: input.series } : {}), required: req, yearly: res.yearly! }));
      if (sens) res.sensitivity = sens;
    }
    return res;
  });
  for (const c of carbons) warnings.push(...c.warnings.map((w) => `${c.carbon.name}: ${w}`));
  let pilot: PilotStepResult | undefined;
  if (project.pilot && input.pilot) {
    const spec = project.pilot;
    const pilotData = input.pilot;
    const cr = spec.carbon !== undefined ? carbons.find((c) => c.carbon.name === spec.carbon) : carbons.find((c) => c.carbon.type === 'PAC');
    const cbg = cr?.background;
    if (!cr || !cbg?.background) throw new InputError('the pilot check needs a PAC carbon and a fractionated background ("isotherm" or "file")', { path: 'pilot' });
    const model = surrogateModel(cbg.background, doc, cbg.backgroundKFactor);
    // under the plant's contact conditions the pilot is compared with the carbon's contact model (its fitted kinetics included)
    const factory = project.site.pacContact && cr.carbon.type === 'PAC' ? contactFactory(project.site.pacContact, cr.carbon, options.kinetic) : undefined;
    const contactModel = factory ? carbonModel(cr.systems, doc, model.background, factory) : undefined;
    pilot = timed('pilot check', () => pilotStep(cr.carbon.name, pilotData, spec.bandPercent, model, cr.systems, doc, contactModel));
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
  if (transfer) out.calibrationTransfer = transfer;
  return out;
}
