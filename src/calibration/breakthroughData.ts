/**
 * Breakthrough data of one target from a pilot or small column: rows of bed volumes and the outlet
 * c/c0, or the outlet concentration c with the feed C0 (a `C0` column or a value given by the
 * caller). Headers carry units: `bed volumes (-)`, `c/c0 (-)` or `c/c0 (%)`, `c (ng/L)`,
 * `C0 (ng/L)`.
 *
 * Checks (InputError naming file, row and column): bed volumes > 0 and strictly increasing;
 * c/c0 in 0–1.2 (above 1 only by displacement or analytical noise; 1.2 is our bound); C0 > 0.
 * The table comes as CSV text or already read with BREAKTHROUGH_COLUMNS (src/io/readTableFile.ts:
 * `;`/`,` separators and decimal marks, gaps, .xlsx sheets).
 */
import { InputError } from '../core/errors.js';
import { readCsvTable, type CsvColumnSpec, type CsvTable } from '../tables/csvTable.js';

/** Largest c/c0 accepted in breakthrough data (ours: displacement peaks and noise above 1). */
export const MAX_DATA_C_OVER_C0 = 1.2;

/** Columns of a breakthrough table (bed volumes; c/c0, or c with C0): their names, units and whether they are required. */
export const BREAKTHROUGH_COLUMNS: readonly CsvColumnSpec[] = [
  { key: 'bv', names: ['bed volumes', 'BV', 'bed volume'], kind: 'fraction', required: true, max: Number.MAX_VALUE, description: 'bed volumes treated (dimensionless, unit "-")' },
  { key: 'ratio', names: ['c/c0', 'C/C0'], kind: 'fraction', required: false, max: Number.MAX_VALUE, description: 'outlet c/c0' },
  { key: 'c', names: ['c', 'outlet concentration'], kind: 'massConcentration', required: false, description: 'outlet concentration c' },
  { key: 'c0', names: ['C0', 'feed concentration'], kind: 'massConcentration', required: false, description: 'feed concentration C0' },
];

export interface BreakthroughData {
  file?: string;
  rows: number[];
  bedVolumes: number[];
  cOverC0: number[];
  /** Feed concentration, mg/L, when the data give it (a C0 column or the caller's value). */
  c0MgPerL?: number;
}

/**
 * Read breakthrough data from CSV text or a table read with BREAKTHROUGH_COLUMNS. `c0MgPerL` is the feed when the file has `c` without `C0`.
 * @throws InputError naming file, row and column
 */
export function readBreakthroughData(source: string | CsvTable, options: { file?: string; c0MgPerL?: number } = {}): BreakthroughData {
  const table = typeof source === 'string' ? readCsvTable(source, BREAKTHROUGH_COLUMNS, options.file) : source;
  const file = table.file ?? options.file;
  if (!table.columns.bv) throw new InputError('the table was read without its bed-volume column; expected the columns of BREAKTHROUGH_COLUMNS', file !== undefined ? { file } : {});
  const col = table.columns;
  const loc = (row: number, column: string) => ({ ...(file !== undefined ? { file } : {}), row, column });
  const bv = col.bv!;
  let ratio: number[];
  let ratioHeader: string;
  let c0: number | undefined;
  if (col.ratio) {
    ratio = col.ratio.values;
    ratioHeader = col.ratio.header;
  } else if (col.c) {
    ratioHeader = col.c.header;
    ratio = col.c.values.map((c, i) => {
      const feed = col.c0 ? col.c0.values[i]! : options.c0MgPerL;
      if (feed === undefined) throw new InputError('the file gives c without C0; expected a "C0 (ng/L)" column or the feed concentration', loc(1, col.c!.header));
      if (!(feed > 0)) throw new InputError('expected a feed concentration C0 > 0', loc(table.rowNumbers[i]!, col.c0?.header ?? 'C0'));
      c0 = feed;
      return c / feed;
    });
  } else {
    throw new InputError('missing column; expected "c/c0 (-)" (or "c/c0 (%)"), or "c (ng/L)" with "C0 (ng/L)"', loc(1, 'c/c0'));
  }
  const rows = table.rowNumbers;
  if (rows.length < 2) throw new InputError('expected at least 2 data rows of bed volumes and c/c0', loc(2, bv.header));
  rows.forEach((row, i) => {
    const b = bv.values[i]!;
    if (!(b > 0)) throw new InputError(`expected bed volumes > 0, got ${b}`, loc(row, bv.header));
    if (i > 0 && !(b > bv.values[i - 1]!)) throw new InputError(`bed volumes not increasing (${b} after ${bv.values[i - 1]}); expected strictly increasing bed volumes`, loc(row, bv.header));
    const r = ratio[i]!;
    if (!(r >= 0 && r <= MAX_DATA_C_OVER_C0)) throw new InputError(`c/c0 = ${Number(r.toPrecision(6))} is outside 0–${MAX_DATA_C_OVER_C0}; expected an outlet at or below the feed (displacement peaks up to ${MAX_DATA_C_OVER_C0})`, loc(row, ratioHeader));
  });
  const out: BreakthroughData = { rows, bedVolumes: bv.values, cOverC0: ratio };
  if (file !== undefined) out.file = file;
  if (c0 !== undefined) out.c0MgPerL = c0;
  return out;
}
