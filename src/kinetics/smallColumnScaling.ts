/**
 * Small-column scaling (rapid small-scale column tests): a small column packed with crushed
 * grains of diameter d_SC reproduces the breakthrough of the full-size bed with grains d_LC, in
 * bed volumes, when
 *
 *   EBCT_SC/EBCT_LC = (d_SC/d_LC)^(2 − X)           and   Ds_SC/Ds_LC = (d_SC/d_LC)^X
 *   t_SC/t_LC       = EBCT_SC/EBCT_LC               (same bed volumes)
 *
 * X = 0: constant diffusivity (Ds independent of grain size); X = 1: proportional diffusivity
 * (Ds proportional to grain size). Crittenden, Berrigan & Hand (1986), J. Water Pollut. Control
 * Fed. 58:312; Crittenden et al. (1991), J. AWWA 83(1):77 (both from memory). The film and the
 * Reynolds-number similarity of the small column are not part of these rules.
 *
 * Units: diameters or radii in any one length unit (only the ratio matters), EBCT in minutes,
 * Ds m²/s.
 * @throws InputError for a non-positive size, EBCT or Ds, or X other than 0 or 1
 */
import { InputError } from '../core/errors.js';

export type DiffusivityScaling = 'constant' | 'proportional';

/** The exponent X of the scaling rule: 0 constant, 1 proportional diffusivity. */
export function scalingExponent(scaling: DiffusivityScaling): 0 | 1 {
  if (scaling === 'constant') return 0;
  if (scaling === 'proportional') return 1;
  throw new InputError(`expected diffusivity scaling "constant" or "proportional", got ${JSON.stringify(scaling)}`, { path: 'scaling' });
}

function positive(v: number, path: string): void {
  if (!(v > 0) || !Number.isFinite(v)) throw new InputError(`expected a positive number, got ${v}`, { path });
}

export interface ColumnScale {
  /** Grain radius (or diameter) of the small column and of the full-size bed, one unit. */
  smallGrainSize: number;
  largeGrainSize: number;
  scaling: DiffusivityScaling;
}

/** EBCT_SC/EBCT_LC = (d_SC/d_LC)^(2 − X) (Crittenden et al. 1986). */
export function ebctRatio(s: ColumnScale): number {
  positive(s.smallGrainSize, 'smallGrainSize');
  positive(s.largeGrainSize, 'largeGrainSize');
  return Math.pow(s.smallGrainSize / s.largeGrainSize, 2 - scalingExponent(s.scaling));
}

/** EBCT of the small column that represents a full-size bed of `largeEbctMin` minutes. */
export function smallColumnEbctMin(s: ColumnScale, largeEbctMin: number): number {
  positive(largeEbctMin, 'largeEbctMin');
  return largeEbctMin * ebctRatio(s);
}

/** Full-size EBCT that a small column of `smallEbctMin` represents. */
export function largeBedEbctMin(s: ColumnScale, smallEbctMin: number): number {
  positive(smallEbctMin, 'smallEbctMin');
  return smallEbctMin / ebctRatio(s);
}

/** Ds of the full-size grains from the Ds fitted to the small column: Ds_LC = Ds_SC·(d_LC/d_SC)^X. */
export function largeGrainDs(s: ColumnScale, smallDsM2PerS: number): number {
  positive(smallDsM2PerS, 'smallDsM2PerS');
  positive(s.smallGrainSize, 'smallGrainSize');
  positive(s.largeGrainSize, 'largeGrainSize');
  return smallDsM2PerS * Math.pow(s.largeGrainSize / s.smallGrainSize, scalingExponent(s.scaling));
}
