/**
 * Choosing an axis: its domain and ticks from the values to be shown, linear or log, with an
 * optional fixed range from the plot spec.
 */
import { linearTicks, type Tick } from './linearTicks.js';
import { logDomain, logTicks } from './logTicks.js';

export interface AxisPlan {
  domain: [number, number];
  ticks: Tick[];
  log: boolean;
}

/**
 * Axis over `values` (already filtered: finite, and > 0 on a log axis). `fixed` [min, max] is
 * used as given when it is valid for the axis (finite, min < max, positive on a log axis);
 * otherwise the range comes from the values. No values: [0, 1] (linear) or [1, 10] (log).
 */
export function planAxis(values: readonly number[], opts: { log?: boolean; fixed?: readonly [number, number] | undefined; targetTicks?: number }): AxisPlan {
  const log = opts.log === true;
  const target = opts.targetTicks ?? 6;
  const f = opts.fixed;
  const fixedOk = f !== undefined && Number.isFinite(f[0]) && Number.isFinite(f[1]) && f[0] < f[1] && (!log || f[0] > 0);
  if (fixedOk) {
    if (log) return { domain: [f[0], f[1]], ticks: logTicks(f[0], f[1]), log };
    const lt = linearTicks(f[0], f[1], target, true);
    return { domain: lt.domain, ticks: lt.ticks, log };
  }
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (log) {
    const domain = lo <= hi ? logDomain(lo, hi) : ([1, 10] as [number, number]);
    return { domain, ticks: logTicks(domain[0], domain[1]), log };
  }
  const lt = lo <= hi ? linearTicks(lo, hi, target) : linearTicks(0, 1, target);
  return { domain: lt.domain, ticks: lt.ticks, log };
}

/** Whether v lies in the (closed) domain, with a little tolerance for rounding. */
export function inDomain(v: number, domain: readonly [number, number], log: boolean): boolean {
  if (!Number.isFinite(v) || (log && v <= 0)) return false;
  const [a, b] = domain;
  const tol = log ? 1e-9 : 1e-9 * Math.max(Math.abs(a), Math.abs(b), 1e-300);
  return log ? v >= a * (1 - 1e-9) && v <= b * (1 + 1e-9) : v >= a - tol && v <= b + tol;
}
