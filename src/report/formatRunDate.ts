/** The run's ISO date-time shown as "YYYY-MM-DD HH:MM UTC"; text that is not a date is shown as given. */
export function formatRunDate(iso: string): string {
  const t = Date.parse(iso);
  if (!Number.isFinite(t)) return String(iso);
  const d = new Date(t).toISOString();
  return `${d.slice(0, 10)} ${d.slice(11, 16)} UTC`;
}
