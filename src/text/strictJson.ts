/**
 * The project's one JSON reader (every JSON input goes through `parseStrictJson`): standard JSON
 * (RFC 8259, Bray 2017) read strictly, with messages a user can act on.
 *
 * - malformed JSON names its line and column (1-based, as editors show them) and what was found;
 * - a key given twice in one object is an error naming its JSON path (JSON.parse silently keeps
 *   the last one, so a file could say two things and mean one);
 * - a number outside the double range (|x| > 1.7976931348623157e308, which JSON.parse turns into
 *   Infinity) is named as such with its JSON path;
 * - keys such as `__proto__` become ordinary own properties (never a prototype);
 * - text values lose control and direction-override characters (`cleanName`), so names are clean
 *   wherever they are shown.
 *
 * @throws InputError naming the file and the line/column or JSON path
 */
import { InputError } from '../core/errors.js';
import { cleanName } from './cleanText.js';

interface Cursor { text: string; pos: number; file: string | undefined }

/** Parse JSON text strictly. @param file file name for messages */
export function parseStrictJson(text: string, file?: string): unknown {
  const cur: Cursor = { text: text.replace(/^\uFEFF/, ''), pos: 0, file };
  skipSpace(cur);
  if (cur.pos >= cur.text.length) fail(cur, 'the file is empty', 'a JSON object');
  const value = parseValue(cur, '$');
  skipSpace(cur);
  if (cur.pos < cur.text.length) fail(cur, `unexpected ${found(cur)} after the end of the JSON value`, 'nothing more (one JSON value per file)');
  return value;
}

/** Line and column (1-based) of an offset. */
export function lineColumn(text: string, pos: number): { line: number; column: number } {
  const before = text.slice(0, pos);
  const line = before.split('\n').length;
  return { line, column: pos - before.lastIndexOf('\n') };
}

function fail(cur: Cursor, what: string, expected: string, at = cur.pos): never {
  const { line, column } = lineColumn(cur.text, at);
  throw new InputError(`malformed JSON at line ${line}, column ${column}: ${what}; expected ${expected}`, cur.file !== undefined ? { file: cur.file } : {});
}

function pathError(cur: Cursor, what: string, path: string): never {
  throw new InputError(what, { ...(cur.file !== undefined ? { file: cur.file } : {}), path });
}

function found(cur: Cursor): string {
  if (cur.pos >= cur.text.length) return 'end of file';
  const ch = cur.text[cur.pos]!;
  return /[\x00-\x1f]/.test(ch) ? `control character U+${ch.charCodeAt(0).toString(16).padStart(4, '0').toUpperCase()}` : `"${ch}"`;
}

function skipSpace(cur: Cursor): void {
  while (cur.pos < cur.text.length) {
    const ch = cur.text.charCodeAt(cur.pos);
    if (ch === 0x20 || ch === 0x09 || ch === 0x0a || ch === 0x0d) cur.pos++;
    else break;
  }
}

function childPath(path: string, key: string): string {
  const k = /^[A-Za-z_$][\w$]*$/.test(key) ? key : JSON.stringify(key);
  return path === '$' ? k : `${path}.${k}`;
}

function parseValue(cur: Cursor, path: string): unknown {
  skipSpace(cur);
  const ch = cur.text[cur.pos];
  if (ch === '{') return parseObject(cur, path);
  if (ch === '[') return parseArray(cur, path);
  if (ch === '"') return cleanName(parseString(cur));
  if (ch === '-' || (ch !== undefined && ch >= '0' && ch <= '9')) return parseNumber(cur, path);
  for (const [word, value] of [['true', true], ['false', false], ['null', null]] as const) {
    if (cur.text.startsWith(word, cur.pos)) { cur.pos += word.length; return value; }
  }
  if (ch === "'") fail(cur, 'a single quote', 'text in double quotes "…"');
  if (cur.text.startsWith('NaN', cur.pos) || cur.text.startsWith('Infinity', cur.pos)) fail(cur, `${cur.text.startsWith('NaN', cur.pos) ? 'NaN' : 'Infinity'} is not a JSON number`, 'a finite number');
  fail(cur, `unexpected ${found(cur)}`, 'a value (object, array, "text", number, true, false or null)');
}

function parseObject(cur: Cursor, path: string): Record<string, unknown> {
  const obj: Record<string, unknown> = {};
  const start = cur.pos;
  cur.pos++; // {
  skipSpace(cur);
  if (cur.text[cur.pos] === '}') { cur.pos++; return obj; }
  for (;;) {
    skipSpace(cur);
    if (cur.text[cur.pos] !== '"') {
      if (cur.text[cur.pos] === '}') fail(cur, 'a comma before "}"', 'another "key": value after the comma, or no comma');
      if (cur.pos >= cur.text.length) fail(cur, 'end of file inside an object', `"}" to close the object opened at line ${lineColumn(cur.text, start).line}`);
      if (/\d,$/.test(cur.text.slice(Math.max(0, cur.pos - 2), cur.pos)) && /\d/.test(cur.text[cur.pos] ?? '')) fail(cur, `unexpected ${found(cur)} after a number and a comma (a decimal comma?)`, 'a decimal point in JSON numbers, such as 8.5');
      fail(cur, `unexpected ${found(cur)}`, 'a key in double quotes');
    }
    const key = parseString(cur);
    const p = childPath(path, key);
    if (Object.prototype.hasOwnProperty.call(obj, key)) pathError(cur, `duplicate key "${key}" (the object gives it twice); expected each key once`, p);
    skipSpace(cur);
    if (cur.text[cur.pos] !== ':') fail(cur, `unexpected ${found(cur)} after the key "${key}"`, '":"');
    cur.pos++;
    const value = parseValue(cur, p);
    Object.defineProperty(obj, key, { value, enumerable: true, writable: true, configurable: true });
    skipSpace(cur);
    const ch = cur.text[cur.pos];
    if (ch === ',') { cur.pos++; continue; }
    if (ch === '}') { cur.pos++; return obj; }
    if (ch === undefined) fail(cur, 'end of file inside an object', `"}" to close the object opened at line ${lineColumn(cur.text, start).line}`);
    fail(cur, `unexpected ${found(cur)}`, '"," or "}"');
  }
}

function parseArray(cur: Cursor, path: string): unknown[] {
  const arr: unknown[] = [];
  const start = cur.pos;
  cur.pos++; // [
  skipSpace(cur);
  if (cur.text[cur.pos] === ']') { cur.pos++; return arr; }
  for (;;) {
    skipSpace(cur);
    if (cur.text[cur.pos] === ']') fail(cur, 'a comma before "]"', 'another value after the comma, or no comma');
    arr.push(parseValue(cur, `${path === '$' ? '' : path}[${arr.length}]`));
    skipSpace(cur);
    const ch = cur.text[cur.pos];
    if (ch === ',') { cur.pos++; continue; }
    if (ch === ']') { cur.pos++; return arr; }
    if (ch === undefined) fail(cur, 'end of file inside an array', `"]" to close the array opened at line ${lineColumn(cur.text, start).line}`);
    fail(cur, `unexpected ${found(cur)}`, '"," or "]"');
  }
}

const ESCAPES: Record<string, string> = { '"': '"', '\\': '\\', '/': '/', b: '\b', f: '\f', n: '\n', r: '\r', t: '\t' };

function parseString(cur: Cursor): string {
  const start = cur.pos;
  cur.pos++; // "
  let out = '';
  for (;;) {
    const ch = cur.text[cur.pos];
    if (ch === undefined) fail(cur, 'end of file inside a text', `a closing double quote for the text opened at line ${lineColumn(cur.text, start).line}, column ${lineColumn(cur.text, start).column}`);
    if (ch === '"') { cur.pos++; return out; }
    if (ch === '\\') {
      const e = cur.text[cur.pos + 1];
      if (e === 'u') {
        const hex = cur.text.slice(cur.pos + 2, cur.pos + 6);
        if (!/^[0-9a-fA-F]{4}$/.test(hex)) fail(cur, 'a bad \\u escape', 'four hexadecimal digits after \\u');
        out += String.fromCharCode(parseInt(hex, 16));
        cur.pos += 6;
        continue;
      }
      const rep = e === undefined ? undefined : ESCAPES[e];
      if (rep === undefined) fail(cur, `the escape \\${e ?? ''}`, 'one of \\" \\\\ \\/ \\b \\f \\n \\r \\t \\uXXXX');
      out += rep;
      cur.pos += 2;
      continue;
    }
    if (ch.charCodeAt(0) < 0x20) fail(cur, `${found(cur)} inside a text`, ch === '\n' ? 'the text to end on the same line (write \\n for a line break)' : 'an escape such as \\t');
    out += ch;
    cur.pos++;
  }
}

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][-+]?\d+)?/y;

function parseNumber(cur: Cursor, path: string): number {
  NUMBER.lastIndex = cur.pos;
  const m = NUMBER.exec(cur.text);
  if (!m) fail(cur, `a malformed number`, 'a JSON number such as 0.25, -3 or 1.5e-6 (no leading zeros, no "+", a digit after the point)');
  const next = cur.text[cur.pos + m[0].length];
  if (next !== undefined && /[0-9.eE+\-xX]/.test(next)) fail(cur, `a malformed number "${m[0]}${next}…"`, 'a JSON number such as 0.25, -3 or 1.5e-6 (no leading zeros, a decimal point, not a comma)');
  const v = Number(m[0]);
  if (!Number.isFinite(v)) pathError(cur, `the number ${m[0]} is outside the double range (largest magnitude about 1.8e308); expected a finite number`, path);
  cur.pos += m[0].length;
  return v;
}
