/**
 * The design of one carbon at one DOC: the dose each compound's goal needs, the dose at which the
 * indicator mean reaches its goal, the required dose (the largest of those: the governing goal is
 * the one needing the most carbon; unreachable goals are left out and said so), the carbon cost
 * per m³ treated and the DOC/UV254 surrogate set-point at the required dose.
 *
 *   cost per m³ = dose (mg/L = g/m³) / 1000 × price per kg           (carbonCost.ts)
 *   DOC reduction = 1 − Σ c_i(D)/Σ c0_i over the fictive components
 *   UV254 reduction = 1 − Σ a_i·c_i(D)/Σ a_i·c0_i (Beer–Lambert additivity; UV254 reduction as a
 *   dosing control parameter: Altmann et al. 2016, Water Research 94:240–245)
 *
 * The same function serves the run at the design DOC, every distinct DOC of the series and every
 * Monte Carlo draw, on any removal model (src/design/removalModel.ts). Units: doses mg/L.
 * Throws ComputationError if a solve fails; statuses (not exceptions) for unreachable goals.
 */
import type { CompoundGoal } from './compoundGoal.js';
import { compoundDoseSolved, type CompoundDose } from './compoundDose.js';
import { powerLawRoot } from './indicatorDoseNewton.js';
import { indicatorDose, type IndicatorDose, type IndicatorGoal } from './indicatorGoal.js';
import type { DoseAtRemoval, RemovalModel, WarmStart } from './removalModel.js';
import { costPerM3 } from './carbonCost.js';

export interface DesignProblem {
  /** Goal of every compound of the model (model order). */
  goals: readonly CompoundGoal[];
  indicator?: IndicatorGoal;
  /** Carbon price per kg (the carbon's currency). */
  pricePerKg: number;
  /** Specific UV254 absorbance of each fictive DOC component, 1/m per (mg/L), when known. */
  uv254AbsorbancePerM?: readonly number[];
}

export interface SurrogateSetPoint {
  doseMgPerL: number;
  docReduction: number;
  /** null without absorbances. */
  uv254Reduction: number | null;
}

export interface Design {
  docMgPerL: number;
  compounds: CompoundDose[];
  /** The reachable compound needing the most carbon. */
  governing?: { compoundId: string; doseMgPerL: number };
  indicator?: IndicatorDose;
  /** The dose meeting every reachable goal, mg/L (null when nothing is reachable). */
  doseMgPerL: number | null;
  /** "compound CBZ", "indicator mean" or "nothing reachable". */
  governedBy: string;
  /** Carbon cost per m³ treated at the required dose (null without a dose). */
  costPerM3: number | null;
  /** DOC/UV254 reduction at the required dose (models with a fractionated background, dose > 0). */
  surrogate?: SurrogateSetPoint;
}

/**
 * The solve states a design ended with (each compound's at its dose, the background's at the
 * required dose) and the kind of model they belong to: warm starts for a design of the same kind
 * near it (a Monte Carlo draw near the point design). Only a speed-up.
 */
export interface DesignWarmStarts {
  kind: string;
  compounds: Array<WarmStart | undefined>;
  background?: WarmStart;
}

/** DOC and UV254 reduction of the model's fictive background at a dose (mg/L). */
export function surrogatesAt(model: RemovalModel, doseMgPerL: number, uv254AbsorbancePerM?: readonly number[], warm?: { background?: WarmStart }): SurrogateSetPoint | undefined {
  const c0 = model.backgroundC0MgPerL;
  if (!c0 || !model.backgroundRemaining) return undefined;
  const at = model.backgroundRemaining(doseMgPerL / 1000, warm?.background);
  if (warm) warm.background = at.warm;
  const c = at.cMgPerL;
  let doc0 = 0, doc = 0, uv0 = 0, uv = 0;
  for (let i = 0; i < c0.length; i++) {
    doc0 += c0[i]!;
    doc += c[i]!;
    if (uv254AbsorbancePerM) { uv0 += uv254AbsorbancePerM[i]! * c0[i]!; uv += uv254AbsorbancePerM[i]! * c[i]!; }
  }
  return { doseMgPerL, docReduction: doc0 > 0 ? 1 - doc / doc0 : 0, uv254Reduction: uv254AbsorbancePerM && uv0 > 0 ? 1 - uv / uv0 : null };
}

/**
 * A starting dose (mg/L) for the indicator-mean search from the members' own goal doses: each
 * member's ln c/c0 taken linear in ln D through its goal dose with the slope there
 * (indicatorDoseNewton.ts); undefined unless every member has such a point.
 */
function indicatorHint(goal: IndicatorGoal, solved: ReadonlyArray<DoseAtRemoval | undefined>): number | undefined {
  const n = goal.members.length;
  // plain arrays: a Float64Array of more than 8 numbers (9 indicator compounds) is allocated outside the JS heap
  const x = new Array<number>(n), l = new Array<number>(n), s = new Array<number>(n);
  for (let k = 0; k < n; k++) {
    const d = solved[goal.members[k]!.index];
    if (!d || d.slope === undefined || !(d.slope < 0) || !(d.remainingFraction > 0)) return undefined;
    x[k] = Math.log(d.doseGPerL);
    l[k] = Math.log(d.remainingFraction);
    s[k] = d.slope;
  }
  if (goal.chosen) return undefined; // the chosen set is a subset: keep the general hint
  let x0 = 0;
  for (let k = 0; k < n; k++) x0 += x[k]! / n;
  const root = powerLawRoot(x0, x, l, s, goal.goalPercent);
  return root === undefined ? undefined : Math.exp(root) * 1000;
}

/** Designs made once at load with and without numbers (see requiredDoseAt.ts: layouts that a rare null mid-run does not change). */
const layoutPrimers: readonly Design[] = [
  { docMgPerL: 1.5, compounds: [], doseMgPerL: 1.5, governedBy: '', costPerM3: 1.5, governing: undefined, indicator: undefined, surrogate: { doseMgPerL: 1.5, docReduction: 0.5, uv254Reduction: 0.5 } },
  { docMgPerL: 1.5, compounds: [], doseMgPerL: null, governedBy: '', costPerM3: null, governing: { compoundId: '', doseMgPerL: 1.5 }, indicator: { status: 'unreachable', doseMgPerL: null }, surrogate: { doseMgPerL: 1.5, docReduction: 0.5, uv254Reduction: null } },
];
void layoutPrimers;

/**
 * @param model the removal model of the carbon at the water's DOC
 * @param near  the design at another DOC, for starting guesses only (doses scaled by DOC:
 *              the dose per mg DOC is roughly constant, Zietzschmann et al. 2016)
 */
export function designDose(model: RemovalModel, problem: DesignProblem, near?: Design, nearWarm?: DesignWarmStarts): Design {
  return designDoseWarm(model, problem, near, nearWarm).design;
}

/**
 * `designDose`, with the solve states it ended with.
 * @param nearWarm the states of `near` (used only when they belong to a model of the same kind)
 */
export function designDoseWarm(model: RemovalModel, problem: DesignProblem, near?: Design, nearWarm?: DesignWarmStarts): { design: Design; warm: DesignWarmStarts } {
  const docMgPerL = model.docMgPerL;
  const scale = near ? docMgPerL / near.docMgPerL : 1;
  const prev = nearWarm && nearWarm.kind === model.kind ? nearWarm : undefined;
  // arrays built by push, not by map: V8's optimised map makes arrays of another layout (holey)
  // than its first, unoptimised runs, which sent every reader of them back to the interpreter
  const solved: Array<DoseAtRemoval | undefined> = [];
  const compounds: CompoundDose[] = [];
  const compoundWarm: Array<WarmStart | undefined> = [];
  for (let i = 0; i < problem.goals.length; i++) {
    const prior = near?.compounds[i];
    const hint = prior && prior.status === 'met' && prior.doseMgPerL ? prior.doseMgPerL * scale : undefined;
    const r = compoundDoseSolved(model, i, problem.goals[i]!, hint, problem.indicator !== undefined, prev?.compounds[i]);
    solved.push(r.solved);
    compounds.push(r.dose);
    compoundWarm.push(r.solved?.warm);
  }
  const warm: DesignWarmStarts = { kind: model.kind, compounds: compoundWarm };
  if (prev?.background !== undefined) warm.background = prev.background;
  let governing: Design['governing'];
  for (const c of compounds) {
    if (c.doseMgPerL !== null && (!governing || c.doseMgPerL > governing.doseMgPerL)) governing = { compoundId: c.compoundId, doseMgPerL: c.doseMgPerL };
  }
  // every field present (undefined when absent, which JSON leaves out), in the order they are
  // filled: one object layout whatever the outcome (the Monte Carlo's hot code sees one shape)
  const out: Design = {
    docMgPerL, compounds, doseMgPerL: governing?.doseMgPerL ?? null,
    governedBy: governing ? `compound ${governing.compoundId}` : 'nothing reachable', costPerM3: null,
    governing, indicator: undefined, surrogate: undefined,
  };
  if (problem.indicator) {
    const prior = near?.indicator;
    const hint = indicatorHint(problem.indicator, solved) ?? (prior && prior.status === 'met' && prior.doseMgPerL ? prior.doseMgPerL * scale : undefined);
    const ind = indicatorDose(model, problem.indicator, hint, compoundWarm); // read only there
    out.indicator = ind;
    if (ind.doseMgPerL !== null && (out.doseMgPerL === null || ind.doseMgPerL > out.doseMgPerL)) {
      out.doseMgPerL = ind.doseMgPerL;
      out.governedBy = 'indicator mean';
    }
  }
  if (out.doseMgPerL !== null) {
    out.costPerM3 = costPerM3(out.doseMgPerL, problem.pricePerKg);
    if (out.doseMgPerL > 0) {
      const s = surrogatesAt(model, out.doseMgPerL, problem.uv254AbsorbancePerM, warm);
      if (s) out.surrogate = s;
    }
  }
  return { design: out, warm };
}
