/**
 * The kinetic data of a PAC carbon in a project file, `carbons[i].kinetics`:
 *   { "particle_radius": "10 um", "particle_density": "650 kg/m3",
 *     "Ds": { "CBZ": "2e-17 m2/s" }, "DL": { "CBZ": "7e-10 m2/s" },
 *     "doc_Ds": "5e-18 m2/s", "doc_DL": "5e-10 m2/s" }
 * Ds and DL per target compound (surface and liquid diffusivity; the film coefficient of a fine
 * particle follows from Sh = 2, kf = DL/R, common practice), and one Ds and DL shared by the
 * background competitors (the fictive DOC components, or the EBC). A bare number is in the
 * internal unit (m, kg/m³, m²/s). Missing quantities are allowed here; `checkKineticInputs` names
 * them when the plant's contact conditions ask for a kinetic result.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { parseQuantity } from '../units/parseQuantity.js';
import type { UnitKind } from '../units/unitFactor.js';
import { at, describeValue, expectObject, join, onlyKeys } from '../scenario/jsonChecks.js';
import { readKineticTests, type KineticTestsSpec } from './readKineticTests.js';

/** Kinetic data of one PAC carbon (internal units: m, g/L, m²/s). */
export interface CarbonKinetics {
  particleRadiusM?: number;
  particleDensityGPerL?: number;
  /** Surface diffusivity per compound id, m²/s. */
  dsM2PerS: Record<string, number>;
  /** Liquid diffusivity per compound id, m²/s. */
  dlM2PerS: Record<string, number>;
  /** Surface diffusivity shared by the background competitors, m²/s. */
  docDsM2PerS?: number;
  /** Liquid diffusivity shared by the background competitors, m²/s. */
  docDlM2PerS?: number;
  /** Kinetic jar tests whose fits replace Ds of targets and doc_Ds (readKineticTests.ts). */
  tests?: KineticTestsSpec;
}

function positiveQuantity(v: unknown, kind: UnitKind, path: string, example: string): number {
  const x = at(path, () => parseQuantity(v, kind));
  if (!(x > 0) || !Number.isFinite(x)) throw new InputError(`expected a positive value such as "${example}", got ${describeValue(v)}`, { path });
  return x;
}

function perCompound(raw: unknown, path: string, compoundIds: readonly string[], example: string): Record<string, number> {
  const o = expectObject(raw, path, `values by compound id, e.g. { "${compoundIds[0] ?? 'CBZ'}": "${example}" }`);
  const out: Record<string, number> = {};
  for (const [id, v] of Object.entries(o)) {
    if (!compoundIds.includes(id)) throw new InputError(`"${id}" is not a compound id; expected one of ${compoundIds.map((x) => `"${x}"`).join(', ')}`, { path: join(path, id) });
    out[id] = positiveQuantity(v, 'diffusivity', join(path, id), example);
  }
  return out;
}

/** Read `carbons[i].kinetics`. */
export function readCarbonKinetics(raw: unknown, path: string, compoundIds: readonly string[]): CarbonKinetics {
  const o = expectObject(raw, path, 'the carbon\'s kinetic data { "particle_radius", "particle_density", "Ds", "DL", "doc_Ds", "doc_DL" }');
  onlyKeys(o, ['particle_radius', 'particle_density', 'Ds', 'DL', 'doc_Ds', 'doc_DL', 'kinetic_tests', 'note'], path);
  const k: CarbonKinetics = { dsM2PerS: {}, dlM2PerS: {} };
  if (o.particle_radius !== undefined) k.particleRadiusM = positiveQuantity(o.particle_radius, 'length', `${path}.particle_radius`, '10 um');
  if (o.particle_density !== undefined) k.particleDensityGPerL = positiveQuantity(o.particle_density, 'density', `${path}.particle_density`, '650 kg/m3');
  if (o.Ds !== undefined) k.dsM2PerS = perCompound(o.Ds, `${path}.Ds`, compoundIds, '2e-17 m2/s');
  if (o.DL !== undefined) k.dlM2PerS = perCompound(o.DL, `${path}.DL`, compoundIds, '7e-10 m2/s');
  if (o.doc_Ds !== undefined) k.docDsM2PerS = positiveQuantity(o.doc_Ds, 'diffusivity', `${path}.doc_Ds`, '5e-18 m2/s');
  if (o.doc_DL !== undefined) k.docDlM2PerS = positiveQuantity(o.doc_DL, 'diffusivity', `${path}.doc_DL`, '5e-10 m2/s');
  if (o.kinetic_tests !== undefined) k.tests = readKineticTests(o.kinetic_tests, `${path}.kinetic_tests`, compoundIds);
  return k;
}
