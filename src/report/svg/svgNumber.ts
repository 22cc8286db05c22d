/**
 * Numbers written into SVG coordinates: rounded to 2 decimals (0.01 px is far below what a
 * screen or printer shows) so the output is short and byte-for-byte deterministic.
 */

/** `n` rounded to 2 decimals as text, without a trailing `.0` and without `-0`. */
export function r2(n: number): string {
  const v = Math.round(n * 100) / 100;
  return Object.is(v, -0) || v === 0 ? '0' : String(v);
}
