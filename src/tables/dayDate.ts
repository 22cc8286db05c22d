/**
 * A calendar day written as ISO 8601 (YYYY-MM-DD) or day.month.year (D.M.YYYY or DD.MM.YYYY, the
 * European spreadsheet form), returned as ISO YYYY-MM-DD. Slashes (1/3/2024) are rejected: they
 * mean month/day in some locales and day/month in others.
 */
const ISO = /^(\d{4})-(\d{2})-(\d{2})(?:[T ]00:00(?::00(?:\.0+)?)?Z?)?$/;
const DMY = /^(\d{1,2})\.(\d{1,2})\.(\d{4})(?: 00:00(?::00)?)?$/;

const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** `t` when it is exactly YYYY-MM-DD of a valid day of the years 1000–9999 (the common case, checked without Date objects); else undefined. */
function plainIso(t: string): string | undefined {
  if (t.length !== 10 || t.charCodeAt(4) !== 45 || t.charCodeAt(7) !== 45) return undefined;
  let y = 0, m = 0, d = 0;
  for (let i = 0; i < 10; i++) {
    if (i === 4 || i === 7) continue;
    const c = t.charCodeAt(i) - 48;
    if (c < 0 || c > 9) return undefined;
    if (i < 4) y = y * 10 + c; else if (i < 7) m = m * 10 + c; else d = d * 10 + c;
  }
  if (y < 1000 || m < 1 || m > 12 || d < 1) return undefined;
  const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  return d <= (m === 2 && leap ? 29 : DAYS_IN_MONTH[m - 1]!) ? t : undefined;
}

/** The ISO date of `text`, or undefined when it is not a valid day in one of the two forms. */
export function parseDayDate(text: string): string | undefined {
  const fast = plainIso(text);
  if (fast !== undefined) return fast;
  const t = text.trim();
  let y: number, m: number, d: number;
  const iso = ISO.exec(t);
  const dmy = DMY.exec(t);
  if (iso) { y = Number(iso[1]); m = Number(iso[2]); d = Number(iso[3]); }
  else if (dmy) { d = Number(dmy[1]); m = Number(dmy[2]); y = Number(dmy[3]); }
  else return undefined;
  const ms = Date.UTC(y, m - 1, d);
  const out = new Date(ms).toISOString().slice(0, 10);
  const back = new Date(ms);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== m - 1 || back.getUTCDate() !== d) return undefined;
  return out;
}
