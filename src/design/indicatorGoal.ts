/**
 * The indicator goal of SR 814.201.231 (Art. 3; the arithmetic mean of the percentage removals
 * of a set of indicator substances, src/indicators) applied to modelled removals: at a carbon dose,
 * each indicator compound's removal from the removal model, then the mean over the set. Also the
 * dose at which that mean reaches its goal, by the design layer's one dose search (the mean rises
 * with the dose because every removal does).
 *
 * Which set: the compounds chosen in goals.indicator.compounds; otherwise all compounds with a
 * category when they form an admissible set; otherwise the worst admissible subset (the
 * conservative choice). When more substances are available than needed, the best and worst
 * admissible subsets are reported too. Units: doses mg/L outside, g/L into the model.
 */
import {
  admissibleRange, evaluateIndicatorSet, ruleViolation,
  type AdmissibleRange, type IndicatorCategory, type IndicatorEvaluation, type IndicatorValue,
} from '../indicators/indicatorRule.js';
import type { RemovalModel, WarmStart } from './removalModel.js';
import { searchDose, DEFAULT_DOSE_HINT_G_PER_L, MAX_DOSE_G_PER_L } from './doseSearch.js';
import { indicatorDoseNewton } from './indicatorDoseNewton.js';

export interface IndicatorMember {
  /** Index of the compound in the removal model. */
  index: number;
  category: IndicatorCategory;
}

export type IndicatorSelection = 'chosen set' | 'all indicator compounds' | 'worst admissible subset';

export interface IndicatorGoal {
  members: IndicatorMember[];
  /** Ids of the chosen set (goals.indicator.compounds), if any. */
  chosen?: string[];
  goalPercent: number;
}

export interface IndicatorCheck {
  doseMgPerL: number;
  goalPercent: number;
  /** Removal of every available indicator compound at the dose. */
  values: IndicatorValue[];
  selection: IndicatorSelection;
  /** The evaluated set (admissible or not, with the reason). */
  set: IndicatorEvaluation;
  /** Best and worst admissible subsets (absent when none is admissible). */
  range?: AdmissibleRange;
  /** True when the set is admissible and its mean reaches the goal. */
  met: boolean;
}

/** Removal (%) of each member at a dose (g/L); `warm` (one per member) is updated when given. */
export function indicatorValuesAt(model: RemovalModel, goal: IndicatorGoal, doseGPerL: number, warm?: WarmStart[]): IndicatorValue[] {
  return goal.members.map((m, k) => {
    const r = model.remaining(m.index, doseGPerL, warm?.[k]);
    if (warm) warm[k] = r.warm;
    return { id: model.compoundIds[m.index]!, category: m.category, removalPercent: 100 * (1 - r.remainingFraction) };
  });
}

/**
 * The set the rule is applied to, from the values at one dose. With `withRange` false the best and
 * worst admissible subsets are only formed when the worst one is the set (the dose searches need
 * the set's mean only); the set is the same either way.
 */
export function selectIndicatorSet(goal: IndicatorGoal, values: IndicatorValue[], withRange = true): { selection: IndicatorSelection; set: IndicatorEvaluation; range?: AdmissibleRange } {
  const rangeOf = (): AdmissibleRange | undefined => { try { return admissibleRange(values); } catch { return undefined; } };
  if (goal.chosen) {
    const set = evaluateIndicatorSet(values.filter((v) => goal.chosen!.includes(v.id)));
    const range = withRange ? rangeOf() : undefined;
    return range ? { selection: 'chosen set', set, range } : { selection: 'chosen set', set };
  }
  const all = evaluateIndicatorSet(values);
  if (all.admissible && !withRange) return { selection: 'all indicator compounds', set: all };
  const range = rangeOf();
  if (all.admissible || !range) return range ? { selection: 'all indicator compounds', set: all, range } : { selection: 'all indicator compounds', set: all };
  return { selection: 'worst admissible subset', set: range.worst, range };
}

/** The indicator check at one dose (mg/L) on a model. */
export function indicatorCheckAt(model: RemovalModel, goal: IndicatorGoal, doseMgPerL: number): IndicatorCheck {
  const values = indicatorValuesAt(model, goal, doseMgPerL / 1000);
  const sel = selectIndicatorSet(goal, values);
  const out: IndicatorCheck = {
    doseMgPerL, goalPercent: goal.goalPercent, values, selection: sel.selection, set: sel.set,
    met: sel.set.admissible && sel.set.meanRemovalPercent >= goal.goalPercent - 1e-9,
  };
  if (sel.range) out.range = sel.range;
  return out;
}

export type IndicatorDoseStatus = 'met' | 'met below the smallest dose' | 'unreachable' | 'not admissible';

export interface IndicatorDose {
  status: IndicatorDoseStatus;
  /** Dose at which the mean reaches the goal, mg/L (0 when met below the smallest dose; null otherwise). */
  doseMgPerL: number | null;
  selection?: IndicatorSelection;
  message?: string;
}

/**
 * What `indicatorInadmissible` and `fixedIndicatorSet` give for a goal and a list of compound ids
 * (they depend on nothing else), kept per goal and list: every Monte Carlo draw and every node
 * of the dose table asks again with the same two.
 */
interface GoalFacts { ids: readonly string[]; why: string | undefined; fixed: { set: readonly number[]; selection: IndicatorSelection } | undefined }
const goalFacts = new WeakMap<IndicatorGoal, GoalFacts>();
function factsOf(model: RemovalModel, goal: IndicatorGoal): GoalFacts {
  const f = goalFacts.get(goal);
  if (f && sameIds(f.ids, model.compoundIds)) return f; // each draw's model has its own list of the same ids
  const fresh: GoalFacts = { ids: model.compoundIds, why: inadmissible(model, goal), fixed: fixedSet(model, goal) };
  goalFacts.set(goal, fresh);
  return fresh;
}

function sameIds(a: readonly string[], b: readonly string[]): boolean {
  if (a === b) return true;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** Why no admissible set can be formed from the members (undefined when one can). */
export function indicatorInadmissible(model: RemovalModel, goal: IndicatorGoal): string | undefined {
  return factsOf(model, goal).why;
}

function inadmissible(model: RemovalModel, goal: IndicatorGoal): string | undefined {
  const inSet = (m: IndicatorMember) => (goal.chosen ? goal.chosen.includes(model.compoundIds[m.index]!) : true);
  const n1 = goal.members.filter((m) => inSet(m) && m.category === 1).length;
  const n2 = goal.members.filter((m) => inSet(m) && m.category === 2).length;
  const why = ruleViolation(n1, n2);
  if (goal.chosen) return why ? `the chosen indicator set is not admissible: ${why}` : undefined;
  return why && (n1 < 4 || n2 < 2) ? `no admissible indicator set: ${why}` : undefined;
}

/** The indices of a set that does not depend on the removals (chosen, or all when admissible), else undefined. */
export function fixedIndicatorSet(model: RemovalModel, goal: IndicatorGoal): { set: readonly number[]; selection: IndicatorSelection } | undefined {
  return factsOf(model, goal).fixed;
}

function fixedSet(model: RemovalModel, goal: IndicatorGoal): { set: readonly number[]; selection: IndicatorSelection } | undefined {
  if (goal.chosen) return { set: goal.members.filter((m) => goal.chosen!.includes(model.compoundIds[m.index]!)).map((m) => m.index), selection: 'chosen set' };
  const n1 = goal.members.filter((m) => m.category === 1).length;
  if (ruleViolation(n1, goal.members.length - n1)) return undefined;
  return { set: goal.members.map((m) => m.index), selection: 'all indicator compounds' };
}

/**
 * The dose (mg/L) at which the mean removal of the indicator set reaches the goal.
 * @param hintMgPerL a dose near the answer (only a speed-up)
 * @param warmStarts solve states by compound index near that dose (only a speed-up)
 * @throws ComputationError if the search fails
 */
export function indicatorDose(model: RemovalModel, goal: IndicatorGoal, hintMgPerL?: number, warmStarts?: ReadonlyArray<WarmStart>): IndicatorDose {
  const why = indicatorInadmissible(model, goal);
  if (why) return { status: 'not admissible', doseMgPerL: null, message: why };
  let selection: IndicatorSelection | undefined;
  const warm: WarmStart[] = goal.members.map(() => undefined);
  const excess = (doseGPerL: number) => {
    const sel = selectIndicatorSet(goal, indicatorValuesAt(model, goal, doseGPerL, warm), false);
    selection = sel.selection;
    return sel.set.meanRemovalPercent - goal.goalPercent;
  };
  // a fixed set (chosen, or all compounds when admissible): Newton's method on the mean first
  const fixed = fixedIndicatorSet(model, goal);
  if (fixed) {
    // the model's cheap estimate (trace targets) as the start when it has one: fewer exact steps
    let hintGPerL = hintMgPerL !== undefined ? hintMgPerL / 1000 : undefined;
    let warm = warmStarts;
    const approx = model.approximateMeanDose?.(fixed.set, goal.goalPercent, hintGPerL ?? DEFAULT_DOSE_HINT_G_PER_L);
    if (approx) { hintGPerL = approx.doseGPerL; warm = approx.warm; }
    const d = indicatorDoseNewton(model, fixed.set, goal.goalPercent, hintGPerL, warm);
    if (d !== undefined) return { status: 'met', doseMgPerL: d * 1000, selection: fixed.selection };
  }
  const opts: Parameters<typeof searchDose>[1] = { what: 'indicator-mean dose search' };
  if (hintMgPerL !== undefined && hintMgPerL > 0) opts.hintGPerL = hintMgPerL / 1000;
  const r = searchDose(excess, opts);
  if (r.status === 'unreachable') {
    return { status: 'unreachable', doseMgPerL: null, message: `the indicator mean reaches only ${(r.excess + goal.goalPercent).toFixed(1)} % at ${MAX_DOSE_G_PER_L * 1000} mg/L, below the goal of ${goal.goalPercent} %` };
  }
  excess(r.doseGPerL); // the selection at the dose found
  const out: IndicatorDose = r.status === 'met'
    ? { status: 'met', doseMgPerL: r.doseGPerL * 1000 }
    : { status: 'met below the smallest dose', doseMgPerL: 0, message: 'the indicator goal is met below the smallest dose searched (1e-9 mg/L)' };
  if (selection) out.selection = selection;
  return out;
}
