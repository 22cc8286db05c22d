/**
 * The indicator check of SR 814.201.231 (Art. 3; CHECKS.md) on modelled removals: at a carbon
 * dose, each indicator compound's removal from batch IAST in the site water, then the
 * arithmetic mean over the set (src/indicators). Also the dose at which that mean reaches its
 * goal (bracketed Brent search on ln D; the mean rises with the dose because every removal does).
 *
 * Which set: the compounds chosen in goals.indicator.compounds; otherwise all compounds with a
 * category when they form an admissible set; otherwise the worst admissible subset (the
 * conservative choice). When more substances are available than needed, the best and worst
 * admissible subsets are reported too.
 */
import { brentRoot } from '../numerics/brent.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L } from '../design/doseForRemoval.js';
import type { PreparedMixture } from '../equilibrium/preparedMixture.js';
import {
  admissibleRange, evaluateIndicatorSet, ruleViolation,
  type AdmissibleRange, type IndicatorCategory, type IndicatorEvaluation, type IndicatorValue,
} from '../indicators/indicatorRule.js';
import { prepareSystem, type CompoundSystem } from './competitionSystem.js';
import { doseNear } from './doseNear.js';

export interface IndicatorMember {
  system: CompoundSystem;
  category: IndicatorCategory;
}

export type IndicatorSelection = 'chosen set' | 'all indicator compounds' | 'worst admissible subset';

export interface IndicatorPlan {
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

/** Removal (%) of each member at a dose (mg/L), with prepared mixtures reused. */
function valuesAt(plan: IndicatorPlan, pms: PreparedMixture[], doseMgPerL: number, warm?: Array<{ u: number; theta: number } | undefined>): IndicatorValue[] {
  return plan.members.map((m, k) => {
    const pm = pms[k]!;
    const s = solveBatchPrepared(pm, doseMgPerL / 1000, warm?.[k]);
    if (warm) warm[k] = s.state;
    return { id: m.system.compoundId, category: m.category, removalPercent: 100 * (1 - s.cMgPerL[0]! / m.system.c0MgPerL) };
  });
}

/** The set the rule is applied to, from the values at one dose. */
function selectSet(plan: IndicatorPlan, values: IndicatorValue[]): { selection: IndicatorSelection; set: IndicatorEvaluation; range?: AdmissibleRange } {
  let range: AdmissibleRange | undefined;
  try { range = admissibleRange(values); } catch { range = undefined; }
  const withRange = <T extends object>(o: T) => (range ? { ...o, range } : o);
  if (plan.chosen) {
    return withRange({ selection: 'chosen set' as const, set: evaluateIndicatorSet(values.filter((v) => plan.chosen!.includes(v.id))) });
  }
  const all = evaluateIndicatorSet(values);
  if (all.admissible || !range) return withRange({ selection: 'all indicator compounds' as const, set: all });
  return { selection: 'worst admissible subset', set: range.worst, range };
}

/** The indicator check at one dose (mg/L) and DOC (mg/L). */
export function indicatorCheckAt(plan: IndicatorPlan, docMgPerL: number, doseMgPerL: number): IndicatorCheck {
  const pms = plan.members.map((m) => prepareSystem(m.system, docMgPerL));
  const values = valuesAt(plan, pms, doseMgPerL);
  const sel = selectSet(plan, values);
  const out: IndicatorCheck = {
    doseMgPerL, goalPercent: plan.goalPercent, values, selection: sel.selection, set: sel.set,
    met: sel.set.admissible && sel.set.meanRemovalPercent >= plan.goalPercent - 1e-9,
  };
  if (sel.range) out.range = sel.range;
  return out;
}

export interface IndicatorDose {
  status: 'ok' | 'unreachable' | 'not admissible';
  doseMgPerL: number | null;
  selection?: IndicatorSelection;
  message?: string;
}

/**
 * The dose (mg/L) at which the mean removal of the indicator set reaches the goal.
 * @returns status 'not admissible' when no admissible set exists, 'unreachable' when the goal is
 *   not met at 5000 mg/L.
 * @throws ComputationError if the search fails
 */
export function indicatorDose(plan: IndicatorPlan, docMgPerL: number, guessMgPerL?: number): IndicatorDose {
  const n1 = plan.members.filter((m) => (plan.chosen ? plan.chosen.includes(m.system.compoundId) : true) && m.category === 1).length;
  const n2 = plan.members.filter((m) => (plan.chosen ? plan.chosen.includes(m.system.compoundId) : true) && m.category === 2).length;
  if (plan.chosen) {
    const why = ruleViolation(n1, n2);
    if (why) return { status: 'not admissible', doseMgPerL: null, message: `the chosen indicator set is not admissible: ${why}` };
  } else if (ruleViolation(n1, n2) && (n1 < 4 || n2 < 2)) {
    return { status: 'not admissible', doseMgPerL: null, message: `no admissible indicator set: ${ruleViolation(n1, n2)}` };
  }
  const pms = plan.members.map((m) => prepareSystem(m.system, docMgPerL));
  let selection: IndicatorSelection | undefined;
  const warm: Array<{ u: number; theta: number } | undefined> = plan.members.map(() => undefined);
  const g = (lnD: number) => {
    const sel = selectSet(plan, valuesAt(plan, pms, Math.exp(lnD) * 1000, warm));
    selection = sel.selection;
    return sel.set.meanRemovalPercent - plan.goalPercent;
  };
  if (guessMgPerL !== undefined && guessMgPerL > 0) {
    const r = doseNear((d) => g(Math.log(d)), guessMgPerL / 1000, 'indicator-mean dose search');
    if (r.status === 'ok') {
      g(Math.log(r.doseGPerL));
      const out: IndicatorDose = { status: 'ok', doseMgPerL: r.doseGPerL * 1000 };
      if (selection) out.selection = selection;
      return out;
    }
  }
  const hi = Math.log(MAX_DOSE_G_PER_L);
  const gHi = g(hi);
  if (gHi < 0) return { status: 'unreachable', doseMgPerL: null, message: `the indicator mean reaches only ${(gHi + plan.goalPercent).toFixed(1)} % at ${MAX_DOSE_G_PER_L * 1000} mg/L, below the goal of ${plan.goalPercent} %` };
  let b = hi, gb = gHi, a = hi - 2.3, ga = g(a);
  const lo = Math.log(MIN_DOSE_G_PER_L);
  while (ga > 0) {
    b = a; gb = ga;
    if (a <= lo) return { status: 'ok', doseMgPerL: MIN_DOSE_G_PER_L * 1000, message: 'the goal is met at the smallest dose searched' };
    a = Math.max(lo, a - 2.3);
    ga = g(a);
  }
  const root = brentRoot(g, a, b, { fa: ga, fb: gb, xTol: 1e-12, what: 'indicator-mean dose search' });
  g(root.x);
  const out: IndicatorDose = { status: 'ok', doseMgPerL: Math.exp(root.x) * 1000 };
  if (selection) out.selection = selection;
  return out;
}
