/** `sorbshare column MIXTURE.json --ebct T --bed-depth L [--porosity 0.4] [--to-bv N] [--temperature C] [--points N] [--json]` */
import type { CommandSpec } from '../commandSpec.js';
import { InputError } from '../../core/errors.js';
import type { ColumnJson } from '../../api/fixedBedApi.js';
import { readJsonFile } from '../../io/readFiles.js';
import { fmt, fmtConc, fmtCount, fmtInput, fmtPercent, table } from '../format.js';
import { finiteNumber, positiveLength, positiveNumber, positiveTime, wholeNumber } from '../optionParsers.js';
import { inFile } from './shared.js';
import { snakeCaseJsonText } from '../../output/snakeCaseJson.js';

/** Library argument paths and the options that set them. */
const COLUMN_OPTIONS: Record<string, string> = { 'bed.ebctS': '--ebct', 'bed.bedDepthM': '--bed-depth', 'bed.porosity': '--porosity', porosity: '--porosity', toBedVolumes: '--to-bv', temperatureC: '--temperature', points: '--points' };

/** Run `f`; an InputError about an option's value (a library argument path, never a file's) names the option only. */
export function columnOptionValue<T>(f: () => T, map: Record<string, string> = COLUMN_OPTIONS): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.location.path && map[e.location.path]) throw new InputError(e.expected, { option: map[e.location.path]! });
    throw e;
  }
}

export const columnCommand: CommandSpec = {
  name: 'column',
  args: ['<mixture>'],
  summary: 'GAC fixed-bed breakthrough of every component (plug flow, film, surface diffusion in the grains, IAST at their surface): c/c0 against bed volumes and the bed volumes at c/c0 0.1, 0.2 and 0.5; trace components (below 0.1 % of the adsorbable feed) are integrated each on its own against the background solved once, which they do not disturb',
  options: [
    { flags: '--ebct <time>', description: 'empty-bed contact time, e.g. "20 min"', parse: positiveTime, required: true },
    { flags: '--bed-depth <length>', description: 'bed depth, e.g. "2 m"', parse: positiveLength, required: true },
    { flags: '--porosity <fraction>', description: 'bed porosity (void fraction between the grains; 0.4 is common practice)', parse: finiteNumber, default: '0.4' },
    { flags: '--to-bv <n>', description: 'length of the run in bed volumes', parse: positiveNumber, default: '100000' },
    { flags: '--temperature <celsius>', description: 'water temperature for the film correlation, °C (10–15 °C is common practice)', parse: finiteNumber, default: '12' },
    { flags: '--points <n>', description: 'output points from 0 to --to-bv', parse: wholeNumber(3, 100000), default: '201' },
    { flags: '--json', description: 'print JSON instead of a table' },
  ],
  examples: ['sorbshare column water.json --ebct "20 min" --bed-depth "2 m"', 'sorbshare column water.json --ebct "15 min" --bed-depth "1.5 m" --porosity 0.42 --to-bv 60000 --json'],
  async action(args, opts, ctx) {
    const { readKineticMixture } = await import('../../scenario/readKineticInputs.js');
    const { column } = await import('../../api/fixedBedApi.js');
    const file = args[0]!;
    const mixture = inFile(file, () => readKineticMixture(readJsonFile(file, 'mixture file')));
    const options = { ebctS: opts.ebct as number, bedDepthM: opts.bedDepth as number, porosity: opts.porosity as number, toBedVolumes: opts.toBv as number, temperatureC: opts.temperature as number, points: opts.points as number };
    const res = columnOptionValue(() => inFile(file, () => column(mixture, options)));
    ctx.out(opts.json ? snakeCaseJsonText(res) : render(res));
  },
};

function render(r: ColumnJson): string {
  const levels = r.components[0]?.breakthrough.map((b) => b.c_over_c0) ?? [];
  const rows = r.components.map((c) => [c.id, fmtConc(c.c0_mg_per_L), ...c.breakthrough.map((b) => (b.bed_volumes === null ? `> ${bedVolumes(r.bed_volumes[r.bed_volumes.length - 1]!)}` : bedVolumes(b.bed_volumes))), fmtPercent(c.run_averaged_removal * 100)]);
  const last = r.bed_volumes[r.bed_volumes.length - 1]!;
  const lines = [
    `GAC fixed bed: EBCT ${fmtInput(r.bed.ebct_s / 60)} min, depth ${fmtInput(r.bed.bed_depth_m)} m, porosity ${fmtInput(r.bed.porosity)}, grains ${fmtInput(r.bed.particle_radius_m * 1000)} mm radius, bed density ${fmtInput(r.bed.bed_density_kg_per_m3)} kg/m³, ${fmtInput(r.bed.temperature_c)} °C`,
    '',
    table(['id', 'c0', ...levels.map((l) => `BV at c/c0 ${l}`), `removal % (avg to ${fmtCount(last)} BV)`], rows),
    '',
    `Mass balance (fed − left − held)/fed: ${r.mass_balance_error.toExponential(1)}; grid ${r.grid.cells} axial cells, ${r.grid.interior_points} grain points.`,
  ];
  for (const w of r.warnings) lines.push(`Warning: ${w}`);
  lines.push('Model estimate (film, surface diffusion, IAST at the grain surface, clean bed, constant feed): confirm with pilot or rapid small-scale column tests; design decisions belong to a licensed engineer.');
  return lines.join('\n');
}

/** Bed volumes: whole and grouped from 1,000 ("32,089"), 3 significant digits below (the pore volume 0.400 of a non-adsorbable component). */
function bedVolumes(bv: number): string {
  return bv >= 1000 ? fmtCount(bv) : fmt(bv);
}
