/**
 * Summary statistics of a daily series.
 *
 * Percentiles use linear interpolation between order statistics, definition 7 of Hyndman &
 * Fan (1996, The American Statistician 50(4):361–365), the default of R, NumPy and spreadsheet
 * PERCENTILE.INC: for sorted x_1..x_n, h = (n − 1)·p, Q(p) = x_⌊h⌋+1 + (h − ⌊h⌋)(x_⌊h⌋+2 − x_⌊h⌋+1).
 */
import { InputError } from '../core/errors.js';

/**
 * The p-quantile (0 ≤ p ≤ 1) of the values (Hyndman & Fan 1996, definition 7).
 * @throws InputError on an empty list or p outside [0, 1]
 */
export function quantile(values: readonly number[], p: number): number {
  if (values.length === 0) throw new InputError('no values; expected at least one', { path: 'values' });
  if (!(p >= 0 && p <= 1)) throw new InputError(`expected a probability between 0 and 1, got ${p}`, { path: 'p' });
  return sortedQuantile(sortedCopy(values), p);
}

/** An ascending copy (a typed-array sort: numeric, no comparator calls). */
function sortedCopy(values: readonly number[]): Float64Array {
  return Float64Array.from(values).sort();
}

/** Definition 7 on values already sorted ascending. */
function sortedQuantile(x: Float64Array, p: number): number {
  const h = (x.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, x.length - 1);
  return x[lo]! + (h - lo) * (x[hi]! - x[lo]!);
}

export function median(values: readonly number[]): number {
  return quantile(values, 0.5);
}

export interface SeriesSummary {
  n: number;
  min: number;
  max: number;
  mean: number;
  median: number;
  p90: number;
  sum: number;
}

/** n, min, max, mean, median, 90th percentile and sum of a series. */
export function summarise(values: readonly number[]): SeriesSummary {
  if (values.length === 0) throw new InputError('no values; expected at least one', { path: 'values' });
  let sum = 0, min = Infinity, max = -Infinity;
  for (const v of values) { sum += v; if (v < min) min = v; if (v > max) max = v; }
  const x = sortedCopy(values); // sorted once for both percentiles
  return { n: values.length, min, max, mean: sum / values.length, median: sortedQuantile(x, 0.5), p90: sortedQuantile(x, 0.9), sum };
}
