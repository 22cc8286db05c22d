/**
 * Reading input files with errors that name the file (and line and column for JSON).
 */
import { readFileSync, statSync } from 'node:fs';
import { InputError } from '../core/errors.js';

export function readTextFile(path: string, what = 'input file'): string {
  let st;
  try {
    st = statSync(path);
  } catch {
    throw new InputError(`${what} not found; expected a readable file`, { file: path });
  }
  if (!st.isFile()) throw new InputError(`${what} is not a file`, { file: path });
  try {
    return readFileSync(path, 'utf8').replace(/^\uFEFF/, '');
  } catch (e) {
    throw new InputError(`cannot read ${what}: ${(e as Error).message}`, { file: path });
  }
}

/** Parse JSON, naming line and column of a syntax error. */
export function parseJsonText(text: string, file: string): unknown {
  try {
    return JSON.parse(text);
  } catch (e) {
    const msg = (e as Error).message;
    const m = /position (\d+)/.exec(msg);
    let where = '';
    if (m) {
      const pos = Number(m[1]);
      const before = text.slice(0, pos);
      const line = before.split('\n').length;
      const col = pos - before.lastIndexOf('\n');
      where = ` at line ${line}, column ${col}`;
    }
    throw new InputError(`malformed JSON${where}; expected valid JSON (${msg.replace(/^JSON\.parse: /, '')})`, { file });
  }
}

export function readJsonFile(path: string, what = 'JSON file'): unknown {
  return parseJsonText(readTextFile(path, what), path);
}
