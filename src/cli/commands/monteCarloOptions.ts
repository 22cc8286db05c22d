/** The Monte Carlo options shared by `run` and `demo` (a light module: read at every start-up). */
import type { OptionSpec } from '../commandSpec.js';
import { wholeNumber } from '../optionParsers.js';
import { MAX_PROJECT_DRAWS } from '../../project/projectTypes.js';

/** The Monte Carlo options shared by `run` and `demo`. */
export const MONTE_CARLO_OPTIONS: OptionSpec[] = [
  { flags: '--draws <n>', description: `Monte Carlo draws (0 = off; overrides the project's uncertainty.draws; at most ${MAX_PROJECT_DRAWS})`, parse: wholeNumber(0, MAX_PROJECT_DRAWS, 'a whole number of draws') },
  { flags: '--seed <s>', description: 'Monte Carlo seed, a whole number 0–4294967295 (overrides uncertainty.seed)', parse: wholeNumber(0, 0xffffffff, 'a whole-number seed') },
];

/** --draws and --seed as the pipeline takes them (both already parsed by their specs). */
export function monteCarloOverrides(opts: Record<string, unknown>): { draws?: number; seed?: number } {
  return {
    ...(opts.draws !== undefined ? { draws: opts.draws as number } : {}),
    ...(opts.seed !== undefined ? { seed: opts.seed as number } : {}),
  };
}
