/**
 * The cautions the tool shows, used by the renderers when a model
 * carries none, so a report never goes out without them.
 */
export const DEFAULT_CAUTIONS: readonly string[] = [
  'Results are planning estimates from adsorption models (equilibrium and, where the project gives them, contact and fixed-bed kinetics).',
  'Contact time, carbon age, preloading, mixing and temperature reduce real removal; confirm with jar and pilot tests.',
  'Leave design decisions to a licensed engineer under the local discharge permit and codes.',
  'Carbon dust is combustible and needs the usual handling precautions.',
];

/** The model's cautions, or the default ones when it has none. */
export function cautionsOf(cautions: readonly string[] | undefined): readonly string[] {
  return cautions && cautions.length ? cautions : DEFAULT_CAUTIONS;
}
