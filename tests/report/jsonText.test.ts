/**
 * The JSON writer of run.json and every --json output: the same JSON value as JSON.stringify
 * (ECMA-262 JSON.stringify is the reference), the same text as JSON.stringify(value, null, 2)
 * while no array is longer than LONG_ARRAY, and a long array one compact element per line.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { jsonText, LONG_ARRAY } from '../../src/output/snakeCaseJson.js';

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
