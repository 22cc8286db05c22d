/**
 * Transfer of the site's jar-test calibration to the compounds without jar tests
 * (capability 21; project key "calibration_transfer").
 *
 *   - target-K factors (model "fictive-k"): the transferred factor is the named compound's factor,
 *     or the geometric mean of all calibrated factors, f = (Π f_i)^(1/m) (factors are ratios, so
 *     they are averaged on a log scale; common practice);
 *   - EBCs (models "ebc", "sebc"): the transferred EBC concentration per mg DOC is the named
 *     compound's c0_EBC/DOC, or the geometric mean of those ratios; it is applied through the
 *     simplified-EBC rule (the EBC takes the receiving compound's own isotherm on each carbon,
 *     Qi et al. 2007, from memory), and scales with DOC like every EBC (Zietzschmann et al. 2016).
 *
 * A transferred correction is an assumption (the untested compound is taken to compete like the
 * tested ones); every table and the report flag it "transferred from …".
 * @throws InputError when the project asks for a transfer that the calibrations cannot give
 */
import { InputError } from '../core/errors.js';
import type { CalibrationTransferSpec } from '../project/projectTypes.js';
import type { CompoundCalibration } from './calibrationStep.js';

export interface TransferredCalibration {
  /** Ids of the calibrated compounds the correction comes from. */
  fromIds: string[];
  /** Ids of the compounds without jar tests that take it (project order). */
  toIds: string[];
  /** "transferred from CBZ" or "transferred from the geometric mean of CBZ, MET". */
  label: string;
  /** Factor on the untested compound's K beside the fictive DOC components. */
  targetKFactor?: number;
  /** EBC concentration per mg/L DOC (mg/L per mg/L), applied with the compound's own isotherm. */
  ebcC0PerDoc?: number;
}

function geometricMean(xs: readonly number[]): number {
  return Math.exp(xs.reduce((s, x) => s + Math.log(x), 0) / xs.length);
}

/** The correction every untested compound takes, or undefined for "none". */
export function calibrationTransfer(spec: CalibrationTransferSpec | undefined, calibrations: readonly CompoundCalibration[], compoundIds: readonly string[]): TransferredCalibration | undefined {
  if (!spec || spec.kind === 'none') return undefined;
  const sources = spec.kind === 'mean' ? calibrations.slice() : calibrations.filter((c) => c.compoundId === spec.compoundId);
  if (sources.length === 0) throw new InputError('no calibrated compound to transfer from', { path: 'calibration_transfer' });
  const fromIds = sources.map((c) => c.compoundId);
  const toIds = compoundIds.filter((id) => !calibrations.some((c) => c.compoundId === id));
  const label = spec.kind === 'mean' && sources.length > 1 ? `transferred from the geometric mean of ${fromIds.join(', ')}` : `transferred from ${fromIds[0]}`;
  if (sources.every((c) => c.targetKFactor !== undefined)) return { fromIds, toIds, label, targetKFactor: geometricMean(sources.map((c) => c.targetKFactor!)) };
  if (sources.every((c) => c.ebc !== undefined)) return { fromIds, toIds, label, ebcC0PerDoc: geometricMean(sources.map((c) => c.ebc!.c0MgPerL / c.ebc!.docMgPerL)) };
  throw new InputError('the calibrated compounds mix target-K factors and EBCs, which cannot be averaged; name one compound', { path: 'calibration_transfer' });
}

/** The run's note on a transfer, for the warnings and the report. */
export function transferNote(t: TransferredCalibration): string {
  const what = t.targetKFactor !== undefined ? `target-K factor ${Number(t.targetKFactor.toPrecision(4))}` : `EBC of ${Number(t.ebcC0PerDoc!.toPrecision(4))} mg/L per mg/L DOC (simplified-EBC rule)`;
  return t.toIds.length === 0
    ? `calibration transfer: every compound has its own jar tests; nothing is transferred`
    : `calibration ${t.label}: ${what} applied to ${t.toIds.join(', ')}, which have no jar tests of their own (an assumption: confirm with jar tests of those compounds)`;
}
