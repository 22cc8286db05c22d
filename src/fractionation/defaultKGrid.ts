/**
 * Default Freundlich K grid for the fictive adsorbable DOC components, in (mg/g)/(mg/L)^(1/n).
 *
 * Common practice (adsorption analysis, Worch 2012, Adsorption Technology in Water Treatment,
 * from memory): fictive components span weakly to strongly adsorbable, K from about 0.1 to
 * about 100 (mg/g)/(mg/L)^0.2 with 1/n = 0.2. The grids below (ours) sit in the upper part of
 * that range, roughly log-even and ending at the strongly adsorbable 100, because with a low
 * exponent each component is removed over a narrow dose window (≈ c0_i/K_i in g/L): for effluent
 * DOC of 5–15 mg/L and PAC doses of 5–300 mg/L these grids keep the shares identifiable (for
 * M = 3 the 95 % intervals hold the true shares at about the nominal rate in the coverage test of
 * tests/fractionation; a grid of 5, 25, 100 left the weakest share inseparable from the
 * non-adsorbable one). Pass your own grid with `kGrid`.
 */
export const DEFAULT_K_GRIDS: Readonly<Record<number, readonly number[]>> = {
  1: [30],
  2: [10, 100],
  3: [10, 30, 100],
  4: [5, 15, 40, 100],
  5: [3, 8, 20, 50, 100],
};

/** Largest and smallest number of adsorbable fictive components supported. */
export const MIN_COMPONENTS = 1;
export const MAX_COMPONENTS = 5;

/** The default grid for M adsorbable components (ascending). @throws RangeError outside 1–5 */
export function defaultKGrid(m: number): number[] {
  const g = DEFAULT_K_GRIDS[m];
  if (!g) throw new RangeError(`no default K grid for ${m} components; expected 1–5`);
  return [...g];
}
