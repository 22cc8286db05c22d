/** `sorbshare equilibrium MIXTURE.json [--dose Q | --from Q --to Q --points N] [--json]` */
import type { CommandSpec } from '../commandSpec.js';
import { InputError } from '../../core/errors.js';
import { equilibrium, equilibriumCurve, type EquilibriumResult } from '../../api/equilibriumApi.js';
import { readJsonFile } from '../../io/readFiles.js';
import { readMixture } from '../../scenario/readMixture.js';
import { fmt, fmtConc, fmtInput, fmtPercent, table } from '../format.js';
import { positiveMassConcentration, wholeNumber } from '../optionParsers.js';
import { inFile, optionValue } from './shared.js';
import { snakeCaseJsonText } from '../../output/snakeCaseJson.js';

export const equilibriumCommand: CommandSpec = {
  name: 'equilibrium',
  args: ['<mixture>'],
  summary: 'Batch IAST equilibrium of a mixture file at one carbon dose or over a log-spaced dose sweep',
  options: [
    { flags: '--dose <quantity>', description: 'carbon dose, e.g. "20 mg/L" (default: the dose in the mixture file)', parse: positiveMassConcentration },
    { flags: '--from <quantity>', description: 'first dose of a sweep, e.g. "1 mg/L"', parse: positiveMassConcentration },
    { flags: '--to <quantity>', description: 'last dose of a sweep, e.g. "100 mg/L"', parse: positiveMassConcentration },
    { flags: '--points <n>', description: 'number of log-spaced doses in the sweep', parse: wholeNumber(2, 100000), default: '25' },
    { flags: '--json', description: 'print JSON instead of a table' },
  ],
  examples: ['sorbshare equilibrium mixture.json --dose "15 mg/L"', 'sorbshare equilibrium mixture.json --from "1 mg/L" --to "100 mg/L" --points 30 --json'],
  action(args, opts, ctx) {
    const file = args[0]!;
    const mixture = inFile(file, () => readMixture(readJsonFile(file, 'mixture file')));
    for (const w of mixture.warnings ?? []) ctx.err(`sorbshare: warning: ${w}\n`);
    const sweep = opts.from !== undefined || opts.to !== undefined;
    if (sweep) {
      if (opts.dose !== undefined) throw new InputError('give either --dose or --from/--to, not both', { option: '--dose' });
      if (opts.from === undefined || opts.to === undefined) throw new InputError('a sweep needs both --from and --to', { option: opts.from === undefined ? '--from' : '--to' });
      const res = inFile(file, () => optionValue(() => equilibriumCurve(mixture, opts.from as number, opts.to as number, opts.points as number)));
      if (opts.json) ctx.out(snakeCaseJsonText(res));
      else ctx.out(renderCurve(res.curve));
      return;
    }
    const res = inFile(file, () => optionValue(() => equilibrium(mixture, opts.dose as number | undefined)));
    if (opts.json) ctx.out(snakeCaseJsonText(res));
    else ctx.out(renderOne(res));
  },
};

function renderOne(r: EquilibriumResult): string {
  const rows = r.components.map((c) => [c.id, fmtConc(c.c0_mg_per_L), fmtConc(c.c_mg_per_L), fmt(c.q_mg_per_g), fmtPercent(c.removal_fraction * 100)]);
  return [
    `Carbon dose ${fmtInput(r.dose_mg_per_L)} mg/L — batch IAST equilibrium (mass-based, Freundlich)`,
    '',
    table(['id', 'c0', 'c (equilibrium)', 'q (mg/g)', 'removal %'], rows),
    '',
    'Equilibrium estimate: contact time, carbon age and preloading lower real removal; confirm with jar tests.',
  ].join('\n');
}

function renderCurve(curve: EquilibriumResult[]): string {
  const ids = curve[0]?.components.map((c) => c.id) ?? [];
  const rows = curve.map((r) => [fmt(r.dose_mg_per_L), ...r.components.map((c) => fmtPercent(c.removal_fraction * 100))]);
  return ['Removal (%) against carbon dose — batch IAST', '', table(['dose mg/L', ...ids], rows)].join('\n');
}
