/**
 * Thinning long polylines to pixel columns (thinPolyline.ts): per pixel column the thinned line
 * keeps the first and last point and the smallest and largest y of the full line, at most 4 points
 * per column, in the original order; short runs and runs whose x does not rise are unchanged.
 * Invented series (36,500 days of a noisy seasonal curve); properties only.
 */
import { describe, expect, it } from 'vitest';
import { thinRun } from '../../src/report/svg/thinPolyline.js';
import { makeScale } from '../../src/report/svg/axisScale.js';

describe('thinRun', () => {
  const n = 36_500;
  let seed = 7;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
  const run: Array<[number, number]> = Array.from({ length: n }, (_, d) => [d, 8 + 2 * Math.sin((2 * Math.PI * d) / 365) + rnd()]);
  const xs = makeScale([0, n - 1], [50, 650], false);
  const col = (x: number) => Math.floor(xs.map(x));

  it('keeps, per pixel column, the first, last, lowest and highest point, and at most 4 points', () => {
    const thin = thinRun(run, xs, 600);
    expect(thin.length).toBeLessThanOrEqual(4 * 601);
    expect(thin.length).toBeLessThan(n / 10);
    const full = new Map<number, { first: number; last: number; lo: number; hi: number }>();
    for (const [x, y] of run) {
      const c = full.get(col(x));
      if (!c) full.set(col(x), { first: y, last: y, lo: y, hi: y });
      else { c.last = y; c.lo = Math.min(c.lo, y); c.hi = Math.max(c.hi, y); }
    }
    const got = new Map<number, number[]>();
    for (const [x, y] of thin) got.set(col(x), [...(got.get(col(x)) ?? []), y]);
    expect([...got.keys()]).toEqual([...full.keys()]);
    for (const [c, f] of full) {
      const ys = got.get(c)!;
      expect(ys.length).toBeLessThanOrEqual(4);
      expect(ys[0]).toBe(f.first);
      expect(ys[ys.length - 1]).toBe(f.last);
      expect(Math.min(...ys)).toBe(f.lo);
      expect(Math.max(...ys)).toBe(f.hi);
    }
    for (let i = 1; i < thin.length; i++) expect(thin[i]![0]).toBeGreaterThan(thin[i - 1]![0]); // original order
  });

  it('leaves short runs and runs whose x does not rise as they are', () => {
    expect(thinRun(run.slice(0, 2000), xs, 600)).toEqual(run.slice(0, 2000));
    const back = [...run].reverse();
    expect(thinRun(back, xs, 600)).toEqual(back);
  });
});
