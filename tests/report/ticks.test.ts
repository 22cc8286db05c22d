/**
 * Tick generation of the report plots. Linear ticks follow Heckbert's nice numbers (P. S. Heckbert,
 * "Nice numbers for graph labels", Graphics Gems 1990; from memory): steps of 1, 2 or 5 × 10^k.
 * Log ticks: decades with 2 and 5 sub-ticks (common practice). The expected tick lists below are
 * worked out by hand from those rules.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { linearTicks, niceNumber } from '../../src/report/svg/linearTicks.js';
import { ceilNice125, floorNice125, formatLogLabel, logDomain, logTicks } from '../../src/report/svg/logTicks.js';
import { planAxis } from '../../src/report/svg/planAxis.js';

const values = (t: { value: number }[]) => t.map((x) => x.value);
const labelled = (t: { value: number; label: string | null }[]) => t.filter((x) => x.label).map((x) => x.label);

describe('niceNumber (Heckbert 1990)', () => {
  it('rounds to 1, 2, 5, 10 × 10^k', () => {
    expect(niceNumber(0.8, true)).toBe(1); // f = 8 → 10 × 10^-1
    expect(niceNumber(1.4, true)).toBe(1);
    expect(niceNumber(2.9, true)).toBe(2);
    expect(niceNumber(6.9, true)).toBe(5);
    expect(niceNumber(0.025, true)).toBe(0.02);
    expect(niceNumber(0.031, true)).toBe(0.05);
    expect(niceNumber(3.1, false)).toBe(5);
    expect(niceNumber(11, false)).toBe(20);
    expect(niceNumber(100, false)).toBe(100);
  });
});

describe('linearTicks', () => {
  it('0…1 in steps of 0.2 with one decimal', () => {
    const t = linearTicks(0, 1, 6);
    expect(values(t.ticks)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(labelled(t.ticks)).toEqual(['0', '0.2', '0.4', '0.6', '0.8', '1.0']);
    expect(t.domain).toEqual([0, 1]);
  });
  it('0…60 in steps of 10', () => {
    expect(values(linearTicks(0, 60, 7).ticks)).toEqual([0, 10, 20, 30, 40, 50, 60]);
  });
  it('widens a loose domain to whole steps', () => {
    const t = linearTicks(14.1, 27.9, 6);
    expect(t.step).toBe(2);
    expect(t.domain).toEqual([14, 28]);
  });
  it('negative ranges and small steps carry exact decimals', () => {
    const t = linearTicks(-0.052, 0.049, 6);
    expect(t.step).toBe(0.02);
    expect(values(t.ticks)).toEqual([-0.06, -0.04, -0.02, 0, 0.02, 0.04, 0.06]);
    expect(labelled(t.ticks)[0]).toBe('−0.06');
  });
  it('a fixed range is kept exactly, ticks inside only', () => {
    const t = linearTicks(0.5, 9.5, 6, true);
    expect(t.domain).toEqual([0.5, 9.5]);
    expect(values(t.ticks)).toEqual([2, 4, 6, 8]);
  });
  it('equal and non-finite input stay usable', () => {
    expect(linearTicks(5, 5).domain[0]).toBeLessThan(5);
    expect(linearTicks(5, 5).domain[1]).toBeGreaterThan(5);
    expect(linearTicks(0, 0).domain).toEqual([-1, 1]);
    expect(linearTicks(NaN, 3).domain).toEqual([0, 1]);
  });
  it('property: ticks cover the data, evenly spaced, 1-2-5 step, 3 to 12 ticks', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-6, max: 1e3, noNaN: true }), (lo, relSpan) => {
        // spans down to 1e-6 of the magnitude (plots never resolve finer than that)
        const hi = lo + relSpan * Math.max(1, Math.abs(lo));
        if (!(hi > lo)) return;
        const t = linearTicks(lo, hi, 6);
        const v = values(t.ticks);
        expect(t.domain[0]).toBeLessThanOrEqual(lo + 1e-6 * t.step); // sub-pixel tolerance
        expect(t.domain[1]).toBeGreaterThanOrEqual(hi - 1e-6 * t.step);
        expect(v.length).toBeGreaterThanOrEqual(3);
        expect(v.length).toBeLessThanOrEqual(12);
        const m = t.step / 10 ** Math.floor(Math.log10(t.step) + 1e-12);
        expect([1, 2, 5].some((k) => Math.abs(m - k) < 1e-9)).toBe(true);
        for (let i = 1; i < v.length; i++) expect(v[i]! - v[i - 1]!).toBeCloseTo(t.step, 6);
      }),
      { numRuns: 300 },
    );
  });
});

describe('log ticks', () => {
  it('1…1000: labelled decades with unlabelled 2 and 5 sub-ticks', () => {
    const t = logTicks(1, 1000);
    expect(values(t)).toEqual([1, 2, 5, 10, 20, 50, 100, 200, 500, 1000]);
    expect(labelled(t)).toEqual(['1', '10', '100', '1000']);
    expect(t.filter((x) => x.major).map((x) => x.value)).toEqual([1, 10, 100, 1000]);
  });
  it('short spans label the 1-2-5 sequence, very short spans every integer multiple', () => {
    expect(labelled(logTicks(0.05, 2))).toEqual(['0.05', '0.1', '0.2', '0.5', '1', '2']);
    expect(labelled(logTicks(2, 5))).toEqual(['2', '3', '4', '5']);
  });
  it('many decades: every second decade labelled, no sub-ticks', () => {
    const t = logTicks(1e-9, 1e3);
    expect(t).toHaveLength(13);
    expect(labelled(t)).toEqual(['10⁻⁸', '10⁻⁶', '10⁻⁴', '0.01', '1', '100']);
  });
  it('labels: plain decimals from 0.001 to 99 999, powers of ten outside', () => {
    expect(formatLogLabel(5, -3)).toBe('0.005');
    expect(formatLogLabel(1, -5)).toBe('10⁻⁵');
    expect(formatLogLabel(2, -6)).toBe('2×10⁻⁶');
    expect(formatLogLabel(1, 5)).toBe('10⁵');
    expect(formatLogLabel(2, 4)).toBe('20000');
  });
  it('domain snaps outwards to the 1-2-5 sequence', () => {
    expect(logDomain(0.063, 12.6)).toEqual([0.05, 20]);
    expect(logDomain(3, 3)).toEqual([2, 5]);
    expect(logDomain(1, 1)).toEqual([0.5, 2]);
    expect(logDomain(0, 5)).toEqual([1, 10]);
    expect(floorNice125(5e-7)).toBe(5e-7);
    expect(ceilNice125(5.0000001e-7)).toBe(1e-6);
  });
  it('property: ticks inside the domain, increasing, at least two labels', () => {
    fc.assert(
      fc.property(fc.double({ min: -12, max: 12, noNaN: true }), fc.double({ min: 0.01, max: 15, noNaN: true }), (a, span) => {
        const [lo, hi] = logDomain(10 ** a, 10 ** (a + span));
        expect(lo).toBeLessThanOrEqual(10 ** a * (1 + 1e-12));
        expect(hi).toBeGreaterThanOrEqual(10 ** (a + span) * (1 - 1e-12));
        const t = logTicks(lo, hi);
        const v = values(t);
        for (let i = 1; i < v.length; i++) expect(v[i]!).toBeGreaterThan(v[i - 1]!);
        expect(v[0]!).toBeGreaterThanOrEqual(lo * (1 - 1e-9));
        expect(v[v.length - 1]!).toBeLessThanOrEqual(hi * (1 + 1e-9));
        expect(labelled(t).length).toBeGreaterThanOrEqual(2);
        expect(labelled(t).length).toBeLessThanOrEqual(10);
      }),
      { numRuns: 300 },
    );
  });
});

describe('planAxis', () => {
  it('uses a valid fixed range, ignores an invalid one', () => {
    expect(planAxis([3, 4], { fixed: [0, 100] }).domain).toEqual([0, 100]);
    expect(planAxis([3, 4], { log: true, fixed: [0, 100] }).domain).toEqual([2, 5]);
    expect(planAxis([], { log: true }).domain).toEqual([1, 10]);
    expect(planAxis([], {}).domain).toEqual([0, 1]);
  });
});
