/**
 * Every output file of a run as text, keyed by file name, ready for writeOutputDir (outputs are
 * written whole or not at all).
 */
import { renderHtmlReport } from '../report/htmlReport.js';
import { renderMarkdownSummary } from '../report/markdownSummary.js';
import { buildReportModel } from '../output/buildReportModel.js';
import { carbonsCsv, compoundsCsv, dailyDosesCsv, indicatorsCsv, removalCurvesCsv } from '../output/outputTables.js';
import { gacCsv, pilotCheckCsv, setpointsCsv, surrogatesCsv, uncertaintyCsv } from '../output/surrogateGacUncertaintyTables.js';
import { runRecordSource, type RunEnvironment } from '../output/runRecord.js';
import type { PipelineResult } from '../pipeline/pipelineTypes.js';
import { snakeCaseJsonText } from '../output/snakeCaseJson.js';
import { kineticCalibrationCsv } from '../output/kineticCalibrationRecord.js';
import { columnCalibrationCsv, hasColumnCalibration } from '../output/columnCalibrationRecord.js';

/** Names of the text output files of a run, in the order they are written. */
export const OUTPUT_FILES = [
  'summary.md', 'report.html', 'compounds.csv', 'removal_curves.csv', 'carbons.csv', 'daily_doses.csv', 'indicators.csv',
  'surrogates.csv', 'setpoints.csv', 'pilot_check.csv', 'gac.csv', 'uncertainty.csv', 'kinetic_calibration.csv', 'run.json',
] as const;

/** Output files written only when the run has them (column_calibration.csv: a GAC carbon with column tests). */
export type OptionalOutputFile = 'column_calibration.csv';

/** The CSV tables of a run (the sheets of results.xlsx), keyed by file name in output order. */
export type RunTables = Pick<Record<(typeof OUTPUT_FILES)[number], string>, 'compounds.csv' | 'removal_curves.csv' | 'carbons.csv' | 'daily_doses.csv' | 'indicators.csv' | 'surrogates.csv' | 'setpoints.csv' | 'pilot_check.csv' | 'gac.csv' | 'uncertainty.csv' | 'kinetic_calibration.csv'> & Partial<Record<OptionalOutputFile, string>>;

export function pipelineTables(r: PipelineResult): RunTables {
  return {
    'compounds.csv': compoundsCsv(r),
    'removal_curves.csv': removalCurvesCsv(r),
    'carbons.csv': carbonsCsv(r),
    'daily_doses.csv': dailyDosesCsv(r),
    'indicators.csv': indicatorsCsv(r),
    'surrogates.csv': surrogatesCsv(r),
    'setpoints.csv': setpointsCsv(r),
    'pilot_check.csv': pilotCheckCsv(r),
    'gac.csv': gacCsv(r),
    'uncertainty.csv': uncertaintyCsv(r),
    'kinetic_calibration.csv': kineticCalibrationCsv(r),
    ...(hasColumnCalibration(r) ? { 'column_calibration.csv': columnCalibrationCsv(r) } : {}),
  };
}

/**
 * @param tables the run's CSV tables when the caller has made them already (pipelineTables), so
 *   that it can start on results.xlsx before the report and run.json are made
 */
export function pipelineOutputs(r: PipelineResult, env: RunEnvironment, tables: RunTables = pipelineTables(r)): Record<(typeof OUTPUT_FILES)[number], string> & Partial<Record<OptionalOutputFile, string>> {
  const model = buildReportModel(r, env.toolVersion);
  return {
    'summary.md': renderMarkdownSummary(model),
    'report.html': renderHtmlReport(model),
    ...tables,
    'run.json': snakeCaseJsonText(runRecordSource(r, env)) + '\n', // converted while written (runRecord's object, one pass)
  };
}
