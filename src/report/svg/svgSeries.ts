/**
 * Drawing one data series: a polyline per run of drawable points (solid or dashed), or markers
 * only. A run of a single point on a line series is drawn as a marker so it stays visible.
 */
import type { AxisScale } from './axisScale.js';
import { markerPath } from './markers.js';
import { cycleDash, type MarkerShape } from './palette.js';
import { r2 } from './svgNumber.js';

export type SeriesStyle = 'line' | 'points' | 'dashed';

/** Polyline path data of the runs with ≥ 2 points ("M x y L x y x y …", one sub-path per run). */
export function polylinePath(runs: ReadonlyArray<ReadonlyArray<readonly [number, number]>>, xs: AxisScale, ys: AxisScale): string {
  const d: string[] = [];
  for (const run of runs) {
    if (run.length < 2) continue;
    d.push(`M${run.map(([x, y], i) => `${i === 1 ? 'L' : ''}${r2(xs.map(x))} ${r2(ys.map(y))}`).join(' ')}`);
  }
  return d.join('');
}

/** Path data of markers at `points`. */
export function markersPath(points: Iterable<readonly [number, number]>, shape: MarkerShape, size: number, xs: AxisScale, ys: AxisScale): string {
  const d: string[] = [];
  for (const [x, y] of points) d.push(markerPath(shape, xs.map(x), ys.map(y), size));
  return d.join('');
}

/**
 * SVG of one series (empty string when nothing is drawable). The element(s) carry
 * `data-series="index"` so tests and readers can find each series.
 */
export function renderSeries(
  runs: ReadonlyArray<ReadonlyArray<readonly [number, number]>>,
  style: SeriesStyle,
  colour: string,
  marker: MarkerShape,
  index: number,
  xs: AxisScale,
  ys: AxisScale,
): string {
  const parts: string[] = [];
  if (style === 'points') {
    const d = markersPath(runs.flat(), marker, 8.5, xs, ys);
    if (d) parts.push(`<path d="${d}" fill="${colour}" stroke="#ffffff" stroke-width="0.9"/>`);
  } else {
    const d = polylinePath(runs, xs, ys);
    if (d) {
      const pattern = cycleDash(index) || (style === 'dashed' ? '7 4' : '');
      const dash = pattern ? ` stroke-dasharray="${pattern}"` : '';
      parts.push(`<path d="${d}" fill="none" stroke="${colour}" stroke-width="2.2" stroke-linejoin="round" stroke-linecap="round"${dash}/>`);
    }
    const singles = runs.filter((r) => r.length === 1).map((r) => r[0]!);
    if (singles.length) parts.push(`<path d="${markersPath(singles, marker, 7, xs, ys)}" fill="${colour}"/>`);
  }
  return parts.length ? `<g class="series" data-series="${index}">${parts.join('')}</g>` : '';
}
