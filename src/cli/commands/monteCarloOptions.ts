/** The Monte Carlo options shared by `run` and `demo` (a light module: read at every start-up). */
import { InputError } from '../../core/errors.js';
import { MAX_PROJECT_DRAWS } from '../../project/projectTypes.js';

/** The Monte Carlo options shared by `run` and `demo`. */
export const MONTE_CARLO_OPTIONS = [
  { flags: '--draws <n>', description: `Monte Carlo draws (0 = off; overrides the project's uncertainty.draws; at most ${MAX_PROJECT_DRAWS})` },
  { flags: '--seed <s>', description: "Monte Carlo seed, a whole number 0–4294967295 (overrides uncertainty.seed)" },
];

/** --draws and --seed from the command line. @throws InputError naming the option */
export function monteCarloOverrides(opts: Record<string, unknown>): { draws?: number; seed?: number } {
  const out: { draws?: number; seed?: number } = {};
  const whole = (v: unknown, option: string, max: number, what: string): number => {
    const t = String(v).trim();
    const x = /^\d+$/.test(t) ? Number(t) : NaN;
    if (!(Number.isInteger(x) && x >= 0 && x <= max)) throw new InputError(`expected ${what}, got ${JSON.stringify(String(v))}`, { option });
    return x;
  };
  if (opts.draws !== undefined) out.draws = whole(opts.draws, '--draws', MAX_PROJECT_DRAWS, `a whole number of draws from 0 (off) to ${MAX_PROJECT_DRAWS}`);
  if (opts.seed !== undefined) out.seed = whole(opts.seed, '--seed', 0xffffffff, 'a whole-number seed from 0 to 4294967295');
  return out;
}

