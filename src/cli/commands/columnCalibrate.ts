/**
 * The column part of `sorbshare calibrate BREAKTHROUGH.csv --model column …`: read the target's
 * compound file (K, 1/n, K_unit, and DL or kf; an optional c0), the optional background file with
 * the shared DOC diffusivities, the bed options, and fit the target's Ds (optionally a kf factor)
 * with `fitColumn` (src/calibration/columnFit.ts).
 */
import { InputError } from '../../core/errors.js';
import type { ColumnFitResult } from '../../calibration/columnFit.js';
import type { FixedBedComponent } from '../../kinetics/fixedBedInput.js';
import { readJsonFile } from '../../io/readFiles.js';
import { tableFormat } from './tableFormatOptions.js';
import { fmt, fmtCount, table } from '../format.js';
import type { CommandContext, OptionValues } from '../commandSpec.js';
import { emitJson, inFile } from './shared.js';
import { columnOptionValue } from './columnCommand.js';

const NEEDS: Array<[string, string, string]> = [
  ['ebct', '--ebct', 'the small or pilot column\'s empty-bed contact time, e.g. "2 min"'],
  ['bedDepth', '--bed-depth', 'the column\'s bed depth, e.g. "0.3 m"'],
  ['grainRadius', '--grain-radius', 'the grain radius of the tested carbon, e.g. "0.1 mm"'],
  ['grainDensity', '--grain-density', 'the grain density, e.g. "750 kg/m3"'],
];

/** Calibrate Ds to breakthrough data; writes through `emitJson` like the other models. */
export async function calibrateColumnAction(file: string, opts: OptionValues, ctx: CommandContext): Promise<void> {
  const { fitColumn } = await import('../../calibration/columnFit.js');
  const { readBreakthroughData } = await import('../../calibration/breakthroughData.js');
  const { readComponent } = await import('../../scenario/readMixture.js');
  const { readComponentKinetics } = await import('../../scenario/readKineticInputs.js');
  const { readBackground } = await import('../../fractionation/backgroundFile.js');
  const { backgroundComponents } = await import('../../fractionation/backgroundPrediction.js');
  for (const [key, option, what] of NEEDS) if (opts[key] === undefined) throw new InputError(`model column needs ${option}: ${what}`, { option });
  const compoundFile = opts.compound as string;
  const compound = inFile(compoundFile, () => {
    const raw = readJsonFile(compoundFile, 'compound file');
    return readComponentKinetics(raw, readComponent(raw, '$', false), '$');
  });
  if (!(compound.K > 0)) throw new InputError('expected an adsorbable target compound (K > 0)', { file: compoundFile, path: 'K' });
  // --dl is the liquid diffusivity of every component without its own DL or kf (as in the PAC kinetic models)
  if (compound.kfMPerS === undefined && compound.dlM2PerS === undefined) {
    if (opts.dl === undefined) throw new InputError(`compound "${compound.id}" has neither DL nor kf; the film needs one (e.g. "DL": "7e-10 m2/s" in the file, or --dl)`, { file: compoundFile, path: 'DL' });
    compound.dlM2PerS = opts.dl as number;
  }
  let background: FixedBedComponent[] = [];
  if (opts.background !== undefined) {
    const bgFile = opts.background as string;
    if (opts.docDs === undefined) throw new InputError('a background needs --doc-ds: the surface diffusivity shared by the fictive DOC components, e.g. "2e-15 m2/s"', { option: '--doc-ds' });
    if (opts.dl === undefined) throw new InputError('a background needs --dl: the liquid diffusivity of the components without their own DL or kf, here the fictive DOC components, e.g. "4e-10 m2/s"', { option: '--dl' });
    const bg = inFile(bgFile, () => backgroundComponents(readBackground(readJsonFile(bgFile, 'background file')), opts.doc as number | undefined));
    background = bg.map((c) => (c.K > 0 ? { ...c, dsM2PerS: opts.docDs as number, dlM2PerS: opts.dl as number } : { ...c }));
  }
  const { readTableFile } = await import('../../io/readTableFile.js');
  const { BREAKTHROUGH_COLUMNS } = await import('../../calibration/breakthroughData.js');
  const { table } = readTableFile(file, BREAKTHROUGH_COLUMNS, 'breakthrough file', tableFormat(opts));
  for (const note of table.notes ?? []) ctx.err(`sorbshare: note: ${note}\n`);
  const data = inFile(file, () => readBreakthroughData(table, { file, ...(compound.c0MgPerL > 0 ? { c0MgPerL: compound.c0MgPerL } : {}) }));
  const c0 = data.c0MgPerL ?? (compound.c0MgPerL > 0 ? compound.c0MgPerL : undefined);
  if (c0 === undefined) throw new InputError('the target\'s feed concentration is unknown: give a "C0 (ng/L)" column in the data or "c0" in the compound file', { file: compoundFile, path: 'c0' });
  const target: FixedBedComponent = { id: compound.id, c0MgPerL: c0, K: compound.K, oneOverN: compound.oneOverN };
  if (compound.kfMPerS !== undefined) target.kfMPerS = compound.kfMPerS;
  if (compound.dlM2PerS !== undefined) target.dlM2PerS = compound.dlM2PerS;
  const bed = { ebctS: opts.ebct as number, bedDepthM: opts.bedDepth as number, porosity: opts.porosity as number, particleRadiusM: opts.grainRadius as number, particleDensityKgPerM3: opts.grainDensity as number, temperatureC: opts.temperature as number };
  const result = columnOptionValue(() => fitColumn({ data, target, background, bed, fitKfFactor: opts.fitKf === true }), { 'bed.ebctS': '--ebct', 'bed.bedDepthM': '--bed-depth', 'bed.porosity': '--porosity', 'carbon.particle_radius': '--grain-radius', 'carbon.particle_density': '--grain-density', temperatureC: '--temperature' });
  emitJson(result, opts, ctx, (out) => render(result, out));
}

function render(r: ColumnFitResult, out: string | undefined): string {
  const ci = (v: [number, number] | null | undefined) => (v ? `${fmt(v[0], 3)} – ${fmt(v[1], 3)}` : '—');
  const rows: string[][] = [['Ds', r.parameters.Ds_m2_per_s.toExponential(3), 'm²/s', r.ci95.Ds_m2_per_s ? `${r.ci95.Ds_m2_per_s[0].toExponential(2)} – ${r.ci95.Ds_m2_per_s[1].toExponential(2)}` : '—']];
  if (r.parameters.kf_factor !== undefined) rows.push(['kf factor', fmt(r.parameters.kf_factor), '', ci(r.ci95.kf_factor)]);
  const lines = [
    `column calibration for ${r.compound} (fixed-bed model: film, surface diffusion, IAST at the grain surface)`,
    '',
    table(['parameter', 'value', 'unit', '95 % CI'], rows),
    '',
    `Fit: RMSE ${fmt(r.fit.rmse, 3)} in c/c0, ${r.fit.points} points, ${r.fit.parameters} parameter${r.fit.parameters > 1 ? 's' : ''}; converged (${r.fit.stop}).`,
    '',
    table(['row', 'bed volumes', 'c/c0 measured', 'c/c0 predicted'], r.table.map((x) => [String(x.row), fmtCount(x.bed_volumes), fmt(x.c_over_c0_measured, 3), fmt(x.c_over_c0_predicted, 3)])),
  ];
  for (const w of r.warnings) lines.push(`Warning: ${w}`);
  if (out) lines.push('', `Calibration written to ${out}.`);
  lines.push('Ds fitted to one column test; scale to the full-size grains with the small-column rules (constant or proportional diffusivity) and confirm with pilot data.');
  return lines.join('\n');
}
