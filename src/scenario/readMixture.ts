/**
 * Read a mixture object (the parsed JSON of a mixture file, see the README) into
 * internal units, with errors that name the JSON path.
 *
 *   { "dose": "20 mg/L", "components": [ { "id", "c0", "K", "one_over_n", "K_unit": {"q","c"},
 *     "molar_mass" } ] }
 *
 * A bare number is in the key's default unit (mg/L for c0 and dose; K_unit defaults to mg/g and
 * mg/L). K = 0 marks a non-adsorbable component (no exponent needed).
 */
import { InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { freundlichKToInternal, type KUnit } from '../units/freundlichK.js';
import { kindOfUnit } from '../units/unitFactor.js';
import { onlyKeys } from './jsonChecks.js';
import { cleanName } from '../text/cleanText.js';
import { componentWarnings, doseWarnings } from './plausibility.js';
import { COMPONENT_KEYS, K_UNIT_KEYS, MIXTURE_CARBON_KEYS, MIXTURE_KEYS } from './mixtureKeys.js';

export interface MixtureInput {
  dose?: string | number;
  components: ComponentInput[];
}

export interface ComponentInput {
  id: string;
  c0?: string | number;
  K: number;
  one_over_n?: number;
  K_unit?: KUnit;
  molar_mass?: number;
}

export interface ParsedMixture {
  /** Dose from the file, mg/L, if given. */
  doseMgPerL?: number;
  components: FreundlichComponent[];
  /** Plausibility warnings (exponent above 1, a dose far above common practice). */
  warnings?: string[];
}

export function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Wrap a parse step so that an InputError gains the JSON path. */
export function atPath<T>(path: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError) throw e.at({ path });
    throw e;
  }
}

/** Concentration in mg/L from "100 ng/L", "0.5 umol/L" (needs molar mass) or a bare number in mg/L. */
export function parseConcentration(value: unknown, molarMassGPerMol?: number): number {
  if (typeof value === 'string') {
    const unit = value.replace(/^\s*[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s*/, '');
    if (unit && kindOfUnit(unit, ['massConcentration']) === undefined && kindOfUnit(unit, ['molarConcentration'])) {
      if (!(molarMassGPerMol && molarMassGPerMol > 0)) throw new InputError(`"${value}" is a molar concentration: give molar_mass in g/mol`);
      return parseQuantity(value, 'molarConcentration') * molarMassGPerMol;
    }
  }
  return parseQuantity(value, 'massConcentration');
}

/** Dose in mg/L from "20 mg/L", "20 g/m3", "0.02 g/L" or a bare number in mg/L. */
export function parseDose(value: unknown): number {
  return parseQuantity(value, 'massConcentration');
}

/**
 * Read one Freundlich compound (no c0 required when `needC0` is false). The caller checks the
 * object's keys (mixture components, compound files and project compounds allow different ones).
 */
export function readComponent(raw: unknown, rootPath: string, needC0: boolean): FreundlichComponent {
  if (!isObject(raw)) throw new InputError('expected an object with id, K and one_over_n', { path: rootPath });
  const path = rootPath === '$' ? '' : rootPath;
  const sub = (key: string) => (path === '' ? key : `${path}.${key}`);
  const id = typeof raw.id === 'string' ? cleanName(raw.id) : raw.id;
  if (typeof id !== 'string' || id.trim() === '') throw new InputError('expected a non-empty text id', { path: sub('id') });
  const molarMass = raw.molar_mass;
  if (molarMass !== undefined && (typeof molarMass !== 'number' || !(molarMass > 0) || !Number.isFinite(molarMass))) {
    throw new InputError(`expected molar_mass as a positive number in g/mol, got ${JSON.stringify(molarMass)}`, { path: sub('molar_mass') });
  }
  let c0 = 0;
  if (raw.c0 === undefined) {
    if (needC0) throw new InputError('missing c0; expected an initial concentration such as "100 ng/L"', { path: sub('c0') });
  } else {
    // a bare number is already mg/L (what parseConcentration returns for it); paths only on error
    c0 = typeof raw.c0 === 'number' && raw.c0 > 0 && Number.isFinite(raw.c0) ? raw.c0 : atPath(sub('c0'), () => parseConcentration(raw.c0, molarMass as number | undefined));
  }
  const K = raw.K;
  if (K === undefined) throw new InputError('missing K; expected the Freundlich K as a number (0 = non-adsorbable)', { path: sub('K') });
  if (typeof K !== 'number' || !Number.isFinite(K)) throw new InputError(`expected K as a number, got ${JSON.stringify(K)}`, { path: sub('K') });
  if (K < 0) throw new InputError(`expected K ≥ 0 (0 = non-adsorbable), got ${K}`, { path: sub('K') });
  const exp = raw.one_over_n;
  if (K === 0) return { id, c0MgPerL: c0, K: 0, oneOverN: typeof exp === 'number' && exp > 0 ? exp : 1 };
  if (exp === undefined) throw new InputError('missing one_over_n; expected the Freundlich exponent 1/n (> 0)', { path: sub('one_over_n') });
  if (typeof exp !== 'number' || !Number.isFinite(exp)) throw new InputError(`expected one_over_n as a number, got ${JSON.stringify(exp)}`, { path: sub('one_over_n') });
  if (!(exp > 0)) throw new InputError(`expected one_over_n > 0, got ${exp}`, { path: sub('one_over_n') });
  let kUnit: KUnit = {};
  if (raw.K_unit !== undefined) {
    if (!isObject(raw.K_unit)) throw new InputError('expected K_unit as an object { "q": "mg/g", "c": "mg/L" }', { path: sub('K_unit') });
    onlyKeys(raw.K_unit, K_UNIT_KEYS, sub('K_unit'));
    for (const key of ['q', 'c'] as const) {
      const v = raw.K_unit[key];
      if (v !== undefined && typeof v !== 'string') throw new InputError(`expected a unit text such as "${key === 'q' ? 'mg/g' : 'mg/L'}"`, { path: sub(`K_unit.${key}`) });
    }
    kUnit = { q: raw.K_unit.q as string | undefined, c: raw.K_unit.c as string | undefined };
  }
  // no K_unit: K is already in (mg/g)/(mg/L)^(1/n), the internal unit (factor 1)
  const Kint = raw.K_unit === undefined ? K : atPath(sub('K_unit'), () => freundlichKToInternal(K, exp, kUnit, molarMass as number | undefined));
  return { id, c0MgPerL: c0, K: Kint, oneOverN: exp };
}

/** Read a compound file (`calibrate --compound`): one component, c0 optional. @throws InputError naming the JSON path. */
export function readCompoundFile(raw: unknown): FreundlichComponent {
  if (isObject(raw)) onlyKeys(raw, COMPONENT_KEYS, '$');
  return readComponent(raw, '$', false);
}

/** Read a mixture object. @throws InputError naming the JSON path. */
export function readMixture(raw: unknown): ParsedMixture {
  if (!isObject(raw)) throw new InputError('expected a JSON object with "components"', { path: '$' });
  onlyKeys(raw, MIXTURE_KEYS, '$');
  if (raw.carbon !== undefined) {
    if (!isObject(raw.carbon)) throw new InputError('expected "carbon" as an object { "particle_radius", "particle_density" }', { path: 'carbon' });
    onlyKeys(raw.carbon, MIXTURE_CARBON_KEYS, 'carbon');
  }
  const comps = raw.components;
  if (!Array.isArray(comps)) throw new InputError('expected "components" as an array', { path: 'components' });
  if (comps.length === 0) throw new InputError('expected at least one component; the mixture is empty', { path: 'components' });
  const components = comps.map((c, i) => {
    if (isObject(c)) onlyKeys(c, COMPONENT_KEYS, `components[${i}]`);
    return readComponent(c, `components[${i}]`, true);
  });
  const ids = new Set<string>();
  components.forEach((c, i) => {
    if (ids.has(c.id)) throw new InputError(`duplicate id "${c.id}"; every component needs its own id`, { path: `components[${i}].id` });
    ids.add(c.id);
  });
  const out: ParsedMixture = { components };
  if (raw.dose !== undefined) out.doseMgPerL = atPath('dose', () => parseDose(raw.dose));
  const warnings = [...componentWarnings(components), ...(out.doseMgPerL !== undefined ? doseWarnings(out.doseMgPerL, 'the dose in the mixture file') : [])];
  if (warnings.length) out.warnings = warnings;
  return out;
}

