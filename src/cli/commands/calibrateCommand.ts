/** `sorbshare calibrate JARTESTS.csv --model ebc|sebc|fictive-k --compound COMPOUND.json [--background FILE] [--doc Q] [--json] [--out FILE]`; `--model surface-diffusion|surface-diffusion-doc` on kinetic jar tests; `--model column` on breakthrough data */
import type { CommandContext, CommandSpec, OptionValues } from '../commandSpec.js';
import { InputError } from '../../core/errors.js';
import type { CalibrationModel, CalibrationResult } from '../../calibration/calibrate.js';
import { readCompoundFile } from '../../scenario/readMixture.js';
import { readJsonFile } from '../../io/readFiles.js';
import { fmt, fmtConc, fmtInput, fmtPercent, table } from '../format.js';
import { emitJson, inFile } from './shared.js';
import { TABLE_FORMAT_OPTIONS, tableFormat } from './tableFormatOptions.js';
import { finiteNumber, nonEmptyText, positiveDensity, positiveDiffusivity, positiveLength, positiveMassConcentration, positiveTime } from '../optionParsers.js';
import type { KineticCalibrationModel, KineticCalibrationResult } from '../../calibration/kineticCalibration.js';

const MODELS: readonly (CalibrationModel | KineticCalibrationModel | 'column')[] = ['ebc', 'sebc', 'fictive-k', 'surface-diffusion', 'surface-diffusion-doc', 'column'];
const KINETIC: readonly string[] = ['surface-diffusion', 'surface-diffusion-doc'];

export const calibrateCommand: CommandSpec = {
  name: 'calibrate',
  args: ['<jartests>'],
  summary: 'Calibrate a competition model (EBC, simplified EBC, or fictive components with a K factor) to jar tests of one target in the site water, a surface diffusivity to kinetic jar tests, or the target\'s surface diffusivity to column breakthrough data (model column)',
  options: [
    { flags: '--model <model>', description: 'ebc (K, 1/n and C0 of an equivalent background compound), sebc (C0 only), fictive-k (K factor with --background), surface-diffusion (the target\'s Ds from tests over time: time, dose, C0, c), surface-diffusion-doc (the one Ds of the fictive DOC components from tests over time: time, dose, DOC) or column (Ds from breakthrough data)', choices: MODELS, required: true },
    { flags: '--compound <file>', description: 'compound file: { "id", "K", "one_over_n", "K_unit" } (optional "DL" or "kf" for surface-diffusion); needed by every model but surface-diffusion-doc', parse: nonEmptyText },
    { flags: '--background <file>', description: 'background file from sorbshare fractionate (model fictive-k)', parse: nonEmptyText },
    { flags: '--doc <quantity>', description: 'site DOC of the jar tests, e.g. "8 mg/L" (scales C0_EBC to other DOC values)', parse: positiveMassConcentration },
    { flags: '--particle-radius <length>', description: 'PAC particle radius for the kinetic models, e.g. "10 um"', parse: positiveLength },
    { flags: '--particle-density <density>', description: 'PAC particle density for the kinetic models, e.g. "650 kg/m3"', parse: positiveDensity },
    { flags: '--dl <diffusivity>', description: 'kinetic and column models: liquid diffusivity of the components without their own DL or kf (the fictive DOC components, for instance), e.g. "5e-10 m2/s"', parse: positiveDiffusivity },
    { flags: '--ebct <time>', description: 'column model: empty-bed contact time of the tested column, e.g. "2 min"', parse: positiveTime },
    { flags: '--bed-depth <length>', description: 'column model: bed depth of the tested column, e.g. "0.3 m"', parse: positiveLength },
    { flags: '--grain-radius <length>', description: 'column model: grain radius of the tested carbon, e.g. "0.1 mm"', parse: positiveLength },
    { flags: '--grain-density <density>', description: 'column model: grain (particle) density, e.g. "750 kg/m3"', parse: positiveDensity },
    { flags: '--porosity <fraction>', description: 'column model: bed porosity (0.4 is common practice)', parse: finiteNumber, default: '0.4' },
    { flags: '--temperature <celsius>', description: 'column model: water temperature for the film correlation, °C (10–15 °C is common practice)', parse: finiteNumber, default: '12' },
    { flags: '--doc-ds <diffusivity>', description: 'models surface-diffusion and column (with --background): surface diffusivity shared by the fictive DOC components, e.g. "2e-15 m2/s" (for PAC from a surface-diffusion-doc fit)', parse: positiveDiffusivity },
    { flags: '--fit-kf', description: 'column model: fit a factor on the target\'s film coefficient as well' },
    { flags: '--json', description: 'print JSON instead of text' },
    { flags: '--out <file>', description: 'also write the calibration (JSON) to FILE', parse: nonEmptyText },
    ...TABLE_FORMAT_OPTIONS,
  ],
  examples: ['sorbshare calibrate jartests.csv --model ebc --compound carbamazepine.json --doc "8 mg/L"', 'sorbshare calibrate jartests.csv --model fictive-k --compound target.json --background background.json --json', 'sorbshare calibrate breakthrough.csv --model column --compound target.json --background background.json --doc-ds "2e-15 m2/s" --dl "4e-10 m2/s" --ebct "2 min" --bed-depth "0.3 m" --grain-radius "0.1 mm" --grain-density "750 kg/m3"', 'sorbshare calibrate doc-kinetics.csv --model surface-diffusion-doc --background background.json --particle-radius "12 um" --particle-density "700 kg/m3" --dl "5e-10 m2/s"'],
  async action(args, opts, ctx) {
    if (KINETIC.includes(opts.model as string)) {
      await kineticAction(args[0]!, opts, ctx);
      return;
    }
    if (opts.compound === undefined) throw new InputError(`model ${opts.model as string} needs --compound FILE`, { option: '--compound' });
    if (opts.model === 'column') {
      const { calibrateColumnAction } = await import('./columnCalibrate.js');
      return calibrateColumnAction(args[0]!, opts, ctx);
    }
    const { calibrate } = await import('../../calibration/calibrate.js');
    const { readBackground } = await import('../../fractionation/backgroundFile.js');
    const file = args[0]!;
    const model = opts.model as CalibrationModel;
    const docMgPerL = opts.doc as number | undefined;
    const compoundFile = opts.compound as string;
    const compound = inFile(compoundFile, () => readCompoundFile(readJsonFile(compoundFile, 'compound file')));
    if (!(compound.K > 0)) throw new InputError('expected an adsorbable target compound (K > 0)', { file: compoundFile, path: 'K' });
    let background: unknown;
    if (opts.background !== undefined) {
      const bgFile = opts.background as string;
      background = inFile(bgFile, () => readBackground(readJsonFile(bgFile, 'background file')));
    } else if (model === 'fictive-k') throw new InputError('model fictive-k needs --background FILE (the output of sorbshare fractionate)', { option: '--background' });
    const { readTableFile } = await import('../../io/readTableFile.js');
    const { JAR_TEST_COLUMNS } = await import('../../calibration/jarTestData.js');
    const { table: text } = readTableFile(file, JAR_TEST_COLUMNS, 'jar-test file', tableFormat(opts));
    for (const note of text.notes ?? []) ctx.err(`sorbshare: note: ${note}\n`);
    const result = inFile(file, () => calibrate(text, { model: model as CalibrationModel, compound, ...(background !== undefined ? { background } : {}), ...(docMgPerL !== undefined ? { docMgPerL } : {}), file }));
    emitJson(result, opts, ctx, (out) => render(result, out), [file, compoundFile, ...(opts.background !== undefined ? [String(opts.background)] : [])]);
  },
};

/** Parameter names as the text table shows them (the unit stands in its own column; JSON keeps the keys). */
const PARAMETER_LABELS: Record<string, string> = { K_EBC: 'K_EBC', one_over_n_EBC: '1/n_EBC', c0_EBC_mg_per_L: 'c0_EBC', K_factor: 'K factor' };

function render(r: CalibrationResult, out: string | undefined): string {
  const ci = (k: string) => { const v = r.ci95[k]; return v ? `${fmt(v[0], 3)} – ${fmt(v[1], 3)}` : '—'; };
  const unit: Record<string, string> = { K_EBC: '(mg/g)/(mg/L)^1/n', one_over_n_EBC: '', c0_EBC_mg_per_L: 'mg/L', K_factor: '' };
  const lines = [
    `${r.model} calibration for ${r.compound} (batch IAST; residuals ${r.fit.residual})`,
    '',
    table(['parameter', 'value', 'unit', '95 % CI'], Object.entries(r.parameters).map(([k, v]) => [PARAMETER_LABELS[k] ?? k, fmt(v), unit[k] ?? '', ci(k)])),
    '',
  ];
  if (r.c0_EBC_per_DOC != null && r.doc_mg_per_L !== null) lines.push(`C0_EBC is ${fmt(r.c0_EBC_per_DOC * 100, 3)} % of the site DOC (${fmt(r.doc_mg_per_L, 3)} mg/L); it scales with DOC.`);
  if (r.target.K_calibrated !== undefined) lines.push(`Target K ${fmt(r.target.K)} → ${fmt(r.target.K_calibrated)} (mg/g)/(mg/L)^${r.target.one_over_n} in the site water.`);
  lines.push(`Fit: RMSE ${fmt(r.fit.rmse, 3)} in ln c (about ${fmt((Math.exp(r.fit.rmse) - 1) * 100, 2)} %), ${r.fit.points} points, ${r.fit.parameters} parameter${r.fit.parameters > 1 ? 's' : ''}; converged (${r.fit.stop}).`, '');
  lines.push(table(['row', 'C0', 'dose mg/L', 'c measured', 'c predicted', 'removal meas. %', 'removal pred. %'],
    r.table.map((x) => [String(x.row), fmtConc(x.c0_mg_per_L), fmt(x.dose_mg_per_L), fmtConc(x.c_measured_mg_per_L), fmtConc(x.c_predicted_mg_per_L), fmtPercent(x.removal_measured * 100), fmtPercent(x.removal_predicted * 100)])));
  for (const w of r.warnings) lines.push(`Warning: ${w}`);
  if (out) lines.push('', `Calibration written to ${out}.`);
  lines.push('Equilibrium model calibrated to jar tests; contact time and carbon age in the plant differ — confirm with pilot tests.');
  return lines.join('\n');
}

/** The kinetic models: Ds fitted to tests over time with the PAC batch model. */
async function kineticAction(file: string, opts: OptionValues, ctx: CommandContext): Promise<void> {
  const { calibrateKinetics } = await import('../../calibration/kineticCalibration.js');
  const { readBackground } = await import('../../fractionation/backgroundFile.js');
  const { readComponentKinetics } = await import('../../scenario/readKineticInputs.js');
  const model = opts.model as KineticCalibrationModel;
  if (opts.background === undefined) throw new InputError(`model ${model} needs --background FILE (the output of sorbshare fractionate)`, { option: '--background' });
  if (opts.particleRadius === undefined) throw new InputError(`model ${model} needs the PAC particle radius, e.g. --particle-radius "10 um"`, { option: '--particle-radius' });
  if (opts.particleDensity === undefined) throw new InputError(`model ${model} needs the PAC particle density, e.g. --particle-density "650 kg/m3"`, { option: '--particle-density' });
  let target: import('../../kinetics/kineticMixture.js').KineticComponent | undefined;
  if (model === 'surface-diffusion') {
    if (opts.compound === undefined) throw new InputError('model surface-diffusion needs --compound FILE (the target)', { option: '--compound' });
    const compoundFile = opts.compound as string;
    const raw = readJsonFile(compoundFile, 'compound file');
    target = inFile(compoundFile, () => readComponentKinetics(raw, readCompoundFile(raw), '$'));
    if (!(target.K > 0)) throw new InputError('expected an adsorbable target compound (K > 0)', { file: compoundFile, path: 'K' });
  }
  const bgFile = opts.background as string;
  const bg = inFile(bgFile, () => readBackground(readJsonFile(bgFile, 'background file')));
  const background = bg.components.map((c) => ({ id: c.id, c0MgPerL: c.c0_mg_per_L, K: c.K, oneOverN: c.one_over_n }));
  const { readTableFile } = await import('../../io/readTableFile.js');
  const { KINETIC_TARGET_COLUMNS, KINETIC_DOC_COLUMNS } = await import('../../calibration/kineticTestData.js');
  const { table } = readTableFile(file, model === 'surface-diffusion' ? KINETIC_TARGET_COLUMNS : KINETIC_DOC_COLUMNS, 'kinetic test file', tableFormat(opts));
  for (const note of table.notes ?? []) ctx.err(`sorbshare: note: ${note}\n`);
  const result = inFile(file, () => calibrateKinetics(table, {
    model,
    ...(target ? { target } : {}),
    background,
    docMgPerL: bg.doc0_mg_per_L,
    particle: { radiusM: opts.particleRadius as number, densityGPerL: opts.particleDensity as number },
    ...(opts.docDs !== undefined ? { backgroundDsM2PerS: opts.docDs as number } : {}),
    ...(opts.dl !== undefined ? { dlM2PerS: opts.dl as number } : {}),
    file,
  }));
  emitJson(result, opts, ctx, (out) => renderKinetic(result, out));
}

function renderKinetic(r: KineticCalibrationResult, out: string | undefined): string {
  const ci = r.ci95.Ds_m2_per_s;
  const lines = [
    `${r.model} calibration for ${r.compound} (PAC batch model: surface diffusion, film, IAST at the particle surface; residuals ${r.fit.residual})`,
    '',
    `Ds = ${r.parameters.Ds_m2_per_s.toExponential(3)} m2/s${ci ? ` (95 % CI ${ci[0].toExponential(3)} – ${ci[1].toExponential(3)})` : ''}`,
    `Fit: RMSE ${fmt(r.fit.rmse, 3)} in ln c, ${r.fit.points} points; converged (${r.fit.stop}).`,
    '',
    table(['row', 'time (min)', 'dose mg/L', 'c0', 'c measured', 'c predicted'], r.table.map((x) => [String(x.row), fmtInput(x.time_s / 60), fmt(x.dose_mg_per_L), fmtConc(x.c0_mg_per_L), fmtConc(x.c_measured_mg_per_L), fmtConc(x.c_predicted_mg_per_L)])),
  ];
  for (const w of r.warnings) lines.push(`Warning: ${w}`);
  if (out) lines.push('', `Calibration written to ${out}.`);
  lines.push('Kinetic model fitted to jar tests; mixing and temperature in the plant differ — confirm with pilot tests.');
  return lines.join('\n');
}
