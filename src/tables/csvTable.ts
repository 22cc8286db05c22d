/**
 * Reading a CSV table whose headers carry units, e.g. `dose (mg/L),DOC0 (mg/L),DOC (mg/L)`.
 * This is the project's one CSV reader: every CSV input goes through `readCsvTable`.
 *
 * The caller declares the columns it understands (name, aliases, kind, required or not), either
 * as a list or as a function of the header row (for column families such as `removal <id> (%)`).
 * Kinds:
 * - quantity kinds (mass concentration, loading, flow …, UV absorbance): the header carries a
 *   known unit of the kind; cells are numbers, converted once to the internal unit (mg/L for
 *   concentrations and doses, 1/m for absorbance);
 * - `fraction`: the header says `%` (or `percent`) or `fraction` (also `-`, `1`); values become
 *   fractions (50 % → 0.5), range-checked to 0–1 unless the column sets another range;
 * - `text`: cells are kept as written (sample names); the header needs no unit.
 * Numbers must lie in the column's range (default: ≥ 0, and ≤ 1 for fractions); a blank cell is
 * an error unless the column allows it (blank = not measured). Columns that match no declaration
 * are ignored (notes).
 *
 * Spreadsheet exports are read as they come: `,` or `;` separators and `.` or `,` decimal marks
 * (detected or given, see csvFormat.ts; a notice in `notes` says how a non-default table was
 * read); gaps written as an empty cell, `n.a.` or `-` count as blank. An .xlsx sheet is read into
 * the same rows by `readTableFile`.
 *
 * Errors are InputError naming the file, the row (as a spreadsheet shows it: header = row 1,
 * blank and comment lines counted) and the column, and saying what was expected.
 */
import { parse } from 'csv-parse/sync';
import { InputError } from '../core/errors.js';
import { splitHeader } from '../units/parseQuantity.js';
import { describeKind, normaliseUnitText, unitFactor, type UnitKind } from '../units/unitFactor.js';
import { cleanName } from '../text/cleanText.js';
import { detectDecimal, detectSeparator, formatNotice, isGap, parseNumberCell, type CsvFormat, type CsvFormatOptions, type DecimalMark } from './csvFormat.js';

/** Quantity kinds a CSV column may hold: the unit kinds, UV absorbance (internal 1/m) and fractions (internal 0–1). */
export type CsvKind = UnitKind | 'absorbance' | 'fraction';

export interface CsvColumnSpec {
  /** Key of the column in the result, e.g. "doc0". */
  key: string;
  /** Accepted header names (compared case-insensitively, ignoring spaces, `_` and `-`). */
  names: string[];
  /** A quantity kind (numbers with a unit in the header) or `text` (cells kept as written). */
  kind: CsvKind | 'text';
  required: boolean;
  /** Blank cells allowed (reported in `blank`). Default false. */
  allowBlank?: boolean;
  /** Smallest allowed value, in the internal unit (a fraction for `fraction`). Default 0. */
  min?: number;
  /** Largest allowed value, in the internal unit. Default 1 for `fraction`, no limit otherwise. */
  max?: number;
  /** What the column is, for messages ("equilibrium DOC"). */
  description: string;
}

/** The header row, given to a caller that declares its columns from the headers it finds. */
export interface CsvHeaderRow {
  /** Spreadsheet row number of the header (1 unless comment or blank lines precede it). */
  row: number;
  /** Header cells as written (trimmed). */
  cells: readonly string[];
}

/**
 * The columns a caller understands: a list, or a function of the header row. The function may
 * throw InputError for a bad header (with row and column); the reader adds the file name.
 */
export type CsvColumnSpecs = readonly CsvColumnSpec[] | ((header: CsvHeaderRow) => readonly CsvColumnSpec[]);

export interface CsvColumn {
  key: string;
  /** Header text as written in the file. */
  header: string;
  /** Unit text from the header ('' for a text column without one). */
  unit: string;
  /** Values in the internal unit (0 where blank); empty for text columns. */
  values: number[];
  /** Cell text as written (trimmed), one per data row; '' where blank. */
  cells: string[];
  /** True where the cell was blank or a gap mark such as "n.a." (only possible when the spec allows it). */
  blank: boolean[];
}

/** One row of cells as a spreadsheet holds it, with its spreadsheet row number. */
export interface TableRecord {
  cells: string[];
  row: number;
}

export interface CsvTable {
  /** File name for messages, when the table came from a file. */
  file?: string;
  /** Spreadsheet row number of each data row (header = row 1). */
  rowNumbers: number[];
  /** Recognised columns by key. */
  columns: Record<string, CsvColumn>;
  /** How the table was read (separator and decimal mark). */
  format?: CsvFormat;
  /** Notices for the user (how a non-default table was read). */
  notes?: string[];
}

const ABSORBANCE_FACTORS: Record<string, number> = { '1/m': 1, 'm^-1': 1, '/m': 1, '1/cm': 100, 'cm^-1': 100, '/cm': 100 };
/** Percent to fraction: 1 % = 0.01 by definition. */
const FRACTION_FACTORS: Record<string, number> = { '%': 0.01, 'percent': 0.01, 'fraction': 1, '-': 1, '1': 1 };

/** Factor from a header unit to the internal unit of `kind`. @throws InputError */
export function csvUnitFactor(unit: string, kind: CsvKind): number {
  const compact = normaliseUnitText(unit).replace(/\s+/g, '');
  if (kind === 'absorbance') {
    const f = ABSORBANCE_FACTORS[compact];
    if (f === undefined) throw new InputError(`unknown unit "${unit}"; expected an absorbance per path length such as 1/m or 1/cm`);
    return f;
  }
  if (kind === 'fraction') {
    const f = FRACTION_FACTORS[compact.toLowerCase()];
    if (f === undefined) throw new InputError(`unknown unit "${unit}"; expected % or fraction (0–1)`);
    return f;
  }
  return unitFactor(unit, kind);
}

function describe(kind: CsvKind): string {
  if (kind === 'absorbance') return 'an absorbance unit such as 1/m or 1/cm';
  if (kind === 'fraction') return '% or fraction';
  return describeKind(kind);
}

function normaliseName(name: string): string {
  return name.toLowerCase().replace(/[\s_\-]+/g, '');
}

type Location = { file?: string; row?: number; column?: string };
interface FoundColumn { spec: CsvColumnSpec; index: number; header: string; unit: string; factor: number }

/**
 * Parse CSV text into typed, unit-converted columns.
 * @param text    the CSV text (`,` or `;` separated, `.` or `,` decimals; `#` starts a comment line)
 * @param specs   the columns the caller understands (a list, or a function of the header row)
 * @param file    file name for messages
 * @param format  separator and decimal mark when given by the user (detected otherwise)
 * @throws InputError naming file, row and column
 */
export function readCsvTable(text: string, specs: CsvColumnSpecs, file?: string, format: CsvFormatOptions = {}): CsvTable {
  const loc = (row?: number): Location => ({ ...(file !== undefined ? { file } : {}), ...(row !== undefined ? { row } : {}) });
  const body = text.replace(/^\uFEFF/, '');
  const { separator, detected: separatorDetected } = detectSeparator(body, format.separator);
  let rows = splitPlainCsv(body, separator);
  if (!rows) {
    let records: Array<{ record: string[]; info: { lines: number } }>;
    try {
      records = parse(body, { delimiter: separator, skip_empty_lines: true, trim: true, info: true, comment: '#', comment_no_infix: true, relax_quotes: false }) as unknown as Array<{ record: string[]; info: { lines: number } }>;
    } catch (e) {
      const err = e as Error & { lines?: number };
      const hint = separator === ',' && /\d,\d/.test(body) ? ' (numbers with decimal commas in a comma-separated file split into two cells: separate the cells with ";" or quote the numbers)' : '';
      throw new InputError(`malformed CSV (${err.message.replace(/^Invalid Record Length: /, '')})${hint}; expected ${separator === ';' ? 'semicolon' : 'comma'}-separated values with the same number of cells in every row`, loc(err.lines));
    }
    rows = records.map((r) => ({ cells: r.record, row: r.info.lines }));
  }
  const { decimal, detected: decimalDetected } = detectDecimal(dataCells(rows), format.decimal);
  const table = readTableRecords(rows, specs, file, decimal);
  table.format = { separator, decimal, separatorDetected, decimalDetected };
  const notice = formatNotice(table.format, file);
  table.notes = notice ? [notice] : [];
  return table;
}

/** Text the plain splitter leaves to the full CSV parser: quotes, a lone CR, whitespace other than space and tab. */
const NEEDS_FULL_PARSER = /["\u000B\u000C\u00A0\u1680\u2000-\u200A\u2028\u2029\u202F\u205F\u3000\uFEFF]|\r(?!\n)/;

/**
 * The records of a CSV text without quotes, split at line ends and separators: the same records,
 * cells and line numbers as the full parser (csv-parse with the options above) gives them, for
 * the common plain file; undefined where the text needs the full parser (quotes, unusual
 * whitespace, a line of blanks, an indented comment, rows of unequal length: the parser then
 * reads it, or reports the error with its line). Exported for its test against the parser.
 */
export function splitPlainCsv(body: string, separator: string): TableRecord[] | undefined {
  if (NEEDS_FULL_PARSER.test(body)) return undefined;
  const crlf = body.includes('\r');
  if (crlf && /(?:^|[^\r])\n/.test(body)) return undefined; // \r\n and \n mixed
  const lines = body.split(crlf ? '\r\n' : '\n');
  const rows: TableRecord[] = [];
  let width = -1;
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!;
    if (line === '' || line.charCodeAt(0) === 35 /* # */) continue;
    const cells = line.split(separator);
    for (let c = 0; c < cells.length; c++) {
      const t = cells[c]!;
      const f = t.charCodeAt(0);
      const l = t.charCodeAt(t.length - 1);
      if (f === 32 || f === 9 || l === 32 || l === 9) cells[c] = t.trim();
    }
    if (cells.length === 1 && cells[0] === '') return undefined; // a line of blanks
    if (cells[0]!.charCodeAt(0) === 35) return undefined; // an indented comment
    if (width === -1) width = cells.length;
    else if (cells.length !== width) return undefined;
    rows.push({ cells, row: i + 1 });
  }
  return rows;
}

/** Every cell below the header row. */
function* dataCells(rows: readonly TableRecord[]): Iterable<string> {
  for (let i = 1; i < rows.length; i++) yield* rows[i]!.cells;
}

/**
 * Read rows already split into cells (a parsed CSV, or an .xlsx sheet) into typed, unit-converted
 * columns. @param decimal the decimal mark of number cells
 * @throws InputError naming file, row and column
 */
export function readTableRecords(records: readonly TableRecord[], specs: CsvColumnSpecs, file?: string, decimal: DecimalMark = '.'): CsvTable {
  const loc = (row?: number, column?: string): Location => ({ ...(file !== undefined ? { file } : {}), ...(row !== undefined ? { row } : {}), ...(column !== undefined ? { column } : {}) });
  const header = records[0];
  if (!header) {
    const wanted = typeof specs === 'function' ? '' : ` with ${specs.filter((s) => s.required).map((s) => `"${s.names[0]}"`).join(', ')} and units`;
    throw new InputError(`empty table; expected a header row${wanted}`, loc(1));
  }
  const headerRow = header.row;
  const headerCells = header.cells.map((c) => cleanName(c).trim());
  let columnSpecs: readonly CsvColumnSpec[];
  try {
    columnSpecs = typeof specs === 'function' ? specs({ row: headerRow, cells: headerCells }) : specs;
  } catch (e) {
    throw e instanceof InputError && file !== undefined ? e.at({ file }) : e;
  }
  const found = findColumns(headerCells, columnSpecs, (column) => loc(headerRow, column));
  const columns: Record<string, CsvColumn> = {};
  for (const f of found.values()) columns[f.spec.key] = { key: f.spec.key, header: f.header, unit: f.unit, values: [], cells: [], blank: [] };
  const inSpecOrder = columnSpecs.flatMap((s) => found.get(s.key) ?? []);
  const rowNumbers: number[] = [];
  for (const rec of records.slice(1)) {
    const row = rec.row;
    rowNumbers.push(row);
    // the location is built only for an error message (an object per cell would dominate long series)
    for (const f of inSpecOrder) readCell(cleanName(rec.cells[f.index] ?? '').trim(), f, columns[f.spec.key]!, () => loc(row, f.header), decimal);
  }
  if (rowNumbers.length === 0) throw new InputError('no data rows; expected at least one row below the header', loc(headerRow + 1));
  const table: CsvTable = { rowNumbers, columns };
  if (file !== undefined) table.file = file;
  return table;
}

/** Match header cells to specs (result in header order by key); check units, duplicates and required columns. */
function findColumns(headers: readonly string[], specs: readonly CsvColumnSpec[], at: (column: string) => Location): Map<string, FoundColumn> {
  const found = new Map<string, FoundColumn>();
  headers.forEach((h, index) => {
    const { name, unit } = splitHeader(h);
    const spec = specs.find((s) => s.names.some((n) => normaliseName(n) === normaliseName(name)));
    if (!spec) return;
    if (found.has(spec.key)) throw new InputError(`the ${spec.description} appears twice; expected one column`, at(h));
    if (spec.kind === 'text') {
      found.set(spec.key, { spec, index, header: h, unit: unit ?? '', factor: 1 });
      return;
    }
    if (unit === undefined) throw new InputError(`header without a unit; expected e.g. "${exampleHeader(spec)}" with ${describe(spec.kind)}`, at(h));
    try {
      found.set(spec.key, { spec, index, header: h, unit, factor: csvUnitFactor(unit, spec.kind) });
    } catch (e) {
      throw e instanceof InputError ? new InputError(e.expected, at(h)) : e;
    }
  });
  for (const s of specs) {
    if (s.required && !found.has(s.key)) throw new InputError(`missing column for the ${s.description}; expected a header such as "${exampleHeader(s)}"`, at(s.names[0] ?? s.key));
  }
  return found;
}

/** Check one cell and append it to its column. @throws InputError at `where()` */
function readCell(cell: string, f: FoundColumn, col: CsvColumn, where: () => Location, decimal: DecimalMark): void {
  const s = f.spec;
  const gap = s.kind === 'text' ? cell === '' : isGap(cell);
  col.cells.push(gap ? '' : cell);
  col.blank.push(gap);
  if (gap) {
    if (!s.allowBlank) {
      const what = cell === '' ? 'empty cell' : `"${cell}" marks a gap`;
      throw new InputError(`${what}; expected ${s.kind === 'text' ? `the ${s.description}` : `a number in ${f.unit} (this table needs a value in every row: leave the row out instead)`}`, where());
    }
    if (s.kind !== 'text') col.values.push(0);
    return;
  }
  if (s.kind === 'text') return;
  const parsed = parseNumberCell(cell, decimal);
  if ('problem' in parsed) throw new InputError(`${parsed.problem}; expected a number in ${f.unit} (the unit is given in the header)`, where());
  const x = parsed.value * f.factor;
  if (!Number.isFinite(x)) throw new InputError(`"${cell}" ${f.unit} is outside the double range after conversion; expected a finite value`, where());
  const min = s.min ?? 0;
  const max = s.max ?? (s.kind === 'fraction' ? 1 : Infinity);
  if (x < min || x > max) throw new InputError(outOfRange(cell, f, min, max), where());
  col.values.push(x);
}

/** The message for a value outside [min, max] (internal unit), with the bounds in the header's unit. */
function outOfRange(cell: string, f: FoundColumn, min: number, max: number): string {
  if (min === 0 && max === Infinity) return `negative value ${cell}; expected a value ≥ 0 ${f.unit}`;
  const inHeaderUnit = (x: number) => String(Number((x / f.factor).toPrecision(12)));
  const unit = f.spec.kind === 'fraction' && f.factor === 1 ? '' : ` ${f.unit}`;
  const lo = inHeaderUnit(min);
  if (max === Infinity) return `${f.spec.description} ${cell} is below ${lo}${unit}; expected a value ≥ ${lo}${unit}`;
  const hi = inHeaderUnit(max);
  return `${f.spec.description} ${cell} is outside ${lo}${min < 0 ? ' … ' : '–'}${hi}${unit}; expected a value from ${lo} to ${hi}${unit}`;
}

function exampleHeader(spec: CsvColumnSpec): string {
  return spec.kind === 'text' ? `${spec.names[0]}` : `${spec.names[0]} (${exampleUnit(spec.kind)})`;
}

function exampleUnit(kind: CsvKind): string {
  switch (kind) {
    case 'absorbance': return '1/m';
    case 'fraction': return '%';
    case 'massConcentration': return 'mg/L';
    case 'massLoading': return 'mg/g';
    case 'molarConcentration': return 'umol/L';
    case 'molarLoading': return 'mmol/g';
    case 'flow': return 'm3/d';
    case 'time': return 'min';
    case 'length': return 'um';
    case 'density': return 'kg/m3';
    case 'diffusivity': return 'm2/s';
    case 'velocity': return 'm/s';
  }
}
