/**
 * The required dose at another DOC, solved exactly but cheaply: the governing goal rarely changes
 * from one DOC to the next, so the dose of the goal that governed at the nearest DOC solved (a
 * compound's or the indicator mean's) is searched first, from a hint scaled by DOC; then every
 * other goal is checked at that dose (one solve per compound). If all are met, that dose is the
 * largest of the goal doses, i.e. what designDose returns; otherwise the full designDose runs.
 * Used for the dose table's nodes by the run and by every Monte Carlo draw alike.
 */
import { compoundDoseSolved } from './compoundDose.js';
import { designDose, type Design, type DesignProblem } from './designDose.js';
import { fixedIndicatorSet, indicatorDose, selectIndicatorSet, type IndicatorGoal } from './indicatorGoal.js';
import type { IndicatorValue } from '../indicators/indicatorRule.js';
import type { DoseAtRemoval, RemainingEstimates, RemovalModel, WarmStart } from './removalModel.js';

export interface RequiredAtDoc {
  docMgPerL: number;
  /** Required dose, mg/L (null when no goal is reachable). */
  doseMgPerL: number | null;
  /** "compound HCT", "indicator mean" or "nothing reachable". */
  governedBy: string;
  /** Each compound's solve state at the dose (warm starts for the next DOC; only a speed-up). */
  warm?: WarmStart[];
}

/**
 * @param model     the model at this DOC
 * @param reference the full design at the design DOC (its statuses decide whether the fast path applies)
 * @param near      the answer at a nearby DOC (hint and governing goal); default the reference
 */
export function requiredDoseAt(model: RemovalModel, problem: DesignProblem, reference: Design, near?: RequiredAtDoc): RequiredAtDoc {
  const docMgPerL = model.docMgPerL;
  const base = near && near.doseMgPerL !== null ? near : reference;
  if (base.doseMgPerL === null || !(base.doseMgPerL > 0) || !allMet(reference)) return full(model, problem, reference);
  const hint = base.doseMgPerL * (docMgPerL / base.docMgPerL);
  let dose: number | null;
  let solved: DoseAtRemoval | undefined;
  const governing = base.governedBy === 'indicator mean' ? -1 : governingIndex(model.compoundIds, base.governedBy);
  if (governing === -1) {
    if (!problem.indicator) return full(model, problem, reference);
    const r = indicatorDose(model, problem.indicator, hint);
    dose = r.status === 'met' ? r.doseMgPerL : null;
  } else {
    const i = governing;
    if (i < 0) return full(model, problem, reference);
    const d = compoundDoseSolved(model, i, problem.goals[i]!, hint, false, near?.warm?.[i]);
    dose = d.dose.status === 'met' ? d.dose.doseMgPerL : null;
    solved = d.solved;
  }
  if (dose === null || !(dose > 0)) return full(model, problem, reference);
  // every compound's removal at that dose, once (the indicator mean uses the same values); a
  // model's estimates with error bounds skip the solves whose outcome they already decide
  const D = dose / 1000;
  const T = problem.goals.length;
  const warm: WarmStart[] = near?.warm ? near.warm.slice() : new Array<WarmStart>(T);
  const removal = new Array<number>(T).fill(NaN); // NaN: not solved yet (a plain array: a typed array of more than 8 numbers is allocated outside the JS heap)
  let est: RemainingEstimates | undefined;
  if (governing >= 0 && solved) { warm[governing] = solved.warm; removal[governing] = 1 - solved.remainingFraction; }
  if (governing >= 0 && model.remainingEstimates) {
    exactRemoval(model, governing, D, warm, removal);
    est = model.remainingEstimates(governing, D, warm[governing]);
  }
  for (let i = 0; i < T; i++) {
    const goal = problem.goals[i]!;
    if (goal.kind === 'none' || !(goal.removalFraction > 0)) continue;
    if (est && est.lnRemaining[i]! + est.lnBound[i]! <= lnKept(i, goal.removalFraction)) continue; // met for certain
    if (exactRemoval(model, i, D, warm, removal) < goal.removalFraction - 1e-9) return full(model, problem, reference);
  }
  if (problem.indicator) {
    const ind = problem.indicator;
    const fixed = fixedIndicatorSet(model, ind)?.set; // kept per goal and compound list
    // lower bounds of the removals first (the mean of any set rises with every removal)
    const certain = est !== undefined && indicatorMet(model, ind, fixed, D, warm, removal, est);
    if (!certain && !indicatorMet(model, ind, fixed, D, warm, removal, undefined)) return full(model, problem, reference);
  }
  return { docMgPerL, doseMgPerL: dose, governedBy: base.governedBy, warm };
}

/**
 * Two answers made once at load, one with a dose and one without: a field that has held both a
 * number and null keeps a general layout, so a draw in which nothing is reachable (a rare null
 * mid-run) does not change the layout of every answer and send the optimised code back to the
 * interpreter (V8 stores a field that has only held numbers as a number until null arrives).
 */
const layoutPrimers: readonly RequiredAtDoc[] = [
  { docMgPerL: 1.5, doseMgPerL: 1.5, governedBy: '', warm: undefined },
  { docMgPerL: 1.5, doseMgPerL: null, governedBy: '', warm: [] },
];
void layoutPrimers;

/** The full design at this DOC (what the fast path stands for when it does not apply). */
function full(model: RemovalModel, problem: DesignProblem, reference: Design): RequiredAtDoc {
  const d = designDose(model, problem, reference);
  return { docMgPerL: model.docMgPerL, doseMgPerL: d.doseMgPerL, governedBy: d.governedBy, warm: undefined }; // the fast path's layout
}

/** Whether every goal of the reference design is met (or report only): the fast path's condition, kept per design. */
const allMetCache = new WeakMap<Design, boolean>();
/** The last design asked about and its answer (every node of a draw asks about the same one). */
const allMetLast: { reference: Design | undefined; value: boolean } = { reference: undefined, value: false };
function allMet(reference: Design): boolean {
  if (allMetLast.reference === reference) return allMetLast.value;
  let v = allMetCache.get(reference);
  if (v === undefined) {
    v = !reference.compounds.some((c) => c.status !== 'met' && c.status !== 'report only') && !(reference.indicator && reference.indicator.status !== 'met');
    allMetCache.set(reference, v);
  }
  allMetLast.reference = reference;
  allMetLast.value = v;
  return v;
}

/** Index of the compound of "compound <id>" in `ids` (−2 when not there), kept per id list. */
const governingIndices = new WeakMap<readonly string[], Map<string, number>>();
/** The last question and its answer (the nodes of a draw ask the same one over and over). */
const governingLast: { ids: readonly string[] | undefined; governedBy: string; index: number } = { ids: undefined, governedBy: '', index: -2 };
function governingIndex(ids: readonly string[], governedBy: string): number {
  if (governingLast.ids === ids && governingLast.governedBy === governedBy) return governingLast.index;
  let m = governingIndices.get(ids);
  if (!m) governingIndices.set(ids, (m = new Map()));
  let i = m.get(governedBy);
  if (i === undefined) {
    const k = ids.indexOf(governedBy.replace(/^compound /, ''));
    i = k < 0 ? -2 : k;
    m.set(governedBy, i);
  }
  governingLast.ids = ids;
  governingLast.governedBy = governedBy;
  governingLast.index = i;
  return i;
}

/** ln(1 − R) last computed for the goal at each index, with its R (every node of every draw asks again for the same goals). */
const lnKeptR: number[] = [], lnKeptValue: number[] = [];
function lnKept(i: number, R: number): number {
  if (lnKeptR[i] === R) return lnKeptValue[i]!;
  const v = Math.log1p(-R);
  while (lnKeptR.length <= i) { lnKeptR.push(NaN); lnKeptValue.push(NaN); }
  lnKeptR[i] = R;
  lnKeptValue[i] = v;
  return v;
}

/** Removal of compound i at dose D (g/L), solved once and kept in `removal` (NaN: not yet). */
function exactRemoval(model: RemovalModel, i: number, D: number, warm: WarmStart[], removal: number[]): number {
  let v = removal[i]!;
  if (v !== v) {
    const r = model.remaining(i, D, warm[i]);
    warm[i] = r.warm;
    removal[i] = v = 1 - r.remainingFraction;
  }
  return v;
}

/**
 * Whether the indicator mean reaches its goal at dose D: from lower bounds of the removals when
 * `est` is given (the solved ones exact, the others the estimate's bound), else from exact removals.
 */
function indicatorMet(model: RemovalModel, ind: IndicatorGoal, fixed: readonly number[] | undefined, D: number, warm: WarmStart[], removal: number[], est: RemainingEstimates | undefined): boolean {
  if (fixed) {
    // a set that does not depend on the removals: its mean directly (what selectIndicatorSet gives)
    let sum = 0;
    for (let k = 0; k < fixed.length; k++) sum += 100 * removalValue(model, fixed[k]!, D, warm, removal, est);
    return sum / fixed.length >= ind.goalPercent - 1e-7;
  }
  const values: IndicatorValue[] = ind.members.map((m) => ({ id: model.compoundIds[m.index]!, category: m.category, removalPercent: 100 * removalValue(model, m.index, D, warm, removal, est) }));
  return selectIndicatorSet(ind, values, false).set.meanRemovalPercent >= ind.goalPercent - 1e-7;
}

/** Compound i's removal for indicatorMet: exact (solved once), or with `est` the solved value or the estimate's lower bound. */
function removalValue(model: RemovalModel, i: number, D: number, warm: WarmStart[], removal: number[], est: RemainingEstimates | undefined): number {
  if (!est) return exactRemoval(model, i, D, warm, removal);
  const v = removal[i]!;
  return v === v ? v : 1 - Math.exp(est.lnRemaining[i]! + est.lnBound[i]!);
}

