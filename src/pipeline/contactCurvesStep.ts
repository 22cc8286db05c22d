/**
 * The report's contact curves of one PAC carbon, for the governing compound (with its
 * competitors, as in the design):
 *   - removal against contact time at the required dose: the batch (every particle in contact for
 *     time t: a jar test or a plug-flow tank; pacBatch), 1 min to 4 h;
 *   - removal against dose at equilibrium and under the plant's contact conditions, at the doses
 *     of the run's removal curves (the contact values are the run's curve);
 *   - removal against mean carbon age θ at the required dose in a stirred tank of the plant's
 *     residence time τ, θ from τ (no recirculation) to 10 days: what recirculation buys.
 * Units: times s, doses mg/L, removal percent.
 * @throws ComputationError when a kinetic solve fails
 */
import { prepareKinetics } from '../kinetics/kineticMixture.js';
import { pacBatch, type KineticSolverOptions } from '../kinetics/pacBatch.js';
import { stirredReactor } from '../kinetics/stirredReactor.js';
import type { ContactConditions } from '../kinetics/contactRemoval.js';
import type { RemovalModel } from '../design/removalModel.js';
import type { RemovalCurves } from '../design/removalCurves.js';
import type { CarbonSpec } from '../project/projectTypes.js';
import { competitionSets } from '../design/carbonModel.js';
import type { CompoundSystem } from '../design/competitionSystem.js';
import { kineticMixture } from '../kinetics/contactModel.js';

export interface ContactCurves {
  compoundId: string;
  requiredDoseMgPerL: number;
  contactTimeS: number;
  /** Removal against time in contact (batch), percent. */
  time: { timesS: number[]; removalPercent: number[] };
  /** Removal against dose: equilibrium and under the plant's contact conditions, percent. */
  dose: { dosesMgPerL: number[]; equilibriumPercent: number[]; contactPercent: number[] };
  /** Removal against mean carbon age in a stirred tank of residence contactTimeS, percent. */
  carbonAge: { carbonAgesS: number[]; removalPercent: number[] };
}

/** Batch times of the contact-time curve, s (1 min to 4 h; ours). */
export const CONTACT_CURVE_TIMES_S = [60, 120, 300, 600, 900, 1200, 1800, 2700, 3600, 5400, 7200, 10800, 14400];
/** Carbon ages as multiples of τ up to this many days (ours: a few days is common with recirculation). */
const MAX_CARBON_AGE_S = 10 * 86400;

export function contactCurvesStep(contact: ContactConditions, carbon: CarbonSpec, systems: readonly CompoundSystem[], docMgPerL: number, compoundId: string, requiredDoseMgPerL: number, curves: RemovalCurves, equilibriumModel: RemovalModel, options: KineticSolverOptions = {}): ContactCurves {
  const index = systems.findIndex((s) => s.compoundId === compoundId);
  const set = competitionSets(systems, docMgPerL)[index]!;
  const { components, particle } = kineticMixture(set, carbon);
  const pk = prepareKinetics(components, particle);
  const removal = (c: number) => 100 * Math.min(1, Math.max(0, 1 - c / components[0]!.c0MgPerL));
  const doseGPerL = requiredDoseMgPerL / 1000;
  const batch = pacBatch(pk, doseGPerL, CONTACT_CURVE_TIMES_S, options);
  const tau = contact.contactTimeS;
  const ages: number[] = [];
  for (let theta = tau; theta < MAX_CARBON_AGE_S; theta *= 3) ages.push(theta);
  ages.push(Math.max(MAX_CARBON_AGE_S, tau));
  return {
    compoundId,
    requiredDoseMgPerL,
    contactTimeS: tau,
    time: { timesS: [...CONTACT_CURVE_TIMES_S], removalPercent: batch.cMgPerL.map((c) => removal(c[0]!)) },
    dose: {
      dosesMgPerL: [...curves.dosesMgPerL],
      equilibriumPercent: curves.dosesMgPerL.map((d) => 100 * (1 - equilibriumModel.remaining(index, d / 1000).remainingFraction)),
      contactPercent: [...curves.removalPercent[compoundId]!],
    },
    carbonAge: { carbonAgesS: ages, removalPercent: ages.map((theta) => removal(stirredReactor(pk, doseGPerL, tau, theta, options).cMgPerL[0]!)) },
  };
}
