/**
 * The results workbook (results.xlsx): one sheet per CSV table of the run, built from the CSV
 * texts themselves so the workbook holds exactly the numbers of the CSV files. Header cells keep
 * their units ("dose (mg/L)"); a cell that reads as a number in the CSV is written as a number,
 * everything else as text; an empty cell stays empty; the header row is bold and stays in view.
 * The SpreadsheetML parts (Office Open XML, ECMA-376 Part 1: workbook, worksheets, one
 * shared-string table for the text cells, one style sheet, core properties) are written as text
 * straight from the CSV cells and packed with zipArchive.ts, the parts compressed on the thread
 * pool: a 36,500-day series has 73,000 daily rows, and building cell objects for them cost
 * seconds. The caller writes the bytes.
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

/**
 * Decimal text that is already JavaScript's own form of its number (String(Number(text)) === text):
 * at most 15 significant digits (so the text is the shortest that reads back as the same double),
 * no exponent, no leading or trailing zeros, and not below 1e-6 (written with an exponent).
 */
const CANONICAL = /^-?(?:0\.(?!0{6})\d*[1-9]|[1-9]\d*(?:\.\d*[1-9])?)$/;

/** The number of a CSV number cell as the sheet writes it (JavaScript's shortest round-trip form). */
export function numberText(text: string): string {
  return text.length <= 16 && CANONICAL.test(text) ? text : String(Number(text));
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

/**
 * Bytes appended to a growing buffer: text known to be ASCII (tags, numbers, cell references)
 * copied code by code, other text as UTF-8, whole numbers as digits. A long sheet is written
 * without building its text first (73,000 rows of string pieces cost more in garbage collection
 * than in writing).
 */
class ByteWriter {
  private buf: Buffer;
  private pos = 0;
  constructor(capacity: number) { this.buf = Buffer.allocUnsafe(Math.max(4096, capacity)); }
  private room(n: number): void {
    if (this.pos + n <= this.buf.length) return;
    const next = Buffer.allocUnsafe(Math.max(this.buf.length * 2, this.pos + n));
    this.buf.copy(next, 0, 0, this.pos);
    this.buf = next;
  }
  /** Text of ASCII characters only. */
  ascii(s: string): void {
    this.room(s.length);
    const b = this.buf;
    let p = this.pos;
    for (let i = 0; i < s.length; i++) b[p++] = s.charCodeAt(i);
    this.pos = p;
  }
  /** Any text, as UTF-8. */
  text(s: string): void {
    this.room(3 * s.length);
    this.pos += this.buf.write(s, this.pos, 'utf8');
  }
  /** A whole number ≥ 0 in decimal digits. */
  int(n: number): void {
    let digits = 1;
    for (let m = n; m >= 10; m = Math.floor(m / 10)) digits++;
    this.room(digits);
    let p = this.pos + digits;
    this.pos = p;
    let m = n;
    do { this.buf[--p] = 48 + (m % 10); m = Math.floor(m / 10); } while (m > 0);
  }
  bytes(): Uint8Array { return this.buf.subarray(0, this.pos); }
}

/**
 * One worksheet's XML (UTF-8 bytes): frozen header row (bold inline strings, style 1), column
 * widths, numbers, and text as shared strings.
 */
function sheetXml(rows: string[][], strings: SharedStrings, sizeHint: number): Uint8Array {
  const header = rows[0] ?? [];
  const w = new ByteWriter(4 * sizeHint + 1024);
  w.ascii('<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships">');
  w.ascii('<sheetViews><sheetView workbookViewId="0"><pane ySplit="1" topLeftCell="A2" activePane="bottomLeft" state="frozen"/><selection pane="bottomLeft" activeCell="A2" sqref="A2"/></sheetView></sheetViews>');
  w.ascii('<sheetFormatPr defaultRowHeight="15"/>');
  if (header.length) w.ascii(`<cols>${header.map((h, c) => `<col min="${c + 1}" max="${c + 1}" width="${Math.min(40, Math.max(10, h.length + 2))}" customWidth="1"/>`).join('')}</cols>`);
  w.ascii('<sheetData>');
  const letters = Array.from({ length: rows.reduce((m, r) => Math.max(m, r.length), 0) }, (_, c) => `<c r="${columnName(c)}`);
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i]!;
    const n = i + 1;
    w.ascii('<row r="'); w.int(n); w.ascii('">');
    if (i === 0) {
      for (let c = 0; c < r.length; c++) { w.ascii(letters[c]!); w.int(n); w.ascii('" s="1" t="inlineStr"><is><t xml:space="preserve">'); w.text(xmlText(r[c]!)); w.ascii('</t></is></c>'); }
    } else {
      for (let c = 0; c < r.length; c++) {
        const text = r[c]!;
        if (text === '') continue;
        w.ascii(letters[c]!); w.int(n);
        if (NUMBER.test(text)) { w.ascii('"><v>'); w.ascii(numberText(text)); }
        else { w.ascii('" t="s"><v>'); w.int(strings.of(text)); }
        w.ascii('</v></c>');
      }
    }
    w.ascii('</row>');
  }
  w.ascii('</sheetData></worksheet>');
  return w.bytes();
}

/**
 * @param csvFiles CSV texts keyed by file name, in the order the sheets should take
 * @returns the .xlsx file's bytes
 */
export async function resultsWorkbook(csvFiles: Record<string, string>, meta: { creator?: string; created?: Date } = {}): Promise<Uint8Array> {
  const strings = new SharedStrings();
  const sheets = Object.entries(csvFiles).map(([file, text], k) => ({ name: sheetName(file), xml: sheetXml(parseCsv(text), strings, text.length), part: `worksheets/sheet${k + 1}.xml` }));
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
