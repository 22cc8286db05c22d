/**
 * Pilot pairs from CSV text: one row per sample, with the UV254 reduction and the measured
 * removal of each compound.
 *
 *   sample,dose (mg/L),UV254 reduction (%),removal CBZ (%),removal DCF (%)
 *   P1,10,35.2,71,64
 *
 * - `sample`: text (required); `dose`: a mass concentration unit (mg/L, g/m3 …; required);
 * - `UV254 reduction`: `%` or `fraction` (also `-`), 0–100 % (required);
 * - `removal <compound id>`: `%` or `fraction`, one column per compound, ≤ 100 % (slightly
 *   negative measured removals are allowed down to −100 %); a blank cell = not measured.
 * Other columns (notes) are ignored. Rows are numbered as a spreadsheet shows them (header = 1).
 *
 * The records are split by csv-parse with the same options as src/io/csvTable.ts (comments with
 * `#`, blank lines skipped, cells trimmed), and units are converted by its `csvUnitFactor`; the
 * shared reader has no text or percent columns yet, hence this thin layer over it.
 * @throws InputError naming file, row and column for every bad value.
 */
import { parse } from 'csv-parse/sync';
import { InputError } from '../core/errors.js';
import { csvUnitFactor } from '../io/csvTable.js';
import { readTextFile } from '../io/readFiles.js';
import { splitHeader } from '../units/parseQuantity.js';
import type { PilotPair } from './pilotCheck.js';

export interface PilotData {
  file?: string;
  /** Compound ids in column order. */
  compounds: string[];
  pairs: PilotPair[];
}

const FRACTION_FACTORS: Record<string, number> = { '%': 0.01, 'percent': 0.01, 'fraction': 1, '-': 1, '1': 1 };

function norm(s: string): string {
  return s.toLowerCase().replace(/[\s_\-]+/g, '');
}

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/**
 * Parse pilot CSV text.
 * @param knownCompoundIds when given, a removal column for any other id is an error
 * @param file file name for messages
 */
export function parsePilotCsv(text: string, file?: string, knownCompoundIds?: readonly string[]): PilotData {
  const loc = (row?: number, column?: string) => ({ ...(file !== undefined ? { file } : {}), ...(row !== undefined ? { row } : {}), ...(column !== undefined ? { column } : {}) });
  let records: Array<{ record: string[]; info: { lines: number } }>;
  try {
    records = parse(text.replace(/^\uFEFF/, ''), { skip_empty_lines: true, trim: true, info: true, comment: '#', comment_no_infix: true, relax_quotes: false }) as unknown as Array<{ record: string[]; info: { lines: number } }>;
  } catch (e) {
    const err = e as Error & { lines?: number };
    throw new InputError(`malformed CSV (${err.message}); expected comma-separated values with the same number of cells in every row`, loc(err.lines));
  }
  const header = records[0];
  if (!header) throw new InputError('empty table; expected a header row "sample,dose (mg/L),UV254 reduction (%),removal <compound id> (%)…"', loc(1));
  const hRow = header.info.lines;
  let sampleCol = -1;
  let dose: { index: number; header: string; factor: number } | undefined;
  let uv: { index: number; header: string; factor: number } | undefined;
  const removals: Array<{ id: string; index: number; header: string; factor: number }> = [];
  const fractionFactor = (unit: string | undefined, h: string, what: string): number => {
    const f = unit === undefined ? undefined : FRACTION_FACTORS[unit.trim().toLowerCase()];
    if (f === undefined) throw new InputError(`${unit === undefined ? 'header without a unit' : `unknown unit "${unit}"`}; expected the ${what} in % or as a fraction, e.g. "${h.replace(/\s*[([].*$/, '')} (%)"`, loc(hRow, h));
    return f;
  };
  header.record.forEach((h, index) => {
    const { name, unit } = splitHeader(h);
    const n = norm(name);
    if (n === 'sample') {
      if (sampleCol >= 0) throw new InputError('the sample column appears twice; expected one column', loc(hRow, h));
      sampleCol = index;
    } else if (n === 'dose') {
      if (dose) throw new InputError('the dose column appears twice; expected one column', loc(hRow, h));
      if (unit === undefined) throw new InputError('header without a unit; expected e.g. "dose (mg/L)"', loc(hRow, h));
      let factor: number;
      try { factor = csvUnitFactor(unit, 'massConcentration'); } catch (e) { throw e instanceof InputError ? new InputError(e.expected, loc(hRow, h)) : e; }
      dose = { index, header: h, factor };
    } else if (n === 'uv254reduction' || n === 'δuv254' || n === 'deltauv254') {
      if (uv) throw new InputError('the UV254 reduction column appears twice; expected one column', loc(hRow, h));
      uv = { index, header: h, factor: fractionFactor(unit, h, 'UV254 reduction') };
    } else {
      const m = /^removal\s+(.+)$/i.exec(name);
      if (!m) return; // notes and other columns are ignored
      const id = m[1]!.trim();
      if (knownCompoundIds && !knownCompoundIds.includes(id)) {
        throw new InputError(`unknown compound id "${id}"; expected one of ${knownCompoundIds.map((k) => `"${k}"`).join(', ')}`, loc(hRow, h));
      }
      if (removals.some((r) => r.id === id)) throw new InputError(`the removal of "${id}" appears twice; expected one column per compound`, loc(hRow, h));
      removals.push({ id, index, header: h, factor: fractionFactor(unit, h, 'removal') });
    }
  });
  if (sampleCol < 0) throw new InputError('missing column for the sample name; expected a header "sample"', loc(hRow, 'sample'));
  if (!dose) throw new InputError('missing column for the carbon dose; expected a header such as "dose (mg/L)"', loc(hRow, 'dose'));
  if (!uv) throw new InputError('missing column for the UV254 reduction; expected a header such as "UV254 reduction (%)"', loc(hRow, 'UV254 reduction'));
  if (removals.length === 0) throw new InputError('no removal columns; expected at least one header such as "removal CBZ (%)"', loc(hRow));
  const num = (cell: string, row: number, col: string, what: string): number => {
    if (cell === '') throw new InputError(`empty cell; expected ${what}`, loc(row, col));
    const v = NUMBER.test(cell) ? Number(cell) : NaN;
    if (!Number.isFinite(v)) throw new InputError(`"${cell}" is not a number; expected ${what} (the unit is given in the header)`, loc(row, col));
    return v;
  };
  const pairs: PilotPair[] = [];
  const seen = new Set<string>();
  for (const rec of records.slice(1)) {
    const row = rec.info.lines;
    const cells = rec.record;
    const sample = cells[sampleCol] ?? '';
    if (sample === '') throw new InputError('empty cell; expected a sample name', loc(row, header.record[sampleCol]));
    if (seen.has(sample)) throw new InputError(`duplicate sample "${sample}"; expected one row per sample`, loc(row, header.record[sampleCol]));
    seen.add(sample);
    const d = num(cells[dose.index] ?? '', row, dose.header, 'a dose ≥ 0');
    if (d < 0) throw new InputError(`negative dose ${d}; expected a dose ≥ 0`, loc(row, dose.header));
    const u = num(cells[uv.index] ?? '', row, uv.header, 'a UV254 reduction from 0 to 100 %') * uv.factor;
    if (!(u >= 0 && u <= 1)) throw new InputError(`UV254 reduction ${cells[uv.index]} is outside 0–100 %; expected a reduction from 0 to 100 %`, loc(row, uv.header));
    const rm: Record<string, number | undefined> = {};
    for (const r of removals) {
      const cell = cells[r.index] ?? '';
      if (cell === '') continue; // not measured in this sample
      const v = num(cell, row, r.header, 'a removal up to 100 %') * r.factor;
      if (!(v >= -1 && v <= 1)) throw new InputError(`removal ${cell} is outside −100 … 100 %; expected a removal up to 100 %`, loc(row, r.header));
      rm[r.id] = v;
    }
    pairs.push({ sample, row, doseMgPerL: d * dose.factor, uv254Reduction: u, removals: rm });
  }
  if (pairs.length === 0) throw new InputError('no data rows; expected at least one row below the header', loc(hRow + 1));
  const out: PilotData = { compounds: removals.map((r) => r.id), pairs };
  if (file !== undefined) out.file = file;
  return out;
}

/**
 * Read a pilot CSV file (file access through src/io/readFiles.ts) and parse it with
 * `parsePilotCsv`. @throws InputError naming the file (and row and column).
 */
export function readPilotCsv(path: string, knownCompoundIds?: readonly string[]): PilotData {
  return parsePilotCsv(readTextFile(path, 'pilot CSV file'), path, knownCompoundIds);
}
