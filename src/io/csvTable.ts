/**
 * Reading a CSV table whose headers carry units, e.g. `dose (mg/L),DOC0 (mg/L),DOC (mg/L)`.
 *
 * The caller declares the columns it understands (name, aliases, quantity kind, required or
 * not). Every recognised column must carry a known unit of its kind; every cell must be a
 * non-negative number (blank only where the column allows it). Values are converted once, to the
 * internal units (mg/L for concentrations and doses, 1/m for absorbance). Columns that match no
 * declaration are ignored (sample names, notes).
 *
 * Errors are InputError naming the file, the row (as a spreadsheet shows it: header = row 1,
 * blank and comment lines counted) and the column, and saying what was expected.
 */
import { parse } from 'csv-parse/sync';
import { InputError } from '../core/errors.js';
import { splitHeader } from '../units/parseQuantity.js';
import { describeKind, normaliseUnitText, unitFactor, type UnitKind } from '../units/unitFactor.js';

/** Quantity kinds a CSV column may hold: the unit kinds plus UV absorbance (internal 1/m). */
export type CsvKind = UnitKind | 'absorbance';

export interface CsvColumnSpec {
  /** Key of the column in the result, e.g. "doc0". */
  key: string;
  /** Accepted header names (compared case-insensitively, ignoring spaces, `_` and `-`). */
  names: string[];
  kind: CsvKind;
  required: boolean;
  /** Blank cells allowed (reported in `blank`). Default false. */
  allowBlank?: boolean;
  /** What the column is, for messages ("equilibrium DOC"). */
  description: string;
}

export interface CsvColumn {
  key: string;
  /** Header text as written in the file. */
  header: string;
  /** Unit text from the header. */
  unit: string;
  /** Values in the internal unit (0 where blank). */
  values: number[];
  /** True where the cell was blank (only possible when the spec allows it). */
  blank: boolean[];
}

export interface CsvTable {
  /** File name for messages, when the table came from a file. */
  file?: string;
  /** Spreadsheet row number of each data row (header = row 1). */
  rowNumbers: number[];
  /** Recognised columns by key. */
  columns: Record<string, CsvColumn>;
}

/** Internal unit of each kind, for messages. */
const ABSORBANCE_FACTORS: Record<string, number> = { '1/m': 1, 'm^-1': 1, '/m': 1, '1/cm': 100, 'cm^-1': 100, '/cm': 100 };

/** Factor from a header unit to the internal unit of `kind`. @throws InputError */
export function csvUnitFactor(unit: string, kind: CsvKind): number {
  if (kind === 'absorbance') {
    const f = ABSORBANCE_FACTORS[normaliseUnitText(unit).replace(/\s+/g, '')];
    if (f === undefined) throw new InputError(`unknown unit "${unit}"; expected an absorbance per path length such as 1/m or 1/cm`);
    return f;
  }
  return unitFactor(unit, kind);
}

function describe(kind: CsvKind): string {
  return kind === 'absorbance' ? 'an absorbance unit such as 1/m or 1/cm' : describeKind(kind);
}

function normaliseName(name: string): string {
  return name.toLowerCase().replace(/[\s_\-]+/g, '');
}

/**
 * Parse CSV text into typed, unit-converted columns.
 * @param text  the CSV text (comma-separated; `#` starts a comment line)
 * @param specs the columns the caller understands
 * @param file  file name for messages
 * @throws InputError naming file, row and column
 */
export function readCsvTable(text: string, specs: readonly CsvColumnSpec[], file?: string): CsvTable {
  const loc = (row?: number, column?: string) => ({ ...(file !== undefined ? { file } : {}), ...(row !== undefined ? { row } : {}), ...(column !== undefined ? { column } : {}) });
  let records: Array<{ record: string[]; info: { lines: number } }>;
  try {
    records = parse(text.replace(/^\uFEFF/, ''), { skip_empty_lines: true, trim: true, info: true, comment: '#', comment_no_infix: true, relax_quotes: false }) as unknown as Array<{ record: string[]; info: { lines: number } }>;
  } catch (e) {
    const err = e as Error & { lines?: number };
    throw new InputError(`malformed CSV (${err.message.replace(/^Invalid Record Length: /, '')}); expected comma-separated values with the same number of cells in every row`, loc(err.lines));
  }
  const header = records[0];
  if (!header) throw new InputError(`empty table; expected a header row with ${specs.filter((s) => s.required).map((s) => `"${s.names[0]}"`).join(', ')} and units`, loc(1));
  const headerRow = header.info.lines;
  const found = new Map<string, { index: number; header: string; unit: string; factor: number }>();
  header.record.forEach((h, index) => {
    const { name, unit } = splitHeader(h);
    const spec = specs.find((s) => s.names.some((n) => normaliseName(n) === normaliseName(name)));
    if (!spec) return;
    if (found.has(spec.key)) throw new InputError(`the ${spec.description} appears twice; expected one column`, loc(headerRow, h));
    if (unit === undefined) throw new InputError(`header without a unit; expected e.g. "${spec.names[0]} (${exampleUnit(spec.kind)})" with ${describe(spec.kind)}`, loc(headerRow, h));
    let factor: number;
    try {
      factor = csvUnitFactor(unit, spec.kind);
    } catch (e) {
      if (e instanceof InputError) throw new InputError(e.expected, loc(headerRow, h));
      throw e;
    }
    found.set(spec.key, { index, header: h, unit, factor });
  });
  for (const s of specs) {
    if (s.required && !found.has(s.key)) {
      throw new InputError(`missing column for the ${s.description}; expected a header such as "${s.names[0]} (${exampleUnit(s.kind)})"`, loc(headerRow, s.names[0]));
    }
  }
  const columns: Record<string, CsvColumn> = {};
  for (const [key, f] of found) columns[key] = { key, header: f.header, unit: f.unit, values: [], blank: [] };
  const rowNumbers: number[] = [];
  for (const rec of records.slice(1)) {
    const row = rec.info.lines;
    rowNumbers.push(row);
    for (const s of specs) {
      const f = found.get(s.key);
      if (!f) continue;
      const col = columns[s.key]!;
      const cell = rec.record[f.index] ?? '';
      if (cell === '') {
        if (!s.allowBlank) throw new InputError(`empty cell; expected a number in ${f.unit}`, loc(row, f.header));
        col.values.push(0);
        col.blank.push(true);
        continue;
      }
      const v = parseCell(cell);
      if (v === undefined) throw new InputError(`"${cell}" is not a number; expected a number in ${f.unit} (the unit is given in the header)`, loc(row, f.header));
      if (v < 0) throw new InputError(`negative value ${cell}; expected a value ≥ 0 ${f.unit}`, loc(row, f.header));
      col.values.push(v * f.factor);
      col.blank.push(false);
    }
  }
  if (rowNumbers.length === 0) throw new InputError('no data rows; expected at least one row below the header', loc(headerRow + 1));
  const table: CsvTable = { rowNumbers, columns };
  if (file !== undefined) table.file = file;
  return table;
}

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/** A plain decimal number (no units, no thousands separators), or undefined. */
function parseCell(cell: string): number | undefined {
  if (!NUMBER.test(cell)) return undefined;
  const v = Number(cell);
  return Number.isFinite(v) ? v : undefined;
}

function exampleUnit(kind: CsvKind): string {
  switch (kind) {
    case 'absorbance': return '1/m';
    case 'massConcentration': return 'mg/L';
    case 'massLoading': return 'mg/g';
    case 'molarConcentration': return 'umol/L';
    case 'molarLoading': return 'mmol/g';
    case 'flow': return 'm3/d';
  }
}
