/** `--separator` and `--decimal` for the commands that read CSV tables (a light module: read at every start-up). */
import type { OptionSpec } from '../commandSpec.js';

/** The table-format options shared by `fractionate`, `calibrate` and `run`. */
export const TABLE_FORMAT_OPTIONS: OptionSpec[] = [
  { flags: '--separator <char>', description: 'cell separator of the CSV tables (detected from the header when not given)', choices: [',', ';'] },
  { flags: '--decimal <char>', description: 'decimal mark of the CSV tables (detected from the numbers when not given)', choices: ['.', ','] },
];

/** The format options as the table reader takes them. */
export function tableFormat(opts: Record<string, unknown>): { separator?: ',' | ';'; decimal?: '.' | ',' } {
  return {
    ...(opts.separator !== undefined ? { separator: opts.separator as ',' | ';' } : {}),
    ...(opts.decimal !== undefined ? { decimal: opts.decimal as '.' | ',' } : {}),
  };
}
