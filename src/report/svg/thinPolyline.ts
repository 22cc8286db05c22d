/**
 * Thinning a long polyline to what a screen can show: the points of a run whose x rises are
 * grouped by pixel column (of the x scale), and each column keeps its first and last point and
 * the points with the smallest and largest y, in their original order (the "M4" reduction of
 * Jugel et al., VLDB 2014, from memory). The drawn line then covers the same pixels as the full
 * line: every vertical extent within a column and every join between columns are kept. Runs
 * shorter than `minPoints`, or whose x does not rise, are returned unchanged. Tables keep every
 * value; only the drawing is thinned.
 */
import type { AxisScale } from './axisScale.js';

/** Runs longer than this many points per pixel column of the plot width are thinned (4 = what M4 keeps). */
export const THIN_ABOVE_POINTS_PER_PIXEL = 4;

export function thinRun(run: ReadonlyArray<readonly [number, number]>, xs: AxisScale, widthPx: number): Array<readonly [number, number]> {
  if (run.length <= THIN_ABOVE_POINTS_PER_PIXEL * Math.max(1, widthPx)) return run.slice();
  for (let i = 1; i < run.length; i++) if (!(run[i]![0] >= run[i - 1]![0])) return run.slice();
  const out: Array<readonly [number, number]> = [];
  let i = 0;
  while (i < run.length) {
    const col = Math.floor(xs.map(run[i]![0]));
    let j = i, lo = i, hi = i;
    while (j + 1 < run.length && Math.floor(xs.map(run[j + 1]![0])) === col) {
      j++;
      if (run[j]![1] < run[lo]![1]) lo = j;
      if (run[j]![1] > run[hi]![1]) hi = j;
    }
    // first, the extremes in their order, last (each once)
    const keep = [i, Math.min(lo, hi), Math.max(lo, hi), j];
    let last = -1;
    for (const k of keep) if (k !== last && k > last) { out.push(run[k]!); last = k; }
    i = j + 1;
  }
  return out;
}
