/**
 * The Monte Carlo under the plant's PAC contact conditions: the kinetic part of a carbon's Monte
 * Carlo problem (src/uncertainty/kineticUncertainty.ts) and the number of draws.
 *
 * Every draw designs the carbon with the contact model (HSDM with IAST at the particle surface in
 * the plant's contact tank) with its drawn Ds: each target's and the one shared by the fictive DOC
 * components, lognormal around the run's value (the fitted one where kinetic jar tests were given).
 * Spread: a fitted Ds takes its 95 % interval (SD of ln Ds = ln(hi/lo)/(2·1.96), normal
 * approximation on ln Ds); a given Ds takes `uncertainty.Ds_rel_sd` (default 30 %, ours: a rough
 * spread for a diffusivity taken from other waters or carbons, not from a source). DL, the
 * particle and the contact conditions are not sampled.
 *
 * Kinetic solves are slow, so contact carbons run `uncertainty.contact_draws` draws (default 100,
 * ours), never more than `draws`; the report states the number.
 */
import type { UncertaintySpec } from '../project/projectTypes.js';
import type { CarbonResult } from './pipelineTypes.js';
import type { UncertainParameter } from './uncertaintyTypes.js';
import type { PacContactSpec } from '../project/readPacContact.js';
import type { UncertainDiffusivity, UncertainKinetics } from '../uncertainty/kineticUncertainty.js';
import type { KineticSolverOptions } from '../kinetics/pacBatch.js';

/** Draws of a contact carbon when `uncertainty.contact_draws` is not given (ours: a moderate number while kinetic solves are slow). */
export const DEFAULT_CONTACT_DRAWS = 100;
/** Relative SD of a given (not fitted) Ds when `uncertainty.Ds_rel_sd` is not given (ours, no source). */
export const DEFAULT_DS_REL_SD = 0.3;
/** Two-sided 95 % quantile of the standard normal distribution. */
const Z95 = 1.959963984540054;

/** Draws of a carbon under contact conditions: contact_draws (default 100), at most `draws`. */
export function contactDrawCount(s: Pick<UncertaintySpec, 'draws' | 'contactDraws'>): number {
  return Math.min(s.draws, s.contactDraws ?? DEFAULT_CONTACT_DRAWS);
}

/**
 * The kinetic part of the Monte Carlo problem of a PAC carbon under contact, with the sampled
 * parameters as the report lists them; `cr.carbon.kinetics` holds the run's (fitted) values.
 * @returns undefined with the reason when a kinetic quantity is missing (the run would have failed first)
 */
export function contactUncertainty(cr: CarbonResult, contact: PacContactSpec, s: Pick<UncertaintySpec, 'dsRelSd'>, solver: KineticSolverOptions = {}): { kinetics: UncertainKinetics; parameters: UncertainParameter[] } | { skipped: string } {
  const k = cr.carbon.kinetics;
  if (!k || k.particleRadiusM === undefined || k.particleDensityGPerL === undefined || k.docDsM2PerS === undefined || k.docDlM2PerS === undefined) return { skipped: 'the carbon has no complete kinetic data for the contact model' };
  const relSd = s.dsRelSd ?? DEFAULT_DS_REL_SD;
  const relBasis = s.dsRelSd === undefined ? `default ${DEFAULT_DS_REL_SD * 100} % (ours, no source; set uncertainty.Ds_rel_sd)` : 'project uncertainty.Ds_rel_sd';
  const fits = cr.kineticCalibration?.fits ?? [];
  const parameters: UncertainParameter[] = [];
  const entry = (label: string, ds: number, dl: number, fitted: ReturnType<typeof fits.find>): UncertainDiffusivity => {
    const ci = fitted?.result.ci95.Ds_m2_per_s;
    let lnSd: number;
    if (ci && ci[0] > 0 && ci[1] >= ci[0]) {
      lnSd = Math.log(ci[1] / ci[0]) / (2 * Z95);
      parameters.push({ parameter: label, distribution: 'lognormal', sd: Math.sqrt(Math.expm1(lnSd * lnSd)), basis: `kinetic fit 95 % interval ${ci[0].toPrecision(3)}–${ci[1].toPrecision(3)} m2/s (SD of ln Ds ${lnSd.toPrecision(3)})` });
    } else {
      lnSd = Math.sqrt(Math.log1p(relSd * relSd));
      if (relSd > 0) parameters.push({ parameter: label, distribution: 'lognormal', sd: relSd, basis: fitted ? `${relBasis} (the kinetic fit has no interval)` : relBasis });
    }
    return { dsM2PerS: ds, dlM2PerS: dl, ...(lnSd > 0 ? { dsLnSd: lnSd } : {}) };
  };
  const targets: UncertainDiffusivity[] = [];
  for (const sys of cr.systems) {
    const ds = k.dsM2PerS[sys.compoundId];
    const dl = k.dlM2PerS[sys.compoundId];
    if (ds === undefined || dl === undefined) return { skipped: `compound ${sys.compoundId} has no Ds or DL on this carbon` };
    targets.push(entry(`Ds of ${sys.compoundId}`, ds, dl, fits.find((f) => f.parameter === 'Ds' && f.compoundId === sys.compoundId)));
  }
  const background = entry('Ds of the fictive DOC components (doc_Ds)', k.docDsM2PerS, k.docDlM2PerS, fits.find((f) => f.parameter === 'doc_Ds'));
  const kinetics: UncertainKinetics = {
    particle: { radiusM: k.particleRadiusM, densityGPerL: k.particleDensityGPerL },
    contact: { ...contact },
    targets,
    background,
  };
  if (solver.interiorPoints !== undefined || solver.rtol !== undefined) kinetics.solver = { ...(solver.interiorPoints !== undefined ? { interiorPoints: solver.interiorPoints } : {}), ...(solver.rtol !== undefined ? { rtol: solver.rtol } : {}) };
  return { kinetics, parameters };
}
