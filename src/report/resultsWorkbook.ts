/**
 * The results workbook (results.xlsx): one sheet per CSV table of the run, built from the CSV
 * texts themselves so the workbook holds exactly the numbers of the CSV files. Header cells keep
 * their units ("dose (mg/L)"); a cell that reads as a number in the CSV is written as a number,
 * everything else as text; an empty cell stays empty; the header row is bold and stays in view.
 * The SpreadsheetML parts (Office Open XML, ECMA-376 Part 1: workbook, worksheets, one
 * shared-string table for the text cells, one style sheet, core properties) are written as text
 * straight from the CSV cells and packed with zipArchive.ts, the parts compressed on the thread
 * pool: a 36,500-day series has 73,000 daily rows, and building cell objects for them cost
 * seconds. A CSV text without quotes is written in one pass over its characters, as bytes, with
 * no string per row or cell (measured on the 36,500-day series' tables, 6.6 M characters: about
 * 370 ms of CPU with the compression, from 570 ms when the text was split into rows of strings and
 * each cell tested with a regular expression). The caller writes the bytes.
 */
import { zipArchiveAsync } from './zipArchive.js';

/** RFC 4180 fields of CSV text (quotes doubled inside quoted fields; \n or \r\n line ends). */
export function parseCsv(text: string): string[][] {
  if (!text.includes('"')) {
    // no quoted fields: lines split at commas (the same fields, without the per-character loop)
    const lines = text.split(/\r?\n|\r/);
    if (lines[lines.length - 1] === '') lines.pop();
    return lines.map((l) => l.split(','));
  }
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

/** numberKind: not a number cell (text). */
const TEXT = 0;
/** numberKind: a number whose text is already JavaScript's own form of it (written as it stands). */
const CANONICAL = 1;
/** numberKind: a number written as String(Number(text)). */
const CONVERTED = 2;

/**
 * What the CSV cell `src[start, end)` is, by one scan of its character codes (no substring, no
 * regular expression): TEXT unless it reads as a decimal number (optional minus, digits with at
 * most one point and at least one digit, optional exponent: /^-?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i);
 * CANONICAL when the text is JavaScript's own shortest round-trip form of its number
 * (String(Number(text)) === text): at most 16 characters and 15 significant digits (so the text is
 * the shortest that reads back as the same double), no exponent, no leading or trailing zeros,
 * and not below 1e-6 (written with an exponent); CONVERTED for any other number.
 */
function numberKind(src: string, start: number, end: number): number {
  let i = start;
  if (i < end && src.charCodeAt(i) === 45) i++; // '-'
  const intStart = i;
  let ch = 0;
  while (i < end && (ch = src.charCodeAt(i)) >= 48 && ch <= 57) i++;
  const intDigits = i - intStart;
  let fracDigits = 0;
  let dot = false;
  if (i < end && src.charCodeAt(i) === 46) { // '.'
    dot = true;
    const fracStart = ++i;
    while (i < end && (ch = src.charCodeAt(i)) >= 48 && ch <= 57) i++;
    fracDigits = i - fracStart;
  }
  if (intDigits + fracDigits === 0) return TEXT;
  if (i === end) {
    if (end - start > 16 || intDigits === 0 || (dot && (fracDigits === 0 || src.charCodeAt(end - 1) === 48))) return CONVERTED;
    if (src.charCodeAt(intStart) !== 48) return intDigits + fracDigits <= 15 ? CANONICAL : CONVERTED;
    // a leading zero: canonical only as "0." and a fraction with a non-zero digit among its first six
    if (intDigits !== 1 || !dot) return CONVERTED;
    const six = Math.min(intStart + 8, end);
    for (let k = intStart + 2; k < six; k++) if (src.charCodeAt(k) !== 48) return CANONICAL;
    return CONVERTED;
  }
  ch = src.charCodeAt(i);
  if (ch !== 101 && ch !== 69) return TEXT; // 'e', 'E'
  i++;
  if (i < end && ((ch = src.charCodeAt(i)) === 43 || ch === 45)) i++; // '+', '-'
  const expStart = i;
  while (i < end && (ch = src.charCodeAt(i)) >= 48 && ch <= 57) i++;
  return i === end && i > expStart ? CONVERTED : TEXT;
}

/** The number of a CSV number cell as the sheet writes it (JavaScript's shortest round-trip form). */
export function numberText(text: string): string {
  return numberKind(text, 0, text.length) === CANONICAL ? text : String(Number(text));
}

/** A CSV cell as a workbook value: number when it reads as one, else text; '' stays empty. */
export function cellValue(text: string): string | number | null {
  if (text === '') return null;
  return NUMBER.test(text) ? Number(text) : text;
}

/** Sheet name from a CSV file name: without ".csv", at most 31 characters (the format's limit). */
export function sheetName(file: string): string {
  return file.replace(/\.csv$/i, '').slice(0, 31);
}

/** Column letters of a 0-based column index (A … Z, AA …). */
function columnName(c: number): string {
  let s = '';
  for (let n = c + 1; n > 0; n = Math.floor((n - 1) / 26)) s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
  return s;
}

const NS_MAIN = 'http://schemas.openxmlformats.org/spreadsheetml/2006/main';
const NS_REL = 'http://schemas.openxmlformats.org/officeDocument/2006/relationships';
const XML_HEAD = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n';

// characters XML 1.0 does not allow in text, and the five that need escaping
const XML_ILLEGAL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;
const XML_SPECIAL = /[<>&"]/g;
const XML_ENTITY: Record<string, string> = { '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;' };
const XML_NEEDS_WORK = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF<>&"]/;
function xmlText(s: string): string {
  return XML_NEEDS_WORK.test(s) ? s.replace(XML_ILLEGAL, '').replace(XML_SPECIAL, (c) => XML_ENTITY[c]!) : s;
}

/**
 * The shared-string table of a workbook: each distinct text once, cells refer to it by index.
 * A long series repeats a few texts (carbon, governing goal, currency) on every row; by index they
 * cost a few bytes instead of the text each time.
 */
class SharedStrings {
  readonly index = new Map<string, number>();
  readonly items: string[] = [];
  count = 0;
  /** The index of `text`, added at first use. */
  of(text: string): number {
    this.count++;
    let k = this.index.get(text);
    if (k === undefined) { k = this.items.length; this.index.set(text, k); this.items.push(text); }
    return k;
  }
  xml(): string {
    const out: string[] = [`${XML_HEAD}<sst xmlns="${NS_MAIN}" count="${this.count}" uniqueCount="${this.items.length}">`];
    for (const t of this.items) out.push(`<si><t xml:space="preserve">${xmlText(t)}</t></si>`);
    out.push('</sst>');
    return out.join('');
  }
}

const ascii = (s: string): Uint8Array => Uint8Array.from(s, (c) => c.charCodeAt(0));
const NUMBER_OPEN = ascii('"><v>');
const TEXT_OPEN = ascii('" t="s"><v>');
const CELL_CLOSE = ascii('</v></c>');
const ROW_OPEN = ascii('<row r="');
const ROW_OPEN_END = ascii('">');
const ROW_CLOSE = ascii('</row>');
const HEADER_OPEN = ascii('" s="1" t="inlineStr"><is><t xml:space="preserve">');
const HEADER_CLOSE = ascii('</t></is></c>');
/** Bytes a data cell adds besides its own characters, at most: tags, column letters, row digits, a converted number. */
const CELL_ROOM = 96;

/**
 * One worksheet's XML as UTF-8 bytes in one growing buffer: frozen header row (bold inline strings,
 * style 1), column widths, numbers, and text as shared strings. Cells are written from their CSV
 * text by position (`cell(src, start, end, column)`), so a long table is written without a string
 * per cell; each column remembers the shared string of its last text cell and tries it, and the
 * one after it, before the table of all strings (a long series repeats its carbon, goal and
 * currency row after row, and a second carbon's dates follow the first carbon's in order).
 */
class SheetWriter {
  private buf: Buffer;
  private pos = 0;
  /** '<c r="' and the column letters, per column. */
  private readonly refs: Uint8Array[] = [];
  /** Shared-string index of each column's last text cell (-1: none yet). */
  private readonly lastText: number[] = [];
  /** Decimal digits of the current row number. */
  private readonly rowDigits = new Uint8Array(16);
  private rowDigitCount = 0;

  constructor(private readonly strings: SharedStrings, capacity: number, header: readonly string[]) {
    this.buf = Buffer.allocUnsafe(Math.max(4096, capacity));
    this.text('<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships">');
    this.text('<sheetViews><sheetView workbookViewId="0"><pane ySplit="1" topLeftCell="A2" activePane="bottomLeft" state="frozen"/><selection pane="bottomLeft" activeCell="A2" sqref="A2"/></sheetView></sheetViews>');
    this.text('<sheetFormatPr defaultRowHeight="15"/>');
    if (header.length) this.text(`<cols>${header.map((h, c) => `<col min="${c + 1}" max="${c + 1}" width="${Math.min(40, Math.max(10, h.length + 2))}" customWidth="1"/>`).join('')}</cols>`);
    this.text('<sheetData>');
  }

  private room(n: number): void {
    if (this.pos + n <= this.buf.length) return;
    const next = Buffer.allocUnsafe(Math.max(this.buf.length * 2, this.pos + n));
    next.set(this.buf.subarray(0, this.pos));
    this.buf = next;
  }

  /** Bytes known to fit (after room). */
  private put(b: Uint8Array): void {
    const buf = this.buf;
    let p = this.pos;
    for (let i = 0; i < b.length; i++) buf[p++] = b[i]!;
    this.pos = p;
  }

  /** Any text, as UTF-8. */
  private text(s: string): void {
    this.room(3 * s.length);
    this.pos += this.buf.write(s, this.pos, 'utf8');
  }

  /** A whole number ≥ 0 in decimal digits (after room). */
  private int(n: number): void {
    let digits = 1;
    for (let m = n; m >= 10; m = Math.floor(m / 10)) digits++;
    let p = this.pos + digits;
    this.pos = p;
    let m = n;
    do { this.buf[--p] = 48 + (m % 10); m = Math.floor(m / 10); } while (m > 0);
  }

  /** '<c r="' and the letters of column c, then the row number. */
  private ref(c: number): void {
    if (c >= this.refs.length) this.addColumns(c);
    this.put(this.refs[c]!);
    const buf = this.buf;
    let p = this.pos;
    for (let i = 0; i < this.rowDigitCount; i++) buf[p++] = this.rowDigits[i]!;
    this.pos = p;
  }

  /** The digits of row number n (≥ 0) as the current row's; returns their count. */
  private setRowDigits(n: number): number {
    const s = String(n);
    for (let k = 0; k < s.length; k++) this.rowDigits[k] = s.charCodeAt(k);
    return (this.rowDigitCount = s.length);
  }

  /** Open row n (1-based). */
  row(n: number): void {
    this.setRowDigits(n);
    this.room(32);
    this.put(ROW_OPEN);
    this.int(n);
    this.put(ROW_OPEN_END);
  }

  endRow(): void {
    this.room(8);
    this.put(ROW_CLOSE);
  }

  /** A header cell (bold inline string), also when empty. */
  headerCell(c: number, text: string): void {
    this.room(CELL_ROOM);
    this.ref(c);
    this.put(HEADER_OPEN);
    this.text(xmlText(text));
    this.room(16);
    this.put(HEADER_CLOSE);
  }

  /** The data cell src[start, end) in column c: a number, a shared string, or nothing when empty. */
  cell(src: string, start: number, end: number, c: number): void {
    if (start === end) return;
    this.room(CELL_ROOM + end - start);
    this.ref(c);
    const kind = numberKind(src, start, end);
    if (kind === CANONICAL) {
      this.put(NUMBER_OPEN);
      const buf = this.buf;
      let p = this.pos;
      for (let i = start; i < end; i++) buf[p++] = src.charCodeAt(i);
      this.pos = p;
    } else if (kind === CONVERTED) {
      this.put(NUMBER_OPEN);
      const t = String(Number(src.slice(start, end)));
      const buf = this.buf;
      let p = this.pos;
      for (let i = 0; i < t.length; i++) buf[p++] = t.charCodeAt(i);
      this.pos = p;
    } else {
      this.put(TEXT_OPEN);
      this.int(this.sharedIndex(src, start, end, c));
    }
    this.put(CELL_CLOSE);
  }

  /** The shared-string index of the text src[start, end) in column c (see the class comment). */
  private sharedIndex(src: string, start: number, end: number, c: number): number {
    const strings = this.strings;
    const last = this.lastText[c]!;
    if (last >= 0) {
      const items = strings.items;
      if (same(items[last]!, src, start, end)) { strings.count++; return last; }
      if (last + 1 < items.length && same(items[last + 1]!, src, start, end)) { strings.count++; this.lastText[c] = last + 1; return last + 1; }
    }
    const k = strings.of(src.slice(start, end));
    this.lastText[c] = k;
    return k;
  }

  /**
   * The data rows of a CSV text without quotes or carriage returns, from the line at `from` to the
   * end, the first as row `firstRow`: the same cells as `row`/`cell`/`endRow` line by line, in one
   * loop with the buffer and position held in locals (the loop runs once per cell of a long series).
   */
  plainRows(text: string, from: number, firstRow: number): void {
    const n = text.length;
    this.setRowDigits(firstRow - 1); // counted up line by line
    for (let ls = from; ls < n;) {
      let le = text.indexOf('\n', ls);
      if (le === -1) le = n;
      this.plainLine(text, ls, le);
      ls = le + 1;
    }
  }

  /**
   * The next row, from the line text[ls, le) (see plainRows). Each cell's characters are read
   * once: copied as they are scanned, as if the cell were a number already in JavaScript's own
   * form (numberKind's grammar, written out here), and taken back when it is not.
   */
  private plainLine(text: string, ls: number, le: number): void {
    // room for the whole line: each of its at most (length + 1) cells adds at most CELL_ROOM bytes
    this.room((le - ls + 1) * (CELL_ROOM + 1) + 64);
    const buf = this.buf;
    const digits = this.rowDigits;
    const refs = this.refs;
    let p = this.pos;
    // the next row number, and '<row r="…">'
    let nd = this.rowDigitCount;
    let d = nd - 1;
    while (d >= 0 && digits[d] === 57) { digits[d] = 48; d = d - 1; }
    if (d >= 0) digits[d] = digits[d]! + 1;
    else { digits.copyWithin(1, 0, nd); digits[0] = 49; nd = nd + 1; this.rowDigitCount = nd; }
    buf[p++] = 60; buf[p++] = 114; buf[p++] = 111; buf[p++] = 119; buf[p++] = 32; buf[p++] = 114; buf[p++] = 61; buf[p++] = 34; // '<row r="'
    for (let k = 0; k < nd; k++) buf[p++] = digits[k]!;
    buf[p++] = 34; buf[p++] = 62; // '">'
    // text.charCodeAt(le) is '\n' or NaN (the end): the digit loops below stop there without a bound
    for (let c = 0, i = ls; ; c++, i++) {
      const fs = i;
      let ch = text.charCodeAt(i);
      if (i < le && ch !== 44) {
        // the cell text[fs, …) in column c, up to the next ',' or the line's end
        if (c >= refs.length) this.addColumns(c);
        const r = refs[c]!;
        for (let k = 0; k < r.length; k++) buf[p++] = r[k]!;
        for (let k = 0; k < nd; k++) buf[p++] = digits[k]!;
        const pv = p;
        buf[p++] = 34; buf[p++] = 62; buf[p++] = 60; buf[p++] = 118; buf[p++] = 62; // '"><v>'
        if (ch === 45) { buf[p++] = 45; ch = text.charCodeAt(++i); } // '-'
        const intStart = i;
        while (ch >= 48 && ch <= 57) { buf[p++] = ch; ch = text.charCodeAt(++i); }
        const intDigits = i - intStart;
        let fracDigits = 0;
        let dot = false;
        if (ch === 46) { // '.'
          dot = true;
          buf[p++] = 46;
          ch = text.charCodeAt(++i);
          const fracStart = i;
          while (ch >= 48 && ch <= 57) { buf[p++] = ch; ch = text.charCodeAt(++i); }
          fracDigits = i - fracStart;
        }
        let kind = TEXT;
        if (intDigits + fracDigits > 0) {
          if (i === le || ch === 44) {
            if (i - fs > 16 || intDigits === 0 || (dot && (fracDigits === 0 || text.charCodeAt(i - 1) === 48))) kind = CONVERTED;
            else if (text.charCodeAt(intStart) !== 48) kind = intDigits + fracDigits <= 15 ? CANONICAL : CONVERTED;
            else {
              // a leading zero: canonical only as "0." and a fraction with a non-zero digit among its first six
              kind = CONVERTED;
              if (intDigits === 1 && dot) for (let k = intStart + 2, six = Math.min(intStart + 8, i); k < six; k++) if (text.charCodeAt(k) !== 48) { kind = CANONICAL; break; }
            }
          } else if (ch === 101 || ch === 69) { // 'e', 'E'
            ch = text.charCodeAt(++i);
            if (ch === 43 || ch === 45) ch = text.charCodeAt(++i); // '+', '-'
            const expStart = i;
            while (ch >= 48 && ch <= 57) ch = text.charCodeAt(++i);
            if ((i === le || ch === 44) && i > expStart) kind = CONVERTED;
          }
        }
        if (kind === CONVERTED) {
          p = pv + 5;
          const t = String(Number(text.slice(fs, i)));
          for (let k = 0; k < t.length; k++) buf[p++] = t.charCodeAt(k);
        } else if (kind === TEXT) {
          while (i < le && text.charCodeAt(i) !== 44) i++;
          p = pv;
          buf[p++] = 34; buf[p++] = 32; buf[p++] = 116; buf[p++] = 61; buf[p++] = 34; buf[p++] = 115; // '" t="s'
          buf[p++] = 34; buf[p++] = 62; buf[p++] = 60; buf[p++] = 118; buf[p++] = 62; // '"><v>'
          const k = this.sharedIndex(text, fs, i, c);
          if (k < 10) buf[p++] = 48 + k;
          else { this.pos = p; this.int(k); p = this.pos; }
        }
        buf[p++] = 60; buf[p++] = 47; buf[p++] = 118; buf[p++] = 62; // '</v>'
        buf[p++] = 60; buf[p++] = 47; buf[p++] = 99; buf[p++] = 62; // '</c>'
      }
      if (i >= le) break;
    }
    buf[p++] = 60; buf[p++] = 47; buf[p++] = 114; buf[p++] = 111; buf[p++] = 119; buf[p++] = 62; // '</row>'
    this.pos = p;
  }

  /** Column references and text memories up to column c. */
  private addColumns(c: number): void {
    while (this.refs.length <= c) { this.refs.push(ascii(`<c r="${columnName(this.refs.length)}`)); this.lastText.push(-1); }
  }

  /** The sheet's bytes (closes it). */
  end(): Uint8Array {
    this.text('</sheetData></worksheet>');
    return this.buf.subarray(0, this.pos);
  }
}

/** Is `s` the text src[start, end)? */
function same(s: string, src: string, start: number, end: number): boolean {
  if (s.length !== end - start) return false;
  for (let i = 0; i < s.length; i++) if (s.charCodeAt(i) !== src.charCodeAt(start + i)) return false;
  return true;
}

/**
 * One worksheet's XML (UTF-8 bytes) from a CSV text: a text without quotes or carriage returns in
 * one pass over its lines and fields (the same rows as parseCsv), any other through parseCsv.
 */
function sheetXml(text: string, strings: SharedStrings): Uint8Array {
  if (text.includes('"') || text.includes('\r')) return sheetXmlOfRows(parseCsv(text), strings, text.length);
  const firstEnd = text.indexOf('\n');
  const header = text.length === 0 ? [] : text.slice(0, firstEnd === -1 ? text.length : firstEnd).split(',');
  const w = new SheetWriter(strings, 4 * text.length + 1024, header);
  if (header.length) {
    w.row(1);
    for (let c = 0; c < header.length; c++) w.headerCell(c, header[c]!);
    w.endRow();
  }
  w.plainRows(text, firstEnd === -1 ? text.length : firstEnd + 1, 2);
  return w.end();
}

/** One worksheet's XML (UTF-8 bytes) from parsed rows (the first is the header). */
function sheetXmlOfRows(rows: string[][], strings: SharedStrings, sizeHint: number): Uint8Array {
  const w = new SheetWriter(strings, 4 * sizeHint + 1024, rows[0] ?? []);
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i]!;
    w.row(i + 1);
    if (i === 0) for (let c = 0; c < r.length; c++) w.headerCell(c, r[c]!);
    else for (let c = 0; c < r.length; c++) w.cell(r[c]!, 0, r[c]!.length, c);
    w.endRow();
  }
  return w.end();
}

let primed = false;
/**
 * Run the one-pass sheet writer once on a small invented table that takes each of its paths
 * (negative, converted and exponent numbers, text after digits, texts repeated and in sequence,
 * shared-string indices of two digits, row numbers gaining a digit). Speed only: the optimising
 * compiler then sees every path before a long table, instead of throwing its code away (and
 * compiling it again) at the first negative number or the first text in sequence, part-way
 * through (measured on the 36,500-day tables: the first workbook 320-330 ms of CPU, 350-390 without).
 */
function primeSheetWriter(): void {
  if (primed) return;
  primed = true;
  const lines = ['a,b,c,d'];
  for (let k = 0; k < 24; k++) lines.push(`${2000 + (k % 12)}-01,-${k}.5,${k % 3 ? '1.50' : '2e-7'},${k % 4 ? 'x' : ''}`);
  sheetXml(lines.join('\n'), new SharedStrings());
}

/**
 * @param csvFiles CSV texts keyed by file name, in the order the sheets should take
 * @returns the .xlsx file's bytes
 */
export async function resultsWorkbook(csvFiles: Record<string, string>, meta: { creator?: string; created?: Date } = {}): Promise<Uint8Array> {
  primeSheetWriter();
  const strings = new SharedStrings();
  const sheets = Object.entries(csvFiles).map(([file, text], k) => ({ name: sheetName(file), xml: sheetXml(text, strings), part: `worksheets/sheet${k + 1}.xml` }));
  const created = (meta.created ?? new Date()).toISOString().replace(/\.\d{3}Z$/, 'Z');
  const files = [
    { name: '[Content_Types].xml', data: `${XML_HEAD}<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/><Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/><Override PartName="/xl/styles.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.styles+xml"/><Override PartName="/xl/sharedStrings.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sharedStrings+xml"/>${sheets.map((s) => `<Override PartName="/xl/${s.part}" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>`).join('')}<Override PartName="/docProps/core.xml" ContentType="application/vnd.openxmlformats-package.core-properties+xml"/></Types>` },
    { name: '_rels/.rels', data: `${XML_HEAD}<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="${NS_REL}/officeDocument" Target="xl/workbook.xml"/><Relationship Id="rId2" Type="http://schemas.openxmlformats.org/package/2006/relationships/metadata/core-properties" Target="docProps/core.xml"/></Relationships>` },
    { name: 'docProps/core.xml', data: `${XML_HEAD}<cp:coreProperties xmlns:cp="http://schemas.openxmlformats.org/package/2006/metadata/core-properties" xmlns:dc="http://purl.org/dc/elements/1.1/" xmlns:dcterms="http://purl.org/dc/terms/" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance"><dc:creator>${xmlText(meta.creator ?? 'sorbshare')}</dc:creator><dcterms:created xsi:type="dcterms:W3CDTF">${created}</dcterms:created><dcterms:modified xsi:type="dcterms:W3CDTF">${created}</dcterms:modified></cp:coreProperties>` },
    { name: 'xl/workbook.xml', data: `${XML_HEAD}<workbook xmlns="${NS_MAIN}" xmlns:r="${NS_REL}"><bookViews><workbookView/></bookViews><sheets>${sheets.map((s, k) => `<sheet name="${xmlText(s.name)}" sheetId="${k + 1}" r:id="rId${k + 1}"/>`).join('')}</sheets></workbook>` },
    { name: 'xl/_rels/workbook.xml.rels', data: `${XML_HEAD}<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">${sheets.map((s, k) => `<Relationship Id="rId${k + 1}" Type="${NS_REL}/worksheet" Target="${s.part}"/>`).join('')}<Relationship Id="rId${sheets.length + 1}" Type="${NS_REL}/styles" Target="styles.xml"/><Relationship Id="rId${sheets.length + 2}" Type="${NS_REL}/sharedStrings" Target="sharedStrings.xml"/></Relationships>` },
    { name: 'xl/styles.xml', data: `${XML_HEAD}<styleSheet xmlns="${NS_MAIN}"><fonts count="2"><font><sz val="11"/><name val="Calibri"/></font><font><b/><sz val="11"/><name val="Calibri"/></font></fonts><fills count="2"><fill><patternFill patternType="none"/></fill><fill><patternFill patternType="gray125"/></fill></fills><borders count="1"><border><left/><right/><top/><bottom/><diagonal/></border></borders><cellStyleXfs count="1"><xf numFmtId="0" fontId="0" fillId="0" borderId="0"/></cellStyleXfs><cellXfs count="2"><xf numFmtId="0" fontId="0" fillId="0" borderId="0" xfId="0"/><xf numFmtId="0" fontId="1" fillId="0" borderId="0" xfId="0" applyFont="1"/></cellXfs><cellStyles count="1"><cellStyle name="Normal" xfId="0" builtinId="0"/></cellStyles></styleSheet>` },
    ...sheets.map((s) => ({ name: `xl/${s.part}`, data: s.xml })),
    { name: 'xl/sharedStrings.xml', data: strings.xml() },
  ];
  return zipArchiveAsync(files, meta.created);
}
