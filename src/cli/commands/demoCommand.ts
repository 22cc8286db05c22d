/**
 * `sorbshare demo [--contact] [--out DIR] [--json]` — the whole job on the built-in invented plant
 * (fixtures/demo): `project.json` (PAC at equilibrium contact, GAC with its fixed-bed model), or
 * with `--contact` `project-contact.json` (the same plant with a 30-minute stirred contact tank and
 * a mean carbon age of 3 days, kinetic jar tests fitted in the run: about half a minute of CPU without draws).
 */
import { fileURLToPath } from 'node:url';
import type { CommandSpec } from '../commandSpec.js';
import { MONTE_CARLO_OPTIONS, monteCarloOverrides } from './monteCarloOptions.js';
import { nonEmptyText } from '../optionParsers.js';

/** The demo project (`contact`: the variant under PAC contact conditions), three folders above this file in both src/ and dist/ layouts. */
export function demoProjectPath(contact = false): string {
  return fileURLToPath(new URL(`../../../fixtures/demo/${contact ? 'project-contact.json' : 'project.json'}`, import.meta.url));
}

export const demoCommand: CommandSpec = {
  name: 'demo',
  args: [],
  summary: 'The whole job on the built-in example plant (the invented Lindqvarn WWTP; all data invented)',
  options: [
    { flags: '--out <dir>', description: 'output folder (written whole or not at all)', parse: nonEmptyText, default: 'sorbshare-demo' },
    { flags: '--json', description: 'print a JSON summary instead of text' },
    { flags: '--pdf', description: 'also write report.pdf (A4), printed by the installed Chromium' },
    { flags: '--contact', description: 'the plant with a 30-minute stirred PAC contact tank and 3 days of carbon age (kinetic doses: about half a minute of CPU without draws; add --draws 0 to skip its Monte Carlo: 100 contact draws per PAC carbon, about six minutes of CPU)' },
    ...MONTE_CARLO_OPTIONS,
  ],
  examples: ['sorbshare demo', 'sorbshare demo --draws 0', 'sorbshare demo --out demo-output --json', 'sorbshare demo --contact --draws 0 --out demo-contact'],
  async action(_args, opts, ctx) {
    const mc = monteCarloOverrides(opts);
    const { loadProject } = await import('../../io/loadProject.js');
    const { runAndWrite } = await import('./projectRun.js');
    const input = loadProject(demoProjectPath(Boolean(opts.contact)), { demo: true });
    await runAndWrite(input, String(opts.out), Boolean(opts.json), ctx, mc, { pdf: Boolean(opts.pdf) });
  },
};
