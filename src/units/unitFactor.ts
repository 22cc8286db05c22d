/**
 * Conversion factors from a unit written by the user to the tool's internal unit of a kind.
 *
 * Internal units (one set for the whole core; DEVELOPERS.md, "How to add a model"):
 *   mass concentration and carbon dose: mg/L (= g/m³)
 *   loading (mass per carbon mass):     mg/g
 *   molar concentration:                mmol/L
 *   molar loading:                      mmol/g
 *   flow:                               m³/d
 *   kinetics (PAC and GAC models):      time s, length m, density kg/m³ (= g/L),
 *                                       diffusivity m²/s, velocity m/s
 *   specific carbon dose:               mg PAC per mg DOC is dimensionless and not handled here
 *
 * Common units are answered from a table of exact SI definitions (1 ng = 1e-9 g, 1 L = 1e-3 m³,
 * 1 d = 86 400 s), which keeps start-up fast; any other unit is parsed by mathjs (loaded lazily,
 * the general-purpose reference) and its factor rounded to 15 significant digits so that exact
 * decimal definitions stay exact. Tests check the table against mathjs.
 */
import { createRequire } from 'node:module';
import { InputError } from '../core/errors.js';

export type UnitKind =
  | 'massConcentration'
  | 'massLoading'
  | 'molarConcentration'
  | 'molarLoading'
  | 'flow'
  | 'time'
  | 'length'
  | 'density'
  | 'diffusivity'
  | 'velocity';

/** The internal unit of each unit kind (mg/L for concentrations and doses, …): every input is converted to it once. */
export const INTERNAL_UNIT: Record<UnitKind, string> = {
  massConcentration: 'mg/L',
  massLoading: 'mg/g',
  molarConcentration: 'mmol/L',
  molarLoading: 'mmol/g',
  flow: 'm^3/day',
  time: 's',
  length: 'm',
  density: 'kg/m^3',
  diffusivity: 'm^2/s',
  velocity: 'm/s',
};

const KIND_WORDS: Record<UnitKind, string> = {
  massConcentration: 'a mass concentration such as ng/L, ug/L, mg/L, g/L or g/m3',
  massLoading: 'a loading (mass per carbon mass) such as mg/g, ug/mg, ug/g or g/kg',
  molarConcentration: 'a molar concentration such as nmol/L, umol/L or mmol/L',
  molarLoading: 'a molar loading such as umol/g or mmol/g',
  flow: 'a flow such as m3/d, m3/h or L/s',
  time: 'a time such as 30 s, 15 min, 2 h or 3 d',
  length: 'a length such as 10 um, 1.2 mm or 2 m',
  density: 'a density such as 650 kg/m3 or 0.65 g/cm3',
  diffusivity: 'a diffusivity such as 2e-17 m2/s or 1e-5 cm2/s',
  velocity: 'a velocity such as 1e-5 m/s or 10 m/h',
};

/** Exact factors to the internal unit, keyed by the normalised unit text. */
const EXACT: Record<UnitKind, Record<string, number>> = {
  massConcentration: {
    'pg/L': 1e-9, 'ng/L': 1e-6, 'ug/L': 1e-3, 'mg/L': 1, 'g/L': 1e3, 'kg/L': 1e6,
    'ng/mL': 1e-3, 'ug/mL': 1, 'mg/mL': 1e3,
    'ng/m^3': 1e-9, 'ug/m^3': 1e-6, 'mg/m^3': 1e-3, 'g/m^3': 1, 'kg/m^3': 1e3,
  },
  massLoading: {
    'ng/mg': 1e-3, 'ug/mg': 1, 'mg/mg': 1e3, 'g/g': 1e3,
    'ng/g': 1e-6, 'ug/g': 1e-3, 'mg/g': 1, 'g/kg': 1, 'mg/kg': 1e-3, 'ug/kg': 1e-6, 'kg/kg': 1e3,
  },
  molarConcentration: {
    'pmol/L': 1e-9, 'nmol/L': 1e-6, 'umol/L': 1e-3, 'mmol/L': 1, 'mol/L': 1e3,
    'nM': 1e-6, 'uM': 1e-3, 'mM': 1, 'M': 1e3, 'mol/m^3': 1, 'mmol/m^3': 1e-3,
  },
  molarLoading: {
    'nmol/mg': 1e-3, 'umol/mg': 1, 'mmol/mg': 1e3,
    'nmol/g': 1e-6, 'umol/g': 1e-3, 'mmol/g': 1, 'mol/g': 1e3, 'mol/kg': 1, 'mmol/kg': 1e-3,
  },
  flow: {
    'm^3/day': 1, 'm^3/hour': 24, 'm^3/s': 86400, 'L/s': 86.4, 'L/day': 1e-3, 'L/hour': 0.024,
    'ML/day': 1000, 'L/min': 1.44, 'm^3/min': 1440, 'm^3/year': 1 / 365,
  },
  // SI definitions: 1 min = 60 s, 1 h = 3600 s, 1 d = 86 400 s; 1 um = 1e-6 m; 1 g/L = 1 kg/m³
  time: {
    's': 1, 'sec': 1, 'ms': 1e-3, 'min': 60, 'h': 3600, 'hr': 3600, 'hour': 3600, 'hours': 3600,
    'd': 86400, 'day': 86400, 'days': 86400,
  },
  length: { 'm': 1, 'cm': 1e-2, 'mm': 1e-3, 'um': 1e-6, 'nm': 1e-9 },
  density: { 'kg/m^3': 1, 'g/L': 1, 'kg/L': 1e3, 'g/cm^3': 1e3, 'g/mL': 1e3 },
  diffusivity: { 'm^2/s': 1, 'cm^2/s': 1e-4, 'mm^2/s': 1e-6, 'um^2/s': 1e-12 },
  velocity: { 'm/s': 1, 'cm/s': 1e-2, 'mm/s': 1e-3, 'm/hour': 1 / 3600, 'm/day': 1 / 86400 },
};

/** Normalise the ways engineers write units into one spelling. */
export function normaliseUnitText(text: string): string {
  let u = text.trim().replace(/\s+/g, '');
  u = u.replace(/[µμ]/g, 'u');
  u = u.replace(/³/g, '^3').replace(/²/g, '^2');
  u = u.replace(/\/l$/, '/L').replace(/^l\//, 'L/');
  u = u.replace(/m3\b/g, 'm^3').replace(/m\*\*3/g, 'm^3');
  u = u.replace(/m2\b/g, 'm^2').replace(/m\*\*2/g, 'm^2');
  u = u.replace(/\/(d|day|days)$/, '/day').replace(/\/(h|hr|hour|hours)$/, '/hour');
  u = u.replace(/\/(a|yr|year|years)$/, '/year');
  u = u.replace(/\/(sec|s)$/, '/s');
  return u;
}

type MathjsModule = typeof import('mathjs');
let mathjsCache: MathjsModule | undefined;
/** mathjs, loaded on first use (its single-file bundle loads in a third of the time). */
export function mathjs(): MathjsModule {
  if (!mathjsCache) {
    const require = createRequire(import.meta.url);
    mathjsCache = require('mathjs/lib/browser/math.js') as MathjsModule;
  }
  return mathjsCache;
}

/** Round to 15 significant digits: removes binary noise from products of exact decimals. */
export function roundSignificant15(x: number): number {
  if (x === 0 || !Number.isFinite(x)) return x;
  return Number(x.toPrecision(15));
}

/**
 * Factors already looked up, one map per kind keyed by the unit text as written (no key is
 * built per lookup: this sits on the path of every parsed quantity). Each starts with the
 * internal unit itself.
 */
const cache: Record<UnitKind, Map<string, number>> = {
  massConcentration: new Map([[INTERNAL_UNIT.massConcentration, 1]]),
  massLoading: new Map([[INTERNAL_UNIT.massLoading, 1]]),
  molarConcentration: new Map([[INTERNAL_UNIT.molarConcentration, 1]]),
  molarLoading: new Map([[INTERNAL_UNIT.molarLoading, 1]]),
  flow: new Map([[INTERNAL_UNIT.flow, 1]]),
  time: new Map([[INTERNAL_UNIT.time, 1]]),
  length: new Map([[INTERNAL_UNIT.length, 1]]),
  density: new Map([[INTERNAL_UNIT.density, 1]]),
  diffusivity: new Map([[INTERNAL_UNIT.diffusivity, 1]]),
  velocity: new Map([[INTERNAL_UNIT.velocity, 1]]),
};

/** Factor f such that value_in_unit · f = value in the internal unit of `kind`. */
export function unitFactor(unitText: string, kind: UnitKind): number {
  const kindCache = cache[kind];
  const hit = kindCache.get(unitText);
  if (hit !== undefined) return hit;
  const norm = normaliseUnitText(unitText);
  let factor = EXACT[kind][norm];
  if (factor === undefined) factor = mathjsFactor(norm, kind, unitText);
  kindCache.set(unitText, factor);
  return factor;
}

/** The factor as mathjs computes it (also used by the tests as the reference). */
export function mathjsFactor(norm: string, kind: UnitKind, original = norm): number {
  const m = mathjs();
  let unit;
  try {
    unit = m.unit(1, norm);
  } catch {
    throw new InputError(`unknown unit "${original}"; expected ${KIND_WORDS[kind]}`);
  }
  const target = m.unit(1, INTERNAL_UNIT[kind]);
  if (!unit.equalBase(target)) {
    throw new InputError(`unit "${original}" is not ${KIND_WORDS[kind]}`);
  }
  const f = roundSignificant15(unit.toNumber(INTERNAL_UNIT[kind]));
  if (!(f > 0) || !Number.isFinite(f)) {
    throw new InputError(`unit "${original}" cannot be used; expected ${KIND_WORDS[kind]}`);
  }
  return f;
}

/** Which of the given kinds a unit belongs to, or undefined. */
export function kindOfUnit(unitText: string, kinds: UnitKind[]): UnitKind | undefined {
  for (const k of kinds) {
    try {
      unitFactor(unitText, k);
      return k;
    } catch {
      /* try the next kind */
    }
  }
  return undefined;
}

/** The unit kind in words, for messages ("a mass concentration such as mg/L"). */
export function describeKind(kind: UnitKind): string {
  return KIND_WORDS[kind];
}
