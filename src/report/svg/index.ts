/** SVG plot drawing of the report: our own axes, ticks, series, bands, reference lines, legends and bars. */
export { renderPlot } from './renderPlot.js';
export { renderXYPlot, type PlotRenderOptions } from './xyPlot.js';
export { renderBarPlot } from './barPlot.js';
export { renderTornadoPlot } from './tornadoPlot.js';
export { monthTicks, dayNumber } from './timeTicks.js';
export { linearTicks, niceNumber, type Tick, type LinearAxisTicks } from './linearTicks.js';
export { logTicks, logDomain } from './logTicks.js';
export { makeScale, type AxisScale } from './axisScale.js';
export { SERIES_COLOURS } from '../../output/palette.js';
