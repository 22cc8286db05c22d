/**
 * Plausibility warnings (ranges are common practice, as the warnings say), the non-finite result
 * guard, equilibrium at dose 0, and the output-folder writer's recovery of a killed run's
 * leftovers.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { calibrationPointsWarnings, componentWarnings, docWarnings, doseWarnings, fractionationWarnings, traceC0Warnings } from '../../src/scenario/plausibility.js';
import { assertFiniteResult } from '../../src/scenario/finiteResult.js';
import { readMixture } from '../../src/scenario/readMixture.js';
import { equilibrium } from '../../src/api/equilibriumApi.js';
import { recoverOutputDir, writeOutputDir } from '../../src/io/writeOutputs.js';
import { ComputationError } from '../../src/core/errors.js';

describe('plausibility warnings', () => {
  it('an exponent above 1 warns that IAST gives loadings above single-solute ones', () => {
    expect(componentWarnings([{ id: 'X', K: 10, oneOverN: 1.2 }, { id: 'Y', K: 10, oneOverN: 0.4 }, { id: 'N', K: 0, oneOverN: 2 }])).toEqual([expect.stringMatching(/^X has 1\/n = 1\.2 > 1 .*loadings above the single-solute ones/)]);
    const m = readMixture({ components: [{ id: 'X', c0: 1, K: 10, one_over_n: 1.5 }] });
    expect(m.warnings).toEqual([expect.stringMatching(/1\/n = 1\.5 > 1/)]);
  });
  it('values far outside the common-practice ranges warn, values inside do not', () => {
    expect(docWarnings(8)).toEqual([]);
    expect(docWarnings(0.5)[0]).toMatch(/far outside the 5–15 mg\/L .*common practice/);
    expect(docWarnings(80)).toHaveLength(1);
    expect(doseWarnings(20)).toEqual([]);
    expect(doseWarnings(1000)[0]).toMatch(/10–20 mg\/L .*common practice/);
    expect(traceC0Warnings([{ id: 'CBZ', c0MgPerL: 450e-6 }])).toEqual([]);
    expect(traceC0Warnings([{ id: 'CBZ', c0MgPerL: 450 }])[0]).toMatch(/CBZ at 450 mg\/L .*check the unit/);
  });
  it('an unidentifiable fractionation warns: an interval over the whole range, starts that disagree', () => {
    expect(fractionationWarnings([[0.1, 0.3], null], 4, 4)).toEqual([]);
    expect(fractionationWarnings([[0.1, 0.3], [0, 1]], 4, 4)[0]).toMatch(/F1 spans the whole 0–100 % range/);
    expect(fractionationWarnings([[0.1, 0.3]], 4, 1)[0]).toMatch(/only 1 of 4 fitting starts/);
  });
  it('a calibration on fewer than twice as many points as parameters warns', () => {
    expect(calibrationPointsWarnings(5, 3)[0]).toMatch(/5 jar test\(s\) for 3 parameter\(s\)/);
    expect(calibrationPointsWarnings(6, 3)).toEqual([]);
    expect(calibrationPointsWarnings(2, 1)).toEqual([]);
  });
});

describe('non-finite results', () => {
  it('name the result field and the inputs behind it', () => {
    const e = (() => { try { assertFiniteResult({ project: { x: Infinity }, carbons: [{ yearly: { carbonKg: 1, cost: Infinity } }] }, ['A']); } catch (x) { return x as Error; } return undefined; })();
    expect(e).toBeInstanceOf(ComputationError);
    expect(e!.message).toMatch(/carbons\[0\]\.yearly\.cost would be infinite; the inputs behind it are site\.flow .*carbons\[0\] \("A"\)\.price_per_kg/);
    expect(() => assertFiniteResult({ a: [1, 2, { b: NaN }] })).toThrow(/a\[2\]\.b would be not a number/);
    expect(() => assertFiniteResult({ project: { flow: Infinity }, a: 1 })).not.toThrow();
  });
  it('name the element of a typed array, of a long array and of a nested row', () => {
    expect(() => assertFiniteResult({ carbons: [{ curve: { c: Float64Array.of(1, 0.5, -Infinity) } }] })).toThrow(/^the result carbons\[0\]\.curve\.c\[2\] would be infinite/);
    const rows = Array.from({ length: 40_000 }, (_, k) => ({ day: k, doseMgPerL: k === 39_999 ? NaN : 10 }));
    expect(() => assertFiniteResult({ carbons: [{ daily: { rows } }, {}] })).toThrow(/^the result carbons\[0\]\.daily\.rows\[39999\]\.doseMgPerL would be not a number/);
    expect(() => assertFiniteResult({ a: [[1, 2], [3, { b: [4, 5, Int32Array.of(1, 2)] }]], c: Float32Array.of(1, 2), d: 'x', e: null })).not.toThrow();
  });
});

describe('equilibrium at dose 0', () => {
  it('gives zero loadings, c = c0 and no removal', () => {
    const r = equilibrium({ components: [{ id: 'A', c0: '2 mg/L', K: 20, one_over_n: 0.3 }, { id: 'B', c0: '100 ng/L', K: 50, one_over_n: 0.4 }] }, '0 mg/L');
    expect(r.dose_mg_per_L).toBe(0);
    for (const c of r.components) {
      expect(c.q_mg_per_g).toBe(0);
      expect(c.removal_fraction).toBe(0);
      expect(c.c_mg_per_L).toBe(c.c0_mg_per_L);
    }
  });
});

describe('writeOutputDir', () => {
  it('replaces an existing folder as a whole (files of the old set that the new one lacks are gone)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sorbshare-out-'));
    try {
      const out = join(dir, 'res');
      writeOutputDir(out, { 'run.json': '{}', 'old.csv': 'a' });
      writeOutputDir(out, { 'run.json': '{"n":2}', 'sub/new.csv': 'b' });
      expect(readdirSync(out).sort()).toEqual(['run.json', 'sub']);
      expect(readFileSync(join(out, 'run.json'), 'utf8')).toBe('{"n":2}');
      expect(readdirSync(dir)).toEqual(['res']);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });
  it('puts back the ready set of a killed run, or its old set, and removes dead leftovers', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sorbshare-out-'));
    try {
      const dead = 2 ** 22 + 12345; // above the usual pid range: no such process
      const out = join(dir, 'res');
      for (const [kind, content] of [['old', 'OLD'], ['ready', 'NEW'], ['staging', 'PART']] as const) {
        mkdirSync(join(dir, `.res.${kind}-${dead}-abcd`));
        writeFileSync(join(dir, `.res.${kind}-${dead}-abcd`, 'run.json'), content);
      }
      recoverOutputDir(out);
      expect(readFileSync(join(out, 'run.json'), 'utf8')).toBe('NEW');
      expect(readdirSync(dir)).toEqual(['res']);
      // only an old set left: it comes back
      rmSync(out, { recursive: true });
      mkdirSync(join(dir, `.res.old-${dead}-ef01`));
      writeFileSync(join(dir, `.res.old-${dead}-ef01`, 'run.json'), 'OLD');
      recoverOutputDir(out);
      expect(readFileSync(join(out, 'run.json'), 'utf8')).toBe('OLD');
      // a live run's staging folder is left alone
      mkdirSync(join(dir, `.res.staging-${process.ppid}-live`));
      recoverOutputDir(out);
      expect(existsSync(join(dir, `.res.staging-${process.ppid}-live`))).toBe(true);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });
});
