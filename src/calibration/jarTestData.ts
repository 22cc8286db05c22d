/**
 * Jar tests of one target compound in the site water: rows of initial concentration C0, carbon
 * dose and equilibrium concentration c (units from the headers, e.g. `C0 (ng/L)`), optionally the
 * site DOC of each test. Internal units mg/L.
 *
 * Checks (InputError naming file, row, column): C0 > 0; c > 0 where the dose is > 0 (a value
 * below detection cannot enter a logarithmic fit); c not above C0 by more than 10 % (analytical
 * noise, common practice); a dose-0 row agrees with C0 within 20 % (common practice for trace
 * analyses); DOC > 0; within one series (same C0 and DOC) c does not rise with dose anywhere: no c
 * lies above the lowest c at any smaller dose by more than 20 % of it plus 1 % of C0 (trace
 * analyses, common practice), so a rise in small steps is caught once it adds up.
 */
import { InputError } from '../core/errors.js';
import { readCsvTable, type CsvColumnSpec, type CsvTable } from '../tables/csvTable.js';

/** Columns of a jar-test table (C0, dose, c): their names, units and whether they are required. */
export const JAR_TEST_COLUMNS: readonly CsvColumnSpec[] = [
  { key: 'c0', names: ['C0', 'initial concentration'], kind: 'massConcentration', required: true, description: 'initial target concentration C0' },
  { key: 'dose', names: ['dose', 'carbon dose', 'PAC dose', 'PAC'], kind: 'massConcentration', required: true, description: 'carbon dose' },
  { key: 'c', names: ['c', 'ce', 'equilibrium concentration'], kind: 'massConcentration', required: true, description: 'equilibrium target concentration c' },
  { key: 'doc', names: ['DOC', 'DOC0'], kind: 'massConcentration', required: false, description: 'site DOC' },
];

export interface JarTestPoint {
  c0MgPerL: number;
  doseMgPerL: number;
  cMgPerL: number;
  docMgPerL?: number;
  row?: number;
}

export interface JarTestRow {
  row: number;
  c0MgPerL: number;
  doseMgPerL: number;
  cMgPerL: number;
  docMgPerL?: number;
}

export interface JarTestData {
  file?: string;
  rows: JarTestRow[];
  headers: { c0: string; dose: string; c: string; doc: string };
  hasDoc: boolean;
}

/** Anything `calibrate` reads: a table read with JAR_TEST_COLUMNS, CSV text, or points. */
export type JarTestInput = CsvTable | string | readonly JarTestPoint[];

const DEFAULT_HEADERS: JarTestData['headers'] = { c0: 'C0', dose: 'dose', c: 'c', doc: 'DOC' };

/** Read and check jar tests. @throws InputError naming file, row and column */
export function readJarTests(input: JarTestInput, file?: string): JarTestData {
  let points: JarTestPoint[];
  let headers = DEFAULT_HEADERS;
  if (Array.isArray(input)) {
    points = [...(input as JarTestPoint[])];
  } else {
    const table = typeof input === 'string' ? readCsvTable(input, JAR_TEST_COLUMNS, file) : (input as CsvTable);
    file = file ?? table.file;
    const col = table.columns;
    const c0 = col.c0, dose = col.dose, c = col.c, doc = col.doc;
    if (!c0 || !dose || !c) throw new InputError('missing column; expected "C0 (ng/L)", "dose (mg/L)" and "c (ng/L)"', { ...(file ? { file } : {}), row: 1, column: !c0 ? 'C0' : !dose ? 'dose' : 'c' });
    headers = { c0: c0.header, dose: dose.header, c: c.header, doc: doc?.header ?? 'DOC' };
    points = table.rowNumbers.map((row, i) => {
      const p: JarTestPoint = { row, c0MgPerL: c0.values[i]!, doseMgPerL: dose.values[i]!, cMgPerL: c.values[i]! };
      if (doc) p.docMgPerL = doc.values[i]!;
      return p;
    });
  }
  const loc = (row: number, column: string) => ({ ...(file !== undefined ? { file } : {}), row, column });
  if (points.length === 0) throw new InputError('no data rows; expected jar-test rows of C0, dose and c', loc(2, headers.c0));
  const rows: JarTestRow[] = points.map((p, i) => {
    const row = p.row ?? i + 2;
    for (const [v, h] of [[p.c0MgPerL, headers.c0], [p.doseMgPerL, headers.dose], [p.cMgPerL, headers.c], [p.docMgPerL, headers.doc]] as const) {
      if (v !== undefined && (!Number.isFinite(v) || v < 0)) throw new InputError(`expected a finite value ≥ 0, got ${v}`, loc(row, h));
    }
    if (!(p.c0MgPerL > 0)) throw new InputError('expected an initial concentration C0 > 0', loc(row, headers.c0));
    if (p.doseMgPerL > 0 && !(p.cMgPerL > 0)) throw new InputError('expected c > 0 (a value below detection cannot be fitted on a log scale; leave the row out)', loc(row, headers.c));
    if (p.cMgPerL > 1.1 * p.c0MgPerL) throw new InputError(`c (${p.cMgPerL} mg/L) exceeds C0 (${p.c0MgPerL} mg/L) by more than 10 %; expected c ≤ C0`, loc(row, headers.c));
    if (p.doseMgPerL === 0 && Math.abs(p.cMgPerL - p.c0MgPerL) > 0.2 * p.c0MgPerL) throw new InputError(`at dose 0, c (${p.cMgPerL} mg/L) disagrees with C0 (${p.c0MgPerL} mg/L) by more than 20 %; expected equal values`, loc(row, headers.c));
    if (p.docMgPerL !== undefined && !(p.docMgPerL > 0)) throw new InputError('expected a site DOC > 0', loc(row, headers.doc));
    const r: JarTestRow = { row, c0MgPerL: p.c0MgPerL, doseMgPerL: p.doseMgPerL, cMgPerL: p.cMgPerL };
    if (p.docMgPerL !== undefined) r.docMgPerL = p.docMgPerL;
    return r;
  });
  checkFallingWithDose(rows, loc, headers);
  const hasDoc = rows.every((r) => r.docMgPerL !== undefined);
  const out: JarTestData = { rows, headers, hasDoc };
  if (file !== undefined) out.file = file;
  return out;
}

/** Relative tolerance on c rising with dose in one jar-test series (trace analyses, common practice). */
export const JAR_RISE_TOLERANCE_RELATIVE = 0.2;

/** c must not rise with dose within a series of the same C0 and DOC. @throws InputError naming both rows */
function checkFallingWithDose(rows: readonly JarTestRow[], loc: (row: number, column: string) => { file?: string; row: number; column: string }, headers: JarTestData['headers']): void {
  const series = new Map<string, JarTestRow[]>();
  for (const r of rows) {
    const key = `${r.c0MgPerL}|${r.docMgPerL ?? ''}`;
    series.set(key, [...(series.get(key) ?? []), r]);
  }
  for (const g of series.values()) {
    const sorted = [...g].sort((a, b) => a.doseMgPerL - b.doseMgPerL);
    let lowest: JarTestRow | undefined;
    for (const r of sorted) {
      if (lowest && r.doseMgPerL > lowest.doseMgPerL && r.cMgPerL > lowest.cMgPerL * (1 + JAR_RISE_TOLERANCE_RELATIVE) + 0.01 * r.c0MgPerL) {
        throw new InputError(`c (${fmtC(r.cMgPerL)} mg/L) at dose ${r.doseMgPerL} mg/L is higher than c (${fmtC(lowest.cMgPerL)} mg/L) at the smaller dose ${lowest.doseMgPerL} mg/L (row ${lowest.row}) in the same series (C0 ${fmtC(r.c0MgPerL)} mg/L${r.docMgPerL !== undefined ? `, DOC ${fmtC(r.docMgPerL)} mg/L` : ''}); expected c to fall (or stay) as the dose rises (beyond ${JAR_RISE_TOLERANCE_RELATIVE * 100} % analytical noise, common practice)`, loc(r.row, headers.c));
      }
      if (!lowest || r.cMgPerL < lowest.cMgPerL) lowest = r;
    }
  }
}

function fmtC(x: number): string {
  return Number(x.toPrecision(4)).toString();
}
