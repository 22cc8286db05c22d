/**
 * assertFiniteResult walks a result once without paths and, only when it holds a non-finite
 * number, again with paths to name the first one. Against the previous single walk (kept here
 * only as the reference): the same outcome and the same message on random results with rows,
 * typed arrays, shared objects, cycles and skipped `project`/`provenance` members.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assertFiniteResult } from '../../src/scenario/finiteResult.js';
import { ComputationError } from '../../src/core/errors.js';

// ---- the previous check (reference only) ----
const INPUTS_BEHIND: ReadonlyArray<[RegExp, (carbon: string) => string]> = [
  [/carbonKg|KgPer/, () => 'site.flow (and the flows of the DOC series) with the dose'],
  [/yearly|daily|Cost|cost/, (c) => `site.flow (and the flows of the DOC series), ${c}.price_per_kg`],
  [/costPerM3/, (c) => `${c}.price_per_kg`],
  [/gac/, (c) => `${c}.bed_density_kg_per_m3, ${c}.ebct_min, site.flow`],
  [/dose|Dose/, () => 'the compounds\' K, one_over_n and c0, the goals and site.doc'],
];
function previousAssertFiniteResult(result: unknown, carbonNames: readonly string[] = []): void {
  const seen = new WeakSet<object>();
  const keys: Array<string | number> = [];
  const pathOf = (): string => keys.reduce<string>((p, k) => (typeof k === 'number' ? `${p}[${k}]` : p ? `${p}.${k}` : k), '');
  const fail = (v: number, path: string): never => {
    const m = /^carbons\[(\d+)\]/.exec(path);
    const carbon = m ? `carbons[${m[1]}]${carbonNames[Number(m[1])] ? ` ("${carbonNames[Number(m[1])]}")` : ''}` : 'carbons[…]';
    const behind = INPUTS_BEHIND.find(([re]) => re.test(path.replace(/^carbons\[\d+\]\.?/, '')))?.[1](carbon) ?? 'the magnitudes of the inputs';
    throw new ComputationError(`the result ${path} would be ${Number.isNaN(v) ? 'not a number' : 'infinite'}; the inputs behind it are ${behind}: check their values and units (nothing was written)`);
  };
  const walk = (v: unknown): void => {
    if (typeof v === 'number') { if (!Number.isFinite(v)) fail(v, pathOf()); return; }
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
  walk(result);
}

/** The outcome of a check: undefined, or the message thrown. */
function outcome(check: () => void): string | undefined {
  try { check(); return undefined; } catch (e) { return (e as Error).message; }
}

const num = fc.oneof({ weight: 12, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) }, { weight: 1, arbitrary: fc.constantFrom(NaN, Infinity, -Infinity) });
const key = fc.constantFrom('carbons', 'daily', 'rows', 'doseMgPerL', 'cost', 'yearly', 'gac', 'project', 'provenance', 'x', '0');
const leaf = fc.oneof(num, fc.constantFrom(null, undefined, 'text', true));
const row = fc.dictionary(key, leaf, { maxKeys: 5 });
const value = fc.letrec((tie) => ({
  v: fc.oneof({ depthSize: 'small' }, leaf, tie('obj'), tie('arr'), tie('rows'), tie('typed')),
  obj: fc.dictionary(key, tie('v'), { maxKeys: 4 }),
  arr: fc.array(tie('v'), { maxLength: 4 }),
  rows: fc.array(row, { maxLength: 60 }),
  typed: fc.oneof(fc.array(num, { maxLength: 8 }).map((a) => Float64Array.from(a)), fc.array(num, { maxLength: 8 }).map((a) => Float32Array.from(a)), fc.constant(Int32Array.of(1, 2))),
}));

describe('assertFiniteResult against the previous walk', () => {
  it('the same outcome and message on random results', () => {
    fc.assert(fc.property(fc.dictionary(key, value.v, { maxKeys: 4 }), fc.boolean(), (result, link) => {
      if (link) {
        // a shared row (met under project first, then elsewhere) and a cycle
        const shared = { cost: Infinity };
        Object.assign(result, { project: { shared }, self: result, z: [shared] });
      }
      expect(outcome(() => assertFiniteResult(result, ['A', 'B']))).toBe(outcome(() => previousAssertFiniteResult(result, ['A', 'B'])));
    }), { numRuns: 500 });
  });

  it('the same message for a non-finite number late in long per-day rows, in a typed array and behind a cycle', () => {
    const rows = Array.from({ length: 50_000 }, (_, k) => ({ date: `d${k}`, doseMgPerL: k / 7, carbonKgPerD: k === 49_321 ? -Infinity : k, governedBy: 'x' }));
    const cyclic: Record<string, unknown> = { a: [1, 2] };
    cyclic.back = cyclic;
    (cyclic.a as unknown[]).push(cyclic, { deep: Float32Array.of(1, NaN) });
    for (const r of [{ carbons: [{ daily: { rows } }] }, { carbons: [{}, cyclic] }, { provenance: rows, carbons: [{ c: Float64Array.of(1, Infinity) }] }, { project: cyclic, ok: rows.slice(0, 10) }]) {
      expect(outcome(() => assertFiniteResult(r, ['A', 'B']))).toBe(outcome(() => previousAssertFiniteResult(r, ['A', 'B'])));
    }
    expect(outcome(() => assertFiniteResult({ carbons: [{ daily: { rows } }] }, ['A']))).toMatch(/^the result carbons\[0\]\.daily\.rows\[49321\]\.carbonKgPerD would be infinite/);
    expect(outcome(() => assertFiniteResult({ project: cyclic, ok: rows.slice(0, 10) }))).toBeUndefined();
  });
});
