/**
 * Kinetic jar tests: concentration against time at known carbon doses, read from CSV with units in
 * the headers. Target tests: `time (min),dose (mg/L),C0 (ng/L),c (ng/L)`; DOC tests:
 * `time (min),dose (mg/L),DOC (mg/L)` with an optional `DOC0 (mg/L)` column (default: the DOC0 of
 * the background file). A series is a run of consecutive rows with the same dose and C0 (or
 * DOC0); within a series times must be positive and increasing. The table comes as CSV text or
 * already read (src/io/readTableFile.ts: `;`/`,` separators and decimal marks, gaps, .xlsx sheets).
 * @throws InputError naming file, row and column
 */
import { InputError } from '../core/errors.js';
import { readCsvTable, type CsvColumnSpec, type CsvTable } from '../tables/csvTable.js';

export type KineticTestKind = 'target' | 'doc';

/** Columns of a target kinetic test table (time, dose, C0, c). */
export const KINETIC_TARGET_COLUMNS: readonly CsvColumnSpec[] = [
  { key: 'time', names: ['time', 't', 'contact time'], kind: 'time', required: true, description: 'contact time' },
  { key: 'dose', names: ['dose', 'carbon dose', 'PAC dose', 'PAC'], kind: 'massConcentration', required: true, description: 'carbon dose' },
  { key: 'c0', names: ['C0', 'initial concentration'], kind: 'massConcentration', required: true, description: 'initial target concentration C0' },
  { key: 'c', names: ['c', 'concentration'], kind: 'massConcentration', required: true, description: 'target concentration c at the time' },
];

/** Columns of a DOC kinetic test table (time, dose, DOC). */
export const KINETIC_DOC_COLUMNS: readonly CsvColumnSpec[] = [
  { key: 'time', names: ['time', 't', 'contact time'], kind: 'time', required: true, description: 'contact time' },
  { key: 'dose', names: ['dose', 'carbon dose', 'PAC dose', 'PAC'], kind: 'massConcentration', required: true, description: 'carbon dose' },
  { key: 'c', names: ['DOC'], kind: 'massConcentration', required: true, description: 'DOC at the time' },
  { key: 'c0', names: ['DOC0', 'initial DOC'], kind: 'massConcentration', required: false, description: 'initial DOC' },
];

export interface KineticSeries {
  doseMgPerL: number;
  /** C0 of the target, or DOC0 (undefined: the background's DOC0), mg/L. */
  c0MgPerL: number | undefined;
  timesS: number[];
  cMgPerL: number[];
  rows: number[];
}

/** Read kinetic tests from CSV text or a table read with KINETIC_TARGET_COLUMNS / KINETIC_DOC_COLUMNS. */
export function readKineticTests(source: string | CsvTable, kind: KineticTestKind, fileName?: string): KineticSeries[] {
  const table = typeof source === 'string' ? readCsvTable(source, kind === 'target' ? KINETIC_TARGET_COLUMNS : KINETIC_DOC_COLUMNS, fileName) : source;
  const file = table.file ?? fileName;
  for (const key of ['time', 'dose', 'c']) {
    if (!table.columns[key]) throw new InputError(`the table was read without its "${key}" column; expected the columns of ${kind === 'target' ? 'KINETIC_TARGET_COLUMNS' : 'KINETIC_DOC_COLUMNS'}`, file !== undefined ? { file } : {});
  }
  const col = (k: string) => table.columns[k];
  const time = col('time')!, dose = col('dose')!, c = col('c')!, c0 = col('c0');
  const at = (i: number, column: string) => ({ ...(file !== undefined ? { file } : {}), row: table.rowNumbers[i]!, column });
  const series: KineticSeries[] = [];
  let cur: KineticSeries | undefined;
  for (let i = 0; i < table.rowNumbers.length; i++) {
    const t = time.values[i]!, d = dose.values[i]!, ci = c.values[i]!;
    const c0i = c0 ? c0.values[i]! : undefined;
    if (!(t > 0)) throw new InputError(`expected a positive contact time, got ${time.cells[i]}`, at(i, time.header));
    if (!(d > 0)) throw new InputError(`expected a positive carbon dose, got ${dose.cells[i]}`, at(i, dose.header));
    if (!(ci > 0)) throw new InputError(`expected a positive concentration (a measured value above the detection limit), got ${c.cells[i]}`, at(i, c.header));
    if (c0i !== undefined && !(c0i > 0)) throw new InputError(`expected a positive initial concentration, got ${c0!.cells[i]}`, at(i, c0!.header));
    if (c0i !== undefined && ci > c0i * 1.5) throw new InputError(`the concentration ${c.cells[i]} is far above the initial ${c0!.cells[i]}; expected c ≤ C0`, at(i, c.header));
    if (!cur || cur.doseMgPerL !== d || cur.c0MgPerL !== c0i) {
      cur = { doseMgPerL: d, c0MgPerL: c0i, timesS: [], cMgPerL: [], rows: [] };
      series.push(cur);
    } else if (!(t > cur.timesS[cur.timesS.length - 1]!)) {
      throw new InputError(`times must increase within a series (same dose and C0): ${time.cells[i]} follows ${time.cells[i - 1]}`, at(i, time.header));
    }
    cur.timesS.push(t);
    cur.cMgPerL.push(ci);
    cur.rows.push(table.rowNumbers[i]!);
  }
  if (series.length === 0) throw new InputError('expected at least one kinetic test row', file !== undefined ? { file } : {});
  return series;
}
