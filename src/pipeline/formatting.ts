/** Number formatting shared by the tables, the summary and the report (presentation only). */

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

/** Money with two decimals and thin grouping of thousands. */
export function fmtMoney(x: number, currency: string): string {
  const s = Math.abs(x) >= 100 ? Math.round(x).toLocaleString('en-US') : x.toFixed(Math.abs(x) < 1 ? 4 : 2);
  return `${s} ${currency}`;
}

/** Whole numbers with grouping (kg, m³). */
export function fmtWhole(x: number): string {
  return Math.round(x).toLocaleString('en-US');
}

/** Fixed decimals without a negative zero ("-0.0" becomes "0.0"): for differences and residuals. */
export function fmtFixed(x: number, decimals: number): string {
  if (!Number.isFinite(x)) return String(x);
  const s = x.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}
