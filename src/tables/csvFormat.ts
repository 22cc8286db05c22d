/**
 * How a spreadsheet export writes its table: the cell separator (`,` or `;`), the decimal mark
 * (`.` or `,`) and the marks of a gap (an empty cell, `n.a.`, `-`). European exports commonly use
 * `;` with decimal commas (common practice of spreadsheet programs in locales whose decimal mark
 * is a comma). Both are detected unless set: the separator from the header row (more `;` than `,`
 * outside quotes means `;`), the decimal mark from the number cells (decimal commas and no decimal
 * points means `,`).
 */
import { InputError } from '../core/errors.js';

export type CsvSeparator = ',' | ';';
export type DecimalMark = '.' | ',';

/** Format settings given by the user (an option); absent fields are detected. */
export interface CsvFormatOptions {
  separator?: CsvSeparator;
  decimal?: DecimalMark;
}

export interface CsvFormat {
  separator: CsvSeparator;
  decimal: DecimalMark;
  /** True where the setting was detected rather than given. */
  separatorDetected: boolean;
  decimalDetected: boolean;
}

/** Gap marks (compared case-insensitively): the cell holds no value. */
export const GAP_MARKS: readonly string[] = ['', 'n.a.', 'n.a', 'n/a', 'na', '-', '–', '—'];

export function isGap(cell: string): boolean {
  return GAP_MARKS.includes(cell.trim().toLowerCase());
}

const POINT_NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;
const COMMA_NUMBER = /^[-+]?(?:\d+,?\d*|,\d+)(?:[eE][-+]?\d+)?$/;
const HAS_POINT = /^[-+]?\d*\.\d+(?:[eE][-+]?\d+)?$/;
const HAS_COMMA = /^[-+]?\d*,\d+(?:[eE][-+]?\d+)?$/;

/** Check a user's `--separator` / `--decimal` value. @throws InputError naming the option */
export function parseFormatOptions(separator: unknown, decimal: unknown): CsvFormatOptions {
  const out: CsvFormatOptions = {};
  if (separator !== undefined) {
    const s = String(separator).trim().toLowerCase();
    const v = ({ ',': ',', comma: ',', ';': ';', semicolon: ';' } as Record<string, CsvSeparator>)[s];
    if (!v) throw new InputError(`expected "," (comma) or ";" (semicolon), got "${String(separator)}"`, { option: '--separator' });
    out.separator = v;
  }
  if (decimal !== undefined) {
    const s = String(decimal).trim().toLowerCase();
    const v = ({ '.': '.', point: '.', ',': ',', comma: ',' } as Record<string, DecimalMark>)[s];
    if (!v) throw new InputError(`expected "." (point) or "," (comma), got "${String(decimal)}"`, { option: '--decimal' });
    out.decimal = v;
  }
  return out;
}

/** The separator of a CSV text: given, or detected from its first non-comment line. */
export function detectSeparator(text: string, given?: CsvSeparator): { separator: CsvSeparator; detected: boolean } {
  if (given) return { separator: given, detected: false };
  const header = text.split(/\r?\n/).find((l) => l.trim() !== '' && !l.trimStart().startsWith('#')) ?? '';
  const outside = header.replace(/"[^"]*"/g, '');
  const semi = (outside.match(/;/g) ?? []).length;
  const comma = (outside.match(/,/g) ?? []).length;
  return { separator: semi > comma ? ';' : ',', detected: true };
}

/** The decimal mark of a table's cells: given, or detected (decimal commas and no decimal points → ","). */
export function detectDecimal(cells: Iterable<string>, given?: DecimalMark): { decimal: DecimalMark; detected: boolean } {
  if (given) return { decimal: given, detected: false };
  let commas = 0, points = 0;
  for (const c of cells) {
    if (HAS_COMMA.test(c)) commas++;
    else if (HAS_POINT.test(c)) points++;
  }
  return { decimal: commas > 0 && points === 0 ? ',' : commas > points ? ',' : '.', detected: true };
}

/**
 * A number cell read with the table's decimal mark, or an explanation of why it is not one.
 * Thousands separators are not accepted (a cell such as 1.234,5 is an error).
 */
export function parseNumberCell(cell: string, decimal: DecimalMark): { value: number } | { problem: string } {
  if (decimal === '.') {
    if (POINT_NUMBER.test(cell)) {
      const v = Number(cell);
      return Number.isFinite(v) ? { value: v } : { problem: `"${cell}" is outside the double range` };
    }
    if (COMMA_NUMBER.test(cell)) return { problem: `"${cell}" has a decimal comma but the table uses decimal points` };
    return { problem: `"${cell}" is not a number` };
  }
  if (COMMA_NUMBER.test(cell)) {
    const v = Number(cell.replace(',', '.'));
    return Number.isFinite(v) ? { value: v } : { problem: `"${cell}" is outside the double range` };
  }
  if (POINT_NUMBER.test(cell)) return { problem: `"${cell}" has a decimal point but the table uses decimal commas` };
  return { problem: `"${cell}" is not a number` };
}

/** A notice for the user when the table is not plain comma/point CSV, or undefined. */
export function formatNotice(format: CsvFormat, file: string | undefined): string | undefined {
  if (format.separator === ',' && format.decimal === '.') return undefined;
  const how = `${format.separator === ';' ? 'semicolon-separated' : 'comma-separated'} with decimal ${format.decimal === ',' ? 'commas' : 'points'}`;
  const origin = format.separatorDetected || format.decimalDetected ? ' (detected; set --separator and --decimal to override)' : ' (as set)';
  return `${file ?? 'table'}: read as ${how}${origin}`;
}
