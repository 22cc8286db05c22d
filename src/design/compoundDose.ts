/**
 * The carbon dose that meets one compound's goal on a removal model: the design layer's one dose
 * search (src/design/doseSearch.ts) on e(D) = ln(1 − R) − ln(c(D)/c0), warm-starting each solve
 * from the previous one; or, when the model solves its own inverse (`doseForRemoval`, e.g. the
 * batch IAST read at a fixed removal) and the dose lies within the searched range, that dose. Doses mg/L at this layer (g/L into the model).
 *
 * Statuses, never exceptions: 'met' (the dose and the removal reached there), 'met without
 * carbon' (a limit at or above the feed concentration: dose 0), 'met below the smallest dose'
 * (the goal holds at 1e-9 mg/L: dose 0), 'unreachable' (not met at 5000 mg/L: no dose),
 * 'report only' (a compound without a goal: no dose, so it never governs).
 * Throws ComputationError if a solve or the search fails, or the dose found misses the goal by
 * more than the model's `removalTolerance` (1e-9 by default).
 * Every result has the same fields (absent ones undefined, left out of JSON): one object layout
 * for the Monte Carlo's hot code, whatever the status.
 */
import { ComputationError } from '../core/errors.js';
import type { CompoundGoal } from './compoundGoal.js';
import { MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L, searchDose } from './doseSearch.js';
import { removalExcess } from './removalExcess.js';
import type { DoseAtRemoval, RemovalModel, WarmStart } from './removalModel.js';

export type CompoundDoseStatus = 'met' | 'met without carbon' | 'met below the smallest dose' | 'unreachable' | 'report only';

export interface CompoundDose {
  compoundId: string;
  status: CompoundDoseStatus;
  /** Dose that meets the goal, mg/L (0 when met without carbon or below the smallest dose; null when unreachable or report only). */
  doseMgPerL: number | null;
  /** Removal reached at that dose (fraction; at 5000 mg/L when unreachable; null when report only). */
  removalFraction: number | null;
  /** Why the goal is unreachable or needs no carbon. */
  message?: string;
}

/**
 * @param model       the removal model at the water's DOC
 * @param index       the compound's index in the model
 * @param goal        its goal
 * @param hintMgPerL  a dose near the answer (e.g. the dose at another DOC scaled by DOC)
 */
export function compoundDose(model: RemovalModel, index: number, goal: CompoundGoal, hintMgPerL?: number): CompoundDose {
  return compoundDoseSolved(model, index, goal, hintMgPerL).dose;
}

/**
 * `compoundDose` with what the model's inverse gave besides (the slope and solve state at the
 * dose, for hints); `warmStart` is a solve state of the compound near the answer (only a speed-up).
 */
export function compoundDoseSolved(model: RemovalModel, index: number, goal: CompoundGoal, hintMgPerL?: number, withSlope = false, warmStart?: WarmStart): { dose: CompoundDose; solved?: DoseAtRemoval } {
  const compoundId = model.compoundIds[index]!;
  if (goal.kind === 'none') return { dose: { compoundId, status: 'report only', doseMgPerL: null, removalFraction: null, message: `"${compoundId}" is reported only: it has no goal and does not govern the dose` }, solved: undefined };
  if (goal.removalFraction <= 0) {
    return { dose: { compoundId, status: 'met without carbon', doseMgPerL: 0, removalFraction: 0, message: `${goal.text} is met without carbon (c0 is already at or below it)` }, solved: undefined };
  }
  const direct = model.doseForRemoval?.(index, goal.removalFraction, warmStart, withSlope);
  if (direct && direct.doseGPerL >= MIN_DOSE_G_PER_L && direct.doseGPerL <= MAX_DOSE_G_PER_L) {
    // the model's inverse: the same root as the search below, without searching
    const reached = 1 - direct.remainingFraction;
    checkReached(model, compoundId, reached, goal.removalFraction, 'dose');
    return { dose: { compoundId, status: 'met', doseMgPerL: direct.doseGPerL * 1000, removalFraction: reached, message: undefined }, solved: direct };
  }
  return searchedDose(model, index, goal, hintMgPerL);
}

/**
 * The dose search of `compoundDoseSolved` (outside the searched doses, or a model without an
 * inverse), apart so that the direct path allocates none of its closures.
 */
function searchedDose(model: RemovalModel, index: number, goal: CompoundGoal, hintMgPerL: number | undefined): { dose: CompoundDose; solved?: DoseAtRemoval } {
  const compoundId = model.compoundIds[index]!;
  // outside the searched doses (or no inverse): the search gives the status and its message
  let warm: WarmStart;
  let lastDose = NaN;
  let lastRemaining = 1;
  const excess = (doseGPerL: number) => {
    const r = model.remaining(index, doseGPerL, warm);
    warm = r.warm;
    lastDose = doseGPerL;
    lastRemaining = r.remainingFraction;
    return removalExcess(lastRemaining, goal.removalFraction);
  };
  const opts: Parameters<typeof searchDose>[1] = { what: `dose search for "${compoundId}"` };
  if (hintMgPerL !== undefined && hintMgPerL > 0) opts.hintGPerL = hintMgPerL / 1000;
  const r = searchDose(excess, opts);
  const pct = (f: number) => `${(f * 100).toPrecision(4)} %`;
  if (r.status === 'unreachable') {
    const reached = 1 - model.remaining(index, MAX_DOSE_G_PER_L).remainingFraction;
    return { dose: { compoundId, status: 'unreachable', doseMgPerL: null, removalFraction: reached, message: `the goal of ${pct(goal.removalFraction)} removal of "${compoundId}" is not reached by any dose up to ${MAX_DOSE_G_PER_L * 1000} mg/L (it reaches ${pct(reached)} there)` }, solved: undefined };
  }
  if (r.status === 'met below the smallest dose') {
    return { dose: { compoundId, status: 'met below the smallest dose', doseMgPerL: 0, removalFraction: null, message: `the goal of ${pct(goal.removalFraction)} removal of "${compoundId}" is already met below ${MIN_DOSE_G_PER_L * 1000} mg/L of carbon` }, solved: undefined };
  }
  // Brent's answer is normally its last evaluation: reuse it rather than solve again
  const reached = 1 - (lastDose === r.doseGPerL ? lastRemaining : model.remaining(index, r.doseGPerL, warm).remainingFraction);
  checkReached(model, compoundId, reached, goal.removalFraction, 'dose search');
  return { dose: { compoundId, status: 'met', doseMgPerL: r.doseGPerL * 1000, removalFraction: reached, message: undefined }, solved: undefined };
}

/** Results made once at load with and without numbers (see requiredDoseAt.ts: layouts that a rare null mid-run does not change). */
const layoutPrimers: ReadonlyArray<{ dose: CompoundDose; solved?: DoseAtRemoval }> = [
  { dose: { compoundId: '', status: 'met', doseMgPerL: 1.5, removalFraction: 0.5, message: undefined }, solved: undefined },
  { dose: { compoundId: '', status: 'unreachable', doseMgPerL: null, removalFraction: null, message: '' }, solved: undefined },
];
void layoutPrimers;

/** The removal reached at the dose found must sit within the model's accuracy of the goal. @throws ComputationError */
function checkReached(model: RemovalModel, compoundId: string, reached: number, goal: number, what: string): void {
  const tol = model.removalTolerance ?? 1e-9;
  if (!(Math.abs(reached - goal) <= tol)) throw new ComputationError(`${what} for "${compoundId}" ended at a removal of ${reached} instead of ${goal} (off by ${Math.abs(reached - goal).toExponential(2)}, more than the model's accuracy ${tol.toExponential(0)})`);
}
