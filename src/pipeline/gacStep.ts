/**
 * The GAC estimate on one GAC carbon (capability 12): equilibrium bed volumes to saturation and
 * carbon usage rate of every compound under competition (direct IAST of the compound with its
 * competitors at their feed concentrations, src/gac/gacEstimate.ts), the operating life BV·EBCT,
 * the yearly carbon at the design flow, and the governing compound (fewest bed volumes).
 *
 *   BV = ρ_bed·q_T(feed)/c0_T,   CUR = c0_T/q_T(feed)   (equilibrium column estimate; docs/references.md)
 *
 * Each compound is estimated with its own competitors (fictive DOC components or its EBC, as in
 * the batch systems) at the design DOC. Beside it the single-solute estimate uses the compound's
 * own isotherm on this carbon (before any calibrated K factor). A REFERENCE, NOT A BOUND: preloading
 * by DOC and kinetics usually make real beds break through far earlier, displacement can make a
 * weak compound break through later (GAC_UPPER_BOUND_CAUTION).
 *
 * Units: ρ_bed kg/m³, EBCT min, flow m³/d, concentrations mg/L, q mg/g.
 * @throws InputError for invalid carbon data; ComputationError if direct IAST fails
 */
import { gacEstimate, GAC_UPPER_BOUND_CAUTION, type GacEstimate, type GacTargetEstimate } from '../gac/gacEstimate.js';
import type { CarbonSpec } from '../project/projectTypes.js';
import type { CompoundSystem } from '../design/competitionSystem.js';

export interface GacStepResult {
  carbonName: string;
  bedDensityKgPerM3: number;
  ebctMin: number;
  flowM3PerD: number;
  docMgPerL: number;
  estimate: GacEstimate;
  /** Governing compound's estimate (fewest bed volumes). */
  governing: GacTargetEstimate;
  /** Carbon cost per year at the governing usage rate (equilibrium reference, as the usage is). */
  yearlyCost: number;
  currency: string;
}

export function gacStep(carbon: CarbonSpec, systems: readonly CompoundSystem[], docMgPerL: number, flowM3PerD: number): GacStepResult {
  const rho = carbon.bedDensityKgPerM3!;
  const ebct = carbon.ebctMin!;
  const ebctDays = ebct / 1440;
  let last: GacEstimate | undefined;
  const targets = systems.map((sys) => {
    const est = gacEstimate({
      targets: [{ id: sys.compoundId, c0MgPerL: sys.c0MgPerL, K: sys.inMixture.K, oneOverN: sys.inMixture.oneOverN }],
      background: sys.background(docMgPerL),
      bedDensityKgPerM3: rho, ebctMin: ebct, flowM3PerD,
    });
    last = est;
    const t = est.targets[0]!;
    // single solute: the compound's own isotherm on this carbon (Freundlich q = K·c0^(1/n))
    const qSingle = sys.single.K * Math.pow(sys.c0MgPerL, sys.single.oneOverN);
    t.qSingleMgPerG = qSingle;
    t.bedVolumesSingleSolute = (rho * qSingle) / sys.c0MgPerL; // BV = ρ_bed·q/c0
    t.carbonUsageSingleSoluteGPerM3 = (sys.c0MgPerL / qSingle) * 1000;
    t.lifeDaysSingleSolute = t.bedVolumesSingleSolute * ebctDays;
    return t;
  });
  let governing = targets[0]!;
  for (const t of targets) if (t.bedVolumes < governing.bedVolumes) governing = t;
  const estimate: GacEstimate = { targets, governing: governing.id, upperBound: true, caution: GAC_UPPER_BOUND_CAUTION };
  if (last?.bedVolumeM3 !== undefined) estimate.bedVolumeM3 = last.bedVolumeM3;
  if (last?.bedCarbonTonnes !== undefined) estimate.bedCarbonTonnes = last.bedCarbonTonnes;
  return {
    carbonName: carbon.name, bedDensityKgPerM3: rho, ebctMin: ebct, flowM3PerD, docMgPerL, estimate, governing,
    yearlyCost: (governing.carbonTonnesPerYear ?? 0) * 1000 * carbon.pricePerKg, currency: carbon.currency,
  };
}
