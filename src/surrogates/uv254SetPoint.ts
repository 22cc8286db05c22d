/**
 * UV254-reduction set-points: the UV254 reduction an operator doses to so that a target meets its
 * removal goal, per target and for the governing target (the one that needs the largest dose).
 *
 *   D*  = dose at which removal of the target (target + background, batch IAST) equals the goal
 *         (src/dose/doseSearch.ts: Brent on ln D)
 *   set-point = UV254 reduction at D* = 1 − Σ a_i c_i(D*)/Σ a_i c0_i (Beer–Lambert additivity)
 * UV254 reduction as a dosing control parameter: Altmann et al. 2016, Water Research 94:240–245
 * (the relation must be site-calibrated; the pilot check in pilotCheck.ts does that).
 * The inverse, `doseForUv254Reduction`, finds the dose that gives a UV254 reduction (Brent on ln D;
 * UV254 reduction rises monotonically with the dose).
 *
 * Units: doses mg/L; reductions and goals are fractions (0–1).
 */
import { InputError } from '../core/errors.js';
import { brentRoot } from '../numerics/brent.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { prepareMixture } from '../equilibrium/preparedMixture.js';
import { doseForRemoval, MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L } from '../design/doseForRemoval.js';
import { backgroundSurrogatesAt, checkAbsorbances, type SurrogateModel } from './surrogateCurve.js';

export interface SetPointGoal {
  target: FreundlichComponent;
  /** Removal goal as a fraction, 0 < R < 1. */
  removalGoal: number;
}

export interface Uv254SetPoint {
  targetId: string;
  removalGoal: number;
  /** Dose meeting the goal, mg/L. */
  doseMgPerL: number;
  /** UV254 reduction at that dose (the set-point), fraction. */
  uv254Reduction: number;
  /** DOC reduction at that dose, fraction. */
  docReduction: number;
}

export interface GoverningSetPoint {
  perTarget: Uv254SetPoint[];
  /** The target with the largest dose; its set-point is the one to dose to. */
  governing: Uv254SetPoint;
}

function needAbsorbances(model: SurrogateModel): void {
  if (!model.uv254AbsorbancePerM) throw new InputError('no UV254 absorbances for the background components; expected uv254AbsorbancePerM (fractionate an isotherm with a UV254 column)', { path: 'uv254AbsorbancePerM' });
  checkAbsorbances(model);
}

/**
 * Set-point of one target. @throws InputError when the goal is out of range or unreachable up to
 * 5 g/L or the model has no absorbances; ComputationError if a solve fails.
 */
export function uv254SetPoint(model: SurrogateModel, goal: SetPointGoal): Uv254SetPoint {
  needAbsorbances(model);
  const pm = prepareMixture([goal.target, ...model.background]);
  const d = doseForRemoval(pm, 0, goal.removalGoal);
  const doseMgPerL = d.doseGPerL * 1000;
  const at = backgroundSurrogatesAt(model, doseMgPerL).point;
  return { targetId: goal.target.id, removalGoal: goal.removalGoal, doseMgPerL, uv254Reduction: at.uv254Reduction!, docReduction: at.docReduction };
}

/** Set-points of every target and of the governing one (largest dose). @throws as uv254SetPoint */
export function governingSetPoint(model: SurrogateModel, goals: readonly SetPointGoal[]): GoverningSetPoint {
  if (goals.length === 0) throw new InputError('expected at least one target with a removal goal', { path: 'targets' });
  const perTarget = goals.map((g) => uv254SetPoint(model, g));
  let governing = perTarget[0]!;
  for (const s of perTarget) if (s.doseMgPerL > governing.doseMgPerL) governing = s;
  return { perTarget, governing };
}

/**
 * Dose (mg/L) at which the background's UV254 reduction equals `reduction` (0 < r < 1).
 * @throws InputError when the reduction is out of range or not reached up to 5 g/L
 */
export function doseForUv254Reduction(model: SurrogateModel, reduction: number): number {
  needAbsorbances(model);
  if (!(reduction > 0 && reduction < 1)) throw new InputError(`expected a UV254 reduction between 0 and 1 (exclusive), got ${reduction}`, { path: 'uv254Reduction' });
  const g = (lnD: number) => backgroundSurrogatesAt(model, Math.exp(lnD) * 1000).point.uv254Reduction! - reduction;
  const hi = Math.log(MAX_DOSE_G_PER_L);
  const lo = Math.log(MIN_DOSE_G_PER_L);
  const gHi = g(hi);
  if (gHi < 0) throw new InputError(`a UV254 reduction of ${(reduction * 100).toPrecision(4)} % is not reached by any dose up to ${MAX_DOSE_G_PER_L * 1000} mg/L (it reaches ${((gHi + reduction) * 100).toPrecision(4)} % there)`, { path: 'uv254Reduction' });
  const gLo = g(lo);
  if (gLo > 0) throw new InputError(`a UV254 reduction of ${(reduction * 100).toPrecision(4)} % is already reached below ${MIN_DOSE_G_PER_L * 1000} mg/L`, { path: 'uv254Reduction' });
  return Math.exp(brentRoot(g, lo, hi, { fa: gLo, fb: gHi, xTol: 1e-12, what: 'dose for a UV254 reduction' }).x) * 1000;
}
