/**
 * The indicator-mean dose by Newton's method on ln D, for a fixed indicator set (the chosen set,
 * or all indicator compounds when they form an admissible set) on a model that gives the slope of
 * each compound's remaining fraction (`remainingWithSlope`). The goal is
 *   e(D) = 100·mean_i(1 − f_i(D)) − goal = 0   (percent).
 * Each step solves every compound at the current dose D_k (f_i and s_i = d ln f_i/d ln D), then
 * finds the root of the same mean with each ln f_i linear in ln D,
 *   f_i(D) ≈ f_i(D_k)·(D/D_k)^(s_i),
 * (cheap: no IAST solve; a Newton step that keeps the curvature of a power law, which a removal
 * curve nearly is). Steps stay inside the bracket found so far (e changes sign between its ends);
 * the iteration stops when a step is below 1e-6 in ln D (the outer iteration converges
 * quadratically, error after a step ≈ C·step² with C about 0.6 on the demo, so the dose is then
 * within about 1e-12 of the root: the root the dose search finds to |Δ ln D| ≤ 1e-12). Returns undefined whenever it cannot finish that way (a step
 * outside the bracket or the searched doses, no convergence in 30 steps): the caller then runs
 * the one dose search (doseSearch.ts), which also gives the statuses.
 * Units: doses g/L. Throws ComputationError only from the model's solves.
 */
import type { RemovalModel, WarmStart } from './removalModel.js';
import { DEFAULT_DOSE_HINT_G_PER_L, MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L } from './doseSearch.js';

/**
 * Root x = ln D of 100·mean_i(1 − exp(l_i + s_i·(x − x_i))) − goal, each compound's ln f linear in
 * ln D around its own point (x_i, l_i = ln f_i, slope s_i), by Newton's method on this smooth,
 * monotone function (s_i < 0); undefined when it does not converge.
 */
export function powerLawRoot(x0: number, xi: ArrayLike<number>, li: ArrayLike<number>, si: ArrayLike<number>, goalPercent: number): number | undefined {
  const n = li.length;
  let x = x0;
  for (let it = 0; it < 50; it++) {
    let mean = 0, slope = 0;
    for (let i = 0; i < n; i++) {
      const fi = Math.exp(li[i]! + si[i]! * (x - xi[i]!));
      mean += 1 - fi;
      slope -= fi * si[i]!;
    }
    const e = (100 * mean) / n - goalPercent;
    const de = (100 * slope) / n;
    if (!(de > 0) || !Number.isFinite(e)) return undefined;
    let step = -e / de;
    if (Math.abs(step) > 2) step = Math.sign(step) * 2;
    x += step;
    if (Math.abs(step) <= 1e-12) return x;
  }
  return undefined;
}

/**
 * @param set        indices (into the model) of the compounds averaged
 * @param goalPercent the goal of the mean removal, percent
 * @param warmStarts solve states by compound index (e.g. from nearby doses), only a speed-up
 * @returns the dose in g/L, or undefined (search instead)
 */
export function indicatorDoseNewton(model: RemovalModel, set: readonly number[], goalPercent: number, hintGPerL?: number, warmStarts?: ReadonlyArray<WarmStart>): number | undefined {
  if (!model.remainingWithSlope || set.length === 0) return undefined;
  const lo0 = Math.log(MIN_DOSE_G_PER_L), hi0 = Math.log(MAX_DOSE_G_PER_L);
  let x = Math.log(hintGPerL !== undefined && hintGPerL > 0 && Number.isFinite(hintGPerL) ? hintGPerL : DEFAULT_DOSE_HINT_G_PER_L);
  if (!(x > lo0 && x < hi0)) return undefined;
  let lo = lo0, hi = hi0; // leaving the searched doses means "search" (statuses)
  const warm: WarmStart[] = []; // by push: one array layout in every tier (designDose.ts)
  for (let k = 0; k < set.length; k++) warm.push(warmStarts?.[set[k]!]);
  // plain arrays: a Float64Array of more than 8 numbers is allocated outside the JS heap
  const xs = new Array<number>(set.length), l = new Array<number>(set.length), s = new Array<number>(set.length);
  for (let it = 0; it < 30; it++) {
    const D = Math.exp(x);
    let mean = 0;
    for (let k = 0; k < set.length; k++) {
      const r = model.remainingWithSlope(set[k]!, D, warm[k]);
      warm[k] = r.warm;
      l[k] = Math.log(r.remainingFraction);
      s[k] = r.slope;
      mean += 1 - r.remainingFraction;
    }
    const e = (100 * mean) / set.length - goalPercent;
    if (!Number.isFinite(e)) return undefined;
    if (e === 0) return D;
    if (e < 0) lo = x; else hi = x;
    xs.fill(x);
    const next = powerLawRoot(x, xs, l, s, goalPercent);
    if (next === undefined) return undefined;
    const step = next - x;
    if (!(next > lo && next < hi)) return undefined;
    if (Math.abs(step) <= 1e-6) return Math.exp(next);
    x = next;
  }
  return undefined;
}
