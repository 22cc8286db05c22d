/**
 * The contact-conditions figures of one PAC carbon: the required dose under the plant's contact
 * conditions (the run's required dose, from the contact model) beside the equilibrium (batch IAST)
 * dose for the same goals and their ratio. Contact leaves less removal at a dose than
 * equilibrium, so the ratio is ≥ 1 up to the dose search's tolerance (|Δ ln D| ≤ 1e-12).
 * Units: doses mg/L, times s.
 */
import type { ContactConditions } from '../kinetics/contactRemoval.js';
import type { Design } from '../design/designDose.js';
import type { RemovalModel } from '../design/removalModel.js';
import type { ContactCurves } from './contactCurvesStep.js';

export interface ContactFigures {
  /** Water residence time of the contact tank (or the plug-flow contact time), s. */
  contactTimeS: number;
  /** Mean carbon age, s (equal to the contact time for a plug-flow contact or without recirculation). */
  carbonAgeS: number;
  reactor: ContactConditions['kind'];
  /** Short description of the contact model. */
  model: string;
  /** Required dose at equilibrium for the same goals, mg/L (null when no goal is reachable). */
  equilibriumDoseMgPerL: number | null;
  /** Required dose under contact ÷ equilibrium dose (null when either is missing). */
  doseRatio: number | null;
  /** The equilibrium design (every compound's equilibrium dose). */
  equilibrium: Design;
  /** The report's curves for the governing compound (contactCurvesStep.ts). */
  curves?: ContactCurves;
}

/**
 * @param equilibrium the design on the equilibrium model (same goals, same DOC)
 * @param required    the design on the contact model
 */
export function contactFigures(contact: ContactConditions, contactModel: RemovalModel, equilibrium: Design, required: Design): ContactFigures {
  const eq = equilibrium.doseMgPerL;
  return {
    contactTimeS: contact.contactTimeS,
    carbonAgeS: contact.kind === 'stirred' ? contact.carbonAgeS : contact.contactTimeS,
    reactor: contact.kind,
    model: contactModel.kind,
    equilibriumDoseMgPerL: eq,
    doseRatio: eq !== null && eq > 0 && required.doseMgPerL !== null ? required.doseMgPerL / eq : null,
    equilibrium,
  };
}
