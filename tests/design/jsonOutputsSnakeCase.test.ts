/**
 * Every `--json` output goes through the one snake_case converter (src/output/snakeCaseJson.ts):
 * running the CLI on the shipped fixtures (invented data), no key has a lower-case letter or digit
 * followed by a capital, except user ids (none of these fixtures has a camelCase id). The commands
 * run through `runCli` in this process (`runInProcess`: the binary's stdout without a Node start-up
 * each); the demo is the worker's shared spawned run (`sharedDemoRun`).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { requireBuild, runInProcess } from '../helpers/cliHarness.js';
import { sharedDemoRun } from '../helpers/sharedDemo.js';

beforeAll(() => requireBuild());

function camelKeys(value: unknown, path = ''): string[] {
  if (Array.isArray(value)) return value.flatMap((v) => camelKeys(v, `${path}[]`));
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => [...(/[a-z0-9][A-Z]/.test(k) ? [`${path}.${k}`] : []), ...camelKeys(v, `${path}.${k}`)]);
}

const lastId = (JSON.parse(readFileSync('fixtures/equilibrium/six-component.json', 'utf8')) as { components: Array<{ id: string }> }).components.at(-1)!.id;
const commands: string[][] = [
  ['equilibrium', 'fixtures/equilibrium/six-component.json', '--json'],
  ['dose', 'fixtures/equilibrium/six-component.json', '--target', lastId, '--removal', '50', '--json'],
  ['check', '--json'],
  ['fractionate', 'fixtures/fractionation/site-effluent-isotherm.csv', '--json'],
  ['calibrate', 'fixtures/calibration/site-jartests.csv', '--model', 'ebc', '--compound', 'fixtures/calibration/target-compound.json', '--json'],
  ['contact', 'fixtures/kinetics/mixture.json', '--dose', '20 mg/L', '--time', '1,5,30 min', '--json'],
  ['contact', 'fixtures/kinetics/mixture.json', '--dose', '20 mg/L', '--contact-time', '30 min', '--json'],
  ['column', 'fixtures/column/demo-water.json', '--ebct', '15 min', '--bed-depth', '2 m', '--to-bv', '5000', '--json'],
];

describe('--json outputs are snake_case', () => {
  for (const args of commands) {
    it(args.join(' '), async () => {
      const r = await runInProcess(...args);
      expect(r.code, r.err).toBe(0);
      expect(camelKeys(JSON.parse(r.out))).toEqual([]);
    });
  }

  it('demo --json (the run summary) and its run.json', () => {
    const r = sharedDemoRun(); // sorbshare demo --out DIR --json, with the demo's draws
    expect(r.code, r.err).toBe(0);
    expect(camelKeys(JSON.parse(r.out))).toEqual([]);
    const rec = JSON.parse(readFileSync(join(r.outDir, 'run.json'), 'utf8'));
    expect(camelKeys(rec)).toEqual([]);
    expect(rec.results.carbons[0].required_dose).toHaveProperty('dose_mg_per_L');
  });
});
