/**
 * Reference lines: horizontal goal or limit lines and vertical lines at a chosen dose, each with
 * its label placed inside the plot area where it collides with no other label and, when
 * possible, with no data.
 */
import { escapeHtml } from '../escapeHtml.js';
import type { AxisScale } from './axisScale.js';
import type { Frame } from './svgAxes.js';
import { type Box, LabelPlacer } from './labelPlacer.js';
import { INK } from '../../output/palette.js';
import { FONT } from './plotStyle.js';
import { inDomain } from './planAxis.js';
import { r2 } from './svgNumber.js';
import { textWidth } from './textWidth.js';

export interface RefLines {
  hLines: ReadonlyArray<{ y: number; label: string }>;
  vLines: ReadonlyArray<{ x: number; label: string }>;
}

export interface RenderedRefLines {
  /** Lines (to be clipped to the plot area). */
  lines: string;
  /** Labels (drawn on top, not clipped). */
  labels: string;
  /** Labels of the reference lines that fall outside the plotted range (not drawn). */
  outside: string[];
}

const PAD = 4;
const H = FONT.ref + 3;

function textAt(box: Box, anchorEnd: boolean, text: string): string {
  const x = anchorEnd ? box.x + box.w - 2 : box.x + 2;
  return `<text x="${r2(x)}" y="${r2(box.y + box.h - 4)}"${anchorEnd ? ' text-anchor="end"' : ''}>${escapeHtml(text)}</text>`;
}

/**
 * SVG of the reference lines over `frame`; `placer` already holds the data points as soft
 * obstacles. Vertical labels go at the top beside the line (right, else left, stepping down
 * when taken); horizontal labels at the right end above the line (else below, else left end).
 */
export function renderRefLines(ref: RefLines, frame: Frame, xs: AxisScale, ys: AxisScale, placer: LabelPlacer): RenderedRefLines {
  const lines: string[] = [];
  const labels: string[] = [];
  const outside: string[] = [];
  const right = frame.left + frame.width;
  const bottom = frame.top + frame.height;
  const dash = 'stroke-dasharray="9 3 2 3"';
  const bounds: Box = { x: frame.left, y: frame.top, w: frame.width, h: frame.height };
  const sortedV = [...ref.vLines].sort((a, b) => a.x - b.x);
  // the lines themselves are soft obstacles for all labels
  for (const v of sortedV) if (inDomain(v.x, xs.domain, xs.log)) placer.reserve({ x: xs.map(v.x) - 1.5, y: frame.top, w: 3, h: frame.height }, true);
  for (const h of ref.hLines) if (inDomain(h.y, ys.domain, ys.log)) placer.reserve({ x: frame.left, y: ys.map(h.y) - 1.5, w: frame.width, h: 3 }, true);
  const rows = Math.max(1, Math.floor((frame.height - 2 * PAD) / H));
  for (const v of sortedV) {
    if (!inDomain(v.x, xs.domain, xs.log)) {
      outside.push(v.label);
      continue;
    }
    const px = xs.map(v.x);
    lines.push(`M${r2(px)} ${r2(frame.top)}V${r2(bottom)}`);
    const w = textWidth(v.label, FONT.ref) + 4;
    const cands: Box[] = [];
    for (let row = 0; row < rows; row++) {
      const y = frame.top + PAD + row * H;
      cands.push({ x: px + PAD, y, w, h: H }, { x: px - PAD - w, y, w, h: H });
    }
    const i = placer.place(cands, bounds);
    labels.push(textAt(cands[i]!, i % 2 === 1, v.label));
  }
  const sortedH = [...ref.hLines].sort((a, b) => b.y - a.y);
  for (const h of sortedH) {
    if (!inDomain(h.y, ys.domain, ys.log)) {
      outside.push(h.label);
      continue;
    }
    const py = ys.map(h.y);
    lines.push(`M${r2(frame.left)} ${r2(py)}H${r2(right)}`);
    const w = textWidth(h.label, FONT.ref) + 4;
    // right end, left end, then across the width; above the line, else below
    const xsAlong = [right - PAD - w, frame.left + PAD];
    for (const f of [0.75, 0.5, 0.25]) xsAlong.push(frame.left + frame.width * f - w / 2);
    const cands: Box[] = xsAlong.flatMap((x) => [
      { x, y: py - H - 1, w, h: H },
      { x, y: py + 1, w, h: H },
    ]);
    const i = placer.place(cands, bounds);
    labels.push(textAt(cands[i]!, i < 2, h.label));
  }
  return {
    lines: lines.length ? `<path class="ref-lines" d="${lines.join('')}" stroke="${INK.refLine}" stroke-width="1.3" ${dash} fill="none"/>` : '',
    labels: labels.length
      ? `<g class="ref-labels" font-size="${FONT.ref}" fill="${INK.refLine}" font-style="italic" stroke="#ffffff" stroke-width="3.5" stroke-linejoin="round" paint-order="stroke">${labels.join('')}</g>`
      : '',
    outside,
  };
}
