/** `sorbshare run PROJECT.json [--out DIR] [--json]` — the whole job from a project file. */
import type { CommandSpec } from '../commandSpec.js';
import { MONTE_CARLO_OPTIONS, monteCarloOverrides } from './monteCarloOptions.js';
import { nonEmptyText } from '../optionParsers.js';
import { TABLE_FORMAT_OPTIONS, tableFormat } from './tableFormatOptions.js';

export const runCommand: CommandSpec = {
  name: 'run',
  args: ['<project>'],
  summary: 'The whole job from a project file: background, calibration, doses per compound and carbon, daily doses over the DOC series, indicator check, report',
  options: [
    { flags: '--out <dir>', description: 'output folder (written whole or not at all)', parse: nonEmptyText, default: 'sorbshare-output' },
    { flags: '--json', description: 'print a JSON summary instead of text' },
    { flags: '--pdf', description: 'also write report.pdf (A4), printed by the installed Chromium' },
    ...MONTE_CARLO_OPTIONS,
    ...TABLE_FORMAT_OPTIONS,
  ],
  examples: ['sorbshare run project.json --out results', 'sorbshare run project.json --draws 2000 --seed 7', 'sorbshare run project.json --out results --json', 'sorbshare run project.json --out results --pdf'],
  async action(args, opts, ctx) {
    const mc = monteCarloOverrides(opts);
    const { loadProject } = await import('../../io/loadProject.js');
    const { runAndWrite } = await import('./projectRun.js');
    const input = loadProject(args[0]!, { format: tableFormat(opts) });
    await runAndWrite(input, String(opts.out), Boolean(opts.json), ctx, mc, { pdf: Boolean(opts.pdf) });
  },
};
