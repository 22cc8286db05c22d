/**
 * Inputs of the fixed-bed breakthrough model in internal units, their validation, and the film
 * coefficient of each component (given kf, or Wilson & Geankoplis 1966 from the liquid
 * diffusivity; src/kinetics/filmCorrelation.ts).
 *
 * Units: concentrations mg/L, K (mg/g)/(mg/L)^β, Ds and DL m²/s, kf m/s, EBCT s, bed depth m,
 * grain radius m, grain (particle) density kg/m³ = g/L, temperature °C.
 * @throws InputError naming the component and field (JSON-path style) for missing or bad values
 */
import { InputError } from '../core/errors.js';
import { wilsonGeankoplisKf } from './filmCorrelation.js';
import { waterProperties } from './waterProperties.js';

export interface FixedBedComponent {
  id: string;
  c0MgPerL: number;
  /** Freundlich K, (mg/g)/(mg/L)^β; 0 = non-adsorbable (passes straight through). */
  K: number;
  oneOverN: number;
  /** Surface diffusivity, m²/s (needed when K > 0). */
  dsM2PerS?: number;
  /** Film coefficient, m/s (overrides the correlation). */
  kfMPerS?: number;
  /** Liquid diffusivity, m²/s (for the correlation when kf is not given). */
  dlM2PerS?: number;
  /** Part of the DOC (fictive DOC component or the non-adsorbable part). */
  doc?: boolean;
  /** Specific UV254 absorbance, (1/m) per (mg/L), when the component absorbs. */
  uv254PerMgPerL?: number;
}

export interface FixedBedSpec {
  /** Empty-bed contact time, s. */
  ebctS: number;
  bedDepthM: number;
  /** Bed porosity ε (void fraction between grains); common practice 0.4 when unknown. */
  porosity: number;
  particleRadiusM: number;
  particleDensityKgPerM3: number;
  /** Water temperature for the film correlation, °C (default 12 °C, common practice). */
  temperatureC?: number;
  /** Factor on every film coefficient (a calibration parameter; default 1). */
  kfFactor?: number;
}

export interface FixedBedInput {
  components: readonly FixedBedComponent[];
  bed: FixedBedSpec;
}

/** Common-practice bed porosity of GAC filters when it is not measured. */
export const DEFAULT_BED_POROSITY = 0.4;

export interface ComponentFilm {
  id: string;
  kfMPerS: number;
  /** "given" or "Wilson & Geankoplis (1966)". */
  source: string;
  reynolds?: number;
  schmidt?: number;
  warning?: string;
}

function positive(v: number | undefined, path: string, what: string): void {
  if (v === undefined || !(v > 0) || !Number.isFinite(v)) throw new InputError(`expected ${what} > 0, got ${v === undefined ? 'nothing' : v}`, { path });
}

/** Validate the bed. */
export function checkBed(bed: FixedBedSpec): void {
  positive(bed.ebctS, 'bed.ebctS', 'an empty-bed contact time in s');
  positive(bed.bedDepthM, 'bed.bedDepthM', 'a bed depth in m');
  if (!(bed.porosity > 0 && bed.porosity < 1)) throw new InputError(`expected a bed porosity between 0 and 1, got ${bed.porosity}`, { path: 'bed.porosity' });
  if (bed.particleRadiusM === undefined) throw new InputError('missing the grain radius; expected carbon.particle_radius such as "0.5 mm"', { path: 'carbon.particle_radius' });
  positive(bed.particleRadiusM, 'carbon.particle_radius', 'a grain radius');
  if (bed.particleDensityKgPerM3 === undefined) throw new InputError('missing the grain density; expected carbon.particle_density such as "750 kg/m3"', { path: 'carbon.particle_density' });
  positive(bed.particleDensityKgPerM3, 'carbon.particle_density', 'a grain density');
  if (bed.kfFactor !== undefined) positive(bed.kfFactor, 'bed.kfFactor', 'a film-coefficient factor');
}

/** Validate the components: ids unique, c0 ≥ 0, adsorbable ones with Ds and kf or DL. */
export function checkComponents(components: readonly FixedBedComponent[]): void {
  if (components.length === 0) throw new InputError('expected at least one component', { path: 'components' });
  const ids = new Set<string>();
  components.forEach((c, i) => {
    const p = `components[${i}]`;
    if (ids.has(c.id)) throw new InputError(`duplicate id "${c.id}"`, { path: `${p}.id` });
    ids.add(c.id);
    if (!(c.c0MgPerL >= 0) || !Number.isFinite(c.c0MgPerL)) throw new InputError(`component "${c.id}": expected c0 ≥ 0 mg/L, got ${c.c0MgPerL}`, { path: `${p}.c0` });
    if (!(c.K >= 0) || !Number.isFinite(c.K)) throw new InputError(`component "${c.id}": expected K ≥ 0, got ${c.K}`, { path: `${p}.K` });
    if (c.K === 0) return;
    if (!(c.oneOverN > 0) || !Number.isFinite(c.oneOverN)) throw new InputError(`component "${c.id}": expected one_over_n > 0, got ${c.oneOverN}`, { path: `${p}.one_over_n` });
    if (c.dsM2PerS === undefined) throw new InputError(`component "${c.id}" has no surface diffusivity; expected Ds such as "1e-14 m2/s"`, { path: `${p}.Ds` });
    positive(c.dsM2PerS, `${p}.Ds`, `component "${c.id}": a surface diffusivity in m²/s`);
    if (c.kfMPerS !== undefined) positive(c.kfMPerS, `${p}.kf`, `component "${c.id}": a film coefficient in m/s`);
    else if (c.dlM2PerS === undefined) throw new InputError(`component "${c.id}" has neither kf nor DL; expected DL (liquid diffusivity, e.g. "7e-10 m2/s") or kf`, { path: `${p}.DL` });
    else positive(c.dlM2PerS, `${p}.DL`, `component "${c.id}": a liquid diffusivity in m²/s`);
  });
}

/** Film coefficient of every adsorbable component (times the bed's kfFactor). */
export function filmCoefficients(components: readonly FixedBedComponent[], bed: FixedBedSpec): ComponentFilm[] {
  const factor = bed.kfFactor ?? 1;
  const water = waterProperties(bed.temperatureC);
  const v = bed.bedDepthM / bed.ebctS; // superficial velocity L/EBCT, m/s
  return components.filter((c) => c.K > 0).map((c): ComponentFilm => {
    if (c.kfMPerS !== undefined) return { id: c.id, kfMPerS: c.kfMPerS * factor, source: 'given' };
    const f = wilsonGeankoplisKf({ superficialVelocityMPerS: v, particleRadiusM: bed.particleRadiusM, porosity: bed.porosity, dlM2PerS: c.dlM2PerS!, viscosityPaS: water.viscosityPaS, densityKgPerM3: water.densityKgPerM3 });
    const out: ComponentFilm = { id: c.id, kfMPerS: f.kfMPerS * factor, source: 'Wilson & Geankoplis (1966)', reynolds: f.reynolds, schmidt: f.schmidt };
    if (f.warning) out.warning = `${c.id}: ${f.warning}`;
    return out;
  });
}
