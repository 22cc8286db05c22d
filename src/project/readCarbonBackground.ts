/**
 * A carbon's own background (capability 21; project key `carbons[i].background`): the DOC (and
 * UV254) isotherm measured with that carbon, fractionated for it, or a background file made from
 * such an isotherm (`sorbshare fractionate --json`):
 *
 *   "background": { "isotherm": "doc_isotherm_B.csv", "fractionation": { "components": 3 } }
 *   "background": { "file": "background_B.json" }
 *
 * A carbon without one uses the project's background with its K factor on every background K,
 * as before. The carbon's own fractionation options override the project's, key by key (so the
 * carbons are fractionated alike unless the carbon says otherwise). A carbon's own background
 * needs a fractionated project background ("isotherm" or "file"): with an EBC background the
 * compounds compete with EBCs, which a DOC isotherm does not replace.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { expectObject, expectString, onlyKeys } from '../scenario/jsonChecks.js';
import type { BackgroundSpec, CarbonBackgroundSpec, CarbonSpec } from './projectTypes.js';
import { readFractionationOptions } from './readFractionationOptions.js';

const WHAT = 'the carbon\'s own background: { "isotherm": CSV, "fractionation": {…} } or { "file": JSON }';

/** @param p the JSON path of the entry (`carbons[1].background`) */
export function readCarbonBackground(raw: unknown, p: string): CarbonBackgroundSpec {
  const o = expectObject(raw, p, WHAT);
  const modes = ['isotherm', 'file'].filter((k) => o[k] !== undefined);
  if (modes.length !== 1) {
    throw new InputError(`expected exactly one of "isotherm" (this carbon's DOC isotherm CSV to fractionate) or "file" (a background file), got ${modes.length === 0 ? 'none' : '"isotherm" and "file"'}`, { path: p });
  }
  if (modes[0] === 'isotherm') {
    onlyKeys(o, ['isotherm', 'fractionation', 'note'], p);
    const file = expectString(o.isotherm, `${p}.isotherm`, 'a DOC isotherm CSV path relative to the project file');
    const options = o.fractionation === undefined ? {} : readFractionationOptions(o.fractionation, `${p}.fractionation`);
    return { kind: 'isotherm', file, options };
  }
  onlyKeys(o, ['file', 'note'], p);
  return { kind: 'file', file: expectString(o.file, `${p}.file`, 'a background JSON path relative to the project file') };
}

/**
 * Check the carbons' own backgrounds against the project's background and give an own isotherm
 * the project's fractionation options where the carbon sets none (in place).
 * @throws InputError at `carbons[i].background` when the project's background is EBCs
 */
export function resolveCarbonBackgrounds(background: BackgroundSpec, carbons: CarbonSpec[]): void {
  carbons.forEach((c, i) => {
    const own = c.background;
    if (!own) return;
    if (background.kind === 'ebc') {
      throw new InputError('a carbon\'s own DOC background needs a fractionated project background ("isotherm" or "file"); with an EBC background the compounds compete with their EBCs and carbons differ by "K_factor"', { path: `carbons[${i}].background` });
    }
    if (own.kind === 'isotherm' && background.kind === 'isotherm') own.options = { ...background.options, ...own.options };
  });
}
