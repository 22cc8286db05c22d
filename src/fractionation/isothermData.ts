/**
 * A DOC (and UV254) batch isotherm, checked: rows of carbon dose, initial DOC (DOC0, optional
 * column; several values make a dilution series), equilibrium DOC, and optionally UV254 and
 * UV254_0 (1/m). Internal units: mg/L and 1/m.
 *
 * Checks (bad input → InputError naming file, row, column): a DOC0 for every row (column or a
 * dose-0 row); a dose-0 row agrees with DOC0 (within 5 %); DOC does not rise with dose anywhere
 * along the isotherm: no DOC lies above the lowest DOC at any smaller dose (or DOC0) by more than
 * max(0.2 mg/L, 10 % of DOC0) — the difference two measurements may show from analytical noise of
 * a few percent for DOC (common practice) — so a rise in small steps is caught once it adds up;
 * the same for UV254 (max(0.2 1/m, 10 %), common practice); DOC0 > 0.
 */
import { InputError } from '../core/errors.js';
import type { CsvColumnSpec, CsvTable } from '../tables/csvTable.js';

/** Columns of a DOC (and UV254) isotherm table: their names, units and whether they are required. */
export const ISOTHERM_COLUMNS: readonly CsvColumnSpec[] = [
  { key: 'dose', names: ['dose', 'carbon dose', 'PAC dose', 'PAC'], kind: 'massConcentration', required: true, description: 'carbon dose' },
  { key: 'doc0', names: ['DOC0', 'initial DOC'], kind: 'massConcentration', required: false, description: 'initial DOC (DOC0)' },
  { key: 'doc', names: ['DOC', 'equilibrium DOC'], kind: 'massConcentration', required: true, description: 'equilibrium DOC' },
  { key: 'uv', names: ['UV254', 'UV'], kind: 'absorbance', required: false, allowBlank: true, description: 'equilibrium UV254' },
  { key: 'uv0', names: ['UV254_0', 'UV0', 'initial UV254'], kind: 'absorbance', required: false, allowBlank: true, description: 'initial UV254 (UV254_0)' },
];

/** One isotherm point in internal units (the form tests and other code may pass directly). */
export interface IsothermPoint {
  doseMgPerL: number;
  /** Initial DOC; when absent, taken from the dose-0 row(s). */
  doc0MgPerL?: number;
  docMgPerL: number;
  uv254PerM?: number;
  uv254_0PerM?: number;
  /** Row number for messages. */
  row?: number;
}

export interface IsothermRow {
  row: number;
  doseMgPerL: number;
  doc0MgPerL: number;
  docMgPerL: number;
  uv254PerM?: number;
  uv254_0PerM?: number;
}

export interface IsothermData {
  file?: string;
  rows: IsothermRow[];
  /** Header text of each column, for messages. */
  headers: { dose: string; doc: string; doc0: string; uv: string; uv0: string };
  hasUv: boolean;
}

/** Relative agreement asked of a dose-0 DOC and DOC0 (common practice). */
export const DOSE0_TOLERANCE_RELATIVE = 0.05;

/** Tolerance on DOC rising with dose, mg/L: the spread of two DOC measurements from analytical noise (common practice). */
export function risingTolerance(doc0MgPerL: number): number {
  return Math.max(0.2, 0.1 * doc0MgPerL);
}

/** Tolerance on UV254 rising with dose, 1/m (common practice, as for DOC). */
export function risingUvTolerance(uv0PerM: number): number {
  return Math.max(0.2, 0.1 * uv0PerM);
}

/** Points from a CSV table read with ISOTHERM_COLUMNS. */
export function pointsFromTable(table: CsvTable): { points: IsothermPoint[]; headers: IsothermData['headers'] } {
  const col = table.columns;
  const get = (key: string) => col[key];
  const dose = get('dose'), doc = get('doc');
  if (!dose || !doc) throw new InputError('missing column; expected "dose (mg/L)" and "DOC (mg/L)"', { ...(table.file ? { file: table.file } : {}), row: 1, column: !dose ? 'dose' : 'DOC' });
  const doc0 = get('doc0'), uv = get('uv'), uv0 = get('uv0');
  const points = table.rowNumbers.map((row, i) => {
    const p: IsothermPoint = { row, doseMgPerL: dose.values[i]!, docMgPerL: doc.values[i]! };
    if (doc0) p.doc0MgPerL = doc0.values[i]!;
    if (uv && !uv.blank[i]) p.uv254PerM = uv.values[i]!;
    if (uv0 && !uv0.blank[i]) p.uv254_0PerM = uv0.values[i]!;
    return p;
  });
  return { points, headers: { dose: dose.header, doc: doc.header, doc0: doc0?.header ?? 'DOC0', uv: uv?.header ?? 'UV254', uv0: uv0?.header ?? 'UV254_0' } };
}

const DEFAULT_HEADERS: IsothermData['headers'] = { dose: 'dose', doc: 'DOC', doc0: 'DOC0', uv: 'UV254', uv0: 'UV254_0' };

/**
 * Check isotherm points and fill in DOC0 (and UV254_0) from dose-0 rows where needed.
 * @throws InputError naming file, row and column
 */
export function checkIsotherm(points: readonly IsothermPoint[], file?: string, headers: IsothermData['headers'] = DEFAULT_HEADERS): IsothermData {
  const loc = (row: number | undefined, column: string) => ({ ...(file !== undefined ? { file } : {}), ...(row !== undefined ? { row } : {}), column });
  if (points.length === 0) throw new InputError('no data rows; expected isotherm rows of dose and DOC', loc(2, headers.dose));
  const rowOf = (p: IsothermPoint, i: number) => p.row ?? i + 2;
  points.forEach((p, i) => {
    for (const [v, h] of [[p.doseMgPerL, headers.dose], [p.docMgPerL, headers.doc], [p.doc0MgPerL, headers.doc0], [p.uv254PerM, headers.uv], [p.uv254_0PerM, headers.uv0]] as const) {
      if (v !== undefined && (!Number.isFinite(v) || v < 0)) throw new InputError(`expected a finite value ≥ 0, got ${v}`, loc(rowOf(p, i), h));
    }
  });
  const hasDoc0 = points.every((p) => p.doc0MgPerL !== undefined);
  const zeroRows = points.map((p, i) => ({ p, i })).filter(({ p }) => p.doseMgPerL === 0);
  let commonDoc0: number | undefined;
  if (!hasDoc0) {
    const missing = points.findIndex((p) => p.doc0MgPerL === undefined);
    if (points.some((p) => p.doc0MgPerL !== undefined)) throw new InputError('empty DOC0; expected DOC0 on every row or no DOC0 column', loc(rowOf(points[missing]!, missing), headers.doc0));
    if (zeroRows.length === 0) throw new InputError('no initial DOC; expected a DOC0 column or a row with dose 0', loc(1, headers.doc0));
    commonDoc0 = zeroRows.reduce((s, { p }) => s + p.docMgPerL, 0) / zeroRows.length;
    for (const { p, i } of zeroRows) {
      if (Math.abs(p.docMgPerL - commonDoc0) > DOSE0_TOLERANCE_RELATIVE * commonDoc0) {
        throw new InputError(`dose-0 rows disagree (DOC ${p.docMgPerL} against mean ${fmt(commonDoc0)} mg/L); for a dilution series add a DOC0 column`, loc(rowOf(p, i), headers.doc));
      }
    }
  }
  const rows: IsothermRow[] = points.map((p, i) => {
    const r: IsothermRow = { row: rowOf(p, i), doseMgPerL: p.doseMgPerL, doc0MgPerL: p.doc0MgPerL ?? commonDoc0!, docMgPerL: p.docMgPerL };
    if (p.uv254PerM !== undefined) r.uv254PerM = p.uv254PerM;
    if (p.uv254_0PerM !== undefined) r.uv254_0PerM = p.uv254_0PerM;
    return r;
  });
  for (const r of rows) {
    if (r.doseMgPerL > 0 && !(r.docMgPerL > 0)) throw new InputError('expected an equilibrium DOC > 0 mg/L (a value below detection cannot be fitted; leave the row out)', loc(r.row, headers.doc));
    if (!(r.doc0MgPerL > 0)) throw new InputError(`expected an initial DOC > 0 mg/L, got ${r.doc0MgPerL}`, loc(r.row, hasDoc0 ? headers.doc0 : headers.doc));
    if (r.doseMgPerL === 0 && hasDoc0 && Math.abs(r.docMgPerL - r.doc0MgPerL) > DOSE0_TOLERANCE_RELATIVE * r.doc0MgPerL) {
      throw new InputError(`at dose 0 the DOC (${fmt(r.docMgPerL)} mg/L) disagrees with DOC0 (${fmt(r.doc0MgPerL)} mg/L) by more than ${DOSE0_TOLERANCE_RELATIVE * 100} %; expected equal values`, loc(r.row, headers.doc));
    }
  }
  // DOC must not rise with dose anywhere within a DOC0 group: compare with the lowest value at any smaller dose
  const groups = new Map<number, IsothermRow[]>();
  for (const r of rows) groups.set(r.doc0MgPerL, [...(groups.get(r.doc0MgPerL) ?? []), r]);
  for (const [doc0, g] of groups) {
    const sorted = [...g].sort((a, b) => a.doseMgPerL - b.doseMgPerL);
    let lowest: { v: number; r?: IsothermRow } = { v: doc0 };
    let lowestUv: { v: number; r?: IsothermRow } = { v: Infinity };
    for (const r of sorted) {
      if (r.docMgPerL > lowest.v + risingTolerance(doc0) && (!lowest.r || r.doseMgPerL > lowest.r.doseMgPerL)) {
        const than = lowest.r ? `${fmt(lowest.v)} mg/L at dose ${fmt(lowest.r.doseMgPerL)} mg/L (row ${lowest.r.row})` : `DOC0 ${fmt(lowest.v)} mg/L`;
        throw new InputError(`DOC ${fmt(r.docMgPerL)} mg/L at dose ${fmt(r.doseMgPerL)} mg/L is higher than ${than}; expected DOC to fall (or stay) as the dose rises (beyond an analytical noise of ${fmt(risingTolerance(doc0))} mg/L, common practice)`, loc(r.row, headers.doc));
      }
      if (r.docMgPerL < lowest.v) lowest = { v: r.docMgPerL, r };
      if (r.uv254PerM !== undefined) {
        const uvTol = risingUvTolerance(r.uv254_0PerM ?? (Number.isFinite(lowestUv.v) ? lowestUv.v : r.uv254PerM));
        if (lowestUv.r && r.uv254PerM > lowestUv.v + uvTol && r.doseMgPerL > lowestUv.r.doseMgPerL) {
          throw new InputError(`UV254 ${fmt(r.uv254PerM)} 1/m at dose ${fmt(r.doseMgPerL)} mg/L is higher than ${fmt(lowestUv.v)} 1/m at dose ${fmt(lowestUv.r.doseMgPerL)} mg/L (row ${lowestUv.r.row}); expected UV254 to fall (or stay) as the dose rises (beyond an analytical noise of ${fmt(uvTol)} 1/m, common practice)`, loc(r.row, headers.uv));
        }
        if (r.uv254PerM < lowestUv.v) lowestUv = { v: r.uv254PerM, r };
      }
    }
  }
  const out: IsothermData = { rows, headers, hasUv: rows.some((r) => r.uv254PerM !== undefined && r.doseMgPerL > 0) };
  if (file !== undefined) out.file = file;
  return out;
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}
