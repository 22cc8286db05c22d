/**
 * Terminal number formatting (src/cli/format.ts): 3 significant digits, percentages that never
 * round to 0 or 100 when they are not, typed inputs echoed as typed, durations in readable units,
 * numeric columns (also "> 50,000") right-aligned. Expected strings are written out by hand.
 */
import { describe, expect, it } from 'vitest';
import { fmt, fmtConc, fmtCount, fmtDuration, fmtInput, fmtPercent, table } from '../../src/cli/format.js';

describe('CLI number formatting', () => {
  it('gives 3 significant digits by default', () => {
    expect(fmt(25.568)).toBe('25.6');
    expect(fmt(114.55)).toBe('115');
    expect(fmt(0.0002862)).toBe('0.000286');
    expect(fmtConc(0.0957e-3)).toBe('95.7 ng/L');
    expect(fmtConc(1.2)).toBe('1.20 mg/L');
  });
  it('keeps percentages apart from 0 and 100 unless they are exactly that', () => {
    expect(fmtPercent(80)).toBe('80.0');
    expect(fmtPercent(4.292)).toBe('4.29');
    expect(fmtPercent(0.000002230)).toBe('< 0.01');
    expect(fmtPercent(99.99)).toBe('99.99');
    expect(fmtPercent(99.96)).toBe('99.96');
    expect(fmtPercent(99.9999999)).toBe('> 99.999');
    expect(fmtPercent(0)).toBe('0');
    expect(fmtPercent(100)).toBe('100');
  });
  it('echoes typed inputs without padding zeros and durations in readable units', () => {
    expect(fmtInput(0.4)).toBe('0.4');
    expect(fmtInput(20)).toBe('20');
    expect(fmtInput(1200 / 60)).toBe('20');
    expect(fmtDuration(1800)).toBe('30 min');
    expect(fmtDuration(3 * 86400)).toBe('3 d');
    expect(fmtDuration(5400)).toBe('1.5 h');
    expect(fmtDuration(45)).toBe('45 s');
    expect(fmtCount(32088.6)).toBe('32,089');
  });
  it('right-aligns numeric columns, "> N" and "< N" included', () => {
    const t = table(['id', 'BV'], [['A', '> 50,000'], ['B', '474']]).split('\n');
    expect(t[2]).toBe('A   > 50,000');
    expect(t[3]).toBe('B        474');
  });
});
