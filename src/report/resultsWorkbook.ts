/**
 * The results workbook (results.xlsx): one sheet per CSV table of the run, built from the CSV
 * texts themselves so the workbook holds exactly the numbers of the CSV files. Header cells keep
 * their units ("dose (mg/L)"); a cell that reads as a number in the CSV is written as a number,
 * everything else as text; an empty cell stays empty. Built in memory with exceljs (Office Open
 * XML, ECMA-376; its streaming writer); the caller writes the bytes.
 */
import ExcelJS from 'exceljs';
import { PassThrough } from 'node:stream';

/** RFC 4180 fields of CSV text (quotes doubled inside quoted fields; \n or \r\n line ends). */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') { field += '"'; i++; }
      else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') { row.push(field); field = ''; }
    else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      row.push(field); rows.push(row); row = []; field = '';
    } else field += ch;
  }
  if (field !== '' || row.length) { row.push(field); rows.push(row); }
  return rows;
}

const NUMBER = /^-?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/** A CSV cell as a workbook value: number when it reads as one, else text; '' stays empty. */
export function cellValue(text: string): string | number | null {
  if (text === '') return null;
  return NUMBER.test(text) ? Number(text) : text;
}

/** Sheet name from a CSV file name: without ".csv", at most 31 characters (the format's limit). */
export function sheetName(file: string): string {
  return file.replace(/\.csv$/i, '').slice(0, 31);
}

/**
 * @param csvFiles CSV texts keyed by file name, in the order the sheets should take
 * @returns the .xlsx file's bytes
 */
export async function resultsWorkbook(csvFiles: Record<string, string>, meta: { creator?: string; created?: Date } = {}): Promise<Uint8Array> {
  // the streaming writer without shared strings: rows are serialised as they are added (a
  // 36,500-day series has 73,000 daily rows; the in-memory model cost several times more)
  const chunks: Buffer[] = [];
  const stream = new PassThrough();
  stream.on('data', (c: Buffer) => chunks.push(c));
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ stream, useStyles: true, useSharedStrings: false });
  wb.creator = meta.creator ?? 'sorbshare';
  if (meta.created) { wb.created = meta.created; wb.modified = meta.created; }
  for (const [file, text] of Object.entries(csvFiles)) {
    const rows = parseCsv(text);
    const ws = wb.addWorksheet(sheetName(file), { views: [{ state: 'frozen', ySplit: 1 }] });
    ws.columns = (rows[0] ?? []).map((h) => ({ width: Math.min(40, Math.max(10, h.length + 2)) }));
    rows.forEach((r, i) => {
      const row = ws.addRow(i === 0 ? r : r.map(cellValue));
      if (i === 0) row.font = { bold: true };
      row.commit();
    });
    ws.commit();
  }
  await wb.commit();
  return new Uint8Array(Buffer.concat(chunks));
}
