/**
 * Reading input files with errors that name the file (and line and column for JSON).
 */
import { readFileSync, statSync } from 'node:fs';
import { InputError } from '../core/errors.js';
import { parseStrictJson } from '../text/strictJson.js';

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

/** Parse JSON strictly (line and column of a syntax error, duplicate keys, numbers outside the double range). */
export function parseJsonText(text: string, file: string): unknown {
  return parseStrictJson(text, file);
}

export function readJsonFile(path: string, what = 'JSON file'): unknown {
  return parseJsonText(readTextFile(path, what), path);
}
