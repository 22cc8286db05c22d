import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { admissibleRange, evaluateIndicatorSet, indicatorMean, type IndicatorValue } from '../../src/indicators/indicatorRule.js';
import { InputError } from '../../src/core/errors.js';

// Worked example: Swiss DETEC ordinance SR 814.201.231 (in force 1 Dec 2016), Art. 3, as given in
// SR 814.201.231 Art. 3 rule, example computed from it: category 1 at 90, 85, 88, 92 % and category 2 at 70, 75 % give 500/6 = 83.33 %.
const EXAMPLE: IndicatorValue[] = [
  { id: 'carbamazepine', category: 1, removalPercent: 90 },
  { id: 'diclofenac', category: 1, removalPercent: 85 },
  { id: 'metoprolol', category: 1, removalPercent: 88 },
  { id: 'venlafaxine', category: 1, removalPercent: 92 },
  { id: 'benzotriazole', category: 2, removalPercent: 70 },
  { id: 'candesartan', category: 2, removalPercent: 75 },
];

describe('SR 814.201.231 indicator averaging rule', () => {
  it('gives 83.33 % for the example computed from the rule (500/6)', () => {
    expect(indicatorMean(EXAMPLE)).toBeCloseTo(83.33, 2);
    const ev = evaluateIndicatorSet(EXAMPLE);
    expect(ev.admissible).toBe(true);
    expect(ev.category1).toBe(4);
    expect(ev.category2).toBe(2);
  });

  it('rejects fewer than 6 substances with a clear reason (Art. 3: at least 6)', () => {
    const five = EXAMPLE.slice(0, 5);
    const ev = evaluateIndicatorSet(five);
    expect(ev.admissible).toBe(false);
    expect(ev.reason).toMatch(/5 substances given; the rule needs at least 6/);
    expect(() => indicatorMean(five)).toThrow(InputError);
    expect(() => indicatorMean(five)).toThrow(/not admissible: 5 substances/);
  });

  it('rejects a set not in the ratio 2:1 (Art. 3)', () => {
    const wrong = [...EXAMPLE.slice(0, 3), ...EXAMPLE.slice(4), { id: 'irbesartan', category: 2 as const, removalPercent: 80 }];
    const ev = evaluateIndicatorSet(wrong);
    expect(ev.admissible).toBe(false);
    expect(ev.reason).toMatch(/3 of category 1 and 3 of category 2; the rule needs them in the ratio 2:1/);
    expect(() => indicatorMean(wrong)).toThrow(/ratio 2:1/);
  });

  it('names duplicate ids and bad categories', () => {
    expect(() => evaluateIndicatorSet([...EXAMPLE, EXAMPLE[0]!])).toThrow(/appears twice/);
    expect(() => evaluateIndicatorSet([{ id: 'x', category: 3 as 1, removalPercent: 1 }])).toThrow(/category 1 or 2/);
  });

  it('says why no admissible subset exists', () => {
    expect(() => admissibleRange(EXAMPLE.slice(0, 3).concat(EXAMPLE.slice(4)))).toThrow(/no admissible indicator set: 3 substances of category 1 and 2 of category 2/);
  });

  it('with exactly the needed substances, best = worst = the set itself', () => {
    const r = admissibleRange(EXAMPLE);
    expect(r.best.meanRemovalPercent).toBeCloseTo(500 / 6, 12);
    expect(r.worst.meanRemovalPercent).toBeCloseTo(500 / 6, 12);
    expect(r.sizes).toEqual([{ category1: 4, category2: 2 }]);
  });

  // Property (no published table): the best and worst admissible subsets equal a brute-force
  // enumeration of every admissible subset (k1 = 2·k2, k1 + k2 ≥ 6).
  it('best and worst admissible subsets match brute force', () => {
    const arb = fc.tuple(
      fc.array(fc.double({ min: 0, max: 100, noNaN: true }), { minLength: 4, maxLength: 8 }),
      fc.array(fc.double({ min: 0, max: 100, noNaN: true }), { minLength: 2, maxLength: 4 }),
    );
    fc.assert(fc.property(arb, ([r1, r2]) => {
      const values: IndicatorValue[] = [...r1.map((r, i) => ({ id: `a${i}`, category: 1 as const, removalPercent: r })), ...r2.map((r, i) => ({ id: `b${i}`, category: 2 as const, removalPercent: r }))];
      let best = -Infinity, worst = Infinity;
      const n = values.length;
      for (let mask = 1; mask < 1 << n; mask++) {
        const sub = values.filter((_, i) => mask & (1 << i));
        const ev = evaluateIndicatorSet(sub);
        if (!ev.admissible) continue;
        best = Math.max(best, ev.meanRemovalPercent);
        worst = Math.min(worst, ev.meanRemovalPercent);
      }
      const range = admissibleRange(values);
      expect(range.best.meanRemovalPercent).toBeCloseTo(best, 9);
      expect(range.worst.meanRemovalPercent).toBeCloseTo(worst, 9);
      expect(evaluateIndicatorSet(values.filter((v) => range.worst.ids.includes(v.id))).admissible).toBe(true);
    }), { numRuns: 150 });
  });
});
