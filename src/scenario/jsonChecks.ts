/**
 * Small typed readers for JSON values that throw InputError naming the JSON path and what was
 * expected. Used by the project validator; kept in step with schema/project.schema.json.
 */
import { InputError } from '../core/errors.js';
import { nearestKey } from '../text/nearestKey.js';

export type JsonObject = Record<string, unknown>;

export function isObject(v: unknown): v is JsonObject {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

export function describeValue(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  if (typeof v === 'object') return 'an object';
  if (typeof v === 'string') return `the text ${JSON.stringify(v.length > 40 ? v.slice(0, 40) + '…' : v)}`;
  return `${typeof v} ${JSON.stringify(v)}`;
}

export function expectObject(v: unknown, path: string, what: string): JsonObject {
  if (!isObject(v)) throw new InputError(`expected ${what} (a JSON object), got ${describeValue(v)}`, { path });
  return v;
}

/**
 * Reject keys that are not in `allowed` (catches typos such as "flwo"): the message names the JSON
 * path of the unknown key and the nearest valid key.
 */
export function onlyKeys(obj: JsonObject, allowed: readonly string[], path: string): void {
  for (const k of Object.keys(obj)) {
    if (!allowed.includes(k)) {
      const near = nearestKey(k, allowed);
      throw new InputError(`unknown key "${k}"${near !== undefined ? ` (did you mean "${near}"?)` : ''}; expected one of ${allowed.map((a) => `"${a}"`).join(', ')}`, { path: join(path, k) });
    }
  }
}

export function join(path: string, key: string): string {
  return path === '' || path === '$' ? key : `${path}.${key}`;
}

export function required(obj: JsonObject, key: string, path: string, what: string): unknown {
  const v = obj[key];
  if (v === undefined) throw new InputError(`missing "${key}"; expected ${what}`, { path: join(path, key) });
  return v;
}

export function expectString(v: unknown, path: string, what = 'a non-empty text'): string {
  if (typeof v !== 'string' || v.trim() === '') throw new InputError(`expected ${what}, got ${describeValue(v)}`, { path });
  return v;
}

export function expectNumber(v: unknown, path: string, what: string, check?: (x: number) => boolean): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || (check && !check(v))) throw new InputError(`expected ${what}, got ${describeValue(v)}`, { path });
  return v;
}

export function expectArray(v: unknown, path: string, what: string, minItems = 0): unknown[] {
  if (!Array.isArray(v)) throw new InputError(`expected ${what} (a JSON array), got ${describeValue(v)}`, { path });
  if (v.length < minItems) throw new InputError(`expected ${what} with at least ${minItems} entr${minItems === 1 ? 'y' : 'ies'}, got ${v.length}`, { path });
  return v;
}

/** Run `f`; an InputError without a path gains `path` (unit parsers know no paths). */
export function at<T>(path: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError) {
      if (e.location.path === undefined) throw e.at({ path });
      throw e;
    }
    throw e;
  }
}
