/**
 * The optional "uncertainty" entry of a project file: the Monte Carlo run over isotherm and
 * background parameters (capability 13).
 *
 *   "uncertainty": { "draws": 400, "seed": 7, "K_rel_sd": 0.2, "one_over_n_rel_sd": 0.05,
 *                    "doc_rel_sd": 0.05, "fraction_rel_sd": 0.1, "background_K_rel_sd": 0 }
 *
 * Relative standard deviations are fractions (0.2 = 20 %), from 0 to 2. Fitted background
 * parameters with a 95 % interval use the fit instead of `fraction_rel_sd` / `background_K_rel_sd`.
 * The former key `doc_levels` is retired (the design layer chooses its own DOC nodes) and named
 * as such when it appears.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { expectNumber, expectObject, onlyKeys } from '../scenario/jsonChecks.js';

/** Why `uncertainty.doc_levels` is refused, and what replaced it. */
export const RETIRED_DOC_LEVELS = 'the key "doc_levels" is retired and no longer does anything: every draw now solves the yearly doses at the DOC nodes of the design layer\'s dose table (src/design/doseTable.ts, refined until each segment midpoint is within 0.1 % of the exact design), scaled by the draw\'s DOC factor; remove the key';
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
  if (o.doc_levels !== undefined) throw new InputError(RETIRED_DOC_LEVELS, { path: `${p}.doc_levels` });
  onlyKeys(o, ['draws', 'seed', ...REL_SD_KEYS.map((k) => k[0]), 'Ds_rel_sd', 'contact_draws', 'gac_draws', 'note'], p);
  const spec: UncertaintySpec = { ...DEFAULT_UNCERTAINTY };
  if (o.draws !== undefined) spec.draws = expectNumber(o.draws, `${p}.draws`, `a whole number of draws from 0 (off) to ${MAX_PROJECT_DRAWS}`, (x) => Number.isInteger(x) && x >= 0 && x <= MAX_PROJECT_DRAWS);
  if (o.seed !== undefined) spec.seed = expectNumber(o.seed, `${p}.seed`, 'a whole-number seed from 0 to 4294967295', (x) => Number.isInteger(x) && x >= 0 && x <= 0xffffffff);
  for (const [key, field, what] of REL_SD_KEYS) {
    if (o[key] !== undefined) (spec[field] as number) = expectNumber(o[key], `${p}.${key}`, `a relative standard deviation of ${what} as a fraction from 0 to 2 (0.2 = 20 %)`, (x) => x >= 0 && x <= 2);
  }
  if (o.Ds_rel_sd !== undefined) spec.dsRelSd = expectNumber(o.Ds_rel_sd, `${p}.Ds_rel_sd`, 'a relative standard deviation of the given surface diffusivities (PAC contact, GAC fixed bed) as a fraction from 0 to 2 (0.3 = 30 %)', (x) => x >= 0 && x <= 2);
  if (o.contact_draws !== undefined) spec.contactDraws = expectNumber(o.contact_draws, `${p}.contact_draws`, `a whole number of draws under PAC contact conditions from 0 (off) to ${MAX_PROJECT_DRAWS}`, (x) => Number.isInteger(x) && x >= 0 && x <= MAX_PROJECT_DRAWS);
  if (o.gac_draws !== undefined) spec.gacDraws = expectNumber(o.gac_draws, `${p}.gac_draws`, `a whole number of draws of a GAC carbon's run length from 0 (off) to ${MAX_PROJECT_DRAWS}`, (x) => Number.isInteger(x) && x >= 0 && x <= MAX_PROJECT_DRAWS);
  return spec;
}
