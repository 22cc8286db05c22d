/** `sorbshare contact MIXTURE.json --dose Q (--time "1,5,15,30 min" | --contact-time T [--carbon-age A]) [--json]` */
import type { CommandSpec } from '../commandSpec.js';
import { InputError } from '../../core/errors.js';
import type { ContactOverTimeResult, ContactSteadyStateResult } from '../../api/contactApi.js';
import { readJsonFile } from '../../io/readFiles.js';
import { fmt, fmtConc, fmtDuration, fmtInput, fmtPercent, table } from '../format.js';
import { positiveMassConcentration, positiveTime, timeList } from '../optionParsers.js';
import { inFile } from './shared.js';
import { snakeCaseJsonText } from '../../output/snakeCaseJson.js';

export const contactCommand: CommandSpec = {
  name: 'contact',
  args: ['<mixture>'],
  summary: 'PAC contact kinetics (surface diffusion with IAST at the particle surface): removal over time in a batch, or in a stirred contact tank with recirculated carbon at steady state',
  options: [
    { flags: '--dose <quantity>', description: 'carbon dose, e.g. "20 mg/L" (default: the dose in the mixture file)', parse: positiveMassConcentration },
    { flags: '--time <list>', description: 'contact times of a batch (jar test, plug-flow tank), e.g. "1,5,15,30,60 min"', parse: timeList },
    { flags: '--contact-time <time>', description: 'water residence time of a stirred contact tank, e.g. "30 min"', parse: positiveTime },
    { flags: '--carbon-age <time>', description: 'mean carbon age with recirculation, e.g. "3 d" (default: the contact time, no recirculation)', parse: positiveTime },
    { flags: '--json', description: 'print JSON instead of a table' },
  ],
  examples: ['sorbshare contact mixture.json --dose "20 mg/L" --time "1,5,15,30,60 min"', 'sorbshare contact mixture.json --dose "10 mg/L" --contact-time "30 min" --carbon-age "3 d" --json'],
  async action(args, opts, ctx) {
    const { readKineticMixture } = await import('../../scenario/readKineticInputs.js');
    const { contactOverTime, contactSteadyState } = await import('../../api/contactApi.js');
    const file = args[0]!;
    const times = opts.time as number[] | undefined;
    const contactTime = opts.contactTime as number | undefined;
    const carbonAge = opts.carbonAge as number | undefined;
    if ((times === undefined) === (contactTime === undefined)) throw new InputError('give exactly one of --time LIST (batch) or --contact-time T (stirred tank)', { option: '--time/--contact-time' });
    if (carbonAge !== undefined && contactTime === undefined) throw new InputError('--carbon-age needs --contact-time (the stirred contact tank)', { option: '--carbon-age' });
    const mixture = inFile(file, () => readKineticMixture(readJsonFile(file, 'mixture file')));
    if (times !== undefined) {
      const res = inFile(file, () => contactOverTime(mixture, times, opts.dose as number | undefined));
      ctx.out(opts.json ? snakeCaseJsonText(res) : renderOverTime(res));
    } else {
      const res = inFile(file, () => contactSteadyState(mixture, contactTime!, carbonAge, opts.dose as number | undefined));
      ctx.out(opts.json ? snakeCaseJsonText(res) : renderSteady(res));
    }
  },
};

const CAUTION = 'Planning estimate from the surface diffusion model: mixing, temperature and preloading change real removal; confirm with jar and pilot tests, and leave design decisions to a licensed engineer.';

function renderOverTime(r: ContactOverTimeResult): string {
  const rows = r.times_s.map((t, k) => [fmtDuration(t), ...r.components.map((c) => fmtPercent(c.removal_fraction[k]! * 100))]);
  return [
    `Carbon dose ${fmtInput(r.dose_mg_per_L)} mg/L — removal (%) over contact time in a batch (HSDM, IAST at the particle surface)`,
    '',
    table(['time', ...r.components.map((c) => c.id)], rows),
    '',
    CAUTION,
  ].join('\n');
}

function renderSteady(r: ContactSteadyStateResult): string {
  const rows = r.components.map((c) => [c.id, fmtConc(c.c0_mg_per_L), fmtConc(c.c_mg_per_L), fmt(c.q_mg_per_g), fmtPercent(c.removal_fraction * 100)]);
  return [
    `Stirred contact tank at steady state: carbon dose ${fmtInput(r.dose_mg_per_L)} mg/L, residence ${fmtDuration(r.contact_time_s)}, mean carbon age ${fmtDuration(r.carbon_age_s)}; carbon held ${fmt(r.carbon_held_mg_per_L)} mg/L`,
    '',
    table(['id', 'c0', 'c (outlet)', 'q leaving (mg/g)', 'removal %'], rows),
    '',
    CAUTION,
  ].join('\n');
}
