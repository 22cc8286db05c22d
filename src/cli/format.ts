/** Plain-text tables and number formatting for terminal output. */

/** Number with `sig` significant digits, no exponent for everyday magnitudes. */
export function fmt(x: number, sig = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const ax = Math.abs(x);
  if (ax >= 1e-3 && ax < 1e7) {
    const digits = Math.max(0, sig - 1 - Math.floor(Math.log10(ax)));
    return x.toFixed(Math.min(digits, 12));
  }
  return x.toExponential(sig - 1);
}

/** Concentration in mg/L shown in the most readable of ng/L, µg/L, mg/L. */
export function fmtConc(cMgPerL: number, sig = 4): string {
  const a = Math.abs(cMgPerL);
  if (a === 0) return '0 mg/L';
  if (a < 1e-3) return `${fmt(cMgPerL * 1e6, sig)} ng/L`;
  if (a < 1) return `${fmt(cMgPerL * 1e3, sig)} µg/L`;
  return `${fmt(cMgPerL, sig)} mg/L`;
}

/** Aligned text table; numbers right-aligned. */
export function table(headers: string[], rows: string[][]): string {
  const widths = headers.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const isNum = headers.map((_, j) => rows.length > 0 && rows.every((r) => /^[-+]?[\d.]/.test(r[j] ?? '')));
  const line = (cells: string[]) => cells.map((c, j) => (isNum[j] ? c.padStart(widths[j]!) : c.padEnd(widths[j]!))).join('  ').trimEnd();
  return [line(headers), widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}
