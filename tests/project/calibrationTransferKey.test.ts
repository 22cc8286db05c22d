/**
 * The project key "calibration_transfer" (issue 11): accepted values and every bad value named by
 * its JSON path with what was expected; the shipped JSON Schema knows the key.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from './jsonSchemaCheck.js';

const root = join(__dirname, '../..');
const schema = JSON.parse(readFileSync(join(root, 'schema/project.schema.json'), 'utf8'));
const demo = JSON.parse(readFileSync(join(root, 'fixtures/demo/project.json'), 'utf8'));
const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;
const withTransfer = (v: unknown, f: (p: any) => void = () => undefined) => { const p = clone(demo); p.calibration_transfer = v; f(p); return p; };

describe('calibration_transfer: accepted values', () => {
  it('"none", "mean" and the id of a compound with jar tests validate (hand validator and schema)', () => {
    expect(validateProject(withTransfer('none')).calibrationTransfer).toEqual({ kind: 'none' });
    expect(validateProject(withTransfer('mean')).calibrationTransfer).toEqual({ kind: 'mean' });
    expect(validateProject(withTransfer('CBZ')).calibrationTransfer).toEqual({ kind: 'compound', compoundId: 'CBZ' });
    for (const v of ['none', 'mean', 'CBZ']) expect(validateAgainstSchema(schema, withTransfer(v))).toEqual([]);
    expect(validateProject(clone(demo)).calibrationTransfer).toBeUndefined();
  });
});

// [description, value, mutation, words of what was expected]
const BAD: Array<[string, unknown, (p: any) => void, RegExp]> = [
  ['a number', 1, () => undefined, /expected "none", "mean" or the id of a compound with jar tests \("CBZ"\), got number 1/],
  ['an empty text', '', () => undefined, /expected "none", "mean" or the id/],
  ['an object', { from: 'CBZ' }, () => undefined, /expected "none", "mean" or the id/],
  ['null', null, () => undefined, /expected "none", "mean" or the id/],
  ['an unknown id', 'CBX', () => undefined, /"CBX" is not "none", "mean" or a compound id; expected one of "none", "mean", "CBZ"/],
  ['a compound without jar tests', 'DCF', () => undefined, /compound "DCF" has no jar tests to transfer; expected one of "CBZ"/],
  ['"mean" with no jar tests at all', 'mean', (p) => { delete p.compounds[0].jar_tests; }, /needs at least one compound with "jar_tests"; none has any/],
  ['"mean" over a target-K factor and an EBC', 'mean', (p) => { p.compounds[1].jar_tests = { file: 'jar_tests_cbz.csv', model: 'sebc' }; }, /mix target-K factors .* and EBCs .*cannot be averaged; name one compound instead: one of "CBZ", "DCF"/],
  ['a case variant of the keyword', 'Mean', () => undefined, /"Mean" is not "none", "mean" or a compound id/],
];

describe('calibration_transfer: bad values name the key and what was expected', () => {
  for (const [what, v, f, words] of BAD) {
    it(what, () => {
      let err: unknown;
      try { validateProject(withTransfer(v, f)); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).location.path).toBe('calibration_transfer');
      expect((err as InputError).message).toContain('field calibration_transfer');
      expect((err as InputError).message).toMatch(words);
    });
  }

  it('the schema rejects the values it can express (not text)', () => {
    for (const v of [1, '', { from: 'CBZ' }, null]) expect(validateAgainstSchema(schema, withTransfer(v)).length).toBeGreaterThan(0);
  });
});
