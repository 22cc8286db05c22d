/**
 * Reference check cases (capability 15). A case is a fixture pair in `fixtures/checks/<case>/`:
 * `input.json` names the source, the provenance of the expected value, the quantity the library
 * computes and a tolerance; `expected.json` holds the expected value, computed independently of
 * the library by `scripts/checkExpected.ts` and rewritten only with `UPDATE_FIXTURES=1`.
 * `runCheckCase` computes the value with the library's public functions and compares. Pure: the
 * CLI reads the files.
 */
import { InputError } from '../core/errors.js';
import { freundlichKFromInternal, freundlichKToInternal, type KUnit } from '../units/freundlichK.js';
import { equilibrium, loadingsAt } from '../api/equilibriumApi.js';
import { indicatorMean } from '../indicators/indicatorRule.js';
import { isObject } from '../scenario/readMixture.js';

/**
 * Where an expected value comes from, said honestly:
 * - `published table`: the value itself is printed in the source;
 * - `closed form`: an exact solution of the model's equations, evaluated to machine precision;
 * - `computed from a published rule`: the source gives the equation or rule (and perhaps the
 *   parameters), and the value was computed from it.
 */
export const PROVENANCES = ['published table', 'closed form', 'computed from a published rule'] as const;
export type Provenance = (typeof PROVENANCES)[number];

export interface CheckCase {
  id: string;
  title: string;
  source: string;
  provenance: Provenance;
  kind: CheckKind;
  input: Record<string, unknown>;
  expected: number;
  unit: string;
  tolerance: { relative?: number; absolute?: number };
  note?: string;
}

export interface CheckOutcome {
  id: string;
  title: string;
  source: string;
  provenance: Provenance;
  unit: string;
  expected: number;
  computed: number | null;
  /** |computed − expected| and its ratio to |expected|. */
  absoluteError: number | null;
  relativeError: number | null;
  tolerance: CheckCase['tolerance'];
  pass: boolean;
  /** Set when the computation threw. */
  error?: string;
}

type Compute = (input: Record<string, unknown>) => number;

function report(input: Record<string, unknown>): string {
  if (typeof input.report !== 'string') throw new InputError('expected "report": the id of the component to report', { path: 'input.report' });
  return input.report;
}

const KINDS = {
  /** K converted between unit pairs (Chen et al. 1999). */
  k_conversion: (input) => {
    const M = input.molar_mass as number | undefined;
    const Kint = freundlichKToInternal(input.K as number, input.one_over_n as number, input.from as KUnit, M);
    return freundlichKFromInternal(Kint, input.one_over_n as number, input.to as KUnit, M);
  },
  /** Loading from a one-component direct IAST, which reduces to Freundlich. */
  freundlich_q: (input) => {
    const comp = { id: 'X', K: input.K, one_over_n: input.one_over_n, ...(input.K_unit ? { K_unit: input.K_unit } : {}) };
    return loadingsAt([comp], { X: input.c as string }).components[0]!.q_mg_per_g;
  },
  /** Liquid concentration of a one-component batch IAST. */
  batch_single: (input) => {
    const r = equilibrium({ components: [{ id: 'X', c0: input.c0, K: input.K, one_over_n: input.one_over_n }] }, input.dose as string);
    return r.components[0]!.c_mg_per_L;
  },
  /** Loading of one component from direct IAST at given concentrations. */
  direct_iast: (input) => {
    const r = loadingsAt(input.components as unknown[], input.concentrations as Record<string, string>);
    return pick(r.components, report(input)).q_mg_per_g;
  },
  /** Fraction remaining c/c0 of one component in batch IAST. */
  batch_fraction_remaining: (input) => {
    const r = equilibrium({ components: input.components }, input.dose as string);
    const c = pick(r.components, report(input));
    return c.c_mg_per_L / c.c0_mg_per_L;
  },
  /** Loading of one component in batch IAST. */
  batch_loading: (input) => {
    const r = equilibrium({ components: input.components }, input.dose as string);
    return pick(r.components, report(input)).q_mg_per_g;
  },
  /** Mean of an indicator set (SR 814.201.231 Art. 3). */
  indicator_mean: (input) => {
    const subs = input.substances;
    if (!Array.isArray(subs)) throw new InputError('expected "substances" as an array', { path: 'input.substances' });
    return indicatorMean(subs.map((s: Record<string, unknown>) => ({ id: String(s.id), category: s.category as 1 | 2, removalPercent: s.removal_percent as number })));
  },
} satisfies Record<string, Compute>;

export type CheckKind = keyof typeof KINDS;
/** The kinds of reference check case (`kind` in a case's input.json), each a library computation. */
export const CHECK_KINDS = Object.keys(KINDS) as CheckKind[];

function pick<T extends { id: string }>(list: T[], id: string): T {
  const x = list.find((c) => c.id === id);
  if (!x) throw new InputError(`"${id}" is not a component of this case`, { path: 'input.report' });
  return x;
}

const INPUT_KEYS = ['id', 'title', 'source', 'provenance', 'kind', 'input', 'unit', 'tolerance', 'note'];
const EXPECTED_KEYS = ['expected', 'computed_by'];

function onlyKnownKeys(raw: Record<string, unknown>, keys: string[], what: string): void {
  for (const k of Object.keys(raw)) if (!keys.includes(k)) throw new InputError(`unknown key "${k}" in ${what}; expected ${keys.join(', ')}`, { path: k });
}

/** Check a parsed `input.json` (the case without its expected value). @throws InputError naming the JSON path */
export function readCheckInput(raw: unknown): Omit<CheckCase, 'expected'> {
  if (!isObject(raw)) throw new InputError('expected a check case object', { path: '$' });
  onlyKnownKeys(raw, INPUT_KEYS, 'a check case');
  for (const key of ['id', 'title', 'source', 'unit'] as const) {
    if (typeof raw[key] !== 'string' || raw[key] === '') throw new InputError(`expected "${key}" as text`, { path: key });
  }
  if (typeof raw.provenance !== 'string' || !(PROVENANCES as readonly string[]).includes(raw.provenance)) throw new InputError(`expected "provenance" as one of ${PROVENANCES.map((p) => `"${p}"`).join(', ')}`, { path: 'provenance' });
  if (typeof raw.kind !== 'string' || !(CHECK_KINDS as string[]).includes(raw.kind)) throw new InputError(`expected "kind" as one of ${CHECK_KINDS.join(', ')}`, { path: 'kind' });
  if (!isObject(raw.input)) throw new InputError('expected "input" as an object', { path: 'input' });
  if (raw.note !== undefined && typeof raw.note !== 'string') throw new InputError('expected "note" as text', { path: 'note' });
  const tol = raw.tolerance;
  if (!isObject(tol) || (typeof tol.relative !== 'number' && typeof tol.absolute !== 'number')) throw new InputError('expected "tolerance" with "relative" and/or "absolute"', { path: 'tolerance' });
  onlyKnownKeys(tol, ['relative', 'absolute'], 'the tolerance');
  return raw as unknown as Omit<CheckCase, 'expected'>;
}

/** Check a parsed `expected.json`: `{ "expected": number, "computed_by": text }`. @throws InputError naming the JSON path */
export function readCheckExpected(raw: unknown): number {
  if (!isObject(raw)) throw new InputError('expected an object { "expected": number, "computed_by": text }', { path: '$' });
  onlyKnownKeys(raw, EXPECTED_KEYS, 'an expected file');
  if (typeof raw.expected !== 'number' || !Number.isFinite(raw.expected)) throw new InputError('expected "expected" as a finite number', { path: 'expected' });
  if (typeof raw.computed_by !== 'string' || raw.computed_by === '') throw new InputError('expected "computed_by" naming the script that computed the value', { path: 'computed_by' });
  return raw.expected;
}

/** A whole case from its two parsed files (input.json, expected.json). Unknown keys are errors. */
export function readCheckCase(rawInput: unknown, rawExpected: unknown): CheckCase {
  return { ...readCheckInput(rawInput), expected: readCheckExpected(rawExpected) };
}

/** Compute one case and compare: pass when within the relative or the absolute tolerance. */
export function runCheckCase(c: CheckCase): CheckOutcome {
  const out: CheckOutcome = { id: c.id, title: c.title, source: c.source, provenance: c.provenance, unit: c.unit, expected: c.expected, computed: null, absoluteError: null, relativeError: null, tolerance: c.tolerance, pass: false };
  try {
    const v = KINDS[c.kind](c.input);
    out.computed = v;
    const abs = Math.abs(v - c.expected);
    out.absoluteError = abs;
    out.relativeError = c.expected !== 0 ? abs / Math.abs(c.expected) : null;
    out.pass = Number.isFinite(v) && ((c.tolerance.relative !== undefined && out.relativeError !== null && out.relativeError <= c.tolerance.relative) || (c.tolerance.absolute !== undefined && abs <= c.tolerance.absolute));
  } catch (e) {
    out.error = (e as Error).message;
  }
  return out;
}
