/**
 * Staggered parallel GAC filters: N equal filters share the flow and are replaced one at a time at
 * equal intervals, so at any moment their carbon ages are spread evenly over the run length T
 * (in bed volumes of one filter, BV = t/EBCT):
 *
 *   ages a_k = (φ + k)·T/N,  k = 0 … N−1,  phase φ ∈ (0, 1] since the last replacement
 *   blended c/c0(φ) = (1/N)·Σ_k c/c0_single(a_k)          (equal flows; a mass balance)
 *
 * Just before a replacement (φ = 1) the ages are T/N, 2T/N, …, T. The run length that meets a goal
 * is the largest T for which the blend meets it at every phase (the worst phase is searched on a
 * grid of phases, so displacement peaks with c/c0 > 1 are handled too). Averaged over a cycle the
 * blend is (1/T)·∫₀^T c/c0 dBV, the run-averaged effluent of one filter.
 *
 * The goal may be a removal fraction (blend ≤ 1 − removal), an effluent limit (blend ≤ limit/c0),
 * or the indicator rule of SR 814.201.231 (the arithmetic mean of the blended removals of the
 * indicator compounds ≥ the goal; src/indicators/indicatorRule.ts). The common-practice picture
 * of staggered beds; the formulas are mass balances of the mixed effluent (closed form).
 *
 * Units: bed volumes (dimensionless), c/c0 and removals as fractions.
 * @throws InputError for N < 1 or not an integer, a run length ≤ 0, or a goal outside its range;
 *   ComputationError when a run length needs the curve beyond its end
 */
import { InputError } from '../core/errors.js';
import { evaluateIndicatorSet, type IndicatorCategory } from '../indicators/indicatorRule.js';
import { curveAt, curveEnd, curveIntegral, type BreakthroughCurve } from './breakthroughCurve.js';

/** Phases per cycle on which the worst blend is searched (plus φ = 1 itself). */
export const PHASES_PER_CYCLE = 48;

function checkFilters(filters: number): void {
  if (!Number.isInteger(filters) || filters < 1) throw new InputError(`expected a whole number of filters ≥ 1, got ${filters}`, { path: 'filters' });
}

/** Carbon ages (BV) of the N filters at phase φ ∈ (0, 1] of a cycle of run length T. */
export function filterAges(filters: number, runBedVolumes: number, phase: number): number[] {
  checkFilters(filters);
  if (!(runBedVolumes > 0)) throw new InputError(`expected a run length > 0 bed volumes, got ${runBedVolumes}`, { path: 'runBedVolumes' });
  return Array.from({ length: filters }, (_, k) => ((phase + k) * runBedVolumes) / filters);
}

/** Blended c/c0 of N staggered filters at phase φ (mean of the single filter's outlet at the N ages). */
export function blendedOutlet(curve: BreakthroughCurve, filters: number, runBedVolumes: number, phase: number): number {
  checkFilters(filters);
  if (!(runBedVolumes > 0)) throw new InputError(`expected a run length > 0 bed volumes, got ${runBedVolumes}`, { path: 'runBedVolumes' });
  let s = 0;
  for (let k = 0; k < filters; k++) s += curveAt(curve, ((phase + k) * runBedVolumes) / filters); // the ages of filterAges, without the array
  return s / filters;
}

/** The blend over one cycle at phases k/PHASES_PER_CYCLE, k = 1 … PHASES_PER_CYCLE. */
export function blendOverCycle(curve: BreakthroughCurve, filters: number, runBedVolumes: number): { phase: number[]; cOverC0: number[] } {
  const phase: number[] = [], c: number[] = [];
  for (let k = 1; k <= PHASES_PER_CYCLE; k++) {
    phase.push(k / PHASES_PER_CYCLE);
    c.push(blendedOutlet(curve, filters, runBedVolumes, k / PHASES_PER_CYCLE));
  }
  return { phase, cOverC0: c };
}

/** Highest blended c/c0 over a cycle. */
export function worstBlend(curve: BreakthroughCurve, filters: number, runBedVolumes: number): number {
  return Math.max(...blendOverCycle(curve, filters, runBedVolumes).cOverC0);
}

/** Run-averaged removal 1 − (1/T)·∫₀^T c/c0 dBV (equal for one filter and for the staggered blend). */
export function runAveragedRemoval(curve: BreakthroughCurve, runBedVolumes: number): number {
  if (!(runBedVolumes > 0)) throw new InputError(`expected a run length > 0 bed volumes, got ${runBedVolumes}`, { path: 'runBedVolumes' });
  return 1 - curveIntegral(curve, runBedVolumes) / runBedVolumes;
}

export interface RunLength {
  /** Longest run (BV of one filter) that meets the goal at every phase; null when even the shortest run checked fails. */
  bedVolumes: number | null;
  /** True when the goal is still met at the end of the simulated curve (the run length is at least `bedVolumes`). */
  atCurveEnd: boolean;
}

/**
 * Largest T ≤ the curve's end with `meets(T)` true for all shorter runs on the search grid: the
 * grid is the curve's own bed volumes, then bisection to a relative 1e-6 between the last passing
 * and the first failing grid point.
 */
function longestRun(end: number, grid: readonly number[], meets: (t: number) => boolean): RunLength {
  let pass = 0;
  for (const t of grid) {
    if (t <= 0) continue;
    if (meets(t)) { pass = t; continue; }
    let lo = pass, hi = t;
    while (hi - lo > 1e-6 * hi) {
      const mid = 0.5 * (lo + hi);
      if (meets(mid)) lo = mid; else hi = mid;
    }
    return { bedVolumes: lo > 0 ? lo : null, atCurveEnd: false };
  }
  return { bedVolumes: end, atCurveEnd: true };
}

/**
 * Run length of N staggered filters for one compound whose blended c/c0 must stay at or below
 * `maxCOverC0` (1 − removal goal, or limit/c0).
 */
export function runLengthForCompound(curve: BreakthroughCurve, filters: number, maxCOverC0: number): RunLength {
  checkFilters(filters);
  if (!(maxCOverC0 > 0) || !Number.isFinite(maxCOverC0)) throw new InputError(`expected an allowed c/c0 > 0, got ${maxCOverC0}`, { path: 'maxCOverC0' });
  return longestRun(curveEnd(curve), curve.bedVolumes, (t) => worstBlend(curve, filters, t) <= maxCOverC0);
}

/** Allowed outlet c/c0 from a removal goal (fraction 0–1) or an effluent limit (mg/L, with c0 in mg/L). */
export function allowedCOverC0(goal: { removalFraction: number } | { limitMgPerL: number; c0MgPerL: number }): number {
  if ('removalFraction' in goal) {
    if (!(goal.removalFraction > 0 && goal.removalFraction < 1)) throw new InputError(`expected a removal goal between 0 and 1 (fraction), got ${goal.removalFraction}`, { path: 'removalFraction' });
    return 1 - goal.removalFraction;
  }
  if (!(goal.limitMgPerL > 0) || !(goal.c0MgPerL > 0)) throw new InputError(`expected a positive limit and feed concentration, got ${goal.limitMgPerL} and ${goal.c0MgPerL} mg/L`, { path: 'limitMgPerL' });
  return goal.limitMgPerL / goal.c0MgPerL;
}

export interface IndicatorCurve {
  id: string;
  category: IndicatorCategory;
  curve: BreakthroughCurve;
}

/** Lowest indicator mean removal (percent, SR 814.201.231 Art. 3) of the blend over a cycle of run length T. */
export function worstIndicatorMean(indicators: readonly IndicatorCurve[], filters: number, runBedVolumes: number): number {
  let worst = Infinity;
  for (let k = 1; k <= PHASES_PER_CYCLE; k++) {
    const phase = k / PHASES_PER_CYCLE;
    const ev = evaluateIndicatorSet(indicators.map((x) => ({ id: x.id, category: x.category, removalPercent: 100 * (1 - blendedOutlet(x.curve, filters, runBedVolumes, phase)) })));
    worst = Math.min(worst, ev.meanRemovalPercent);
  }
  return worst;
}

/**
 * Run length of N staggered filters at which the mean blended removal of the indicator compounds
 * still reaches `goalPercent` at every phase.
 * @throws InputError when the indicator set is not admissible (≥ 6 substances, 2:1) or empty
 */
export function runLengthForIndicators(indicators: readonly IndicatorCurve[], filters: number, goalPercent: number): RunLength {
  checkFilters(filters);
  if (!(goalPercent > 0 && goalPercent < 100)) throw new InputError(`expected an indicator goal between 0 and 100 %, got ${goalPercent}`, { path: 'goalPercent' });
  const ev = evaluateIndicatorSet(indicators.map((x) => ({ id: x.id, category: x.category, removalPercent: 0 })));
  if (!ev.admissible) throw new InputError(`indicator set not admissible: ${ev.reason}`, { path: 'indicators' });
  const end = Math.min(...indicators.map((x) => curveEnd(x.curve)));
  const grid = indicators[0]!.curve.bedVolumes.filter((b) => b <= end);
  return longestRun(end, grid, (t) => worstIndicatorMean(indicators, filters, t) >= goalPercent);
}
