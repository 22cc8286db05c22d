/**
 * End-to-end tests of `sorbshare equilibrium` and `sorbshare dose`: the real binary is spawned
 * (`run`) for the results, the first bad input, help, version and an unknown option; the other bad
 * inputs and the secondary runs go through the same `runCli` in this process (`cli`), which gives
 * the binary's exit code, stdout and stderr without a Node start-up each.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { runBin, runInProcess, requireBuild, scratchDir } from '../helpers/cliHarness.js';
import { freundlichBatchC } from '../helpers/reference.js';

const FIX = join(process.cwd(), 'fixtures/equilibrium');
const run = runBin;
const cli = runInProcess;
let dir: string;
let write: (name: string, content: unknown) => string;
const good = (extra: Record<string, unknown> = {}) => ({
  dose: '10 mg/L',
  components: [
    { id: 'B', c0: '5 mg/L', K: 20, one_over_n: 0.2 },
    { id: 'T', c0: '100 ng/L', K: 40, one_over_n: 0.3, ...extra },
  ],
});

beforeAll(() => {
  requireBuild();
  ({ dir, write } = scratchDir('sorbshare-cli-'));
});

describe('sorbshare equilibrium', () => {
  it('prints the documented JSON shape and a single solute matches the Freundlich batch balance', () => {
    const f = write('single.json', { components: [{ id: 'A', c0: '3 mg/L', K: 10, one_over_n: 0.5 }] });
    const r = run('equilibrium', f, '--dose', '50 mg/L', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(['dose_mg_per_L', 'components']);
    expect(Object.keys(j.components[0])).toEqual(['id', 'c0_mg_per_L', 'c_mg_per_L', 'q_mg_per_g', 'removal_fraction']);
    expect(j.dose_mg_per_L).toBe(50);
    expect(j.components[0].c_mg_per_L).toBeCloseTo(freundlichBatchC(3, 10, 0.5, 0.05), 12); // 2.25 mg/L
    expect(j.components[0].q_mg_per_g).toBeCloseTo(15, 11);
    expect(j.components[0].removal_fraction).toBeCloseTo(0.25, 12);
  });

  it('uses the dose in the file, shows a readable table and accepts units everywhere', async () => {
    const r = run('equilibrium', join(FIX, 'six-component.json'));
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Carbon dose 15 mg\/L/); // the dose as typed in the file ("15 mg/L")
    expect(r.out).toMatch(/target\s+100 ng\/L/); // c0 100 ng/L to 3 significant digits
    expect(r.out).toMatch(/confirm with jar tests/);
    const u = await cli('equilibrium', join(FIX, 'units.json'), '--dose', '0.02 g/L', '--json');
    expect(u.code).toBe(0);
    const j = JSON.parse(u.out);
    expect(j.dose_mg_per_L).toBe(20);
    expect(j.components[1].c0_mg_per_L).toBeCloseTo(0.4e-6 * 250.3, 15); // 0.4 nmol/L × 250.3 g/mol
  });

  it('sweeps log-spaced doses and prints { curve: [...] } with one single-dose element per dose', async () => {
    const r = run('equilibrium', join(FIX, 'six-component.json'), '--from', '1 mg/L', '--to', '100 mg/L', '--points', '5', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.curve.map((e: { dose_mg_per_L: number }) => e.dose_mg_per_L)).toEqual([1, expect.closeTo(Math.sqrt(10), 12), expect.closeTo(10, 12), expect.closeTo(Math.pow(10, 1.5), 10), 100]);
    const removal = j.curve.map((e: { components: Array<{ removal_fraction: number }> }) => e.components[5]!.removal_fraction);
    for (let k = 1; k < removal.length; k++) expect(removal[k]).toBeGreaterThan(removal[k - 1]);
    const single = JSON.parse((await cli('equilibrium', join(FIX, 'six-component.json'), '--dose', '10 mg/L', '--json')).out);
    expect(j.curve[2].components[5].c_mg_per_L).toBeCloseTo(single.components[5].c_mg_per_L, 15);
    const table = await cli('equilibrium', join(FIX, 'six-component.json'), '--from', '1 mg/L', '--to', '100 mg/L', '--points', '3');
    expect(table.out).toMatch(/dose mg\/L/);
  });

  it('starts fast enough to feel instant (well under 0.5 s is the target; checked loosely here, measured by npm run bench)', () => {
    const t0 = performance.now();
    expect(run('equilibrium', join(FIX, 'six-component.json')).code).toBe(0);
    expect(performance.now() - t0).toBeLessThan(3000);
  });
});

describe('sorbshare dose', () => {
  it('finds the dose for a removal goal and re-solving at it gives the goal', async () => {
    const r = run('dose', join(FIX, 'six-component.json'), '--target', 'target', '--removal', '80', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(['target', 'dose_mg_per_L', 'removal_fraction']);
    expect(j.removal_fraction).toBeCloseTo(0.8, 9);
    const back = JSON.parse((await cli('equilibrium', join(FIX, 'six-component.json'), '--dose', `${j.dose_mg_per_L} mg/L`, '--json')).out);
    expect(back.components[5].removal_fraction).toBeCloseTo(0.8, 9);
  });

  it('an effluent limit is a removal of 1 − limit/c0', async () => {
    const r = run('dose', join(FIX, 'six-component.json'), '--target', 'target', '--limit', '20 ng/L', '--json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).removal_fraction).toBeCloseTo(0.8, 9);
    const t = await cli('dose', join(FIX, 'six-component.json'), '--target', 'target', '--limit', '20 ng/L');
    // 3 significant digits and the dose given once (no "(… g/m³)" echo of the same number)
    const dose = JSON.parse(r.out).dose_mg_per_L as number;
    expect(t.out).toContain(`Target target: 80.0 % removal at a carbon dose of ${Number(dose.toPrecision(3))} mg/L\n`);
    expect(t.out).not.toMatch(/g\/m³/);
  });
});

describe('bad input: exit 2, the file and the field named, nothing on stdout', () => {
  const cases: Array<[string, unknown, RegExp]> = [
    ['unknown unit', good({ c0: '100 ng/furlong' }), /components\[1\]\.c0.*unknown unit "ng\/furlong"/],
    ['unit of the wrong kind', good({ c0: '100 m3/d' }), /components\[1\]\.c0.*not a mass concentration/],
    ['negative value', good({ c0: '-100 ng/L' }), /components\[1\]\.c0.*non-negative/],
    ['non-numeric value', good({ c0: 'lots' }), /components\[1\]\.c0.*number with a unit/],
    ['non-numeric K', good({ K: 'forty' }), /components\[1\]\.K.*expected K as a number/],
    ['missing K', { components: [{ id: 'T', c0: '1 mg/L', one_over_n: 0.3 }] }, /components\[0\]\.K.*missing K/],
    ['missing exponent', { components: [{ id: 'T', c0: '1 mg/L', K: 3 }] }, /components\[0\]\.one_over_n.*missing one_over_n/],
    ['exponent ≤ 0', good({ one_over_n: 0 }), /components\[1\]\.one_over_n.*> 0/],
    ['negative exponent', good({ one_over_n: -0.3 }), /components\[1\]\.one_over_n.*> 0/],
    ['duplicate ids', good({ id: 'B' }), /components\[1\]\.id.*duplicate id "B"/],
    ['empty mixture', { components: [] }, /field components.*empty/],
    ['no components key', { dose: '5 mg/L' }, /components.*array/],
    ['bad K unit', good({ K_unit: { q: 'mg/L' } }), /components\[1\]\.K_unit.*not a loading/],
  ];
  cases.forEach(([name, content, re], i) => {
    it(name, async () => {
      const f = write(`${name.replace(/\W+/g, '_')}.json`, content);
      for (const args of [['equilibrium', f, '--json'], ['dose', f, '--target', 'T', '--removal', '50']]) {
        const r = i === 0 ? run(...args) : await cli(...args); // the first case through the real binary
        expect(r.code, r.err).toBe(2);
        expect(r.out).toBe('');
        expect(r.err).toContain(f);
        expect(r.err).toMatch(re);
      }
    });
  });

  it('malformed JSON names the file, line and column', async () => {
    const f = write('broken.json', '{ "components": [\n  { "id": "A", "c0": 1, }\n] }');
    const r = await cli('equilibrium', f, '--dose', '5');
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toMatch(/broken\.json: malformed JSON at line 2, column \d+/);
  });

  it('a missing file is named', async () => {
    const r = await cli('equilibrium', join(dir, 'nope.json'), '--dose', '5');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/nope\.json: mixture file not found/);
  });

  it('a bad --dose names the option; a missing dose says what is expected', async () => {
    const f = write('nodose.json', { components: [{ id: 'A', c0: 1, K: 3, one_over_n: 0.4 }] });
    let r = await cli('equilibrium', f, '--dose', '5 parsecs');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/option --dose.*unknown unit "parsecs"/);
    r = await cli('equilibrium', f);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/no carbon dose given/);
    r = await cli('equilibrium', f, '--from', '1 mg/L');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/option --to.*needs both/);
  });

  it('a target not in the mixture names the file, the option and the ids', async () => {
    const f = write('t.json', good());
    const r = await cli('dose', f, '--target', 'X', '--removal', '80');
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toContain(f);
    expect(r.err).toMatch(/option --target.*"X" is not in the mixture; its ids are "B", "T"/);
  });

  it('a goal that no dose up to 5 g/L reaches, a non-adsorbable target, a bad percentage', async () => {
    const f = write('hard.json', { components: [{ id: 'B', c0: '50 mg/L', K: 200, one_over_n: 0.2 }, { id: 'T', c0: '100 ng/L', K: 0.01, one_over_n: 0.9 }, { id: 'N', c0: '1 mg/L', K: 0 }] });
    let r = await cli('dose', f, '--target', 'T', '--removal', '99.99');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/not reached by any dose up to 5000 mg\/L/);
    r = await cli('dose', f, '--target', 'N', '--removal', '50');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/"N" is non-adsorbable/);
    r = await cli('dose', f, '--target', 'T', '--removal', '120');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/option --removal.*between 0 and 100/);
    r = await cli('dose', f, '--target', 'T', '--limit', '200 ng/L');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/option --limit.*not below c0/);
    r = await cli('dose', f, '--target', 'T');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/exactly one of --removal/);
  });

  it('an unknown option or command exits 2', async () => {
    expect(run('equilibrium', '--bogus').code).toBe(2);
    expect((await cli('frobnicate')).code).toBe(2);
  });
});

describe('help and version', () => {
  it('lists the commands and prints the package version', () => {
    const h = run('--help');
    expect(h.code).toBe(0);
    expect(h.out).toMatch(/equilibrium/);
    expect(h.out).toMatch(/dose/);
    const v = run('--version');
    expect(v.out.trim()).toBe(JSON.parse(readFileSync('package.json', 'utf8')).version);
  });
});
