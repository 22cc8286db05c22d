/**
 * End-to-end tests of `sorbshare demo`, `sorbshare run` and `sorbshare check`: the real binary
 * is spawned (build first: `npm run build`). Outputs go to temporary folders. The demo with its
 * draws is the worker's shared run (`sharedDemoRun`, read only); a bad input after the first goes
 * through the same `runCli` in this process (`runInProcess`).
 */
import { describe, expect, it } from 'vitest';
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runBin, runInProcess } from '../helpers/cliHarness.js';
import { sharedDemoRun } from '../helpers/sharedDemo.js';

const DEMO = join(process.cwd(), 'fixtures/demo');
const run = runBin; // fails with a clear message when dist is missing or older than src
const tmp = () => mkdtempSync(join(tmpdir(), 'sorbshare-cli-'));
const FILES = ['summary.md', 'report.html', 'compounds.csv', 'removal_curves.csv', 'carbons.csv', 'daily_doses.csv', 'indicators.csv',
  'surrogates.csv', 'setpoints.csv', 'pilot_check.csv', 'gac.csv', 'uncertainty.csv', 'kinetic_calibration.csv', 'column_calibration.csv', 'run.json', 'results.xlsx'];
/** stderr without Monte Carlo progress lines (they appear only when the draws take over a second). */
const quiet = (err: string) => err.replace(/^\r?sorbshare: Monte Carlo.*$\n?/gm, '');

describe('sorbshare demo', () => {
  it('writes every output, with the cautions, run.json provenance and --json summary', () => {
    const { outDir: out, ...r } = sharedDemoRun(); // sorbshare demo --out DIR --json
    expect(quiet(r.err)).toBe('');
    expect(r.code).toBe(0);
    const s = JSON.parse(r.out);
    expect(s.carbons).toHaveLength(3);
    expect(s.carbons[0].governing_compound).toBe('HCT');
    expect(s.carbons[2].type).toBe('GAC');
    // the demo's GAC carbon has fixed-bed inputs: the kinetic run length, the equilibrium bed volumes beside it
    expect(s.carbons[2].gac.upper_bound).toBe(false);
    expect(s.carbons[2].gac.run_bed_volumes).toBeGreaterThan(0);
    expect(s.carbons[2].gac.equilibrium_bed_volumes).toBeGreaterThan(0);
    expect(s.carbons[2].cost_per_m3).toBeGreaterThan(0);
    expect(s.carbons[2].gac.monte_carlo_draws).toBe(5); // the demo's uncertainty.gac_draws
    expect(s.carbons[2].gac.run_bed_volumes_p10).toBeLessThan(s.carbons[2].gac.run_bed_volumes_p90);
    expect(s.carbons[0].monte_carlo.draws).toBeGreaterThan(0);
    expect(s.pilot_outliers).toEqual(['DCF']); // the demo's pilot data put diclofenac deliberately off (fixtures/demo/README.md)
    expect(readdirSync(out).sort()).toEqual([...FILES].sort());
    const summary = readFileSync(join(out, 'summary.md'), 'utf8');
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    for (const text of [summary, html]) {
      expect(text).toContain('Contact time, carbon age, preloading');
      expect(text).toContain('licensed engineer');
      expect(text).toContain('Carbon dust is combustible');
      expect(text).toMatch(/invented/i);
      // the client's copy never shows the author's folders (the full paths stay in run.json)
      expect(text).not.toContain(process.cwd());
    }
    expect(html).toContain('<svg');
    const rec = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    expect(rec.tool.version).toMatch(/^\d+\.\d+\.\d+/);
    expect(rec.node).toBe(process.version);
    expect(Date.parse(rec.date)).not.toBeNaN();
    expect(rec.demo).toBe(true);
    expect(rec.inputs.site.flow_m3_per_d).toBe(15000);
    expect(rec.input_files.map((f: { role: string }) => f.role)).toContain('site DOC series');
    expect(rec.results.carbons[0].daily).toHaveLength(365);
    const daily = readFileSync(join(out, 'daily_doses.csv'), 'utf8').trim().split('\n');
    expect(daily[0]).toBe('date,carbon,DOC (mg/L),flow (m3/d),dose (mg/L),governed by,carbon (kg/d),carbon cost per day,currency');
    expect(daily.length).toBe(1 + 2 * 365);
  });

  it('prints a text table by default', () => {
    const dir = tmp();
    try {
      const r = run('demo', '--out', join(dir, 'o'), '--draws', '0'); // the text table; the draws are the first test's
      expect(r.code).toBe(0);
      expect(r.out).toMatch(/Carbon A \(coal-based\)/);
      expect(r.out).toMatch(/UV254-reduction set-point/);
      expect(r.out).toMatch(/compound HCT/);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });
});

describe('sorbshare run: bad input writes nothing', () => {
  function demoCopy(): string {
    const dir = tmp();
    cpSync(DEMO, join(dir, 'p'), { recursive: true });
    return dir;
  }

  it('a schema violation: exit 2, the message names file and JSON path, --out not created', () => {
    const dir = demoCopy();
    try {
      const p = join(dir, 'p/project.json');
      const raw = JSON.parse(readFileSync(p, 'utf8'));
      raw.carbons[0].price_per_kg = 'cheap';
      writeFileSync(p, JSON.stringify(raw));
      const out = join(dir, 'out');
      const r = run('run', p, '--out', out);
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      expect(r.err).toContain(p);
      expect(r.err).toContain('field carbons[0].price_per_kg');
      expect(existsSync(out)).toBe(false);
      expect(readdirSync(dir).sort()).toEqual(['p']); // no staging folder left either
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });

  it('a missing referenced CSV: exit 2, names the path; an existing --out keeps its old content', async () => {
    const dir = demoCopy();
    try {
      rmSync(join(dir, 'p/doc_isotherm.csv'));
      const out = join(dir, 'out');
      cpSync(join(dir, 'p/jar_tests_cbz.csv'), join(out, 'keep.txt'));
      const r = await runInProcess('run', join(dir, 'p/project.json'), '--out', out);
      expect(r.code).toBe(2);
      expect(r.err).toContain('doc_isotherm.csv');
      expect(r.err).toContain('field background.isotherm');
      expect(readdirSync(out)).toEqual(['keep.txt']);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });

  it('runs a fixture project with an EBC background and a GAC candidate', () => {
    const dir = tmp();
    try {
      const r = run('run', join(process.cwd(), 'fixtures/project/ebc-background/project.json'), '--out', join(dir, 'o'), '--json');
      expect(r.code).toBe(0);
      const s = JSON.parse(r.out);
      expect(s.carbons[1].type).toBe('GAC');
      expect(s.carbons[1].required_dose_mg_per_L).toBeNull();
      expect(s.carbons[1].gac.bed_volumes).toBeGreaterThan(0); // the GAC step replaces the old "skipped" warning
      expect(s.carbons[0].currency).toBe('CHF');
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });
});

describe('sorbshare check', () => {
  it('prints every case with source, expected, computed and PASS; exit 0', () => {
    const r = run('check');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/PASS {2}sr814-indicator-mean/);
    expect(r.out).toMatch(/source: {3}Chen, Z\., Xing, B\., McGill/);
    expect(r.out).toMatch(/provenance: computed from a published rule\n {6}expected: 83\.33333333 %/);
    expect(r.out).not.toMatch(/FAIL/);
  });

  it('--json lists the cases', () => {
    const r = run('check', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.failed).toBe(0);
    expect(j.cases.length).toBe(j.passed);
    for (const c of j.cases) expect(typeof c.source).toBe('string');
  });
});
