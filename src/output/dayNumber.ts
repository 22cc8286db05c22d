/** Milliseconds in a day. */
export const DAY_MS = 86_400_000;

/** Whole days since 1970-01-01 of an ISO date "YYYY-MM-DD" (UTC). Throws RangeError on other text. */
export function dayNumber(isoDate: string): number {
  // the digits read directly (a long series has tens of thousands of dates); the same value as below
  if (isoDate.length === 10 && isoDate.charCodeAt(4) === 45 && isoDate.charCodeAt(7) === 45) {
    const y = digits(isoDate, 0, 4), mo = digits(isoDate, 5, 7), d = digits(isoDate, 8, 10);
    if (y >= 0 && mo >= 0 && d >= 0) return Date.UTC(y, mo - 1, d) / DAY_MS;
  }
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!m) throw new RangeError(`not an ISO date (YYYY-MM-DD): "${isoDate}"`);
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) / DAY_MS;
}

/** The number written by the ASCII digits s[from, to), or −1 when one is not a digit. */
function digits(s: string, from: number, to: number): number {
  let v = 0;
  for (let i = from; i < to; i++) {
    const c = s.charCodeAt(i) - 48;
    if (c < 0 || c > 9) return -1;
    v = v * 10 + c;
  }
  return v;
}
