/**
 * How a yearly figure says it was annualised, the same words everywhere (run, Monte Carlo,
 * tables, report): a series of 365 or 366 days is a year and its sum is the yearly figure; any
 * other series is scaled by 365/days and labelled "annualised from N days".
 */

/** True unless the series is one whole year (365 or 366 days). */
export function isAnnualised(days: number): boolean {
  return !(days === 365 || days === 366);
}

/** "" for a whole year, else "annualised from N days". */
export function annualisedNote(days: number): string {
  return isAnnualised(days) ? `annualised from ${days} day${days === 1 ? '' : 's'}` : '';
}

/** A label with the note in parentheses when annualised: "yearly carbon mass (annualised from 120 days)". */
export function yearlyLabel(what: string, days: number): string {
  const note = annualisedNote(days);
  return note ? `${what} (${note})` : what;
}
