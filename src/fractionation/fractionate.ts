/**
 * `fractionate`: reduce a site's DOC isotherm to fictive components (the background file) —
 * the library entry point behind `sorbshare fractionate`; returns exactly what `--json` prints.
 *
 * Method: adsorption analysis (Worch 2012, from memory) with batch IAST (Crittenden et al. 1985):
 * a non-adsorbable share plus M adsorbable components, common exponent 1/n (default 0.2, common
 * practice), K on a grid or fitted; shares of DOC0, scaled with DOC0 in a dilution series.
 * `components: 'auto'` fits M = 1–5 and keeps the lowest AICc (Hurvich & Tsai 1989).
 * With UV254, specific absorbances per component by NNLS (uv254Fit.ts).
 * @throws InputError on bad data (file, row, column) or options; ComputationError if no fit converges
 */
import { ComputationError, InputError } from '../core/errors.js';
import { readCsvTable, type CsvTable } from '../tables/csvTable.js';
import { fractionationWarnings } from '../scenario/plausibility.js';
import { checkIsotherm, ISOTHERM_COLUMNS, pointsFromTable, type IsothermData, type IsothermPoint } from './isothermData.js';
import { defaultKGrid, MAX_COMPONENTS, MIN_COMPONENTS } from './defaultKGrid.js';
import { fitBackground, type BackgroundFitResult } from './fitBackground.js';
import { makeIsothermModel } from './isothermModel.js';
import { fitUv254, type Uv254Observation } from './uv254Fit.js';
import type { BackgroundComponentRecord, BackgroundFile } from './backgroundFile.js';

export interface FractionateOptions {
  /** Common Freundlich exponent 1/n (default 0.2, common practice). */
  exponent?: number;
  /** Adsorbable components M (1–5, default 3) or 'auto' (AICc). */
  components?: number | 'auto';
  /** Fit K instead of keeping the grid. */
  fitK?: boolean;
  /** K grid (mg/g)/(mg/L)^(1/n), one per adsorbable component. */
  kGrid?: number[];
  /** File name for messages. */
  file?: string;
}

export interface ModelAlternative {
  components: number;
  parameters: number;
  rmse_mg_per_L: number | null;
  aicc: number | null;
  delta_aicc: number | null;
  chosen: boolean;
  note?: string;
}

export interface FractionateResult extends BackgroundFile {
  fit: BackgroundFile['fit'] & {
    max_relative_error: number;
    rmse_relative: number;
    parameters: number;
    degrees_of_freedom: number;
    aicc: number | null;
    k_mode: 'grid' | 'fitted';
    converged: boolean;
    stop: string;
    evaluations: number;
    starts: number;
    agreeing_starts: number;
  };
  residuals: Array<Record<string, number>>;
  uv254?: { rmse_per_m: number; max_relative_error: number; points: number; uv254_0_per_m: number };
  model_selection?: { criterion: 'AICc'; chosen: number; alternatives: ModelAlternative[] };
  warnings: string[];
}

/** Anything `fractionate` reads: a CSV table read with ISOTHERM_COLUMNS, CSV text, or points. */
export type IsothermInput = CsvTable | string | readonly IsothermPoint[];

/** Common Freundlich exponent 1/n of the fictive DOC components (common practice 0.2). */
export const DEFAULT_EXPONENT = 0.2;
/** Number of adsorbable fictive components (common practice 3). */
export const DEFAULT_COMPONENTS = 3;

/** Turn any isotherm input into checked data. */
export function readIsotherm(input: IsothermInput, file?: string): IsothermData {
  if (typeof input === 'string') {
    const t = readCsvTable(input, ISOTHERM_COLUMNS, file);
    const { points, headers } = pointsFromTable(t);
    return checkIsotherm(points, file, headers);
  }
  if (Array.isArray(input)) return checkIsotherm(input as IsothermPoint[], file);
  const t = input as CsvTable;
  const { points, headers } = pointsFromTable(t);
  return checkIsotherm(points, file ?? t.file, headers);
}

export function fractionate(input: IsothermInput, options: FractionateOptions = {}): FractionateResult {
  const data = readIsotherm(input, options.file);
  const file = data.file;
  const exponent = options.exponent ?? DEFAULT_EXPONENT;
  if (!(exponent > 0 && exponent <= 1.5) || !Number.isFinite(exponent)) throw new InputError(`expected an exponent 1/n between 0 and 1.5, got ${exponent}`, { path: 'exponent' });
  let kGrid = options.kGrid;
  if (kGrid !== undefined) {
    if (kGrid.length < MIN_COMPONENTS || kGrid.length > MAX_COMPONENTS) throw new InputError(`expected 1–5 K values, got ${kGrid.length}`, { path: 'kGrid' });
    kGrid.forEach((k, i) => { if (!(k > 0) || !Number.isFinite(k)) throw new InputError(`expected K > 0, got ${k}`, { path: `kGrid[${i}]` }); });
    kGrid = [...kGrid].sort((a, b) => a - b);
  }
  const comps = options.components ?? (kGrid ? kGrid.length : DEFAULT_COMPONENTS);
  if (comps === 'auto' && kGrid) throw new InputError('a K grid fixes the number of components; give --components auto or a K grid, not both', { path: 'components' });
  if (comps !== 'auto') {
    if (!Number.isInteger(comps) || comps < MIN_COMPONENTS || comps > MAX_COMPONENTS) throw new InputError(`expected 1–5 adsorbable components or "auto", got ${comps}`, { path: 'components' });
    if (kGrid && kGrid.length !== comps) throw new InputError(`the K grid has ${kGrid.length} values for ${comps} components; expected one K per component`, { path: 'kGrid' });
  }
  const fitK = options.fitK ?? false;
  const fitRows = data.rows.filter((r) => r.doseMgPerL > 0);
  const lastRow = data.rows[data.rows.length - 1]!.row;
  const loc = { ...(file !== undefined ? { file } : {}), row: lastRow, column: data.headers.doc };
  const paramsFor = (m: number) => (fitK ? 2 * m : m);

  let chosen: BackgroundFitResult;
  let selection: FractionateResult['model_selection'];
  if (comps === 'auto') {
    const alternatives: ModelAlternative[] = [];
    const fits = new Map<number, BackgroundFitResult>();
    for (let m = MIN_COMPONENTS; m <= MAX_COMPONENTS; m++) {
      const p = paramsFor(m);
      if (fitRows.length - (p + 1) - 1 <= 0) {
        alternatives.push({ components: m, parameters: p, rmse_mg_per_L: null, aicc: null, delta_aicc: null, chosen: false, note: 'too few points for AICc' });
        continue;
      }
      try {
        const f = fitBackground(fitRows, { oneOverN: exponent, kGrid: defaultKGrid(m), fitK });
        fits.set(m, f);
        alternatives.push({ components: m, parameters: p, rmse_mg_per_L: f.rmse, aicc: f.aicc, delta_aicc: null, chosen: false });
      } catch (e) {
        if (!(e instanceof ComputationError)) throw e;
        alternatives.push({ components: m, parameters: p, rmse_mg_per_L: null, aicc: null, delta_aicc: null, chosen: false, note: `fit failed: ${e.reason}` });
      }
    }
    const ok = alternatives.filter((a) => a.aicc !== null);
    if (ok.length === 0) {
      if (fits.size === 0 && alternatives.every((a) => a.note === 'too few points for AICc')) throw new InputError(`only ${fitRows.length} rows with a carbon dose > 0; --components auto needs at least ${paramsFor(1) + 3}`, loc);
      throw new ComputationError('no number of components could be fitted');
    }
    const best = ok.reduce((a, b) => (b.aicc! < a.aicc! ? b : a));
    for (const a of ok) a.delta_aicc = a.aicc! - best.aicc!;
    best.chosen = true;
    chosen = fits.get(best.components)!;
    selection = { criterion: 'AICc', chosen: best.components, alternatives };
  } else {
    const p = paramsFor(comps);
    if (fitRows.length < p) throw new InputError(`only ${fitRows.length} rows with a carbon dose > 0 for ${p} fitted parameters; expected at least ${p} isotherm points`, loc);
    chosen = fitBackground(fitRows, { oneOverN: exponent, kGrid: kGrid ?? defaultKGrid(comps), fitK });
  }
  return assemble(data, chosen, exponent, fitK, selection);
}

function assemble(data: IsothermData, f: BackgroundFitResult, exponent: number, fitK: boolean, selection: FractionateResult['model_selection']): FractionateResult {
  const doc0 = Math.max(...data.rows.map((r) => r.doc0MgPerL));
  const sum = f.fractions.reduce((a, b) => a + b, 0);
  const fractions = f.fractions.map((v) => v / sum);
  const warnings: string[] = [];
  const components: BackgroundComponentRecord[] = fractions.map((fr, j) => {
    const rec: BackgroundComponentRecord = { id: `F${j}`, K: f.K[j]!, one_over_n: exponent, fraction: fr, c0_mg_per_L: fr * doc0, fraction_ci95: f.fractionCi[j] ?? null };
    if (fitK && j > 0) rec.K_ci95 = f.KCi[j] ?? null;
    return rec;
  });
  // predictions on every row (dose-0 rows included) for the residual table and UV254
  const model = makeIsothermModel(data.rows, exponent);
  const all = model.predict(fractions, f.K);
  const residuals: Array<Record<string, number>> = data.rows.map((r, i) => ({
    row: r.row, dose_mg_per_L: r.doseMgPerL, doc0_mg_per_L: r.doc0MgPerL, doc_measured_mg_per_L: r.docMgPerL,
    doc_predicted_mg_per_L: all.doc[i]!, residual_mg_per_L: all.doc[i]! - r.docMgPerL,
  }));
  let uv254: FractionateResult['uv254'];
  if (data.hasUv) {
    const obs: Uv254Observation[] = [];
    data.rows.forEach((r, i) => { if (r.uv254PerM !== undefined) obs.push({ row: r.row, c: all.c[i]!, uv254PerM: r.uv254PerM }); });
    const groups = new Map<number, number[]>();
    for (const r of data.rows) if (r.uv254_0PerM !== undefined) groups.set(r.doc0MgPerL, [...(groups.get(r.doc0MgPerL) ?? []), r.uv254_0PerM]);
    for (const [d0, vals] of groups) obs.push({ row: 0, c: fractions.map((fr) => fr * d0), uv254PerM: vals.reduce((a, b) => a + b, 0) / vals.length });
    const uv = fitUv254(obs, fractions.length);
    components.forEach((c, j) => { c.specific_uv254_per_m_per_mg_per_L = uv.specific[j]!; });
    data.rows.forEach((r, i) => {
      const rec = residuals[i]!;
      if (r.uv254PerM !== undefined) rec.uv254_measured_per_m = r.uv254PerM;
      rec.uv254_predicted_per_m = uv.specific.reduce((s, a, j) => s + a * all.c[i]![j]!, 0);
    });
    uv254 = { rmse_per_m: uv.rmsePerM, max_relative_error: uv.maxRelativeError, points: uv.points, uv254_0_per_m: uv.specific.reduce((s, a, j) => s + a * fractions[j]! * doc0, 0) };
    if (uv.maxRelativeError > 0.1) warnings.push(`UV254 fit: largest relative error ${(uv.maxRelativeError * 100).toFixed(1)} %; the components do not explain UV254 well`);
  }
  if (!f.identifiable) warnings.push(f.dof <= 0 ? 'as many parameters as points: no confidence intervals' : 'the shares are not identifiable from these data (singular Jacobian): no confidence intervals; try fewer components');
  f.fractions.forEach((fr, j) => { if (j > 0 && fr <= 1e-7) warnings.push(`component F${j} (K = ${f.K[j]}) has no share: fewer components may describe the data as well`); });
  if (f.maxRelativeError > 0.1) warnings.push(`poor fit: largest relative DOC error ${(f.maxRelativeError * 100).toFixed(1)} %`);
  warnings.push(...fractionationWarnings(f.fractionCi, f.starts, f.agreeing));
  const out: FractionateResult = {
    _note: 'DOC as fictive components (adsorption analysis, batch IAST). Shares of DOC0 (fraction) scale with DOC; K in (mg/g)/(mg/L)^(1/n); F0 is non-adsorbable.',
    doc0_mg_per_L: doc0,
    one_over_n: exponent,
    components,
    fit: {
      rmse_mg_per_L: f.rmse, rmse_relative: f.rmseRelative, points: f.points, max_relative_error: f.maxRelativeError, parameters: f.parameters,
      degrees_of_freedom: f.dof, aicc: f.aicc, k_mode: fitK ? 'fitted' : 'grid', converged: f.converged, stop: f.stop,
      evaluations: f.evaluations, starts: f.starts, agreeing_starts: f.agreeing,
    },
    residuals,
    warnings,
  };
  if (uv254) out.uv254 = uv254;
  if (selection) out.model_selection = selection;
  return out;
}
