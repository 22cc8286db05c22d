/**
 * The JSON writer of run.json and every --json output: the same JSON value as JSON.stringify
 * (ECMA-262 JSON.stringify is the reference), the same text as JSON.stringify(value, null, 2)
 * while no array is longer than LONG_ARRAY, and a long array one compact element per line.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { jsonText, LONG_ARRAY, snakeCaseJsonText, toSnakeCaseJson, userIdMap } from '../../src/output/snakeCaseJson.js';

describe('jsonText', () => {
  it('is JSON.stringify(v, null, 2) for values without long arrays, and parses back to the same value', () => {
    fc.assert(fc.property(fc.jsonValue({ maxDepth: 4 }), (v) => {
      expect(jsonText(v)).toBe(JSON.stringify(v, null, 2));
    }), { numRuns: 500 });
  });

  it('treats undefined, functions, non-finite numbers and toJSON as JSON.stringify does', () => {
    const v = { a: undefined, b: () => 1, c: [undefined, NaN, Infinity, () => 2], d: new Date(Date.UTC(2026, 0, 2)), e: {}, f: [], g: { h: undefined } };
    expect(jsonText(v)).toBe(JSON.stringify(v, null, 2));
    expect(jsonText(null)).toBe('null');
  });

  it('writes a long array one compact element per line, the same value', () => {
    const rows = Array.from({ length: LONG_ARRAY + 1 }, (_, k) => ({ date: `d${k}`, dose: k / 3, governed: k % 2 ? null : 'x', missing: undefined }));
    const v = { daily: rows, n: 1 };
    const text = jsonText(v);
    expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(v)));
    const lines = text.split('\n');
    expect(lines[1]).toBe('  "daily": [');
    expect(lines[2]).toBe(`    ${JSON.stringify(rows[0])},`);
    expect(lines).toHaveLength(rows.length + 5);
  });
});

describe('snakeCaseJsonText', () => {
  // reference: the two-step definition, jsonText(toSnakeCaseJson(v)) (closed form of the one-pass writer)
  const reference = (v: unknown) => jsonText(toSnakeCaseJson(v));
  const keys = fc.constantFrom('doseMgPerL', 'docMgPerL', 'removalPercent', 'samples', 'date', 'a', 'toJSON', 'k},{', '1');
  const leaf = fc.oneof(fc.double(), fc.integer(), fc.constantFrom(null, undefined, true, 'x},{', 'a"b', '},{"', '\n'), fc.string());
  const value = fc.letrec((tie) => ({
    v: fc.oneof({ depthSize: 'small' }, leaf, tie('obj'), tie('arr'), tie('long'), tie('map')),
    obj: fc.dictionary(keys, tie('v'), { maxKeys: 4 }),
    arr: fc.array(tie('v'), { maxLength: 3 }),
    long: fc.oneof(
      fc.array(fc.dictionary(keys, leaf, { maxKeys: 4 }), { minLength: LONG_ARRAY + 1, maxLength: LONG_ARRAY + 3 }),
      fc.array(fc.double(), { minLength: LONG_ARRAY + 1, maxLength: LONG_ARRAY + 3 }),
      fc.array(tie('v'), { minLength: LONG_ARRAY + 1, maxLength: LONG_ARRAY + 2 }),
    ),
    map: fc.dictionary(keys, tie('v'), { maxKeys: 3 }).map((e) => userIdMap(e)),
  }));

  it('is jsonText(toSnakeCaseJson(v)) on random nested values (per-day rows, numbers, user-id maps, tricky strings)', () => {
    fc.assert(fc.property(value.v, (v) => { expect(snakeCaseJsonText(v)).toBe(reference(v)); }), { numRuns: 100 });
  });

  it('is jsonText(toSnakeCaseJson(v)) for typed arrays, dates, class instances and toJSON', () => {
    class Point { x = 1; doseMgPerL = [1, 2]; }
    const v = {
      f: Float64Array.from({ length: LONG_ARRAY + 5 }, (_, i) => i / 3), g: new Float64Array(3), d: new Date(0), p: new Point(),
      rows: Array.from({ length: LONG_ARRAY + 2 }, (_, i) => ({ doseMgPerL: i / 7, at: new Date(i), n: null })),
      odd: Array.from({ length: LONG_ARRAY + 2 }, (_, i) => (i === 5 ? { nothing: undefined } : { doseMgPerL: i })),
      t: { toJSON: () => ({ doseMgPerL: 1 }) }, removalPercent: { doseMgPerL: [1] }, samples: userIdMap({ docMgPerL: new Float64Array(2) }),
      nested: { deeper: Array.from({ length: LONG_ARRAY + 1 }, (_, i) => [i, { docMgPerL: i }]) },
    };
    expect(snakeCaseJsonText(v)).toBe(reference(v));
    expect(snakeCaseJsonText(Array.from({ length: LONG_ARRAY + 1 }, (_, i) => ({ i })))).toBe(reference(Array.from({ length: LONG_ARRAY + 1 }, (_, i) => ({ i }))));
    expect(snakeCaseJsonText(undefined)).toBe(reference(undefined));
  });
});
