/**
 * The optional "pilot" entry of a project file: pilot pairs (UV254 reduction, measured removal)
 * in a CSV, the acceptance band and the carbon the pilot ran with.
 *
 *   "pilot": { "file": "pilot.csv", "band_percent": 10, "carbon": "Carbon A (coal-based)" }
 *
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { expectNumber, expectObject, expectString, onlyKeys, required } from '../scenario/jsonChecks.js';
import { DEFAULT_PILOT_BAND_PERCENT, type CarbonSpec, type PilotSpec } from './projectTypes.js';

export function readPilot(raw: unknown, carbons: readonly CarbonSpec[]): PilotSpec {
  const p = 'pilot';
  const o = expectObject(raw, p, 'the pilot data { "file": CSV, "band_percent": 10, "carbon": name }');
  onlyKeys(o, ['file', 'band_percent', 'carbon', 'note'], p);
  const spec: PilotSpec = {
    file: expectString(required(o, 'file', p, 'the pilot CSV path relative to the project file'), `${p}.file`, 'a CSV path relative to the project file'),
    bandPercent: o.band_percent === undefined
      ? DEFAULT_PILOT_BAND_PERCENT
      : expectNumber(o.band_percent, `${p}.band_percent`, 'a band half-width in percentage points between 0 and 100 (exclusive)', (x) => x > 0 && x < 100),
  };
  if (o.carbon !== undefined) {
    const name = expectString(o.carbon, `${p}.carbon`, 'the name of one of the carbons');
    const c = carbons.find((x) => x.name === name);
    if (!c) throw new InputError(`"${name}" is not a carbon name; expected one of ${carbons.map((x) => `"${x.name}"`).join(', ')}`, { path: `${p}.carbon` });
    if (c.type !== 'PAC') throw new InputError(`"${name}" is a GAC carbon; the pilot check needs a PAC carbon (removal against a batch dose)`, { path: `${p}.carbon` });
    spec.carbon = name;
  } else if (!carbons.some((c) => c.type === 'PAC')) {
    throw new InputError('the pilot check needs a PAC carbon (removal against a batch dose); the project has none', { path: p });
  }
  return spec;
}
