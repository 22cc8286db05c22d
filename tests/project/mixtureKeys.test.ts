/**
 * Mixture, compound and background files reject unknown keys with the JSON path and the nearest
 * valid key; the kinetic keys (carbon.particle_radius, carbon.particle_density, Ds, DL, kf) are
 * valid keys (parsed by the kinetics reader, not here).
 */
import { describe, expect, it } from 'vitest';
import { readCompoundFile, readMixture } from '../../src/scenario/readMixture.js';
import { InputError } from '../../src/core/errors.js';

function err(f: () => unknown): InputError {
  try { f(); } catch (e) { return e as InputError; }
  throw new Error('no error');
}

describe('mixture keys', () => {
  it('accepts the kinetic keys', () => {
    const m = readMixture({ carbon: { particle_radius: '20 um', particle_density: '800 kg/m3' }, components: [{ id: 'A', c0: 1, K: 10, one_over_n: 0.3, Ds: 1e-15, DL: 7e-10, kf: 1e-5 }] });
    expect(m.components).toHaveLength(1);
  });
  it.each([
    [{ components: [{ id: 'A', c0: 1, K: 10, one_over_n: 0.3, K_units: {} }] }, 'components[0].K_units', 'K_unit'],
    [{ components: [{ id: 'A', c0: 1, K: 10, one_over_n: 0.3, ds: 1 }] }, 'components[0].ds', 'Ds'],
    [{ carbon: { radius: 1 }, components: [] }, 'carbon.radius', 'particle_radius'],
    [{ component: [] }, 'component', 'components'],
  ])('%j → %s (did you mean %s)', (raw, path, near) => {
    const e = err(() => readMixture(raw));
    expect(e.location.path).toBe(path);
    expect(e.message).toContain(`did you mean "${near}"`);
  });
  it('compound files too', () => {
    const e = err(() => readCompoundFile({ id: 'A', K: 1, one_over_n: 0.3, molar_mas: 200 }));
    expect(e.location.path).toBe('molar_mas');
    expect(e.message).toContain('did you mean "molar_mass"');
  });
});
