/** `sorbshare demo [--out DIR] [--json]` — the whole job on the built-in invented plant (fixtures/demo). */
import { fileURLToPath } from 'node:url';
import type { CommandSpec } from '../commandSpec.js';
import { MONTE_CARLO_OPTIONS, monteCarloOverrides } from './monteCarloOptions.js';
import { nonEmptyText } from '../optionParsers.js';

/** The demo project, three folders above this file in both src/ and dist/ layouts. */
export function demoProjectPath(): string {
  return fileURLToPath(new URL('../../../fixtures/demo/project.json', import.meta.url));
}

export const demoCommand: CommandSpec = {
  name: 'demo',
  args: [],
  summary: 'The whole job on the built-in example plant (the invented Lindqvarn WWTP; all data invented)',
  options: [
    { flags: '--out <dir>', description: 'output folder (written whole or not at all)', parse: nonEmptyText, default: 'sorbshare-demo' },
    { flags: '--json', description: 'print a JSON summary instead of text' },
    ...MONTE_CARLO_OPTIONS,
  ],
  examples: ['sorbshare demo', 'sorbshare demo --draws 0', 'sorbshare demo --out demo-output --json'],
  async action(_args, opts, ctx) {
    const mc = monteCarloOverrides(opts);
    const { loadProject } = await import('../../project/loadProject.js');
    const { runAndWrite } = await import('./projectRun.js');
    const input = loadProject(demoProjectPath(), { demo: true });
    await runAndWrite(input, opts.out as string, Boolean(opts.json), ctx, mc);
  },
};
