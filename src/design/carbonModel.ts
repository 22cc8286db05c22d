/**
 * The removal model of one carbon at the design DOC, from its competition systems: each compound
 * with its competitors at that DOC, and the fractionated background on this carbon for the
 * surrogates. The model kind comes from the factory (equilibrium by default), so the steps that
 * use the model never name it.
 */
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { equilibriumRemoval } from './equilibriumRemoval.js';
import type { CompetitionSet, RemovalModel, RemovalModelFactory } from './removalModel.js';
import type { CompoundSystem } from './competitionSystem.js';

/** Each compound with its competitors at a DOC (mg/L). */
export function competitionSets(systems: readonly CompoundSystem[], docMgPerL: number): CompetitionSet[] {
  return systems.map((s) => ({
    target: { id: s.compoundId, c0MgPerL: s.c0MgPerL, K: s.inMixture.K, oneOverN: s.inMixture.oneOverN },
    competitors: s.background(docMgPerL),
  }));
}

/**
 * @param background the fictive DOC components on this carbon at `docMgPerL` (surrogates), if any
 */
export function carbonModel(systems: readonly CompoundSystem[], docMgPerL: number, background?: readonly FreundlichComponent[], factory: RemovalModelFactory = equilibriumRemoval): RemovalModel {
  return factory(competitionSets(systems, docMgPerL), docMgPerL, background);
}
