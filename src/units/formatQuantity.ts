/**
 * Numbers and concentrations as text for messages and labels (goal texts, error messages) and,
 * through src/output/formatting.ts, for the tables and the report: one implementation.
 */

/** `sig` significant digits without exponent for everyday magnitudes. */
export function fmtNumber(x: number, sig = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const ax = Math.abs(x);
  if (ax >= 1e-6 && ax < 1e7) {
    const digits = Math.max(0, sig - 1 - Math.floor(Math.log10(ax)));
    return x.toFixed(Math.min(digits, 12));
  }
  return x.toExponential(sig - 1);
}

/** Concentration in mg/L shown in ng/L, µg/L or mg/L. */
export function fmtConcentration(cMgPerL: number, sig = 3): string {
  const a = Math.abs(cMgPerL);
  if (a === 0) return '0 mg/L';
  if (a < 1e-3) return `${fmtNumber(cMgPerL * 1e6, sig)} ng/L`;
  if (a < 1) return `${fmtNumber(cMgPerL * 1e3, sig)} µg/L`;
  return `${fmtNumber(cMgPerL, sig)} mg/L`;
}
