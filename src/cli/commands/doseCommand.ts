/** `sorbshare dose MIXTURE.json --target ID (--removal PCT | --limit Q) [--json]` */
import type { CommandContext, CommandSpec, OptionValues } from '../commandSpec.js';
import { InputError } from '../../core/errors.js';
import { doseFor, type DoseGoal } from '../../api/equilibriumApi.js';
import { readJsonFile } from '../../io/readFiles.js';
import { readMixture } from '../../scenario/readMixture.js';
import { fmt, fmtDuration, fmtPercent } from '../format.js';
import { finiteNumber, nonEmptyText, positiveMassConcentration, positiveTime } from '../optionParsers.js';
import { inFile, optionValue } from './shared.js';
import { snakeCaseJsonText } from '../../output/snakeCaseJson.js';

export const doseCommand: CommandSpec = {
  name: 'dose',
  args: ['<mixture>'],
  summary: 'Carbon dose that meets a removal goal or an effluent limit for one component',
  options: [
    { flags: '--target <id>', description: 'id of the component the goal applies to', parse: nonEmptyText, required: true },
    { flags: '--removal <percent>', description: 'removal goal in percent, e.g. 80', parse: finiteNumber },
    { flags: '--limit <quantity>', description: 'effluent limit, e.g. "50 ng/L"', parse: positiveMassConcentration },
    { flags: '--contact-time <time>', description: 'dose under PAC contact: residence time of a stirred contact tank, e.g. "30 min" (needs the kinetic inputs in the mixture file)', parse: positiveTime },
    { flags: '--carbon-age <time>', description: 'mean carbon age with recirculation, e.g. "3 d" (default: the contact time)', parse: positiveTime },
    { flags: '--json', description: 'print JSON instead of text' },
  ],
  examples: ['sorbshare dose mixture.json --target T1 --removal 80', 'sorbshare dose mixture.json --target T1 --limit "50 ng/L" --json', 'sorbshare dose mixture.json --target T1 --removal 80 --contact-time "30 min" --carbon-age "3 d"'],
  async action(args, opts, ctx) {
    const file = args[0]!;
    if ((opts.removal === undefined) === (opts.limit === undefined)) throw new InputError('give exactly one of --removal PERCENT or --limit QUANTITY', { option: '--removal/--limit' });
    const goal: DoseGoal = opts.removal !== undefined ? { removal: opts.removal as number } : { limit: opts.limit as number };
    if (opts.carbonAge !== undefined && opts.contactTime === undefined) throw new InputError('--carbon-age needs --contact-time (the stirred contact tank)', { option: '--carbon-age' });
    if (opts.contactTime !== undefined) {
      await contactDoseAction(file, opts, goal, ctx);
      return;
    }
    const mixture = inFile(file, () => readMixture(readJsonFile(file, 'mixture file')));
    for (const w of mixture.warnings ?? []) ctx.err(`sorbshare: warning: ${w}\n`);
    const res = inFile(file, () => optionValue(() => doseFor(mixture, opts.target as string, goal)));
    if (opts.json) ctx.out(snakeCaseJsonText(res));
    else ctx.out([
      `Target ${res.target}: ${fmtPercent(res.removal_fraction * 100)} % removal at a carbon dose of ${fmt(res.dose_mg_per_L)} mg/L`,
      'Equilibrium estimate (batch IAST): real contact times give less removal; confirm with jar and pilot tests.',
    ].join('\n'));
  },
};

/** The dose under PAC contact conditions (stirred contact tank at steady state). */
async function contactDoseAction(file: string, opts: OptionValues, goal: DoseGoal, ctx: CommandContext): Promise<void> {
  const { readKineticMixture } = await import('../../scenario/readKineticInputs.js');
  const { contactDose } = await import('../../api/contactApi.js');
  const { goalToRemovalFraction } = await import('../../api/equilibriumApi.js');
  const mixture = inFile(file, () => readKineticMixture(readJsonFile(file, 'mixture file')));
  const target = opts.target as string;
  const comp = mixture.components.find((c) => c.id === target);
  if (!comp) throw new InputError(`target "${target}" is not in the mixture; its ids are ${mixture.components.map((c) => `"${c.id}"`).join(', ')}`, { option: '--target' });
  const R = optionValue(() => goalToRemovalFraction(goal, comp.c0MgPerL, target));
  const res = inFile(file, () => contactDose(mixture, target, R, opts.contactTime as number, opts.carbonAge as number | undefined));
  if (opts.json) ctx.out(snakeCaseJsonText(res));
  else ctx.out([
    `Target ${res.target}: ${fmtPercent(res.removal_fraction * 100)} % removal at a carbon dose of ${fmt(res.dose_mg_per_L)} mg/L in a stirred contact tank (residence ${fmtDuration(res.contact_time_s)}, mean carbon age ${fmtDuration(res.carbon_age_s)})`,
    `Equilibrium dose for the same goal: ${fmt(res.equilibrium_dose_mg_per_L)} mg/L (the contact tank needs ${fmt(res.dose_mg_per_L / res.equilibrium_dose_mg_per_L)} times as much).`,
    'Planning estimate from the surface diffusion model; confirm with jar and pilot tests, and leave design decisions to a licensed engineer.',
  ].join('\n'));
}
