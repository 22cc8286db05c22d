/**
 * The command-line entry point: builds commander from the command specs, runs one command and
 * maps errors to exit codes (0 success, 1 computation failed, 2 bad input). Nothing is printed to
 * stdout on failure: commands hand their whole output to ctx.out only when it is complete.
 */
import { Command, CommanderError, Option } from 'commander';
import '../uncertainty/idleReading.js'; // the machine's idle time at start-up, for spareCore (src/uncertainty/sharedTraceOutlets.ts)
import { ComputationError, InputError } from '../core/errors.js';
import { attributeName, fullDescription, longFlag, type CommandContext, type OptionSpec } from './commandSpec.js';
import { COMMANDS } from './commands/index.js';
import { VERSION } from '../version.js';

export interface RunIO {
  stdout: (s: string) => void;
  stderr: (s: string) => void;
  isTTY?: boolean;
}

const defaultIO: RunIO = {
  stdout: (s) => process.stdout.write(s),
  stderr: (s) => process.stderr.write(s),
  isTTY: Boolean(process.stderr.isTTY),
};

/**
 * commander's option from a spec: the spec's parser becomes the `argParser` (its InputError gains
 * the option name), its choices commander's `choices`, and its default is parsed like a typed value.
 */
export function toCommanderOption(o: OptionSpec): Option {
  const opt = new Option(o.flags, fullDescription(o));
  const option = longFlag(o);
  const what = /<([^>]+)>/.exec(o.flags)?.[1] ?? 'value'; // "--model <model>" → "model"
  const parse = (text: string): unknown => {
    if (o.choices && !o.choices.includes(text)) throw new InputError(`unknown ${what} ${JSON.stringify(text)}; expected one of ${o.choices.join(', ')}`, { option });
    if (!o.parse) return text;
    try {
      return o.parse(text);
    } catch (e) {
      if (e instanceof InputError) throw new InputError(e.expected, { option });
      throw e;
    }
  };
  if (o.choices) opt.choices(o.choices); // listed in --help; the check itself is `parse` above
  if (o.parse || o.choices) opt.argParser(parse);
  if (o.default !== undefined) opt.default(parse(o.default), o.default);
  return opt;
}

/** Run the CLI with `argv` (without node and script). Resolves to the exit code. */
export async function runCli(argv: string[], io: RunIO = defaultIO): Promise<number> {
  const outBuf: string[] = [];
  const ctx: CommandContext = {
    out: (t) => outBuf.push(t.endsWith('\n') ? t : t + '\n'),
    err: (t) => io.stderr(t),
    isTTY: io.isTTY ?? false,
  };
  const program = new Command('sorbshare')
    .description('Competitive adsorption of effluent organic matter and micropollutants on activated carbon: equilibrium, doses, costs and set-points.')
    .version(VERSION, '-V, --version')
    .exitOverride()
    .configureOutput({ writeOut: (s) => outBuf.push(s), writeErr: (s) => io.stderr(s) })
    .showHelpAfterError('(run with --help for usage)');
  for (const spec of COMMANDS) {
    const cmd = program.command(spec.name).description(spec.summary);
    for (const a of spec.args) cmd.argument(a);
    for (const o of spec.options) cmd.addOption(toCommanderOption(o));
    if (spec.examples?.length) cmd.addHelpText('after', `\nExamples:\n${spec.examples.map((e) => `  ${e}`).join('\n')}\n`);
    cmd.exitOverride();
    cmd.action(async (...params: unknown[]) => {
      const positional = params.slice(0, spec.args.length) as string[];
      const options = params[spec.args.length] as Record<string, unknown>;
      const given = new Set(spec.options.map(attributeName).filter((k) => cmd.getOptionValueSource(k) === 'cli'));
      for (const o of spec.options) {
        if (o.required && options[attributeName(o)] === undefined) throw new InputError(`missing; expected ${o.description}`, { option: longFlag(o) });
      }
      await spec.action(positional, options, ctx, given);
    });
  }
  try {
    await program.parseAsync(argv, { from: 'user' });
    for (const s of outBuf) io.stdout(s);
    return 0;
  } catch (e) {
    if (e instanceof CommanderError) {
      if (e.code === 'commander.helpDisplayed' || e.code === 'commander.version' || e.code === 'commander.help') {
        for (const s of outBuf) io.stdout(s);
        return 0;
      }
      return 2; // commander already printed its message to stderr
    }
    if (e instanceof InputError) {
      io.stderr(`sorbshare: bad input: ${e.message}\n`);
      return 2;
    }
    if (e instanceof ComputationError) {
      io.stderr(`sorbshare: computation failed: ${e.message}\n`);
      return 1;
    }
    io.stderr(`sorbshare: internal error: ${(e as Error).stack ?? String(e)}\n`);
    return 1;
  }
}
