/**
 * Removal at a carbon dose under PAC contact conditions, and the dose for a goal under them.
 *
 * Contact conditions: `plug-flow` (a jar test or a plug-flow contact tank: every particle stays
 * the contact time T; pacBatch at t = T) or `stirred` (a stirred contact tank with residence τ and
 * mean carbon age θ ≥ τ; stirredReactor). The remaining fraction c/c0 of every component falls
 * as the dose rises, so the dose for a goal is the root of
 *   e(D) = ln(1 − R) − ln(c(D)/c0)   (removalExcess)
 * found by secant steps on the log-odds of removal from 1.5 × the equilibrium dose (a lower
 * bound: contact gives less removal; traceDoseRoot.ts), and where they give up by the design
 * layer's one dose search (src/design/doseSearch.ts: bracketing on ln D, then Brent 1973; see
 * remainingAtDoses and doseUnderContact).
 *
 * `ContactRemoval` is the RemovalModel of the design layer (src/design/removalModel.ts) for these
 * conditions: every target with its competitors (fictive DOC components with their Ds and DL or
 * kf) in one kinetic run; `atDoc` scales the competitors with DOC.
 *
 * Units: dose g/L, times s, concentrations mg/L.
 * @throws InputError for missing kinetic inputs (component and field named), goals that no dose
 *         up to 5 g/L reaches; ComputationError when a kinetic solve fails.
 */
import { ComputationError, InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { prepareMixture } from '../equilibrium/preparedMixture.js';
import { doseForRemoval } from '../design/doseForRemoval.js';
import { MAX_DOSE_G_PER_L, searchDose } from '../design/doseSearch.js';
import { removalExcess } from '../design/removalExcess.js';
import type { BackgroundAtDose, CompetitionSet, DoseAtRemoval, RemainingAtDose, RemovalModel, WarmStart } from '../design/removalModel.js';
import { prepareKinetics, type CarbonParticle, type KineticComponent, type PreparedKinetics } from './kineticMixture.js';
import { checkTimes, DEFAULT_KINETIC_RTOL, pacBatch, type KineticSolverOptions } from './pacBatch.js';
import { checkContactConditions, STIRRED_DEFAULT_RTOL, stirredReactor, stirredReactorFrom } from './stirredReactor.js';
import { adsorbingComponentsKey, ContactSolveStore, nearestOutlets, sharedBackground, solveConditions, sharedBackgroundKey, type ModelSolves, type SharedBackground, type SharedSlot, type StirredOutlet } from './sharedBackground.js';
import { logOdds, traceDoseRoot } from './traceDoseRoot.js';

export type ContactConditions =
  | { kind: 'plug-flow'; contactTimeS: number }
  | { kind: 'stirred'; contactTimeS: number; carbonAgeS: number };

/** Check contact conditions. @throws InputError naming the option */
export function checkConditions(cond: ContactConditions): void {
  if (cond.kind === 'plug-flow') checkTimes([cond.contactTimeS], '--contact-time');
  else checkContactConditions(cond.contactTimeS, cond.carbonAgeS);
}

/** c/c0 of every component of the mixture at a dose (1 for components with c0 = 0). */
export function remainingUnderContact(pk: PreparedKinetics, doseGPerL: number, cond: ContactConditions, options: KineticSolverOptions = {}): Float64Array {
  const c = cond.kind === 'plug-flow'
    ? pacBatch(pk, doseGPerL, [cond.contactTimeS], options).cMgPerL[0]!
    : stirredReactor(pk, doseGPerL, cond.contactTimeS, cond.carbonAgeS, options).cMgPerL;
  return remainingFraction(pk, c);
}

function remainingFraction(pk: PreparedKinetics, c: Float64Array): Float64Array {
  return Float64Array.from(pk.components, (comp, i) => (comp.c0MgPerL > 0 ? Math.min(1, Math.max(0, c[i]! / comp.c0MgPerL)) : 1));
}

export interface ContactDoseResult {
  doseGPerL: number;
  removalFraction: number;
  /** The equilibrium (batch IAST) dose for the same goal, g/L. */
  equilibriumDoseGPerL: number;
  evaluations: number;
}

/**
 * Dose that removes `removalFraction` of component `targetIndex` under the contact conditions.
 * @throws InputError when no dose up to 5 g/L reaches the goal
 */
export function doseUnderContact(pk: PreparedKinetics, targetIndex: number, removalFraction: number, cond: ContactConditions, options: KineticSolverOptions = {}): ContactDoseResult {
  checkConditions(cond);
  const comp = pk.components[targetIndex];
  if (!comp) throw new InputError(`target index ${targetIndex} is not in the mixture`);
  const eq = doseForRemoval(prepareMixture(pk.components), targetIndex, removalFraction);
  const at = remainingAtDoses(pk, cond, options);
  const d1 = eq.doseGPerL * 1.5;
  // the secant on the log-odds of removal (traceDoseRoot) first, meeting the goal within half
  // the model's accuracy in c/c0 (rtol/200); the design layer's dose search where it gives up
  const root = traceDoseRoot((d) => at(d)[targetIndex]!, [], removalFraction, (options.rtol ?? DEFAULT_KINETIC_RTOL) * 5e-3, () => d1);
  if (root) return { doseGPerL: root.doseGPerL, removalFraction: 1 - root.remainingFraction, equilibriumDoseGPerL: eq.doseGPerL, evaluations: at.evaluations() };
  // warm start (ours): one evaluation at 1.5 × the equilibrium dose, then the hint from ln(c/c0)
  // proportional to the dose (first-order uptake by the carbon's outer surface), clamped to
  // [1, 20] × that dose; the search then brackets with small steps
  const r1 = at(d1)[targetIndex]!;
  const hint = r1 > 0 && r1 < 1 ? d1 * Math.min(20, Math.max(1, Math.log(1 - removalFraction) / Math.log(r1))) : d1;
  const r = searchDose((d) => removalExcess(at(d)[targetIndex]!, removalFraction), { hintGPerL: hint, firstStep: 0.1, what: `contact dose search for "${comp.id}"` });
  if (r.status === 'unreachable') {
    throw new InputError(`the goal of ${pct(removalFraction)} removal of "${comp.id}" is not reached under these contact conditions by any dose up to ${MAX_DOSE_G_PER_L * 1000} mg/L (it reaches ${pct(1 - at(MAX_DOSE_G_PER_L)[targetIndex]!)} there)`);
  }
  if (r.status !== 'met') throw new ComputationError(`contact dose search for "${comp.id}": the goal is met below the smallest dose searched, although the equilibrium dose is ${eq.doseGPerL * 1000} mg/L`);
  return { doseGPerL: r.doseGPerL, removalFraction: 1 - at(r.doseGPerL)[targetIndex]!, equilibriumDoseGPerL: eq.doseGPerL, evaluations: at.evaluations() };
}

/**
 * remainingUnderContact over the doses of one search, or of one compound solved on its own in a
 * ContactRemoval: remembers every dose's result (a dose asked again costs nothing) and starts each
 * stirred reactor from the outlet and the balance Jacobian at the nearest dose already solved,
 * before the first at the nearest of `starts` (warm start; the result does not depend on the
 * start beyond the balance tolerance). With `stored` (a ContactSolveStore's live list for this
 * mixture, conditions and options) its outlets are starts too, and this one's are added to it;
 * when the mixture has no trace component, an outlet solved there at exactly the dose is the
 * result (every adsorbing component is in it; the others stay at c0), as a fresh solve within the
 * balance tolerance.
 */
function remainingAtDoses(pk: PreparedKinetics, cond: ContactConditions, options: KineticSolverOptions, starts: readonly StirredOutlet[] = [], stored?: StirredOutlet[]) {
  const done = new Map<number, Float64Array>();
  const outlets: StirredOutlet[] = [];
  const at = (d: number): Float64Array => {
    const hit = done.get(d);
    if (hit) return hit;
    let f: Float64Array;
    const same = stored && !pk.trace.length ? stored.find((o) => o.dose === d) : undefined;
    if (same) f = Float64Array.from(pk.components, (_c, i) => { const k = pk.coupled.indexOf(i); return k >= 0 ? same.coupled[k]! : 1; });
    else if (cond.kind === 'plug-flow') f = remainingUnderContact(pk, d, cond, options);
    else {
      const known = stored ?? outlets; // the store holds this one's outlets too
      const [near, second] = nearestOutlets(known.length ? known : starts, d);
      const res = stirredReactorFrom(pk, d, cond.contactTimeS, cond.carbonAgeS, options, near?.coupled, near?.jacobian, near?.dose, second && { dose: second.dose, remaining: second.coupled });
      const c = res.cMgPerL;
      const outlet = { dose: d, coupled: Float64Array.from(pk.coupled, (i) => c[i]! / pk.components[i]!.c0MgPerL), ...(res.balanceJacobian ? { jacobian: res.balanceJacobian } : {}) };
      outlets.push(outlet);
      stored?.push(outlet);
      f = remainingFraction(pk, c);
    }
    done.set(d, f);
    return f;
  };
  return Object.assign(at, { evaluations: () => done.size, solved: done as ReadonlyMap<number, Float64Array>, outlets: outlets as readonly StirredOutlet[] });
}

/** A compound's solves on its own (not trace, or alone with its competitors): remainingAtDoses on its own mixture. */
type OwnSolves = ReturnType<typeof remainingAtDoses>;

function pct(f: number): string {
  return `${(f * 100).toPrecision(4)} %`;
}

/**
 * RemovalModel of the design layer under PAC contact conditions (see the file comment).
 * Trace targets with the same competitors share one background (sharedBackground.ts): one solve
 * per dose gives all of them, every dose solved is remembered, and `doseForRemoval` finds each
 * target's dose on those shared solves (traceDoseRoot.ts), so a carbon's whole design solves the
 * background at a few doses instead of once per target and dose. Other targets (not trace in
 * their water, or with their own competitors) are solved on their own mixture, each dose once,
 * every stirred solve started from the nearest outlet already solved (remainingAtDoses: of this
 * model, of the store's models with the same mixture, or before those of the model at the nearby
 * DOC, doses scaled by DOC); their doses are left to the design layer's search.
 */
export class ContactRemoval implements RemovalModel {
  readonly kind: string;
  readonly compoundIds: readonly string[];
  readonly backgroundC0MgPerL?: Float64Array;
  /**
   * Accuracy of c/c0 against the same particle grid integrated to convergence: plug flow a
   * hundredth of the integrator's rtol (1e-6 by default), a stirred tank its rtol (1e-6 by
   * default; measured within a fifth of it on the test waters, tests/kinetics/
   * contactRemovalTolerance.test.ts and stirredShortAge.test.ts). Not everywhere: in a water with
   * one DOC fraction removed to 1.3 % (stirred, θ = 3 d, 50 mg/L) the c/c0 of a partly removed
   * fraction scattered by up to 3e-5 between rtol 1e-5 and 1e-7, settling only from 3e-8: the
   * reactor replays steps pinned at the feed (stirredReactor), far from that outlet. Pinning
   * the steps again at the outlet closed the gap (within 1e-7 from rtol 1e-6) but cost about 55 %
   * more CPU in the demo contact run; an open problem. The particle grid adds its own error:
   * doubling the grid changes c/c0 by < 1e-4 (stirredGridPoints).
   */
  readonly removalTolerance: number;
  private readonly prepared: PreparedKinetics[];
  private readonly bgPrepared?: PreparedKinetics;
  /** The shared background of each compound (undefined: solved on its own) and its component index there. */
  private readonly shared: Array<SharedSlot | undefined>;
  /** The background components' indices in a shared background with the same components, if any. */
  private readonly bgShared?: { group: SharedBackground; at: number[] };
  /** The solves of each compound solved on its own (made at its first dose; undefined for the shared ones). */
  private readonly own: Array<OwnSolves | undefined>;
  /** The key of this water's family in the store (the same water at other DOCs, under conditions that solve alike: solveConditions). */
  private readonly family: string;

  constructor(
    readonly sets: readonly CompetitionSet[],
    readonly docMgPerL: number,
    readonly particle: CarbonParticle,
    readonly conditions: ContactConditions,
    readonly background?: readonly FreundlichComponent[],
    readonly options: KineticSolverOptions = {},
    /** Share trace targets' backgrounds (default true; false solves every target on its own, for tests). */
    readonly shareBackground = true,
    /** The same water at another DOC (atDoc), whose solves give starts: doses scaled by `factor` = this DOC / its DOC. */
    private nearDoc?: ModelSolves & { factor: number },
    /**
     * Solves kept across the models of one factory (contactFactory), or of the factories of one
     * carbon under several contact conditions (keyed by the conditions as they decide a solve:
     * solveConditions): starts for groups with the same background or target, and, in place of
     * `nearDoc`, the model of the same water at the nearest DOC already solved (the family key:
     * the competitors' c0 per mg DOC).
     */
    private readonly store?: ContactSolveStore,
  ) {
    checkConditions(conditions);
    this.kind = conditions.kind === 'plug-flow'
      ? `contact time ${conditions.contactTimeS} s, plug flow (HSDM with IAST at the surface)`
      : `stirred contact tank, residence ${conditions.contactTimeS} s, carbon age ${conditions.carbonAgeS} s (HSDM with IAST at the surface)`;
    this.compoundIds = sets.map((s) => s.target.id);
    this.removalTolerance = Math.max(1e-9, conditions.kind === 'plug-flow' ? (options.rtol ?? DEFAULT_KINETIC_RTOL) * 1e-2 : options.rtol ?? STIRRED_DEFAULT_RTOL);
    this.prepared = sets.map((s) => prepareKinetics([s.target as KineticComponent, ...(s.competitors as KineticComponent[])], particle));
    const byKey = new Map<string, number[]>();
    this.prepared.forEach((pk, i) => {
      const key = shareBackground ? sharedBackgroundKey(pk) : undefined;
      if (key !== undefined) byKey.set(key, [...(byKey.get(key) ?? []), i]);
    });
    this.shared = this.prepared.map(() => undefined);
    this.own = this.prepared.map(() => undefined);
    const perDoc = (cs: readonly FreundlichComponent[]) => cs.map((c) => ({ ...c, c0MgPerL: Number((c.c0MgPerL / docMgPerL).toPrecision(12)) }));
    // the fictive background for the surrogates is left out: it is solved with a group or on its own, never a start
    const family = this.family = store ? JSON.stringify([sets.map((s) => [s.target, perDoc(s.competitors)]), particle, solveConditions(conditions), options, shareBackground]) : '';
    if (store) nearDoc = store.nearestModel(family, docMgPerL) ?? nearDoc;
    this.nearDoc = nearDoc;
    for (const members of byKey.values()) {
      // starts from the same group at the nearby DOC: its outlets at doses scaled by DOC (the dose per mg DOC is roughly constant)
      const nearGroup = nearDoc?.shared[members[0]!]?.group;
      const starts: StirredOutlet[] = nearGroup ? nearGroup.outlets.map((o) => ({ ...o, dose: o.dose * nearDoc!.factor })) : [];
      const group = sharedBackground(members.map((i) => this.prepared[i]!), particle, conditions, options, starts, store);
      members.forEach((i, k) => { this.shared[i] = { group, at: group.competitorCount + k }; });
    }
    if (background && background.length) {
      this.bgPrepared = prepareKinetics(background as KineticComponent[], particle);
      this.backgroundC0MgPerL = Float64Array.from(background, (c) => c.c0MgPerL);
      this.bgShared = backgroundInGroup(this.bgPrepared, this.shared);
    }
    store?.registerModel(family, docMgPerL, { shared: this.shared, own: this.own });
  }

  /** The solves of compound `index` on its own mixture (see the class comment). */
  private ownSolves(index: number): OwnSolves {
    let o = this.own[index];
    if (!o) {
      const pk = this.prepared[index]!;
      const near = this.nearDoc?.own[index];
      const starts = near ? near.outlets.map((x) => ({ ...x, dose: x.dose * this.nearDoc!.factor })) : [];
      o = remainingAtDoses(pk, this.conditions, this.options, starts, this.store?.outletsOf(ownKey(pk, this.conditions, this.options)));
      this.own[index] = o;
    }
    return o;
  }

  remaining(index: number, doseGPerL: number, warm?: WarmStart): RemainingAtDose {
    const pk = this.prepared[index];
    if (!pk) throw new InputError(`compound index ${index} is not in the model (${this.prepared.length} compounds)`);
    if (doseGPerL === 0) return { remainingFraction: 1, warm };
    const sh = this.shared[index];
    if (sh) {
      // a dose this group has not solved but another of the store has, for the same background and target (ContactSolveStore)
      const kept = sh.group.solved.has(doseGPerL) ? undefined : sh.group.storedAt(sh.at - sh.group.competitorCount, doseGPerL);
      return { remainingFraction: kept ?? sh.group.remainingAt(doseGPerL)[sh.at]!, warm };
    }
    return { remainingFraction: this.ownSolves(index)(doseGPerL)[0]!, warm };
  }

  /**
   * The dose for a goal of a target that shares its background, found on the shared solves
   * (traceDoseRoot) and the target's points kept in the store (solves of other groups with the
   * same background and target: the same c/c0 to the integrator's accuracy), meeting the goal by
   * at most half of `removalTolerance` more; undefined for the other targets, or
   * when the goal is not met within the searched doses (the design layer's search then gives the
   * status).
   */
  doseForRemoval(index: number, removalFraction: number, warm?: WarmStart, withSlope?: boolean): DoseAtRemoval | undefined {
    const sh = this.shared[index];
    if (!sh || !(removalFraction > 0 && removalFraction < 1)) return undefined;
    const { group, at } = sh;
    // this target's c/c0 solved by any group of the store with the same background and target
    // (the same values to the integrator's accuracy, ContactSolveStore), this group's own where both have a dose
    const byDose = new Map<number, number>(group.storedPoints(at - group.competitorCount));
    for (const [d, f] of group.solved) byDose.set(d, f[at]!);
    const known = [...byDose];
    const root = traceDoseRoot((d) => group.remainingAt(d)[at]!, known, removalFraction, this.removalTolerance * 0.5, () => this.startDose(index, removalFraction), () => this.predictedDose(index, 1 - removalFraction));
    if (!root) return undefined;
    return { doseGPerL: root.doseGPerL, remainingFraction: root.remainingFraction, ...(withSlope && root.slope !== undefined ? { slope: root.slope } : {}), warm };
  }

  /**
   * The first dose tried when nothing is solved yet (by this group, or by a group of the store
   * with the same background and target): from the models of the same water at other DOCs in
   * the store that have bracketed the goal, each one's dose for it (linear in ln D of the log-odds
   * between the bracketing solves) taken linear in ln DOC through the two nearest DOCs (one
   * scaled by DOC when there is one), with the slope of the nearest as the first secant's;
   * else the nearby model's dose for the goal (`nearDoc`: interpolated as above where its solves
   * bracket the goal, else its solve closest to the goal), scaled by DOC;
   * else 1.5 × the equilibrium dose (contact removes less), or 20 mg/L.
   */
  private startDose(index: number, removalFraction: number): number | { doseGPerL: number; slope: number } {
    const goal = 1 - removalFraction;
    const predicted = this.predictedDose(index, goal);
    if (predicted) return predicted;
    let best: number | undefined, gap = Infinity;
    const near = this.nearDoc?.shared[index];
    if (near) for (const [d, f] of near.group.solved) { const g = Math.abs(f[near.at]! - goal); if (g < gap) { gap = g; best = d; } }
    if (best !== undefined) return best * this.nearDoc!.factor;
    try {
      return 1.5 * doseForRemoval(prepareMixture(this.prepared[index]!.components), 0, removalFraction).doseGPerL;
    } catch (e) {
      if (e instanceof InputError || e instanceof ComputationError) return 0.02;
      throw e;
    }
  }

  /**
   * The predicted dose for c/c0 = `goal` and the slope of the log-odds there, from the store's
   * models of this water at other DOCs, else from `nearDoc` (see startDose); also the first dose
   * the root tries when this model's solves do not meet the goal yet (traceDoseRoot's guess).
   */
  private predictedDose(index: number, goal: number): { doseGPerL: number; slope: number } | undefined {
    const across = this.store ? this.acrossDoc(index, goal) : undefined;
    if (across) return across;
    const near = this.nearDoc?.shared[index];
    if (!near) return undefined;
    const r = bracketedRoot([...near.group.solved].map(([d, f]) => [d, f[near.at]!] as const), goal);
    return r ? { doseGPerL: Math.exp(r.x) * this.nearDoc!.factor, slope: r.slope } : undefined;
  }

  /** startDose from the store's models of this water at other DOCs (see there); undefined when none has bracketed the goal. */
  private acrossDoc(index: number, goal: number): { doseGPerL: number; slope: number } | undefined {
    const roots: Array<{ lnDoc: number; x: number; slope: number }> = [];
    for (const m of this.store!.modelsOf(this.family)) {
      if (m.doc === this.docMgPerL) continue;
      const sh = m.solves.shared[index];
      const own = m.solves.own[index];
      const pts: Array<readonly [number, number]> = sh ? [...sh.group.solved].map(([d, f]) => [d, f[sh.at]!] as const) : own ? [...own.solved].map(([d, f]) => [d, f[0]!] as const) : [];
      const r = bracketedRoot(pts, goal);
      if (r) roots.push({ lnDoc: Math.log(m.doc), ...r });
    }
    const here = Math.log(this.docMgPerL);
    if (!roots.length) return undefined;
    roots.sort((a, b) => Math.abs(a.lnDoc - here) - Math.abs(b.lnDoc - here));
    const a = roots[0]!;
    const b = roots.find((r) => r.lnDoc !== a.lnDoc);
    // through the two nearest DOCs; from one, the dose scaled by DOC (the dose per mg DOC roughly constant)
    const x = b ? a.x + ((b.x - a.x) * (here - a.lnDoc)) / (b.lnDoc - a.lnDoc) : a.x + (here - a.lnDoc);
    return Number.isFinite(x) ? { doseGPerL: Math.exp(x), slope: a.slope } : undefined;
  }

  backgroundRemaining(doseGPerL: number, warm?: WarmStart): BackgroundAtDose {
    if (!this.bgPrepared) throw new InputError('this model has no fractionated background');
    if (doseGPerL === 0) return { cMgPerL: this.backgroundC0MgPerL!.slice(), warm };
    if (this.bgShared) {
      const f = this.bgShared.group.remainingAt(doseGPerL);
      return { cMgPerL: Float64Array.from(this.bgShared.at, (j, i) => f[j]! * this.backgroundC0MgPerL![i]!), warm };
    }
    const f = remainingUnderContact(this.bgPrepared, doseGPerL, this.conditions, this.options);
    return { cMgPerL: Float64Array.from(f, (x, i) => x * this.backgroundC0MgPerL![i]!), warm };
  }

  atDoc(docMgPerL: number): ContactRemoval {
    const f = docMgPerL / this.docMgPerL;
    const scale = (cs: readonly FreundlichComponent[]) => cs.map((c) => ({ ...c, c0MgPerL: c.c0MgPerL * f }));
    return new ContactRemoval(this.sets.map((s) => ({ target: s.target, competitors: scale(s.competitors) })), docMgPerL, this.particle, this.conditions, this.background ? scale(this.background) : undefined, this.options, this.shareBackground, { shared: this.shared, own: this.own, factor: f }, this.store);
  }
}

/**
 * ln D where c/c0 = `goal`, linear in ln D of the log-odds between the two solved points nearest
 * it on either side, with that secant's slope; undefined unless the points bracket the goal.
 */
function bracketedRoot(points: Iterable<readonly [number, number]>, goal: number): { x: number; slope: number } | undefined {
  const yGoal = logOdds(goal);
  let lo: { x: number; y: number } | undefined, hi: { x: number; y: number } | undefined;
  for (const [d, r] of points) {
    if (!(r > 0 && r < 1)) continue;
    const p = { x: Math.log(d), y: logOdds(r) };
    if (p.y < yGoal) { if (!lo || p.x > lo.x) lo = p; } else if (!hi || p.x < hi.x) hi = p;
  }
  if (!lo || !hi || !(hi.x > lo.x) || !(hi.y > lo.y)) return undefined;
  const slope = (hi.y - lo.y) / (hi.x - lo.x);
  return { x: lo.x + (yGoal - lo.y) / slope, slope };
}

/**
 * The store's key of a compound's own mixture under the conditions and solver options (its
 * outlets): its adsorbing components (adsorbingComponentsKey, the compound's own included; the
 * others have no block in the particle), the particle and the conditions as they decide a solve.
 */
function ownKey(pk: PreparedKinetics, cond: ContactConditions, options: KineticSolverOptions): string {
  return JSON.stringify(['own', adsorbingComponentsKey(pk, 0), pk.particle, solveConditions(cond), options]);
}

/**
 * A shared background whose competitors are exactly the fictive background's components (same
 * values, same split), so that the surrogates read the same solves; undefined otherwise.
 */
function backgroundInGroup(bg: PreparedKinetics, shared: ReadonlyArray<{ group: SharedBackground } | undefined>): { group: SharedBackground; at: number[] } | undefined {
  const same = (a: KineticComponent, b: KineticComponent) => a.id === b.id && a.c0MgPerL === b.c0MgPerL && a.K === b.K && a.oneOverN === b.oneOverN && a.dsM2PerS === b.dsM2PerS && a.dlM2PerS === b.dlM2PerS && a.kfMPerS === b.kfMPerS;
  for (const sh of shared) {
    if (!sh) continue;
    const g = sh.group;
    const comps = g.pk.components.slice(0, g.competitorCount);
    if (comps.length !== bg.components.length || !comps.every((c, i) => same(c, bg.components[i]!))) continue;
    const sameSplit = bg.coupled.length === g.pk.coupled.length && bg.coupled.every((i, k) => i === g.pk.coupled[k]);
    if (!sameSplit) continue;
    return { group: g, at: bg.components.map((_c, i) => i) };
  }
  return undefined;
}
