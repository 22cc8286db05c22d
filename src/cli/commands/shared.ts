import { InputError } from '../../core/errors.js';
import { writeFileAtomic } from '../../io/writeOutputs.js';
import { checkOutputFile } from '../../io/outputChecks.js';
import type { CommandContext } from '../commandSpec.js';
import { snakeCaseJsonText } from '../../output/snakeCaseJson.js';

/** Run `f`; an InputError without a file gains `file`. */
export function inFile<T>(file: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && !e.location.file) throw e.at({ file });
    throw e;
  }
}

/** Library argument names (the first JSON-path segment of an error) and the options that set them. */
const DOSE_OPTIONS: Record<string, string> = { dose: '--dose', from: '--from', to: '--to', points: '--points', target: '--target', removal: '--removal', limit: '--limit' };

/**
 * Run `f`; an InputError about a command-line value (a JSON path without a file) names the
 * option instead of the path. `options` maps argument names to option flags.
 */
export function optionValue<T>(f: () => T, options: Record<string, string> = DOSE_OPTIONS): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.location.path && !e.location.file) {
      const opt = options[e.location.path.replace(/\[.*$/, '').split('.')[0]!];
      if (opt) throw new InputError(e.expected, { option: opt });
    }
    throw e;
  }
}

/**
 * A JSON result: written whole to `--out` when given (never over one of `inputs`), printed as
 * JSON or as `text(outPath)`.
 */
export function emitJson(result: unknown, opts: Record<string, unknown>, ctx: CommandContext, text: (out: string | undefined) => string, inputs: readonly string[] = []): void {
  const json = snakeCaseJsonText(result);
  const out = opts.out === undefined ? undefined : String(opts.out);
  if (out !== undefined) {
    checkOutputFile(out, inputs);
    writeFileAtomic(out, json + '\n');
  }
  ctx.out(opts.json ? json : text(out));
}
