/**
 * A site time series: one row per day with the date, the effluent DOC and (optionally) the flow.
 *
 * CSV header example: `date,DOC (mg/L),flow (m3/d)`. Dates are ISO (YYYY-MM-DD) or
 * day.month.year (DD.MM.YYYY), strictly increasing; DOC must be positive; a missing flow column
 * means the site's design flow is used every day. A day whose DOC or flow is a gap (empty, `n.a.`,
 * `-`) is left out and counted in `warnings`. Parsing is pure (text in, typed arrays out); reading
 * the file lives in src/project.
 */
import { InputError } from '../core/errors.js';
import { readCsvTable, type CsvColumnSpec, type CsvTable } from '../tables/csvTable.js';
import type { CsvFormatOptions } from '../tables/csvFormat.js';
import { parseDayDate } from '../tables/dayDate.js';

export interface SiteSeries {
  /** ISO dates, one per row. */
  dates: string[];
  /** Effluent DOC per day, mg/L. */
  docMgPerL: number[];
  /** Flow per day, m³/d. */
  flowM3PerD: number[];
  /** True when the flow column was absent and the design flow was used. */
  flowFromDesign: boolean;
  /** File the series came from (for messages and run.json). */
  file?: string;
  /** Days left out (gaps) and how the file was read. */
  warnings?: string[];
}

const SERIES_COLUMNS: readonly CsvColumnSpec[] = [
  // optional here only so that its absence gets the message below, which shows a whole header
  { key: 'date', names: ['date', 'day'], kind: 'text', required: false, description: 'date (YYYY-MM-DD)' },
  { key: 'doc', names: ['DOC'], kind: 'massConcentration', required: true, allowBlank: true, description: 'daily effluent DOC' },
  { key: 'flow', names: ['flow', 'Q'], kind: 'flow', required: false, allowBlank: true, description: 'daily flow' },
];

/**
 * Parse a site series CSV.
 * @param text             CSV text
 * @param designFlowM3PerD flow used when the file has no flow column, m³/d
 * @param file             file name for messages
 * @param format           separator and decimal mark when given (detected otherwise)
 * @throws InputError naming file, row and column (bad date, dates not increasing, DOC ≤ 0, flow ≤ 0)
 */
export function parseSiteSeries(text: string, designFlowM3PerD: number, file?: string, format: CsvFormatOptions = {}): SiteSeries {
  return siteSeriesFromTable(readCsvTable(text, SERIES_COLUMNS, file, format), designFlowM3PerD);
}

/** The columns of a site series table (for readers of .xlsx sheets). */
export const SITE_SERIES_COLUMNS = SERIES_COLUMNS;

/** A site series from a table read with SITE_SERIES_COLUMNS. @throws InputError naming file, row and column */
export function siteSeriesFromTable(table: CsvTable, designFlowM3PerD: number): SiteSeries {
  const file = table.file;
  const loc = (row?: number, column?: string) => ({ ...(file !== undefined ? { file } : {}), ...(row !== undefined ? { row } : {}), ...(column !== undefined ? { column } : {}) });
  const dateCol = table.columns.date;
  if (!dateCol) throw new InputError('missing the "date" column; expected a header such as "date,DOC (mg/L),flow (m3/d)" with dates as YYYY-MM-DD or DD.MM.YYYY', loc(1, 'date'));
  const dateHeader = dateCol.header;
  const doc = table.columns.doc!;
  const flowCol = table.columns.flow;
  const kept: number[] = [];
  const gapRows: number[] = [];
  const dates: string[] = [];
  dateCol.cells.forEach((d, k) => {
    const row = table.rowNumbers[k];
    const iso = parseDayDate(d);
    if (iso === undefined) throw new InputError(d === '' ? 'empty date; expected YYYY-MM-DD or DD.MM.YYYY' : `"${d}" is not a date; expected YYYY-MM-DD or DD.MM.YYYY`, loc(row, dateHeader));
    if (dates.length > 0 && !(iso > dates[dates.length - 1]!)) throw new InputError(`date ${d} does not follow ${dates[dates.length - 1]}; expected one row per day in increasing order`, loc(row, dateHeader));
    dates.push(iso);
    if (doc.blank[k] || flowCol?.blank[k]) gapRows.push(row!);
    else kept.push(k);
  });
  for (const k of kept) {
    const v = doc.values[k]!;
    if (!(v > 0)) throw new InputError(`DOC of ${v} mg/L; expected a positive DOC`, loc(table.rowNumbers[k], doc.header));
    if (flowCol && !(flowCol.values[k]! > 0)) throw new InputError(`flow of ${flowCol.values[k]} m³/d; expected a positive flow`, loc(table.rowNumbers[k], flowCol.header));
  }
  if (kept.length === 0) throw new InputError('every day of the series is a gap; expected at least one day with DOC', loc(table.rowNumbers[0], doc.header));
  const warnings = [...(table.notes ?? [])];
  if (gapRows.length > 0) warnings.push(`${file ?? 'site DOC series'}: ${gapRows.length} day(s) with a gap (empty, "n.a." or "-") in DOC or flow left out (row${gapRows.length > 1 ? 's' : ''} ${gapRows.slice(0, 10).join(', ')}${gapRows.length > 10 ? ', …' : ''}); totals cover the other days`);
  const out: SiteSeries = {
    dates: kept.map((k) => dates[k]!),
    docMgPerL: kept.map((k) => doc.values[k]!),
    flowM3PerD: kept.map((k) => (flowCol ? flowCol.values[k]! : designFlowM3PerD)),
    flowFromDesign: !flowCol,
  };
  if (file !== undefined) out.file = file;
  if (warnings.length) out.warnings = warnings;
  return out;
}
