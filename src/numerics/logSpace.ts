/**
 * Log spacing: `points` values from `from` to `to` (both > 0, from < to) equally spaced in ln,
 * x_k = exp(ln from + (ln to − ln from)·k/(points − 1)), with the ends exactly `from` and `to`.
 * @throws InputError (naming `what`) for from ≤ 0, to ≤ from, or points not a whole number from 2 to 100 000
 */
import { InputError } from '../core/errors.js';

export function logSpaced(from: number, to: number, points: number, what = 'from'): number[] {
  if (!(from > 0) || !(to > from) || !Number.isFinite(to)) throw new InputError(`expected 0 < from < to for a log-spaced range, got from ${from} and to ${to}`, { path: what });
  if (!Number.isInteger(points) || points < 2 || points > 100000) throw new InputError(`expected a whole number of points from 2 to 100000, got ${points}`, { path: 'points' });
  const l0 = Math.log(from), l1 = Math.log(to);
  return Array.from({ length: points }, (_, k) => (k === 0 ? from : k === points - 1 ? to : Math.exp(l0 + ((l1 - l0) * k) / (points - 1))));
}
