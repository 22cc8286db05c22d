/**
 * The plant's PAC contact conditions in a project file, `site.pac_contact`:
 *   - `"equilibrium"` (the default): every dose is the batch IAST equilibrium dose, as if the
 *     carbon stayed in the water for days;
 *   - `{ "contact_time": "30 min", "carbon_age": "3 d" }`: a stirred contact tank with water
 *     residence τ (contact_time) and mean carbon age θ ≥ τ (carbon_age; θ = τ, no recirculation,
 *     when omitted); `"reactor": "plug-flow"` instead makes every particle stay the contact time
 *     (a plug-flow tank or a jar test; no carbon age).
 * Times are a number in s or a text with a unit. Units out: s.
 * @throws InputError naming the JSON path (e.g. `site.pac_contact.carbon_age`) and what was expected
 */
import { InputError } from '../core/errors.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { at, describeValue, expectObject, onlyKeys, required } from '../scenario/jsonChecks.js';

/**
 * The kinetic contact conditions (`undefined` is equilibrium, today's behaviour); the same shape
 * as `ContactConditions` of src/kinetics/contactRemoval.ts (scenario code does not import kinetics).
 */
export type PacContactSpec =
  | { kind: 'plug-flow'; contactTimeS: number }
  | { kind: 'stirred'; contactTimeS: number; carbonAgeS: number };

const WHAT = '"equilibrium" or the contact conditions { "contact_time": "30 min", "carbon_age": "3 d" }';

function positiveTime(v: unknown, path: string, what: string): number {
  const s = at(path, () => parseQuantity(v, 'time'));
  if (!(s > 0) || !Number.isFinite(s)) throw new InputError(`expected ${what}, got ${describeValue(v)}`, { path });
  return s;
}

/** Read `site.pac_contact`; `undefined` means equilibrium. */
export function readPacContact(raw: unknown, path = 'site.pac_contact'): PacContactSpec | undefined {
  if (raw === 'equilibrium') return undefined;
  if (typeof raw === 'string') throw new InputError(`expected ${WHAT}, got ${describeValue(raw)}`, { path });
  const o = expectObject(raw, path, WHAT);
  onlyKeys(o, ['contact_time', 'carbon_age', 'reactor', 'note'], path);
  const contactTimeS = positiveTime(required(o, 'contact_time', path, 'the contact time such as "30 min"'), `${path}.contact_time`, 'a positive contact time such as "30 min"');
  const reactor = o.reactor ?? 'stirred';
  if (reactor !== 'stirred' && reactor !== 'plug-flow') throw new InputError(`expected "stirred" or "plug-flow", got ${describeValue(reactor)}`, { path: `${path}.reactor` });
  if (reactor === 'plug-flow') {
    if (o.carbon_age !== undefined) throw new InputError('a plug-flow contact keeps every particle for the contact time and has no carbon age; remove "carbon_age" or use "reactor": "stirred"', { path: `${path}.carbon_age` });
    return { kind: 'plug-flow', contactTimeS };
  }
  const carbonAgeS = o.carbon_age === undefined ? contactTimeS : positiveTime(o.carbon_age, `${path}.carbon_age`, 'a positive carbon age such as "3 d"');
  if (carbonAgeS < contactTimeS) {
    throw new InputError(`the carbon age (${carbonAgeS} s) is below the contact time (${contactTimeS} s); the mean carbon age is at least the water's residence time (equal without recirculation)`, { path: `${path}.carbon_age` });
  }
  return { kind: 'stirred', contactTimeS, carbonAgeS };
}
