/**
 * Pilot pairs from CSV text: one row per sample, with the UV254 reduction and the measured
 * removal of each compound.
 *
 *   sample,dose (mg/L),UV254 reduction (%),removal CBZ (%),removal DCF (%)
 *   P1,10,35.2,71,64
 *
 * - `sample`: text (required, one row per sample); `dose`: a mass concentration unit (mg/L,
 *   g/m3 …; required);
 * - `UV254 reduction`: `%` or `fraction` (also `-`), 0–100 % (required);
 * - `removal <compound id>`: `%` or `fraction`, one column per compound, ≤ 100 % (slightly
 *   negative measured removals are allowed down to −100 %); a blank cell = not measured.
 * Other columns (notes) are ignored. Rows are numbered as a spreadsheet shows them (header = 1).
 *
 * Reading, units, percentages and cell checks are the shared reader's (src/io/csvTable.ts); this
 * file declares the columns (the removal columns from the header) and checks what is pilot-only:
 * known compound ids and unique sample names.
 * @throws InputError naming file, row and column for every bad value.
 */
import { InputError } from '../core/errors.js';
import { readCsvTable, type CsvColumnSpec, type CsvHeaderRow, type CsvTable } from '../tables/csvTable.js';
import { splitHeader } from '../units/parseQuantity.js';
import type { PilotPair } from './pilotCheck.js';

export interface PilotData {
  file?: string;
  /** Compound ids in column order. */
  compounds: string[];
  pairs: PilotPair[];
}

const PILOT_COLUMNS: readonly CsvColumnSpec[] = [
  { key: 'sample', names: ['sample'], kind: 'text', required: true, description: 'sample name' },
  { key: 'dose', names: ['dose'], kind: 'massConcentration', required: true, description: 'carbon dose' },
  { key: 'uv', names: ['UV254 reduction', 'ΔUV254', 'delta UV254'], kind: 'fraction', required: true, description: 'UV254 reduction' },
];

/** Keys of the removal columns: the prefix and the compound id (cannot clash with the fixed keys). */
const REMOVAL = 'removal:';

/**
 * The pilot columns for a header: the fixed ones plus one `removal <id>` column per compound,
 * in header order. @throws InputError at the header (unknown id, no removal column)
 */
function pilotColumns(header: CsvHeaderRow, knownCompoundIds?: readonly string[]): CsvColumnSpec[] {
  const removals: CsvColumnSpec[] = [];
  for (const h of header.cells) {
    const m = /^removal\s+(.+)$/i.exec(splitHeader(h).name);
    if (!m) continue; // other columns are the fixed ones or ignored
    const id = m[1]!.trim();
    if (knownCompoundIds && !knownCompoundIds.includes(id)) {
      throw new InputError(`unknown compound id "${id}"; expected one of ${knownCompoundIds.map((k) => `"${k}"`).join(', ')}`, { row: header.row, column: h });
    }
    if (removals.some((r) => r.key === REMOVAL + id)) continue; // the reader reports the second column
    removals.push({ key: REMOVAL + id, names: [`removal ${id}`], kind: 'fraction', required: false, allowBlank: true, min: -1, max: 1, description: `removal of ${id}` });
  }
  if (removals.length === 0) throw new InputError('no removal columns; expected at least one header such as "removal CBZ (%)"', { row: header.row });
  return [...PILOT_COLUMNS, ...removals];
}

/**
 * Parse pilot CSV text.
 * @param knownCompoundIds when given, a removal column for any other id is an error
 * @param file file name for messages
 */
export function parsePilotCsv(text: string, file?: string, knownCompoundIds?: readonly string[]): PilotData {
  return pilotFromTable(readCsvTable(text, pilotColumnSpecs(knownCompoundIds), file));
}

/** The column specs of a pilot table (a function of its header), for readers of other table files. */
export function pilotColumnSpecs(knownCompoundIds?: readonly string[]): (header: CsvHeaderRow) => CsvColumnSpec[] {
  return (header) => pilotColumns(header, knownCompoundIds);
}

/** Pilot pairs from a table read with `pilotColumnSpecs`. @throws InputError naming file, row and column */
export function pilotFromTable(table: CsvTable): PilotData {
  const file = table.file;
  const sample = table.columns.sample!; // required columns: the reader checked they are there
  const dose = table.columns.dose!;
  const uv = table.columns.uv!;
  const removals = Object.values(table.columns).filter((c) => c.key.startsWith(REMOVAL)); // header order
  const compounds = removals.map((r) => r.key.slice(REMOVAL.length));
  const seen = new Set<string>();
  const pairs = table.rowNumbers.map((row, i): PilotPair => {
    const name = sample.cells[i]!;
    if (seen.has(name)) throw new InputError(`duplicate sample "${name}"; expected one row per sample`, { file, row, column: sample.header });
    seen.add(name);
    const rm: Record<string, number | undefined> = {};
    removals.forEach((r, k) => {
      if (!r.blank[i]) rm[compounds[k]!] = r.values[i]!; // blank = not measured in this sample
    });
    return { sample: name, row, doseMgPerL: dose.values[i]!, uv254Reduction: uv.values[i]!, removals: rm };
  });
  const out: PilotData = { compounds, pairs };
  if (file !== undefined) out.file = file;
  return out;
}
