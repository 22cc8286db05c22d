/**
 * Surrogates on one PAC carbon (capability 11): beside each compound's removal against dose, the
 * predicted DOC reduction and UV254 reduction of the site water, and the UV254-reduction
 * set-point an operator doses to.
 *
 *   DOC(D)   = Σ c_i(D) over the fictive components (batch IAST, Crittenden et al. 1985)
 *   UV254(D) = Σ a_i·c_i(D) (Beer–Lambert additivity; a_i fitted by the fractionation, 1/m per mg/L)
 *   reduction = 1 − value(D)/value(0)   (src/surrogates/surrogateCurve.ts, backgroundSurrogatesAt)
 *   set-point of a compound = UV254 reduction at the dose that meets its goal (the dose of the
 *   required-dose step, so the same number as the dose table); governing set-point = the one of
 *   the governing compound; at the required dose = the one of the dose actually applied (it may be
 *   governed by the indicator mean). UV254 reduction as a dosing control parameter: Altmann et
 *   al. 2016, Water Research 94:240–245.
 * On a carbon with K factor f the background's K are f times the reference ones (src/design/competitionSystem.ts).
 * Needs a fractionated background (isotherm or file); UV254 needs every component's absorbance.
 *
 * `pointAt` (optional) gives the background at a dose from another removal model (the PAC contact
 * model, src/design/modelSurrogates.ts) instead of batch IAST.
 *
 * Units: doses mg/L; reductions and removals fractions.
 */
import { backgroundComponents } from '../fractionation/backgroundPrediction.js';
import type { BackgroundFile } from '../fractionation/backgroundFile.js';
import { backgroundSurrogatesAt, type SurrogateCurve, type SurrogateModel } from '../surrogates/surrogateCurve.js';
import { scaleK } from '../design/competitionSystem.js';
import type { CompoundGoal } from '../design/compoundGoal.js';
import type { CompoundDoseStatus } from '../design/compoundDose.js';
import type { RemovalCurves } from '../design/removalCurves.js';
import type { Design } from '../design/designDose.js';
import type { BackgroundPointAt } from '../design/modelSurrogates.js';

export interface SetPointRow {
  compoundId: string;
  goalText: string;
  /** Removal goal, fraction (≤ 0 when met without carbon). */
  removalGoal: number;
  status: CompoundDoseStatus;
  doseMgPerL: number | null;
  /** UV254 reduction at that dose, fraction (null without absorbances or dose). */
  uv254Reduction: number | null;
  docReduction: number | null;
}

export interface SurrogatePointAtDose {
  doseMgPerL: number;
  uv254Reduction: number | null;
  docReduction: number;
}

export interface SurrogateResult {
  carbonName: string;
  /** The background at the design DOC on this carbon, with absorbances when known. */
  model: SurrogateModel;
  hasUv254: boolean;
  /** DOC/UV254 reduction and removal of every compound at the sweep doses. */
  curve: SurrogateCurve;
  setPoints: SetPointRow[];
  /** Set-point of the governing compound (largest compound dose). */
  governing?: SetPointRow;
  /** At the required dose (what the operator doses to; may be governed by the indicator mean). */
  atRequiredDose?: SurrogatePointAtDose & { governedBy: string };
}

/** The surrogate model of a background at a DOC on a carbon with K factor f. */
export function surrogateModel(background: BackgroundFile, docMgPerL: number, kFactor: number): SurrogateModel {
  const model: SurrogateModel = { background: scaleK(backgroundComponents(background, docMgPerL), kFactor) };
  const a = background.components.map((c) => c.specific_uv254_per_m_per_mg_per_L);
  if (a.every((v): v is number => typeof v === 'number') && a.some((v) => v > 0)) model.uv254AbsorbancePerM = a;
  return model;
}

/** DOC and UV254 reduction at one dose (mg/L). */
export function surrogatesAtDose(model: SurrogateModel, doseMgPerL: number): SurrogatePointAtDose {
  const p = backgroundSurrogatesAt(model, doseMgPerL).point;
  return { doseMgPerL, uv254Reduction: p.uv254Reduction ?? null, docReduction: p.docReduction };
}

/**
 * @param curves    the removal curves of the carbon (sweep doses)
 * @param required  the required dose at the design DOC
 * @throws InputError / ComputationError from the equilibrium solves
 */
export function surrogateStep(
  carbonName: string, background: BackgroundFile, kFactor: number, docMgPerL: number,
  curves: RemovalCurves, required: Design, goals: readonly CompoundGoal[],
  pointAt?: BackgroundPointAt,
): SurrogateResult {
  const model = surrogateModel(background, docMgPerL, kFactor);
  const atDose = (d: number): SurrogatePointAtDose => {
    if (!pointAt) return surrogatesAtDose(model, d);
    const p = pointAt(d);
    return { doseMgPerL: d, uv254Reduction: p.uv254Reduction ?? null, docReduction: p.docReduction };
  };
  const doc0 = model.background.reduce((s, c) => s + c.c0MgPerL, 0);
  const curve: SurrogateCurve = { doc0MgPerL: doc0, points: [] };
  let warm: { u: number; theta: number } | undefined;
  curves.dosesMgPerL.forEach((dose, k) => {
    const bg = pointAt ? { point: pointAt(dose), state: warm } : backgroundSurrogatesAt(model, dose, warm);
    warm = bg.state;
    const removal: Record<string, number> = {};
    for (const [id, values] of Object.entries(curves.removalPercent)) removal[id] = values[k]! / 100;
    curve.points.push({ ...bg.point, removal });
  });
  const hasUv254 = model.uv254AbsorbancePerM !== undefined;
  if (hasUv254) curve.uv254_0PerM = model.background.reduce((s, c, i) => s + c.c0MgPerL * model.uv254AbsorbancePerM![i]!, 0);
  const setPoints = required.compounds.map((d, i): SetPointRow => {
    const at = d.status === 'met' && d.doseMgPerL !== null && d.doseMgPerL > 0 ? atDose(d.doseMgPerL) : undefined;
    return {
      compoundId: d.compoundId, goalText: goals[i]!.text, removalGoal: goals[i]!.removalFraction, status: d.status, doseMgPerL: d.doseMgPerL,
      uv254Reduction: at ? at.uv254Reduction : null, docReduction: at ? at.docReduction : null,
    };
  });
  const out: SurrogateResult = { carbonName, model, hasUv254, curve, setPoints };
  const gov = required.governing ? setPoints.find((s) => s.compoundId === required.governing!.compoundId) : undefined;
  if (gov) out.governing = gov;
  if (required.doseMgPerL !== null && required.doseMgPerL > 0) out.atRequiredDose = { ...atDose(required.doseMgPerL), governedBy: required.governedBy };
  return out;
}
