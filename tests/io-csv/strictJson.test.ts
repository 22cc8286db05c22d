/**
 * The strict JSON reader: valid JSON (RFC 8259) reads as JSON.parse reads it; malformed JSON names
 * line and column; duplicate keys and numbers outside the double range name their JSON path; text
 * loses control and direction characters. Nearest-key suggestions use the optimal string
 * alignment distance (Damerau 1964; closed-form values below counted by hand).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseStrictJson } from '../../src/text/strictJson.js';
import { editDistance, nearestKey } from '../../src/text/nearestKey.js';
import { cleanName } from '../../src/text/cleanText.js';
import { InputError } from '../../src/core/errors.js';

function err(text: string): InputError {
  try { parseStrictJson(text, 'f.json'); } catch (e) { return e as InputError; }
  throw new Error('no error');
}

describe('parseStrictJson', () => {
  it('reads what JSON.parse reads (property: any JSON value without duplicate keys)', () => {
    fc.assert(fc.property(fc.jsonValue({ noUnicodeString: true }), (v) => {
      const text = JSON.stringify(v);
      expect(parseStrictJson(text)).toEqual(JSON.parse(text));
    }), { numRuns: 200 });
  });
  it.each([
    ['{"a": 1,\n "b": }', 2, 7],
    ['{"a": 1,}', 1, 9],
    ['{"a": 01}', 1, 7],
    ["{'a': 1}", 1, 2],
    ['{"a": 1', 1, 8],
    ['{"a": NaN}', 1, 7],
    ['{"a": 8,5}', 1, 9],
    ['[1, 2] 3', 1, 8],
  ])('malformed %j names line %i, column %i', (text, line, column) => {
    const e = err(text);
    expect(e.message).toContain(`f.json: malformed JSON at line ${line}, column ${column}`);
  });
  it('names a duplicate key with its JSON path', () => {
    const e = err('{"components": [{"id": "a", "K": 1, "K": 2}]}');
    expect(e.location.path).toBe('components[0].K');
    expect(e.message).toMatch(/duplicate key "K"/);
  });
  it('names a number outside the double range', () => {
    const e = err('{"dose": 1e999}');
    expect(e.location.path).toBe('dose');
    expect(e.message).toMatch(/outside the double range/);
    expect(err('{"a": [-2e308]}').location.path).toBe('a[0]');
  });
  it('keeps __proto__ as an own key, never a prototype', () => {
    const v = parseStrictJson('{"__proto__": {"x": 1}}') as Record<string, unknown>;
    expect(Object.getPrototypeOf(v)).toBe(Object.prototype);
    expect(Object.keys(v)).toEqual(['__proto__']);
  });
  it('removes control and direction characters from text values', () => {
    expect(parseStrictJson('{"id": "CBZ\\u202e\\u0007x\\ty"}')).toEqual({ id: 'CBZx y' });
  });
});

describe('nearestKey', () => {
  it('edit distances counted by hand', () => {
    expect(editDistance('kitten', 'sitting')).toBe(3); // Levenshtein's classic example: 2 substitutions + 1 insertion
    expect(editDistance('ca', 'ac')).toBe(1); // one transposition
    expect(editDistance('', 'abc')).toBe(3);
  });
  it('points misspellings to the intended key', () => {
    const keys = ['id', 'name', 'c0', 'K', 'one_over_n', 'K_unit', 'molar_mass'];
    expect(nearestKey('K_units', keys)).toBe('K_unit');
    expect(nearestKey('k_unit', keys)).toBe('K_unit');
    expect(nearestKey('oneovern', keys)).toBe('one_over_n');
    expect(nearestKey('molarmass', keys)).toBe('molar_mass');
    expect(nearestKey('k', keys)).toBe('K');
  });
});

describe('cleanName', () => {
  it('removes C0/C1 controls and bidi overrides and isolates (UAX #9)', () => {
    expect(cleanName('a\u202Eb\u2066c\u2069d\u200Fe\u0000f\u009Bg')).toBe('abcdefg');
    expect(cleanName('two\nlines')).toBe('two lines');
    expect(cleanName('Ünïcødé µg')).toBe('Ünïcødé µg');
  });
});

describe('decimal comma in JSON', () => {
  it('says so', () => {
    expect(err('{"K": 8,5}').message).toMatch(/decimal comma.*8\.5/);
  });
});
