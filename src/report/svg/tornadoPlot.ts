/**
 * A sensitivity figure as a standalone SVG string: one row per input, a bar from the base value
 * to the output with the input lowered and another to the output with it raised, a vertical line
 * at the base value, and the two outputs written at the bar ends. Rows are drawn in the order
 * given (the caller sorts them, largest swing first).
 */
import type { TornadoPlotSpec } from '../../output/reportModel.js';
import { escapeHtml } from '../escapeHtml.js';
import { makeScale } from './axisScale.js';
import { INK } from '../../output/palette.js';
import { planAxis } from './planAxis.js';
import { FONT, PLOT_WIDTH } from './plotStyle.js';
import { type Frame, renderXAxis, X_AXIS_BAND } from './svgAxes.js';
import { fitText, layoutLegend, renderLegend } from './svgLegend.js';
import { svgOpen } from './svgRoot.js';
import { r2 } from './svgNumber.js';
import { textWidth } from './textWidth.js';

/** Bar colours: our own muted teal for "lowered" and ochre for "raised" (not compound colours). */
export const TORNADO_COLOURS = { low: '#3d7f8c', high: '#c08a2e' } as const;

const ROW_HEIGHT = 26;

/** Bar-end value: 3 significant digits, thousands grouped, never an exponent for everyday magnitudes. */
export function formatTornadoValue(v: number): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e12) return Number(v.toPrecision(3)).toLocaleString('en-US', { maximumSignificantDigits: 3 });
  return v.toExponential(2);
}

/** SVG of a tornado plot. Rows with a non-finite value are drawn without that bar. */
export function renderTornadoPlot(spec: TornadoPlotSpec): string {
  const labels = spec.rows.map((r) => fitText(r.label, 220, FONT.tick));
  const labelW = Math.max(60, ...labels.map((l) => textWidth(l, FONT.tick)));
  const values = [spec.base, ...spec.rows.flatMap((r) => [r.low, r.high])].filter(Number.isFinite);
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const pad = (hi - lo) * 0.12 || Math.abs(spec.base) * 0.1 || 1;
  const plan = planAxis([lo - pad, hi + pad], { targetTicks: 6 });
  const frame: Frame = { left: Math.round(labelW + 16), top: 10, width: 0, height: Math.max(1, spec.rows.length) * ROW_HEIGHT };
  frame.width = PLOT_WIDTH - frame.left - 32; // room for half of the last tick label
  const xs = makeScale(plan.domain, [frame.left, frame.left + frame.width], false);
  const bx = xs.map(spec.base);
  const bars: string[] = [];
  const texts: string[] = [];
  spec.rows.forEach((r, i) => {
    const y = frame.top + i * ROW_HEIGHT + 5;
    const h = ROW_HEIGHT - 10;
    texts.push(`<text x="${r2(frame.left - 8)}" y="${r2(y + h / 2)}" dy="0.35em" text-anchor="end">${escapeHtml(labels[i]!)}</text>`);
    for (const [v, colour, side] of [[r.low, TORNADO_COLOURS.low, 'low'], [r.high, TORNADO_COLOURS.high, 'high']] as const) {
      if (!Number.isFinite(v)) continue;
      const x = xs.map(v);
      const x0 = Math.min(x, bx);
      bars.push(`<rect data-row="${i}" data-side="${side}" data-value="${v}" x="${r2(x0)}" y="${r2(y)}" width="${r2(Math.max(0.8, Math.abs(x - bx)))}" height="${r2(h)}" fill="${colour}"/>`);
      const right = x >= bx;
      texts.push(`<text x="${r2(x + (right ? 4 : -4))}" y="${r2(y + h / 2)}" dy="0.35em" text-anchor="${right ? 'start' : 'end'}" font-size="${FONT.bar}" fill="${INK.muted}">${escapeHtml(formatTornadoValue(v))}</text>`);
    }
  });
  const axis = renderXAxis(frame, { scale: xs, ticks: plan.ticks, label: spec.xLabel });
  const legendTop = frame.top + frame.height + X_AXIS_BAND + 4;
  const legend = layoutLegend(
    [
      { name: spec.lowName, colour: TORNADO_COLOURS.low, kind: 'swatch' },
      { name: spec.highName, colour: TORNADO_COLOURS.high, kind: 'swatch' },
      { name: spec.baseLabel, colour: INK.refLine, kind: 'line' },
    ],
    frame.left, legendTop, PLOT_WIDTH - frame.left - 8,
  );
  const height = legendTop + legend.height + 8;
  const desc = `Sensitivity of ${spec.xLabel} to ${spec.rows.map((r) => r.label).join(', ')}; base ${spec.base}.`;
  return [
    svgOpen(spec.id, spec.title, desc, height),
    `<rect class="plot-area" x="${r2(frame.left)}" y="${r2(frame.top)}" width="${r2(frame.width)}" height="${r2(frame.height)}" fill="#ffffff"/>`,
    axis.grid,
    `<g class="series tornado-bars" data-series="0">${bars.join('')}</g>`,
    `<path class="base-line" d="M${r2(bx)} ${r2(frame.top - 4)}V${r2(frame.top + frame.height)}" stroke="${INK.refLine}" stroke-width="1.6"/>`,
    axis.axis,
    `<g class="row-labels" font-size="${FONT.tick}" fill="${INK.text}">${texts.join('')}</g>`,
    renderLegend(legend),
    '</svg>',
  ].join('');
}
