/**
 * Colour palette for series and stacks: the colour-blind-safe set of Okabe & Ito ("Color
 * Universal Design", 2008; from memory), reordered so the first colours contrast best on white
 * and yellow (weak as a thin line on white) comes last. Markers also change shape per series, so
 * series stay apart in grey-scale print.
 */

export const SERIES_COLOURS: readonly string[] = [
  '#0072B2', // blue
  '#D55E00', // vermillion
  '#009E73', // bluish green
  '#CC79A7', // reddish purple
  '#E69F00', // orange
  '#56B4E9', // sky blue
  '#000000', // black
  '#F0E442', // yellow
];

/** Marker shapes, cycled with the colours. */
export type MarkerShape = 'circle' | 'square' | 'triangle' | 'diamond' | 'triangle-down' | 'pentagon' | 'hexagon' | 'star';
export const MARKER_SHAPES: readonly MarkerShape[] = ['circle', 'square', 'triangle', 'diamond', 'triangle-down', 'pentagon', 'hexagon', 'star'];

/** Colour of series `index` (cycles past the end of the palette). */
export function seriesColour(index: number): string {
  return SERIES_COLOURS[((index % SERIES_COLOURS.length) + SERIES_COLOURS.length) % SERIES_COLOURS.length]!;
}

/** Marker shape of series `index`. */
export function seriesMarker(index: number): MarkerShape {
  return MARKER_SHAPES[((index % MARKER_SHAPES.length) + MARKER_SHAPES.length) % MARKER_SHAPES.length]!;
}

/**
 * Extra dash pattern of series `index` once the colours repeat (index ≥ palette length), so that
 * two series of the same colour still differ: '' for the first round, then dotted, then dash-dot.
 */
export function cycleDash(index: number): string {
  const round = Math.floor(index / SERIES_COLOURS.length);
  return ['', '2 3', '10 3 2 3'][round % 3]!;
}

/** Neutral colours of the plot furniture. */
export const INK = {
  text: '#1f2a30',
  muted: '#5b6870',
  axis: '#44525a',
  grid: '#e3e8eb',
  gridMinor: '#f0f3f5',
  refLine: '#3b3b3b',
} as const;

/**
 * Neutral styles of the lines that are not compounds (DOC and UV254 reduction, reference
 * curves): greys with their own dash patterns, so no compound colour is reused for them.
 */
export const NEUTRAL_STYLES = {
  uv254: { colour: '#4d4d4d', dash: '9 4' },
  doc: { colour: '#8c8c8c', dash: '2 3' },
  reference: { colour: '#6b6b6b', dash: '7 4' },
} as const;

/**
 * Text colour readable on a filled `hex` background: dark or white by relative luminance
 * (WCAG 2.x definition of relative luminance; common practice threshold 0.4).
 */
export function textOn(hex: string): string {
  const m = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!m) return INK.text;
  const n = parseInt(m[1]!, 16);
  const lin = (c: number) => {
    const s = c / 255;
    return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  };
  const lum = 0.2126 * lin((n >> 16) & 255) + 0.7152 * lin((n >> 8) & 255) + 0.0722 * lin(n & 255);
  return lum > 0.4 ? INK.text : '#ffffff';
}
