/**
 * Reduced loading of a target at one dose: the loading it reaches in the site water, from the
 * removal model and the batch balance q = (c0 − c)/D (with the equilibrium model: batch IAST
 * beside its competitors, Crittenden et al. 1985), against the single-solute loading at the same
 * liquid concentration (Freundlich q = K·c^(1/n)), and their ratio (< 1: the loss of capacity
 * to competition).
 *
 * Units: dose mg/L in, c mg/L, q mg/g out.
 */
import { ComputationError } from '../core/errors.js';
import type { RemovalModel } from './removalModel.js';

export interface ReducedLoading {
  compoundId: string;
  doseMgPerL: number;
  /** Equilibrium concentration of the target, mg/L. */
  cMgPerL: number;
  /** Removal fraction at the dose. */
  removalFraction: number;
  /** Loading in the site water, mg/g. */
  qSiteMgPerG: number;
  /** Single-solute loading at the same c, mg/g: K·c^(1/n). */
  qSingleMgPerG: number;
  /** qSite / qSingle. */
  ratio: number;
}

/**
 * @param model      the removal model at the water's DOC
 * @param index      the compound's index in the model
 * @param c0MgPerL   its feed concentration, mg/L
 * @param single     its single-solute isotherm on this carbon, K in (mg/g)/(mg/L)^(1/n)
 * @throws ComputationError if the solve fails or the dose is not positive
 */
export function reducedLoading(model: RemovalModel, index: number, c0MgPerL: number, single: { K: number; oneOverN: number }, doseMgPerL: number): ReducedLoading {
  const compoundId = model.compoundIds[index]!;
  if (!(doseMgPerL > 0)) throw new ComputationError(`reduced loading of "${compoundId}" needs a positive dose, got ${doseMgPerL} mg/L`);
  const f = model.remaining(index, doseMgPerL / 1000).remainingFraction;
  const c = c0MgPerL * f;
  const q = (c0MgPerL * (1 - f)) / (doseMgPerL / 1000); // batch balance c0 = c + D·q, D in g/L
  const qSingle = single.K * Math.pow(c, single.oneOverN); // Freundlich at the same c
  const ratio = q / qSingle;
  if (!Number.isFinite(ratio)) throw new ComputationError(`reduced loading of "${compoundId}" at ${doseMgPerL} mg/L is not finite (c = ${c} mg/L)`);
  return { compoundId, doseMgPerL, cMgPerL: c, removalFraction: 1 - f, qSiteMgPerG: q, qSingleMgPerG: qSingle, ratio };
}
