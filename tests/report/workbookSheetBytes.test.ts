/**
 * results.xlsx's sheets are written from the CSV text in one pass (no row arrays, numbers
 * classified by a scan of their characters, shared strings looked up through each column's last
 * text): checked byte for byte against a plain reference writer kept here (the CSV parsed into
 * rows, each cell classified with the number pattern, a number written as String(Number(text)),
 * every text looked up in the shared-string table), on tricky cells (unicode, quotes, empty
 * cells, negative zero, exponents, 16- and 17-digit numbers, text that starts like a number),
 * random tables, and long tables (row numbers past 100,000, columns past Z). Invented tables.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseCsv, resultsWorkbook } from '../../src/report/resultsWorkbook.js';
import { unzipText } from '../helpers/unzipText.js';

// the reference writer: rows, a regular expression per cell, strings joined
const NUMBER = /^-?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;
const esc = (s: string) => s.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '').replace(/[<>&"]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;' })[c]!);
function col(c: number): string {
  let s = '';
  for (let n = c + 1; n > 0; n = Math.floor((n - 1) / 26)) s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
  return s;
}
function reference(csvFiles: Record<string, string>): { sheets: string[]; sst: string } {
  const index = new Map<string, number>();
  const items: string[] = [];
  let count = 0;
  const sheets = Object.values(csvFiles).map((text) => {
    const rows = parseCsv(text);
    const header = rows[0] ?? [];
    let x = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships">'
      + '<sheetViews><sheetView workbookViewId="0"><pane ySplit="1" topLeftCell="A2" activePane="bottomLeft" state="frozen"/><selection pane="bottomLeft" activeCell="A2" sqref="A2"/></sheetView></sheetViews><sheetFormatPr defaultRowHeight="15"/>';
    if (header.length) x += `<cols>${header.map((h, c) => `<col min="${c + 1}" max="${c + 1}" width="${Math.min(40, Math.max(10, h.length + 2))}" customWidth="1"/>`).join('')}</cols>`;
    const parts = [x, '<sheetData>'];
    rows.forEach((r, i) => {
      parts.push(`<row r="${i + 1}">`);
      r.forEach((t, c) => {
        if (i === 0) parts.push(`<c r="${col(c)}${i + 1}" s="1" t="inlineStr"><is><t xml:space="preserve">${esc(t)}</t></is></c>`);
        else if (t === '') return;
        else if (NUMBER.test(t)) parts.push(`<c r="${col(c)}${i + 1}"><v>${String(Number(t))}</v></c>`);
        else {
          count++;
          let k = index.get(t);
          if (k === undefined) { k = items.length; index.set(t, k); items.push(t); }
          parts.push(`<c r="${col(c)}${i + 1}" t="s"><v>${k}</v></c>`);
        }
      });
      parts.push('</row>');
    });
    parts.push('</sheetData></worksheet>');
    return parts.join('');
  });
  const sst = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" count="${count}" uniqueCount="${items.length}">${items.map((t) => `<si><t xml:space="preserve">${esc(t)}</t></si>`).join('')}</sst>`;
  return { sheets, sst };
}

async function expectAsReference(csvFiles: Record<string, string>): Promise<void> {
  const files = unzipText(await resultsWorkbook(csvFiles, { created: new Date(Date.UTC(2026, 0, 2)) }));
  const want = reference(csvFiles);
  want.sheets.forEach((x, k) => expect(files[`xl/worksheets/sheet${k + 1}.xml`], Object.keys(csvFiles)[k]).toBe(x));
  expect(files['xl/sharedStrings.xml']).toBe(want.sst);
}

// cells that take every branch of the number scan and of the text lookup
const TRICKY = ['', '0', '-0', '00', '-00.0', '0.0', '1', '-1', '1.50', '1.', '-1.', '.5', '-.5', '.', '-', '-.', '1e5', '1E-7', '-1.5e+300', '2e', '2e+', '2e-x', '1e5x', '1.2.3',
  '0.000001', '0.0000010', '0.0000001', '-0.000001', '0.0000015', '0.1234567890123', '0.12345678901234', '0.123456789012345', '9007199254740993', '9999999999999999',
  '1234567890123456', '123456789012345', '-123456789012345', '12345678901234567', '1.23456789012345', '12345678.9012345', '99999999999999999999', '1e21', '007', '0x10',
  ' 1', '1 ', '+1', 'NaN', 'Infinity', '1_000', '2000-01-01', '2000-01-02', 'Carbon A (coal-based)', 'compound HCT', 'EUR', 'ü', 'a & b', '<x>', '１', '\u0001ctl', '💧 water', 'A,B'];

const csvCell = (t: string) => (/[",\n\r]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t);

describe('results.xlsx sheets written in one pass', () => {
  it('are the reference bytes on tricky cells, in the plain and the quoted path', async () => {
    const plain = TRICKY.filter((t) => !/[",]/.test(t));
    const header = 'a,b (m³/d),"c, quoted",d';
    const rows = (cells: string[]) => cells.map((t, k) => [t, cells[(k + 7) % cells.length]!, cells[(k * 3) % cells.length]!, t].map(csvCell).join(','));
    await expectAsReference({
      'plain.csv': [header.replace(/"c, quoted"/, 'c'), ...rows(plain), ',,,', '', 'x,,', ',y'].join('\n') + '\n',
      'quoted.csv': [header, ...rows(TRICKY), 'z'].join('\n') + '\n',
      'crlf.csv': ['a,b', '1,x', '2,y', '', '3,x'].join('\r\n') + '\r\n',
      'empty.csv': '',
      'newline.csv': '\n',
      'header-only.csv': 'a,b,c',
      'no-final-newline.csv': 'a,b\n1,2\nx,-0',
      'two-final-newlines.csv': 'a,b\n1,2\n\n',
    });
  });

  it('are the reference bytes on random tables', async () => {
    const cell = fc.oneof(fc.constantFrom(...TRICKY), fc.double({ noNaN: true, noDefaultInfinity: true }).map(String), fc.string({ maxLength: 6 }), fc.stringMatching(/^-?\d{0,18}(\.\d{0,8})?(e[-+]?\d{1,3})?$/));
    const table = fc.array(fc.array(cell, { minLength: 1, maxLength: 6 }), { minLength: 1, maxLength: 25 }).map((rows) => rows.map((r) => r.map(csvCell).join(',')).join('\n') + '\n');
    const plainTable = fc.array(fc.array(cell.filter((t) => !/[",\n\r]/.test(t)), { minLength: 1, maxLength: 6 }), { minLength: 1, maxLength: 25 }).map((rows) => rows.map((r) => r.join(',')).join('\n'));
    await fc.assert(fc.asyncProperty(table, plainTable, plainTable, async (a, b, c) => { await expectAsReference({ 'a.csv': a, 'b.csv': b, 'c.csv': c }); }), { numRuns: 300 });
  });

  it('are the reference bytes on long tables (row 100,000 and on, 30 columns, texts repeated and in sequence)', async () => {
    const days = 50_050;
    const lines = ['date,carbon,dose (mg/L),governed by,currency'];
    for (const carbon of ['Carbon A', 'Carbon B']) {
      for (let k = 0; k < days; k++) {
        // the second carbon's days follow the first's in order; a few extra texts break the sequence
        const date = k === 20_000 && carbon === 'Carbon B' ? 'gap' : `day ${k}`;
        lines.push(`${date},${carbon},${k % 13 === 0 ? '' : (10 + (k % 97) / 7).toPrecision(8)},${k % 1000 === 0 ? `new goal ${k}` : `compound X${k % 3}`},EUR`);
      }
    }
    const wide = [Array.from({ length: 30 }, (_, c) => `h${c}`).join(','), ...Array.from({ length: 40 }, (_, r) => Array.from({ length: 30 }, (_, c) => ((r + c) % 4 === 0 ? `t${c}` : String(r * c - 5))).join(','))].join('\n') + '\n';
    await expectAsReference({ 'long.csv': lines.join('\n') + '\n', 'wide.csv': wide });
  }, 60_000);
});
