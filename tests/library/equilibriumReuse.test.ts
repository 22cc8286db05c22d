/**
 * `equilibrium()` keeps the prepared mixture of an object between calls: a repeated call gives
 * the same result as a fresh copy of the object, and a changed object is read again (new values,
 * and the same validation messages as a fresh object). The reference is the result for a fresh
 * deep copy (no kept state). Invented mixture.
 */
import { describe, expect, it } from 'vitest';
import { equilibrium } from '../../src/index.js';

const mixture = () => ({ components: [
  { id: 'DOC-n', c0: 1.2, K: 0 },
  { id: 'DOC-1', c0: 2.0, K: 18, one_over_n: 0.2 },
  { id: 'target', c0: '100 ng/L', K: 40, one_over_n: 0.3 },
] });
const fresh = (m: unknown, dose: number) => equilibrium(structuredClone(m), dose);

describe('equilibrium() on the same object again', () => {
  it('gives the fresh result on every call', () => {
    const m = mixture();
    for (const d of [5, 20, 5]) expect(equilibrium(m, d)).toEqual(fresh(m, d));
  });

  it('reads a changed object again: a new value, a new component, a removed key, a bad value', () => {
    const m = mixture() as { components: Array<Record<string, unknown>> };
    const before = equilibrium(m, 20);
    m.components[1]!.K = 30;
    const changed = equilibrium(m, 20);
    expect(changed).toEqual(fresh(m, 20));
    expect(changed.components[2]!.c_mg_per_L).not.toBe(before.components[2]!.c_mg_per_L);
    m.components.push({ id: 'extra', c0: 0.5, K: 10, one_over_n: 0.4 });
    expect(equilibrium(m, 20)).toEqual(fresh(m, 20));
    delete m.components[3]!.one_over_n;
    expect(() => equilibrium(m, 20)).toThrow();
    let freshMessage = '';
    try { fresh(m, 20); } catch (e) { freshMessage = (e as Error).message; }
    expect(() => equilibrium(m, 20)).toThrow(freshMessage);
    m.components.pop();
    m.components[1]!.K = 'much';
    try { fresh(m, 20); } catch (e) { freshMessage = (e as Error).message; }
    expect(freshMessage).not.toBe('');
    expect(() => equilibrium(m, 20)).toThrow(freshMessage);
  });
});
