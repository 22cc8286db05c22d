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
  /** The cautions of DESIGN.md, shown prominently. */
  cautions: string[];
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
}

export interface ReportTable {
  caption: string;
  columns: string[];
  rows: Array<Array<string | number>>;
}

export type PlotSpec = XYPlotSpec | BarPlotSpec;

export interface XYPlotSpec {
  kind: 'xy';
  id: string;
  title: string;
  xLabel: string;
  yLabel: string;
  xLog?: boolean;
  yLog?: boolean;
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
}

export interface BarPlotSpec {
  kind: 'bars';
  id: string;
  title: string;
  yLabel: string;
  categories: string[];
  /** Stacked segments; values[k] belongs to categories[k]. */
  stacks: Array<{ name: string; values: number[] }>;
}
