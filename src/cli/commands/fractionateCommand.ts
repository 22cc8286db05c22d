/** `sorbshare fractionate ISOTHERM.csv [--exponent 0.2] [--components 3|auto] [--fit-k] [--k-grid LIST] [--json] [--out FILE]` */
import type { CommandSpec } from '../commandSpec.js';
import { InputError } from '../../core/errors.js';
import type { FractionateResult } from '../../fractionation/fractionate.js';
import { fmt, table } from '../format.js';
import { finiteNumber, nonEmptyText, positiveNumberList, wholeNumberOrAuto } from '../optionParsers.js';
import { emitJson, inFile, optionValue } from './shared.js';
import { TABLE_FORMAT_OPTIONS, tableFormat } from './tableFormatOptions.js';

const OPTION_OF_PATH: Record<string, string> = { exponent: '--exponent', components: '--components', kGrid: '--k-grid' };

export const fractionateCommand: CommandSpec = {
  name: 'fractionate',
  args: ['<isotherm>'],
  summary: 'Reduce a DOC (and UV254) batch isotherm to fictive components: non-adsorbable share plus adsorbable components (adsorption analysis, IAST)',
  options: [
    { flags: '--exponent <value>', description: 'common Freundlich exponent 1/n of the fictive components (common practice 0.2)', parse: finiteNumber, default: '0.2' },
    { flags: '--components <n>', description: 'number of adsorbable components, 1–5, or "auto" (AICc); with --k-grid alone, the length of the grid (common practice 3)', parse: wholeNumberOrAuto(1, 5), default: '3' },
    { flags: '--fit-k', description: 'fit the K values instead of keeping the grid' },
    { flags: '--k-grid <list>', description: 'comma-separated K grid in (mg/g)/(mg/L)^(1/n), one per component, e.g. "10,30,100"', parse: positiveNumberList },
    { flags: '--json', description: 'print the background file (JSON) instead of text' },
    { flags: '--out <file>', description: 'also write the background file (JSON) to FILE', parse: nonEmptyText },
    ...TABLE_FORMAT_OPTIONS,
  ],
  examples: ['sorbshare fractionate isotherm.csv --out background.json', 'sorbshare fractionate lab.xlsx#Isotherm --separator ";" --decimal ","', 'sorbshare fractionate isotherm.csv --components auto --json'],
  async action(args, opts, ctx, given) {
    const { fractionate } = await import('../../fractionation/fractionate.js');
    const file = args[0]!;
    const exponent = opts.exponent as number;
    const kGrid = opts.kGrid as number[] | undefined;
    // the grid sets the number of components unless --components is given
    const components = kGrid && !given.has('components') ? kGrid.length : (opts.components as number | 'auto');
    const { readTableFile } = await import('../../io/readTableFile.js');
    const { ISOTHERM_COLUMNS } = await import('../../fractionation/isothermData.js');
    const { table: text } = readTableFile(file, ISOTHERM_COLUMNS, 'isotherm file', tableFormat(opts));
    for (const note of text.notes ?? []) ctx.err(`sorbshare: note: ${note}\n`);
    const result = inFile(file, () => optionValue(() => fractionate(text, { exponent, components, fitK: Boolean(opts.fitK), ...(kGrid ? { kGrid } : {}), file }), OPTION_OF_PATH));
    emitJson(result, opts, ctx, (out) => render(result, out), [file]);
  },
};

function render(r: FractionateResult, out: string | undefined): string {
  const ci = (v: [number, number] | null | undefined) => (v ? `${fmt(v[0] * 100, 3)}–${fmt(v[1] * 100, 3)}` : '—');
  const hasUv = r.components.some((c) => c.specific_uv254_per_m_per_mg_per_L !== undefined);
  const rows = r.components.map((c) => [
    c.id, c.K === 0 ? '0 (non-adsorbable)' : fmt(c.K), fmt(c.fraction * 100), ci(c.fraction_ci95), fmt(c.c0_mg_per_L),
    ...(c.K_ci95 !== undefined ? [c.K_ci95 ? `${fmt(c.K_ci95[0], 3)}–${fmt(c.K_ci95[1], 3)}` : '—'] : []),
    ...(hasUv ? [fmt(c.specific_uv254_per_m_per_mg_per_L ?? 0)] : []),
  ]);
  const headers = ['id', 'K (mg/g)/(mg/L)^1/n', 'share %', '95 % CI %', 'c0 mg/L', ...(r.components.some((c) => c.K_ci95 !== undefined) ? ['K 95 % CI'] : []), ...(hasUv ? ['UV254 1/m per mg/L'] : [])];
  const lines = [
    `DOC0 ${fmt(r.doc0_mg_per_L)} mg/L as fictive components (1/n = ${r.one_over_n}, K ${r.fit.k_mode === 'fitted' ? 'fitted' : 'on a grid'}; batch IAST)`,
    '',
    table(headers, rows),
    '',
    `Fit: RMSE ${fmt(r.fit.rmse_mg_per_L, 3)} mg/L (${fmt(r.fit.rmse_relative * 100, 3)} %), largest relative error ${fmt(r.fit.max_relative_error * 100, 3)} %, ${r.fit.points} points, ${r.fit.parameters} parameters; converged (${r.fit.stop}), ${r.fit.agreeing_starts} of ${r.fit.starts} starts agree.`,
  ];
  if (r.uv254) lines.push(`UV254: RMSE ${fmt(r.uv254.rmse_per_m, 3)} 1/m over ${r.uv254.points} values, largest relative error ${fmt(r.uv254.max_relative_error * 100, 3)} %; UV254 at DOC0 ${fmt(r.uv254.uv254_0_per_m)} 1/m.`);
  if (r.model_selection) {
    lines.push('', 'Number of components by AICc (lower is better):', table(['components', 'parameters', 'RMSE mg/L', 'AICc', 'ΔAICc', ''],
      r.model_selection.alternatives.map((a) => [String(a.components), String(a.parameters), a.rmse_mg_per_L === null ? '—' : fmt(a.rmse_mg_per_L, 3), a.aicc === null ? '—' : fmt(a.aicc, 4), a.delta_aicc === null ? '—' : fmt(a.delta_aicc, 3), a.chosen ? 'chosen' : (a.note ?? '')])));
  }
  lines.push('', 'Residuals:', table(['row', 'dose mg/L', 'DOC0 mg/L', 'DOC measured', 'DOC predicted', 'residual mg/L', ...(r.uv254 ? ['UV254 measured', 'UV254 predicted'] : [])],
    r.residuals.map((x) => [String(x.row), fmt(x.dose_mg_per_L!), fmt(x.doc0_mg_per_L!), fmt(x.doc_measured_mg_per_L!), fmt(x.doc_predicted_mg_per_L!), fmt(x.residual_mg_per_L!, 3),
      ...(r.uv254 ? [x.uv254_measured_per_m === undefined ? '—' : fmt(x.uv254_measured_per_m), fmt(x.uv254_predicted_per_m ?? 0)] : [])])));
  for (const w of r.warnings) lines.push(`Warning: ${w}`);
  if (out) lines.push('', `Background file written to ${out}.`);
  lines.push('Fictive components are a fitted description of this water, not real substances; shares scale with DOC.');
  return lines.join('\n');
}
