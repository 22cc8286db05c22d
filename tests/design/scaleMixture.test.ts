/**
 * `scaleMixture` (the background moved to another DOC without preparing the mixture again) and
 * `prependComponent` (a target before an already prepared background) give exactly what
 * `prepareMixture` gives on the same components, and the removal model at another
 * DOC through it solves to the same figures bit for bit. Invented mixture (a non-adsorbable part,
 * three fictive DOC components, a trace target); identity checks, no outside values.
 */
import { describe, expect, it } from 'vitest';
import { prepareMixture, prependComponent, scaleMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { EquilibriumRemoval } from '../../src/design/equilibriumRemoval.js';

const target: FreundlichComponent = { id: 'T', c0MgPerL: 1e-4, K: 40, oneOverN: 0.3 };
const bg: FreundlichComponent[] = [
  { id: 'F0', c0MgPerL: 2.5, K: 0, oneOverN: 1 },
  { id: 'F1', c0MgPerL: 2.0, K: 5, oneOverN: 0.2 },
  { id: 'F2', c0MgPerL: 1.5, K: 30, oneOverN: 0.2 },
  { id: 'F3', c0MgPerL: 0.8, K: 120, oneOverN: 0.2 },
];
const scaled = (cs: FreundlichComponent[], f: number) => cs.map((c) => ({ ...c, c0MgPerL: c.c0MgPerL * f }));

describe('scaleMixture', () => {
  for (const f of [0.37, 1, 1.9]) {
    it(`equals prepareMixture on the scaled components (factor ${f}, target kept)`, () => {
      const a = scaleMixture(prepareMixture([target, ...bg]), f, 0);
      const b = prepareMixture([target, ...scaled(bg, f)]);
      expect(a.c0).toEqual(b.c0);
      expect(a.cTotal).toBe(b.cTotal);
      expect(a.lnCTotal).toBe(b.lnCTotal);
      expect(a.active).toEqual(b.active);
      expect(a.source).toEqual(b.source);
    });
  }

  it('the removal model at another DOC gives the same remaining fractions as one built there', () => {
    const here = new EquilibriumRemoval([{ target, competitors: bg }], 7, bg);
    const moved = here.atDoc(9.5);
    const built = new EquilibriumRemoval([{ target, competitors: scaled(bg, 9.5 / 7) }], 9.5, scaled(bg, 9.5 / 7));
    for (const dose of [0.001, 0.012, 0.05]) {
      expect(moved.remaining(0, dose).remainingFraction).toBe(built.remaining(0, dose).remainingFraction);
      expect(moved.backgroundRemaining(dose).cMgPerL).toEqual(built.backgroundRemaining(dose).cMgPerL);
    }
  });

  it('prependComponent equals prepareMixture on [target, ...background], errors included', () => {
    for (const t of [target, { ...target, K: 0 }, { ...target, c0MgPerL: 0 }]) {
      const a = prependComponent(t, prepareMixture(bg));
      const b = prepareMixture([t, ...bg]);
      for (const k of ['c0', 'n', 'beta', 'lnK', 'a', 'active'] as const) expect(a[k]).toEqual(b[k]);
      expect([a.size, a.cTotal, a.lnCTotal]).toEqual([b.size, b.cTotal, b.lnCTotal]);
      expect(a.ids).toEqual(b.ids);
      expect(a.source).toEqual(b.source);
    }
    for (const bad of [{ ...target, id: 'F2' }, { ...target, K: -1 }, { ...target, oneOverN: 0 }, { ...target, c0MgPerL: NaN }]) {
      let expected: unknown, got: unknown;
      try { prepareMixture([bad, ...bg]); } catch (e) { expected = e; }
      try { prependComponent(bad, prepareMixture(bg)); } catch (e) { got = e; }
      expect(got).toBeDefined();
      expect(got).toEqual(expected);
      expect((got as { location?: unknown }).location).toEqual((expected as { location?: unknown }).location);
    }
  });
});
