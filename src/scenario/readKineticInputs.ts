/**
 * Kinetic inputs of a mixture file (the kinetic keys of the mixture file): a `carbon` object
 * `{ "particle_radius": "10 um", "particle_density": "650 kg/m3" }` and per component `Ds`
 * (surface diffusivity), `DL` (liquid diffusivity) or `kf` (film coefficient), each a number in
 * the internal unit (m, kg/m³, m²/s, m/s) or a text with its unit. Read on top of `readMixture`;
 * which of them a result needs is checked where the result is asked for (prepareKinetics).
 * @throws InputError naming the JSON path and what was expected.
 */
import { InputError } from '../core/errors.js';
import type { CarbonParticle, KineticComponent } from '../kinetics/kineticMixture.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { atPath, isObject, readMixture } from './readMixture.js';

export interface KineticMixture {
  doseMgPerL?: number;
  components: KineticComponent[];
  /** The carbon particle, when the file gives one. */
  particle?: CarbonParticle;
}

/** Kinetic keys of a component, their unit kind and the internal field they fill. */
export const COMPONENT_KINETIC_KEYS = [
  { key: 'Ds', kind: 'diffusivity', field: 'dsM2PerS' },
  { key: 'DL', kind: 'diffusivity', field: 'dlM2PerS' },
  { key: 'kf', kind: 'velocity', field: 'kfMPerS' },
] as const;

/** Read the kinetic keys of one component object onto `comp` (internal units). */
export function readComponentKinetics(raw: unknown, comp: KineticComponent, path: string): KineticComponent {
  if (!isObject(raw)) return comp;
  const out: KineticComponent = { ...comp };
  for (const { key, kind, field } of COMPONENT_KINETIC_KEYS) {
    if (raw[key] === undefined) continue;
    out[field] = atPath(`${path}.${key}`, () => parseQuantity(raw[key], kind, { allowZero: false }));
  }
  return out;
}

/** Read `carbon: { particle_radius, particle_density }`. */
export function readCarbonParticle(raw: unknown, path = 'carbon'): CarbonParticle {
  if (!isObject(raw)) throw new InputError('expected an object { "particle_radius": "10 um", "particle_density": "650 kg/m3" }', { path });
  for (const k of Object.keys(raw)) {
    if (k !== 'particle_radius' && k !== 'particle_density') throw new InputError(`unknown key "${k}"; expected particle_radius and particle_density`, { path: `${path}.${k}` });
  }
  if (raw.particle_radius === undefined) throw new InputError('missing particle_radius; expected e.g. "10 um"', { path: `${path}.particle_radius` });
  if (raw.particle_density === undefined) throw new InputError('missing particle_density; expected e.g. "650 kg/m3"', { path: `${path}.particle_density` });
  return {
    radiusM: atPath(`${path}.particle_radius`, () => parseQuantity(raw.particle_radius, 'length', { allowZero: false })),
    densityGPerL: atPath(`${path}.particle_density`, () => parseQuantity(raw.particle_density, 'density', { allowZero: false })),
  };
}

/** A mixture object with its kinetic inputs. */
export function readKineticMixture(raw: unknown): KineticMixture {
  const base = readMixture(raw);
  const obj = raw as Record<string, unknown>;
  const rawComps = obj.components as unknown[];
  const components = base.components.map((c, i) => readComponentKinetics(rawComps[i], c, `components[${i}]`));
  const out: KineticMixture = { components };
  if (base.doseMgPerL !== undefined) out.doseMgPerL = base.doseMgPerL;
  if (obj.carbon !== undefined) out.particle = readCarbonParticle(obj.carbon);
  return out;
}
