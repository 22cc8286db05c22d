/**
 * The "fractionation" options of a DOC isotherm in a project file (the project's background and
 * a carbon's own background): `{ "components": 2–5, "exponent": 0 < 1/n < 1, "fit_k": true|false }`.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { describeValue, expectNumber, expectObject, onlyKeys } from '../scenario/jsonChecks.js';
import type { FractionationOptionsSpec } from './projectTypes.js';

/** @param fp the JSON path of the options object (e.g. `background.fractionation`) */
export function readFractionationOptions(raw: unknown, fp: string): FractionationOptionsSpec {
  const options: FractionationOptionsSpec = {};
  const f = expectObject(raw, fp, 'fractionation options { components, exponent, fit_k }');
  onlyKeys(f, ['components', 'exponent', 'fit_k'], fp);
  if (f.components !== undefined) options.components = expectNumber(f.components, `${fp}.components`, 'a whole number of adsorbable fictive components from 2 to 5', (x) => Number.isInteger(x) && x >= 2 && x <= 5);
  if (f.exponent !== undefined) options.exponent = expectNumber(f.exponent, `${fp}.exponent`, 'a Freundlich exponent 1/n between 0 and 1 (exclusive)', (x) => x > 0 && x < 1);
  if (f.fit_k !== undefined) {
    if (typeof f.fit_k !== 'boolean') throw new InputError(`expected true or false, got ${describeValue(f.fit_k)}`, { path: `${fp}.fit_k` });
    options.fitK = f.fit_k;
  }
  return options;
}
