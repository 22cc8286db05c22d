/**
 * The look of a carbon's line in a figure (the daily dose of every carbon): neutral, dark tones
 * with their own dash patterns, so a carbon is never drawn in a compound's colour (compounds own
 * the coloured palette, see compoundStyles). Assigned by the carbon's position in the project.
 */

/** Carbon looks in project order: colour (dark neutral tones) and SVG stroke-dasharray ('' is solid). */
export const CARBON_LOOKS: ReadonlyArray<{ colour: string; dash: string }> = [
  { colour: '#2b2b2b', dash: '' },
  { colour: '#7a6f63', dash: '10 4' },
  { colour: '#4f6168', dash: '3 3' },
  { colour: '#9a9a9a', dash: '12 3 3 3' },
];

/** The look of the carbon at `index` in the project's carbon list (cycles after four). */
export function carbonLook(index: number): { colour: string; dash: string } {
  return CARBON_LOOKS[((index % CARBON_LOOKS.length) + CARBON_LOOKS.length) % CARBON_LOOKS.length]!;
}
