/** One entry point for any plot of the report model. */
import type { PlotSpec } from '../../output/reportModel.js';
import { renderBarPlot } from './barPlot.js';
import { type PlotRenderOptions, renderXYPlot } from './xyPlot.js';

/** SVG of `spec` (x–y or stacked bars). */
export function renderPlot(spec: PlotSpec, opts: PlotRenderOptions = {}): string {
  return spec.kind === 'bars' ? renderBarPlot(spec) : renderXYPlot(spec, opts);
}
