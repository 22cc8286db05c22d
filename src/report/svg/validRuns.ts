/**
 * Splitting a series into runs of drawable points. A point is skipped when a coordinate is not
 * finite (NaN, ±Infinity) or is zero/negative on a log axis; a line is broken at skipped points
 * rather than bridged across them.
 */

export interface SkipCounts {
  /** Points skipped because a coordinate was NaN or infinite. */
  nonFinite: number;
  /** Points skipped because a coordinate was ≤ 0 on a log axis. */
  nonPositive: number;
}

export interface ValidRuns extends SkipCounts {
  /** Consecutive drawable points, in data coordinates. */
  runs: Array<Array<[number, number]>>;
}

/** Why a single value cannot be drawn: 'nonFinite', 'nonPositive' or null (drawable). */
export function invalidReason(v: number, log: boolean): 'nonFinite' | 'nonPositive' | null {
  if (typeof v !== 'number' || !Number.isFinite(v)) return 'nonFinite';
  if (log && v <= 0) return 'nonPositive';
  return null;
}

/** Drawable runs of `points` on axes with the given log flags, with the skipped points counted. */
export function validRuns(points: ReadonlyArray<readonly [number, number]>, xLog: boolean, yLog: boolean): ValidRuns {
  const out: ValidRuns = { runs: [], nonFinite: 0, nonPositive: 0 };
  let run: Array<[number, number]> = [];
  for (const p of points) {
    const x = p[0];
    const y = p[1];
    const why = invalidReason(x, xLog) ?? invalidReason(y, yLog);
    if (why) {
      out[why]++;
      if (run.length) out.runs.push(run);
      run = [];
      continue;
    }
    run.push(p as [number, number]); // the point itself (runs are only read): no copy of a long series' points
  }
  if (run.length) out.runs.push(run);
  return out;
}

export interface BandRun {
  x: number[];
  lower: number[];
  upper: number[];
}

export interface BandRuns extends SkipCounts {
  runs: BandRun[];
}

/**
 * Drawable runs of an uncertainty band: x from `points`, lower/upper at the same index. An index
 * is skipped (and counted) when any of x, lower, upper cannot be drawn or lower/upper are missing
 * (missing counts as non-finite).
 */
export function bandRuns(
  points: ReadonlyArray<readonly [number, number]>,
  lower: readonly number[],
  upper: readonly number[],
  xLog: boolean,
  yLog: boolean,
): BandRuns {
  const out: BandRuns = { runs: [], nonFinite: 0, nonPositive: 0 };
  const runs = out.runs;
  let cur: BandRun = { x: [], lower: [], upper: [] };
  const flush = () => {
    if (cur.x.length) runs.push(cur);
    cur = { x: [], lower: [], upper: [] };
  };
  for (let i = 0; i < points.length; i++) {
    const x = points[i]![0];
    const lo = lower[i];
    const hi = upper[i];
    const why = lo === undefined || hi === undefined ? 'nonFinite' : invalidReason(x, xLog) ?? invalidReason(lo, yLog) ?? invalidReason(hi, yLog);
    if (why) {
      out[why]++;
      flush();
      continue;
    }
    cur.x.push(x);
    cur.lower.push(lo!);
    cur.upper.push(hi!);
  }
  flush();
  return out;
}
