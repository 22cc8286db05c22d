/**
 * Equilibrium removal-at-dose model: each target with its competitors in one batch IAST with
 * Freundlich isotherms (Radke & Prausnitz, AIChE J. 1972; batch form Crittenden et al., Environ.
 * Sci. Technol. 19(11):1037–1043, 1985), c0_i = c_i + D·q_i, solved by src/equilibrium/iastBatch.ts.
 * Each target is solved beside the background alone: trace targets (ng/L–µg/L) do not compete
 * measurably with each other beside mg/L of DOC (Knappe et al., Environ. Sci. Technol. 1998).
 * The fictive background alone gives the DOC and UV254 surrogates.
 *
 * Units: dose g/L, concentrations mg/L, K (mg/g)/(mg/L)^(1/n). Throws InputError for a target
 * without a feed concentration or invalid components, ComputationError if an IAST solve fails.
 * It is the limit of any contact-time model at long contact (the carbon reaches equilibrium).
 */
import { InputError } from '../core/errors.js';
import { sigmoid, softplus } from '../core/logistic.js';
import { checkLeadAmong, prepareMixture, prependChecked, scaleMixture, type FreundlichComponent, type PreparedMixture } from '../equilibrium/preparedMixture.js';
import { remainingAtState, remainingSlopeAtState, solveBatchPrepared, solveBatchState, type IastState } from '../equilibrium/iastBatch.js';
import { iastDoseForRemoval } from '../equilibrium/iastDoseForRemoval.js';
import { backgroundResponse, traceTarget, type BackgroundResponse, type TraceTarget } from '../equilibrium/traceTargets.js';
import { MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L } from './doseSearch.js';
import type { BackgroundAtDose, CompetitionSet, DoseAtRemoval, RemainingAtDose, RemainingEstimates, RemovalModel, RemovalModelFactory, WarmStart } from './removalModel.js';


function scaled(components: readonly FreundlichComponent[], factor: number): FreundlichComponent[] {
  return components.map((c) => ({ ...c, c0MgPerL: c.c0MgPerL * factor }));
}

const traceResponse: BackgroundResponse = { u: 0, lnX: 0, j11: 0, j12: 0, j21: 0, j22: 0, det: 0, du: 0, dLnX: 0 };
const traceScratch: TraceTarget = { t: 0, dt: 0, u: 0, lnX: 0 };
const traceSums = { mean: 0, slope: 0 };

/**
 * Σ_k (1 − f_k) and Σ_k −f_k(1 − f_k)·dt_k/d ln D over trace targets k (n, a and c0 of each), with
 * f_k = σ(t_k) their remaining fractions beside the background whose response is `r`
 * (traceTargets.ts): the indicator mean's numerator and its slope, into `out`. `tt` is scratch.
 */
function traceMeanRemoval(r: BackgroundResponse, nT: readonly number[], aT: readonly number[], c0T: readonly number[], tt: TraceTarget, out: { mean: number; slope: number }): void {
  let mean = 0, slope = 0;
  for (let k = 0; k < nT.length; k++) {
    traceTarget(r, nT[k]!, aT[k]!, c0T[k]!, tt);
    const f = sigmoid(tt.t);
    mean += 1 - f;
    slope -= f * (1 - f) * tt.dt;
  }
  out.mean = mean;
  out.slope = slope;
}

/** The competitors of every set when all sets share one non-empty list (the same array), else undefined. */
function sharedCompetitors(sets: readonly CompetitionSet[]): readonly FreundlichComponent[] | undefined {
  const first = sets[0]?.competitors;
  if (!first || first.length === 0) return undefined;
  for (const s of sets) if (s.competitors !== first) return undefined;
  return first;
}

/** The model this one was moved from with atDoc, and the DOC factor (mixtures are scaled on first use). */
interface Moved {
  parent: EquilibriumRemoval;
  factor: number;
}

/** The batch-IAST RemovalModel: remaining fraction c/c0 of each compound at a dose in g/L, with warm starts and the same water at another DOC. */
export class EquilibriumRemoval implements RemovalModel {
  readonly kind = 'equilibrium (batch IAST)';
  readonly compoundIds: readonly string[];
  /** Initial concentrations of the fictive DOC components (a moved model's: scaled when first asked for). */
  private bgC0?: Float64Array;
  private readonly mixtures: Array<PreparedMixture | undefined>;
  /** Feed concentrations of the targets (a plain array: a typed array of more than 8 numbers is allocated outside the JS heap, dearer per draw). */
  private readonly c0: readonly number[];
  private bgMixture?: PreparedMixture;
  private setsCache?: readonly CompetitionSet[];
  private backgroundCache?: readonly FreundlichComponent[];
  private readonly moved?: Moved;
  private groupCache?: Int32Array;
  /** The competitors every target shares, prepared once (absent when the sets differ). */
  private shared?: PreparedMixture;
  /** The last state of the shared competitors alone (approximateMeanDose's warm start). */
  private traceWarm?: IastState;

  /**
   * @param sets       each target with its competitors at `docMgPerL`; checked here and read
   *                   later (each target's mixture is prepared on first use), so the objects must
   *                   not be changed after the model is made
   * @param docMgPerL  DOC of the water, mg/L (> 0)
   * @param background the fictive DOC components at `docMgPerL` (for the surrogates), if any
   */
  constructor(sets: readonly CompetitionSet[], readonly docMgPerL: number, background?: readonly FreundlichComponent[], moved?: Moved) {
    if (!(docMgPerL > 0) || !Number.isFinite(docMgPerL)) throw new InputError(`expected a DOC > 0 mg/L, got ${docMgPerL}`, { path: 'doc' });
    if (moved) {
      // the same water at another DOC: targets as in the parent, competitors scaled when first used
      const p = moved.parent;
      this.moved = moved;
      this.compoundIds = p.compoundIds;
      this.c0 = p.c0;
      this.mixtures = new Array<PreparedMixture | undefined>(p.mixtures.length);
      return;
    }
    this.setsCache = sets;
    // arrays built by push: one array layout in every tier (designDose.ts)
    const ids: string[] = [], c0: number[] = [];
    for (let i = 0; i < sets.length; i++) {
      const s = sets[i]!;
      ids.push(s.target.id);
      if (!(s.target.c0MgPerL > 0) || !Number.isFinite(s.target.c0MgPerL)) throw new InputError(`expected a feed concentration > 0 mg/L for "${s.target.id}", got ${s.target.c0MgPerL}`, { path: `compounds[${i}].c0` });
      c0.push(s.target.c0MgPerL);
    }
    this.compoundIds = ids;
    this.c0 = c0;
    const competitors = sharedCompetitors(sets);
    let shared: PreparedMixture | undefined;
    if (competitors) {
      // every target beside the same competitors (the Monte Carlo's draws, the pipeline's fictive
      // background): prepare them once, each target's mixture on first use; a check that fails
      // is left to prepareMixture below, for its messages
      try {
        shared = prepareMixture(competitors);
        const competitorIds: string[] = []; // shared.ids, read from the components it was prepared from
        for (const c of competitors) competitorIds.push(c.id);
        for (const s of sets) checkLeadAmong(s.target, competitorIds);
      } catch { shared = undefined; }
    }
    if (shared) {
      this.shared = shared;
      this.mixtures = new Array<PreparedMixture | undefined>(sets.length);
    } else this.mixtures = sets.map((s) => prepareMixture([s.target, ...s.competitors]));
    if (background && background.length) {
      this.backgroundCache = background;
      this.bgMixture = shared && background === competitors ? shared : prepareMixture(background);
      this.bgC0 = Float64Array.from(background, (c) => c.c0MgPerL);
    }
  }

  /** Initial concentrations of the fictive DOC components, mg/L (absent without a fractionated background). */
  get backgroundC0MgPerL(): Float64Array | undefined {
    if (this.bgC0 || !this.moved) return this.bgC0;
    const factor = this.moved.factor;
    const p = this.moved.parent.backgroundC0MgPerL;
    if (p) this.bgC0 = p.map((c) => c * factor);
    return this.bgC0;
  }

  /** Each target with its competitors at this DOC. */
  get sets(): readonly CompetitionSet[] {
    return (this.setsCache ??= this.compoundIds.map((_, i) => {
      const src = this.mixture(i).source;
      return { target: src[0]!, competitors: src.slice(1) };
    }));
  }

  /** The fictive DOC components at this DOC (for the surrogates), if any. */
  get background(): readonly FreundlichComponent[] | undefined {
    if (this.backgroundCache || !this.moved) return this.backgroundCache;
    const bg = this.background0();
    return (this.backgroundCache = bg ? bg.source : undefined);
  }

  private mixture(index: number): PreparedMixture {
    let pm = this.mixtures[index];
    if (pm) return pm;
    if (this.shared && !this.moved && index >= 0 && index < this.mixtures.length) {
      pm = prependChecked(this.setsCache![index]!.target, this.shared); // checked against it in the constructor
      this.mixtures[index] = pm;
      return pm;
    }
    if (!this.moved || index < 0 || index >= this.mixtures.length) throw new InputError(`compound index ${index} is not in the model (${this.mixtures.length} compounds)`);
    // the prepared mixture scaled in place of preparing it again (the target, component 0, keeps its c0)
    pm = scaleMixture(this.moved.parent.mixture(index), this.moved.factor, 0);
    this.mixtures[index] = pm;
    return pm;
  }

  private background0(): PreparedMixture | undefined {
    if (this.bgMixture || !this.moved) return this.bgMixture;
    const p = this.moved.parent.background0();
    if (p) this.bgMixture = scaleMixture(p, this.moved.factor);
    return this.bgMixture;
  }

  remaining(index: number, doseGPerL: number, warm?: WarmStart): RemainingAtDose {
    const pm = this.mixture(index);
    if (doseGPerL === 0) return { remainingFraction: 1, warm };
    if (pm.active[0] !== 0) {
      // a target that does not adsorb stays in solution (the general solver, for its checks)
      const s = solveBatchPrepared(pm, doseGPerL, warm as IastState | undefined);
      return { remainingFraction: s.cMgPerL[0]! / this.c0[index]!, warm: s.state };
    }
    if (!(doseGPerL > 0) || !Number.isFinite(doseGPerL)) throw new InputError(`expected a non-negative finite carbon dose, got ${doseGPerL}`, { path: 'dose' });
    const state = solveBatchState(pm, doseGPerL, warm as IastState | undefined);
    return { remainingFraction: remainingAtState(pm, 0, state), warm: state };
  }

  remainingWithSlope(index: number, doseGPerL: number, warm?: WarmStart): RemainingAtDose & { slope: number } {
    const pm = this.mixture(index);
    if (pm.active[0] !== 0 || !(doseGPerL > 0) || !Number.isFinite(doseGPerL)) {
      const r = this.remaining(index, doseGPerL, warm);
      return { remainingFraction: r.remainingFraction, warm: r.warm, slope: 0 };
    }
    const state = solveBatchState(pm, doseGPerL, warm as IastState | undefined);
    return { remainingFraction: remainingAtState(pm, 0, state), warm: state, slope: remainingSlopeAtState(pm, doseGPerL, 0, state) };
  }

  /**
   * Trace estimates (Knappe et al. 1998: a trace compound does not change its background's state):
   * every compound whose competitors are those of `from` is evaluated at the spreading pressure ψ
   * and adsorbed total x of the solve of `from`, ln c_i/c0_i = ln σ(n_i·ln ψ + a_i − ln x)
   * (iastBatch.ts). The error comes from the two targets' own share of the adsorbed phase; it is
   * first order in ε = (c0_from + c0_i)/x, and the bound used is 0.005 + 5·max(n_from, n_i)·ε
   * (ours: several times the largest error found on the demo and on random trace mixtures, see
   * tests/design/remainingEstimates.test.ts). Compounds with other competitors get no estimate.
   */
  remainingEstimates(from: number, doseGPerL: number, warm: WarmStart): RemainingEstimates | undefined {
    const pf = this.mixture(from);
    const st = warm as IastState | undefined;
    if (pf.active[0] !== 0 || !st || !(doseGPerL > 0)) return undefined;
    const root = this.moved ? this.moved.parent : this;
    const group = root.groups();
    const lnx = pf.lnCTotal - softplus(-st.theta); // ln x = ln C − softplus(−θ) (iastBatch.ts)
    const x = Math.exp(lnx);
    const T = this.c0.length;
    const lnRemaining = new Array<number>(T).fill(0), lnBound = new Array<number>(T).fill(Infinity);
    for (let i = 0; i < T; i++) {
      if (group[i] !== group[from]) continue;
      const pm = root.mixture(i); // the target's n and a do not change with the DOC
      if (pm.active[0] !== 0) continue;
      const t = pm.n[0]! * st.u + pm.a[0]! - lnx;
      lnRemaining[i] = -softplus(-t); // ln σ(t)
      lnBound[i] = 0.005 + 5 * Math.max(pf.n[0]!, pm.n[0]!) * ((this.c0[from]! + this.c0[i]!) / x);
    }
    return { lnRemaining, lnBound };
  }

  /** Compounds with identical competitors share a group number (the first compound's index). */
  private groups(): Int32Array {
    if (this.groupCache) return this.groupCache;
    const T = this.mixtures.length;
    const g = new Int32Array(T);
    if (this.shared) {
      // one list of competitors: every adsorbable target in the group of the first one
      let first = -1;
      for (let i = 0; i < T; i++) {
        g[i] = i;
        if (this.setsCache![i]!.target.K > 0) { if (first < 0) first = i; g[i] = first; }
      }
      return (this.groupCache = g);
    }
    const same = (p: PreparedMixture, q: PreparedMixture): boolean => {
      if (p.active[0] !== 0 || q.active[0] !== 0 || p.c0.length !== q.c0.length) return false;
      for (let k = 1; k < p.c0.length; k++) if (p.c0[k] !== q.c0[k] || p.n[k] !== q.n[k] || p.a[k] !== q.a[k]) return false;
      return true;
    };
    for (let i = 0; i < T; i++) {
      g[i] = i;
      for (let k = 0; k < i; k++) if (g[k] === k && same(this.mixture(k), this.mixture(i))) { g[i] = k; break; }
    }
    return (this.groupCache = g);
  }

  doseForRemoval(index: number, removalFraction: number, warm?: WarmStart, withSlope = false): DoseAtRemoval | undefined {
    const pm = this.mixture(index);
    if (pm.active[0] !== 0 || !(removalFraction > 0 && removalFraction < 1)) return undefined;
    const r = iastDoseForRemoval(pm, 0, removalFraction, (warm as IastState | undefined)?.u);
    // one object layout whether or not the slope is asked for (hot loops stay monomorphic)
    return { doseGPerL: r.doseGPerL, remainingFraction: remainingAtState(pm, 0, r.state), slope: withSlope ? remainingSlopeAtState(pm, r.doseGPerL, 0, r.state) : undefined, warm: r.state };
  }

  /** The shared competitors at this DOC (absent when the targets' competitors differ). */
  private sharedMixture(): PreparedMixture | undefined {
    if (this.shared || !this.moved) return this.shared;
    const p = this.moved.parent.sharedMixture();
    if (p) this.shared = scaleMixture(p, this.moved.factor);
    return this.shared;
  }

  /**
   * The trace estimate of the dose at which the mean removal of `set` reaches the goal: Newton's
   * method on ln D over solves of the shared competitors alone, each member's c/c0 in closed form
   * with the first-order correction for its own loading (src/equilibrium/traceTargets.ts); the
   * member states it implies are the warm starts of the exact solves. Undefined without one
   * shared background, for a member that does not adsorb, or when the iteration fails.
   */
  approximateMeanDose(set: readonly number[], goalPercent: number, hintGPerL: number): { doseGPerL: number; warm: WarmStart[] } | undefined {
    const bg = this.sharedMixture();
    const m = set.length;
    if (!bg || bg.c0.length === 0 || m === 0 || !(hintGPerL > 0)) return undefined;
    // each member's n, a and c0 (component 0 of its mixture) and liquid total, read once
    const nT: number[] = [], aT: number[] = [], c0T: number[] = [], cTotalT: number[] = [];
    for (let k = 0; k < m; k++) {
      const pm = this.mixture(set[k]!);
      if (pm.active[0] !== 0) return undefined; // a member that does not adsorb
      nT.push(pm.n[0]!); aT.push(pm.a[0]!); c0T.push(pm.c0[0]!); cTotalT.push(pm.cTotal);
    }
    const lo = Math.log(MIN_DOSE_G_PER_L), hi = Math.log(MAX_DOSE_G_PER_L);
    let x = Math.log(hintGPerL);
    if (!(x > lo && x < hi)) return undefined;
    const r = traceResponse, tt = traceScratch;
    let state: IastState | undefined = this.traceWarm;
    for (let it = 0; it < 30; it++) {
      state = solveBatchState(bg, Math.exp(x), state);
      backgroundResponse(bg, state, r);
      if (!Number.isFinite(r.det) || r.det === 0) return undefined;
      traceMeanRemoval(r, nT, aT, c0T, tt, traceSums);
      const mean = traceSums.mean, slope = traceSums.slope;
      const e = (100 * mean) / m - goalPercent, de = (100 * slope) / m;
      if (!(de > 0) || !Number.isFinite(e)) return undefined;
      let step = -e / de;
      if (Math.abs(step) > 2) step = Math.sign(step) * 2;
      if (Math.abs(step) <= 1e-10) {
        this.traceWarm = state;
        const warm: WarmStart[] = [];
        for (let k = 0; k < m; k++) {
          traceTarget(r, nT[k]!, aT[k]!, c0T[k]!, tt);
          const gap = cTotalT[k]! - Math.exp(tt.lnX); // liquid total; θ = ln x − ln(C − x)
          if (gap > 0) warm[set[k]!] = { u: tt.u, theta: tt.lnX - Math.log(gap) };
        }
        return { doseGPerL: Math.exp(x + step), warm };
      }
      x += step;
      if (!(x > lo && x < hi)) return undefined;
    }
    return undefined;
  }

  backgroundRemaining(doseGPerL: number, warm?: WarmStart): BackgroundAtDose {
    const bg = this.background0();
    if (!bg) throw new InputError('this model has no fractionated background');
    if (doseGPerL === 0) return { cMgPerL: this.backgroundC0MgPerL!.slice(), warm };
    const s = solveBatchPrepared(bg, doseGPerL, warm as IastState | undefined);
    return { cMgPerL: s.cMgPerL, warm: s.state };
  }

  atDoc(docMgPerL: number): EquilibriumRemoval {
    const f = docMgPerL / this.docMgPerL;
    if (this.moved) return new EquilibriumRemoval([], docMgPerL, undefined, { parent: this.moved.parent, factor: this.moved.factor * f });
    return new EquilibriumRemoval([], docMgPerL, undefined, { parent: this, factor: f });
  }
}

/** The factory of the equilibrium model (the default of the pipeline and the Monte Carlo). */
export const equilibriumRemoval: RemovalModelFactory = (sets, docMgPerL, background) => new EquilibriumRemoval(sets, docMgPerL, background);
