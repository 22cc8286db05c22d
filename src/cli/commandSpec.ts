/**
 * CLI commands are declared as data: one `CommandSpec` per command, one `OptionSpec` per option.
 * The same spec builds commander's flags (with its `argParser` and `choices`), the `--help` text
 * and the README's option table (`npm run readme`). See DEVELOPERS.md, "Commands and options".
 */

/** One command-line option. */
export interface OptionSpec {
  /** commander flags: "--dose <quantity>" for an option with a value, "--json" for a switch. */
  flags: string;
  /** One line for `--help` and the README (choices, default and "required" are added from the fields below). */
  description: string;
  /**
   * Turns the typed text into the value the action receives (a number in the internal unit, a
   * list, …). Throw `InputError(expected)`: the CLI adds the option name and exits 2. Parsers
   * live in `src/cli/optionParsers.ts`. Without `parse` the action receives the text.
   */
  parse?: (text: string) => unknown;
  /** The only values allowed (commander's `choices`; listed in the help and the README). */
  choices?: readonly string[];
  /** The default, written as a user would type it; parsed with `parse` like a typed value. */
  default?: string;
  /** The option must be given (exit 2 naming the option otherwise). */
  required?: boolean;
}

export interface CommandContext {
  /** Print to standard output (only after the whole result is ready). */
  out(text: string): void;
  /** Progress and notes on standard error. */
  err(text: string): void;
  /** True when stderr is a terminal (progress bars may redraw). */
  isTTY: boolean;
}

/**
 * Option values as the action receives them, keyed by commander's attribute name (`--k-grid` →
 * `kGrid`): parsed values, `true` for a given switch, undefined when neither given nor defaulted.
 */
export type OptionValues = Record<string, unknown>;

export interface CommandSpec {
  name: string;
  /** Positional arguments, e.g. ["<mixture>"] */
  args: string[];
  summary: string;
  options: OptionSpec[];
  /** Example command lines (help text and README). */
  examples?: string[];
  /**
   * Runs the command. `given` holds the attribute names of the options typed on the command
   * line (as opposed to defaults), for options whose default depends on another option.
   */
  action(args: string[], options: OptionValues, ctx: CommandContext, given: ReadonlySet<string>): Promise<void> | void;
}

/** The long option name of a spec, e.g. "--k-grid". */
export function longFlag(o: OptionSpec): string {
  return /--[\w-]+/.exec(o.flags)?.[0] ?? o.flags;
}

/** commander's attribute name of a spec, e.g. "kGrid" for "--k-grid <list>". */
export function attributeName(o: OptionSpec): string {
  return longFlag(o).replace(/^--/, '').replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());
}

/**
 * The description with "required" (and, for the README, the choices) spelled out; commander's
 * help lists the choices itself.
 */
export function fullDescription(o: OptionSpec, withChoices = false): string {
  const extra: string[] = [];
  if (o.choices && withChoices) extra.push(`one of ${o.choices.join(', ')}`);
  if (o.required) extra.push('required');
  return extra.length ? `${o.description} (${extra.join('; ')})` : o.description;
}
