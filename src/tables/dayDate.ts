/**
 * A calendar day written as ISO 8601 (YYYY-MM-DD) or day.month.year (D.M.YYYY or DD.MM.YYYY, the
 * European spreadsheet form), returned as ISO YYYY-MM-DD. Slashes (1/3/2024) are rejected: they
 * mean month/day in some locales and day/month in others.
 */
const ISO = /^(\d{4})-(\d{2})-(\d{2})(?:[T ]00:00(?::00(?:\.0+)?)?Z?)?$/;
const DMY = /^(\d{1,2})\.(\d{1,2})\.(\d{4})(?: 00:00(?::00)?)?$/;

/** The ISO date of `text`, or undefined when it is not a valid day in one of the two forms. */
export function parseDayDate(text: string): string | undefined {
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
