/**
 * Read a quantity written as text with its unit ("20 mg/L", "100 ng/L", "1.2 m3/d") or as a bare
 * number (then in the field's default unit) and return the value in the internal unit.
 */
import { InputError } from '../core/errors.js';
import { describeKind, unitFactor, type UnitKind, INTERNAL_UNIT } from './unitFactor.js';

const NUMBER_THEN_UNIT = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$/;

export interface QuantityOptions {
  /** Unit assumed for a bare number; when absent a bare number is an error. */
  defaultUnit?: string;
  /** Allow zero (default true). */
  allowZero?: boolean;
  /** Allow negative values (default false). */
  allowNegative?: boolean;
}

/** Parse `value` of `kind`; returns the value in the internal unit (mg/L, mg/g, m³/d, …). */
export function parseQuantity(value: unknown, kind: UnitKind, options: QuantityOptions = {}): number {
  const defaultUnit = options.defaultUnit ?? INTERNAL_UNIT[kind];
  let magnitude: number;
  let unitText: string;
  if (typeof value === 'number') {
    magnitude = value;
    unitText = defaultUnit;
    if (options.defaultUnit === undefined && Number.isFinite(value) && value > 0) return value; // already in the internal unit (factor 1)
  } else if (typeof value === 'string') {
    const m = NUMBER_THEN_UNIT.exec(value);
    if (!m) throw new InputError(`expected a number with a unit, e.g. "20 mg/L", got "${value}"`);
    magnitude = Number(m[1]);
    unitText = m[2] === '' ? defaultUnit : (m[2] as string);
  } else {
    throw new InputError(`expected ${describeKind(kind)} as a number or a text such as "20 mg/L", got ${JSON.stringify(value)}`);
  }
  if (!Number.isFinite(magnitude)) throw new InputError(`expected a finite number, got ${JSON.stringify(value)}`);
  if (magnitude < 0 && !options.allowNegative) throw new InputError(`expected a non-negative value, got ${JSON.stringify(value)}`);
  if (magnitude === 0 && options.allowZero === false) throw new InputError(`expected a positive value, got ${JSON.stringify(value)}`);
  const factor = unitFactor(unitText, kind);
  return magnitude * factor;
}

/** Split a CSV header such as `C0 (ng/L)` into name and unit; unit undefined when absent. */
export function splitHeader(header: string): { name: string; unit: string | undefined } {
  const m = /^\s*(.*?)\s*[([]\s*([^)\]]*?)\s*[)\]]\s*$/.exec(header);
  if (!m) return { name: header.trim(), unit: undefined };
  return { name: (m[1] as string).trim(), unit: (m[2] as string).trim() || undefined };
}
