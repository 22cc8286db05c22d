/**
 * The reference check cases (fixtures/checks/<case>/input.json and expected.json). Each expected
 * value was computed by scripts/checkExpected.ts from the published equation, without the
 * library; the test keeps the expected files in step with that script (rewrite them only with
 * UPDATE_FIXTURES=1) and checks the library against them within each case's tolerance.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readCheckCase, readCheckInput, readCheckExpected, runCheckCase, CHECK_KINDS, PROVENANCES } from '../../src/checks/checkCase.js';
import { checkCaseFolders, expectedFile } from '../../scripts/checkExpected.js';

const folders = checkCaseFolders();
const read = (dir: string, name: string) => JSON.parse(readFileSync(join(dir, name), 'utf8'));
const cases = folders.map(({ dir }) => readCheckCase(read(dir, 'input.json'), read(dir, 'expected.json')));

describe('reference check cases', () => {
  it('ships the cases of the sources (Chen 1999, closed forms, Knappe 1998, SR 814.201.231, Hendricks TCE)', () => {
    const sources = cases.map((c) => c.source).join('\n');
    for (const s of ['Chen, Z., Xing, B., McGill', 'Sheindorf', 'Knappe', 'SR 814.201.231', 'Hendricks', 'Crittenden']) expect(sources).toContain(s);
    expect(cases.some((c) => c.kind === 'batch_fraction_remaining')).toBe(true);
    expect(new Set(cases.map((c) => c.id)).size).toBe(cases.length);
    expect(folders.length).toBe(11);
  });

  it('labels provenance honestly: the Chen worked values and the 83.33 % example are computed from a rule, never published', () => {
    for (const c of cases) expect(PROVENANCES).toContain(c.provenance);
    const byId = Object.fromEntries(cases.map((c) => [c.id, c.provenance]));
    for (const id of ['k-conversion-ug', 'k-conversion-mmol', 'k-conversion-same-q', 'k-conversion-ug-per-mg', 'sr814-indicator-mean', 'tce-isotherm-10', 'tce-isotherm-0.1', 'knappe-trace-limit']) {
      expect(byId[id], id).toBe('computed from a published rule');
    }
    for (const id of ['equal-k-fraction-remaining', 'single-solute-batch', 'srs-common-exponent']) expect(byId[id], id).toBe('closed form');
    // no case's value is printed in its source, so none may say so
    expect(cases.filter((c) => c.provenance === 'published table')).toEqual([]);
    for (const c of cases) expect(c.note ?? '', c.id).not.toMatch(/\bpublished to\b/i);
  });

  for (const { dir, input } of folders) {
    it(`${input.id}: expected.json is what scripts/checkExpected.ts computes (UPDATE_FIXTURES=1 rewrites it)`, () => {
      expect(read(dir, 'expected.json')).toEqual(expectedFile(input));
    });
    it(`${input.id}: the library agrees with the expected value within the case's tolerance`, () => {
      const o = runCheckCase(readCheckCase(read(dir, 'input.json'), read(dir, 'expected.json')));
      expect(o.error).toBeUndefined();
      expect(o.pass).toBe(true);
      expect(o.provenance).toBe(input.provenance);
    });
  }

  it('fails a case whose expected value is off', () => {
    const c = cases.find((x) => x.id === 'sr814-indicator-mean')!;
    const o = runCheckCase({ ...c, expected: 84 });
    expect(o.pass).toBe(false);
    expect(o.computed).toBeCloseTo(500 / 6, 12);
  });

  it('rejects a malformed case naming the field, unknown keys included', () => {
    const good = read(folders[0]!.dir, 'input.json');
    expect(() => readCheckInput({ ...good, kind: 'nope' })).toThrow(/field kind/);
    expect(() => readCheckInput({ ...good, provenance: 'published' })).toThrow(/field provenance: expected "provenance" as one of "published table", "closed form", "computed from a published rule"/);
    expect(() => readCheckInput({ ...good, expected: 1 })).toThrow(/field expected: unknown key "expected"/);
    expect(() => readCheckInput({ ...good, tolerance: { relative: 1, rel: 2 } })).toThrow(/unknown key "rel"/);
    expect(() => readCheckExpected({ expected: 1 })).toThrow(/computed_by/);
    expect(() => readCheckExpected({ expected: '1', computed_by: 'x' })).toThrow(/field expected/);
    expect(() => readCheckExpected({ expected: 1, computed_by: 'x', extra: 0 })).toThrow(/unknown key "extra"/);
    expect(CHECK_KINDS.length).toBeGreaterThan(5);
  });
});
