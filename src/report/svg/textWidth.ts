/**
 * Rough width of a text line in SVG units, for layout without a font engine (margins, legend
 * rows, label collisions). Per-character advance widths approximate a wide sans-serif (DejaVu
 * Sans, the widest of the usual fallbacks), so estimates err on the generous side.
 */

const NARROW = new Set('iljtfr.,:;|!\'()[]{} '.split(''));
const WIDE = new Set('mwMWÆŒ@%'.split(''));

/** Estimated width of `text` at `fontSizePx`. */
export function textWidth(text: string, fontSizePx: number): number {
  let em = 0;
  for (const ch of text) {
    if (NARROW.has(ch)) em += 0.34;
    else if (WIDE.has(ch)) em += 0.92;
    else if (ch >= 'A' && ch <= 'Z') em += 0.7;
    else em += 0.62;
  }
  return em * fontSizePx;
}
