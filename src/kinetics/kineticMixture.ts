/**
 * A mixture prepared for the PAC kinetic models: Freundlich components with their surface
 * diffusivity Ds and film coefficient kf, the carbon particle, and the split of the adsorbable
 * components into the coupled background and trace targets.
 *
 * Film coefficient of a fine suspended particle: Sh = kf·2R/DL = 2, so kf = DL/R (common
 * practice for PAC in stirred water; the Sherwood number of a sphere in a stagnant liquid) unless
 * kf is given.
 *
 * Trace split (the trace argument of Knappe et al. 1998, Environ. Sci. Technol. 32:1694, carried
 * to kinetics): an adsorbable component whose c0 is at most `traceRatio` (default 1e-3) of the
 * adsorbable total is a trace target: its loading is left out of ψ and Q at the surface, so it
 * does not disturb the background and its fraction removed does not depend on its own c0. With
 * `traceRatio` 0 every component is coupled (full IAST at the surface).
 *
 * Units: c0 mg/L, K (mg/g)/(mg/L)^β, Ds m²/s, DL m²/s, kf m/s, R m, ρp g/L (= kg/m³).
 * @throws InputError naming the component and field when a kinetic quantity is missing or invalid.
 */
import { InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';

/** A Freundlich component with its kinetic quantities (internal units). */
export interface KineticComponent extends FreundlichComponent {
  /** Surface diffusivity, m²/s (needed when K > 0). */
  dsM2PerS?: number;
  /** Liquid diffusivity, m²/s (gives kf = DL/R when kf is not given). */
  dlM2PerS?: number;
  /** Film coefficient, m/s (overrides the Sh = 2 rule). */
  kfMPerS?: number;
}

/** The carbon particle (internal units). */
export interface CarbonParticle {
  /** Particle radius, m. */
  radiusM: number;
  /** Apparent particle density, g/L (= kg/m³). */
  densityGPerL: number;
}

/** Default trace ratio: c0 at most 1e-3 of the adsorbable total makes a trace target (ours). */
export const DEFAULT_TRACE_RATIO = 1e-3;

export interface PreparedKinetics {
  readonly components: readonly KineticComponent[];
  readonly particle: CarbonParticle;
  /** Indices (into components) of the coupled adsorbable components with c0 > 0. */
  readonly coupled: readonly number[];
  /** Indices of the trace targets (adsorbable, c0 > 0, c0 ≤ traceRatio·total). */
  readonly trace: readonly number[];
  /** Film coefficient of every component, m/s (0 for components that need none). */
  readonly kfMPerS: Float64Array;
}

/** Film coefficient from Sh = 2: kf = DL/R (common practice for fine suspended particles). */
export function filmCoefficientSh2(dlM2PerS: number, radiusM: number): number {
  return dlM2PerS / radiusM;
}

function positive(v: number | undefined): v is number {
  return v !== undefined && Number.isFinite(v) && v > 0;
}

/** Check the kinetic inputs and split the components. */
export function prepareKinetics(components: readonly KineticComponent[], particle: CarbonParticle | undefined, options: { traceRatio?: number } = {}): PreparedKinetics {
  if (!particle) throw new InputError('missing the carbon particle: give "carbon": { "particle_radius": "10 um", "particle_density": "650 kg/m3" }', { path: 'carbon' });
  if (!positive(particle.radiusM)) throw new InputError(`expected a positive particle radius, got ${particle.radiusM}`, { path: 'carbon.particle_radius' });
  if (!positive(particle.densityGPerL)) throw new InputError(`expected a positive particle density, got ${particle.densityGPerL}`, { path: 'carbon.particle_density' });
  const traceRatio = options.traceRatio ?? DEFAULT_TRACE_RATIO;
  const kf = new Float64Array(components.length);
  let total = 0;
  components.forEach((c, i) => {
    const path = `components[${i}]`;
    if (!(c.c0MgPerL >= 0) || !Number.isFinite(c.c0MgPerL)) throw new InputError(`component "${c.id}": expected a non-negative finite c0, got ${c.c0MgPerL}`, { path: `${path}.c0` });
    if (!(c.K > 0)) return;
    if (c.dsM2PerS === undefined) throw new InputError(`component "${c.id}" has no surface diffusivity Ds; a kinetic result needs it (e.g. "Ds": "2e-17 m2/s")`, { path: `${path}.Ds` });
    if (!positive(c.dsM2PerS)) throw new InputError(`component "${c.id}": expected a positive surface diffusivity Ds, got ${c.dsM2PerS}`, { path: `${path}.Ds` });
    if (c.kfMPerS !== undefined) {
      if (!positive(c.kfMPerS)) throw new InputError(`component "${c.id}": expected a positive film coefficient kf, got ${c.kfMPerS}`, { path: `${path}.kf` });
      kf[i] = c.kfMPerS;
    } else if (c.dlM2PerS !== undefined) {
      if (!positive(c.dlM2PerS)) throw new InputError(`component "${c.id}": expected a positive liquid diffusivity DL, got ${c.dlM2PerS}`, { path: `${path}.DL` });
      kf[i] = filmCoefficientSh2(c.dlM2PerS, particle.radiusM); // Sh = 2, common practice
    } else {
      throw new InputError(`component "${c.id}" has neither a liquid diffusivity DL nor a film coefficient kf; a kinetic result needs one (e.g. "DL": "1e-9 m2/s")`, { path: `${path}.DL` });
    }
    total += c.c0MgPerL;
  });
  const coupled: number[] = [];
  const trace: number[] = [];
  components.forEach((c, i) => {
    if (!(c.K > 0) || !(c.c0MgPerL > 0)) return;
    if (traceRatio > 0 && c.c0MgPerL <= traceRatio * total) trace.push(i);
    else coupled.push(i);
  });
  return { components, particle, coupled, trace, kfMPerS: kf };
}
