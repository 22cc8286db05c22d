/**
 * Carbon dose that reaches a removal fraction of one component of a mixture, all components in
 * one batch IAST (the `dose` command and the library's `doseFor`).
 *
 * The dose is the root of  e(D) = ln(1 − R) − ln(c(D)/c0), non-decreasing in D, found by the
 * design layer's one dose search (src/design/doseSearch.ts: bracketing, then Brent on ln D),
 * with each equilibrium warm-started from the previous one.
 *
 * Units: doses g/L. At this edge an infeasible goal is the user's input: throws InputError when
 * the goal is not reached at the largest dose searched or is met below the smallest, and for a
 * component with K = 0 or c0 = 0; ComputationError if the search fails.
 */
import { ComputationError, InputError } from '../core/errors.js';
import type { PreparedMixture } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared, type BatchSolution } from '../equilibrium/iastBatch.js';
import { MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L, searchDose } from './doseSearch.js';
import { removalExcess } from './removalExcess.js';

export { MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L };

export interface DoseResult {
  doseGPerL: number;
  /** Removal fraction reached at that dose (equals the goal to solver precision). */
  removalFraction: number;
  solution: BatchSolution;
  evaluations: number;
}

/**
 * @param pm              prepared mixture
 * @param targetIndex     index of the component in the mixture's order
 * @param removalFraction goal, 0 < R < 1
 * @param hintGPerL       a dose near the answer, g/L (optional; only a speed-up)
 */
export function doseForRemoval(pm: PreparedMixture, targetIndex: number, removalFraction: number, hintGPerL?: number): DoseResult {
  const id = pm.ids[targetIndex];
  if (id === undefined) throw new InputError(`target index ${targetIndex} is not in the mixture`);
  if (!(removalFraction > 0 && removalFraction < 1)) throw new InputError(`expected a removal goal between 0 and 100 %, got ${removalFraction * 100} %`);
  const j = Array.prototype.indexOf.call(pm.active, targetIndex) as number;
  const comp = pm.source[targetIndex]!;
  if (j < 0) {
    if (comp.K === 0) throw new InputError(`component "${id}" is non-adsorbable (K = 0); no carbon dose removes it`);
    throw new InputError(`component "${id}" has c0 = 0; there is nothing to remove`);
  }
  const c0 = comp.c0MgPerL;
  let warm: { u: number; theta: number } | undefined;
  const remainingAt = (doseGPerL: number) => {
    const s = solveBatchPrepared(pm, doseGPerL, warm);
    warm = s.state;
    return s.cMgPerL[targetIndex]! / c0;
  };
  const opts: Parameters<typeof searchDose>[1] = { what: `dose search for "${id}"` };
  if (hintGPerL !== undefined) opts.hintGPerL = hintGPerL;
  const r = searchDose((d) => removalExcess(remainingAt(d), removalFraction), opts);
  if (r.status === 'unreachable') {
    throw new InputError(`the goal of ${fmtPct(removalFraction)} removal of "${id}" is not reached by any dose up to ${MAX_DOSE_G_PER_L * 1000} mg/L (it reaches ${fmtPct(1 - remainingAt(MAX_DOSE_G_PER_L))} there)`);
  }
  if (r.status === 'met below the smallest dose') {
    throw new InputError(`the goal of ${fmtPct(removalFraction)} removal of "${id}" is already met below ${MIN_DOSE_G_PER_L * 1000} mg/L of carbon; check the inputs`);
  }
  const sol = solveBatchPrepared(pm, r.doseGPerL, warm);
  const removal = 1 - sol.cMgPerL[targetIndex]! / c0;
  if (!(Math.abs(removal - removalFraction) <= 1e-9 * Math.max(1, removalFraction) + 1e-12)) {
    throw new ComputationError(`dose search for "${id}" ended at ${fmtPct(removal)} instead of ${fmtPct(removalFraction)}`);
  }
  return { doseGPerL: r.doseGPerL, removalFraction: removal, solution: sol, evaluations: r.evaluations + 1 };
}

function fmtPct(f: number): string {
  return `${(f * 100).toPrecision(4)} %`;
}
