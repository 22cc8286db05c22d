/**
 * Uncertainty band: a filled polygon per run (upper bound left to right, lower bound back),
 * translucent so the line and the grid stay visible.
 */
import type { AxisScale } from './axisScale.js';
import { r2 } from './svgNumber.js';
import type { BandRun } from './validRuns.js';

/** Path data of the band polygons (a single-x run becomes a short vertical bar). */
export function bandPath(runs: readonly BandRun[], xs: AxisScale, ys: AxisScale): string {
  const d: string[] = [];
  for (const run of runs) {
    const n = run.x.length;
    if (n === 0) continue;
    if (n === 1) {
      const px = xs.map(run.x[0]!);
      d.push(`M${r2(px - 2)} ${r2(ys.map(run.upper[0]!))}H${r2(px + 2)}V${r2(ys.map(run.lower[0]!))}H${r2(px - 2)}Z`);
      continue;
    }
    const pts: string[] = [];
    for (let i = 0; i < n; i++) pts.push(`${r2(xs.map(run.x[i]!))} ${r2(ys.map(run.upper[i]!))}`);
    for (let i = n - 1; i >= 0; i--) pts.push(`${r2(xs.map(run.x[i]!))} ${r2(ys.map(run.lower[i]!))}`);
    d.push(`M${pts.join('L')}Z`);
  }
  return d.join('');
}

/** SVG of a band in `colour` (empty when nothing is drawable). */
export function renderBand(runs: readonly BandRun[], colour: string, index: number, xs: AxisScale, ys: AxisScale): string {
  const d = bandPath(runs, xs, ys);
  return d ? `<path class="band" data-band="${index}" d="${d}" fill="${colour}" fill-opacity="0.2" stroke="none"/>` : '';
}
