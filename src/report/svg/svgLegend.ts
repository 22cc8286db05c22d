/**
 * Legend placed below the plot area (so it can never cover data), flowing into as many rows as
 * the width needs. Each entry shows the series as drawn: line, dashed line, marker or band swatch.
 */
import { escapeHtml } from '../escapeHtml.js';
import { markerPath } from './markers.js';
import type { MarkerShape } from '../../output/palette.js';
import { FONT } from './plotStyle.js';
import { r2 } from './svgNumber.js';
import { textWidth } from './textWidth.js';

export interface LegendItem {
  name: string;
  colour: string;
  kind: 'line' | 'dashed' | 'points' | 'band' | 'swatch';
  marker?: MarkerShape;
  /** Dash pattern of the line swatch (overrides the default of 'dashed'). */
  dash?: string;
  /** A line that also carries markers: the swatch shows the marker on the line. */
  lineMarker?: boolean;
  /** A heavier line (the governing compound). */
  emphasis?: boolean;
}

interface PlacedItem {
  item: LegendItem;
  x: number;
  y: number;
  text: string;
}

export interface LegendLayout {
  placed: PlacedItem[];
  height: number;
}

const SWATCH = 26;
const ROW = FONT.legend + 9;

/** Shorten `text` with an ellipsis so it fits `maxWidth` at the legend font size. */
export function fitText(text: string, maxWidth: number, fontSize: number = FONT.legend): string {
  if (textWidth(text, fontSize) <= maxWidth) return text;
  const chars = Array.from(text);
  while (chars.length > 1 && textWidth(`${chars.join('')}…`, fontSize) > maxWidth) chars.pop();
  return `${chars.join('')}…`;
}

/** Entries flowed left to right into rows no wider than `width`, starting at (left, top). */
export function layoutLegend(items: readonly LegendItem[], left: number, top: number, width: number): LegendLayout {
  const placed: PlacedItem[] = [];
  let x = 0;
  let row = 0;
  for (const item of items) {
    const text = fitText(item.name, width - SWATCH - 8);
    const w = SWATCH + 6 + textWidth(text, FONT.legend);
    if (x > 0 && x + w > width) {
      row++;
      x = 0;
    }
    placed.push({ item, x: left + x, y: top + row * ROW, text });
    x += w + 20;
  }
  return { placed, height: items.length ? (row + 1) * ROW : 0 };
}

/** SVG of a laid-out legend. */
export function renderLegend(layout: LegendLayout): string {
  if (!layout.placed.length) return '';
  const parts = layout.placed.map(({ item, x, y, text }) => {
    const cy = y + ROW / 2;
    const c = item.colour;
    let swatch: string;
    switch (item.kind) {
      case 'band':
        swatch = `<rect x="${r2(x)}" y="${r2(cy - 6)}" width="${SWATCH}" height="12" fill="${c}" fill-opacity="0.22" stroke="${c}" stroke-opacity="0.5"/>`;
        break;
      case 'swatch':
        swatch = `<rect x="${r2(x + 6)}" y="${r2(cy - 7)}" width="14" height="14" fill="${c}"/>`;
        break;
      case 'points':
        swatch = `<path d="${markerPath(item.marker ?? 'circle', x + SWATCH / 2, cy, 8)}" fill="${c}" stroke="#fff" stroke-width="0.8"/>`;
        break;
      default:
        swatch = `<path d="M${r2(x)} ${r2(cy)}h${SWATCH}" stroke="${c}" stroke-width="${item.emphasis ? 3.8 : 2.4}"${item.dash ? ` stroke-dasharray="${item.dash}"` : item.kind === 'dashed' && item.dash === undefined ? ' stroke-dasharray="7 4"' : ''} fill="none"/>`;
        if (item.lineMarker && item.marker) swatch += `<path d="${markerPath(item.marker, x + SWATCH / 2, cy, 7.5)}" fill="${c}" stroke="#fff" stroke-width="0.8"/>`;
    }
    const title = text === item.name ? '' : `<title>${escapeHtml(item.name)}</title>`;
    return `<g class="legend-item"${item.emphasis ? ' font-weight="bold"' : ''}>${title}${swatch}<text x="${r2(x + SWATCH + 6)}" y="${r2(cy)}" dy="0.35em">${escapeHtml(text)}</text></g>`;
  });
  return `<g class="legend" font-size="${FONT.legend}">${parts.join('')}</g>`;
}
