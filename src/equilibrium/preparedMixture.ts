/**
 * A mixture of Freundlich components in the internal units, laid out in typed arrays for the
 * solvers. Concentrations mg/L, K in (mg/g)/(mg/L)^(1/n), exponent 1/n dimensionless.
 */
import { InputError } from '../core/errors.js';

/** One Freundlich component in internal units. K = 0 marks a non-adsorbable component. */
export interface FreundlichComponent {
  id: string;
  /** Initial liquid concentration, mg/L (≥ 0). */
  c0MgPerL: number;
  /** Freundlich K in (mg/g)/(mg/L)^(1/n) (≥ 0; 0 = non-adsorbable). */
  K: number;
  /** Freundlich exponent 1/n (> 0; ignored when K = 0). */
  oneOverN: number;
}

export interface PreparedMixture {
  readonly ids: readonly string[];
  readonly size: number;
  /** Indices (into ids) of adsorbable components with c0 > 0, in the order of the arrays below. */
  readonly active: Int32Array;
  readonly c0: Float64Array;
  readonly n: Float64Array;
  readonly beta: Float64Array;
  readonly lnK: Float64Array;
  /** a_i = n_i·ln(β_i/K_i), so that ln c°_i(ψ) = n_i·ln ψ + a_i. */
  readonly a: Float64Array;
  /** Σ c0 over the active components, mg/L. */
  readonly cTotal: number;
  readonly lnCTotal: number;
  readonly source: readonly FreundlichComponent[];
}

/** Validate and lay out a list of components. @throws InputError on invalid values. */
export function prepareMixture(components: readonly FreundlichComponent[]): PreparedMixture {
  if (components.length === 0) throw new InputError('expected at least one component', { path: 'components' });
  // plain loops and paths built only on error: this runs once per public-API call
  const dup = duplicateIdIndex(components);
  if (dup >= 0) throw new InputError(`duplicate id "${components[dup]!.id}"; every component needs its own id`, { path: `components[${dup}].id` });
  const active: number[] = [];
  for (let i = 0; i < components.length; i++) {
    const c = components[i]!;
    if (!(c.c0MgPerL >= 0) || !Number.isFinite(c.c0MgPerL)) throw new InputError(`expected a non-negative finite concentration, got ${c.c0MgPerL}`, { path: `components[${i}].c0` });
    if (!(c.K >= 0) || !Number.isFinite(c.K)) throw new InputError(`expected K ≥ 0 (0 = non-adsorbable), got ${c.K}`, { path: `components[${i}].K` });
    if (c.K > 0) {
      if (!(c.oneOverN > 0) || !Number.isFinite(c.oneOverN)) throw new InputError(`expected an exponent one_over_n > 0, got ${c.oneOverN}`, { path: `components[${i}].one_over_n` });
      if (c.c0MgPerL > 0) active.push(i);
    }
  }
  const m = active.length;
  const c0 = new Float64Array(m);
  const n = new Float64Array(m);
  const beta = new Float64Array(m);
  const lnK = new Float64Array(m);
  const a = new Float64Array(m);
  let cTotal = 0;
  for (let j = 0; j < m; j++) {
    const comp = components[active[j]!]!;
    c0[j] = comp.c0MgPerL;
    beta[j] = comp.oneOverN;
    n[j] = 1 / comp.oneOverN;
    lnK[j] = Math.log(comp.K);
    a[j] = n[j]! * (Math.log(comp.oneOverN) - lnK[j]!);
    cTotal += comp.c0MgPerL;
  }
  return new Mixture(components.length, new Int32Array(active), c0, n, beta, lnK, a, cTotal, components, undefined, undefined, 1, -1);
}

/**
 * Every prepared mixture is one of these (prepared, scaled or with a lead component), so that the
 * solvers' hot loops see one object layout. `ids` and `source` of a derived mixture are built
 * only when asked for (hot loops never read them), from what it was derived from: `from` scaled
 * by `factor` except component `fixedIndex` (scaleMixture), or `lead` before `from`
 * (prependComponent); kept as data rather than a closure (nothing more to allocate per mixture).
 * So are `beta` and `lnK` of a derived mixture (only a cold start of the batch solve reads them):
 * a scaled mixture shares those of `from`, a mixture with a lead builds them on first use.
 */
class Mixture implements PreparedMixture {
  readonly lnCTotal: number;
  private idsCache: readonly string[] | undefined;
  private sourceCache: readonly FreundlichComponent[] | undefined;

  constructor(
    readonly size: number,
    readonly active: Int32Array,
    readonly c0: Float64Array,
    readonly n: Float64Array,
    private betaCache: Float64Array | undefined,
    private lnKCache: Float64Array | undefined,
    readonly a: Float64Array,
    readonly cTotal: number,
    source: readonly FreundlichComponent[] | undefined,
    private readonly from: PreparedMixture | undefined,
    private readonly lead: FreundlichComponent | undefined,
    private readonly factor: number,
    private readonly fixedIndex: number,
  ) {
    this.lnCTotal = Math.log(cTotal);
    this.sourceCache = source;
    this.idsCache = undefined;
  }

  get beta(): Float64Array {
    return (this.betaCache ??= this.lead ? leadBefore(this.lead, this.lead.oneOverN, this.from!.beta) : this.from!.beta);
  }

  get lnK(): Float64Array {
    return (this.lnKCache ??= this.lead ? leadBefore(this.lead, Math.log(this.lead.K), this.from!.lnK) : this.from!.lnK);
  }

  get ids(): readonly string[] {
    if (this.idsCache) return this.idsCache;
    const src = this.source;
    const ids = new Array<string>(src.length);
    for (let i = 0; i < src.length; i++) ids[i] = src[i]!.id;
    return (this.idsCache = ids);
  }

  get source(): readonly FreundlichComponent[] {
    return (this.sourceCache ??= this.lead ? [this.lead, ...this.from!.source] : scaledSource(this.from!, this.factor, this.fixedIndex));
  }
}

/**
 * Index of the first component whose id repeats an earlier one, or −1. Pairwise for small
 * mixtures (a Set costs more than the comparisons below a few dozen components).
 */
export function duplicateIdIndex(components: readonly { id: string }[]): number {
  const size = components.length;
  if (size > 32) {
    const seen = new Set<string>();
    for (let i = 0; i < size; i++) {
      const id = components[i]!.id;
      if (seen.has(id)) return i;
      seen.add(id);
    }
    return -1;
  }
  for (let i = 1; i < size; i++) {
    const id = components[i]!.id;
    for (let j = 0; j < i; j++) if (components[j]!.id === id) return i;
  }
  return -1;
}

/**
 * The same mixture with every concentration scaled by `factor` except that of component
 * `fixedIndex` (−1: none): the same arrays and arithmetic as `prepareMixture` on the scaled
 * components, without validating them again (K and exponents are unchanged). Used to move a
 * background to another DOC many times over (daily doses, Monte Carlo draws).
 * Falls back to `prepareMixture` when a scaled concentration leaves the active set.
 */
export function scaleMixture(pm: PreparedMixture, factor: number, fixedIndex = -1): PreparedMixture {
  const m = pm.active.length;
  const c0 = new Float64Array(m);
  let cTotal = 0;
  let ok = true;
  for (let j = 0; j < m; j++) {
    const idx = pm.active[j]!;
    const v = idx === fixedIndex ? pm.c0[j]! : pm.c0[j]! * factor;
    if (!(v > 0) || !Number.isFinite(v)) { ok = false; break; }
    c0[j] = v;
    cTotal += v;
  }
  if (ok && !(factor >= 0 && Number.isFinite(factor))) ok = false;
  if (!ok) return prepareMixture(scaledSource(pm, factor, fixedIndex)); // leaves the active set, or its error message
  return new Mixture(pm.size, pm.active, c0, pm.n, undefined, undefined, pm.a, cTotal, undefined, pm, undefined, factor, fixedIndex);
}

function scaledSource(pm: PreparedMixture, factor: number, fixedIndex: number): FreundlichComponent[] {
  return pm.source.map((c, i) => (i === fixedIndex ? c : { ...c, c0MgPerL: c.c0MgPerL * factor }));
}

/**
 * The mixture of `lead` followed by the components of an already prepared mixture `rest`: the
 * same arrays and arithmetic as `prepareMixture([lead, ...rest.source])` (the same checks and
 * error messages), validating only the lead and its id against the rest (already validated).
 * Used where many targets share one set of competitors (each target beside the same background).
 * @throws InputError on an invalid lead or a lead id that repeats one of the rest
 */
export function prependComponent(lead: FreundlichComponent, rest: PreparedMixture): PreparedMixture {
  checkLead(lead, rest);
  return prependChecked(lead, rest);
}

/**
 * `prependComponent` for a lead that `checkLead` has already accepted beside the same `rest`
 * (an equilibrium model checks every target when it is built and prepends it on first use).
 */
export function prependChecked(lead: FreundlichComponent, rest: PreparedMixture): PreparedMixture {
  const r = rest.c0.length;
  const first = lead.K > 0 && lead.c0MgPerL > 0 ? 1 : 0;
  const m = r + first;
  // the index array is shared by every lead of `rest` (nothing writes into a prepared mixture);
  // the number arrays stay apart: a few small typed arrays live on the JS heap, where one buffer
  // for all of them would be allocated outside it (dearer to allocate and to collect)
  // (beta and lnK, which only a cold start reads, are built when first asked for: leadBefore)
  const c0 = new Float64Array(m), n = new Float64Array(m), a = new Float64Array(m);
  const active = activeAfterLead(rest, first);
  if (first) {
    c0[0] = lead.c0MgPerL;
    n[0] = 1 / lead.oneOverN;
    a[0] = n[0] * (Math.log(lead.oneOverN) - Math.log(lead.K));
  }
  c0.set(rest.c0, first); n.set(rest.n, first); a.set(rest.a, first);
  let cTotal = 0;
  for (let j = 0; j < m; j++) cTotal += c0[j]!; // the order of prepareMixture's sum
  return new Mixture(rest.size + 1, active, c0, n, undefined, undefined, a, cTotal, undefined, rest, lead, 1, -1);
}

/** `value` (the lead's β or ln K) before the rest's array when the lead is active, else a copy of the rest's (prependComponent). */
function leadBefore(lead: FreundlichComponent, value: number, rest: Float64Array): Float64Array {
  const first = lead.K > 0 && lead.c0MgPerL > 0 ? 1 : 0;
  const out = new Float64Array(rest.length + first);
  if (first) out[0] = value;
  out.set(rest, first);
  return out;
}

/** The active indices of `rest` behind a lead (active or not), kept per mixture. */
const leadActive = new WeakMap<PreparedMixture, [Int32Array | undefined, Int32Array | undefined]>();
function activeAfterLead(rest: PreparedMixture, first: number): Int32Array {
  let pair = leadActive.get(rest);
  if (!pair) leadActive.set(rest, (pair = [undefined, undefined]));
  let active = pair[first];
  if (!active) {
    const m = rest.active.length + first;
    active = new Int32Array(m);
    for (let j = 0; j < m; j++) active[j] = j < first ? 0 : rest.active[j - first]! + 1;
    pair[first] = active;
  }
  return active;
}

/** The checks of `prependComponent` alone. @throws InputError as prependComponent */
export function checkLead(lead: FreundlichComponent, rest: PreparedMixture): void {
  checkLeadAmong(lead, rest.ids);
}

/**
 * The checks of `checkLead` against the ids of the rest (`rest.ids`), for a caller checking many
 * leads beside one rest (the ids read once). @throws InputError as prependComponent
 */
export function checkLeadAmong(lead: FreundlichComponent, ids: readonly string[]): void {
  if (!(lead.c0MgPerL >= 0) || !Number.isFinite(lead.c0MgPerL)) throw new InputError(`expected a non-negative finite concentration, got ${lead.c0MgPerL}`, { path: 'components[0].c0' });
  if (!(lead.K >= 0) || !Number.isFinite(lead.K)) throw new InputError(`expected K ≥ 0 (0 = non-adsorbable), got ${lead.K}`, { path: 'components[0].K' });
  if (lead.K > 0 && (!(lead.oneOverN > 0) || !Number.isFinite(lead.oneOverN))) throw new InputError(`expected an exponent one_over_n > 0, got ${lead.oneOverN}`, { path: 'components[0].one_over_n' });
  for (let k = 0; k < ids.length; k++) if (ids[k] === lead.id) throw new InputError(`duplicate id "${lead.id}"; every component needs its own id`, { path: `components[${k + 1}].id` });
}

