/**
 * The valid keys of mixture and compound files, in one place (unknown keys are errors naming the
 * nearest of these). To add a key, add it here and read it where the file is parsed.
 *
 * The kinetic keys (`carbon.particle_radius`, `carbon.particle_density`, per component `Ds`, `DL`,
 * `kf`) are valid here; their values are parsed by the kinetics reader, not by `readMixture`.
 */

/** Top level of a mixture file. */
export const MIXTURE_KEYS = ['$schema', '_note', 'name', 'note', 'dose', 'components', 'carbon'] as const;

/** The carbon object of a mixture file (kinetic properties of the carbon particle). */
export const MIXTURE_CARBON_KEYS = ['particle_radius', 'particle_density', 'note'] as const;

/** One component of a mixture file, or a compound file (`calibrate --compound`). */
export const COMPONENT_KEYS = ['id', 'name', 'note', '_note', 'c0', 'K', 'one_over_n', 'K_unit', 'molar_mass', 'Ds', 'DL', 'kf'] as const;

/** The unit pair of a Freundlich K. */
export const K_UNIT_KEYS = ['q', 'c'] as const;
