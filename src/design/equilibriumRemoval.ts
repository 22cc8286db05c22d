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
import { prepareMixture, scaleMixture, type FreundlichComponent, type PreparedMixture } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import type { BackgroundAtDose, CompetitionSet, RemainingAtDose, RemovalModel, RemovalModelFactory, WarmStart } from './removalModel.js';

type IastState = { u: number; theta: number };

function scaled(components: readonly FreundlichComponent[], factor: number): FreundlichComponent[] {
  return components.map((c) => ({ ...c, c0MgPerL: c.c0MgPerL * factor }));
}

/** The batch-IAST RemovalModel: remaining fraction c/c0 of each compound at a dose in g/L, with warm starts and the same water at another DOC. */
export class EquilibriumRemoval implements RemovalModel {
  readonly kind = 'equilibrium (batch IAST)';
  readonly compoundIds: readonly string[];
  readonly backgroundC0MgPerL?: Float64Array;
  private readonly mixtures: PreparedMixture[];
  private readonly c0: Float64Array;
  private readonly bgMixture?: PreparedMixture;

  /**
   * @param sets       each target with its competitors at `docMgPerL`
   * @param docMgPerL  DOC of the water, mg/L (> 0)
   * @param background the fictive DOC components at `docMgPerL` (for the surrogates), if any
   * @param prepared   the mixtures of `sets` and `background` already prepared (atDoc), if any
   */
  constructor(readonly sets: readonly CompetitionSet[], readonly docMgPerL: number, readonly background?: readonly FreundlichComponent[], prepared?: { mixtures: PreparedMixture[]; background?: PreparedMixture }) {
    if (!(docMgPerL > 0) || !Number.isFinite(docMgPerL)) throw new InputError(`expected a DOC > 0 mg/L, got ${docMgPerL}`, { path: 'doc' });
    this.compoundIds = sets.map((s) => s.target.id);
    this.c0 = Float64Array.from(sets, (s, i) => {
      if (!(s.target.c0MgPerL > 0) || !Number.isFinite(s.target.c0MgPerL)) throw new InputError(`expected a feed concentration > 0 mg/L for "${s.target.id}", got ${s.target.c0MgPerL}`, { path: `compounds[${i}].c0` });
      return s.target.c0MgPerL;
    });
    this.mixtures = prepared ? prepared.mixtures : sets.map((s) => prepareMixture([s.target, ...s.competitors]));
    if (background && background.length) {
      this.bgMixture = prepared?.background ?? prepareMixture(background);
      this.backgroundC0MgPerL = Float64Array.from(background, (c) => c.c0MgPerL);
    }
  }

  remaining(index: number, doseGPerL: number, warm?: WarmStart): RemainingAtDose {
    const pm = this.mixtures[index];
    if (!pm) throw new InputError(`compound index ${index} is not in the model (${this.mixtures.length} compounds)`);
    if (doseGPerL === 0) return { remainingFraction: 1, warm };
    const s = solveBatchPrepared(pm, doseGPerL, warm as IastState | undefined);
    return { remainingFraction: s.cMgPerL[0]! / this.c0[index]!, warm: s.state };
  }

  backgroundRemaining(doseGPerL: number, warm?: WarmStart): BackgroundAtDose {
    if (!this.bgMixture) throw new InputError('this model has no fractionated background');
    if (doseGPerL === 0) return { cMgPerL: this.backgroundC0MgPerL!.slice(), warm };
    const s = solveBatchPrepared(this.bgMixture, doseGPerL, warm as IastState | undefined);
    return { cMgPerL: s.cMgPerL, warm: s.state };
  }

  atDoc(docMgPerL: number): EquilibriumRemoval {
    const f = docMgPerL / this.docMgPerL;
    // the prepared mixtures scaled in place of preparing them again (the target, component 0, keeps its c0)
    const mixtures = this.mixtures.map((pm) => scaleMixture(pm, f, 0));
    const bg = this.bgMixture ? scaleMixture(this.bgMixture, f) : undefined;
    return new EquilibriumRemoval(
      this.sets.map((s, i) => ({ target: s.target, competitors: mixtures[i]!.source.slice(1) })),
      docMgPerL,
      bg ? bg.source : this.background ? scaled(this.background, f) : undefined,
      bg ? { mixtures, background: bg } : { mixtures },
    );
  }
}

/** The factory of the equilibrium model (the default of the pipeline and the Monte Carlo). */
export const equilibriumRemoval: RemovalModelFactory = (sets, docMgPerL, background) => new EquilibriumRemoval(sets, docMgPerL, background);
