/**
 * The background file: DOC reduced to fictive components (the output of `fractionate --json`).
 *
 *   { "doc0_mg_per_L", "one_over_n", "components": [ { "id", "K", "one_over_n", "fraction",
 *     "c0_mg_per_L", … } ], "fit": { "rmse_mg_per_L", "points", … }, … }
 *
 * `fraction` is the share of DOC0 (0–1, the shares sum to 1), `c0_mg_per_L` = fraction·DOC0;
 * the non-adsorbable component has K = 0. K is in (mg/g)/(mg/L)^(1/n). `readBackground` checks a
 * parsed JSON object and names the JSON path of anything wrong.
 */
import { InputError } from '../core/errors.js';
import { isObject } from '../scenario/readMixture.js';
import { onlyKeys } from '../scenario/jsonChecks.js';

/** Valid keys of a background file (what `fractionate --json` writes), in one place. */
export const BACKGROUND_KEYS = {
  top: ['$schema', '_note', 'note', 'doc0_mg_per_L', 'one_over_n', 'components', 'fit', 'residuals', 'uv254', 'model_selection', 'warnings'],
  component: ['id', 'K', 'one_over_n', 'fraction', 'c0_mg_per_L', 'fraction_ci95', 'K_ci95', 'specific_uv254_per_m_per_mg_per_L', 'note'],
  fit: ['rmse_mg_per_L', 'rmse_relative', 'points', 'max_relative_error', 'parameters', 'degrees_of_freedom', 'aicc', 'k_mode', 'converged', 'stop', 'evaluations', 'starts', 'agreeing_starts'],
  residual: ['row', 'dose_mg_per_L', 'doc0_mg_per_L', 'doc_measured_mg_per_L', 'doc_predicted_mg_per_L', 'residual_mg_per_L', 'uv254_measured_per_m', 'uv254_predicted_per_m'],
  uv254: ['rmse_per_m', 'max_relative_error', 'points', 'uv254_0_per_m'],
  modelSelection: ['criterion', 'chosen', 'alternatives'],
  alternative: ['components', 'parameters', 'rmse_mg_per_L', 'aicc', 'delta_aicc', 'chosen', 'note'],
} as const;

export interface BackgroundComponentRecord {
  id: string;
  /** Freundlich K, (mg/g)/(mg/L)^(1/n); 0 = non-adsorbable. */
  K: number;
  one_over_n: number;
  /** Share of DOC0, 0–1. */
  fraction: number;
  /** fraction·DOC0, mg/L. */
  c0_mg_per_L: number;
  /** Approximate 95 % confidence interval of the fraction (null at a bound or when not estimable). */
  fraction_ci95?: [number, number] | null;
  /** Approximate 95 % confidence interval of K (fitted K only). */
  K_ci95?: [number, number] | null;
  /** Specific UV254 absorbance, 1/m per mg/L (when the isotherm had UV254). */
  specific_uv254_per_m_per_mg_per_L?: number;
}

export interface BackgroundFit {
  rmse_mg_per_L: number;
  points: number;
  max_relative_error?: number;
  [key: string]: unknown;
}

export interface BackgroundFile {
  _note?: string;
  doc0_mg_per_L: number;
  one_over_n: number;
  components: BackgroundComponentRecord[];
  fit: BackgroundFit;
  [key: string]: unknown;
}

function num(raw: Record<string, unknown>, key: string, path: string, opts: { positive?: boolean; max?: number } = {}): number {
  const v = raw[key];
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError(`expected ${key} as a number, got ${JSON.stringify(v)}`, { path: `${path}${path ? '.' : ''}${key}` });
  if (v < 0 || (opts.positive && v === 0)) throw new InputError(`expected ${key} ${opts.positive ? '> 0' : '≥ 0'}, got ${v}`, { path: `${path}${path ? '.' : ''}${key}` });
  if (opts.max !== undefined && v > opts.max) throw new InputError(`expected ${key} ≤ ${opts.max}, got ${v}`, { path: `${path}${path ? '.' : ''}${key}` });
  return v;
}

/**
 * Check a parsed background object (the output of `fractionate`).
 * @throws InputError naming the JSON path
 */
export function readBackground(raw: unknown): BackgroundFile {
  if (!isObject(raw)) throw new InputError('expected a background object with doc0_mg_per_L, one_over_n and components (the output of sorbshare fractionate --json)', { path: '$' });
  onlyKeys(raw, BACKGROUND_KEYS.top, '$');
  num(raw, 'doc0_mg_per_L', '', { positive: true });
  if (!Array.isArray(raw.components) || raw.components.length === 0) throw new InputError('expected "components" as a non-empty array', { path: 'components' });
  let sum = 0;
  const ids = new Set<string>();
  raw.components.forEach((c: unknown, i: number) => {
    const path = `components[${i}]`;
    if (!isObject(c)) throw new InputError('expected an object with id, K, one_over_n and fraction', { path });
    onlyKeys(c, BACKGROUND_KEYS.component, path);
    if (typeof c.id !== 'string' || c.id === '') throw new InputError('expected a non-empty text id', { path: `${path}.id` });
    if (ids.has(c.id)) throw new InputError(`duplicate id "${c.id}"`, { path: `${path}.id` });
    ids.add(c.id);
    const K = num(c, 'K', path);
    if (K > 0) num(c, 'one_over_n', path, { positive: true });
    sum += num(c, 'fraction', path, { max: 1 });
    if (c.specific_uv254_per_m_per_mg_per_L !== undefined) num(c, 'specific_uv254_per_m_per_mg_per_L', path);
  });
  if (Math.abs(sum - 1) > 1e-6) throw new InputError(`the fractions sum to ${sum}; expected shares of DOC0 that sum to 1`, { path: 'components' });
  if (!isObject(raw.fit)) throw new InputError('expected a "fit" object', { path: 'fit' });
  onlyKeys(raw.fit, BACKGROUND_KEYS.fit, 'fit');
  if (raw.residuals !== undefined) {
    if (!Array.isArray(raw.residuals)) throw new InputError('expected "residuals" as an array', { path: 'residuals' });
    raw.residuals.forEach((r: unknown, i: number) => { if (isObject(r)) onlyKeys(r, BACKGROUND_KEYS.residual, `residuals[${i}]`); });
  }
  if (isObject(raw.uv254)) onlyKeys(raw.uv254, BACKGROUND_KEYS.uv254, 'uv254');
  if (isObject(raw.model_selection)) {
    onlyKeys(raw.model_selection, BACKGROUND_KEYS.modelSelection, 'model_selection');
    const alts = raw.model_selection.alternatives;
    if (Array.isArray(alts)) alts.forEach((a: unknown, i: number) => { if (isObject(a)) onlyKeys(a, BACKGROUND_KEYS.alternative, `model_selection.alternatives[${i}]`); });
  }
  return raw as unknown as BackgroundFile;
}
