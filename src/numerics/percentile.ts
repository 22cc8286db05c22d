/**
 * Sample percentiles by linear interpolation between order statistics: Hyndman, R.J., Fan, Y.
 * (1996) "Sample quantiles in statistical packages", Am. Stat. 50(4):361–365, definition 7 (the
 * default of R's quantile() and of NumPy's percentile()):
 *   h = (N − 1)·p,  Q(p) = x₍⌊h⌋₎ + (h − ⌊h⌋)·(x₍⌊h⌋+1₎ − x₍⌊h⌋₎)   (0-based sorted x).
 * +Infinity entries (a goal unreachable in that draw) sort last and propagate: a percentile that
 * interpolates towards one is +Infinity.
 */
import { ComputationError, InputError } from '../core/errors.js';

export const PERCENTILE_METHOD = 'linear interpolation between order statistics, Hyndman & Fan (1996) type 7';

/** Percentile p (0 ≤ p ≤ 1) of values already sorted ascending. */
export function percentileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) throw new ComputationError('percentile of an empty sample');
  if (!(p >= 0 && p <= 1)) throw new InputError(`expected a percentile between 0 and 1, got ${p}`);
  const h = (n - 1) * p; // Hyndman & Fan 1996, definition 7
  const lo = Math.floor(h);
  const frac = h - lo;
  const xl = sorted[lo]!;
  if (frac === 0 || lo + 1 >= n) return xl;
  const xh = sorted[lo + 1]!;
  if (xh === Infinity) return Infinity;
  return xl + frac * (xh - xl);
}

/** Percentiles `ps` (fractions) of an unsorted sample; NaN in the sample is an error. */
export function percentiles(values: ArrayLike<number>, ps: readonly number[]): number[] {
  const sorted = Float64Array.from(values as ArrayLike<number>);
  for (let i = 0; i < sorted.length; i++) if (Number.isNaN(sorted[i]!)) throw new ComputationError('percentile of a sample containing NaN');
  sorted.sort();
  return ps.map((p) => percentileSorted(sorted, p));
}
