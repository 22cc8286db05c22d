/**
 * The optional "uncertainty" entry of a project file: the Monte Carlo run over isotherm and
 * background parameters (capability 13).
 *
 *   "uncertainty": { "draws": 400, "seed": 7, "K_rel_sd": 0.2, "one_over_n_rel_sd": 0.05,
 *                    "doc_rel_sd": 0.05, "fraction_rel_sd": 0.1, "background_K_rel_sd": 0,
 *                    "doc_levels": 5 }
 *
 * Relative standard deviations are fractions (0.2 = 20 %), from 0 to 2. Fitted background
 * parameters with a 95 % interval use the fit instead of `fraction_rel_sd` / `background_K_rel_sd`.
 * @throws InputError naming the JSON path and what was expected
 */
import { expectNumber, expectObject, onlyKeys } from '../scenario/jsonChecks.js';
import { DEFAULT_UNCERTAINTY, MAX_PROJECT_DRAWS, type UncertaintySpec } from './projectTypes.js';

const REL_SD_KEYS: Array<[string, keyof UncertaintySpec, string]> = [
  ['K_rel_sd', 'KRelSd', "the compounds' K"],
  ['one_over_n_rel_sd', 'oneOverNRelSd', "the compounds' exponents 1/n"],
  ['doc_rel_sd', 'docRelSd', 'the DOC'],
  ['fraction_rel_sd', 'fractionRelSd', 'the background fractions without a fitted interval'],
  ['background_K_rel_sd', 'backgroundKRelSd', 'the background K values without a fitted interval'],
];

export function readUncertainty(raw: unknown): UncertaintySpec {
  const p = 'uncertainty';
  const o = expectObject(raw, p, 'the Monte Carlo settings { draws, seed, K_rel_sd, one_over_n_rel_sd, doc_rel_sd, … }');
  onlyKeys(o, ['draws', 'seed', ...REL_SD_KEYS.map((k) => k[0]), 'doc_levels', 'note'], p);
  const spec: UncertaintySpec = { ...DEFAULT_UNCERTAINTY };
  if (o.draws !== undefined) spec.draws = expectNumber(o.draws, `${p}.draws`, `a whole number of draws from 0 (off) to ${MAX_PROJECT_DRAWS}`, (x) => Number.isInteger(x) && x >= 0 && x <= MAX_PROJECT_DRAWS);
  if (o.seed !== undefined) spec.seed = expectNumber(o.seed, `${p}.seed`, 'a whole-number seed from 0 to 4294967295', (x) => Number.isInteger(x) && x >= 0 && x <= 0xffffffff);
  for (const [key, field, what] of REL_SD_KEYS) {
    if (o[key] !== undefined) (spec[field] as number) = expectNumber(o[key], `${p}.${key}`, `a relative standard deviation of ${what} as a fraction from 0 to 2 (0.2 = 20 %)`, (x) => x >= 0 && x <= 2);
  }
  if (o.doc_levels !== undefined) spec.docLevels = expectNumber(o.doc_levels, `${p}.doc_levels`, 'a whole number of DOC levels from 2 to 50', (x) => Number.isInteger(x) && x >= 2 && x <= 50);
  return spec;
}
