/** Plain-text tables and number formatting for terminal output. */

import { fmtConcentration, fmtNumber } from '../output/formatting.js';

/** Number with `sig` significant digits, no exponent for everyday magnitudes. */
export const fmt = (x: number, sig = 4): string => fmtNumber(x, sig);

/** Concentration in mg/L shown in the most readable of ng/L, µg/L, mg/L. */
export const fmtConc = (cMgPerL: number, sig = 4): string => fmtConcentration(cMgPerL, sig);

/** Aligned text table; numbers right-aligned. */
export function table(headers: string[], rows: string[][]): string {
  const widths = headers.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const blank = (c: string) => c === '' || c === '—' || c === '-';
  const isNum = headers.map((_, j) => rows.some((r) => !blank(r[j] ?? '')) && rows.every((r) => blank(r[j] ?? '') || /^[-+−]?[\d.]/.test(r[j] ?? '')));
  const line = (cells: string[]) => cells.map((c, j) => (isNum[j] ? c.padStart(widths[j]!) : c.padEnd(widths[j]!))).join('  ').trimEnd();
  return [line(headers), widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}
