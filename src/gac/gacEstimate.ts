/**
 * GAC equilibrium estimate under competition: bed volumes to saturation and carbon usage rate
 * of each target when the whole bed is in equilibrium with the feed.
 *
 *   q_T(feed)   loading of the target in equilibrium with the feed (target + DOC background at
 *               their feed concentrations), by direct IAST (Radke & Prausnitz 1972, AIChE J.
 *               18(4):761–768; src/equilibrium/iastDirect.ts), mg/g
 *   BV          = ρ_bed·q_T/c0_T  (ρ_bed in kg/m³ = g/L, q mg/g, c0 mg/L → dimensionless)
 *   CUR         = c0_T/q_T  in g carbon per L of water; ×1000 → g/m³, which is numerically the
 *               same as kg per 1000 m³ and as an equivalent continuous dose in mg/L
 *   bed volume  = EBCT·Q;  operating life = BV·bed volume/Q = BV·EBCT
 * (the mass balance of an ideal saturated column,
 * e.g. Crittenden et al., MWH's Water Treatment: Principles and Design, 3rd ed. 2012, ch. 15 —
 * from memory). Beside it the single-solute estimate (target alone, Freundlich q = K·c0^(1/n)).
 *
 * This is a REFERENCE, not a bound: preloading by DOC and adsorption kinetics (mass-transfer zone)
 * usually make real beds break through far earlier (see GAC_UPPER_BOUND_CAUTION below). Each target is solved with the background alone (trace targets
 * do not compete measurably with each other). The governing target is the one with the fewest
 * bed volumes.
 *
 * Units: concentrations mg/L, K (mg/g)/(mg/L)^(1/n), ρ_bed kg/m³, EBCT min, flow m³/d.
 */
import { InputError } from '../core/errors.js';
import { prepareMixture, type FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { directIastPrepared } from '../equilibrium/iastDirect.js';

/**
 * What the equilibrium estimate is and is not. Not always an upper bound: a target weaker than the
 * strongest DOC fraction is displaced in a fixed bed and can break through after it (seen in the
 * fixed-bed model, src/kinetics/fixedBed.ts), and staggered filters run past a single bed.
 */
export const GAC_UPPER_BOUND_CAUTION =
  'Equilibrium estimate, a reference and not a bound: preloading by DOC and adsorption kinetics usually make a single bed break through far earlier, but a compound weaker than the strongest DOC fraction can be displaced and break through after it; confirm with rapid small-scale column tests or pilot columns.';

export interface GacInput {
  /** Target compounds at their feed concentrations (c0MgPerL > 0, K > 0). */
  targets: readonly FreundlichComponent[];
  /** Background (fictive DOC components at the feed DOC; K = 0 for the non-adsorbable one). */
  background: readonly FreundlichComponent[];
  /** Bed (apparent) density of the GAC, kg/m³ (typical 350–550; common practice). */
  bedDensityKgPerM3: number;
  /** Empty-bed contact time, minutes (optional; gives the operating life). */
  ebctMin?: number;
  /** Plant flow, m³/d (optional; gives the bed volume in m³ and the yearly carbon mass). */
  flowM3PerD?: number;
}

export interface GacTargetEstimate {
  id: string;
  c0MgPerL: number;
  /** Loading in equilibrium with the feed under competition, mg/g. */
  qCompetitiveMgPerG: number;
  /** Single-solute loading K·c0^(1/n), mg/g. */
  qSingleMgPerG: number;
  /** Bed volumes to saturation under competition (equilibrium reference, not a bound). */
  bedVolumes: number;
  /** Bed volumes with the single-solute loading (higher still). */
  bedVolumesSingleSolute: number;
  /** Carbon usage rate under competition, g carbon per m³ treated (= kg per 1000 m³ = mg/L). */
  carbonUsageGPerM3: number;
  carbonUsageSingleSoluteGPerM3: number;
  /** Operating life BV·EBCT, days (when EBCT given). */
  lifeDays?: number;
  lifeDaysSingleSolute?: number;
  /** Carbon used per year CUR·Q·365 d, tonnes (when the flow is given). */
  carbonTonnesPerYear?: number;
}

export interface GacEstimate {
  targets: GacTargetEstimate[];
  /** Target with the fewest bed volumes under competition. */
  governing: string;
  /** Bed volume EBCT·Q, m³ (when both given). */
  bedVolumeM3?: number;
  /** Carbon mass in the bed, tonnes (when both given). */
  bedCarbonTonnes?: number;
  upperBound: true;
  caution: string;
}

function positive(v: number | undefined, path: string, what: string): void {
  if (v === undefined) return;
  if (!(v > 0) || !Number.isFinite(v)) throw new InputError(`expected ${what} > 0, got ${v}`, { path });
}

/**
 * Equilibrium bed volumes and carbon usage rates of every target (with competition, and single
 * solute beside it). @throws InputError for invalid inputs (a target with K = 0 or c0 = 0,
 * non-positive density, EBCT or flow); ComputationError if direct IAST fails.
 */
export function gacEstimate(input: GacInput): GacEstimate {
  positive(input.bedDensityKgPerM3, 'bedDensityKgPerM3', 'a bed density in kg/m³');
  positive(input.ebctMin, 'ebctMin', 'an empty-bed contact time in minutes');
  positive(input.flowM3PerD, 'flowM3PerD', 'a flow in m³/d');
  if (input.targets.length === 0) throw new InputError('expected at least one target compound', { path: 'targets' });
  const rhoGPerL = input.bedDensityKgPerM3; // kg/m³ = g/L
  const ebctDays = input.ebctMin !== undefined ? input.ebctMin / 1440 : undefined;
  const targets = input.targets.map((t, i): GacTargetEstimate => {
    if (!(t.K > 0)) throw new InputError(`target "${t.id}" has K = ${t.K}; expected an adsorbable compound (K > 0)`, { path: `targets[${i}].K` });
    if (!(t.c0MgPerL > 0)) throw new InputError(`target "${t.id}" has a feed concentration of ${t.c0MgPerL} mg/L; expected > 0`, { path: `targets[${i}].c0` });
    const pm = prepareMixture([t, ...input.background]);
    const d = directIastPrepared(pm, pm.c0); // feed concentrations of the active components
    const q = d.qMgPerG[0]!; // the target is active component 0 (first, K > 0, c0 > 0)
    const qSingle = t.K * Math.pow(t.c0MgPerL, t.oneOverN); // Freundlich single solute
    const bv = (rhoGPerL * q) / t.c0MgPerL; // BV = ρ_bed·q_T/c0_T
    const bvSingle = (rhoGPerL * qSingle) / t.c0MgPerL;
    const est: GacTargetEstimate = {
      id: t.id,
      c0MgPerL: t.c0MgPerL,
      qCompetitiveMgPerG: q,
      qSingleMgPerG: qSingle,
      bedVolumes: bv,
      bedVolumesSingleSolute: bvSingle,
      carbonUsageGPerM3: (t.c0MgPerL / q) * 1000, // CUR = c0/q (g/L) × 1000 L/m³
      carbonUsageSingleSoluteGPerM3: (t.c0MgPerL / qSingle) * 1000,
    };
    if (ebctDays !== undefined) {
      est.lifeDays = bv * ebctDays; // BV·(EBCT·Q)/Q
      est.lifeDaysSingleSolute = bvSingle * ebctDays;
    }
    if (input.flowM3PerD !== undefined) est.carbonTonnesPerYear = (est.carbonUsageGPerM3 * input.flowM3PerD * 365) / 1e6;
    return est;
  });
  let governing = targets[0]!;
  for (const t of targets) if (t.bedVolumes < governing.bedVolumes) governing = t;
  const out: GacEstimate = { targets, governing: governing.id, upperBound: true, caution: GAC_UPPER_BOUND_CAUTION };
  if (input.ebctMin !== undefined && input.flowM3PerD !== undefined) {
    out.bedVolumeM3 = (input.ebctMin / 1440) * input.flowM3PerD;
    out.bedCarbonTonnes = (out.bedVolumeM3 * input.bedDensityKgPerM3) / 1000;
  }
  return out;
}
