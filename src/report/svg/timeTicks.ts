/**
 * A date axis with month ticks. Values are whole days since 1970-01-01 (UTC), as `dayNumber`
 * gives them. The domain runs from the first of the month of the earliest value to the first of
 * the month after the latest; ticks sit on the first of each month, labelled every 1, 2, 3, 6 or
 * 12 months so that at most about eight labels show ("Jan 2025" on the first label and on every
 * January, the month's short name otherwise).
 */
import type { Tick } from './linearTicks.js';
import type { AxisPlan } from './planAxis.js';
import { DAY_MS } from '../../output/dayNumber.js';

export { dayNumber } from '../../output/dayNumber.js';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];


/** Day number of the first of month `month` (0-based, may run past 11) of `year`. */
function firstOfMonth(year: number, month: number): number {
  return Date.UTC(year, month, 1) / DAY_MS;
}

/** Month ticks over [loDay, hiDay] (day numbers); see the file comment. */
export function monthTicks(loDay: number, hiDay: number): { domain: [number, number]; ticks: Tick[] } {
  const lo = new Date(Math.floor(loDay) * DAY_MS);
  const hi = new Date(Math.ceil(hiDay) * DAY_MS);
  const y0 = lo.getUTCFullYear();
  const m0 = lo.getUTCMonth();
  let months = (hi.getUTCFullYear() - y0) * 12 + hi.getUTCMonth() - m0;
  if (firstOfMonth(y0, m0 + months) < hiDay || months === 0) months++;
  const step = [1, 2, 3, 6, 12].find((s) => months / s <= 8) ?? 12 * Math.ceil(months / 96);
  const ticks: Tick[] = [];
  let firstLabel = true;
  for (let k = 0; k <= months; k++) {
    const month = (m0 + k) % 12;
    const year = y0 + Math.floor((m0 + k) / 12);
    const labelled = (m0 + k) % step === 0 || (step <= 12 && k === 0 && months <= 8);
    const label = labelled ? (firstLabel || month === 0 ? `${MONTHS[month]} ${year}` : MONTHS[month]!) : null;
    if (labelled) firstLabel = false;
    ticks.push({ value: firstOfMonth(y0, m0 + k), label, major: labelled });
  }
  return { domain: [firstOfMonth(y0, m0), firstOfMonth(y0, m0 + months)], ticks };
}

/** A date axis over `values` (day numbers); `fixed` [min, max] in day numbers when valid. */
export function planTimeAxis(values: readonly number[], fixed?: readonly [number, number]): AxisPlan {
  const ok = fixed !== undefined && Number.isFinite(fixed[0]) && Number.isFinite(fixed[1]) && fixed[0] < fixed[1];
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (ok) [lo, hi] = [fixed[0], fixed[1]];
  if (!(lo <= hi)) [lo, hi] = [0, 365];
  const t = monthTicks(lo, hi);
  return { domain: t.domain, ticks: t.ticks, log: false };
}
