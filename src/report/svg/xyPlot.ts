/**
 * An x–y plot as a standalone SVG string: linear or log axes, series as lines, dashed lines or
 * markers, uncertainty bands, horizontal and vertical reference lines, legend below the plot area.
 * Values that cannot be drawn (NaN, infinite, ≤ 0 on a log axis) are skipped and counted in a
 * note under the plot. Output is deterministic for a given spec and `uid`.
 */
import type { PlotSeries, XYPlotSpec } from '../../output/reportModel.js';
import { slug } from '../slug.js';
import { makeScale } from './axisScale.js';
import { LabelPlacer } from './labelPlacer.js';
import { seriesColour, seriesMarker, INK, type MarkerShape } from '../../output/palette.js';
import { planTimeAxis } from './timeTicks.js';
import { planAxis } from './planAxis.js';
import { FONT, PLOT_AREA_HEIGHT, PLOT_WIDTH, TICK } from './plotStyle.js';
import { type Frame, maxTickLabelWidth, renderXAxis, renderYAxis, X_AXIS_BAND } from './svgAxes.js';
import { renderBand } from './svgBand.js';
import { type LegendItem, layoutLegend, renderLegend } from './svgLegend.js';
import { renderRefLines } from './svgRefLines.js';
import { plural, renderNotes, svgOpen } from './svgRoot.js';
import { renderSeries } from './svgSeries.js';
import { r2 } from './svgNumber.js';
import { textWidth } from './textWidth.js';
import { thinRun } from './thinPolyline.js';
import { type BandRuns, bandRuns, validRuns, type ValidRuns } from './validRuns.js';

export interface PlotRenderOptions {
  /** Suffix making internal ids (clip paths) unique within one document; default from the plot id. */
  uid?: string;
}

/** SVG of an x–y plot. Never throws on odd data: what cannot be drawn is skipped and noted. */
export function renderXYPlot(spec: XYPlotSpec, opts: PlotRenderOptions = {}): string {
  const xLog = spec.xLog === true;
  const yLog = spec.yLog === true;
  const uid = slug(opts.uid ?? spec.id, 'plot');
  const series = spec.series.map((s) => ({
    s,
    runs: validRuns(s.points, xLog, yLog),
    band: s.band ? bandRuns(s.points, s.band.lower, s.band.upper, xLog, yLog) : undefined,
  }));

  // Extents: data, bands and reference lines that can sit on the axes.
  const xv: number[] = [];
  const yv: number[] = [];
  for (const { runs, band } of series) {
    for (const run of runs.runs) for (let i = 0; i < run.length; i++) (xv.push(run[i]![0]), yv.push(run[i]![1]));
    for (const b of band?.runs ?? []) for (let i = 0; i < b.x.length; i++) (xv.push(b.x[i]!), yv.push(b.lower[i]!, b.upper[i]!));
  }
  const hasData = xv.length > 0;
  const ok = (v: number, log: boolean) => Number.isFinite(v) && (!log || v > 0);
  if (hasData || (spec.vLines?.length ?? 0) + (spec.hLines?.length ?? 0) > 0) {
    for (const v of spec.vLines ?? []) if (ok(v.x, xLog)) xv.push(v.x);
    for (const h of spec.hLines ?? []) if (ok(h.y, yLog)) yv.push(h.y);
  }
  const xPlan = spec.xTime ? planTimeAxis(xv, spec.xRange) : planAxis(xv, { log: xLog, fixed: spec.xRange, targetTicks: 7 });
  const yPlan = planAxis(yv, { log: yLog, fixed: spec.yRange, targetTicks: 6 });

  // Layout.
  const titleX = 6 + FONT.axis;
  const left = Math.round(titleX + 10 + maxTickLabelWidth(yPlan.ticks) + TICK.length + TICK.gap);
  const lastX = [...xPlan.ticks].reverse().find((t) => t.label);
  const right = Math.max(18, lastX ? textWidth(lastX.label!, FONT.tick) / 2 + 6 : 0);
  const frame: Frame = { left, top: 14, width: PLOT_WIDTH - left - right, height: PLOT_AREA_HEIGHT };
  const xs = makeScale(xPlan.domain, [frame.left, frame.left + frame.width], xLog);
  const ys = makeScale(yPlan.domain, [frame.top + frame.height, frame.top], yLog);

  // long lines thinned to the pixel columns (the tables keep every point)
  for (const e of series) if (e.s.style !== 'points') e.runs.runs = e.runs.runs.map((r) => thinRun(r, xs, frame.width) as Array<[number, number]>);

  const legendItems: LegendItem[] = [];
  series.forEach(({ s, runs }, i) => {
    const kind = s.style === 'points' ? 'points' : s.style === 'dashed' ? 'dashed' : 'line';
    const empty = runs.runs.length === 0;
    const dash = kind === 'points' ? '' : (dashOf(s, i) ?? '');
    legendItems.push({ name: empty ? `${s.name} (no data)` : s.name, colour: colourOf(s, i), kind, marker: markerOf(s, i), ...(dash ? { dash } : {}), ...(s.marker && kind !== 'points' ? { lineMarker: true } : {}), ...(s.emphasis ? { emphasis: true } : {}) });
    if (s.band?.label) legendItems.push({ name: s.band.label, colour: colourOf(s, i), kind: 'band' });
  });
  const legendTop = frame.top + frame.height + X_AXIS_BAND + 4;
  const legend = layoutLegend(legendItems, frame.left, legendTop, PLOT_WIDTH - frame.left - 8);

  // Data as soft obstacles for reference-line labels.
  const placer = new LabelPlacer(PLOT_WIDTH, frame.top + frame.height + 10);
  const hasRef = (spec.hLines?.length ?? 0) + (spec.vLines?.length ?? 0) > 0;
  for (const { s, runs } of hasRef ? series : []) {
    for (const run of runs.runs) {
      let qx = NaN;
      let qy = NaN;
      for (let i = 0; i < run.length; i++) {
        const px = xs.map(run[i]![0]);
        const py = ys.map(run[i]![1]);
        placer.reservePoint(px, py);
        if (i > 0 && s.style !== 'points') placer.reserveSegment(qx, qy, px, py);
        qx = px;
        qy = py;
      }
    }
  }
  const ref = renderRefLines({ hLines: spec.hLines ?? [], vLines: spec.vLines ?? [] }, frame, xs, ys, placer);

  const notes = skipNotes(series.map((e) => e.runs), series.map((e) => e.band), xLog || yLog);
  if (ref.outside.length) notes.push(`Outside the plotted range, not drawn: ${ref.outside.join('; ')}.`);
  const noteBlock = renderNotes(notes, frame.left, legendTop + legend.height + 2, PLOT_WIDTH - frame.left - 8);
  const height = legendTop + legend.height + noteBlock.height + 8;

  const clipId = `clip-${uid}`;
  const pad = 5;
  const xAxis = renderXAxis(frame, { scale: xs, ticks: xPlan.ticks, label: spec.xLabel });
  const yAxis = renderYAxis(frame, { scale: ys, ticks: yPlan.ticks, label: spec.yLabel, titleX });
  const bands = series.map(({ s, band }, i) => (band ? renderBand(band.runs, colourOf(s, i), i, xs, ys) : '')).join('');
  // points above lines, and the emphasised series above the others
  const order = series.map((e, i) => ({ e, i })).sort((a, b) => Number(a.e.s.style === 'points') - Number(b.e.s.style === 'points') || Number(a.e.s.emphasis === true) - Number(b.e.s.emphasis === true));
  const drawn = order
    .map(({ e, i }) => {
      const d = dashOf(e.s, i);
      return renderSeries(e.runs.runs, e.s.style ?? 'line', colourOf(e.s, i), markerOf(e.s, i), i, xs, ys, {
        ...(d !== undefined ? { dash: d } : {}), ...(e.s.emphasis ? { emphasis: true } : {}), ...(e.s.marker ? { markLine: true } : {}), ...(e.s.key !== undefined ? { key: e.s.key } : {}),
      });
    })
    .join('');
  const emptyMsg = hasData
    ? ''
    : `<text x="${r2(frame.left + frame.width / 2)}" y="${r2(frame.top + frame.height / 2)}" text-anchor="middle" fill="${INK.muted}" font-size="${FONT.axis}">No data to plot</text>`;

  return [
    svgOpen(spec.id, spec.title, describe(spec), height),
    `<defs><clipPath id="${clipId}"><rect x="${r2(frame.left - pad)}" y="${r2(frame.top - pad)}" width="${r2(frame.width + 2 * pad)}" height="${r2(frame.height + 2 * pad)}"/></clipPath></defs>`,
    `<rect class="plot-area" x="${r2(frame.left)}" y="${r2(frame.top)}" width="${r2(frame.width)}" height="${r2(frame.height)}" fill="#ffffff"/>`,
    xAxis.grid,
    yAxis.grid,
    `<g clip-path="url(#${clipId})">${bands}${ref.lines}${drawn}</g>`,
    xAxis.axis,
    yAxis.axis,
    ref.labels,
    emptyMsg,
    renderLegend(legend),
    noteBlock.svg,
    '</svg>',
  ].join('');
}

/** A series' colour: its own, or the palette's by position. */
function colourOf(s: PlotSeries, i: number): string {
  return s.colour ?? seriesColour(i);
}

/** A series' marker: its own, or the shapes' by position. */
function markerOf(s: PlotSeries, i: number): MarkerShape {
  return s.marker ?? seriesMarker(i);
}

/** A series' dash pattern: its own; none for a series with its own colour (it needs no cycle dash); else by position. */
function dashOf(s: PlotSeries, i: number): string | undefined {
  if (s.dash !== undefined) return s.dash;
  if (s.colour !== undefined) return s.style === 'dashed' ? '7 4' : '';
  return undefined;
}

/** Notes on skipped values, e.g. "3 points at or below zero omitted (log axis)". */
function skipNotes(runs: ValidRuns[], bands: Array<BandRuns | undefined>, anyLog: boolean): string[] {
  let nonFinite = 0;
  let nonPositive = 0;
  let bandNonFinite = 0;
  let bandNonPositive = 0;
  for (const r of runs) (nonFinite += r.nonFinite, nonPositive += r.nonPositive);
  for (const b of bands) if (b) (bandNonFinite += b.nonFinite, bandNonPositive += b.nonPositive);
  const notes: string[] = [];
  if (anyLog && nonPositive) notes.push(`${plural(nonPositive, 'point')} at or below zero omitted (log axis).`);
  if (nonFinite) notes.push(`${plural(nonFinite, 'point')} without a finite value omitted.`);
  if (anyLog && bandNonPositive) notes.push(`Band omitted at ${plural(bandNonPositive, 'point')} where a bound is at or below zero (log axis).`);
  if (bandNonFinite) notes.push(`Band omitted at ${plural(bandNonFinite, 'point')} without finite bounds.`);
  return notes;
}

/** Text description for screen readers. */
function describe(spec: XYPlotSpec): string {
  const axis = (label: string, log?: boolean) => `${label}${log ? ' (log scale)' : ''}`;
  const names = spec.series.map((s) => s.name).join(', ');
  return `x: ${axis(spec.xLabel, spec.xLog)}; y: ${axis(spec.yLabel, spec.yLog)}; series: ${names || 'none'}.`;
}
