/**
 * Reduced loading of a target at one dose: the loading it reaches in the site water (batch IAST
 * beside its competitors, Crittenden et al. 1985) against the single-solute loading at the same
 * liquid concentration (Freundlich q = K·c^(1/n)), and their ratio (< 1: the loss of capacity
 * to competition).
 *
 * Units: dose mg/L in, c mg/L, q mg/g out.
 */
import { ComputationError } from '../core/errors.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { prepareSystem, type CompoundSystem } from './competitionSystem.js';

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

/** @throws ComputationError if the equilibrium fails or the dose is not positive */
export function reducedLoading(sys: CompoundSystem, docMgPerL: number, doseMgPerL: number): ReducedLoading {
  if (!(doseMgPerL > 0)) throw new ComputationError(`reduced loading of "${sys.compoundId}" needs a positive dose, got ${doseMgPerL} mg/L`);
  const s = solveBatchPrepared(prepareSystem(sys, docMgPerL), doseMgPerL / 1000);
  const c = s.cMgPerL[0]!;
  const q = s.qMgPerG[0]!;
  const qSingle = sys.single.K * Math.pow(c, sys.single.oneOverN); // Freundlich at the same c
  const ratio = q / qSingle;
  if (!Number.isFinite(ratio)) throw new ComputationError(`reduced loading of "${sys.compoundId}" at ${doseMgPerL} mg/L is not finite (c = ${c} mg/L)`);
  return { compoundId: sys.compoundId, doseMgPerL, cMgPerL: c, removalFraction: 1 - c / sys.c0MgPerL, qSiteMgPerG: q, qSingleMgPerG: qSingle, ratio };
}
