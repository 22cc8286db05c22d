/**
 * The one dose search of the design layer: the carbon dose at which a goal is just met, for
 * every caller (a compound's removal goal, the indicator mean, the daily doses, the Monte Carlo
 * draws, the `dose` command).
 *
 * The caller gives the excess e(D) = (what is reached at dose D) − (goal), non-decreasing in the
 * dose (removal rises with the dose in every removal model). The search works on x = ln D:
 *   1. bracketing from a hint: from ln(hint) (clamped to [ln D_min, ln D_max]) step up while
 *      e < 0, or down while e ≥ 0, with steps doubling from `firstStep` until e changes sign;
 *   2. Brent's method (src/numerics/brent.ts; Brent 1973) on the bracket, to |Δx| ≤ 1e-12
 *      (a relative dose error ≤ 1e-12).
 * A good hint (the dose at a nearby DOC scaled by DOC, or the previous draw) finds the bracket in
 * two or three evaluations; without one the search starts at 20 mg/L (common practice PAC doses
 * are 10–20 mg/L; common practice) with wide steps.
 *
 * Outcomes are statuses, not exceptions: 'met' with the dose; 'unreachable' when e < 0 at
 * D_max = 5 g/L; 'met below the smallest dose' when e ≥ 0 at D_min = 1e-12 g/L (1e-9 mg/L, below
 * anything a plant can meter). Units: doses g/L. Throws ComputationError if e is not finite or
 * Brent does not converge.
 */
import { ComputationError } from '../core/errors.js';
import { brentRoot } from '../numerics/brent.js';

/** Largest dose searched, g/L (5 g/L = 5000 mg/L, far above any practical PAC dose). */
export const MAX_DOSE_G_PER_L = 5;
/** Smallest dose searched, g/L (1 ng/L of carbon: below any dose a plant can meter). */
export const MIN_DOSE_G_PER_L = 1e-12;
/** Start without a hint, g/L (20 mg/L; common practice, see above). */
export const DEFAULT_DOSE_HINT_G_PER_L = 0.02;
/** Tolerance on ln D of the Brent step. */
export const LN_DOSE_TOLERANCE = 1e-12;

export type DoseSearchStatus = 'met' | 'unreachable' | 'met below the smallest dose';

export interface DoseSearchOutcome {
  status: DoseSearchStatus;
  /** Dose meeting the goal, g/L ('met'); D_max ('unreachable'); D_min ('met below the smallest dose'). */
  doseGPerL: number;
  /** Excess at that dose (≈ 0 when met; < 0 at D_max when unreachable). */
  excess: number;
  /** Calls of the excess function. */
  evaluations: number;
}

export interface DoseSearchOptions {
  /** A dose near the answer, g/L. */
  hintGPerL?: number;
  /** First bracketing step in ln D (default 0.05 with a hint, 1.5 without). */
  firstStep?: number;
  /** What is searched, for error messages. */
  what?: string;
}

/**
 * @param excess reached minus goal at a dose in g/L, non-decreasing in the dose
 * @throws ComputationError when the excess is not finite or the root search fails
 */
export function searchDose(excess: (doseGPerL: number) => number, options: DoseSearchOptions = {}): DoseSearchOutcome {
  const what = options.what ?? 'dose search';
  const lo = Math.log(MIN_DOSE_G_PER_L);
  const hi = Math.log(MAX_DOSE_G_PER_L);
  const hinted = options.hintGPerL !== undefined && options.hintGPerL > 0 && Number.isFinite(options.hintGPerL);
  let step = options.firstStep ?? (hinted ? 0.05 : 1.5);
  let evaluations = 0;
  const g = (x: number): number => {
    evaluations++;
    const v = excess(Math.exp(x));
    if (!Number.isFinite(v)) throw new ComputationError(`${what}: the goal's excess is not finite at ${Math.exp(x) * 1000} mg/L`);
    return v;
  };
  const x0 = Math.min(hi, Math.max(lo, Math.log(hinted ? options.hintGPerL! : DEFAULT_DOSE_HINT_G_PER_L)));
  let a = x0;
  let fa = g(a);
  let b = a;
  let fb = fa;
  if (fa < 0) {
    while (fb < 0) {
      if (b >= hi) return { status: 'unreachable', doseGPerL: MAX_DOSE_G_PER_L, excess: fb, evaluations };
      a = b; fa = fb;
      b = Math.min(hi, b + step); step *= 2;
      fb = g(b);
    }
  } else {
    while (fa >= 0) {
      if (a <= lo) return { status: 'met below the smallest dose', doseGPerL: MIN_DOSE_G_PER_L, excess: fa, evaluations };
      b = a; fb = fa;
      a = Math.max(lo, a - step); step *= 2;
      fa = g(a);
    }
  }
  if (fb === 0) return { status: 'met', doseGPerL: Math.exp(b), excess: 0, evaluations };
  const root = brentRoot(g, a, b, { fa, fb, xTol: LN_DOSE_TOLERANCE, what });
  return { status: 'met', doseGPerL: Math.exp(root.x), excess: root.fx, evaluations };
}
