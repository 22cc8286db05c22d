/** Report renderers: the self-contained HTML report, the Markdown summary and their SVG plots. */
export type { ReportModel, KeyFigure, ReportSection, ReportTable, PlotSpec, XYPlotSpec, BarPlotSpec, PlotSeries } from '../output/reportModel.js';
export { renderHtmlReport } from './htmlReport.js';
export { renderMarkdownSummary } from './markdownSummary.js';
export { reportPlotIds } from './reportPlotIds.js';
export { DEFAULT_CAUTIONS } from './defaultCautions.js';
export { escapeHtml } from './escapeHtml.js';
export { escapeMarkdown } from './escapeMarkdown.js';
export { formatNumber } from '../output/formatNumber.js';
export * from './svg/index.js';
