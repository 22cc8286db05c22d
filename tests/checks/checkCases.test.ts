import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readCheckCase, runCheckCase, CHECK_KINDS } from '../../src/checks/checkCase.js';

// The shipped cases carry their own published sources (fixtures/checks/*.json); this test runs
// each in-process and also checks that a deliberately wrong expectation fails.
const dir = join(__dirname, '../../fixtures/checks');
const files = readdirSync(dir).filter((f) => f.endsWith('.json')).sort();

describe('published check cases', () => {
  it('ships the cases the issue names (Chen 1999, closed forms, Knappe 1998, SR 814.201.231, Hendricks TCE)', () => {
    const cases = files.map((f) => readCheckCase(JSON.parse(readFileSync(join(dir, f), 'utf8'))));
    const sources = cases.map((c) => c.source).join('\n');
    for (const s of ['Chen, Z., Xing, B., McGill', 'Sheindorf', 'Knappe', 'SR 814.201.231', 'Hendricks', 'Crittenden']) expect(sources).toContain(s);
    expect(cases.some((c) => c.kind === 'batch_fraction_remaining')).toBe(true);
    expect(new Set(cases.map((c) => c.id)).size).toBe(cases.length);
  });

  for (const f of files) {
    it(`${f} agrees with its source`, () => {
      const c = readCheckCase(JSON.parse(readFileSync(join(dir, f), 'utf8')));
      const o = runCheckCase(c);
      expect(o.error).toBeUndefined();
      expect(o.pass).toBe(true);
    });
  }

  it('fails a case whose expected value is off', () => {
    const c = readCheckCase(JSON.parse(readFileSync(join(dir, 'sr814-indicator-example.json'), 'utf8')));
    const o = runCheckCase({ ...c, expected: 84 });
    expect(o.pass).toBe(false);
    expect(o.computed).toBeCloseTo(500 / 6, 12);
  });

  it('rejects a malformed case naming the field', () => {
    expect(() => readCheckCase({ id: 'x', title: 't', source: 's', unit: 'u', kind: 'nope', input: {}, expected: 1, tolerance: { relative: 1 } })).toThrow(/field kind/);
    expect(CHECK_KINDS.length).toBeGreaterThan(5);
  });
});
