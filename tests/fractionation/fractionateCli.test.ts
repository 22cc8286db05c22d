/**
 * End-to-end: `sorbshare fractionate` through the built binary (npm run build first).
 * Results and the first of each kind of bad input come from the spawned binary; the other bad
 * inputs and secondary runs go through the same `runCli` in this process (`runInProcess`: same
 * exit code, streams and files, without a Node start-up each).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { runBin, runInProcess, requireBuild, scratchDir } from '../helpers/cliHarness.js';

const ISO = join(process.cwd(), 'fixtures/fractionation/site-effluent-isotherm.csv');
const run = runBin;
const cli = runInProcess;
let dir: string;
let write: (name: string, content: unknown) => string;

beforeAll(() => {
  requireBuild();
  ({ dir, write } = scratchDir('sorbshare-fractionate-'));
});

describe('sorbshare fractionate', () => {
  it('--json prints the background file and --out writes the same JSON', () => {
    const out = join(dir, 'background.json');
    const r = run('fractionate', ISO, '--json', '--out', out);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(expect.arrayContaining(['doc0_mg_per_L', 'one_over_n', 'components', 'fit']));
    expect(Object.keys(j.components[0])).toEqual(expect.arrayContaining(['id', 'K', 'one_over_n', 'fraction', 'c0_mg_per_L']));
    expect(j.components).toHaveLength(4);
    expect(j.components[0].K).toBe(0);
    expect(j.fit.points).toBe(10);
    expect(j.uv254).toBeDefined();
    expect(JSON.parse(readFileSync(out, 'utf8'))).toEqual(j);
  });

  it('text output with --components auto shows the AICc table; --fit-k, --k-grid and --exponent are honoured', async () => {
    const auto = run('fractionate', ISO, '--components', 'auto');
    expect(auto.code).toBe(0);
    expect(auto.out).toMatch(/Number of components by AICc/);
    expect(auto.out).toMatch(/chosen/);
    const grid = await cli('fractionate', ISO, '--k-grid', '5,50', '--exponent', '0.25', '--json');
    expect(grid.code).toBe(0);
    const g = JSON.parse(grid.out);
    expect(g.components.map((c: { K: number }) => c.K)).toEqual([0, 5, 50]);
    expect(g.one_over_n).toBe(0.25);
    const fk = JSON.parse((await cli('fractionate', ISO, '--fit-k', '--components', '2', '--json')).out);
    expect(fk.fit.k_mode).toBe('fitted');
  });

  const bad: Array<[string, string, RegExp, string[]?]> = [
    ['a header without a unit', 'dose,DOC0 (mg/L),DOC (mg/L)\n0,8,8\n10,8,6\n20,8,5\n40,8,4.5\n', /row 1, column "dose": header without a unit/],
    ['DOC that rises with dose', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8,8\n10,8,6\n20,8,7.5\n40,8,5\n', /row 4, column "DOC \(mg\/L\)": DOC 7\.5 mg\/L at dose 20 mg\/L is higher/, ['--components', '1']],
    ['a negative value', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8,8\n-10,8,6\n', /row 3, column "dose \(mg\/L\)": negative value -10/],
    ['fewer points than parameters', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8,8\n10,8,6\n20,8,5\n', /row 4, column "DOC \(mg\/L\)": only 2 rows with a carbon dose > 0 for 3 fitted parameters/],
    ['a dose-0 row that disagrees with DOC0', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8,6.5\n10,8,6\n20,8,5\n40,8,4.5\n', /row 2, column "DOC \(mg\/L\)": at dose 0 the DOC \(6\.5 mg\/L\) disagrees with DOC0/],
    ['a gap (n/a) in an isotherm row', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8,8\n10,8,n/a\n', /row 3, column "DOC \(mg\/L\)": "n\/a" marks a gap; expected a number in mg\/L \(this table needs a value in every row: leave the row out instead\)/],
  ];
  bad.forEach(([what, csv, message, extra], i) => {
    it(`${what}: exit 2, file/row/column named, nothing on stdout, --out not written`, async () => {
      const f = write(`bad-${what.replace(/\W+/g, '-')}.csv`, csv);
      const out = join(dir, `never-${what.replace(/\W+/g, '-')}.json`);
      const args = ['fractionate', f, '--out', out, ...(extra ?? [])];
      const r = i === 0 ? run(...args) : await cli(...args); // the first through the binary
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      expect(r.err).toContain(f);
      expect(r.err).toMatch(message);
      expect(existsSync(out)).toBe(false);
    });
  });

  it('bad options exit 2 naming the option', async () => {
    const r = run('fractionate', ISO, '--components', 'many');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/option --components/);
    const g = await cli('fractionate', ISO, '--k-grid', '5,-1');
    expect(g.code).toBe(2);
    expect(g.err).toMatch(/--k-grid/);
    const e = await cli('fractionate', ISO, '--exponent', '3');
    expect(e.code).toBe(2);
    expect(e.err).toMatch(/--exponent/);
    const m = await cli('fractionate', join(dir, 'missing.csv'));
    expect(m.code).toBe(2);
    expect(m.err).toMatch(/missing\.csv: isotherm file not found/);
  });
});
