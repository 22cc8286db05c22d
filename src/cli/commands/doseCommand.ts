/** `sorbshare dose MIXTURE.json --target ID (--removal PCT | --limit Q) [--json]` */
import type { CommandSpec } from '../commandSpec.js';
import { InputError } from '../../core/errors.js';
import { doseFor, type DoseGoal } from '../../api/equilibriumApi.js';
import { readJsonFile } from '../../io/readFiles.js';
import { readMixture } from '../../scenario/readMixture.js';
import { fmt } from '../format.js';
import { finiteNumber, nonEmptyText, positiveMassConcentration } from '../optionParsers.js';
import { inFile, optionValue } from './shared.js';

export const doseCommand: CommandSpec = {
  name: 'dose',
  args: ['<mixture>'],
  summary: 'Carbon dose that meets a removal goal or an effluent limit for one component',
  options: [
    { flags: '--target <id>', description: 'id of the component the goal applies to', parse: nonEmptyText, required: true },
    { flags: '--removal <percent>', description: 'removal goal in percent, e.g. 80', parse: finiteNumber },
    { flags: '--limit <quantity>', description: 'effluent limit, e.g. "50 ng/L"', parse: positiveMassConcentration },
    { flags: '--json', description: 'print JSON instead of text' },
  ],
  examples: ['sorbshare dose mixture.json --target T1 --removal 80', 'sorbshare dose mixture.json --target T1 --limit "50 ng/L" --json'],
  action(args, opts, ctx) {
    const file = args[0]!;
    if ((opts.removal === undefined) === (opts.limit === undefined)) throw new InputError('give exactly one of --removal PERCENT or --limit QUANTITY', { option: '--removal/--limit' });
    const goal: DoseGoal = opts.removal !== undefined ? { removal: opts.removal as number } : { limit: opts.limit as number };
    const mixture = inFile(file, () => readMixture(readJsonFile(file, 'mixture file')));
    const res = inFile(file, () => optionValue(() => doseFor(mixture, opts.target as string, goal)));
    if (opts.json) ctx.out(JSON.stringify(res, null, 2));
    else ctx.out([
      `Target ${res.target}: ${fmt(res.removal_fraction * 100, 4)} % removal at a carbon dose of ${fmt(res.dose_mg_per_L, 5)} mg/L (${fmt(res.dose_mg_per_L, 5)} g/m³)`,
      'Equilibrium estimate (batch IAST): real contact times give less removal; confirm with jar and pilot tests.',
    ].join('\n'));
  },
};
