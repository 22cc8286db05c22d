import { InputError } from '../../core/errors.js';

/** Run `f`; an InputError without a file gains `file`. */
export function inFile<T>(file: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && !e.location.file) throw e.at({ file });
    throw e;
  }
}

const OPTION_OF_PATH: Record<string, string> = { dose: '--dose', from: '--from', to: '--to', points: '--points', target: '--target', removal: '--removal', limit: '--limit' };

/** Run `f`; an InputError about a command-line value names the option instead of a JSON path. */
export function optionValue<T>(f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.location.path && !e.location.file) {
      const opt = OPTION_OF_PATH[e.location.path.split('.')[0]!];
      if (opt) throw new InputError(e.expected, { option: opt });
    }
    throw e;
  }
}
