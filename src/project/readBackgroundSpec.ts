/**
 * The "background" entry of a project file: exactly one of a DOC isotherm to fractionate (with
 * options), a background file, or an EBC per compound (with the DOC at which it applies).
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { readComponent } from '../scenario/readMixture.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { at, expectObject, expectString, join, onlyKeys } from '../scenario/jsonChecks.js';
import type { BackgroundSpec, CalibrationTransferSpec, CompoundSpec, SiteSpec } from './projectTypes.js';
import { positive } from './quantities.js';
import { readFractionationOptions } from './readFractionationOptions.js';

/**
 * @param transfer the project's calibration transfer: with "mean" or a named compound, compounds
 *   without jar tests take the transferred EBC and need none of their own in an EBC background
 */
export function readBackground(raw: unknown, compounds: CompoundSpec[], site: SiteSpec, transfer?: CalibrationTransferSpec): BackgroundSpec {
  const p = 'background';
  const o = expectObject(raw, p, 'the background: { "isotherm": CSV }, { "file": JSON } or { "ebc": {…} }');
  const modes = ['isotherm', 'file', 'ebc'].filter((k) => o[k] !== undefined);
  if (modes.length !== 1) {
    throw new InputError(`expected exactly one of "isotherm" (a DOC isotherm CSV to fractionate), "file" (a background file) or "ebc" (an EBC per compound), got ${modes.length === 0 ? 'none' : modes.map((m) => `"${m}"`).join(' and ')}`, { path: p });
  }
  const mode = modes[0]!;
  if (mode === 'isotherm') {
    onlyKeys(o, ['isotherm', 'fractionation', 'note'], p);
    const file = expectString(o.isotherm, `${p}.isotherm`, 'a DOC isotherm CSV path relative to the project file');
    const options = o.fractionation === undefined ? {} : readFractionationOptions(o.fractionation, `${p}.fractionation`);
    for (const c of compounds) checkCalibrationFits(c, compounds, 'fictive');
    return { kind: 'isotherm', file, options };
  }
  if (mode === 'file') {
    onlyKeys(o, ['file', 'note'], p);
    for (const c of compounds) checkCalibrationFits(c, compounds, 'fictive');
    return { kind: 'file', file: expectString(o.file, `${p}.file`, 'a background JSON path relative to the project file') };
  }
  onlyKeys(o, ['ebc', 'doc', 'note'], p);
  const ep = `${p}.ebc`;
  const e = expectObject(o.ebc, ep, 'an object of EBCs by compound id, e.g. { "CBZ": { "K": 20, "one_over_n": 0.25, "c0": "1.2 mg/L" } }');
  const ebc: Record<string, FreundlichComponent> = {};
  for (const [id, val] of Object.entries(e)) {
    const cp = join(ep, id);
    if (!compounds.some((c) => c.id === id)) throw new InputError(`"${id}" is not a compound id; expected one of ${compounds.map((c) => `"${c.id}"`).join(', ')}`, { path: cp });
    const v = expectObject(val, cp, 'an EBC { K, one_over_n, c0 }');
    onlyKeys(v, ['K', 'one_over_n', 'K_unit', 'c0', 'note'], cp);
    const comp = readComponent({ ...v, id: `EBC ${id}` }, cp, true);
    if (!(comp.K > 0)) throw new InputError('expected K > 0 for an equivalent background compound', { path: `${cp}.K` });
    ebc[id] = comp;
  }
  for (const c of compounds) {
    checkCalibrationFits(c, compounds, 'ebc');
    const transferred = transfer !== undefined && transfer.kind !== 'none' && !c.jarTests;
    if (!ebc[c.id] && !transferred && !(c.jarTests && c.jarTests.model !== 'fictive-k')) {
      throw new InputError(`missing the EBC of compound "${c.id}"; expected { "K", "one_over_n", "c0" }, jar tests with model "ebc" or "sebc" for it, or a "calibration_transfer" from a compound with jar tests`, { path: join(ep, c.id) });
    }
  }
  const doc = o.doc === undefined ? site.docMgPerL : positive(at(`${p}.doc`, () => parseQuantity(o.doc, 'massConcentration')), `${p}.doc`, 'the positive DOC at which the EBC concentrations apply');
  return { kind: 'ebc', docMgPerL: doc, ebc };
}


function checkCalibrationFits(c: CompoundSpec, compounds: CompoundSpec[], background: 'fictive' | 'ebc'): void {
  if (background === 'ebc' && c.jarTests?.model === 'fictive-k') {
    const i = compounds.indexOf(c);
    throw new InputError('the model "fictive-k" needs a fractionated background ("isotherm" or "file"); with EBC background use "ebc" or "sebc"', { path: `compounds[${i}].jar_tests.model` });
  }
}

