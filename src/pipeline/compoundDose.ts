/**
 * The carbon dose that meets one compound's goal in the site water at a given DOC: batch IAST of
 * the target beside its competitors (Crittenden et al. 1985) and a bracketed search on the dose
 * (src/dose/doseSearch.ts). Doses are mg/L at this layer (g/L inside the core).
 */
import { InputError } from '../core/errors.js';
import { doseForRemoval, MAX_DOSE_G_PER_L } from '../design/doseForRemoval.js';
import { ComputationError } from '../core/errors.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { prepareSystem, type CompoundSystem } from './competitionSystem.js';
import type { CompoundGoal } from './compoundGoal.js';
import { doseNear } from './doseNear.js';

export type DoseStatus = 'ok' | 'no-carbon-needed' | 'unreachable';

export interface CompoundDose {
  compoundId: string;
  status: DoseStatus;
  /** Dose that meets the goal, mg/L (0 when no carbon is needed; null when unreachable). */
  doseMgPerL: number | null;
  /** Removal reached at that dose (fraction). */
  removalFraction: number | null;
  /** Why the goal is unreachable or needs no carbon. */
  message?: string;
}

/**
 * @param sys       the compound's system on one carbon
 * @param docMgPerL DOC of the site water, mg/L
 * @param goal      the compound's goal
 * @param guessMgPerL a nearby dose (mg/L) to start from (e.g. the design-DOC dose scaled by DOC)
 * @returns the dose; never throws for an unreachable goal (status 'unreachable' instead)
 * @throws ComputationError if an equilibrium or the search fails to converge
 */
export function compoundDose(sys: CompoundSystem, docMgPerL: number, goal: CompoundGoal, guessMgPerL?: number): CompoundDose {
  if (goal.removalFraction <= 0) {
    return { compoundId: sys.compoundId, status: 'no-carbon-needed', doseMgPerL: 0, removalFraction: 0, message: `${goal.text} is met without carbon (c0 is already at or below it)` };
  }
  const pm = prepareSystem(sys, docMgPerL);
  if (guessMgPerL !== undefined && guessMgPerL > 0) {
    let warm: { u: number; theta: number } | undefined;
    const removal = (doseGPerL: number) => {
      const s = solveBatchPrepared(pm, doseGPerL, warm);
      warm = s.state;
      return 1 - s.cMgPerL[0]! / sys.c0MgPerL;
    };
    const r = doseNear((d) => removal(d) - goal.removalFraction, guessMgPerL / 1000, `dose search for "${sys.compoundId}"`);
    if (r.status === 'ok') {
      const reached = removal(r.doseGPerL);
      if (!(Math.abs(reached - goal.removalFraction) <= 1e-9)) throw new ComputationError(`dose search for "${sys.compoundId}" ended at ${(reached * 100).toPrecision(6)} % instead of ${(goal.removalFraction * 100).toPrecision(6)} %`);
      return { compoundId: sys.compoundId, status: 'ok', doseMgPerL: r.doseGPerL * 1000, removalFraction: reached };
    }
    // fall through to the full search, which words the message
  }
  try {
    const r = doseForRemoval(pm, 0, goal.removalFraction);
    return { compoundId: sys.compoundId, status: 'ok', doseMgPerL: r.doseGPerL * 1000, removalFraction: r.removalFraction };
  } catch (e) {
    if (e instanceof InputError && /not reached by any dose/.test(e.message)) {
      return { compoundId: sys.compoundId, status: 'unreachable', doseMgPerL: null, removalFraction: null, message: e.expected };
    }
    if (e instanceof InputError && /already met below/.test(e.message)) {
      return { compoundId: sys.compoundId, status: 'no-carbon-needed', doseMgPerL: 0, removalFraction: null, message: e.expected };
    }
    throw e;
  }
}
