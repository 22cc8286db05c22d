import { beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { requireBuild, runBin, runInProcess, scratchDir } from '../helpers/cliHarness.js';

const WATER = join(process.cwd(), 'fixtures/column/demo-water.json');

/** A small invented water: one fictive DOC component and one trace target. */
const small = {
  carbon: { particle_radius: '0.5 mm', particle_density: '800 kg/m3' },
  components: [
    { id: 'N', c0: '2 mg/L', K: 0 },
    { id: 'F', c0: '3 mg/L', K: 40, one_over_n: 0.2, Ds: '2e-15 m2/s', DL: '5e-10 m2/s' },
    { id: 'T', c0: '1 ug/L', K: 110, one_over_n: 0.3, Ds: '1e-14 m2/s', kf: '3e-5 m/s' },
  ],
};

describe('sorbshare column (end to end)', () => {
  beforeAll(() => requireBuild());
  const { write } = scratchDir('column-');

  it('prints the design JSON shape with breakthrough points at 0.1, 0.2, 0.5 and a closed mass balance', () => {
    const f = write('small.json', small);
    const r = runBin('column', f, '--ebct', '10 min', '--bed-depth', '1 m', '--to-bv', '20000', '--points', '41', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.bed_volumes[0]).toBe(0);
    expect(j.bed_volumes.at(-1)).toBe(20000);
    expect(j.components.map((c: { id: string }) => c.id)).toEqual(['N', 'F', 'T']);
    for (const c of j.components) {
      expect(c.c_over_c0).toHaveLength(j.bed_volumes.length);
      expect(c.breakthrough.map((b: { c_over_c0: number }) => b.c_over_c0)).toEqual([0.1, 0.2, 0.5]);
    }
    expect(j.components[0].breakthrough[0].bed_volumes).toBe(0.4); // non-adsorbable: one pore volume
    expect(j.mass_balance_error).toBeLessThan(1e-5);
    expect(j.bed.bed_density_kg_per_m3).toBeCloseTo(480, 9);
  });

  it('prints a table with the cautions for the demo water', () => {
    const r = runBin('column', WATER, '--ebct', '20 min', '--bed-depth', '2 m', '--to-bv', '5000', '--points', '11');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/BV at c\/c0 0\.1/);
    expect(r.out).toMatch(/CBZ/);
    expect(r.out).toMatch(/confirm with pilot/);
  });

  it('bad inputs exit 2 naming the field or option, and print nothing', async () => {
    // the first through the binary, the others through the same runCli in this process (runInProcess)
    const noGrain = write('nograin.json', { ...small, carbon: { particle_density: '800 kg/m3' } });
    let r = runBin('column', noGrain, '--ebct', '10 min', '--bed-depth', '1 m');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/nograin\.json.*carbon\.particle_radius/);
    expect(r.out).toBe('');
    const noCarbon = write('nocarbon.json', { components: small.components });
    r = await runInProcess('column', noCarbon, '--ebct', '10 min', '--bed-depth', '1 m');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/carbon/);
    const noDs = write('nods.json', { ...small, components: [small.components[0], small.components[1], { ...small.components[2], Ds: undefined }] });
    r = await runInProcess('column', noDs, '--ebct', '10 min', '--bed-depth', '1 m');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/components\[2\]\.Ds/);
    expect(r.err).toMatch(/"T"/);
    r = await runInProcess('column', WATER, '--ebct', '0 min', '--bed-depth', '1 m');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--ebct/);
    r = await runInProcess('column', WATER, '--ebct', '-5 min', '--bed-depth', '1 m');
    expect(r.code).toBe(2);
    r = await runInProcess('column', WATER, '--ebct', '20 min', '--bed-depth', '2 m', '--porosity', '1.2');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--porosity/);
    r = await runInProcess('column', WATER, '--bed-depth', '2 m');
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--ebct/);
    expect(JSON.parse(readFileSync(WATER, 'utf8')).components).toHaveLength(14);
  });
});
