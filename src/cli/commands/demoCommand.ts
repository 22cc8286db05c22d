/** `sorbshare demo [--out DIR] [--json]` — the whole job on the built-in invented plant (fixtures/demo). */
import { fileURLToPath } from 'node:url';
import type { CommandSpec } from '../commandSpec.js';
import { loadProject } from '../../project/loadProject.js';
import { runAndWrite } from './projectRun.js';

/** The demo project, three folders above this file in both src/ and dist/ layouts. */
export function demoProjectPath(): string {
  return fileURLToPath(new URL('../../../fixtures/demo/project.json', import.meta.url));
}

export const demoCommand: CommandSpec = {
  name: 'demo',
  args: [],
  summary: 'The whole job on the built-in example plant (the invented Lindqvarn WWTP; all data invented)',
  options: [
    { flags: '--out <dir>', description: 'output folder (written whole or not at all)', default: 'sorbshare-demo' },
    { flags: '--json', description: 'print a JSON summary instead of text' },
  ],
  examples: ['sorbshare demo', 'sorbshare demo --out demo-output --json'],
  action(_args, opts, ctx) {
    const input = loadProject(demoProjectPath(), { demo: true });
    runAndWrite(input, String(opts.out), Boolean(opts.json), ctx);
  },
};
