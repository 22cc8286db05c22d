/**
 * The carbon dose a site needs at one DOC value on one carbon: the largest of the compounds'
 * goal doses (the governing compound is the one needing the most carbon) and, when an indicator
 * goal is set, the dose at which the indicator mean reaches it.
 */
import { compoundDose, type CompoundDose } from './compoundDose.js';
import type { CompoundGoal } from './compoundGoal.js';
import type { CompoundSystem } from './competitionSystem.js';
import { indicatorDose, type IndicatorDose, type IndicatorPlan } from './indicatorCheck.js';

export interface RequiredDose {
  docMgPerL: number;
  compounds: CompoundDose[];
  /** The reachable compound needing the most carbon. */
  governing?: { compoundId: string; doseMgPerL: number };
  indicator?: IndicatorDose;
  /** The dose meeting every reachable goal, mg/L (null when nothing is reachable). */
  doseMgPerL: number | null;
  /** "compound CBZ" or "indicator mean". */
  governedBy: string;
}

/**
 * @param systems   one system per compound (same order as `goals`)
 * @param goals     each compound's goal
 * @param plan      the indicator plan, when an indicator goal is set
 * @param docMgPerL DOC of the site water, mg/L
 * @param near      the required dose at another DOC, used only for starting guesses
 */
export function requiredDose(systems: readonly CompoundSystem[], goals: readonly CompoundGoal[], plan: IndicatorPlan | undefined, docMgPerL: number, near?: RequiredDose): RequiredDose {
  // Starting guesses from a nearby solution, scaled by DOC (dose per DOC roughly constant,
  // Zietzschmann et al. 2016); only a speed-up, the answers are solved exactly.
  const scale = near ? docMgPerL / near.docMgPerL : 1;
  const compounds = systems.map((s, i) => {
    const prior = near?.compounds[i];
    const guess = prior && prior.status === 'ok' && prior.doseMgPerL ? prior.doseMgPerL * scale : undefined;
    return compoundDose(s, docMgPerL, goals[i]!, guess);
  });
  let governing: RequiredDose['governing'];
  for (const c of compounds) {
    if (c.doseMgPerL !== null && (!governing || c.doseMgPerL > governing.doseMgPerL)) governing = { compoundId: c.compoundId, doseMgPerL: c.doseMgPerL };
  }
  const out: RequiredDose = { docMgPerL, compounds, doseMgPerL: governing?.doseMgPerL ?? null, governedBy: governing ? `compound ${governing.compoundId}` : 'nothing reachable' };
  if (governing) out.governing = governing;
  if (plan) {
    const prior = near?.indicator;
    const ind = indicatorDose(plan, docMgPerL, prior && prior.status === 'ok' && prior.doseMgPerL ? prior.doseMgPerL * scale : undefined);
    out.indicator = ind;
    if (ind.doseMgPerL !== null && (out.doseMgPerL === null || ind.doseMgPerL > out.doseMgPerL)) {
      out.doseMgPerL = ind.doseMgPerL;
      out.governedBy = 'indicator mean';
    }
  }
  return out;
}
