/**
 * Neutralising CSV cells that a spreadsheet would run as a formula (CSV injection), following
 * OWASP's "CSV Injection" guidance (common practice): a text cell that starts with `=`, `+`,
 * `-`, `@`, a tab or a carriage return gets a single quote in front, so the spreadsheet shows it
 * as text. A cell that is a plain number (`-3.5`, `+2`, `1e-6`) is left as it is.
 */

const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/** The cell text safe to open in a spreadsheet. */
export function neutraliseCsvCell(text: string): string {
  return FORMULA_START.test(text) && !PLAIN_NUMBER.test(text) ? `'${text}` : text;
}
