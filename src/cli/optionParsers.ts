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

/** A time with its unit such as "30 min", "2 h" or "3 d" (> 0), in seconds. */
export function positiveTime(text: string): number {
  if (!hasUnit(text)) throw new InputError(`expected a time with its unit such as "30 min", "2 h" or "3 d", got ${JSON.stringify(text)}`);
  return parseQuantity(text, 'time', { allowZero: false });
}

/**
 * Times such as "1,5,15,30,60 min" (one unit at the end for all) or "30 s, 2 min, 1 h", in seconds.
 * Each must be positive; the order is checked by the model (increasing times).
 */
export function timeList(text: string): number[] {
  const parts = text.split(/[,;]/).map((s) => s.trim()).filter((s) => s !== '');
  if (parts.length === 0) throw new InputError('expected times such as "1,5,15,30,60 min", got nothing');
  const unitOf = (s: string) => s.replace(/^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s*/, '');
  const common = unitOf(parts[parts.length - 1]!);
  if (common === '') throw new InputError(`expected times with a unit, e.g. "1,5,15,30,60 min", got ${JSON.stringify(text)}`);
  return parts.map((s) => {
    const withUnit = unitOf(s) === '' ? `${s} ${common}` : s;
    const v = parseQuantity(withUnit, 'time', { allowNegative: true });
    if (!(v > 0)) throw new InputError(`expected positive times, got "${s}" in ${JSON.stringify(text)}`);
    return v;
  });
}

function positiveWithUnit(kind: 'length' | 'density' | 'diffusivity', example: string): (text: string) => number {
  return (text) => {
    if (!hasUnit(text)) throw new InputError(`expected a value with its unit such as "${example}", got ${JSON.stringify(text)}`);
    return parseQuantity(text, kind, { allowZero: false });
  };
}

/** A particle radius such as "10 um", in m. */
export const positiveLength = positiveWithUnit('length', '10 um');
/** A particle density such as "650 kg/m3", in kg/m³ (= g/L). */
export const positiveDensity = positiveWithUnit('density', '650 kg/m3');
/** A diffusivity such as "2e-17 m2/s", in m²/s. */
export const positiveDiffusivity = positiveWithUnit('diffusivity', '2e-17 m2/s');

/** True when a unit follows the number ("2e-17 m2/s" yes, "2e-17" no). */
function hasUnit(text: string): boolean {
  return text.trim().replace(/^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?\s*/, '') !== '';
}

/** A positive finite number such as 100000. */
export function positiveNumber(text: string): number {
  const v = finiteNumber(text);
  if (!(v > 0)) throw new InputError(`expected a number > 0, got ${JSON.stringify(text)}`);
  return v;
}
