/**
 * Options are data: each spec carries its parser (commander's argParser) or its choices, its
 * default as typed text, and whether it is required. These tests run the CLI in-process
 * (`runCli`), so they need no build.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { COMMANDS } from '../../src/cli/commands/index.js';
import { attributeName, longFlag } from '../../src/cli/commandSpec.js';
import { equilibrium, equilibriumCurve, doseFor } from '../../src/api/equilibriumApi.js';
import { InputError } from '../../src/core/errors.js';
import { finiteNumber, positiveMassConcentration, positiveNumberList, wholeNumber, wholeNumberOrAuto } from '../../src/cli/optionParsers.js';

const SIX = join(process.cwd(), 'fixtures/equilibrium/six-component.json');

async function cli(...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await runCli(argv, { stdout: (s) => { out += s; }, stderr: (s) => { err += s; } });
  return { code, out, err };
}

describe('option specs', () => {
  it('every option that takes a value has a parser or a list of choices', () => {
    for (const c of COMMANDS) for (const o of c.options) {
      if (/[<[]/.test(o.flags)) expect(o.parse !== undefined || o.choices !== undefined, `${c.name} ${o.flags}`).toBe(true);
      else expect(o.parse ?? o.choices ?? o.default, `${c.name} ${o.flags} is a switch`).toBeUndefined();
    }
  });

  it('every default is accepted by its own parser (defaults are typed text, parsed like user input)', () => {
    for (const c of COMMANDS) for (const o of c.options) {
      if (o.default === undefined) continue;
      if (o.choices) expect(o.choices).toContain(o.default);
      if (o.parse) expect(() => o.parse!(o.default!), `${c.name} ${o.flags}`).not.toThrow();
    }
  });

  it('long flags and attribute names are unique within each command', () => {
    for (const c of COMMANDS) {
      expect(new Set(c.options.map(longFlag)).size).toBe(c.options.length);
      expect(new Set(c.options.map(attributeName)).size).toBe(c.options.length);
    }
    expect(attributeName({ flags: '--k-grid <list>', description: '' })).toBe('kGrid');
  });

  it('help shows the defaults and the choices from the specs', async () => {
    const e = await cli('equilibrium', '--help');
    expect(e.code).toBe(0);
    expect(e.out).toMatch(/--points <n>.*\(default: 25\)/s);
    const c = await cli('calibrate', '--help');
    expect(c.out.replace(/\s+/g, ' ')).toMatch(/choices: "ebc", "sebc", "fictive-k", "surface-diffusion", "surface-diffusion-doc"/); // the help wraps lines
    expect(c.out).toMatch(/--model <model>.*required/s); // --compound: every model but surface-diffusion-doc (checked in the action)
  });
});

describe('option parsers (the CLI edge)', () => {
  it('quantities become numbers in mg/L', () => {
    expect(positiveMassConcentration('20 mg/L')).toBe(20);
    expect(positiveMassConcentration('0.02 g/L')).toBe(20); // 1 g = 1000 mg exactly
    expect(positiveMassConcentration('50 ng/L')).toBeCloseTo(5e-5, 18);
    expect(positiveMassConcentration('7')).toBe(7); // a bare number is in mg/L
    expect(() => positiveMassConcentration('0 mg/L')).toThrow(InputError);
    expect(() => positiveMassConcentration('5 parsecs')).toThrow(/unknown unit "parsecs"/);
  });
  it('numbers, whole numbers, lists', () => {
    expect(finiteNumber('0.2')).toBe(0.2);
    expect(finiteNumber('-1e-3')).toBe(-0.001);
    for (const bad of ['', ' ', 'abc', '1,5', 'Infinity', '0x10']) expect(() => finiteNumber(bad), bad).toThrow(InputError);
    const points = wholeNumber(2, 10);
    expect(points('2')).toBe(2);
    for (const bad of ['1', '11', '2.5', '-3', '', 'three', '1e1']) expect(() => points(bad), bad).toThrow(/from 2 to 10/);
    expect(wholeNumberOrAuto(1, 5)('auto')).toBe('auto');
    expect(wholeNumberOrAuto(1, 5)('4')).toBe(4);
    expect(() => wholeNumberOrAuto(1, 5)('6')).toThrow(/from 1 to 5 or "auto"/);
    expect(positiveNumberList('10, 30;100')).toEqual([10, 30, 100]);
    expect(() => positiveNumberList('10,-3')).toThrow(/"-3"/);
    expect(() => positiveNumberList(' , ')).toThrow(InputError);
  });
});

describe('the CLI parses at the edge and names the option', () => {
  it('a parser error exits 2 naming the option, stdout empty', async () => {
    for (const [args, re] of [
      [['equilibrium', SIX, '--from', '1 mg/L', '--to', '10 mg/L', '--points', '1'], /option --points: expected a whole number from 2 to 100000, got "1"/],
      [['equilibrium', SIX, '--dose', '0 mg/L'], /option --dose: expected a positive value/],
      [['dose', SIX, '--target', 'target', '--removal', 'eighty'], /option --removal: expected a number/],
      [['dose', SIX, '--target', 'target', '--limit', '5 m3/d'], /option --limit: unit "5 m3\/d"|option --limit: .*not a mass concentration/],
      [['demo', '--draws', '-1'], /option --draws: expected a whole number of draws from 0 to/],
      [['demo', '--seed', '4294967296'], /option --seed: expected a whole-number seed from 0 to 4294967295/],
      [['calibrate', SIX, '--compound', 'x.json', '--model', 'langmuir'], /option --model: unknown model "langmuir"; expected one of ebc, sebc, fictive-k/],
    ] as Array<[string[], RegExp]>) {
      const r = await cli(...args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.out).toBe('');
      expect(r.err).toMatch(re);
    }
  });
  it('a missing required option exits 2 naming it', async () => {
    const r = await cli('dose', SIX, '--removal', '80');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/option --target: missing; expected id of the component the goal applies to/);
    const c = await cli('calibrate', SIX, '--compound', 'x.json');
    expect(c.err).toMatch(/option --model: missing/);
  });
  it('the default comes from the spec: 25 sweep points without --points', async () => {
    const r = await cli('equilibrium', SIX, '--from', '1 mg/L', '--to', '100 mg/L', '--json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).curve).toHaveLength(25);
  });
});

describe('the library takes numbers in internal units as well as strings', () => {
  const mixture = JSON.parse(readFileSync(SIX, 'utf8'));
  it('equilibrium: 20 (mg/L) is "20 mg/L" and "0.02 g/L", identically', () => {
    const n = equilibrium(mixture, 20);
    expect(equilibrium(mixture, '20 mg/L')).toEqual(n);
    expect(equilibrium(mixture, '0.02 g/L')).toEqual(n);
  });
  it('equilibriumCurve and doseFor accept numbers (mg/L) for doses and limits', () => {
    expect(equilibriumCurve(mixture, 1, 100, 4)).toEqual(equilibriumCurve(mixture, '1 mg/L', '100 mg/L', 4));
    // 20 ng/L is 20 · 1e-6 mg/L, the product the unit parser forms (exact factor table)
    expect(doseFor(mixture, 'target', { limit: 20 * 1e-6 })).toEqual(doseFor(mixture, 'target', { limit: '20 ng/L' }));
  });
});
