/**
 * The data a report is drawn from. The pipeline fills it; the renderers (HTML, Markdown) only
 * lay it out, so the report never computes anything of its own.
 */

export interface ReportModel {
  title: string;
  subtitle?: string;
  /** ISO date-time of the run. */
  generatedAt: string;
  version: string;
  /** The cautions the tool shows, shown prominently. */
  cautions: string[];
  /** Cover block from the project file, in order. */
  cover?: CoverLine[];
  /** A few headline numbers (governing compound, dose, yearly cost …). */
  keyFigures: KeyFigure[];
  sections: ReportSection[];
}

export interface KeyFigure {
  label: string;
  value: string;
  note?: string;
}

export interface ReportSection {
  id: string;
  heading: string;
  paragraphs?: string[];
  tables?: ReportTable[];
  plots?: PlotSpec[];
  /** Warnings shown in this section (identifiability, poor fit, upper bounds …). */
  warnings?: string[];
  /** Small-print notes after the content (method notes). */
  notes?: string[];
  /** Paragraphs are a list of references (rendered as an ordered list). */
  referenceList?: boolean;
}

/** One line of the cover block (client, project number, author, checker, revision, date). */
export interface CoverLine {
  label: string;
  value: string;
}

export interface ReportTable {
  caption: string;
  columns: string[];
  rows: Array<Array<string | number>>;
}

export type PlotSpec = XYPlotSpec | BarPlotSpec | TornadoPlotSpec;

export interface XYPlotSpec {
  kind: 'xy';
  id: string;
  title: string;
  xLabel: string;
  yLabel: string;
  xLog?: boolean;
  yLog?: boolean;
  /** x values are dates as whole days since 1970-01-01 (UTC): the axis gets month ticks. */
  xTime?: boolean;
  /** Optional fixed axis ranges [min, max]. */
  xRange?: [number, number];
  yRange?: [number, number];
  series: PlotSeries[];
  /** Horizontal reference lines (goal, limit). */
  hLines?: Array<{ y: number; label: string }>;
  /** Vertical reference lines (chosen dose). */
  vLines?: Array<{ x: number; label: string }>;
}

export interface PlotSeries {
  name: string;
  points: Array<[number, number]>;
  /** line (default), points (markers only, e.g. measured data) or dashed line. */
  style?: 'line' | 'points' | 'dashed';
  /** Uncertainty band drawn behind the line: lower and upper y at the same x values as points. */
  band?: { lower: number[]; upper: number[]; label?: string };
  /** Fixed colour (a compound's own colour, or a neutral grey); default: by series position. */
  colour?: string;
  /** Fixed marker shape; when given, a line series also carries a few markers (grey-scale print). */
  marker?: 'circle' | 'square' | 'triangle' | 'diamond' | 'triangle-down' | 'pentagon' | 'hexagon' | 'star';
  /** Fixed dash pattern (SVG stroke-dasharray) of a line. */
  dash?: string;
  /** Drawn heavier (the governing compound). */
  emphasis?: boolean;
  /** What the series stands for (a compound id), written as data-key on the SVG group. */
  key?: string;
}

export interface BarPlotSpec {
  kind: 'bars';
  id: string;
  title: string;
  yLabel: string;
  categories: string[];
  /** Stacked segments; values[k] belongs to categories[k]. */
  stacks: Array<{ name: string; values: number[]; colour?: string }>;
  /** A narrow figure (one or two bars) instead of the full width. */
  compact?: boolean;
}

/**
 * A sensitivity ("tornado") figure: per input, the output at the input lowered and raised,
 * drawn as a bar from the base value; rows sorted by the caller (largest swing first).
 */
export interface TornadoPlotSpec {
  kind: 'tornado';
  id: string;
  title: string;
  /** Label of the output axis with its unit. */
  xLabel: string;
  base: number;
  /** Text of the base line, e.g. "point estimate 23.6 mg/L". */
  baseLabel: string;
  rows: Array<{ label: string; low: number; high: number }>;
  /** Legend names of the two bar colours, e.g. "input −20 %", "input +20 %". */
  lowName: string;
  highName: string;
}
