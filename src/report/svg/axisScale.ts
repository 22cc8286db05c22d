/**
 * Mapping from data values to SVG coordinates along one axis, linear or log10.
 * Linear: p = r0 + (v − d0)/(d1 − d0)·(r1 − r0); log: the same in log10 v.
 */

export interface AxisScale {
  readonly domain: readonly [number, number];
  readonly range: readonly [number, number];
  readonly log: boolean;
  /** SVG coordinate of data value v (v > 0 on a log axis; callers filter first). */
  map(v: number): number;
}

/**
 * A scale from `domain` (d0 ≠ d1; both > 0 when `log`) onto `range` (SVG units; r0 > r1 is
 * allowed, as for a y axis that grows upwards). A degenerate domain maps everything to the middle.
 */
export function makeScale(domain: readonly [number, number], range: readonly [number, number], log: boolean): AxisScale {
  const t = log ? Math.log10 : (v: number) => v;
  const d0 = t(domain[0]);
  const d1 = t(domain[1]);
  const [r0, r1] = range;
  const span = d1 - d0;
  const k = span === 0 || !Number.isFinite(span) ? 0 : (r1 - r0) / span;
  const mid = (r0 + r1) / 2;
  return {
    domain: [domain[0], domain[1]],
    range: [r0, r1],
    log,
    map: k === 0 ? () => mid : (v: number) => r0 + (t(v) - d0) * k,
  };
}
