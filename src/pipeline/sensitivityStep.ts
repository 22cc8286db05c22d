/**
 * Sensitivity of the required dose and the yearly carbon cost on one PAC carbon to each main
 * input, one at a time, lowered and raised by a relative step (default ±20 %, common practice for
 * a what-if table): K and 1/n of the governing compound, the design DOC (and every day of the DOC
 * series), the adsorbable part of the background (fictive components or EBC concentration, the
 * DOC kept: the non-adsorbable part takes up the difference) and the carbon price. Each case is
 * recomputed through the functions the run uses (designDose, doseTable, dailyDoses' segment sums,
 * yearlyAtOneDose), never a copy of their equations; the price enters the cost linearly, so its
 * case scales the run's yearly carbon mass by the changed price.
 *
 * Under PAC contact conditions the contact time and (stirred tank) the carbon age are cases too,
 * the carbon age kept at least the contact time; at equilibrium they are listed as not modelled.
 * The run's models of a carbon under contact keep their kinetic solves in one store
 * (ContactSolveStore, given to the factories of every case), so a case whose solves are the same
 * computation as the run's or an earlier case's takes them from there: e.g. the adsorbable
 * background scaled like the DOC, or the contact time of a stirred tank whose carbon age does not
 * change (its outlet depends on the age alone). Thin on purpose: when the design model replaces
 * the dose logic, `evaluate` changes.
 *
 * @throws ComputationError from the solvers, as the run does
 */
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import type { CarbonSpec } from '../project/projectTypes.js';
import type { SiteSeries } from '../siteSeries/siteSeries.js';
import type { CompoundSystem } from '../design/competitionSystem.js';
import { designDose, type Design, type DesignProblem } from '../design/designDose.js';
import { seriesYearly } from '../design/dailyDoses.js';
import { doseTable, yearlyAtOneDose } from '../design/doseTable.js';
import type { RemovalModel } from '../design/removalModel.js';
import type { ContactConditions } from '../kinetics/contactRemoval.js';

export interface SensitivityRow {
  /** Stable key: 'K', 'one_over_n', 'doc', 'background', 'price'. */
  key: string;
  /** Words for the figure, e.g. "K of HCT". */
  input: string;
  /** Required dose with the input lowered / raised, mg/L (null: no goal reachable). */
  doseLowMgPerL: number | null;
  doseHighMgPerL: number | null;
  /** Yearly carbon cost with the input lowered / raised, carbon's currency per year. */
  yearlyCostLow: number | null;
  yearlyCostHigh: number | null;
}

export interface Sensitivity {
  carbonName: string;
  currency: string;
  /** Relative step, e.g. 0.2 for ±20 %. */
  step: number;
  governingCompound: string;
  baseDoseMgPerL: number;
  baseYearlyCost: number;
  rows: SensitivityRow[];
  notModelled: string[];
}

export interface SensitivityInput {
  carbon: CarbonSpec;
  systems: readonly CompoundSystem[];
  /** The carbon's design problem (goals, indicator goal, price), as the run uses it. */
  problem: DesignProblem;
  /** The removal model of a set of (possibly changed) systems at a DOC, as the run builds it. */
  modelOf: (systems: readonly CompoundSystem[], docMgPerL: number) => RemovalModel;
  /** The plant's PAC contact conditions and the model under other conditions, when contact is modelled. */
  contact?: { conditions: ContactConditions; modelWith: (systems: readonly CompoundSystem[], docMgPerL: number, conditions: ContactConditions) => RemovalModel };
  docMgPerL: number;
  flowM3PerD: number;
  series?: SiteSeries;
  /** The run's required dose and yearly figures at the design inputs (the base of every bar). */
  required: Design;
  yearly: { carbonKg: number; cost: number };
}

/** The adsorbable part of a background scaled by `f`, the non-adsorbable part taking up the difference (total kept). */
export function scaleAdsorbable(components: readonly FreundlichComponent[], f: number): FreundlichComponent[] {
  const adsorbable = components.reduce((s, c) => s + (c.K > 0 ? c.c0MgPerL : 0), 0);
  const out = components.map((c) => (c.K > 0 ? { ...c, c0MgPerL: c.c0MgPerL * f } : { ...c }));
  const shift = adsorbable * (1 - f);
  const inert = out.find((c) => c.K === 0);
  if (inert) inert.c0MgPerL = Math.max(0, inert.c0MgPerL + shift);
  else if (shift > 0) out.push({ id: 'non-adsorbable (sensitivity)', c0MgPerL: shift, K: 0, oneOverN: 1 });
  return out;
}

/** The run's dose and yearly cost for a set of (possibly changed) inputs. */
function evaluate(inp: SensitivityInput, systems: readonly CompoundSystem[], doc: number, series: SiteSeries | undefined, conditions?: ContactConditions): { dose: number | null; cost: number | null } {
  const model = conditions && inp.contact ? inp.contact.modelWith(systems, doc, conditions) : inp.modelOf(systems, doc);
  const req = designDose(model, inp.problem, inp.required);
  if (series) {
    const daily = seriesYearly(inp.carbon.pricePerKg, series, doseTable(model, inp.problem, series.docMgPerL, req));
    return { dose: req.doseMgPerL, cost: daily.daysWithDose > 0 ? daily.yearlyCost : null };
  }
  return { dose: req.doseMgPerL, cost: req.doseMgPerL === null ? null : yearlyAtOneDose(req.doseMgPerL, inp.flowM3PerD, inp.carbon.pricePerKg).cost };
}

/** One perturbation of the inputs by factor f. */
type Perturb = (f: number) => { systems: readonly CompoundSystem[]; doc: number; series: SiteSeries | undefined; conditions?: ContactConditions };

/** @returns undefined when the required dose at the design inputs is not reachable (no base). */
export function sensitivityStep(inp: SensitivityInput, step = 0.2): Sensitivity | undefined {
  const gov = inp.required.governing?.compoundId;
  if (inp.required.doseMgPerL === null || gov === undefined) return undefined;
  const same = { systems: inp.systems, doc: inp.docMgPerL, series: inp.series };
  const withSystem = (change: (s: CompoundSystem) => CompoundSystem) => inp.systems.map((s) => (s.compoundId === gov ? change(s) : s));
  const cases: Array<{ key: string; input: string; perturb: Perturb }> = [
    { key: 'K', input: `K of ${gov}`, perturb: (f) => ({ ...same, systems: withSystem((s) => ({ ...s, single: { ...s.single, K: s.single.K * f }, inMixture: { ...s.inMixture, K: s.inMixture.K * f } })) }) },
    { key: 'one_over_n', input: `1/n of ${gov}`, perturb: (f) => ({ ...same, systems: withSystem((s) => ({ ...s, single: { ...s.single, oneOverN: s.single.oneOverN * f }, inMixture: { ...s.inMixture, oneOverN: s.inMixture.oneOverN * f } })) }) },
    { key: 'doc', input: 'DOC', perturb: (f) => ({ ...same, doc: inp.docMgPerL * f, series: inp.series ? { ...inp.series, docMgPerL: inp.series.docMgPerL.map((d) => d * f) } : undefined }) },
    { key: 'background', input: 'adsorbable background', perturb: (f) => ({ ...same, systems: inp.systems.map((s) => ({ ...s, background: (doc: number) => scaleAdsorbable(s.background(doc), f) })) }) },
  ];
  const cond = inp.contact?.conditions;
  if (cond) {
    // contact time ±step; a stirred tank without recirculation (θ = τ) keeps θ = τ, one with
    // recirculation keeps its carbon age, never below the contact time (θ ≥ τ)
    cases.push({ key: 'contact_time', input: 'contact time', perturb: (f) => ({ ...same, conditions: cond.kind === 'plug-flow'
      ? { kind: 'plug-flow', contactTimeS: cond.contactTimeS * f }
      : { kind: 'stirred', contactTimeS: cond.contactTimeS * f, carbonAgeS: cond.carbonAgeS === cond.contactTimeS ? cond.contactTimeS * f : Math.max(cond.carbonAgeS, cond.contactTimeS * f) } }) });
    // carbon age ±step, never below the contact time
    if (cond.kind === 'stirred') cases.push({ key: 'carbon_age', input: 'carbon age', perturb: (f) => ({ ...same, conditions: { kind: 'stirred', contactTimeS: cond.contactTimeS, carbonAgeS: Math.max(cond.contactTimeS, cond.carbonAgeS * f) } }) });
  }
  const rows: SensitivityRow[] = cases.map(({ key, input, perturb }) => {
    const lo = perturb(1 - step);
    const hi = perturb(1 + step);
    const a = evaluate(inp, lo.systems, lo.doc, lo.series, lo.conditions);
    const b = evaluate(inp, hi.systems, hi.doc, hi.series, hi.conditions);
    return { key, input, doseLowMgPerL: a.dose, doseHighMgPerL: b.dose, yearlyCostLow: a.cost, yearlyCostHigh: b.cost };
  });
  // the price changes no dose; the yearly cost is the run's carbon mass times the changed price
  rows.push({ key: 'price', input: 'carbon price', doseLowMgPerL: inp.required.doseMgPerL, doseHighMgPerL: inp.required.doseMgPerL,
    yearlyCostLow: inp.yearly.carbonKg * inp.carbon.pricePerKg * (1 - step), yearlyCostHigh: inp.yearly.carbonKg * inp.carbon.pricePerKg * (1 + step) });
  return {
    carbonName: inp.carbon.name, currency: inp.carbon.currency, step, governingCompound: gov,
    baseDoseMgPerL: inp.required.doseMgPerL, baseYearlyCost: inp.yearly.cost, rows,
    notModelled: !inp.contact ? ['contact time', 'carbon age'] : inp.contact.conditions.kind === 'plug-flow' ? ['carbon age (plug-flow contact)'] : [],
  };
}
