/**
 * CLI commands are declared as data (STYLE.md rule 11): the spec drives commander's flags, the
 * help text and the README's option table.
 */
export interface OptionSpec {
  /** commander flags, e.g. "--dose <quantity>" */
  flags: string;
  description: string;
  default?: string | boolean | number;
}

export interface CommandContext {
  /** Print to standard output (only after the whole result is ready). */
  out(text: string): void;
  /** Progress and notes on standard error. */
  err(text: string): void;
  /** True when stderr is a terminal (progress bars may redraw). */
  isTTY: boolean;
}

export interface CommandSpec {
  name: string;
  /** Positional arguments, e.g. ["<mixture>"] */
  args: string[];
  summary: string;
  options: OptionSpec[];
  /** Extra help text (examples). */
  examples?: string[];
  action(args: string[], options: Record<string, unknown>, ctx: CommandContext): Promise<void> | void;
}
