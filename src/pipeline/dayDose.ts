/**
 * The required dose on one day of the DOC series, solved exactly but cheaply: the governing goal
 * rarely changes from one DOC value to the next, so the dose of the previously governing goal
 * (a compound's or the indicator mean's) is solved first, from a guess scaled by DOC; then every
 * other goal is checked at that dose (one equilibrium per compound). If all are met, that dose is
 * the largest of the goal doses, i.e. exactly what requiredDose would return; otherwise the full
 * requiredDose runs. The result is identical to requiredDose's dose and governing goal.
 */
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { evaluateIndicatorSet, admissibleRange, type IndicatorValue } from '../indicators/indicatorRule.js';
import { prepareSystem, type CompoundSystem } from './competitionSystem.js';
import { compoundDose } from './compoundDose.js';
import type { CompoundGoal } from './compoundGoal.js';
import { indicatorDose, type IndicatorPlan } from './indicatorCheck.js';
import { requiredDose, type RequiredDose } from './requiredDose.js';

export interface DayDose {
  docMgPerL: number;
  /** Required dose, mg/L (null when no goal is reachable). */
  doseMgPerL: number | null;
  /** "compound HCT" or "indicator mean". */
  governedBy: string;
}

/** Mean of the indicator set as indicatorCheck applies it (chosen, all, or worst admissible). */
function indicatorMeanOf(plan: IndicatorPlan, values: IndicatorValue[]): number {
  if (plan.chosen) return evaluateIndicatorSet(values.filter((v) => plan.chosen!.includes(v.id))).meanRemovalPercent;
  const all = evaluateIndicatorSet(values);
  if (all.admissible) return all.meanRemovalPercent;
  return admissibleRange(values).worst.meanRemovalPercent;
}

/**
 * @param design the full required dose at the design DOC (its governing goal and statuses)
 * @param near   the previous day's answer (for the starting guess)
 */
export function dayDose(
  systems: readonly CompoundSystem[], goals: readonly CompoundGoal[], plan: IndicatorPlan | undefined,
  docMgPerL: number, design: RequiredDose, near?: DayDose,
): DayDose {
  const full = (): DayDose => {
    const r = requiredDose(systems, goals, plan, docMgPerL, design);
    return { docMgPerL, doseMgPerL: r.doseMgPerL, governedBy: r.governedBy };
  };
  const base = near && near.doseMgPerL !== null ? near : design;
  if (base.doseMgPerL === null || design.compounds.some((c) => c.status === 'unreachable') || (design.indicator && design.indicator.status !== 'ok')) return full();
  const guess = base.doseMgPerL * (docMgPerL / base.docMgPerL);
  // 1. the dose of the previously governing goal
  let dose: number | null;
  if (base.governedBy === 'indicator mean') {
    if (!plan) return full();
    dose = indicatorDose(plan, docMgPerL, guess).doseMgPerL;
  } else {
    const id = base.governedBy.replace(/^compound /, '');
    const i = systems.findIndex((s) => s.compoundId === id);
    if (i < 0) return full();
    const d = compoundDose(systems[i]!, docMgPerL, goals[i]!, guess);
    dose = d.status === 'ok' ? d.doseMgPerL : null;
  }
  if (dose === null || !(dose > 0)) return full();
  // 2. every other goal must be met at that dose (then it is the largest goal dose)
  const values: IndicatorValue[] = [];
  for (let i = 0; i < systems.length; i++) {
    const sys = systems[i]!;
    const goal = goals[i]!;
    const s = solveBatchPrepared(prepareSystem(sys, docMgPerL), dose / 1000);
    const removal = 1 - s.cMgPerL[0]! / sys.c0MgPerL;
    if (goal.removalFraction > 0 && removal < goal.removalFraction - 1e-9) return full();
    const member = plan?.members.find((m) => m.system === sys);
    if (member) values.push({ id: sys.compoundId, category: member.category, removalPercent: 100 * removal });
  }
  if (plan && indicatorMeanOf(plan, values) < plan.goalPercent - 1e-7) return full();
  return { docMgPerL, doseMgPerL: dose, governedBy: base.governedBy };
}
