/**
 * Rows of the report's calibration table for the compounds that take a transferred calibration
 * (project key calibration_transfer): the compound, "transferred from …" in the model column and
 * the transferred target-K factor or EBC concentration per mg DOC. Presentation only.
 */
import type { PipelineResult } from '../pipeline/pipelineTypes.js';

export function transferRows(r: PipelineResult, fn: (x: number, sig: number) => string): string[][] {
  const t = r.calibrationTransfer;
  if (!t) return [];
  return t.toIds.map((id) => [
    id, t.label,
    t.targetKFactor !== undefined ? fn(t.targetKFactor, 4) : '—',
    t.ebcC0PerDoc !== undefined ? 'own K' : '—', t.ebcC0PerDoc !== undefined ? 'own 1/n' : '—',
    t.ebcC0PerDoc !== undefined ? `${fn(t.ebcC0PerDoc * r.project.site.docMgPerL, 4)}` : '—',
    t.ebcC0PerDoc !== undefined ? fn(r.project.site.docMgPerL, 3) : '—',
  ]);
}
