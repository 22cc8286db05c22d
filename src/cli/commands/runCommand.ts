/** `sorbshare run PROJECT.json [--out DIR] [--json]` — the whole job from a project file. */
import type { CommandSpec } from '../commandSpec.js';
import { loadProject } from '../../project/loadProject.js';
import { runAndWrite } from './projectRun.js';

export const runCommand: CommandSpec = {
  name: 'run',
  args: ['<project>'],
  summary: 'The whole job from a project file: background, calibration, doses per compound and carbon, daily doses over the DOC series, indicator check, report',
  options: [
    { flags: '--out <dir>', description: 'output folder (written whole or not at all)', default: 'sorbshare-output' },
    { flags: '--json', description: 'print a JSON summary instead of text' },
  ],
  examples: ['sorbshare run project.json --out results', 'sorbshare run project.json --out results --json'],
  action(args, opts, ctx) {
    const input = loadProject(args[0]!);
    runAndWrite(input, String(opts.out), Boolean(opts.json), ctx);
  },
};
