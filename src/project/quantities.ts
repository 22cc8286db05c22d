/**
 * Quantities of a project file with their JSON path in errors: positive values, effluent limits
 * and UV254 absorbances (a bare number is in 1/m).
 */
import { InputError } from '../core/errors.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { csvUnitFactor } from '../tables/csvTable.js';
import { at, describeValue } from '../scenario/jsonChecks.js';

/** `x` when positive; otherwise an InputError at `path` saying `what` was expected. */
export function positive(x: number, path: string, what: string): number {
  if (!(x > 0)) throw new InputError(`expected ${what}, got ${x}`, { path });
  return x;
}

/** An effluent limit in mg/L ("100 ng/L" or a bare number in mg/L). */
export function readLimit(v: unknown, path: string): number {
  const lim = at(path, () => parseQuantity(v, 'massConcentration'));
  if (!(lim > 0)) throw new InputError('expected a positive effluent limit such as "100 ng/L"', { path });
  return lim;
}

/** UV254 as a number in 1/m or a text such as "17 1/m" or "0.17 1/cm". */
export function readAbsorbance(v: unknown, path: string): number {
  if (typeof v === 'number' && Number.isFinite(v) && v >= 0) return v;
  if (typeof v === 'string') {
    const m = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$/.exec(v);
    if (m && Number(m[1]) >= 0) return Number(m[1]) * at(path, () => csvUnitFactor(m[2] === '' ? '1/m' : m[2]!, 'absorbance'));
  }
  throw new InputError(`expected a UV254 absorbance such as "17 1/m" or "0.17 1/cm" (a bare number is in 1/m), got ${describeValue(v)}`, { path });
}

