/**
 * The optional "calibration_transfer" entry of a project file (capability 21): how compounds
 * without jar tests take the site's correction from the compounds with jar tests.
 *
 *   "calibration_transfer": "none"   (default) untested compounds keep their single-solute K;
 *   "calibration_transfer": "mean"   the geometric mean of the calibrated corrections;
 *   "calibration_transfer": "CBZ"    the correction of one named calibrated compound.
 *
 * The corrections must be of one kind to be averaged: target-K factors (model "fictive-k") or
 * equivalent background compounds (models "ebc", "sebc"); src/pipeline/calibrationTransferStep.ts
 * applies them.
 * @throws InputError naming `calibration_transfer` and what was expected
 */
import { InputError } from '../core/errors.js';
import { describeValue } from '../scenario/jsonChecks.js';
import type { CalibrationTransferSpec, CompoundSpec } from './projectTypes.js';

export function readCalibrationTransfer(raw: unknown, compounds: readonly CompoundSpec[]): CalibrationTransferSpec {
  const p = 'calibration_transfer';
  const calibrated = compounds.filter((c) => c.jarTests);
  const ids = calibrated.map((c) => `"${c.id}"`).join(', ');
  if (typeof raw !== 'string' || raw.trim() === '') {
    throw new InputError(`expected "none", "mean" or the id of a compound with jar tests${ids ? ` (${ids})` : ''}, got ${describeValue(raw)}`, { path: p });
  }
  if (raw === 'none') return { kind: 'none' };
  if (calibrated.length === 0) throw new InputError(`"${raw}" needs at least one compound with "jar_tests"; none has any (use "none" or leave the key out)`, { path: p });
  if (raw === 'mean') {
    if (compounds.some((c) => c.id === 'mean' && c.jarTests)) throw new InputError('"mean" is both the keyword and a compound id; rename the compound', { path: p });
    const kinds = new Set(calibrated.map((c) => (c.jarTests!.model === 'fictive-k' ? 'target-K factor' : 'EBC')));
    if (kinds.size > 1) throw new InputError(`the calibrated compounds mix target-K factors (model "fictive-k") and EBCs (models "ebc", "sebc"), which cannot be averaged; name one compound instead: one of ${ids}`, { path: p });
    return { kind: 'mean' };
  }
  const comp = compounds.find((c) => c.id === raw);
  if (!comp) throw new InputError(`"${raw}" is not "none", "mean" or a compound id; expected one of "none", "mean", ${ids}`, { path: p });
  if (!comp.jarTests) throw new InputError(`compound "${raw}" has no jar tests to transfer; expected one of ${ids}`, { path: p });
  return { kind: 'compound', compoundId: raw };
}
