/**
 * The "carbons" entry of a project file: candidate carbons with price, an optional K factor on
 * the reference carbon's K and per-compound isotherms; GAC also bed density and EBCT.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { readComponent } from '../scenario/readMixture.js';
import { expectArray, expectNumber, expectObject, expectString, join, onlyKeys, required, describeValue } from '../scenario/jsonChecks.js';
import { readCarbonKinetics } from './readCarbonKinetics.js';
import type { CarbonIsotherm, CarbonSpec, CompoundSpec } from './projectTypes.js';
import { readGacKinetics } from './readGacKinetics.js';
import { readCarbonBackground } from './readCarbonBackground.js';

export function readCarbons(raw: unknown, compounds: CompoundSpec[]): CarbonSpec[] {
  const arr = expectArray(raw, 'carbons', 'an array of candidate carbons', 1);
  const names = new Set<string>();
  return arr.map((c, i) => {
    const p = `carbons[${i}]`;
    const o = expectObject(c, p, 'a carbon { name, type, price_per_kg, currency }');
    onlyKeys(o, ['name', 'note', 'type', 'price_per_kg', 'currency', 'K_factor', 'isotherms', 'bed_density_kg_per_m3', 'ebct_min', 'kinetics', 'background'], p);
    const name = expectString(required(o, 'name', p, 'the carbon name as text'), `${p}.name`, 'the carbon name as text');
    if (names.has(name)) throw new InputError(`duplicate carbon name "${name}"; every carbon needs its own name`, { path: `${p}.name` });
    names.add(name);
    const type = required(o, 'type', p, '"PAC" or "GAC"');
    if (type !== 'PAC' && type !== 'GAC') throw new InputError(`expected "PAC" or "GAC", got ${describeValue(type)}`, { path: `${p}.type` });
    const spec: CarbonSpec = {
      name,
      type,
      pricePerKg: expectNumber(required(o, 'price_per_kg', p, 'the carbon price per kg as a number'), `${p}.price_per_kg`, 'a price per kg ≥ 0 as a number', (x) => x >= 0),
      currency: expectString(required(o, 'currency', p, 'the currency as text, e.g. "EUR"'), `${p}.currency`, 'the currency as text, e.g. "EUR"'),
      kFactor: o.K_factor === undefined ? 1 : expectNumber(o.K_factor, `${p}.K_factor`, 'a positive factor on the reference K', (x) => x > 0),
      isotherms: {},
    };
    if (o.isotherms !== undefined) {
      const ip = `${p}.isotherms`;
      const iso = expectObject(o.isotherms, ip, 'per-compound isotherms by compound id, e.g. { "CBZ": { "K": 200, "one_over_n": 0.3 } }');
      for (const [id, val] of Object.entries(iso)) {
        const cp = join(ip, id);
        const comp = compounds.find((x) => x.id === id);
        if (!comp) throw new InputError(`"${id}" is not a compound id; expected one of ${compounds.map((x) => `"${x.id}"`).join(', ')}`, { path: cp });
        const v = expectObject(val, cp, 'an isotherm { K, one_over_n, K_unit }');
        onlyKeys(v, ['K', 'one_over_n', 'K_unit', 'note'], cp);
        const r = readComponent({ ...v, id, molar_mass: comp.molarMassGPerMol }, cp, false);
        if (!(r.K > 0)) throw new InputError('expected K > 0', { path: `${cp}.K` });
        spec.isotherms[id] = { K: r.K, oneOverN: r.oneOverN } satisfies CarbonIsotherm;
      }
    }
    if (o.background !== undefined) spec.background = readCarbonBackground(o.background, `${p}.background`);
    if (o.bed_density_kg_per_m3 !== undefined) spec.bedDensityKgPerM3 = expectNumber(o.bed_density_kg_per_m3, `${p}.bed_density_kg_per_m3`, 'a positive bed density in kg/m³', (x) => x > 0);
    if (o.ebct_min !== undefined) spec.ebctMin = expectNumber(o.ebct_min, `${p}.ebct_min`, 'a positive empty-bed contact time in minutes', (x) => x > 0);
    if (type === 'GAC') {
      if (spec.bedDensityKgPerM3 === undefined) throw new InputError('missing "bed_density_kg_per_m3"; a GAC carbon needs its bed density in kg/m³', { path: `${p}.bed_density_kg_per_m3` });
      if (spec.ebctMin === undefined) throw new InputError('missing "ebct_min"; a GAC carbon needs its empty-bed contact time in minutes', { path: `${p}.ebct_min` });
      // a GAC carbon's "kinetics" are its fixed-bed inputs; a PAC carbon's are its particle data
      if (o.kinetics !== undefined) spec.bedKinetics = readGacKinetics(o.kinetics, `${p}.kinetics`, spec.bedDensityKgPerM3, compounds);
    } else if (o.kinetics !== undefined) {
      spec.kinetics = readCarbonKinetics(o.kinetics, `${p}.kinetics`, compounds.map((x) => x.id));
    }
    return spec;
  });
}

