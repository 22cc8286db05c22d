/**
 * The adsorption system of one target compound on one carbon in the site water: the target's
 * single-solute Freundlich isotherm on that carbon, the target as it enters the IAST (after a
 * calibrated K factor), and its competitors (fictive DOC components or an equivalent background
 * compound) at any DOC.
 *
 * Each target is solved beside the background alone (trace targets do not compete noticeably
 * with each other at ng/L–µg/L beside mg/L of DOC; Knappe et al. 1998).
 *
 * Carbons: a carbon with K factor f has every reference K (targets and background) times f; in a
 * batch this is the same as the reference carbon at f times the dose (q = f·q_ref in the balance
 * c0 = c + D·q). Per-compound isotherms given for a carbon replace the target's reference values;
 * the background keeps the reference K times f.
 */
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { prepareMixture, type PreparedMixture } from '../equilibrium/preparedMixture.js';

export interface CompoundSystem {
  compoundId: string;
  carbonName: string;
  /** Target in the site water, mg/L. */
  c0MgPerL: number;
  /** Single-solute isotherm of the target on this carbon: K (mg/g)/(mg/L)^(1/n), 1/n. */
  single: { K: number; oneOverN: number };
  /** Target isotherm used in the IAST (single-solute times a calibrated factor, if any). */
  inMixture: { K: number; oneOverN: number };
  /** 'fictive' = fractionated DOC components, 'ebc' = one equivalent background compound. */
  competition: 'fictive' | 'ebc';
  /** Competitors at a DOC value (mg/L), K already for this carbon. */
  background(docMgPerL: number): FreundlichComponent[];
  /** Plain-words description for the report. */
  description: string;
  /** Where the site correction comes from: "jar tests (model …)", "transferred from …"; absent = none. */
  calibration?: string;
}

/** Target first, then its competitors, at `docMgPerL`. */
export function systemComponents(sys: CompoundSystem, docMgPerL: number): FreundlichComponent[] {
  return [
    { id: sys.compoundId, c0MgPerL: sys.c0MgPerL, K: sys.inMixture.K, oneOverN: sys.inMixture.oneOverN },
    ...sys.background(docMgPerL),
  ];
}

/** The prepared mixture (target at index 0) at a DOC value. */
export function prepareSystem(sys: CompoundSystem, docMgPerL: number): PreparedMixture {
  return prepareMixture(systemComponents(sys, docMgPerL));
}

/** Components with every K multiplied by `factor` (ids and concentrations unchanged). */
export function scaleK(components: readonly FreundlichComponent[], factor: number): FreundlichComponent[] {
  return factor === 1 ? components.slice() : components.map((c) => ({ ...c, K: c.K * factor }));
}
