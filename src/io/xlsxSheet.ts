/**
 * Reading one sheet of an .xlsx workbook (Office Open XML, ECMA-376) into rows of cell texts,
 * with exceljs. exceljs reads workbooks asynchronously; the input readers of this tool are
 * synchronous, so the sheet is read in a short-lived child process and handed back as JSON.
 *
 * Cell texts: numbers in JavaScript's shortest round-trip form (decimal point), dates as
 * YYYY-MM-DD (or the full ISO time when not at midnight), formulas by their cached result, rich
 * text by its plain text, empty cells as ''. Rows keep the sheet's row numbers; empty rows and
 * rows whose first cell starts with `#` (comments, as in CSV) are left out.
 *
 * A path may name the sheet after `#`: `data.xlsx#Isotherm`; without it the first sheet is read.
 * @throws InputError naming the file (missing file, not a workbook, unknown sheet)
 */
import { execFileSync } from 'node:child_process';
import { createRequire } from 'node:module';
import { InputError } from '../core/errors.js';
import type { TableRecord } from '../tables/csvTable.js';

/** True when `path` (optionally with `#Sheet`) names an .xlsx workbook. */
export function isXlsxPath(path: string): boolean {
  return /\.xlsx(?:#.*)?$/i.test(path);
}

/** Split `data.xlsx#Sheet1` into the file and the sheet name (undefined: the first sheet). */
export function splitSheetPath(path: string): { file: string; sheet: string | undefined } {
  const m = /^(.*\.xlsx)(?:#(.*))?$/i.exec(path);
  if (!m) return { file: path, sheet: undefined };
  return { file: m[1]!, sheet: m[2] === undefined || m[2] === '' ? undefined : m[2] };
}

const CHILD = `
const ExcelJS = require(process.argv[1]);
const [file, sheetName] = [process.argv[2], process.argv[3]];
const text = (v) => {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return String(v);
  if (typeof v === 'string') return v;
  if (typeof v === 'boolean') return v ? 'TRUE' : 'FALSE';
  if (v instanceof Date) { const iso = v.toISOString(); return iso.endsWith('T00:00:00.000Z') ? iso.slice(0, 10) : iso; }
  if (Array.isArray(v.richText)) return v.richText.map((r) => r.text).join('');
  if ('result' in v) return text(v.result);
  if ('formula' in v || 'sharedFormula' in v) return '';
  if ('text' in v) return text(v.text);
  if ('error' in v) return String(v.error);
  return String(v);
};
(async () => {
  const wb = new ExcelJS.Workbook();
  try { await wb.xlsx.readFile(file); } catch (e) { process.stderr.write('NOTXLSX ' + e.message); process.exit(3); }
  const names = wb.worksheets.map((w) => w.name);
  const ws = sheetName === '' ? wb.worksheets[0] : wb.getWorksheet(sheetName);
  if (!ws) { process.stderr.write('NOSHEET ' + JSON.stringify(names)); process.exit(4); }
  const rows = [];
  ws.eachRow({ includeEmpty: false }, (row, n) => {
    const cells = [];
    for (let c = 1; c <= row.cellCount; c++) cells.push(text(row.getCell(c).value).trim());
    while (cells.length && cells[cells.length - 1] === '') cells.pop();
    if (cells.length === 0 || cells[0].startsWith('#')) return;
    rows.push({ cells, row: n });
  });
  const width = Math.max(0, ...rows.map((r) => r.cells.length));
  for (const r of rows) while (r.cells.length < width) r.cells.push('');
  process.stdout.write(JSON.stringify({ sheet: ws.name, rows }));
})().catch((e) => { process.stderr.write('NOTXLSX ' + e.message); process.exit(3); });
`;

/**
 * Read a sheet of an .xlsx file. @param path file path, optionally with `#Sheet`
 * @throws InputError naming the file
 */
export function readXlsxSheet(path: string): { file: string; sheet: string; rows: TableRecord[] } {
  const { file, sheet } = splitSheetPath(path);
  const exceljs = createRequire(import.meta.url).resolve('exceljs');
  let out: string;
  try {
    out = execFileSync(process.execPath, ['-e', CHILD, exceljs, file, sheet ?? ''], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024, stdio: ['ignore', 'pipe', 'pipe'] });
  } catch (e) {
    const err = e as { status?: number; stderr?: string };
    const msg = String(err.stderr ?? '');
    if (msg.startsWith('NOSHEET ')) {
      const names = JSON.parse(msg.slice(8)) as string[];
      throw new InputError(`no sheet named "${sheet}"; expected one of ${names.map((n) => `"${n}"`).join(', ')} (write FILE.xlsx#SHEET)`, { file });
    }
    throw new InputError(`cannot read the workbook (${msg.replace(/^NOTXLSX /, '').split('\n')[0] || 'unknown error'}); expected an .xlsx file`, { file });
  }
  const parsed = JSON.parse(out) as { sheet: string; rows: TableRecord[] };
  return { file, sheet: parsed.sheet, rows: parsed.rows };
}
