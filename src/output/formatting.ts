/** Number formatting shared by the tables, the summary and the report (presentation only). */

export { fmtNumber, fmtConcentration } from '../units/formatQuantity.js';

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
