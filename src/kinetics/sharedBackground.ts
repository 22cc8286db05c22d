/**
 * Trace targets that share one background under PAC contact conditions: one kinetic solve per
 * dose for all of them (the trace argument of Knappe et al. 1998, Environ. Sci. Technol. 32:1694,
 * carried to kinetics).
 *
 * A trace target does not disturb the background (kineticMixture: its loading is left out of ψ
 * and Q at the particle surface), and in the particle system each trace block depends only on
 * the background's surface state (hsdmParticleSystem: the Jacobian is block lower-triangular).
 * So the targets whose competitors are the same components (same c0, K, 1/n, Ds, kf) can be put
 * in one mixture, [competitors…, targets…], every target a trace block: one run per dose gives
 * every target's c/c0, each equal to its own run with the same background to the integrator's
 * accuracy (the steps are chosen for all blocks at once; tests/kinetics/sharedBackground.test.ts).
 * In the stirred reactor the background's outlet is solved once (Newton–Broyden on the coupled
 * components) and every target then follows from one linear run,
 * c_out,T/c0_T = 1/(1 + D·Φ_T) (stirredReactor).
 *
 * Every dose solved is remembered (a dose asked again, by any target of the group, costs nothing),
 * and each stirred solve starts from the outlet and balance Jacobian at the nearest dose already
 * solved, or, before the first, at the nearest of `starts` (e.g. the same water at another DOC,
 * doses scaled by DOC); the result does not depend on the start beyond the balance tolerance.
 * With a ContactSolveStore (given to contactFactory: the run keeps one per carbon, shared by the
 * factories of its sensitivity cases) the outlets already solved by any group of the models using
 * it with the same background, conditions and solver options are starts
 * too (the background's balance does not depend on the targets), and every target's c/c0 at the
 * doses solved is kept there for a later group holding the same target: points of its curve for
 * the dose root (ContactRemoval.doseForRemoval) and its c/c0 at exactly those doses
 * (ContactRemoval.remaining), equal to that group's own solve at the dose to
 * the integrator's accuracy (the steps are pinned for the other group's blocks, and its balance
 * started elsewhere: within removalTolerance); and the models of one water at other DOCs are
 * kept there too, so that a model at a new DOC starts from the ones at the nearest DOCs already
 * solved (ContactRemoval).
 *
 * Units: dose g/L, times s, concentrations mg/L.
 * @throws ComputationError when a kinetic solve fails.
 */
import type { PreparedKinetics } from './kineticMixture.js';
import { prepareKinetics, type CarbonParticle, type KineticComponent } from './kineticMixture.js';
import { pacBatch, type KineticSolverOptions } from './pacBatch.js';
import { stirredReactorFrom } from './stirredReactor.js';
import type { ContactConditions } from './contactRemoval.js';

/** Trace targets with one background, and the solves done so far. */
export interface SharedBackground {
  /** The combined mixture: the competitors (as in each target's own mixture), then the targets, all trace. */
  readonly pk: PreparedKinetics;
  /** Number of competitors (the targets follow them in pk.components). */
  readonly competitorCount: number;
  /** c/c0 of every component of pk at a dose (1 where c0 = 0), remembered per dose. */
  remainingAt(doseGPerL: number): Float64Array;
  /** Doses solved so far and their results (in the order solved). */
  readonly solved: ReadonlyMap<number, Float64Array>;
  /** Stirred-reactor outlets solved so far (warm starts), c_out/c0 of the coupled components. */
  readonly outlets: ReadonlyArray<StirredOutlet>;
  /** (dose g/L, c/c0) of target k (0-based among the targets) solved by any group of the same store, when there is one. */
  storedPoints(k: number): ReadonlyArray<readonly [number, number]>;
  /** c/c0 of target k at exactly this dose solved by any group of the same store, if one has. */
  storedAt(k: number, doseGPerL: number): number | undefined;
}

/** A solved stirred-reactor outlet: the dose, c_out/c0 of the coupled components and the balance Jacobian there. */
export interface StirredOutlet { dose: number; coupled: Float64Array; jacobian?: Float64Array }

/** A compound's shared background in a model and its component index there. */
export interface SharedSlot { group: SharedBackground; at: number }

/** A compound solved on its own in a model (not a trace target): its doses solved (c/c0 of its own mixture, the compound first) and stirred outlets. */
export interface OwnSlot { readonly solved: ReadonlyMap<number, Float64Array>; readonly outlets: ReadonlyArray<StirredOutlet> }

/** The solves of one contact model by compound (a live view: filled as the model solves): shared backgrounds, and the compounds solved on their own. */
export interface ModelSolves { shared: ReadonlyArray<SharedSlot | undefined>; own: ReadonlyArray<OwnSlot | undefined> }

/**
 * Solves kept across the contact models that are given the same store (contactFactory; the run
 * keeps one per carbon; never module-wide, so that nothing depends on what else ran in the process): the stirred outlets of
 * each background, and each target's c/c0 at the doses solved, keyed by the values that decide
 * them (the background by its adsorbing components alone, c0 to 12 significant digits: the same
 * water reached by another sum is the same key). The outlets are starts only (a result does not
 * depend on them beyond the balance tolerance), except that a compound solved on its own takes
 * an outlet of its mixture at exactly the dose as its result (ContactRemoval); a target's c/c0
 * are points of its curve for a dose root and its result at exactly such a dose, each within the
 * model's removalTolerance of a fresh solve at that dose, so a dose found on them meets the goal
 * within that accuracy too.
 */
export class ContactSolveStore {
  private readonly outlets = new Map<string, StirredOutlet[]>();
  private readonly points = new Map<string, { list: Array<readonly [number, number]>; byDose: Map<number, number> }>();
  private readonly models = new Map<string, Array<{ doc: number; solves: ModelSolves }>>();
  /** Registers the solves of a model of a family (the same water scaled by DOC: ContactRemoval's family key) at a DOC. */
  registerModel(family: string, docMgPerL: number, solves: ModelSolves): void {
    let l = this.models.get(family);
    if (!l) { l = []; this.models.set(family, l); }
    l.push({ doc: docMgPerL, solves });
  }
  /** The model of the family at the DOC nearest `docMgPerL` (in ln DOC) that has solved a dose, and the factor this DOC / its DOC. */
  nearestModel(family: string, docMgPerL: number): ModelSolves & { factor: number } | undefined {
    let best: { doc: number; solves: ModelSolves } | undefined, gap = Infinity;
    for (const m of this.models.get(family) ?? []) {
      const g = Math.abs(Math.log(m.doc / docMgPerL));
      if (g < gap && (m.solves.shared.some((sh) => sh && sh.group.solved.size > 0) || m.solves.own.some((o) => o && o.solved.size > 0))) { gap = g; best = m; }
    }
    return best ? { ...best.solves, factor: docMgPerL / best.doc } : undefined;
  }
  /** Every model of the family registered so far, with its DOC. */
  modelsOf(family: string): ReadonlyArray<{ doc: number; solves: ModelSolves }> {
    return this.models.get(family) ?? [];
  }
  /** The outlets of a background key (a live list: append to it). */
  outletsOf(key: string): StirredOutlet[] {
    let l = this.outlets.get(key);
    if (!l) { l = []; this.outlets.set(key, l); }
    return l;
  }
  /** The (dose g/L, c/c0) points of a target key (a live list), and c/c0 by dose. */
  pointsOf(key: string): { list: Array<readonly [number, number]>; byDose: Map<number, number> } {
    let l = this.points.get(key);
    if (!l) { l = { list: [], byDose: new Map() }; this.points.set(key, l); }
    return l;
  }
}

/**
 * Key of a target's own prepared mixture [target, ...competitors] when the target is a trace
 * target there, else undefined: the competitors' values and which of them are coupled. Targets
 * with equal keys share one background.
 */
export function sharedBackgroundKey(own: PreparedKinetics): string | undefined {
  if (!own.trace.includes(0)) return undefined;
  const comps = own.components.slice(1).map((c, k) => [c.id, c.c0MgPerL, c.K, c.oneOverN, c.dsM2PerS ?? null, own.kfMPerS[k + 1]]);
  return JSON.stringify([comps, own.coupled, own.trace.filter((i) => i > 0)]);
}

/**
 * The contact conditions as far as they decide a solve, for the store's keys: a stirred tank's
 * outlet depends on the carbon age θ = max(θ, τ) alone (the age distribution of the carbon and the
 * balance c0 − c_out = D·∫q̄E dt; the residence τ enters only the carbon held, D·θ/τ:
 * stirredReactor), so tanks with the same θ share their solves (e.g. a sensitivity case that
 * changes τ with recirculation); plug flow is its contact time.
 */
export function solveConditions(cond: ContactConditions): { kind: ContactConditions['kind']; timeS: number } {
  return cond.kind === 'stirred' ? { kind: 'stirred', timeS: Math.max(cond.carbonAgeS, cond.contactTimeS) } : { kind: 'plug-flow', timeS: cond.contactTimeS };
}

/**
 * The store's key of a background: sharedBackgroundKey on the adsorbable competitors alone (those
 * coupled or trace; a component that does not adsorb has no block in the particle and leaves
 * every result unchanged, e.g. the non-adsorbable DOC that a sensitivity case scales), the split
 * by id, and each c0 to 12 significant digits (the same water reached by another sum, such as
 * DOC × 0.8 and the adsorbable part × 0.8 at the design DOC).
 */
function storeBackgroundKey(own: PreparedKinetics): string {
  return JSON.stringify(adsorbingComponentsKey(own, 1));
}

/**
 * The adsorbing components (coupled or trace) of a prepared mixture from index `from` on, in
 * order, each with its values (c0 to 12 significant digits) and film coefficient, and the split
 * into coupled and trace by id: what decides a solve, for the store's keys (storeBackgroundKey;
 * a compound's own mixture in ContactRemoval).
 */
export function adsorbingComponentsKey(pk: PreparedKinetics, from: number): unknown[] {
  const adsorbs = new Set([...pk.coupled, ...pk.trace]);
  const comps = pk.components.flatMap((c, i) => (i >= from && adsorbs.has(i) ? [[c.id, Number(c.c0MgPerL.toPrecision(12)), c.K, c.oneOverN, c.dsM2PerS ?? null, pk.kfMPerS[i]]] : []));
  const ids = (l: readonly number[]) => l.filter((i) => i >= from).map((i) => pk.components[i]!.id);
  return [comps, ids(pk.coupled), ids(pk.trace)];
}

/**
 * The shared background of targets whose own mixtures (`own`, each [target, ...competitors], all
 * with the same sharedBackgroundKey) are given.
 */
export function sharedBackground(own: readonly PreparedKinetics[], particle: CarbonParticle, cond: ContactConditions, options: KineticSolverOptions = {}, starts: readonly StirredOutlet[] = [], store?: ContactSolveStore): SharedBackground {
  const first = own[0]!;
  const competitors = first.components.slice(1) as KineticComponent[];
  const nC = competitors.length;
  const targets = own.map((p) => p.components[0]!);
  const base = prepareKinetics([...competitors, ...targets], particle);
  // the split of each target's own mixture: its competitors as there, every target a trace block
  const pk: PreparedKinetics = {
    ...base,
    coupled: first.coupled.map((i) => i - 1),
    trace: [...first.trace.filter((i) => i > 0).map((i) => i - 1), ...targets.map((_t, k) => nC + k)],
  };
  const solved = new Map<number, Float64Array>();
  const outlets: StirredOutlet[] = [];
  // the store's keys: the background (competitors and split) with the particle, the conditions and
  // the solver options; each target with its own values and film coefficient beside it
  const bgKey = store ? JSON.stringify([storeBackgroundKey(first), particle, solveConditions(cond), options]) : '';
  const stored = store?.outletsOf(bgKey);
  const emptyPoints = { list: [] as Array<readonly [number, number]>, byDose: new Map<number, number>() };
  const points = own.map((p) => (store ? store.pointsOf(JSON.stringify([bgKey, p.components[0], p.kfMPerS[0]])) : emptyPoints));
  const fraction = (c: Float64Array) => Float64Array.from(pk.components, (comp, i) => (comp.c0MgPerL > 0 ? Math.min(1, Math.max(0, c[i]! / comp.c0MgPerL)) : 1));
  const remainingAt = (d: number): Float64Array => {
    const hit = solved.get(d);
    if (hit) return hit;
    let f: Float64Array;
    if (cond.kind === 'plug-flow') f = fraction(pacBatch(pk, d, [cond.contactTimeS], options).cMgPerL[0]!);
    else {
      const known = stored ?? outlets; // the store holds this group's outlets too
      const [near, second] = nearestOutlets(known.length ? known : starts, d);
      const res = stirredReactorFrom(pk, d, cond.contactTimeS, cond.carbonAgeS, options, near?.coupled, near?.jacobian, near?.dose, second && { dose: second.dose, remaining: second.coupled });
      const c = res.cMgPerL;
      const outlet = { dose: d, coupled: Float64Array.from(pk.coupled, (i) => c[i]! / pk.components[i]!.c0MgPerL), ...(res.balanceJacobian ? { jacobian: res.balanceJacobian } : {}) };
      outlets.push(outlet);
      stored?.push(outlet);
      f = fraction(c);
    }
    solved.set(d, f);
    if (store) points.forEach((p, k) => { p.list.push([d, f[nC + k]!]); p.byDose.set(d, f[nC + k]!); });
    return f;
  };
  return { pk, competitorCount: nC, remainingAt, solved, outlets, storedPoints: (k) => (points[k] ?? emptyPoints).list, storedAt: (k, d) => points[k]?.byDose.get(d) };
}

/** The two outlets nearest a dose in ln D (the start of a stirred solve and a second point for its predictor). */
export function nearestOutlets(outlets: readonly StirredOutlet[], doseGPerL: number): [StirredOutlet | undefined, StirredOutlet | undefined] {
  let near: StirredOutlet | undefined, second: StirredOutlet | undefined;
  let best = Infinity, next = Infinity;
  for (const o of outlets) {
    const dist = Math.abs(Math.log(o.dose / doseGPerL));
    if (dist < best) { second = near; next = best; near = o; best = dist; } else if (dist < next) { second = o; next = dist; }
  }
  // a second point too close to the first gives a secant of rounding noise (and of the small
  // differences between solves started apart): only 1 % or more away in dose (ours)
  if (near && second && Math.abs(Math.log(second.dose / near.dose)) < 0.01) {
    second = undefined;
    let gap = Infinity;
    for (const o of outlets) {
      const dist = Math.abs(Math.log(o.dose / doseGPerL));
      if (Math.abs(Math.log(o.dose / near.dose)) >= 0.01 && dist < gap) { gap = dist; second = o; }
    }
  }
  return [near, second];
}
