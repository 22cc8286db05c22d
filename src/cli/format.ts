/** Plain-text tables and number formatting for terminal output. */

import { fmtConcentration, fmtNumber } from '../output/formatting.js';

/** Number with `sig` significant digits (3 unless asked), no exponent for everyday magnitudes. */
export const fmt = (x: number, sig = 3): string => fmtNumber(x, sig);

/** Concentration in mg/L shown in the most readable of ng/L, µg/L, mg/L, 3 significant digits. */
export const fmtConc = (cMgPerL: number, sig = 3): string => fmtConcentration(cMgPerL, sig);

/** A value the user typed, echoed as typed: up to 6 significant digits, no padding zeros ("0.4", "20"). */
export const fmtInput = (x: number): string => String(Number(x.toPrecision(6)));

/** Whole numbers with thousands grouped ("32,089"), e.g. bed volumes. */
export const fmtCount = (x: number): string => Math.round(x).toLocaleString('en-US');

/**
 * A percentage (removal, reduction) for reading: 3 significant digits; below 0.01 as "< 0.01";
 * just under 100 with as many decimals as keep it apart from 100 (at most 3, then "> 99.999").
 */
export function fmtPercent(p: number): string {
  if (!Number.isFinite(p)) return String(p);
  if (p === 0 || p === 100) return String(p);
  if (Math.abs(p) < 0.01) return p > 0 ? '< 0.01' : '> -0.01';
  if (p > 99.9 && p < 100) {
    for (let d = 1; d <= 3; d++) if (p.toFixed(d) !== '100.' + '0'.repeat(d)) return p.toFixed(d);
    return '> 99.999';
  }
  return fmtNumber(p, 3);
}

/** A duration in seconds in the most readable of s, min, h and d, up to 4 significant digits without padding zeros ("30 min", "3 d", "1.5 h"). */
export function fmtDuration(seconds: number): string {
  const v = (x: number) => String(Number(x.toPrecision(4)));
  if (seconds >= 86400) return `${v(seconds / 86400)} d`;
  if (seconds >= 3600) return `${v(seconds / 3600)} h`;
  if (seconds >= 60) return `${v(seconds / 60)} min`;
  return `${v(seconds)} s`;
}

/** Aligned text table; numbers right-aligned. */
export function table(headers: string[], rows: string[][]): string {
  const widths = headers.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const blank = (c: string) => c === '' || c === '—' || c === '-';
  const isNum = headers.map((_, j) => rows.some((r) => !blank(r[j] ?? '')) && rows.every((r) => blank(r[j] ?? '') || /^([<>] )?[-+−]?[\d.]/.test(r[j] ?? '')));
  const line = (cells: string[]) => cells.map((c, j) => (isNum[j] ? c.padStart(widths[j]!) : c.padEnd(widths[j]!))).join('  ').trimEnd();
  return [line(headers), widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}
