/** `sorbshare run PROJECT.json [--out DIR] [--json]` — the whole job from a project file. */
import type { CommandSpec } from '../commandSpec.js';
import { MONTE_CARLO_OPTIONS, monteCarloOverrides } from './monteCarloOptions.js';
import { nonEmptyText } from '../optionParsers.js';

export const runCommand: CommandSpec = {
  name: 'run',
  args: ['<project>'],
  summary: 'The whole job from a project file: background, calibration, doses per compound and carbon, daily doses over the DOC series, indicator check, report',
  options: [
    { flags: '--out <dir>', description: 'output folder (written whole or not at all)', parse: nonEmptyText, default: 'sorbshare-output' },
    { flags: '--json', description: 'print a JSON summary instead of text' },
    ...MONTE_CARLO_OPTIONS,
  ],
  examples: ['sorbshare run project.json --out results', 'sorbshare run project.json --draws 2000 --seed 7', 'sorbshare run project.json --out results --json'],
  async action(args, opts, ctx) {
    const mc = monteCarloOverrides(opts);
    const { loadProject } = await import('../../project/loadProject.js');
    const { runAndWrite } = await import('./projectRun.js');
    const input = loadProject(args[0]!);
    await runAndWrite(input, opts.out as string, Boolean(opts.json), ctx, mc);
  },
};
