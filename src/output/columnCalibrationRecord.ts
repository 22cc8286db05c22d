/**
 * The column calibration of a GAC carbon (src/pipeline/columnCalibrationStep.ts) in the run's
 * outputs: the run.json entry, the rows of column_calibration.csv (written only when a carbon has
 * column tests) and the report's measured-against-fitted breakthrough figure. Presentation only:
 * every value comes from the fits.
 */
import type { CarbonColumnCalibration, ColumnFit } from '../pipeline/columnCalibrationStep.js';
import type { PipelineResult } from '../pipeline/pipelineTypes.js';
import type { ReportSection, XYPlotSpec } from './reportModel.js';
import { fmtNumber as fn } from './formatting.js';
import { toCsv } from './outputTables.js';

/** The run.json `column_calibration` entry of one carbon (snake_case keys). */
export function columnCalibrationRecord(c: CarbonColumnCalibration): Array<Record<string, unknown>> {
  return c.fits.map((f) => ({
    parameter: 'Ds', compound: f.compoundId, model: 'column', file: f.test.file,
    test_ebct_s: f.test.ebctS, test_bed_depth_m: f.test.bedDepthM, test_particle_radius_m: f.test.particleRadiusM ?? null, scale_up: f.test.scaleUp ?? null,
    given_m2_per_s: f.givenM2PerS ?? null, fitted_m2_per_s: f.dsM2PerS, ci95_m2_per_s: f.ci95M2PerS,
    result: f.result, warnings: f.warnings,
  }));
}

/** Does any carbon of the run have column tests? (column_calibration.csv is written only then.) */
export function hasColumnCalibration(r: PipelineResult): boolean {
  return r.carbons.some((cr) => (cr.columnCalibration?.fits.length ?? 0) > 0);
}

/** column_calibration.csv: one row per fitted Ds. */
export function columnCalibrationCsv(r: PipelineResult): string {
  const rows = r.carbons.flatMap((cr) => (cr.columnCalibration?.fits ?? []).map((f) => {
    const ci = f.ci95M2PerS;
    const onTest = f.result.ci95.Ds_m2_per_s;
    return [cr.carbon.name, f.compoundId, f.dsM2PerS, ci ? ci[0] : null, ci ? ci[1] : null, f.result.parameters.Ds_m2_per_s, onTest ? onTest[0] : null, onTest ? onTest[1] : null, f.test.scaleUp ?? '', f.givenM2PerS ?? null, f.result.fit.rmse, f.result.fit.points, f.test.file, f.warnings.join(' | ')];
  }));
  return toCsv(['carbon', 'compound', 'Ds of the carbon\'s grains (m2/s)', 'Ds 95 % lower (m2/s)', 'Ds 95 % upper (m2/s)', 'Ds fitted on the test grains (m2/s)', 'test Ds 95 % lower (m2/s)', 'test Ds 95 % upper (m2/s)', 'scale-up', 'given Ds replaced (m2/s)', 'RMSE of c/c0', 'points', 'file', 'warnings'], rows);
}

/** A diffusivity in units of 10⁻¹⁵ m²/s, 4 significant digits (client tables and titles carry no exponent). */
const e15 = (dsM2PerS: number) => fn(dsM2PerS / 1e-15, 4);

function rowsOf(r: PipelineResult): string[][] {
  return r.carbons.flatMap((cr) => (cr.columnCalibration?.fits ?? []).map((f) => {
    const ci = f.ci95M2PerS;
    return [cr.carbon.name, f.compoundId, e15(f.dsM2PerS), ci ? `${e15(ci[0])}–${e15(ci[1])}` : '—', f.test.scaleUp ?? 'same grains', f.givenM2PerS !== undefined ? e15(f.givenM2PerS) : '—', fn(f.result.fit.rmse, 3), String(f.result.fit.points)];
  }));
}

/** Measured and fitted c/c0 against bed volumes of one column test. */
export function columnCalibrationPlot(carbonName: string, f: ColumnFit, id: string): XYPlotSpec {
  const ci = f.ci95M2PerS;
  return {
    kind: 'xy', id,
    title: `Column test of ${f.compoundId} for ${carbonName}, measured and fitted c/c0 (Ds on the test grains ${e15(f.result.parameters.Ds_m2_per_s)}, on the carbon's grains ${e15(f.dsM2PerS)}${ci ? ` (95 % interval ${e15(ci[0])}–${e15(ci[1])})` : ''} × 10⁻¹⁵ m²/s; RMSE ${fn(f.result.fit.rmse, 3)} over ${f.result.fit.points} points)`,
    xLabel: 'bed volumes of the tested column', yLabel: 'c/c0',
    series: [
      { name: `${f.compoundId} fitted`, key: f.compoundId, points: f.result.table.map((x) => [x.bed_volumes, x.c_over_c0_predicted] as [number, number]) },
      { name: `${f.compoundId} measured`, key: f.compoundId, points: f.result.table.map((x) => [x.bed_volumes, x.c_over_c0_measured] as [number, number]), style: 'points' },
    ],
  };
}

/** The report's calibration section with the column fits added; the section is created when only column fits exist. */
export function withColumnCalibration(section: ReportSection | undefined, r: PipelineResult): ReportSection | undefined {
  const rows = rowsOf(r);
  if (rows.length === 0) return section;
  const sec: ReportSection = section ?? { id: 'calibration', heading: 'Calibration to column tests', paragraphs: [], tables: [], plots: [], warnings: [] };
  let n = 0;
  const plots = r.carbons.flatMap((cr) => (cr.columnCalibration?.fits ?? []).map((f) => columnCalibrationPlot(cr.carbon.name, f, `column-calibration-${++n}`)));
  return {
    ...sec,
    heading: section ? `${sec.heading} and column tests` : sec.heading,
    paragraphs: [...(sec.paragraphs ?? []), 'Surface diffusivities of GAC targets fitted to pilot or small-column breakthrough tests with the fixed-bed model: film transfer (Wilson & Geankoplis 1966 unless kf is given), homogeneous surface diffusion in the grains and IAST at the grain surface with the fictive DOC components (Crittenden & Weber 1978; Radke & Prausnitz 1972), least squares on c/c0 with a 95 % interval from the Jacobian. A test on smaller grains is scaled to the carbon\'s grains with constant or proportional diffusivity (Crittenden, Berrigan & Hand 1986). The fitted values replace the ones given for the carbon in its kinetic run length; confirm with a pilot column.'],
    tables: [...(sec.tables ?? []), { caption: 'Surface diffusivities fitted to column tests (10⁻¹⁵ m²/s, on the carbon\'s grains)', columns: ['carbon', 'compound', 'Ds (10⁻¹⁵ m²/s)', '95 % interval (10⁻¹⁵ m²/s)', 'scale-up', 'given value replaced (10⁻¹⁵ m²/s)', 'RMSE of c/c0', 'points'], rows }],
    plots: [...(sec.plots ?? []), ...plots],
    warnings: [...(sec.warnings ?? []), ...r.carbons.flatMap((cr) => (cr.columnCalibration?.fits ?? []).flatMap((f) => f.warnings.map((w) => `${cr.carbon.name}, Ds of ${f.compoundId}: ${w}`)))],
  };
}
