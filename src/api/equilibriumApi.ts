/**
 * Library entry points behind `sorbshare equilibrium` and `sorbshare dose`. Each takes the parsed
 * mixture object (the mixture file's JSON) and returns exactly what `--json` prints.
 */
import { InputError } from '../core/errors.js';
import { prepareMixture, type FreundlichComponent, type PreparedMixture } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared, type BatchSolution } from '../equilibrium/iastBatch.js';
import { directIastPrepared } from '../equilibrium/iastDirect.js';
import { logSpaced } from '../numerics/logSpace.js';
import { doseForRemoval } from '../design/doseForRemoval.js';
import { atPath, parseConcentration, parseDose, readComponent, readMixture, type MixtureInput, type ParsedMixture } from '../scenario/readMixture.js';

export interface EquilibriumComponentResult {
  id: string;
  c0_mg_per_L: number;
  c_mg_per_L: number;
  q_mg_per_g: number;
  removal_fraction: number;
}

export interface EquilibriumResult {
  dose_mg_per_L: number;
  components: EquilibriumComponentResult[];
}

export interface DoseSearchResult {
  target: string;
  dose_mg_per_L: number;
  removal_fraction: number;
}

/** A goal: removal in percent (0–100, exclusive) or an effluent limit ("50 ng/L" or mg/L). */
export type DoseGoal = { removal: number } | { limit: string | number };

type MixtureLike = MixtureInput | ParsedMixture | unknown;

function toParsed(mixture: MixtureLike): ParsedMixture {
  if (isParsed(mixture)) return mixture;
  return readMixture(mixture);
}

/**
 * The parsed and prepared mixture of a mixture object, kept per object: repeated calls with the
 * same object (a sweep, a search, a caller's own loop) skip the reading, the unit conversion and
 * the preparation. Each call first checks that the object still holds exactly what it held
 * (every own key and value, in order, compared with a snapshot taken when it was read), so a
 * changed object is read again, with the same validation and messages as at first.
 */
interface PreparedEntry { snapshot: unknown[]; parsed: ParsedMixture; pm: PreparedMixture }
const PREPARED = new WeakMap<object, PreparedEntry>();
const OBJECT_MARK = Symbol('object');
const ARRAY_MARK = Symbol('array');

/** Appends the content of plain data `v` to `out`; false when `v` holds anything else (then nothing is kept). */
function snapshot(v: unknown, out: unknown[]): boolean {
  if (v === null || (typeof v !== 'object' && typeof v !== 'function' && typeof v !== 'symbol')) { out.push(v); return true; }
  if (typeof v !== 'object') return false;
  if (Array.isArray(v)) {
    if (Object.getPrototypeOf(v) !== Array.prototype) return false;
    out.push(ARRAY_MARK, v.length);
    for (let i = 0; i < v.length; i++) if (!snapshot(v[i], out)) return false;
    return true;
  }
  const proto = Object.getPrototypeOf(v);
  if (proto !== Object.prototype && proto !== null) return false;
  const keys = Object.keys(v);
  out.push(OBJECT_MARK, keys.length);
  for (const k of keys) { out.push(k); if (!snapshot((v as Record<string, unknown>)[k], out)) return false; }
  return true;
}

/** The position after `v` in `snap` when `v` still holds what was stored from `at` on, else -1. */
function matches(v: unknown, snap: readonly unknown[], at: number): number {
  if (v === null || typeof v !== 'object') return at < snap.length && Object.is(snap[at], v) ? at + 1 : -1;
  let i = at;
  if (Array.isArray(v)) {
    if (snap[i] !== ARRAY_MARK || snap[i + 1] !== v.length) return -1;
    i += 2;
    for (let k = 0; k < v.length && i >= 0; k++) i = matches(v[k], snap, i);
    return i;
  }
  if (snap[i] !== OBJECT_MARK) return -1;
  const count = snap[i + 1];
  i += 2;
  // the own enumerable string keys in the order of Object.keys (for-in lists them first, then
  // inherited ones, which are skipped), without allocating the array of keys on every call
  let seen = 0;
  for (const key in v) {
    if (!Object.prototype.hasOwnProperty.call(v, key)) continue;
    if (++seen > (count as number) || snap[i] !== key) return -1;
    i = matches((v as Record<string, unknown>)[key], snap, i + 1);
    if (i < 0) return -1;
  }
  return seen === count ? i : -1;
}

/** The parsed mixture and its prepared form (kept per object while the object is unchanged). */
function prepared(mixture: MixtureLike): { parsed: ParsedMixture; pm: PreparedMixture } {
  const key = typeof mixture === 'object' && mixture !== null ? mixture : undefined;
  const hit = key ? PREPARED.get(key) : undefined;
  if (hit && matches(mixture, hit.snapshot, 0) === hit.snapshot.length) return hit;
  const parsed = toParsed(mixture);
  const pm = prepareMixture(parsed.components);
  const snap: unknown[] = [];
  if (key && snapshot(mixture, snap)) PREPARED.set(key, { snapshot: snap, parsed, pm });
  return { parsed, pm };
}

function isParsed(m: unknown): m is ParsedMixture {
  return typeof m === 'object' && m !== null && Array.isArray((m as ParsedMixture).components) &&
    (m as ParsedMixture).components.every((c) => typeof (c as FreundlichComponent).c0MgPerL === 'number');
}

function resolveDose(dose: string | number | undefined, parsed: ParsedMixture): number {
  if (dose !== undefined) return atPath('dose', () => parseDose(dose));
  if (parsed.doseMgPerL !== undefined) return parsed.doseMgPerL;
  throw new InputError('no carbon dose given; expected "dose" in the mixture or a dose argument such as "20 mg/L"', { path: 'dose' });
}

/** Shape one solution as the `--json` output. */
export function formatSolution(pm: PreparedMixture, s: BatchSolution): EquilibriumResult {
  return {
    dose_mg_per_L: s.doseGPerL * 1000,
    components: pm.source.map((c, i) => ({
      id: c.id,
      c0_mg_per_L: c.c0MgPerL,
      c_mg_per_L: s.cMgPerL[i]!,
      q_mg_per_g: s.qMgPerG[i]!,
      removal_fraction: c.c0MgPerL > 0 ? 1 - s.cMgPerL[i]! / c.c0MgPerL : 0,
    })),
  };
}

/**
 * Batch IAST equilibrium of a mixture at one carbon dose.
 * @param mixture the mixture file's object (or an already parsed mixture)
 * @param dose    "20 mg/L", a number in mg/L, or omitted to use the mixture's own dose; at dose 0 every loading is 0 and c = c0
 */
export function equilibrium(mixture: MixtureLike, dose?: string | number): EquilibriumResult {
  const { parsed, pm } = prepared(mixture);
  const doseMgPerL = resolveDose(dose, parsed);
  if (doseMgPerL === 0) {
    // no carbon: nothing adsorbed, c = c0 (reported as zero loadings rather than the limiting q at c0)
    return { dose_mg_per_L: 0, components: pm.source.map((c) => ({ id: c.id, c0_mg_per_L: c.c0MgPerL, c_mg_per_L: c.c0MgPerL, q_mg_per_g: 0, removal_fraction: 0 })) };
  }
  return formatSolution(pm, solveBatchPrepared(pm, doseMgPerL / 1000));
}

/** Log-spaced doses from `from` to `to` inclusive (mg/L). */
export function logSpacedDoses(fromMgPerL: number, toMgPerL: number, points: number): number[] {
  return logSpaced(fromMgPerL, toMgPerL, points, 'from');
}

/** Removal-against-dose curve: one equilibrium per log-spaced dose. */
export function equilibriumCurve(mixture: MixtureLike, from: string | number, to: string | number, points: number): { curve: EquilibriumResult[] } {
  const parsed = toParsed(mixture);
  const f = atPath('from', () => parseDose(from));
  const t = atPath('to', () => parseDose(to));
  const pm = prepareMixture(parsed.components);
  let warm: { u: number; theta: number } | undefined;
  const curve = logSpacedDoses(f, t, points).map((d) => {
    const s = solveBatchPrepared(pm, d / 1000, warm);
    warm = s.state;
    return formatSolution(pm, s);
  });
  return { curve };
}

/** Turn a goal into a removal fraction for a component with initial concentration c0. */
export function goalToRemovalFraction(goal: DoseGoal, c0MgPerL: number, targetId: string): number {
  if ('removal' in goal) {
    const r = goal.removal;
    if (typeof r !== 'number' || !Number.isFinite(r) || !(r > 0 && r < 100)) throw new InputError(`expected a removal goal in percent between 0 and 100 (exclusive), got ${JSON.stringify(r)}`, { path: 'removal' });
    return r / 100;
  }
  if ('limit' in goal) {
    const lim = atPath('limit', () => parseConcentration(goal.limit));
    if (!(lim > 0)) throw new InputError('expected a positive effluent limit', { path: 'limit' });
    if (lim >= c0MgPerL) throw new InputError(`the limit ${lim} mg/L is not below c0 = ${c0MgPerL} mg/L of "${targetId}"; no carbon is needed`, { path: 'limit' });
    return 1 - lim / c0MgPerL;
  }
  throw new InputError('expected a goal { removal: percent } or { limit: "50 ng/L" }', { path: 'goal' });
}

/** The carbon dose that meets a removal goal or an effluent limit for one component. */
export function doseFor(mixture: MixtureLike, targetId: string, goal: DoseGoal): DoseSearchResult {
  const parsed = toParsed(mixture);
  const idx = parsed.components.findIndex((c) => c.id === targetId);
  if (idx < 0) throw new InputError(`target "${targetId}" is not in the mixture; its ids are ${parsed.components.map((c) => `"${c.id}"`).join(', ')}`, { path: 'target' });
  const comp = parsed.components[idx]!;
  const R = goalToRemovalFraction(goal, comp.c0MgPerL, targetId);
  const pm = prepareMixture(parsed.components);
  const r = doseForRemoval(pm, idx, R);
  return { target: targetId, dose_mg_per_L: r.doseGPerL * 1000, removal_fraction: r.removalFraction };
}

export interface LoadingResult {
  id: string;
  c_mg_per_L: number;
  q_mg_per_g: number;
}

/**
 * Direct IAST: loadings in equilibrium with given liquid concentrations.
 * @param components   compounds (file shape without c0, or parsed FreundlichComponent)
 * @param concentrations liquid concentrations by id ("100 ng/L" or mg/L) or in component order
 */
export function loadingsAt(components: unknown[], concentrations: Record<string, string | number> | Array<string | number>): { psi_mg_per_g: number; components: LoadingResult[] } {
  if (!Array.isArray(components) || components.length === 0) throw new InputError('expected a non-empty array of components', { path: 'components' });
  const comps = components.map((c, i) => (isInternal(c) ? c : readComponent(c, `components[${i}]`, false)));
  const cs = comps.map((c, i) => {
    const v = Array.isArray(concentrations) ? concentrations[i] : concentrations[c.id];
    if (v === undefined) throw new InputError(`missing the liquid concentration of "${c.id}"`, { path: `concentrations.${c.id}` });
    return atPath(`concentrations.${c.id}`, () => parseConcentration(v));
  });
  const withC = comps.map((c, i) => ({ ...c, c0MgPerL: cs[i]! }));
  const pm = prepareMixture(withC);
  const activeC = Array.from(pm.active, (idx) => cs[idx]!);
  const d = directIastPrepared(pm, activeC);
  const q = new Float64Array(comps.length);
  pm.active.forEach((idx, j) => { q[idx] = d.qMgPerG[j]!; });
  return { psi_mg_per_g: d.psiMgPerG, components: comps.map((c, i) => ({ id: c.id, c_mg_per_L: cs[i]!, q_mg_per_g: q[i]! })) };
}

function isInternal(c: unknown): c is FreundlichComponent {
  return typeof c === 'object' && c !== null && typeof (c as FreundlichComponent).oneOverN === 'number' && typeof (c as FreundlichComponent).K === 'number';
}
