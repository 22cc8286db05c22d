/**
 * The outer `<svg>` element of every plot: accessible (role="img", aria-label, `<title>`,
 * `<desc>`), findable (`class="plot"`, `data-plot-id`) and self-contained (fonts and colours as
 * attributes, no external references).
 */
import { escapeHtml } from '../escapeHtml.js';
import { INK } from '../../output/palette.js';
import { FONT, FONT_FAMILY, PLOT_WIDTH } from './plotStyle.js';
import { r2 } from './svgNumber.js';
import { fitText } from './svgLegend.js';

/** Opening tag with title and description, for a plot `height` units tall. */
export function svgOpen(plotId: string, title: string, desc: string, height: number, width: number = PLOT_WIDTH): string {
  const t = escapeHtml(title);
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" class="plot" role="img" aria-label="${t}" data-plot-id="${escapeHtml(plotId)}" ` +
    `viewBox="0 0 ${width} ${r2(height)}" width="${width}" height="${r2(height)}"${width !== PLOT_WIDTH ? ` style="max-width:${width}px"` : ''} ` +
    `font-family="${escapeHtml(FONT_FAMILY)}" font-size="${FONT.tick}" fill="${INK.text}">` +
    `<title>${t}</title><desc>${escapeHtml(desc)}</desc>`
  );
}

/** Small grey notes (one per line) starting at baseline `top`; returns SVG and the height used. */
export function renderNotes(notes: readonly string[], left: number, top: number, width: number): { svg: string; height: number } {
  if (!notes.length) return { svg: '', height: 0 };
  const lh = FONT.note + 5;
  const lines = notes.map(
    (n, i) => `<text x="${r2(left)}" y="${r2(top + (i + 1) * lh - 4)}">${escapeHtml(fitText(n, width, FONT.note))}</text>`,
  );
  return { svg: `<g class="plot-notes" font-size="${FONT.note}" fill="${INK.muted}" font-style="italic">${lines.join('')}</g>`, height: notes.length * lh + 2 };
}

/** Words for a count: "1 point", "3 points". */
export function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}
