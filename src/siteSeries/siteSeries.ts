/**
 * A site time series: one row per day with the date, the effluent DOC and (optionally) the flow.
 *
 * CSV header example: `date,DOC (mg/L),flow (m3/d)`. Dates are ISO (YYYY-MM-DD), strictly
 * increasing; DOC must be positive; a missing flow column means the site's design flow is used
 * every day. Parsing is pure (text in, typed arrays out); reading the file lives in src/project.
 */
import { InputError } from '../core/errors.js';
import { readCsvTable, type CsvColumnSpec } from '../tables/csvTable.js';

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
}

const SERIES_COLUMNS: readonly CsvColumnSpec[] = [
  // optional here only so that its absence gets the message below, which shows a whole header
  { key: 'date', names: ['date', 'day'], kind: 'text', required: false, description: 'date (YYYY-MM-DD)' },
  { key: 'doc', names: ['DOC'], kind: 'massConcentration', required: true, description: 'daily effluent DOC' },
  { key: 'flow', names: ['flow', 'Q'], kind: 'flow', required: false, description: 'daily flow' },
];

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Parse a site series CSV.
 * @param text             CSV text
 * @param designFlowM3PerD flow used when the file has no flow column, m³/d
 * @param file             file name for messages
 * @throws InputError naming file, row and column (bad date, dates not increasing, DOC ≤ 0, flow ≤ 0)
 */
export function parseSiteSeries(text: string, designFlowM3PerD: number, file?: string): SiteSeries {
  const table = readCsvTable(text, SERIES_COLUMNS, file);
  const loc = (row?: number, column?: string) => ({ ...(file !== undefined ? { file } : {}), ...(row !== undefined ? { row } : {}), ...(column !== undefined ? { column } : {}) });
  const dateCol = table.columns.date;
  if (!dateCol) throw new InputError('missing the "date" column; expected a header such as "date,DOC (mg/L),flow (m3/d)" with ISO dates (YYYY-MM-DD)', loc(1, 'date'));
  const dateHeader = dateCol.header;
  const dates = dateCol.cells.map((d, k) => {
    const row = table.rowNumbers[k];
    const m = ISO_DATE.exec(d);
    const t = m ? Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) : NaN;
    if (!m || new Date(t).toISOString().slice(0, 10) !== d) throw new InputError(`"${d}" is not a date; expected YYYY-MM-DD`, loc(row, dateHeader));
    return d;
  });
  for (let k = 1; k < dates.length; k++) {
    if (!(dates[k]! > dates[k - 1]!)) throw new InputError(`date ${dates[k]} does not follow ${dates[k - 1]}; expected one row per day in increasing order`, loc(table.rowNumbers[k], dateHeader));
  }
  const doc = table.columns.doc!;
  doc.values.forEach((v, k) => {
    if (!(v > 0)) throw new InputError(`DOC of ${v} mg/L; expected a positive DOC`, loc(table.rowNumbers[k], doc.header));
  });
  const flowCol = table.columns.flow;
  if (flowCol) {
    flowCol.values.forEach((v, k) => {
      if (!(v > 0)) throw new InputError(`flow of ${v} m³/d; expected a positive flow`, loc(table.rowNumbers[k], flowCol.header));
    });
  }
  const out: SiteSeries = {
    dates,
    docMgPerL: doc.values.slice(),
    flowM3PerD: flowCol ? flowCol.values.slice() : dates.map(() => designFlowM3PerD),
    flowFromDesign: !flowCol,
  };
  if (file !== undefined) out.file = file;
  return out;
}
