/**
 * Drawing one data series: a polyline per run of drawable points (solid or dashed), or markers
 * only. A run of a single point on a line series is drawn as a marker so it stays visible.
 */
import type { AxisScale } from './axisScale.js';
import { markerPath } from './markers.js';
import { cycleDash, type MarkerShape } from '../../output/palette.js';
import { r2 } from './svgNumber.js';
import { escapeHtml } from '../escapeHtml.js';

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
export interface SeriesDrawOptions {
  /** Dash pattern overriding the default of the style and position. */
  dash?: string;
  /** Heavier line and larger markers (the governing compound). */
  emphasis?: boolean;
  /** Put a few markers on a line (when the series has a marker of its own). */
  markLine?: boolean;
  /** data-key attribute (a compound id). */
  key?: string;
}

/** About `n` evenly spaced points of the runs (by index), offset by `shift` so series do not stack markers. */
function sparse(runs: ReadonlyArray<ReadonlyArray<readonly [number, number]>>, n: number, shift: number): Array<readonly [number, number]> {
  const all = runs.filter((r) => r.length > 1).flat();
  if (all.length === 0) return [];
  const step = Math.max(1, Math.floor(all.length / n));
  const out: Array<readonly [number, number]> = [];
  for (let k = Math.floor(step * ((shift % 5) + 1) / 6); k < all.length; k += step) out.push(all[k]!);
  return out;
}

export function renderSeries(
  runs: ReadonlyArray<ReadonlyArray<readonly [number, number]>>,
  style: SeriesStyle,
  colour: string,
  marker: MarkerShape,
  index: number,
  xs: AxisScale,
  ys: AxisScale,
  opts: SeriesDrawOptions = {},
): string {
  const parts: string[] = [];
  const big = opts.emphasis ? 1.3 : 1;
  if (style === 'points') {
    const d = markersPath(runs.flat(), marker, 8.5 * big, xs, ys);
    if (d) parts.push(`<path d="${d}" fill="${colour}" stroke="#ffffff" stroke-width="0.9"/>`);
  } else {
    const d = polylinePath(runs, xs, ys);
    if (d) {
      const pattern = opts.dash ?? (cycleDash(index) || (style === 'dashed' ? '7 4' : ''));
      const dash = pattern ? ` stroke-dasharray="${pattern}"` : '';
      parts.push(`<path d="${d}" fill="none" stroke="${colour}" stroke-width="${opts.emphasis ? 3.8 : 2.2}" stroke-linejoin="round" stroke-linecap="round"${dash}/>`);
      if (opts.markLine) {
        const m = markersPath(sparse(runs, 5, index), marker, 7.5 * big, xs, ys);
        if (m) parts.push(`<path class="line-markers" d="${m}" fill="${colour}" stroke="#ffffff" stroke-width="0.8"/>`);
      }
    }
    const singles = runs.filter((r) => r.length === 1).map((r) => r[0]!);
    if (singles.length) parts.push(`<path d="${markersPath(singles, marker, 7 * big, xs, ys)}" fill="${colour}"/>`);
  }
  const attrs = `data-colour="${colour}" data-marker="${marker}"${opts.key !== undefined ? ` data-key="${escapeHtml(opts.key)}"` : ''}${opts.emphasis ? ' data-emphasis="true"' : ''} data-series="${index}"`;
  return parts.length ? `<g class="series" ${attrs}>${parts.join('')}</g>` : '';
}
