/**
 * The project key "carbons[i].background" (issue 11, capability 21): a carbon's own DOC isotherm
 * or background file. Accepted shapes (hand validator and the shipped JSON Schema), the
 * fractionation options inherited from the project's background, and every bad value named by
 * its JSON path; on the command line a bad value exits 2 naming the path, with nothing printed
 * on stdout and nothing written.
 */
import { describe, expect, it } from 'vitest';
import { copyFileSync, existsSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from './jsonSchemaCheck.js';
import { runBin, scratchDir } from '../helpers/cliHarness.js';

const root = join(__dirname, '../..');
const fixtureDir = join(root, 'fixtures/project/per-carbon-background');
const schema = JSON.parse(readFileSync(join(root, 'schema/project.schema.json'), 'utf8'));
const fixture = JSON.parse(readFileSync(join(fixtureDir, 'project.json'), 'utf8'));
const ebcFixture = JSON.parse(readFileSync(join(root, 'fixtures/project/ebc-background/project.json'), 'utf8'));
const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;
/** The fixture with carbon Q's background replaced by `v` (and a further change). */
const withQ = (v: unknown, f: (p: any) => void = () => undefined) => { const p = clone(fixture); p.carbons[1].background = v; f(p); return p; };

describe('carbons[i].background: accepted values', () => {
  it('an own isotherm inherits the project\'s fractionation options, overridden key by key by its own', () => {
    const p = validateProject(clone(fixture));
    expect(p.carbons[1]!.background).toEqual({ kind: 'isotherm', file: 'doc_isotherm_carbon_q.csv', options: { components: 3, exponent: 0.2, fitK: false } });
    expect(p.carbons[0]!.background).toBeUndefined();
    expect(p.carbons[2]!.background).toBeUndefined();
    const own = validateProject(withQ({ isotherm: 'q.csv', fractionation: { components: 4 } })).carbons[1]!.background;
    expect(own).toEqual({ kind: 'isotherm', file: 'q.csv', options: { components: 4, exponent: 0.2, fitK: false } });
  });

  it('a background file is accepted, also beside a project background file (hand validator and schema)', () => {
    expect(validateProject(withQ({ file: 'q.json' })).carbons[1]!.background).toEqual({ kind: 'file', file: 'q.json' });
    const p = withQ({ file: 'q.json' }, (x) => { x.background = { file: 'reference.json' }; });
    expect(validateProject(p).carbons[1]!.background).toEqual({ kind: 'file', file: 'q.json' });
    for (const v of [withQ({ file: 'q.json' }), p, withQ({ isotherm: 'q.csv', fractionation: { exponent: 0.25, fit_k: true }, note: 'x' })]) expect(validateAgainstSchema(schema, v)).toEqual([]);
  });
});

// [description, value, mutation, JSON path, words of what was expected]
const BAD: Array<[string, unknown, (p: any) => void, string, RegExp]> = [
  ['not an object', 'q.csv', () => undefined, 'carbons[1].background', /expected the carbon's own background/],
  ['neither isotherm nor file', { note: 'x' }, () => undefined, 'carbons[1].background', /expected exactly one of "isotherm" .* or "file" .*, got none/],
  ['both isotherm and file', { isotherm: 'q.csv', file: 'q.json' }, () => undefined, 'carbons[1].background', /got "isotherm" and "file"/],
  ['an unknown key', { isotherm: 'q.csv', fractionaton: {} }, () => undefined, 'carbons[1].background.fractionaton', /unknown key/],
  ['fractionation beside a file', { file: 'q.json', fractionation: {} }, () => undefined, 'carbons[1].background.fractionation', /unknown key/],
  ['an isotherm that is not text', { isotherm: 3 }, () => undefined, 'carbons[1].background.isotherm', /a DOC isotherm CSV path/],
  ['too many components', { isotherm: 'q.csv', fractionation: { components: 7 } }, () => undefined, 'carbons[1].background.fractionation.components', /from 2 to 5/],
  ['an exponent of 1', { isotherm: 'q.csv', fractionation: { exponent: 1 } }, () => undefined, 'carbons[1].background.fractionation.exponent', /between 0 and 1/],
  ['fit_k not a boolean', { isotherm: 'q.csv', fractionation: { fit_k: 'yes' } }, () => undefined, 'carbons[1].background.fractionation.fit_k', /true or false/],
];

describe('carbons[i].background: bad values name the JSON path and what was expected', () => {
  for (const [what, v, f, path, words] of BAD) {
    it(what, () => {
      let err: unknown;
      try { validateProject(withQ(v, f)); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).location.path).toBe(path);
      expect((err as InputError).message).toMatch(words);
      expect(validateAgainstSchema(schema, withQ(v, f)).length).toBeGreaterThan(0);
    });
  }

  it('an own background beside an EBC project background is refused at carbons[0].background', () => {
    const p = clone(ebcFixture);
    p.carbons[0].background = { isotherm: 'q.csv' };
    let err: unknown;
    try { validateProject(p); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).location.path).toBe('carbons[0].background');
    expect((err as InputError).message).toMatch(/needs a fractionated project background \("isotherm" or "file"\)/);
  });
});

describe('sorbshare run: a bad carbon background exits 2 naming the place, nothing printed or written', () => {
  const cases: Array<[string, (p: any) => void, RegExp]> = [
    ['a missing isotherm file', (p) => { p.carbons[1].background = { isotherm: 'no_such.csv' }; }, /no_such\.csv.*carbons\[1\]\.background\.isotherm/s],
    ['an unknown key', (p) => { p.carbons[1].background.fraction = 3; }, /carbons\[1\]\.background\.fraction/],
    ['an isotherm whose DOC rises with dose (row named)', (p) => { p.carbons[1].background = { isotherm: 'rising.csv' }; }, /rising\.csv.*row 4/s],
  ];
  for (const [what, change, words] of cases) {
    it(what, () => {
      const s = scratchDir('sorbshare-carbon-bg-');
      try {
        for (const f of ['doc_isotherm.csv', 'doc_isotherm_carbon_q.csv']) copyFileSync(join(fixtureDir, f), join(s.dir, f));
        s.write('rising.csv', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,7.5,7.5\n10,7.5,5.0\n20,7.5,6.4\n40,7.5,5.0\n80,7.5,4.5\n');
        const p = clone(fixture);
        delete p.$schema; delete p.uncertainty;
        change(p);
        const file = s.write('project.json', p);
        const out = join(s.dir, 'out');
        const r = runBin('run', file, '--out', out);
        expect(r.code).toBe(2);
        expect(r.out).toBe('');
        expect(r.err).toMatch(words);
        expect(existsSync(out)).toBe(false);
      } finally {
        rmSync(s.dir, { recursive: true, force: true });
      }
    });
  }
});
