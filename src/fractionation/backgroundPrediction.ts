/**
 * Using a fitted background: its fictive components at any DOC, and the DOC and UV254 it
 * predicts at any carbon dose.
 *
 * Fractions scale with DOC: c0_i = fraction_i · DOC (the basis of fractionating a dilution
 * series; Zietzschmann et al. 2016, Water Research 102:190, found the EBC concentration
 * proportional to DOC). UV254 is additive over components (Beer–Lambert):
 * UV254 = Σ a_i·c_i with a_i the specific absorbance (1/m per mg/L).
 */
import { InputError } from '../core/errors.js';
import { prepareMixture, type FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import type { BackgroundFile } from './backgroundFile.js';

/**
 * The background's fictive components scaled to `docMgPerL` (mg/L): c0_i = fraction_i·DOC.
 * K in (mg/g)/(mg/L)^(1/n) as stored. @throws InputError for a negative or non-finite DOC
 */
export function backgroundComponents(background: BackgroundFile, docMgPerL: number = background.doc0_mg_per_L): FreundlichComponent[] {
  if (!(docMgPerL >= 0) || !Number.isFinite(docMgPerL)) throw new InputError(`expected a DOC ≥ 0 mg/L, got ${docMgPerL}`, { path: 'doc' });
  return background.components.map((c) => ({ id: c.id, c0MgPerL: c.fraction * docMgPerL, K: c.K, oneOverN: c.K > 0 ? c.one_over_n : (c.one_over_n > 0 ? c.one_over_n : 1) }));
}

/** Liquid concentrations of the components (mg/L) after a batch dose (mg/L). */
function componentConcentrations(background: BackgroundFile, doseMgPerL: number, doc0MgPerL: number): Float64Array {
  if (!(doseMgPerL >= 0) || !Number.isFinite(doseMgPerL)) throw new InputError(`expected a carbon dose ≥ 0 mg/L, got ${doseMgPerL}`, { path: 'dose' });
  const pm = prepareMixture(backgroundComponents(background, doc0MgPerL));
  return solveBatchPrepared(pm, doseMgPerL / 1000).cMgPerL;
}

/**
 * Equilibrium DOC (mg/L) after a batch carbon dose `doseMgPerL` (mg/L), starting from
 * `doc0MgPerL` (default the background's DOC0): Σ c_i from batch IAST (Crittenden et al. 1985).
 * @throws InputError for invalid doses; ComputationError if the equilibrium does not converge
 */
export function predictDoc(background: BackgroundFile, doseMgPerL: number, doc0MgPerL: number = background.doc0_mg_per_L): number {
  return componentConcentrations(background, doseMgPerL, doc0MgPerL).reduce((s, v) => s + v, 0);
}

/**
 * Equilibrium UV254 (1/m) after a batch dose: Σ a_i·c_i (Beer–Lambert additivity) with the
 * specific absorbances a_i (1/m per mg/L) fitted by `fractionate`.
 * @throws InputError when the background has no UV254 fit
 */
export function predictUv254(background: BackgroundFile, doseMgPerL: number, doc0MgPerL: number = background.doc0_mg_per_L): number {
  const a = background.components.map((c, i) => {
    const v = c.specific_uv254_per_m_per_mg_per_L;
    if (typeof v !== 'number') throw new InputError('the background has no UV254 fit; expected specific_uv254_per_m_per_mg_per_L on every component (fractionate an isotherm with a UV254 column)', { path: `components[${i}].specific_uv254_per_m_per_mg_per_L` });
    return v;
  });
  const c = componentConcentrations(background, doseMgPerL, doc0MgPerL);
  return a.reduce((s, ai, i) => s + ai * c[i]!, 0);
}

/** Fractional UV254 reduction 1 − UV254(D)/UV254(0) at a dose (mg/L). */
export function predictUv254Reduction(background: BackgroundFile, doseMgPerL: number, doc0MgPerL: number = background.doc0_mg_per_L): number {
  const u0 = predictUv254(background, 0, doc0MgPerL);
  if (!(u0 > 0)) return 0;
  return 1 - predictUv254(background, doseMgPerL, doc0MgPerL) / u0;
}
