/**
 * Step 2 of the job: calibrate each compound that has jar tests (capabilities 6–7) with
 * src/calibration on the reference carbon (the compound's own single-solute isotherm):
 *   - "fictive-k": a factor on the target's K beside the fractionated DOC (Schideman et al. 2006;
 *     Worch 2010; both from memory), applied on every carbon;
 *   - "ebc" / "sebc": an equivalent background compound (Najm, Snoeyink & Richard 1991; Qi et al.
 *     2007, from memory) whose concentration is proportional to DOC (Zietzschmann et al. 2016).
 * The jar tests' DOC comes from their DOC column; without one, the site's design DOC is assumed
 * (and said so in a warning).
 */
import type { CsvTable } from '../tables/csvTable.js';
import { calibrate, type CalibrationResult, type CalibrateOptions } from '../calibration/calibrate.js';
import type { CalibrationModelName, ProjectSpec } from '../project/projectTypes.js';
import type { BackgroundStep } from './backgroundStep.js';

export interface CompoundCalibration {
  compoundId: string;
  model: CalibrationModelName;
  /** Factor on the target's K (model fictive-k). */
  targetKFactor?: number;
  /** The EBC on the reference carbon at the jar tests' DOC (models ebc, sebc). */
  ebc?: { K: number; oneOverN: number; c0MgPerL: number; docMgPerL: number };
  /** The calibration result as `sorbshare calibrate --json` prints it. */
  result: CalibrationResult;
  warnings: string[];
}

/**
 * @throws InputError on bad jar-test data; ComputationError when a fit does not converge
 */
export function calibrationStep(project: ProjectSpec, jarTests: Record<string, CsvTable>, bg: BackgroundStep): CompoundCalibration[] {
  const out: CompoundCalibration[] = [];
  for (const comp of project.compounds) {
    if (!comp.jarTests) continue;
    const table = jarTests[comp.id];
    if (!table) continue;
    const warnings: string[] = [];
    const options: CalibrateOptions = {
      model: comp.jarTests.model,
      compound: { id: comp.id, c0MgPerL: 0, K: comp.K, oneOverN: comp.oneOverN },
    };
    if (table.file !== undefined) options.file = table.file;
    if (!table.columns.doc) {
      options.docMgPerL = project.site.docMgPerL;
      warnings.push(`the jar tests have no DOC column; they are taken to be at the site's design DOC of ${project.site.docMgPerL} mg/L`);
    }
    if (comp.jarTests.model === 'fictive-k') options.background = bg.background;
    const result = calibrate(table, options);
    warnings.push(...result.warnings);
    const cal: CompoundCalibration = { compoundId: comp.id, model: comp.jarTests.model, result, warnings };
    if (comp.jarTests.model === 'fictive-k') cal.targetKFactor = result.parameters.K_factor!;
    else if (result.ebc_component) {
      const e = result.ebc_component;
      cal.ebc = { K: e.K, oneOverN: e.one_over_n, c0MgPerL: e.c0_mg_per_L, docMgPerL: result.doc_mg_per_L ?? project.site.docMgPerL };
    }
    out.push(cal);
  }
  return out;
}
