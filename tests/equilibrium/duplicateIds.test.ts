/** prepareMixture's duplicate-id check: pairwise for small mixtures, a Set above 32 components. */
import { describe, expect, it } from 'vitest';
import { duplicateIdIndex, prepareMixture } from '../../src/equilibrium/preparedMixture.js';

const comps = (ids: string[]) => ids.map((id) => ({ id, c0MgPerL: 1, K: 10, oneOverN: 0.3 }));

describe('duplicate ids', () => {
  it('finds the first repeated id on both paths, and none when ids are unique', () => {
    for (const size of [2, 5, 32, 33, 80]) {
      const ids = Array.from({ length: size }, (_, i) => `c${i}`);
      expect(duplicateIdIndex(comps(ids))).toBe(-1);
      const withDup = [...ids];
      withDup[size - 1] = 'c0';
      expect(duplicateIdIndex(comps(withDup))).toBe(size - 1);
    }
    expect(duplicateIdIndex([])).toBe(-1);
  });
  it('prepareMixture names the JSON path of the repeated id', () => {
    expect(() => prepareMixture(comps(['a', 'b', 'a']))).toThrow(/components\[2\]\.id.*duplicate id "a"/);
  });
});
