/**
 * One colour and one marker per compound, assigned once from the order of the compound table and
 * used by every figure of the report, so a compound looks the same everywhere. Colours cycle
 * through the palette and markers through the marker shapes; with up to eight compounds both are
 * unique, beyond that the (colour, marker) pair still is (8 × 8 combinations).
 */
import { MARKER_SHAPES, SERIES_COLOURS, type MarkerShape } from './palette.js';

export interface SeriesLook {
  colour: string;
  marker: MarkerShape;
}

/** The look of each compound id, in the order given (the compound table's order). */
export function compoundStyles(ids: readonly string[]): Map<string, SeriesLook> {
  const out = new Map<string, SeriesLook>();
  ids.forEach((id, i) => {
    const colour = SERIES_COLOURS[i % SERIES_COLOURS.length]!;
    // shift the marker by one every full round of colours, so pairs stay distinct past eight
    const marker = MARKER_SHAPES[(i + Math.floor(i / SERIES_COLOURS.length)) % MARKER_SHAPES.length]!;
    out.set(id, { colour, marker });
  });
  return out;
}
