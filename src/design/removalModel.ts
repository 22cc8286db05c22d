/**
 * The removal-at-dose model: what fraction of each compound remains in the water at a carbon
 * dose. Every dose in the design layer (the required dose at the design DOC, the daily doses over
 * the DOC series, every Monte Carlo draw) is found by searching the dose on one of these models,
 * so a model plugs in without touching its callers.
 *
 * Contract (units: dose g/L, DOC mg/L, concentrations mg/L):
 *   - `remaining(i, D)` is c_i(D)/c0_i of compound i in [0, 1], equal to 1 at D = 0 and
 *     non-increasing in D (the dose search brackets on that);
 *   - `warm` is opaque: what `remaining` returns for compound i may be passed back on the next
 *     call for the same compound at a nearby dose, to start the solve there (never required);
 *   - `atDoc(doc)` is the same model in water of another DOC: every competitor's concentration
 *     proportional to the DOC (fictive DOC components and EBCs alike; Zietzschmann et al. 2016,
 *     Water Research 102:190 support scaling the background with DOC), targets unchanged;
 *   - `doseForRemoval(i, R)` (optional) is the inverse of `remaining`: the dose at which
 *     c/c0 = 1 − R, solved from the model's own equations (a shortcut of the dose search);
 *   - `backgroundRemaining(D)` (optional) gives the fictive DOC components left at the dose, for
 *     the DOC and UV254 surrogates;
 *   - never NaN: a failed solve throws ComputationError with the reason.
 *
 * How to add a model (e.g. a contact-time model in src/kinetics): write a class or factory that
 * implements RemovalModel from the same competition sets (`CompetitionSet`: the target and its
 * competitors at one DOC) plus its own parameters (contact time, carbon age, particle data); keep
 * its warm-start state in the opaque `warm`; make `atDoc` scale the competitors by DOC; then let
 * the code that builds models choose it (`RemovalModelFactory`, passed to the pipeline and the
 * Monte Carlo). Test it against the design layer's contract above and against its own closed
 * forms: for a contact time long enough, `remaining` must approach `EquilibriumRemoval`'s.
 */
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';

/** Opaque warm-start state of one compound's solve (model-specific). */
export type WarmStart = unknown;

export interface RemainingAtDose {
  /** c/c0 of the compound at the dose, in [0, 1]. */
  remainingFraction: number;
  /** Pass back to the next call for the same compound (a nearby dose) to start the solve there. */
  warm: WarmStart;
}

export interface BackgroundAtDose {
  /** Concentration of each background component left at the dose, mg/L (background order). */
  cMgPerL: Float64Array;
  warm: WarmStart;
}

export interface DoseAtRemoval {
  /** Dose at which the compound's removal equals the goal, g/L. */
  doseGPerL: number;
  /** c/c0 at that dose (1 − goal, to the model's own tolerance). */
  remainingFraction: number;
  /** d ln(c/c0)/d ln D there, when asked for (`withSlope`) and the model gives it (else absent or undefined). */
  slope?: number | undefined;
  warm: WarmStart;
}

export interface RemainingEstimates {
  /** ln(c/c0) of each compound (model order). */
  lnRemaining: ArrayLike<number>;
  /** Bound on the error of each estimate in ln(c/c0). */
  lnBound: ArrayLike<number>;
}

/** One target and its competitors in the water at one DOC (target c0 > 0). */
export interface CompetitionSet {
  target: FreundlichComponent;
  /** Competitors (fictive DOC components or one EBC) at the model's DOC, K for this carbon. */
  competitors: readonly FreundlichComponent[];
}

export interface RemovalModel {
  /** Short description for reports, e.g. "equilibrium (batch IAST)". */
  readonly kind: string;
  /** Compound ids, in the order of every index. */
  readonly compoundIds: readonly string[];
  /** DOC of the water the model describes, mg/L. */
  readonly docMgPerL: number;
  /** Remaining fraction c/c0 of compound `index` at a dose in g/L. @throws ComputationError */
  remaining(index: number, doseGPerL: number, warm?: WarmStart): RemainingAtDose;
  /**
   * Optional: the absolute accuracy of `remaining` (c/c0), how far the removal reached at the
   * dose found may sit from the goal. Default 1e-9 (the equilibrium solve, converged far below
   * it); a model integrated numerically states its own (its results jitter with the steps chosen).
   */
  readonly removalTolerance?: number;
  /**
   * Optional: the dose (g/L) at which compound `index` is removed by `removalFraction` (0 < R < 1),
   * solved directly from the model's equations to the same tolerance as `remaining` (a shortcut
   * of the dose search, which callers use when it is absent or returns undefined).
   */
  doseForRemoval?(index: number, removalFraction: number, warm?: WarmStart, withSlope?: boolean): DoseAtRemoval | undefined;
  /** Optional: `remaining` with its slope d ln(c/c0)/d ln D at the dose (for Newton steps on the dose). */
  remainingWithSlope?(index: number, doseGPerL: number, warm?: WarmStart): RemainingAtDose & { slope: number };
  /**
   * Optional: c/c0 of every compound estimated from one solve (compound `from` at the dose, its
   * `warm` from `remaining`), as ln c/c0 with a bound on |ln estimate − ln exact| (Infinity where
   * the model gives no estimate). Callers use it only to skip solves whose outcome the bound
   * already decides; undefined when the model has no estimate.
   */
  remainingEstimates?(from: number, doseGPerL: number, warm: WarmStart): RemainingEstimates | undefined;
  /**
   * Optional: an approximate dose (g/L) at which the mean removal of the compounds `set` reaches
   * `goalPercent`, with a warm start for each of them there (by compound index), from a cheaper
   * model (e.g. trace targets beside one background solve). Only a start for the exact search;
   * undefined when the model has none or it fails.
   */
  approximateMeanDose?(set: readonly number[], goalPercent: number, hintGPerL: number): { doseGPerL: number; warm: WarmStart[] } | undefined;
  /** The same model in water of another DOC (competitors scaled by DOC). */
  atDoc(docMgPerL: number): RemovalModel;
  /** Initial concentrations of the fictive DOC components, mg/L (absent without a fractionated background). */
  readonly backgroundC0MgPerL?: Float64Array;
  /** Fictive DOC components left at a dose in g/L (present with `backgroundC0MgPerL`). */
  backgroundRemaining?(doseGPerL: number, warm?: WarmStart): BackgroundAtDose;
}

/**
 * Builds the model of one carbon from its competition sets at a DOC (and the fictive background,
 * for the surrogates). The pipeline and the Monte Carlo take one, so they never name a model.
 */
export type RemovalModelFactory = (sets: readonly CompetitionSet[], docMgPerL: number, background?: readonly FreundlichComponent[]) => RemovalModel;
