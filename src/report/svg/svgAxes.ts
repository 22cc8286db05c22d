/**
 * Drawing the axes of an x–y plot: light grid, axis lines, ticks, tick labels (thinned when they
 * would collide) and axis titles with units.
 */
import { escapeHtml } from '../escapeHtml.js';
import type { AxisScale } from './axisScale.js';
import type { Tick } from './linearTicks.js';
import { INK } from '../../output/palette.js';
import { FONT, TICK } from './plotStyle.js';
import { r2 } from './svgNumber.js';
import { textWidth } from './textWidth.js';

/** The plot area in SVG units. */
export interface Frame {
  left: number;
  top: number;
  width: number;
  height: number;
}

/** Widest tick label of `ticks` at the tick font size. */
export function maxTickLabelWidth(ticks: readonly Tick[]): number {
  let w = 0;
  for (const t of ticks) if (t.label) w = Math.max(w, textWidth(t.label, FONT.tick));
  return w;
}

/**
 * Which labelled ticks keep their label: walking from the first, a label is kept when it does not
 * come within `gap` of the previous kept one. `pos` gives the centre, `size` the extent along the axis.
 */
export function thinLabels(ticks: readonly Tick[], pos: (v: number) => number, size: (t: Tick) => number, gap = 6): boolean[] {
  const keep = ticks.map(() => false);
  let lastEdge = -Infinity;
  const order = ticks.map((t, i) => ({ i, p: pos(t.value) })).sort((a, b) => a.p - b.p);
  for (const { i, p } of order) {
    const t = ticks[i]!;
    if (!t.label) continue;
    const half = size(t) / 2;
    if (p - half >= lastEdge + gap) {
      keep[i] = true;
      lastEdge = p + half;
    }
  }
  return keep;
}

/** Grid lines (drawn first, under everything) and the axis itself (line, ticks, labels, title). */
export interface AxisParts {
  grid: string;
  axis: string;
}

function gridPaths(major: string[], minor: string[]): string {
  return (
    (minor.length ? `<path class="grid-minor" d="${minor.join('')}" stroke="${INK.gridMinor}" fill="none"/>` : '') +
    (major.length ? `<path class="grid" d="${major.join('')}" stroke="${INK.grid}" fill="none"/>` : '')
  );
}

/** Axis title font size shrunk so that `text` fits `avail` (never below 9). */
function titleFontSize(text: string, avail: number): number {
  const w = textWidth(text, FONT.axis);
  return w <= avail ? FONT.axis : Math.max(9, Math.floor((FONT.axis * avail) / w));
}

/** Horizontal grid lines, ticks, tick labels and the rotated title of a y axis at frame.left. */
export function renderYAxis(frame: Frame, y: { scale: AxisScale; ticks: readonly Tick[]; label: string; titleX: number }): AxisParts {
  const right = frame.left + frame.width;
  const grid: string[] = [];
  const minorGrid: string[] = [];
  const marks: string[] = [];
  for (const t of y.ticks) {
    const py = r2(y.scale.map(t.value));
    (t.major ? grid : minorGrid).push(`M${r2(frame.left)} ${py}H${r2(right)}`);
    marks.push(`M${r2(frame.left)} ${py}h${-(t.major ? TICK.length : TICK.minorLength)}`);
  }
  const keep = thinLabels(y.ticks, (v) => -y.scale.map(v), () => FONT.tick + 2, 2);
  const labels: string[] = [];
  y.ticks.forEach((t, i) => {
    if (!keep[i]) return;
    labels.push(`<text x="${r2(frame.left - TICK.length - TICK.gap)}" y="${r2(y.scale.map(t.value))}" dy="0.35em" text-anchor="end">${escapeHtml(t.label ?? '')}</text>`);
  });
  const cy = frame.top + frame.height / 2;
  const fs = titleFontSize(y.label, frame.height + 40);
  return {
    grid: gridPaths(grid, minorGrid),
    axis: [`<path class="axis" d="M${r2(frame.left)} ${r2(frame.top)}V${r2(frame.top + frame.height)}${marks.join('')}" stroke="${INK.axis}" fill="none"/>`,
    `<g class="tick-labels" font-size="${FONT.tick}" fill="${INK.muted}">${labels.join('')}</g>`,
    `<text class="axis-title" x="${r2(y.titleX)}" y="${r2(cy)}" transform="rotate(-90 ${r2(y.titleX)} ${r2(cy)})" text-anchor="middle" font-size="${fs}" font-weight="600">${escapeHtml(y.label)}</text>`,
    ].join(''),
  };
}

/** Vertical grid lines, ticks, tick labels and title of an x axis along the frame bottom. */
export function renderXAxis(frame: Frame, x: { scale: AxisScale; ticks: readonly Tick[]; label: string }): AxisParts {
  const bottom = frame.top + frame.height;
  const grid: string[] = [];
  const minorGrid: string[] = [];
  const marks: string[] = [];
  for (const t of x.ticks) {
    const px = r2(x.scale.map(t.value));
    (t.major ? grid : minorGrid).push(`M${px} ${r2(frame.top)}V${r2(bottom)}`);
    marks.push(`M${px} ${r2(bottom)}v${t.major ? TICK.length : TICK.minorLength}`);
  }
  const keep = thinLabels(x.ticks, (v) => x.scale.map(v), (t) => textWidth(t.label ?? '', FONT.tick));
  const labels: string[] = [];
  x.ticks.forEach((t, i) => {
    if (!keep[i]) return;
    labels.push(`<text x="${r2(x.scale.map(t.value))}" y="${r2(bottom + TICK.length + TICK.gap + FONT.tick * 0.8)}" text-anchor="middle">${escapeHtml(t.label ?? '')}</text>`);
  });
  const titleY = bottom + TICK.length + TICK.gap + FONT.tick + 8 + FONT.axis * 0.8;
  const fs = titleFontSize(x.label, frame.width + 40);
  return {
    grid: gridPaths(grid, minorGrid),
    axis: [`<path class="axis" d="M${r2(frame.left)} ${r2(bottom)}H${r2(frame.left + frame.width)}${marks.join('')}" stroke="${INK.axis}" fill="none"/>`,
    `<g class="tick-labels" font-size="${FONT.tick}" fill="${INK.muted}">${labels.join('')}</g>`,
    `<text class="axis-title" x="${r2(frame.left + frame.width / 2)}" y="${r2(titleY)}" text-anchor="middle" font-size="${fs}" font-weight="600">${escapeHtml(x.label)}</text>`,
    ].join(''),
  };
}

/** Height below the plot area taken by x tick labels and the x axis title. */
export const X_AXIS_BAND = TICK.length + TICK.gap + FONT.tick + 8 + FONT.axis + 6;
