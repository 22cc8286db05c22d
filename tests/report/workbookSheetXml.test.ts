/**
 * The worksheet and shared-string XML of results.xlsx for a small table, compared with the text
 * written out by hand from the SpreadsheetML rules (ECMA-376 Part 1: cell references, inline
 * header strings, numbers in <v>, text as shared-string indices; XML 1.0 escaping). Read back
 * from the ZIP with node:zlib's inflate (an independent decoder). Invented table.
 */
import { describe, expect, it } from 'vitest';
import { resultsWorkbook } from '../../src/report/resultsWorkbook.js';
import { unzipText } from '../helpers/unzipText.js';

describe('results.xlsx sheet XML', () => {
  it('is the expected text for a small table (header, numbers, shared text, blanks, escaping, UTF-8)', async () => {
    const csv = 'carbon,"flow (m³/d)",note\nA & B,12345,<x>\nA & B,1.50,\nü,-0.000000123,A & B\n';
    const files = unzipText(await resultsWorkbook({ 'table.csv': csv }, { created: new Date(Date.UTC(2026, 0, 2)) }));
    const sheet = files['xl/worksheets/sheet1.xml']!;
    const data = sheet.slice(sheet.indexOf('<sheetData>'));
    const h = (ref: string, t: string) => `<c r="${ref}" s="1" t="inlineStr"><is><t xml:space="preserve">${t}</t></is></c>`;
    expect(data).toBe('<sheetData>'
      + `<row r="1">${h('A1', 'carbon')}${h('B1', 'flow (m³/d)')}${h('C1', 'note')}</row>`
      + '<row r="2"><c r="A2" t="s"><v>0</v></c><c r="B2"><v>12345</v></c><c r="C2" t="s"><v>1</v></c></row>'
      + '<row r="3"><c r="A3" t="s"><v>0</v></c><c r="B3"><v>1.5</v></c></row>'
      + '<row r="4"><c r="A4" t="s"><v>2</v></c><c r="B4"><v>-1.23e-7</v></c><c r="C4" t="s"><v>0</v></c></row>'
      + '</sheetData></worksheet>');
    expect(sheet).toContain('<cols><col min="1" max="1" width="10" customWidth="1"/><col min="2" max="2" width="13" customWidth="1"/>');
    const sst = files['xl/sharedStrings.xml']!;
    expect(sst.slice(sst.indexOf('<sst'))).toBe('<sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" count="5" uniqueCount="3">'
      + '<si><t xml:space="preserve">A &amp; B</t></si><si><t xml:space="preserve">&lt;x&gt;</t></si><si><t xml:space="preserve">ü</t></si></sst>');
  });
});
