/**
 * The pilot check (capability 11): pilot pairs (UV254 reduction, measured removal) against the
 * model's relation between UV254 reduction and removal on the pilot's carbon at the design DOC,
 * with residuals, the compounds outside the band named, and a site curve
 * removal = 1 − (1 − ΔUV)^k fitted beside the model's (src/surrogates/pilotCheck.ts,
 * siteCurveFit.ts).
 *
 * The predicted relation is traced over doses 0 and 0.1–2000 mg/L (log-spaced, 160 doses): UV254
 * reduction from the fictive components (Beer–Lambert additivity), removal from each compound's
 * system (the same as the dose table). Both rise with the dose, so removal is a function of UV254
 * reduction. Under the plant's PAC contact conditions the relation comes from the carbon's contact
 * model instead (`relationsFromModel`: the same removal model as the run's doses, its fictive
 * background for the UV254 reduction), over 40 log-spaced doses of the same range (each dose is a
 * kinetic solve): a pilot runs with the plant's contact time and carbon age, so its pairs are
 * compared with removals under those conditions, not at equilibrium.
 *
 * @throws InputError when the background has no UV254 absorbances (naming the project field
 *   `pilot`) or the pilot data name an unknown compound
 */
import { InputError } from '../core/errors.js';
import { logSpaced as logSpacedDoses } from '../numerics/logSpace.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import type { PilotData } from '../surrogates/pilotCsv.js';
import { checkPilotPairs, type PilotCheckResult, type PredictedRelation } from '../surrogates/pilotCheck.js';
import { backgroundSurrogatesAt, type SurrogateModel } from '../surrogates/surrogateCurve.js';
import { prepareSystem, type CompoundSystem } from '../design/competitionSystem.js';
import { modelBackgroundPoint } from '../design/modelSurrogates.js';
import type { RemovalModel, WarmStart } from '../design/removalModel.js';

export interface PilotStepResult {
  carbonName: string;
  file?: string;
  bandPercent: number;
  /** Where the model relation comes from: "batch IAST (equilibrium)" or the contact model's kind. */
  relationModel: string;
  check: PilotCheckResult;
  /** The model's removal against UV254 reduction per compound in the pilot data. */
  relations: PredictedRelation[];
}

/** Removal against UV254 reduction of each system, traced over a dose sweep. */
export function predictedRelations(model: SurrogateModel, systems: readonly CompoundSystem[], docMgPerL: number, ids: readonly string[]): PredictedRelation[] {
  const doses = [0, ...logSpacedDoses(0.1, 2000, 160)];
  const uv: number[] = [];
  let warm: { u: number; theta: number } | undefined;
  for (const d of doses) {
    const r = backgroundSurrogatesAt(model, d, d > 0 ? warm : undefined);
    if (d > 0) warm = r.state;
    uv.push(r.point.uv254Reduction!);
  }
  return systems.filter((s) => ids.includes(s.compoundId)).map((sys) => {
    const pm = prepareSystem(sys, docMgPerL);
    let w: { u: number; theta: number } | undefined;
    const removal = doses.map((d) => {
      if (d === 0) return 0;
      const s = solveBatchPrepared(pm, d / 1000, w);
      w = s.state;
      return 1 - s.cMgPerL[0]! / sys.c0MgPerL;
    });
    return { compound: sys.compoundId, uv254Reduction: uv.slice(), removal };
  });
}

/** Doses of the relation traced on a kinetic removal model (mg/L): 0 and 40 log-spaced from 0.1 to 2000. */
export const MODEL_RELATION_DOSES_MG_PER_L: readonly number[] = [0, ...logSpacedDoses(0.1, 2000, 40)];

/**
 * Removal against UV254 reduction of each compound `ids` on a removal model with a fictive
 * background (the PAC contact model): UV254 reduction from `backgroundRemaining`, removal from
 * `remaining`, at `doses` (mg/L, ascending, starting at 0).
 * @throws InputError when the model has no fractionated background; ComputationError from the model
 */
export function relationsFromModel(model: RemovalModel, uv254AbsorbancePerM: readonly number[], ids: readonly string[], doses: readonly number[] = MODEL_RELATION_DOSES_MG_PER_L): PredictedRelation[] {
  const point = modelBackgroundPoint(model, uv254AbsorbancePerM);
  const uv = doses.map((d) => point(d).uv254Reduction ?? 0);
  return ids.filter((id) => model.compoundIds.includes(id)).map((id) => {
    const i = model.compoundIds.indexOf(id);
    let warm: WarmStart;
    const removal = doses.map((d) => {
      if (d === 0) return 0;
      const r = model.remaining(i, d / 1000, warm);
      warm = r.warm;
      return 1 - r.remainingFraction;
    });
    return { compound: id, uv254Reduction: uv.slice(), removal };
  });
}

/**
 * @param model   the surrogate model of the pilot carbon (needs UV254 absorbances)
 * @param systems the compounds' systems on that carbon
 * @param contactModel the carbon's removal model under the plant's PAC contact conditions, when the
 *        project has them: the relation is then traced on it (relationsFromModel)
 */
export function pilotStep(carbonName: string, pilot: PilotData, bandPercent: number, model: SurrogateModel, systems: readonly CompoundSystem[], docMgPerL: number, contactModel?: RemovalModel): PilotStepResult {
  if (!model.uv254AbsorbancePerM) {
    throw new InputError('the pilot check needs UV254 absorbances of the fictive components; expected a DOC isotherm with UV254 columns (or a background file with specific_uv254_per_m_per_mg_per_L)', { path: 'pilot' });
  }
  const relations = contactModel ? relationsFromModel(contactModel, model.uv254AbsorbancePerM, pilot.compounds) : predictedRelations(model, systems, docMgPerL, pilot.compounds);
  let check: PilotCheckResult;
  try {
    check = checkPilotPairs(pilot.pairs, relations, bandPercent);
  } catch (e) {
    if (e instanceof InputError && pilot.file !== undefined && !e.location.file) throw e.at({ file: pilot.file });
    throw e;
  }
  const out: PilotStepResult = { carbonName, bandPercent, relationModel: contactModel ? contactModel.kind : 'batch IAST (equilibrium)', check, relations };
  if (pilot.file !== undefined) out.file = pilot.file;
  return out;
}
