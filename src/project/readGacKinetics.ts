/**
 * The "kinetics" entry of a GAC carbon in a project file: what the fixed-bed model needs for the
 * whole job (bed depth, porosity, grain radius and density, filters in parallel, the water
 * temperature, and the diffusivities of the fictive DOC components and of every compound).
 *
 *   {
 *     "bed_depth": "2.5 m", "porosity": 0.4, "particle_radius": "0.5 mm",
 *     "particle_density": "750 kg/m3", "filters": 4, "temperature_c": 12,
 *     "doc_Ds": "2e-15 m2/s", "doc_DL": "5e-10 m2/s",
 *     "Ds": { "CBZ": "5e-15 m2/s", … }, "DL": { "CBZ": "7e-10 m2/s", … }, "kf": { … }
 *   }
 *
 * Each diffusivity is a number in m²/s or a text with its unit; lengths in m, density in kg/m³.
 * Defaults: porosity 0.4 (DEFAULT_BED_POROSITY, common practice), grain density = bed density/(1 − ε)
 * (ρ_bed = ρp·(1 − ε), the bed as a packing of grains), 1 filter, 12 °C (common practice). A given grain
 * density must agree with the bed density and porosity within 2 %. Every compound needs its Ds
 * (unless a column test under "column_tests" supplies it, src/project/readColumnTests.ts) and DL
 * or kf; the DOC components need doc_Ds and doc_DL or doc_kf.
 * @throws InputError naming the JSON path (carbons[i].kinetics.Ds.CBZ, …) and what was expected
 */
import { InputError } from '../core/errors.js';
import { DEFAULT_BED_POROSITY } from '../kinetics/fixedBedInput.js';
import { DEFAULT_WATER_TEMPERATURE_C } from '../kinetics/waterProperties.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { at, expectNumber, expectObject, join, onlyKeys } from '../scenario/jsonChecks.js';
import type { CompoundSpec } from './projectTypes.js';
import { readColumnTests, type ColumnTestsSpec } from './readColumnTests.js';

/** Diffusivities and film coefficient of one component (m²/s, m/s); DL or kf is set. */
export interface ComponentKinetics {
  dsM2PerS: number;
  dlM2PerS?: number;
  kfMPerS?: number;
}

/** A compound's kinetics: Ds absent only while a column test is still to supply it (columnCalibrationStep). */
export type TargetKinetics = Omit<ComponentKinetics, 'dsM2PerS'> & { dsM2PerS?: number };

export interface GacKineticsSpec {
  bedDepthM: number;
  porosity: number;
  particleRadiusM: number;
  /** Grain (particle) density, kg/m³ (= bed density/(1 − ε) unless given). */
  particleDensityKgPerM3: number;
  filters: number;
  temperatureC: number;
  /** Shared by every fictive DOC component. */
  doc: ComponentKinetics;
  /** By compound id (every compound of the project); Ds may be absent only for a compound with a column test (its fit supplies it). */
  compounds: Record<string, TargetKinetics>;
  /** Column tests whose fits replace the Ds of targets (readColumnTests.ts). */
  columnTests?: ColumnTestsSpec;
}

const KEYS = ['bed_depth', 'porosity', 'particle_radius', 'particle_density', 'filters', 'temperature_c', 'doc_Ds', 'doc_DL', 'doc_kf', 'Ds', 'DL', 'kf', 'column_tests', 'note'];

function quantity(v: unknown, path: string, kind: 'length' | 'density' | 'diffusivity' | 'velocity'): number {
  return at(path, () => parseQuantity(v, kind, { allowZero: false }));
}

function film(o: Record<string, unknown>, dlKey: string, kfKey: string, path: string, what: string): { dlM2PerS: number } | { kfMPerS: number } {
  if (o[kfKey] !== undefined) return { kfMPerS: quantity(o[kfKey], join(path, kfKey), 'velocity') };
  if (o[dlKey] === undefined) throw new InputError(`missing the liquid diffusivity of ${what}; expected e.g. "7e-10 m2/s" (or a film coefficient kf)`, { path: join(path, dlKey) });
  return { dlM2PerS: quantity(o[dlKey], join(path, dlKey), 'diffusivity') };
}

function byId(o: Record<string, unknown>, key: string, path: string, compounds: readonly CompoundSpec[]): Record<string, unknown> {
  if (o[key] === undefined) return {};
  const m = expectObject(o[key], join(path, key), `an object by compound id, e.g. { "${compounds[0]?.id ?? 'CBZ'}": "5e-15 m2/s" }`);
  for (const id of Object.keys(m)) if (!compounds.some((c) => c.id === id)) throw new InputError(`"${id}" is not a compound id; expected one of ${compounds.map((c) => `"${c.id}"`).join(', ')}`, { path: join(join(path, key), id) });
  return m;
}

/** Read `carbons[i].kinetics` of a GAC carbon with bed density `bedDensityKgPerM3`. */
export function readGacKinetics(raw: unknown, path: string, bedDensityKgPerM3: number, compounds: readonly CompoundSpec[]): GacKineticsSpec {
  const o = expectObject(raw, path, 'the fixed-bed inputs { bed_depth, particle_radius, doc_Ds, doc_DL, Ds, DL, … }');
  onlyKeys(o, KEYS, path);
  const need = (key: string, example: string) => {
    if (o[key] === undefined) throw new InputError(`missing "${key}"; the GAC fixed-bed model needs it, e.g. ${example}`, { path: join(path, key) });
    return o[key];
  };
  const porosity = o.porosity === undefined ? DEFAULT_BED_POROSITY : expectNumber(o.porosity, join(path, 'porosity'), 'a bed porosity between 0 and 1', (x) => x > 0 && x < 1);
  const fromBed = bedDensityKgPerM3 / (1 - porosity); // ρ_bed = ρp·(1 − ε)
  let particleDensityKgPerM3 = fromBed;
  if (o.particle_density !== undefined) {
    particleDensityKgPerM3 = quantity(o.particle_density, join(path, 'particle_density'), 'density');
    if (Math.abs(particleDensityKgPerM3 - fromBed) > 0.02 * fromBed) throw new InputError(`the grain density ${particleDensityKgPerM3} kg/m³ disagrees with the bed density and porosity (${bedDensityKgPerM3}/(1 − ${porosity}) = ${fromBed.toPrecision(4)} kg/m³); give consistent values or leave particle_density out`, { path: join(path, 'particle_density') });
  }
  const ds = byId(o, 'Ds', path, compounds), dl = byId(o, 'DL', path, compounds), kf = byId(o, 'kf', path, compounds);
  const particleRadiusM = quantity(need('particle_radius', '"0.5 mm"'), join(path, 'particle_radius'), 'length');
  const columnTests = o.column_tests === undefined ? undefined : readColumnTests(o.column_tests, join(path, 'column_tests'), compounds.map((c) => c.id), particleRadiusM);
  const perCompound: Record<string, TargetKinetics> = {};
  for (const c of compounds) {
    const tested = columnTests?.ds[c.id] !== undefined;
    if (ds[c.id] === undefined && !tested) throw new InputError(`missing the surface diffusivity of "${c.id}"; expected e.g. "5e-15 m2/s" (or a column test under "column_tests")`, { path: join(join(path, 'Ds'), c.id) });
    const k: TargetKinetics = ds[c.id] === undefined ? {} : { dsM2PerS: quantity(ds[c.id], join(join(path, 'Ds'), c.id), 'diffusivity') };
    if (kf[c.id] !== undefined) k.kfMPerS = quantity(kf[c.id], join(join(path, 'kf'), c.id), 'velocity');
    else if (dl[c.id] !== undefined) k.dlM2PerS = quantity(dl[c.id], join(join(path, 'DL'), c.id), 'diffusivity');
    else throw new InputError(`missing the liquid diffusivity of "${c.id}"; expected e.g. "7e-10 m2/s" (or a film coefficient under "kf")`, { path: join(join(path, 'DL'), c.id) });
    perCompound[c.id] = k;
  }
  return {
    bedDepthM: quantity(need('bed_depth', '"2.5 m"'), join(path, 'bed_depth'), 'length'),
    porosity,
    particleRadiusM,
    particleDensityKgPerM3,
    filters: o.filters === undefined ? 1 : expectNumber(o.filters, join(path, 'filters'), 'a whole number of filters in parallel (1–100)', (x) => Number.isInteger(x) && x >= 1 && x <= 100),
    temperatureC: o.temperature_c === undefined ? DEFAULT_WATER_TEMPERATURE_C : expectNumber(o.temperature_c, join(path, 'temperature_c'), 'a water temperature in °C between 0 and 40', (x) => x >= 0 && x <= 40),
    doc: { dsM2PerS: quantity(need('doc_Ds', '"2e-15 m2/s"'), join(path, 'doc_Ds'), 'diffusivity'), ...film(o, 'doc_DL', 'doc_kf', path, 'the DOC components') },
    compounds: perCompound,
    ...(columnTests ? { columnTests } : {}),
  };
}
