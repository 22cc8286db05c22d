/** Sizes and fonts shared by all plots (SVG user units ≈ CSS px at 100 % width of 720). */

export const PLOT_WIDTH = 720;
export const PLOT_AREA_HEIGHT = 300;
/** Width of a compact figure (one or two bars; three of them fit side by side on A4). */
export const COMPACT_WIDTH = 300;

export const FONT_FAMILY = "system-ui, 'Segoe UI', 'Helvetica Neue', 'DejaVu Sans', Arial, sans-serif";

export const FONT = {
  tick: 12,
  axis: 13,
  legend: 12.5,
  note: 11.5,
  ref: 11.5,
  bar: 11,
} as const;

/** Gap between a tick and its label, and the tick length. */
export const TICK = { length: 5, minorLength: 3, gap: 4 } as const;
