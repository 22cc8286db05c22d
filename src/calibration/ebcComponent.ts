/**
 * The calibrated equivalent background compound as a Freundlich component, scaled to a DOC.
 *
 * C0_EBC scales with DOC: c0 = C0_EBC · DOC/DOC_ref (Zietzschmann et al. 2016, Water Research
 * 102:190: C0_EBC correlated with DOC across effluents). K in (mg/g)/(mg/L)^(1/n), c0 in mg/L.
 * @throws InputError when the calibration is not an EBC model, or a DOC is asked for but the
 *   calibration has no reference DOC
 */
import { InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import type { CalibrationResult } from './calibrate.js';

export function ebcComponent(calibration: CalibrationResult, docMgPerL?: number): FreundlichComponent {
  const e = calibration.ebc_component;
  if (!e || (calibration.model !== 'ebc' && calibration.model !== 'sebc')) throw new InputError(`the calibration is of model "${calibration.model}"; expected ebc or sebc for an EBC component`, { path: 'model' });
  let c0 = e.c0_mg_per_L;
  if (docMgPerL !== undefined) {
    if (!(docMgPerL >= 0) || !Number.isFinite(docMgPerL)) throw new InputError(`expected a DOC ≥ 0 mg/L, got ${docMgPerL}`, { path: 'doc' });
    if (calibration.doc_mg_per_L === null) throw new InputError('the calibration has no reference DOC, so C0_EBC cannot be scaled; calibrate with --doc or a DOC column', { path: 'doc_mg_per_L' });
    c0 = (e.c0_mg_per_L * docMgPerL) / calibration.doc_mg_per_L;
  }
  return { id: e.id, c0MgPerL: c0, K: e.K, oneOverN: e.one_over_n };
}
