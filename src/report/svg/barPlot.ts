/**
 * Stacked bar plot as a standalone SVG string (e.g. the fractions of DOC per fictive component,
 * per sample). Segments stack upwards from zero; a value that cannot be stacked (negative, NaN,
 * infinite, missing) is skipped and counted in a note. Segments tall enough carry their value.
 */
import type { BarPlotSpec } from '../../output/reportModel.js';
import { escapeHtml } from '../escapeHtml.js';
import { makeScale } from './axisScale.js';
import { INK, seriesColour, textOn } from '../../output/palette.js';
import { planAxis } from './planAxis.js';
import { COMPACT_WIDTH, FONT, PLOT_AREA_HEIGHT, PLOT_WIDTH, TICK } from './plotStyle.js';
import { type Frame, maxTickLabelWidth, renderYAxis } from './svgAxes.js';
import { type LegendItem, fitText, layoutLegend, renderLegend } from './svgLegend.js';
import { plural, renderNotes, svgOpen } from './svgRoot.js';
import { r2 } from './svgNumber.js';
import { textWidth } from './textWidth.js';

/** Value label of a segment: 3 significant digits, no exponent for everyday magnitudes. */
export function formatSegmentValue(v: number): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e9 || a < 1e-3) return v.toExponential(1);
  return Number(v.toPrecision(3)).toLocaleString('en-US', { maximumSignificantDigits: 3 }); // 297,669 → "298,000"
}

/** SVG of a stacked bar plot. Never throws on odd data: what cannot be drawn is skipped and noted. */
export function renderBarPlot(spec: BarPlotSpec): string {
  const nCat = spec.categories.length;
  let skipped = 0;
  const totals = new Array<number>(nCat).fill(0);
  const value = (k: number, c: number): number | null => {
    const v = spec.stacks[k]?.values[c];
    return typeof v === 'number' && Number.isFinite(v) && v >= 0 ? v : null;
  };
  for (let k = 0; k < spec.stacks.length; k++) {
    for (let c = 0; c < nCat; c++) {
      const v = value(k, c);
      if (v === null) skipped++;
      else totals[c]! += v;
    }
  }
  const maxTotal = Math.max(0, ...totals);
  const yPlan = planAxis(maxTotal > 0 ? [0, maxTotal] : [], { targetTicks: 6 });
  const width = spec.compact ? COMPACT_WIDTH : PLOT_WIDTH;
  const areaHeight = spec.compact ? Math.round(PLOT_AREA_HEIGHT * 0.75) : PLOT_AREA_HEIGHT;

  const titleX = 6 + FONT.axis;
  const catLabels = spec.categories.map((c) => fitText(c, 150, FONT.tick));
  const widest = Math.max(0, ...catLabels.map((c) => textWidth(c, FONT.tick)));
  const axisLeft = Math.round(titleX + 10 + maxTickLabelWidth(yPlan.ticks) + TICK.length + TICK.gap);
  const bandFor = (l: number) => (nCat > 0 ? (width - l - 16) / nCat : width - l - 16);
  const rotate = widest > bandFor(axisLeft) - 6;
  // a label rotated by 35° reaches widest·cos 35° left of its bar's centre left + band/2, band = (width − left − 16)/n:
  // left ≥ widest·cos 35° − band/2 + 6 solved for left keeps the first label inside the figure
  const n = Math.max(1, nCat);
  const reach = widest * Math.cos((35 * Math.PI) / 180);
  const left = rotate ? Math.max(axisLeft, Math.ceil((reach - (width - 16) / (2 * n) + 6) / (1 - 1 / (2 * n)))) : axisLeft;
  const frameWidth = width - left - 16;
  const band = bandFor(left);
  const barW = Math.min(72, band * 0.62);
  const catBand = rotate ? widest * 0.6 + 20 : FONT.tick + 14;
  const frame: Frame = { left, top: 14, width: frameWidth, height: areaHeight };
  const bottom = frame.top + frame.height;
  const ys = makeScale(yPlan.domain, [bottom, frame.top], false);

  const legendItems: LegendItem[] = spec.stacks.map((s, k) => ({
    name: s.values.some((_, c) => value(k, c) !== null && value(k, c)! > 0) ? s.name : `${s.name} (no data)`,
    colour: s.colour ?? seriesColour(k),
    kind: 'swatch',
  }));
  const legendTop = bottom + catBand + 4;
  const legend = layoutLegend(legendItems, spec.compact ? 8 : frame.left, legendTop, width - (spec.compact ? 8 : frame.left) - 8);
  const notes = skipped ? [`${plural(skipped, 'value')} that cannot be stacked (negative or not a finite number) omitted.`] : [];
  const noteBlock = renderNotes(notes, frame.left, legendTop + legend.height + 2, width - frame.left - 8);
  const height = legendTop + legend.height + noteBlock.height + 8;

  const segs: string[] = [];
  const segLabels: string[] = [];
  const base = new Array<number>(nCat).fill(0);
  for (let k = 0; k < spec.stacks.length; k++) {
    const colour = spec.stacks[k]!.colour ?? seriesColour(k);
    const rects: string[] = [];
    for (let c = 0; c < nCat; c++) {
      const v = value(k, c);
      if (v === null || v === 0) continue;
      const cx = frame.left + band * (c + 0.5);
      const y0 = ys.map(base[c]!);
      const y1 = ys.map(base[c]! + v);
      base[c]! += v;
      rects.push(`<rect x="${r2(cx - barW / 2)}" y="${r2(y1)}" width="${r2(barW)}" height="${r2(Math.max(0.5, y0 - y1))}"/>`);
      const label = formatSegmentValue(v);
      if (y0 - y1 >= FONT.bar + 4 && textWidth(label, FONT.bar) <= barW - 4) {
        segLabels.push(`<text x="${r2(cx)}" y="${r2((y0 + y1) / 2)}" dy="0.35em" fill="${textOn(colour)}">${escapeHtml(label)}</text>`);
      }
    }
    if (rects.length) segs.push(`<g class="series" data-series="${k}" fill="${colour}" stroke="#ffffff" stroke-width="0.8">${rects.join('')}</g>`);
  }
  const cats = catLabels.map((c, i) => {
    const cx = frame.left + band * (i + 0.5);
    const y = bottom + TICK.gap + FONT.tick;
    return rotate
      ? `<text x="${r2(cx)}" y="${r2(y)}" text-anchor="end" transform="rotate(-35 ${r2(cx)} ${r2(y)})">${escapeHtml(c)}</text>`
      : `<text x="${r2(cx)}" y="${r2(y)}" text-anchor="middle">${escapeHtml(c)}</text>`;
  });
  const yAxis = renderYAxis(frame, { scale: ys, ticks: yPlan.ticks, label: spec.yLabel, titleX });
  const emptyMsg =
    maxTotal > 0
      ? ''
      : `<text x="${r2(frame.left + frame.width / 2)}" y="${r2(frame.top + frame.height / 2)}" text-anchor="middle" fill="${INK.muted}" font-size="${FONT.axis}">No data to plot</text>`;
  const desc = `Stacked bars; categories: ${spec.categories.join(', ') || 'none'}; stacks: ${spec.stacks.map((s) => s.name).join(', ') || 'none'}; y: ${spec.yLabel}.`;

  return [
    svgOpen(spec.id, spec.title, desc, height, width),
    `<rect class="plot-area" x="${r2(frame.left)}" y="${r2(frame.top)}" width="${r2(frame.width)}" height="${r2(frame.height)}" fill="#ffffff"/>`,
    yAxis.grid,
    segs.join(''),
    segLabels.length ? `<g class="segment-labels" font-size="${FONT.bar}" text-anchor="middle">${segLabels.join('')}</g>` : '',
    `<path class="axis" d="M${r2(frame.left)} ${r2(bottom)}H${r2(frame.left + frame.width)}" stroke="${INK.axis}" fill="none"/>`,
    yAxis.axis,
    `<g class="category-labels" font-size="${FONT.tick}" fill="${INK.text}">${cats.join('')}</g>`,
    emptyMsg,
    renderLegend(legend),
    noteBlock.svg,
    '</svg>',
  ].join('');
}
