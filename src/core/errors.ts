/**
 * One error hierarchy for the whole tool.
 *
 * - `InputError`: the user's input is wrong (file, row, column or JSON path, and what was
 *   expected). The CLI maps it to exit code 2.
 * - `ComputationError`: the input was valid but a solver or fitter could not produce a
 *   trustworthy answer (with the reason). The CLI maps it to exit code 1.
 */

export interface InputLocation {
  /** File the value came from, when it came from a file. */
  file?: string;
  /** 1-based data row (CSV), counted as a spreadsheet user would (header is row 1). */
  row?: number;
  /** Column header (CSV) or field name. */
  column?: string;
  /** JSON path such as `components[2].K`. */
  path?: string;
  /** Command-line option such as `--dose`. */
  option?: string;
}

/** Base class of the errors sorbshare throws on purpose (InputError: bad input, exit 2; ComputationError: a computation failed, exit 1). */
export class SorbshareError extends Error {
  override name = 'SorbshareError';
}

export class InputError extends SorbshareError {
  override name = 'InputError';
  readonly location: InputLocation;
  readonly expected: string;
  constructor(expected: string, location: InputLocation = {}) {
    super(formatInputMessage(expected, location));
    this.location = location;
    this.expected = expected;
  }
  /** The same error with more location detail (outer layers know the file name). */
  at(extra: InputLocation): InputError {
    const merged: InputLocation = { ...extra, ...this.location };
    if (extra.path && this.location.path) merged.path = joinPath(extra.path, this.location.path);
    return new InputError(this.expected, merged);
  }
}

export class ComputationError extends SorbshareError {
  override name = 'ComputationError';
  readonly reason: string;
  constructor(reason: string) {
    super(reason);
    this.reason = reason;
  }
}

function joinPath(outer: string, inner: string): string {
  if (inner.startsWith('[')) return outer + inner;
  return `${outer}.${inner}`;
}

export function formatInputMessage(expected: string, loc: InputLocation): string {
  const parts: string[] = [];
  if (loc.file) parts.push(loc.file);
  if (loc.row !== undefined) parts.push(`row ${loc.row}`);
  if (loc.column !== undefined) parts.push(`column "${loc.column}"`);
  if (loc.path !== undefined) parts.push(`field ${loc.path}`);
  if (loc.option !== undefined) parts.push(`option ${loc.option}`);
  return parts.length ? `${parts.join(', ')}: ${expected}` : expected;
}
