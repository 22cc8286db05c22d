/**
 * Coordinate mapping of the plots: linear p = r0 + (v − d0)/(d1 − d0)·(r1 − r0) and the same in
 * log10 v (definition of a linear/log axis; common practice). Expected values worked by hand.
 */
import { describe, expect, it } from 'vitest';
import { makeScale } from '../../src/report/svg/axisScale.js';
import { r2 } from '../../src/report/svg/svgNumber.js';

describe('makeScale', () => {
  it('linear: ends and midpoint, reversed range for a y axis', () => {
    const x = makeScale([0, 60], [100, 700], false);
    expect(x.map(0)).toBe(100);
    expect(x.map(60)).toBe(700);
    expect(x.map(15)).toBe(250);
    const y = makeScale([0, 100], [314, 14], false);
    expect(y.map(0)).toBe(314);
    expect(y.map(100)).toBe(14);
    expect(y.map(80)).toBeCloseTo(74, 12);
  });
  it('log: decades equally spaced, geometric mean in the middle', () => {
    const x = makeScale([0.01, 100], [0, 400], true);
    expect(x.map(0.01)).toBeCloseTo(0, 12);
    expect(x.map(0.1)).toBeCloseTo(100, 12);
    expect(x.map(1)).toBeCloseTo(200, 12);
    expect(x.map(100)).toBeCloseTo(400, 12);
    expect(x.map(Math.sqrt(0.5 * 2))).toBeCloseTo(200, 12);
    expect(x.map(2)).toBeCloseTo(200 + 100 * Math.log10(2), 12);
  });
  it('degenerate domain maps to the middle of the range', () => {
    const x = makeScale([5, 5], [0, 10], false);
    expect(x.map(5)).toBe(5);
    expect(x.map(123)).toBe(5);
  });
});

describe('r2 (SVG numbers)', () => {
  it('rounds to two decimals without -0 or trailing zeros', () => {
    expect(r2(1.23456)).toBe('1.23');
    expect(r2(1.005 + 1e-9)).toBe('1.01');
    expect(r2(-0.001)).toBe('0');
    expect(r2(10)).toBe('10');
    expect(r2(-3.1)).toBe('-3.1');
  });
});
