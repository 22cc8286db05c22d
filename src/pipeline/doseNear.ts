/**
 * Dose search started near a known answer: the root of h(ln D) = removal(D) − goal, where
 * removal rises with the dose, bracketed by stepping out from ln(guess) with doubling steps and
 * then solved by Brent's method (Brent 1973). Used for the daily doses, whose answers lie close
 * to the dose at the design DOC scaled by DOC (Zietzschmann et al. 2016): the bracket is found in
 * two or three evaluations instead of a sweep from 5 g/L, and each equilibrium is warm-started.
 *
 * Doses g/L. Returns status 'unreachable' when h < 0 at the largest dose searched and
 * 'below-min' when h ≥ 0 at the smallest; throws ComputationError if Brent fails.
 */
import { brentRoot } from '../numerics/brent.js';
import { MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L } from '../design/doseForRemoval.js';

export interface DoseNearResult {
  status: 'ok' | 'unreachable' | 'below-min';
  doseGPerL: number;
  evaluations: number;
}

/**
 * @param h         removal minus goal at a dose in g/L (increasing in the dose)
 * @param guessGPerL starting guess, g/L
 * @param what      description for error messages
 */
export function doseNear(h: (doseGPerL: number) => number, guessGPerL: number, what: string): DoseNearResult {
  const lo = Math.log(MIN_DOSE_G_PER_L), hi = Math.log(MAX_DOSE_G_PER_L);
  let evaluations = 0;
  const g = (x: number) => { evaluations++; return h(Math.exp(x)); };
  const x0 = Math.min(hi, Math.max(lo, Math.log(guessGPerL > 0 && Number.isFinite(guessGPerL) ? guessGPerL : 0.01)));
  let step = 0.03;
  let a = x0, fa = g(a), b: number, fb: number;
  if (fa < 0) {
    b = a; fb = fa;
    while (fb < 0) {
      if (b >= hi) return { status: 'unreachable', doseGPerL: MAX_DOSE_G_PER_L, evaluations };
      a = b; fa = fb;
      b = Math.min(hi, b + step); step *= 2;
      fb = g(b);
    }
  } else {
    b = a; fb = fa;
    while (fa >= 0) {
      if (a <= lo) return { status: 'below-min', doseGPerL: MIN_DOSE_G_PER_L, evaluations };
      b = a; fb = fa;
      a = Math.max(lo, a - step); step *= 2;
      fa = g(a);
    }
  }
  const root = brentRoot(g, a, b, { fa, fb, xTol: 1e-12, what });
  return { status: 'ok', doseGPerL: Math.exp(root.x), evaluations };
}
