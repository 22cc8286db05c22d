/**
 * The snake_case JSON shapes, made in one place at the edge. Core result types are camelCase
 * (`doseMgPerL`); every JSON file and `--json` output is snake_case with the unit in the key
 * (`dose_mg_per_L`). This module holds the explicit mapping of every camelCase field name of the
 * core result types to its JSON name, grouped by the type that declares it, and converts a whole
 * JSON-ready value with it.
 *
 * Keys that are user ids (compound ids, step names) are never renamed: a core field listed in
 * `USER_ID_MAP_FIELDS` holds a map keyed by user ids, and a map built by a writer is marked with
 * `userIdMap()`. Keys already in snake_case (or one lower-case word) pass unchanged, so the
 * existing run.json names stay stable. A camelCase field missing from the mapping is left as it
 * is (the run.json test, tests/design/runRecordSnakeCase.test.ts, then names it).
 * Typed arrays become plain arrays (JSON.stringify would write them as index-keyed objects).
 */

/** camelCase field name of a core type → its JSON name. */
export const SNAKE_CASE_KEYS: Readonly<Record<string, string>> = {
  // shared by many types (concentrations, doses, flows)
  c0MgPerL: 'c0_mg_per_L', cMgPerL: 'c_mg_per_L', docMgPerL: 'doc_mg_per_L', doc0MgPerL: 'doc0_mg_per_L',
  doseMgPerL: 'dose_mg_per_L', dosesMgPerL: 'doses_mg_per_L', doseGPerL: 'dose_g_per_L', limitMgPerL: 'limit_mg_per_L',
  flowM3PerD: 'flow_m3_per_d', oneOverN: 'one_over_n', compoundId: 'compound_id', compoundIds: 'compound_ids',
  carbonName: 'carbon_name', targetId: 'target_id', pricePerKg: 'price_per_kg', carbonPricePerKg: 'carbon_price_per_kg',
  backgroundC0MgPerL: 'background_c0_mg_per_L', fromMgPerL: 'from_mg_per_L', toMgPerL: 'to_mg_per_L',
  // IntegratorStats (src/kinetics/implicitIntegrator.ts), in run.json's fixed-bed record
  rejectedSteps: 'rejected_steps', newtonIterations: 'newton_iterations', newtonFailures: 'newton_failures', rhsEvaluations: 'rhs_evaluations', maxAcceptedError: 'max_accepted_error',
  // CompoundGoal, CompoundDose, Design, SurrogateSetPoint (src/design)
  removalFraction: 'removal_fraction', remainingFraction: 'remaining_fraction', governedBy: 'governed_by',
  costPerM3: 'cost_per_m3', docReduction: 'doc_reduction', uv254Reduction: 'uv254_reduction',
  designDoseMgPerL: 'design_dose_mg_per_L', designDoseSource: 'design_dose_source',
  // IndicatorDose, indicator check (src/design, src/indicators)
  goalPercent: 'goal_percent', meanRemovalPercent: 'mean_removal_percent', removalPercent: 'removal_percent',
  // removal curves, reduced loadings (src/design)
  qSingleMgPerG: 'q_single_mg_per_g', qSiteMgPerG: 'q_site_mg_per_g',
  // daily doses, dose table, yearly carbon (src/design, src/siteSeries)
  carbonKg: 'carbon_kg', carbonKgPerD: 'carbon_kg_per_d', carbonKgPerDAtDesign: 'carbon_kg_per_d_at_design',
  daysWithDose: 'days_with_dose', totalCarbonKg: 'total_carbon_kg', totalCost: 'total_cost', totalDays: 'total_days',
  totalKg: 'total_kg', yearlyCarbonKg: 'yearly_carbon_kg', yearlyKg: 'yearly_kg', yearlyCost: 'yearly_cost',
  docNodesMgPerL: 'doc_nodes_mg_per_L', docSeriesMgPerL: 'doc_series_mg_per_L', midpointErrorRel: 'midpoint_error_rel',
  toleranceRel: 'tolerance_rel', doseAgainstDoc: 'dose_against_doc', flowFromDesign: 'flow_from_design',
  // surrogates: curve, set-points, pilot check (src/surrogates)
  uv254PerM: 'uv254_per_m', uv254_0PerM: 'uv254_0_per_m', uv254AbsorbancePerM: 'uv254_absorbance_per_m',
  goalText: 'goal_text', removalGoal: 'removal_goal', hasUv254: 'has_uv254', rmsePerM: 'rmse_per_m',
  bandPercentagePoints: 'band_percentage_points', meanResidual: 'mean_residual', measuredRemoval: 'measured_removal',
  predictedRemoval: 'predicted_removal', outsideBand: 'outside_band', outlierCompounds: 'outlier_compounds',
  modelCurve: 'model_curve', siteCurve: 'site_curve', atBound: 'at_bound', standardErrorK: 'standard_error_K',
  // GAC estimate (src/gac)
  bedDensityKgPerM3: 'bed_density_kg_per_m3', ebctMin: 'ebct_min', bedCarbonTonnes: 'bed_carbon_tonnes',
  bedVolumeM3: 'bed_volume_m3', bedVolumes: 'bed_volumes', bedVolumesSingleSolute: 'bed_volumes_single_solute',
  carbonTonnesPerYear: 'carbon_tonnes_per_year', carbonUsageGPerM3: 'carbon_usage_g_per_m3',
  carbonUsageSingleSoluteGPerM3: 'carbon_usage_single_solute_g_per_m3', lifeDays: 'life_days',
  lifeDaysSingleSolute: 'life_days_single_solute', qCompetitiveMgPerG: 'q_competitive_mg_per_g', upperBound: 'upper_bound',
  // Monte Carlo problem, settings and result (src/uncertainty)
  KRelSd: 'K_rel_sd', oneOverNRelSd: 'one_over_n_rel_sd', docRelSd: 'doc_rel_sd', fractionRelSd: 'fraction_rel_sd',
  backgroundKRelSd: 'background_K_rel_sd', docLevels: 'doc_levels', chunkSize: 'chunk_size',
  percentileMethod: 'percentile_method', pointEstimate: 'point_estimate', unreachableDraws: 'unreachable_draws',
  governingShare: 'governing_share', p10Percent: 'p10_percent', p50Percent: 'p50_percent', p90Percent: 'p90_percent',
  keepSamples: 'keep_samples', pointDesign: 'point_design',
  // PAC contact kinetics in the Monte Carlo problem and settings (src/uncertainty/kineticUncertainty.ts, src/project)
  radiusM: 'radius_m', densityGPerL: 'density_g_per_L', contactTimeS: 'contact_time_s', carbonAgeS: 'carbon_age_s',
  dsM2PerS: 'Ds_m2_per_s', dlM2PerS: 'DL_m2_per_s', dsLnSd: 'ln_Ds_sd', interiorPoints: 'interior_points',
  dsRelSd: 'Ds_rel_sd', contactDraws: 'contact_draws', gacDraws: 'gac_draws',
  // calibration and fractionation fits (src/calibration, src/fractionation)
  fractionCi: 'fraction_ci', rmseRelative: 'rmse_relative', residualScale: 'residual_scale',
  maxRelativeError: 'max_relative_error', modelSelection: 'model_selection',
  // check cases (src/checks)
  relativeError: 'relative_error', absoluteError: 'absolute_error',
};

/** Core fields whose value is a map keyed by user ids (compound ids): keys kept, values converted. */
export const USER_ID_MAP_FIELDS: ReadonlySet<string> = new Set([
  'removalPercent', // RemovalCurves: compound id → removal % at each dose
  'removal', // SurrogateCurve point: compound id → removal
  'removals', // pilot pair: compound id → measured removal
  'samples', // Monte Carlo samples: quantity key → draws
  'jarTests', // compound id → jar-test table
]);

/** A map built by a writer whose keys are user ids (kept as they are). */
export class UserIdMap {
  constructor(readonly entries: Readonly<Record<string, unknown>>) {}
}

/** Mark a map keyed by user ids (compound ids, file roles, step names) so that its keys are kept. */
export function userIdMap(entries: Readonly<Record<string, unknown>>): UserIdMap {
  return new UserIdMap(entries);
}

/** SNAKE_CASE_KEYS as a Map (a lookup in the object literal of some 200 keys cost more). */
const SNAKE_CASE_MAP: ReadonlyMap<string, string> = new Map(Object.entries(SNAKE_CASE_KEYS));

/** The JSON name of a field: the explicit mapping, or the key itself. */
export function snakeCaseKey(key: string): string {
  return SNAKE_CASE_MAP.get(key) ?? key;
}

function convertMap(entries: Readonly<Record<string, unknown>>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(entries)) out[k] = toSnakeCaseJson(entries[k]);
  return out;
}

/**
 * A JSON-ready copy of `value` with every mapped camelCase key renamed (see above); user-id maps
 * keep their keys. Plain data only (objects, arrays, typed arrays, primitives); other objects
 * (Date) are returned as they are for JSON.stringify.
 */
export function toSnakeCaseJson(value: unknown): unknown {
  if (value === null || typeof value !== 'object') return value;
  if (value instanceof UserIdMap) return convertMap(value.entries);
  if (Array.isArray(value)) return value.map(toSnakeCaseJson);
  if (ArrayBuffer.isView(value)) return Array.from(value as unknown as ArrayLike<number>);
  const proto = Object.getPrototypeOf(value);
  if (proto !== Object.prototype && proto !== null) return value;
  const src = value as Record<string, unknown>;
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(src)) {
    const v = src[k];
    const isMap = USER_ID_MAP_FIELDS.has(k) && v !== null && typeof v === 'object' && !Array.isArray(v) && !ArrayBuffer.isView(v);
    out[snakeCaseKey(k)] = isMap ? convertMap(v as Record<string, unknown>) : toSnakeCaseJson(v);
  }
  return out;
}

/** Arrays longer than this are written one element per line, each element on its one line. */
export const LONG_ARRAY = 50;

/**
 * JSON text with a two-space indent, as JSON.stringify(value, null, 2) writes it, except that an
 * array of more than LONG_ARRAY elements has each element compact on its own line: per-day data
 * (a 36,500-day series) stays readable line by line at a third of the indented size. The same
 * JSON value either way (toJSON, undefined and non-finite numbers as JSON.stringify treats them).
 */
export function jsonText(value: unknown): string {
  // JSON.stringify writes the text (natively, fast); each long array stands in it as a
  // placeholder string with a per-call random tag, replaced afterwards by its lines
  const longs: unknown[][] = [];
  const tag = `\u0000long-array-${Math.random().toString(36).slice(2)}-`;
  const text = JSON.stringify(value, (_key, v: unknown) => (Array.isArray(v) && v.length > LONG_ARRAY ? tag + (longs.push(v) - 1) : v), 2) as string | undefined;
  if (text === undefined || longs.length === 0) return text as string;
  const quoted = JSON.stringify(tag).slice(0, -1).replace(/[\\^$.*+?()[\]{}|]/g, '\\$&');
  return text.replace(new RegExp(`${quoted}(\\d+)"`, 'g'), (_m, k: string, offset: number) => {
    const lineStart = text.lastIndexOf('\n', offset) + 1;
    let indent = '';
    while (text.charCodeAt(lineStart + indent.length) === 32) indent += ' ';
    const items = longs[Number(k)]!;
    const inner = `${indent}  `;
    const lines = new Array<string>(items.length);
    for (let i = 0; i < items.length; i++) lines[i] = JSON.stringify(items[i]) ?? 'null';
    return `[\n${inner}${lines.join(`,\n${inner}`)}\n${indent}]`;
  });
}

/**
 * The JSON text of a result (two-space indent, long arrays one element per line; see jsonText),
 * snake_case: every JSON writer prints through this. The text is jsonText(toSnakeCaseJson(value)),
 * written in one pass over `value` without the renamed copy (a 36,500-day run.json is 15 MB of
 * per-day objects): plain objects, user-id maps, arrays and typed arrays are written here, with
 * JSON.stringify's rules (numbers as String(n), non-finite as null, undefined members left out
 * and null in arrays, JSON.stringify's string quoting); anything else (a Date, a class instance,
 * an object with toJSON) is handed to jsonText as before.
 */
export function snakeCaseJsonText(value: unknown): string {
  const text = prettyText(value, '');
  return text as string; // undefined only where JSON.stringify gives undefined too
}

/** Quoted JSON names of keys (renamed, and as they are for user-id maps), made once per key. */
const quotedRenamed = new Map<string, string>();
const quotedKept = new Map<string, string>();
function quotedKey(key: string, renamed: boolean): string {
  const cache = renamed ? quotedRenamed : quotedKept;
  let q = cache.get(key);
  if (q === undefined) {
    q = JSON.stringify(renamed ? snakeCaseKey(key) : key);
    if (cache.size > 10_000) cache.clear(); // user ids as keys: keep the cache small
    cache.set(key, q);
  }
  return q;
}

/** How the direct writer treats a value (what toSnakeCaseJson would make of it). */
enum Shape { Primitive, Map, Array, View, Plain, Other }

function shapeOf(v: unknown): Shape {
  if (v === null || typeof v !== 'object') return Shape.Primitive;
  if (v instanceof UserIdMap) return Shape.Map;
  if (Array.isArray(v)) return Shape.Array;
  if (ArrayBuffer.isView(v)) return Shape.View;
  const proto = Object.getPrototypeOf(v);
  if (proto !== Object.prototype && proto !== null) return Shape.Other;
  return typeof (v as { toJSON?: unknown }).toJSON === 'function' ? Shape.Other : Shape.Plain;
}

/** JSON text of a primitive as JSON.stringify writes it (undefined: left out). */
function primitiveText(v: unknown): string | undefined {
  switch (typeof v) {
    case 'number': return Number.isFinite(v) ? String(v) : 'null';
    case 'string': return JSON.stringify(v);
    case 'boolean': return v ? 'true' : 'false';
    case 'object': return 'null'; // null
    case 'bigint': return JSON.stringify(v); // throws as JSON.stringify does
    default: return undefined; // undefined, function, symbol
  }
}

/** A member of an object: its key (renamed unless in a user-id map) and the value as toSnakeCaseJson converts it. */
function memberValue(src: Record<string, unknown>, k: string, userIds: boolean): { value: unknown; asMap: boolean } {
  const v = src[k];
  if (userIds) return { value: v, asMap: false };
  const isMap = USER_ID_MAP_FIELDS.has(k) && v !== null && typeof v === 'object' && !Array.isArray(v) && !ArrayBuffer.isView(v);
  return { value: v, asMap: isMap };
}

/**
 * Pretty text (two-space indent, at `indent`) of `v` after toSnakeCaseJson; `asMap`: v is a map
 * whose keys are kept (convertMap). undefined where JSON.stringify leaves the value out.
 */
function prettyText(v: unknown, indent: string, asMap = false): string | undefined {
  const shape = asMap ? Shape.Map : shapeOf(v);
  switch (shape) {
    case Shape.Primitive: return primitiveText(v);
    case Shape.Other: {
      const t = jsonText(v);
      return t === undefined ? undefined : indent === '' ? t : t.replace(/\n/g, `\n${indent}`);
    }
    case Shape.Array: case Shape.View: {
      const a = v as ArrayLike<unknown>;
      const len = a.length;
      if (len === 0) return '[]';
      const inner = `${indent}  `;
      const parts = new Array<string>(len);
      if (len > LONG_ARRAY) {
        const lines = longArrayLines(a, inner);
        if (lines !== undefined) return `[\n${inner}${lines}\n${indent}]`;
        // the general case: each element converted, then compact (what jsonText does)
        for (let i = 0; i < len; i++) parts[i] = (JSON.stringify(toSnakeCaseJson(a[i])) as string | undefined) ?? 'null';
      } else {
        for (let i = 0; i < len; i++) parts[i] = prettyText(a[i], inner) ?? 'null';
      }
      return `[\n${inner}${parts.join(`,\n${inner}`)}\n${indent}]`;
    }
    default: {
      // a plain object (keys renamed) or a user-id map (keys kept; asMap or a UserIdMap)
      const userIds = shape === Shape.Map;
      const src = (!asMap && v instanceof UserIdMap ? v.entries : v) as Record<string, unknown>;
      const inner = `${indent}  `;
      let out = '';
      const keys = Object.keys(src);
      // two keys with one JSON name (`doseMgPerL` beside `dose_mg_per_L`): as in toSnakeCaseJson's
      // object, the name once, where it first stands, with the value of the last key giving it
      const lastOf = userIds ? undefined : sharedNames(keys);
      const written = lastOf === undefined ? undefined : new Set<string>();
      for (let k of keys) {
        if (lastOf !== undefined) {
          const name = snakeCaseKey(k);
          const last = lastOf.get(name);
          if (last !== undefined) {
            if (written!.has(name)) continue; // written where the name first stood
            written!.add(name);
            k = last;
          }
        }
        const m = memberValue(src, k, userIds);
        const t = prettyText(m.value, inner, m.asMap);
        if (t === undefined) continue;
        out += `${out === '' ? '' : ','}\n${inner}${quotedKey(k, !userIds)}: ${t}`;
      }
      return out === '' ? '{}' : `{${out}\n${indent}}`;
    }
  }
}

/**
 * For keys of which two or more are renamed to one JSON name: that name → the last such key
 * (undefined, the usual case, when every name is distinct).
 */
function sharedNames(keys: readonly string[]): Map<string, string> | undefined {
  if (keys.every((k) => snakeCaseKey(k) === k)) return undefined; // unchanged keys of one object are distinct
  const last = new Map<string, string>();
  const count = new Map<string, number>();
  for (const k of keys) {
    const name = snakeCaseKey(k);
    last.set(name, k);
    count.set(name, (count.get(name) ?? 0) + 1);
  }
  for (const [name, n] of count) if (n < 2) last.delete(name);
  return last.size > 0 ? last : undefined;
}

/**
 * The lines of a long array (joined by ",\n" + inner), for the two shapes of per-day data:
 * numbers only (one native join: String(n) is JSON's number text for a finite n), and flat plain
 * objects (every value a primitive; per-day rows), renamed as toSnakeCaseJson does and written
 * by a native JSON.stringify per chunk of rows, split into lines. In compact JSON text a quote
 * inside a string is always escaped, so `},{"` occurs only between two objects of such an array
 * or at the end of a string ending in "},{" (such arrays are left to the general case).
 * undefined for any other array (written element by element).
 */
function longArrayLines(a: ArrayLike<unknown>, inner: string): string | undefined {
  const sep = `,\n${inner}`;
  if (ArrayBuffer.isView(a)) {
    if (a instanceof BigInt64Array || a instanceof BigUint64Array) return undefined; // throws there, as JSON.stringify does
    return numberLines(a as unknown as ArrayLike<number> & { join(sep: string): string }, sep);
  }
  if (typeof a[0] === 'number') {
    for (let i = 1; i < a.length; i++) if (typeof a[i] !== 'number') return undefined;
    return numberLines(a as unknown as ArrayLike<number> & { join(sep: string): string }, sep);
  }
  const shape = rowShape(a[0]);
  if (shape === undefined) return undefined;
  // in chunks of ROW_CHUNK rows: the renamed copies of a chunk die young (cheap to collect), and
  // the split of a chunk's text stays small
  const rowBreak = `},\n${inner}{"`;
  let lines = '';
  for (let start = 0; start < a.length; start += ROW_CHUNK) {
    const rows = renamedRows(a, start, Math.min(a.length, start + ROW_CHUNK), shape);
    if (rows === undefined) return undefined;
    const part = (JSON.stringify(rows) as string).slice(1, -1).split('},{"').join(rowBreak);
    lines = start === 0 ? part : lines + sep + part; // (no copy: the text is joined when it is written)
  }
  return lines;
}

/** Rows written per JSON.stringify call (their copies are garbage before the next chunk is made). */
const ROW_CHUNK = 4096;

/** Lines of an array of numbers (a typed array or numbers only): one join when every one is finite. */
function numberLines(a: ArrayLike<number> & { join(sep: string): string }, sep: string): string {
  const len = a.length;
  let finite = true;
  for (let i = 0; i < len; i++) if (!Number.isFinite(a[i])) { finite = false; break; }
  if (finite) return a.join(sep);
  // NaN and ±Infinity are null in JSON: written by JSON.stringify (no commas in number text)
  return (JSON.stringify(Array.isArray(a) ? a : Array.from(a)) as string).slice(1, -1).split(',').join(sep);
}

/** A plain object (not an array, typed array, user-id map or class instance): a per-day row candidate. */
function isPlainRow(e: unknown): e is Record<string, unknown> {
  if (e === null || typeof e !== 'object') return false;
  const proto = Object.getPrototypeOf(e); // (a user-id map's is UserIdMap.prototype)
  return (proto === Object.prototype || proto === null) && !Array.isArray(e) && !ArrayBuffer.isView(e);
}

/** A key that forbids the split into lines or the copy: toJSON, text ending in "},{", __proto__ (dropped by toSnakeCaseJson). */
function breaksKey(k: string): boolean {
  return k === 'toJSON' || k === '__proto__' || k.endsWith('},{');
}

/** The keys of the first row of an array of rows, their JSON names and the template of a renamed copy. */
interface RowShape { keys: string[]; names: string[]; renamed: boolean; template: Record<string, unknown> }

/** The shape of a first row (undefined when it is not a plain object or a key breaks the split). */
function rowShape(first: unknown): RowShape | undefined {
  if (!isPlainRow(first)) return undefined;
  const keys: string[] = [];
  for (const k in first) {
    if (breaksKey(k)) return undefined;
    keys.push(k);
  }
  const names = keys.map(snakeCaseKey);
  const renamed = names.some((name, j) => name !== keys[j]);
  const template: Record<string, unknown> = {};
  if (renamed) for (const name of names) template[name] = undefined;
  return { keys, names, renamed, template };
}

/**
 * Rows start..end-1 of an array of flat plain objects with their keys renamed (toSnakeCaseJson's
 * object for each, the same key order), ready for one JSON.stringify. A row with the first row's
 * keys in its order (every per-day row) is copied from the shape's template while it is checked
 * (names looked up once; copies of one shape share their layout, which JSON.stringify walks fast),
 * or is itself when no key is renamed; another row is copied key by key. undefined unless every
 * row is a flat plain object that writes at least one member and nothing in it breaks the split
 * into lines.
 */
function renamedRows(a: ArrayLike<unknown>, start: number, end: number, shape: RowShape): unknown[] | undefined {
  const { keys, names, template, renamed } = shape;
  const n = keys.length;
  const out = new Array<unknown>(end - start);
  for (let i = start; i < end; i++) {
    const e = a[i];
    if (!isPlainRow(e)) return undefined;
    const copy: Record<string, unknown> | undefined = renamed ? { ...template } : undefined;
    let j = 0, same = true, written = false;
    for (const k in e) {
      const v = e[k];
      if (same && j < n && k === keys[j]) {
        if (copy !== undefined) copy[names[j]!] = v;
      } else {
        same = false;
        if (breaksKey(k)) return undefined;
      }
      if ((v !== null && typeof v === 'object') || (typeof v === 'string' && v.endsWith('},{'))) return undefined;
      if (!written && v !== undefined && typeof v !== 'function' && typeof v !== 'symbol') written = true;
      j++;
    }
    if (!written) return undefined; // `{}` would not be split safely
    out[i - start] = same && j === n ? (copy ?? e) : renamedCopy(e);
  }
  return out;
}

/** toSnakeCaseJson's object for a flat plain object (its keys renamed, in its order). */
function renamedCopy(e: Record<string, unknown>): Record<string, unknown> {
  const o: Record<string, unknown> = {};
  for (const k in e) o[snakeCaseKey(k)] = e[k];
  return o;
}
