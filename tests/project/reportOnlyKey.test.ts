/**
 * The compound key "goal" (issue 11): `"goal": "none"` marks a report-only compound; every other
 * value, and a limit beside it, is an input error naming the JSON path; the JSON Schema agrees.
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

describe('compound goal "none"', () => {
  it('marks the compound report-only (hand validator and schema); without the key it is not', () => {
    const p = clone(demo);
    p.compounds[1].goal = 'none';
    expect(validateProject(p).compounds[1]!.reportOnly).toBe(true);
    expect(validateAgainstSchema(schema, p)).toEqual([]);
    expect(validateProject(clone(demo)).compounds[1]!.reportOnly).toBeUndefined();
  });

  // [description, mutation, JSON path, words]
  const BAD: Array<[string, (p: any) => void, string, RegExp]> = [
    ['another text', (p) => { p.compounds[1].goal = 'report'; }, 'compounds[1].goal', /expected "none" \(a report-only compound that never governs the dose\), got the text "report"/],
    ['a percentage', (p) => { p.compounds[1].goal = 80; }, 'compounds[1].goal', /expected "none".*got number 80/],
    ['null', (p) => { p.compounds[1].goal = null; }, 'compounds[1].goal', /expected "none"/],
    ['"None" (case)', (p) => { p.compounds[1].goal = 'None'; }, 'compounds[1].goal', /expected "none"/],
    ['with its own limit', (p) => { p.compounds[8].goal = 'none'; }, 'compounds[8].limit', /report-only compound \("goal": "none"\) cannot also have an effluent limit/],
    ['with a limit in goals.limits', (p) => { p.compounds[1].goal = 'none'; p.goals.limits = { DCF: '50 ng/L' }; }, 'goals.limits.DCF', /"DCF" is a report-only compound \("goal": "none"\); it cannot have a limit/],
  ];
  for (const [what, f, path, words] of BAD) {
    it(`rejects ${what}`, () => {
      const p = clone(demo);
      f(p);
      let err: unknown;
      try { validateProject(p); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).location.path).toBe(path);
      expect((err as InputError).message).toContain(`field ${path}`);
      expect((err as InputError).message).toMatch(words);
    });
  }
  it('the schema rejects the values it can express (anything but "none")', () => {
    for (const v of ['report', 80, null, 'None']) { const p = clone(demo); p.compounds[1].goal = v; expect(validateAgainstSchema(schema, p).length).toBeGreaterThan(0); }
  });
});
