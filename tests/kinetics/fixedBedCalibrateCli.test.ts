import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { requireBuild, runBin, runInProcess, scratchDir } from '../helpers/cliHarness.js';

const DATA = join(process.cwd(), 'fixtures/column/small-column.csv');
const COMPOUND = join(process.cwd(), 'fixtures/column/target-compound.json');
const BACKGROUND = join(process.cwd(), 'fixtures/project/background-file/background.json');
const BED = ['--ebct', '1 min', '--bed-depth', '0.1 m', '--grain-radius', '0.1 mm', '--grain-density', '800 kg/m3'];

describe('sorbshare calibrate --model column (end to end)', () => {
  beforeAll(() => requireBuild());
  const { write } = scratchDir('colcal-');

  it('fits Ds to the invented small-column test (generated with Ds = 3e-15 m²/s and ±0.01 scatter)', () => {
    const r = runBin('calibrate', DATA, '--model', 'column', '--compound', COMPOUND, ...BED, '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.model).toBe('column');
    expect(j.compound).toBe('TGT');
    const ds = j.parameters.Ds_m2_per_s;
    expect(Math.abs(ds / 3e-15 - 1)).toBeLessThan(0.05);
    expect(j.ci95.Ds_m2_per_s[0]).toBeLessThan(ds);
    expect(j.ci95.Ds_m2_per_s[1]).toBeGreaterThan(ds);
    expect(j.fit.points).toBe(14);
    expect(j.fit.rmse).toBeLessThan(0.02);
    expect(j.table).toHaveLength(14);
  });

  it('bad inputs exit 2 naming the file, row, column or option, and print nothing', async () => {
    // the first through the binary, the others through the same runCli in this process (runInProcess)
    let r = runBin('calibrate', DATA, '--model', 'column', '--compound', COMPOUND, '--ebct', '1 min', '--bed-depth', '0.1 m', '--grain-density', '800 kg/m3');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--grain-radius/);
    expect(r.out).toBe('');
    r = await runInProcess('calibrate', DATA, '--model', 'column', '--compound', COMPOUND, '--ebct', '0 min', '--bed-depth', '0.1 m', '--grain-radius', '0.1 mm', '--grain-density', '800 kg/m3');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--ebct/);
    const down = write('down.csv', 'bed volumes (-),c/c0 (-)\n1000,0.1\n3000,0.3\n2000,0.4\n');
    r = await runInProcess('calibrate', down, '--model', 'column', '--compound', COMPOUND, ...BED);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/down\.csv, row 4, column "bed volumes \(-\)": bed volumes not increasing/);
    const high = write('high.csv', 'bed volumes (-),c/c0 (%)\n1000,10\n2000,130\n');
    r = await runInProcess('calibrate', high, '--model', 'column', '--compound', COMPOUND, ...BED);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/high\.csv, row 3, column "c\/c0 \(%\)": c\/c0 = 1\.3 is outside 0–1\.2/);
    const neg = write('neg.csv', 'bed volumes (-),c/c0 (-)\n1000,-0.1\n2000,0.2\n');
    r = await runInProcess('calibrate', neg, '--model', 'column', '--compound', COMPOUND, ...BED);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/neg\.csv, row 2/);
    const noFilm = write('nofilm.json', { id: 'TGT', K: 110, one_over_n: 0.3 });
    r = await runInProcess('calibrate', DATA, '--model', 'column', '--compound', noFilm, ...BED);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/nofilm\.json.*DL/);
    r = await runInProcess('calibrate', DATA, '--model', 'column', '--compound', COMPOUND, '--background', BACKGROUND, ...BED);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--doc-ds/);
    // one liquid-diffusivity option for every kinetic model: --dl (components without their own DL or kf)
    r = await runInProcess('calibrate', DATA, '--model', 'column', '--compound', COMPOUND, '--background', BACKGROUND, '--doc-ds', '2e-15 m2/s', ...BED);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--dl/);
    expect(r.out).toBe('');
    r = await runInProcess('calibrate', DATA, '--model', 'column', '--compound', COMPOUND, '--background', BACKGROUND, '--doc-ds', '2e-15 m2/s', '--doc-dl', '4e-10 m2/s', ...BED);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--doc-dl/);
  });
});
