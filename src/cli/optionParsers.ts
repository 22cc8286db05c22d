/**
 * Parsers of option values, used as `parse` in option specs (commander's `argParser`). Each takes
 * the typed text and returns the value in the library's internal unit (mg/L for concentrations and
 * doses), or throws `InputError(expected)`; the CLI adds the option name. Light on purpose: every
 * start-up loads this module with the specs.
 */
import { InputError } from '../core/errors.js';
import { parseQuantity } from '../units/parseQuantity.js';

/** A mass concentration or carbon dose such as "20 mg/L" or "50 ng/L" (a bare number is mg/L), > 0, in mg/L. */
export function positiveMassConcentration(text: string): number {
  return parseQuantity(text, 'massConcentration', { allowZero: false });
}

const NUMBER = /^\s*[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s*$/;

/** A plain finite number such as 0.2 or 80. */
export function finiteNumber(text: string): number {
  if (!NUMBER.test(text)) throw new InputError(`expected a number such as 0.2 or 80, got ${JSON.stringify(text)}`);
  return Number(text);
}

/** A whole number from `min` to `max` inclusive (digits only). */
export function wholeNumber(min: number, max: number, what = 'a whole number'): (text: string) => number {
  return (text) => {
    const t = text.trim();
    const x = /^\d+$/.test(t) ? Number(t) : NaN;
    if (!(Number.isSafeInteger(x) && x >= min && x <= max)) throw new InputError(`expected ${what} from ${min} to ${max}, got ${JSON.stringify(text)}`);
    return x;
  };
}

/** A whole number from `min` to `max`, or the word "auto". */
export function wholeNumberOrAuto(min: number, max: number): (text: string) => number | 'auto' {
  const whole = wholeNumber(min, max);
  return (text) => {
    if (text.trim() === 'auto') return 'auto';
    try {
      return whole(text);
    } catch {
      throw new InputError(`expected a whole number from ${min} to ${max} or "auto", got ${JSON.stringify(text)}`);
    }
  };
}

/** Positive numbers separated by commas, semicolons or spaces, e.g. "10,30,100". */
export function positiveNumberList(text: string): number[] {
  const parts = text.split(/[,;\s]+/).filter((s) => s !== '');
  if (parts.length === 0) throw new InputError('expected positive numbers separated by commas, e.g. "10,30,100", got nothing');
  return parts.map((s) => {
    const v = NUMBER.test(s) ? Number(s) : NaN;
    if (!(Number.isFinite(v) && v > 0)) throw new InputError(`expected positive numbers separated by commas, got "${s}"`);
    return v;
  });
}

/** Non-empty text (an id or a file name). */
export function nonEmptyText(text: string): string {
  if (text.trim() === '') throw new InputError('expected a non-empty value');
  return text;
}
