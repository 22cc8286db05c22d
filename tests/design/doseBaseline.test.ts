/**
 * The merged dose search returns the doses of the searches it replaced (within 1e-10, relative):
 * fixtures/design/dose-baseline.json was recorded by scripts/recordDoseBaseline.ts from the old
 * searches before they were merged. Each search solves to |Δ ln D| ≤ 1e-12, so two correct
 * searches from different brackets agree to about 2e-12; 1e-10 leaves room for the IAST solver's
 * own tolerance. These are regression checks against the project's previous figures (not
 * outside references); the outside checks of the dose are in doseSearch.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { prepareMixture, type FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { doseForRemoval } from '../../src/design/doseForRemoval.js';

interface Baseline {
  random: Array<{ components: FreundlichComponent[]; removalFraction: number; doseGPerL: number | null }>;
}
const baseline = JSON.parse(readFileSync(new URL('../../fixtures/design/dose-baseline.json', import.meta.url), 'utf8')) as Baseline;

describe('merged dose search against the recorded doses', () => {
  it('the 300 random problems of the property test: same doses within 1e-10, same unreachable cases', () => {
    expect(baseline.random).toHaveLength(300);
    let compared = 0;
    for (const p of baseline.random) {
      const pm = prepareMixture(p.components);
      if (p.doseGPerL === null) {
        expect(() => doseForRemoval(pm, p.components.length - 1, p.removalFraction)).toThrow(/not reached by any dose up to 5000 mg\/L/);
        continue;
      }
      const d = doseForRemoval(pm, p.components.length - 1, p.removalFraction).doseGPerL;
      expect(Math.abs(d / p.doseGPerL - 1)).toBeLessThan(1e-10);
      compared++;
    }
    expect(compared).toBe(292);
  });
});
