/**
 * Film mass-transfer coefficient of a grain in a packed bed: Wilson & Geankoplis (1966), Ind. Eng.
 * Chem. Fundam. 5(1):9–14, for liquids at low Reynolds numbers:
 *
 *   Sh = (1.09/ε)·Re^(1/3)·Sc^(1/3),   valid for 0.0016 < Re < 55
 *   Re = ρ_w·v·d_p/μ        (v superficial velocity L/EBCT, d_p = 2R the grain diameter)
 *   Sc = μ/(ρ_w·D_L)
 *   Sh = kf·d_p/D_L   →   kf = Sh·D_L/d_p
 *
 * Units: v m/s, R m, D_L m²/s, μ Pa·s, ρ_w kg/m³, kf m/s; Re, Sc, Sh dimensionless.
 * Outside 0.0016 < Re < 55 the coefficient is still returned, with a warning naming the range.
 * @throws InputError when an input is not a positive finite number or ε is not in (0, 1)
 */
import { InputError } from '../core/errors.js';

export interface FilmInput {
  superficialVelocityMPerS: number;
  particleRadiusM: number;
  /** Bed porosity ε (void fraction between the grains), 0–1. */
  porosity: number;
  /** Liquid (molecular) diffusivity of the compound, m²/s. */
  dlM2PerS: number;
  viscosityPaS: number;
  densityKgPerM3: number;
}

export interface FilmCoefficient {
  kfMPerS: number;
  reynolds: number;
  schmidt: number;
  sherwood: number;
  /** Present when Re is outside the correlation's range. */
  warning?: string;
}

/** Validity range of the correlation (Wilson & Geankoplis 1966). */
export const WILSON_GEANKOPLIS_RE_RANGE = [0.0016, 55] as const;

/** Film coefficient by Wilson & Geankoplis (1966); see the file comment. */
export function wilsonGeankoplisKf(input: FilmInput): FilmCoefficient {
  for (const key of ['superficialVelocityMPerS', 'particleRadiusM', 'dlM2PerS', 'viscosityPaS', 'densityKgPerM3'] as const) {
    const v = input[key];
    if (!(v > 0) || !Number.isFinite(v)) throw new InputError(`expected a positive number, got ${v}`, { path: key });
  }
  if (!(input.porosity > 0 && input.porosity < 1)) throw new InputError(`expected a bed porosity between 0 and 1, got ${input.porosity}`, { path: 'porosity' });
  const dp = 2 * input.particleRadiusM;
  const reynolds = (input.densityKgPerM3 * input.superficialVelocityMPerS * dp) / input.viscosityPaS;
  const schmidt = input.viscosityPaS / (input.densityKgPerM3 * input.dlM2PerS);
  const sherwood = (1.09 / input.porosity) * Math.cbrt(reynolds) * Math.cbrt(schmidt); // Wilson & Geankoplis 1966
  const out: FilmCoefficient = { kfMPerS: (sherwood * input.dlM2PerS) / dp, reynolds, schmidt, sherwood };
  const [lo, hi] = WILSON_GEANKOPLIS_RE_RANGE;
  if (reynolds <= lo || reynolds >= hi) {
    out.warning = `Reynolds number ${reynolds.toPrecision(3)} is outside the range of the Wilson & Geankoplis film correlation (${lo} < Re < ${hi}); the film coefficient is extrapolated`;
  }
  return out;
}
