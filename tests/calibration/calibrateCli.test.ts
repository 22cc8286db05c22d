/**
 * End-to-end: `sorbshare calibrate` through the built binary (npm run build first).
 * Results and the first of each kind of bad input come from the spawned binary; the other bad
 * inputs and secondary runs go through the same `runCli` in this process (`runInProcess`: same
 * exit code, streams and files, without a Node start-up each).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { runBin, runInProcess, requireBuild, scratchDir } from '../helpers/cliHarness.js';

const FIX = join(process.cwd(), 'fixtures');
const JAR = join(FIX, 'calibration/site-jartests.csv');
const COMPOUND = join(FIX, 'calibration/target-compound.json');
const run = runBin;
const cli = runInProcess;
let dir: string;
let write: (name: string, content: unknown) => string;

beforeAll(() => {
  requireBuild();
  ({ dir, write } = scratchDir('sorbshare-calibrate-'));
});

describe('sorbshare calibrate', () => {
  it('ebc --json prints { model, parameters, fit, warnings } with the documented parameter names', () => {
    const out = join(dir, 'ebc.json');
    const r = run('calibrate', JAR, '--model', 'ebc', '--compound', COMPOUND, '--doc', '8.2 mg/L', '--json', '--out', out);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(expect.arrayContaining(['model', 'parameters', 'fit', 'warnings']));
    expect(Object.keys(j.parameters)).toEqual(['K_EBC', 'one_over_n_EBC', 'c0_EBC_mg_per_L']);
    expect(Object.keys(j.fit)).toEqual(expect.arrayContaining(['rmse', 'points']));
    expect(j.fit.points).toBe(24);
    // invented data generated with K 60, 1/n 0.22, C0 1.4 mg/L and ±4 % wiggle: the intervals hold them
    expect(j.ci95.K_EBC[0]).toBeLessThan(60);
    expect(j.ci95.K_EBC[1]).toBeGreaterThan(60);
    expect(j.c0_EBC_per_DOC).toBeCloseTo(j.parameters.c0_EBC_mg_per_L / 8.2, 12);
    expect(JSON.parse(readFileSync(out, 'utf8'))).toEqual(j);
  });

  it('sebc and fictive-k (with a background from fractionate) run; text output has the table', async () => {
    const s = run('calibrate', JAR, '--model', 'sebc', '--compound', COMPOUND, '--json');
    expect(s.code).toBe(0);
    expect(Object.keys(JSON.parse(s.out).parameters)).toEqual(['c0_EBC_mg_per_L']);
    const bg = join(dir, 'bg.json');
    expect((await cli('fractionate', join(FIX, 'fractionation/site-effluent-isotherm.csv'), '--out', bg)).code).toBe(0);
    const f = await cli('calibrate', JAR, '--model', 'fictive-k', '--compound', COMPOUND, '--background', bg, '--json');
    expect(f.code).toBe(0);
    expect(Object.keys(JSON.parse(f.out).parameters)).toEqual(['K_factor']);
    const t = run('calibrate', JAR, '--model', 'ebc', '--compound', COMPOUND);
    expect(t.code).toBe(0);
    expect(t.out).toMatch(/removal meas\. %/);
    expect(t.out).toMatch(/K_EBC/);
  });

  const header = 'C0 (ng/L),dose (mg/L),c (ng/L)\n';
  const bad: Array<[string, string, RegExp]> = [
    ['a header without a unit', 'C0,dose (mg/L),c (ng/L)\n500,10,200\n', /row 1, column "C0": header without a unit/],
    ['a negative value', `${header}500,10,-2\n`, /row 2, column "c \(ng\/L\)": negative value -2/],
    ['a non-numeric cell', `${header}500,ten,200\n`, /row 2, column "dose \(mg\/L\)": "ten" is not a number/],
    ['fewer points than parameters', `${header}500,10,200\n500,20,100\n`, /row 3, column "c \(ng\/L\)": only 2 jar tests with a carbon dose > 0 for 3 fitted parameters/],
    ['a dose-0 row that disagrees with C0', `${header}500,0,200\n500,10,150\n500,20,100\n500,40,50\n`, /row 2, column "c \(ng\/L\)": at dose 0, c .* disagrees with C0/],
  ];
  bad.forEach(([what, csv, message], i) => {
    it(`${what}: exit 2, file/row/column named, nothing on stdout, --out not written`, async () => {
      const f = write(`bad-${what.replace(/\W+/g, '-')}.csv`, csv);
      const out = join(dir, `never-${what.replace(/\W+/g, '-')}.json`);
      const args = ['calibrate', f, '--model', 'ebc', '--compound', COMPOUND, '--out', out];
      const r = i === 0 ? run(...args) : await cli(...args); // the first through the binary
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      expect(r.err).toContain(f);
      expect(r.err).toMatch(message);
      expect(existsSync(out)).toBe(false);
    });
  });

  it('option and compound-file errors exit 2 and name the option or JSON field', async () => {
    const m = run('calibrate', JAR, '--compound', COMPOUND);
    expect(m.code).toBe(2);
    expect(m.err).toMatch(/option --model/);
    const u = await cli('calibrate', JAR, '--model', 'langmuir', '--compound', COMPOUND);
    expect(u.code).toBe(2);
    expect(u.err).toMatch(/unknown model "langmuir"/);
    const c = write('compound.json', JSON.stringify({ id: 'X', K: 10 }));
    const cr = await cli('calibrate', JAR, '--model', 'sebc', '--compound', c);
    expect(cr.code).toBe(2);
    expect(cr.err).toMatch(/compound\.json, field one_over_n/);
    const fk = await cli('calibrate', JAR, '--model', 'fictive-k', '--compound', COMPOUND);
    expect(fk.code).toBe(2);
    expect(fk.err).toMatch(/--background/);
    const d = await cli('calibrate', JAR, '--model', 'sebc', '--compound', COMPOUND, '--doc', 'lots');
    expect(d.code).toBe(2);
    expect(d.err).toMatch(/option --doc/);
    const bgBad = write('bg.json', JSON.stringify({ doc0_mg_per_L: 8, components: [{ id: 'F0', K: 0, fraction: 0.5 }], fit: {} }));
    const b = await cli('calibrate', JAR, '--model', 'fictive-k', '--compound', COMPOUND, '--background', bgBad);
    expect(b.code).toBe(2);
    expect(b.err).toMatch(/bg\.json, field components: the fractions sum to 0\.5/);
  });
});
