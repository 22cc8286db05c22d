/**
 * Numbers as shown in report tables and text: 4 significant digits, digit groups for large
 * integers, powers of ten with superscripts outside 0.001 … 10⁷ (common practice in engineering
 * reports). The model normally passes text it formatted itself; this covers raw numbers.
 */

const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻', '+': '',
};

/** An integer exponent in superscript digits ("-5" → "⁻⁵"). */
export function toSuperscript(exponent: number | string): string {
  return String(exponent)
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
}

/** Integer with a narrow no-break space between groups of three digits from 10 000 up. */
function groupDigits(n: number): string {
  const s = String(Math.abs(n));
  const grouped = Math.abs(n) >= 10000 ? s.replace(/\B(?=(\d{3})+(?!\d))/g, '\u202f') : s;
  return n < 0 ? `-${grouped}` : grouped;
}

/** `x` for display: "—" for NaN, "∞" for infinities, otherwise as described above. */
export function formatNumber(x: number, significant = 4): string {
  if (Number.isNaN(x)) return '—';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '-∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e7) {
    if (Number.isInteger(x)) return groupDigits(x);
    const digits = Math.max(0, significant - 1 - Math.floor(Math.log10(a)));
    const s = x.toFixed(Math.min(digits, 12));
    return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
  }
  const [mant, exp] = x.toExponential(significant - 1).split('e');
  const m = mant!.includes('.') ? mant!.replace(/\.?0+$/, '') : mant!;
  return `${m}×10${toSuperscript(Number(exp))}`;
}
