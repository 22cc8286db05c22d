/** Milliseconds in a day. */
export const DAY_MS = 86_400_000;

/** Whole days since 1970-01-01 of an ISO date "YYYY-MM-DD" (UTC). Throws RangeError on other text. */
export function dayNumber(isoDate: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!m) throw new RangeError(`not an ISO date (YYYY-MM-DD): "${isoDate}"`);
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) / DAY_MS;
}
