/**
 * The one-pass JSON writer (snakeCaseJsonText) against the writer it replaced: the same text for
 * random nested values, above all long arrays of per-day rows (one shape, or rows that differ in
 * keys, order or values) and of numbers, where the new writer copies rows from a template per
 * chunk and joins numbers natively. `previousSnakeCaseJsonText` below is the earlier writer, kept
 * here only as the reference (it renamed keys through per-row Sets and wrote each long array with
 * one JSON.stringify; it wrote a JSON name twice when two keys gave it, which it no longer does here,
 * as the writer no longer does). Both are also checked against the closed form
 * jsonText(toSnakeCaseJson(v)).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { jsonText, LONG_ARRAY, SNAKE_CASE_KEYS, snakeCaseJsonText, snakeCaseKey, toSnakeCaseJson, USER_ID_MAP_FIELDS, UserIdMap, userIdMap } from '../../src/output/snakeCaseJson.js';

// ---- the previous writer (reference only) ----

const prevQuoted = new Map<string, string>();
function prevQuotedKey(key: string, renamed: boolean): string {
  const id = `${renamed ? 'r' : 'k'}${key}`;
  let q = prevQuoted.get(id);
  if (q === undefined) { q = JSON.stringify(renamed ? prevSnakeCaseKey(key) : key); prevQuoted.set(id, q); }
  return q;
}
function prevSnakeCaseKey(key: string): string {
  return Object.prototype.hasOwnProperty.call(SNAKE_CASE_KEYS, key) ? SNAKE_CASE_KEYS[key]! : key;
}
enum Shape { Primitive, Map, Array, View, Plain, Other }
function prevShapeOf(v: unknown): Shape {
  if (v === null || typeof v !== 'object') return Shape.Primitive;
  if (v instanceof UserIdMap) return Shape.Map;
  if (Array.isArray(v)) return Shape.Array;
  if (ArrayBuffer.isView(v)) return Shape.View;
  const proto = Object.getPrototypeOf(v);
  if (proto !== Object.prototype && proto !== null) return Shape.Other;
  return typeof (v as { toJSON?: unknown }).toJSON === 'function' ? Shape.Other : Shape.Plain;
}
function prevPrimitiveText(v: unknown): string | undefined {
  switch (typeof v) {
    case 'number': return Number.isFinite(v) ? String(v) : 'null';
    case 'string': return JSON.stringify(v);
    case 'boolean': return v ? 'true' : 'false';
    case 'object': return 'null';
    case 'bigint': return JSON.stringify(v);
    default: return undefined;
  }
}
function prevPrettyText(v: unknown, indent: string, asMap = false): string | undefined {
  const shape = asMap ? Shape.Map : prevShapeOf(v);
  switch (shape) {
    case Shape.Primitive: return prevPrimitiveText(v);
    case Shape.Other: {
      const t = jsonText(v);
      return t === undefined ? undefined : indent === '' ? t : t.replace(/\n/g, `\n${indent}`);
    }
    case Shape.Array: case Shape.View: {
      const a = v as ArrayLike<unknown>;
      const len = a.length;
      if (len === 0) return '[]';
      const inner = `${indent}  `;
      const parts = new Array<string>(len);
      if (len > LONG_ARRAY) {
        const lines = prevLongArrayLines(a, inner);
        if (lines !== undefined) return `[\n${inner}${lines}\n${indent}]`;
        for (let i = 0; i < len; i++) parts[i] = (JSON.stringify(toSnakeCaseJson(a[i])) as string | undefined) ?? 'null';
      } else {
        for (let i = 0; i < len; i++) parts[i] = prevPrettyText(a[i], inner) ?? 'null';
      }
      return `[\n${inner}${parts.join(`,\n${inner}`)}\n${indent}]`;
    }
    default: {
      const userIds = shape === Shape.Map;
      const src = (!asMap && v instanceof UserIdMap ? v.entries : v) as Record<string, unknown>;
      const inner = `${indent}  `;
      let out = '';
      // the one change since: two keys with one JSON name are written once, where the name first
      // stands, with the last key's value (as toSnakeCaseJson's object; this writer wrote both)
      const byName = new Map<string, string>();
      for (const k of Object.keys(src)) byName.set(userIds ? k : prevSnakeCaseKey(k), k);
      for (const k of byName.values()) {
        const m = src[k];
        const isMap = !userIds && USER_ID_MAP_FIELDS.has(k) && m !== null && typeof m === 'object' && !Array.isArray(m) && !ArrayBuffer.isView(m);
        const t = prevPrettyText(m, inner, isMap);
        if (t === undefined) continue;
        out += `${out === '' ? '' : ','}\n${inner}${prevQuotedKey(k, !userIds)}: ${t}`;
      }
      return out === '' ? '{}' : `{${out}\n${indent}}`;
    }
  }
}
function prevLongArrayLines(a: ArrayLike<unknown>, inner: string): string | undefined {
  const len = a.length;
  if (ArrayBuffer.isView(a) && !(a instanceof BigInt64Array || a instanceof BigUint64Array)) {
    return len === 0 ? '' : JSON.stringify(Array.from(a)).slice(1, -1).replaceAll(',', `,\n${inner}`);
  }
  let numbers = true, rows = true;
  const renamed = new Set<string>();
  const checked = new Set<string>();
  for (let i = 0; i < len && (numbers || rows); i++) {
    const e = a[i];
    if (typeof e !== 'number') numbers = false;
    if (!rows) continue;
    if (e === null || typeof e !== 'object' || Array.isArray(e) || e instanceof UserIdMap || ArrayBuffer.isView(e)) { rows = false; continue; }
    const proto = Object.getPrototypeOf(e);
    if (proto !== Object.prototype && proto !== null) { rows = false; continue; }
    let written = false;
    for (const k in e) {
      const v = (e as Record<string, unknown>)[k];
      if (k === 'toJSON' || (v !== null && typeof v === 'object') || (typeof v === 'string' && v.endsWith('},{')) || k.endsWith('},{')) { rows = false; break; }
      if (v !== undefined && typeof v !== 'function' && typeof v !== 'symbol') written = true;
      if (!checked.has(k)) { checked.add(k); if (prevSnakeCaseKey(k) !== k) renamed.add(k); }
    }
    if (!written) rows = false;
  }
  if (numbers) return JSON.stringify(Array.isArray(a) ? a : Array.prototype.slice.call(a)).slice(1, -1).replaceAll(',', `,\n${inner}`);
  if (!rows) return undefined;
  let source: ArrayLike<unknown> = a;
  if (renamed.size > 0) {
    const copies = new Array<Record<string, unknown>>(len);
    for (let i = 0; i < len; i++) {
      const e = a[i] as Record<string, unknown>;
      const o: Record<string, unknown> = {};
      for (const k in e) o[renamed.has(k) ? prevSnakeCaseKey(k) : k] = e[k];
      copies[i] = o;
    }
    source = copies;
  }
  return (JSON.stringify(Array.isArray(source) ? source : Array.prototype.slice.call(source)) as string).slice(1, -1).replaceAll('},{"', `},\n${inner}{"`);
}
/** The earlier snakeCaseJsonText (reference). */
function previousSnakeCaseJsonText(value: unknown): string {
  return prevPrettyText(value, '') as string;
}

// ---- random values ----

const MAPPED = Object.keys(SNAKE_CASE_KEYS);
/** Keys: mapped camelCase and acronym fields, their JSON names, user-map fields, unicode, tricky text. */
const key = fc.oneof(
  fc.constantFrom(...MAPPED),
  fc.constantFrom('date', 'cost', 'day', 'KRelSd', 'dsM2PerS', 'uv254_0PerM', 'dose_mg_per_L', 'removalPercent', 'samples', 'jarTests', '1', '07', ''),
  fc.constantFrom('Dosis µg/L', 'ΔDOC', '日付', '😀key', 'a"b', 'back\\slash', 'line\nbreak', 'k},{', '},{"x', '\u2028'),
  fc.string({ maxLength: 6 }),
);
/** Numbers: NaN-free, with negative zero, the largest and smallest, exponents and long fractions. */
const num = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer(),
  fc.constantFrom(-0, 0, 1e21, 1e-7, 5e-324, -5e-324, Number.MAX_VALUE, -Number.MAX_VALUE, 2 ** 53, 0.1 + 0.2, 123456789.12345678, -1.5e-10),
);
const str = fc.oneof(
  fc.string({ maxLength: 8 }),
  fc.string({ unit: 'grapheme', maxLength: 5 }),
  fc.constantFrom('2026-01-01', 'compound HCT', 'x},{', '},{"', 'a"b', '\\', '\n', '\u0000', '\ud800', 'µ–€', ''),
);
const leaf = fc.oneof({ weight: 4, arbitrary: num }, { weight: 3, arbitrary: str }, { weight: 1, arbitrary: fc.constantFrom(null, undefined, true, false) });
const longLength = fc.integer({ min: LONG_ARRAY + 1, max: LONG_ARRAY + 40 });

/** Per-day rows of one shape (the first row's keys in its order), some rows changed: a key missing, added or moved, a value an object, every value left out. */
const rows = fc.tuple(fc.uniqueArray(key, { minLength: 1, maxLength: 7 }), longLength, fc.array(fc.tuple(fc.nat(), fc.nat(6)), { maxLength: 3 }), fc.array(leaf, { minLength: 200, maxLength: 200 }))
  .map(([keys, n, changes, values]) => {
    const out: Array<Record<string, unknown>> = [];
    for (let i = 0; i < n; i++) {
      const r: Record<string, unknown> = {};
      keys.forEach((k, j) => { r[k] = values[(i * 7 + j * 13) % values.length]; });
      out.push(r);
    }
    for (const [at, kind] of changes) {
      const r = out[at % n]!;
      const k0 = keys[0]!;
      if (kind === 0) delete r[k0];
      else if (kind === 1) r.extraKey = 1;
      else if (kind === 2) { const v = r[k0]; delete r[k0]; r[k0] = v; }
      else if (kind === 3) r[k0] = { nested: 1 };
      else if (kind === 4) for (const k of keys) r[k] = undefined;
      else if (kind === 5) r[k0] = 'tail},{';
      else out[at % n] = Object.assign(Object.create(null), r) as Record<string, unknown>;
    }
    return out;
  });
const numbers = fc.array(num, { minLength: LONG_ARRAY + 1, maxLength: LONG_ARRAY + 60 });
const typed = fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { minLength: LONG_ARRAY + 1, maxLength: LONG_ARRAY + 30 }).map((v) => Float64Array.from(v));

const value = fc.letrec((tie) => ({
  v: fc.oneof({ depthSize: 'small' }, leaf, tie('obj'), tie('arr'), tie('long'), tie('map')),
  obj: fc.dictionary(key, tie('v'), { maxKeys: 5 }),
  arr: fc.oneof(fc.array(tie('v'), { maxLength: 4 }), fc.constant([]), fc.constant({})),
  long: fc.oneof(rows, numbers, typed, fc.array(tie('v'), { minLength: LONG_ARRAY + 1, maxLength: LONG_ARRAY + 2 })),
  map: fc.dictionary(key, tie('v'), { maxKeys: 3 }).map((e) => userIdMap(e)),
}));

describe('snakeCaseJsonText where two keys give one JSON name', () => {
  it('writes the name once, where it first stands, with the last key\'s value, as toSnakeCaseJson\'s object holds it (the previous writer wrote the name twice)', () => {
    const cases: Array<[unknown, string]> = [
      [{ doseMgPerL: [], dose_mg_per_L: 0 }, '{\n  "dose_mg_per_L": 0\n}'],
      [{ dose_mg_per_L: 0, x: 1, doseMgPerL: [] }, '{\n  "dose_mg_per_L": [],\n  "x": 1\n}'],
      [{ doseMgPerL: 1, dose_mg_per_L: undefined, x: 2 }, '{\n  "x": 2\n}'],
      [{ a: { doseMgPerL: 1, q: 3, dose_mg_per_L: { z: 1 } } }, '{\n  "a": {\n    "dose_mg_per_L": {\n      "z": 1\n    },\n    "q": 3\n  }\n}'],
    ];
    for (const [v, text] of cases) {
      expect(snakeCaseJsonText(v)).toBe(text);
      expect(snakeCaseJsonText(v)).toBe(jsonText(toSnakeCaseJson(v)));
    }
  });
});

describe('snakeCaseJsonText against the previous writer', () => {
  it('the same text on random nested values (unicode and camelCase keys, -0, 1e21, 5e-324, long arrays, empty and undefined members, null)', () => {
    fc.assert(fc.property(value.v, (v) => {
      const text = snakeCaseJsonText(v);
      expect(text).toBe(previousSnakeCaseJsonText(v));
      expect(text).toBe(jsonText(toSnakeCaseJson(v)));
    }), { numRuns: 400 });
  });

  it('the same text for long arrays of rows, numbers and typed arrays on their own and nested', () => {
    fc.assert(fc.property(rows, numbers, typed, (r, n, t) => {
      for (const v of [r, n, t, { daily: r, doseMgPerL: n, samples: { x: t } }, [[r]], userIdMap({ docMgPerL: r })]) {
        expect(snakeCaseJsonText(v)).toBe(previousSnakeCaseJsonText(v));
      }
    }), { numRuns: 200 });
  });

  it('the same text for per-day rows longer than a chunk, renamed or not, with a changed row far in', () => {
    const day = (k: number) => ({ date: `2000-${k}`, docMgPerL: 8 + (k % 97) / 7, flowM3PerD: 13_000 + k, doseMgPerL: k / 3, governedBy: k % 5 ? 'compound HCT' : null, carbonKgPerD: -0, cost: k * 1e-9 });
    const long = Array.from({ length: 10_003 }, (_, k) => day(k));
    const plain = long.map((r) => ({ date: r.date, cost: r.cost, n: null }));
    const changedLate = long.map((r, k) => (k === 9_000 ? { ...r, extra: 'x' } : r));
    const objectLate = long.map((r, k) => (k === 9_999 ? { ...r, date: { d: 1 } } : r));
    const emptyLate = long.map((r, k) => (k === 8_500 ? { date: undefined } : r));
    const nanNumbers = Array.from({ length: 5_000 }, (_, k) => (k === 4_321 ? NaN : k % 7 === 0 ? -Infinity : k / 9));
    const nanTyped = Float32Array.from({ length: 300 }, (_, k) => (k === 100 ? NaN : k / 3));
    for (const v of [long, plain, changedLate, objectLate, emptyLate, nanNumbers, nanTyped, { results: { carbons: [{ daily: long }, { daily: plain }] } }]) {
      expect(snakeCaseJsonText(v)).toBe(previousSnakeCaseJsonText(v));
      expect(snakeCaseJsonText(v)).toBe(jsonText(toSnakeCaseJson(v)));
    }
  });

  it('an own __proto__ key in rows is left out, as toSnakeCaseJson leaves it out', () => {
    const rowsWithProto = Array.from({ length: LONG_ARRAY + 1 }, (_, k) => JSON.parse(`{"__proto__": ${k}, "day": ${k}}`) as Record<string, unknown>);
    expect(snakeCaseJsonText(rowsWithProto)).toBe(jsonText(toSnakeCaseJson(rowsWithProto)));
    expect(snakeCaseJsonText(rowsWithProto)).not.toContain('__proto__');
  });

  it('snakeCaseKey gives the mapped name, and the key itself for any other (inherited names too)', () => {
    for (const k of MAPPED) expect(snakeCaseKey(k)).toBe(SNAKE_CASE_KEYS[k]);
    for (const k of ['constructor', 'toString', '__proto__', 'hasOwnProperty', 'dose_mg_per_L', '']) expect(snakeCaseKey(k)).toBe(k);
  });
});
