/**
 * Carbon dose that reaches a removal fraction of one component of a mixture.
 *
 * Removal of a component in a batch IAST system rises monotonically with the dose, so the
 * dose is the root of  g(ln D) = ln(c(D)/c0) − ln(1 − R)  on a bracket of ln D; Brent's method
 * (bracketed, cannot lose the root) with each equilibrium warm-started from the previous one.
 *
 * Units: doses g/L. Throws InputError when the goal is not reached at the largest dose allowed
 * (the goal is infeasible for this mixture) and ComputationError if the search fails.
 */
import { ComputationError, InputError } from '../core/errors.js';
import { brentRoot } from '../numerics/brent.js';
import type { PreparedMixture } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared, type BatchSolution } from '../equilibrium/iastBatch.js';

/** Largest dose searched, g/L (5 g/L = 5000 mg/L, far above any practical PAC dose). */
export const MAX_DOSE_G_PER_L = 5;
/** Smallest dose searched, g/L (1 ng/L of carbon: below any dose a plant can meter). */
export const MIN_DOSE_G_PER_L = 1e-12;

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
 */
export function doseForRemoval(pm: PreparedMixture, targetIndex: number, removalFraction: number, maxDoseGPerL = MAX_DOSE_G_PER_L): DoseResult {
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
  const lnKeep = Math.log1p(-removalFraction);
  let warm: { u: number; theta: number } | undefined;
  let evaluations = 0;
  let last: BatchSolution | undefined;
  const g = (lnD: number) => {
    const s = solveBatchPrepared(pm, Math.exp(lnD), warm);
    warm = s.state;
    last = s;
    evaluations++;
    return Math.log(s.cMgPerL[targetIndex]! / c0) - lnKeep;
  };
  const hi = Math.log(maxDoseGPerL);
  const gHi = g(hi);
  if (gHi > 0) {
    const reached = 1 - last!.cMgPerL[targetIndex]! / c0;
    throw new InputError(`the goal of ${fmtPct(removalFraction)} removal of "${id}" is not reached by any dose up to ${maxDoseGPerL * 1000} mg/L (it reaches ${fmtPct(reached)} there)`);
  }
  // Bracket from above: step down in ln D until removal falls below the goal.
  let b = hi, gb = gHi;
  let a = hi - 2.3;
  warm = undefined;
  let ga = g(a);
  const lo = Math.log(MIN_DOSE_G_PER_L);
  while (ga < 0) {
    b = a; gb = ga;
    if (a <= lo) throw new InputError(`the goal of ${fmtPct(removalFraction)} removal of "${id}" is already met below ${MIN_DOSE_G_PER_L * 1000} mg/L of carbon; check the inputs`);
    a = Math.max(lo, a - 4.6);
    ga = g(a);
  }
  const root = brentRoot(g, a, b, { fa: ga, fb: gb, xTol: 1e-12, what: `dose search for "${id}"` });
  const dose = Math.exp(root.x);
  const sol = solveBatchPrepared(pm, dose, warm);
  const removal = 1 - sol.cMgPerL[targetIndex]! / c0;
  if (!(Math.abs(removal - removalFraction) <= 1e-9 * Math.max(1, removalFraction) + 1e-12)) {
    throw new ComputationError(`dose search for "${id}" ended at ${fmtPct(removal)} instead of ${fmtPct(removalFraction)}`);
  }
  return { doseGPerL: dose, removalFraction: removal, solution: sol, evaluations: evaluations + 1 };
}

function fmtPct(f: number): string {
  return `${(f * 100).toPrecision(4)} %`;
}
