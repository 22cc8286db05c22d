/**
 * A result that holds a non-finite number (an overflow to Infinity, or NaN) must never reach a
 * table or a report ("∞ t/a"): `assertFiniteResult` walks a result and throws ComputationError
 * naming the first such value and the inputs behind it.
 */
import { ComputationError } from '../core/errors.js';

/** The inputs that feed a result field, by a key on its path (first match wins). */
const INPUTS_BEHIND: ReadonlyArray<[RegExp, (carbon: string) => string]> = [
  [/carbonKg|KgPer/, () => 'site.flow (and the flows of the DOC series) with the dose'],
  [/yearly|daily|Cost|cost/, (c) => `site.flow (and the flows of the DOC series), ${c}.price_per_kg`],
  [/costPerM3/, (c) => `${c}.price_per_kg`],
  [/gac/, (c) => `${c}.bed_density_kg_per_m3, ${c}.ebct_min, site.flow`],
  [/dose|Dose/, () => 'the compounds\' K, one_over_n and c0, the goals and site.doc'],
];

/**
 * Throw when `result` holds a non-finite number (the `project` and `provenance` fields are
 * inputs and are skipped). @param carbonNames names of the carbons, to name `carbons[i]`
 * @throws ComputationError naming the result field and the inputs behind it
 */
export function assertFiniteResult(result: unknown, carbonNames: readonly string[] = []): void {
  // a tight walk without paths first (a 36,500-day result holds hundreds of thousands of numbers);
  // only a result that holds a non-finite number is walked again to name the first one
  if (holdsNonFinite(result, new Set<object>())) throwForFirstNonFinite(result, carbonNames);
}

/**
 * Whether a non-finite number is reachable in `v` as throwForFirstNonFinite walks it (the same
 * members). Only objects that hold objects are remembered in `seen` (a cycle passes through
 * them); an object of primitives (a per-day row) is checked again where it is met again.
 */
function holdsNonFinite(v: unknown, seen: Set<object>): boolean {
  if (typeof v === 'number') return !Number.isFinite(v);
  if (v === null || typeof v !== 'object' || seen.has(v)) return false;
  if (v instanceof Float64Array || v instanceof Float32Array) {
    for (let i = 0; i < v.length; i++) if (!Number.isFinite(v[i]!)) return true;
    return false;
  }
  let container = false;
  if (Array.isArray(v) || ArrayBuffer.isView(v)) {
    const a = v as unknown as ArrayLike<unknown>;
    for (let i = 0; i < a.length; i++) {
      const e = a[i];
      if (typeof e === 'number') { if (!Number.isFinite(e)) return true; continue; }
      if (e === null || typeof e !== 'object') continue;
      if (!container) { container = true; seen.add(v); }
      // a row of primitives is checked here (the loop of a long array of rows stays in one function)
      let flat = !Array.isArray(e) && !ArrayBuffer.isView(e) && !seen.has(e);
      if (flat) {
        const r = e as Record<string, unknown>;
        for (const k in r) {
          if (!Object.prototype.hasOwnProperty.call(r, k) || k === 'project' || k === 'provenance') continue;
          const x = r[k];
          if (typeof x === 'number') { if (!Number.isFinite(x)) return true; } else if (x !== null && typeof x === 'object') { flat = false; break; }
        }
      }
      if (!flat && holdsNonFinite(e, seen)) return true;
    }
    return false;
  }
  const o = v as Record<string, unknown>;
  for (const k in o) {
    if (!Object.prototype.hasOwnProperty.call(o, k) || k === 'project' || k === 'provenance') continue;
    const e = o[k];
    if (typeof e === 'number') { if (!Number.isFinite(e)) return true; continue; }
    if (e === null || typeof e !== 'object') continue;
    if (!container) { container = true; seen.add(v); }
    if (holdsNonFinite(e, seen)) return true;
  }
  return false;
}

/** Walk `result` with the path of each value and throw for its first non-finite number (see assertFiniteResult). */
function throwForFirstNonFinite(result: unknown, carbonNames: readonly string[]): void {
  const seen = new WeakSet<object>();
  // the path is kept as a stack of keys and written out only for a failure (a 36,500-day result
  // holds hundreds of thousands of numbers)
  const keys: Array<string | number> = [];
  const pathOf = (): string => keys.reduce<string>((p, k) => (typeof k === 'number' ? `${p}[${k}]` : p ? `${p}.${k}` : k), '');
  const walk = (v: unknown): void => {
    if (typeof v === 'number') {
      if (!Number.isFinite(v)) fail(v, pathOf());
      return;
    }
    if (v === null || typeof v !== 'object' || seen.has(v)) return;
    seen.add(v);
    if (v instanceof Float64Array || v instanceof Float32Array) {
      for (let i = 0; i < v.length; i++) if (!Number.isFinite(v[i]!)) { keys.push(i); fail(v[i]!, pathOf()); }
      return;
    }
    if (Array.isArray(v) || ArrayBuffer.isView(v)) {
      const a = v as unknown as ArrayLike<unknown>;
      keys.push(0);
      for (let i = 0; i < a.length; i++) { keys[keys.length - 1] = i; walk(a[i]); }
      keys.pop();
      return;
    }
    for (const k in v) {
      if (!Object.prototype.hasOwnProperty.call(v, k) || k === 'project' || k === 'provenance') continue;
      keys.push(k);
      walk((v as Record<string, unknown>)[k]);
      keys.pop();
    }
  };
  const fail = (v: number, path: string): never => {
    const m = /^carbons\[(\d+)\]/.exec(path);
    const carbon = m ? `carbons[${m[1]}]${carbonNames[Number(m[1])] ? ` ("${carbonNames[Number(m[1])]}")` : ''}` : 'carbons[…]';
    const behind = INPUTS_BEHIND.find(([re]) => re.test(path.replace(/^carbons\[\d+\]\.?/, '')))?.[1](carbon) ?? 'the magnitudes of the inputs';
    throw new ComputationError(`the result ${path} would be ${Number.isNaN(v) ? 'not a number' : 'infinite'}; the inputs behind it are ${behind}: check their values and units (nothing was written)`);
  };
  walk(result);
}
