/**
 * The kinetic calibration of a PAC carbon (src/pipeline/kineticCalibrationStep.ts) in the run's
 * outputs: the run.json entry, the rows of kinetic_calibration.csv and the report's
 * measured-against-fitted figure. Presentation only: every value comes from the fits.
 */
import type { CarbonKineticCalibration, KineticFit } from '../pipeline/kineticCalibrationStep.js';
import type { PipelineResult } from '../pipeline/pipelineTypes.js';
import type { ReportSection, XYPlotSpec } from './reportModel.js';
import { fmtNumber as fn } from './formatting.js';
import { toCsv } from './outputTables.js';

/** The run.json `kinetic_calibration` entry of one carbon. */
export function kineticCalibrationRecord(k: CarbonKineticCalibration): Array<Record<string, unknown>> {
  return k.fits.map((f) => ({
    parameter: f.parameter, compound: f.compoundId, model: f.model, file: f.file ?? null,
    given_m2_per_s: f.givenM2PerS ?? null, fitted_m2_per_s: f.result.parameters.Ds_m2_per_s, ci95_m2_per_s: f.result.ci95.Ds_m2_per_s,
    result: f.result, warnings: f.warnings,
  }));
}

/** kinetic_calibration.csv: one row per fitted diffusivity (header only when there is none). */
export function kineticCalibrationCsv(r: PipelineResult): string {
  const rows = r.carbons.flatMap((cr) => (cr.kineticCalibration?.fits ?? []).map((f) => {
    const ci = f.result.ci95.Ds_m2_per_s;
    return [cr.carbon.name, f.parameter, f.compoundId, f.model, f.result.parameters.Ds_m2_per_s, ci ? ci[0] : null, ci ? ci[1] : null, f.givenM2PerS ?? null, f.result.fit.rmse, f.result.fit.points, f.file ?? '', f.warnings.join(' | ')];
  }));
  return toCsv(['carbon', 'parameter', 'compound', 'model', 'fitted Ds (m2/s)', 'Ds 95 % lower (m2/s)', 'Ds 95 % upper (m2/s)', 'given Ds replaced (m2/s)', 'RMSE of ln c', 'points', 'file', 'warnings'], rows);
}

/** The fitted diffusivities as rows of the report's calibration table. */
export function kineticCalibrationRows(r: PipelineResult): string[][] {
  return r.carbons.flatMap((cr) => (cr.kineticCalibration?.fits ?? []).map((f) => {
    const ci = f.result.ci95.Ds_m2_per_s;
    return [cr.carbon.name, f.parameter === 'doc_Ds' ? 'DOC components (doc_Ds)' : f.compoundId, f.model, f.result.parameters.Ds_m2_per_s.toExponential(3), ci ? `${ci[0].toExponential(3)}–${ci[1].toExponential(3)}` : '—', f.givenM2PerS !== undefined ? f.givenM2PerS.toExponential(3) : '—', fn(f.result.fit.rmse, 3), String(f.result.fit.points)];
  }));
}

/** Measured against fitted concentration of one kinetic fit (log axes, 1:1 line); DOC in mg/L, targets in ng/L. */
export function kineticCalibrationPlot(carbonName: string, f: KineticFit, id: string): XYPlotSpec | undefined {
  const scale = f.parameter === 'doc_Ds' ? 1 : 1e6;
  const unit = f.parameter === 'doc_Ds' ? 'mg/L' : 'ng/L';
  const pts = f.result.table.filter((x) => x.c_measured_mg_per_L > 0 && x.c_predicted_mg_per_L > 0).map((x) => [x.c_measured_mg_per_L * scale, x.c_predicted_mg_per_L * scale] as [number, number]);
  if (pts.length === 0) return undefined;
  const all = pts.flat();
  const lo = Math.min(...all) / 1.1;
  const hi = Math.max(...all) * 1.1;
  const ci = f.result.ci95.Ds_m2_per_s;
  const what = f.parameter === 'doc_Ds' ? 'DOC' : f.compoundId;
  return {
    kind: 'xy', id,
    title: `Kinetic jar tests of ${what} on ${carbonName}, measured against fitted concentration (model ${f.model}; Ds = ${f.result.parameters.Ds_m2_per_s.toExponential(3)} m2/s${ci ? ` (95 % interval ${ci[0].toExponential(3)}–${ci[1].toExponential(3)})` : ''}; RMSE of ln c ${fn(f.result.fit.rmse, 3)} over ${f.result.fit.points} points)`,
    xLabel: `measured ${what} after the contact time (${unit})`, yLabel: `fitted ${what} (${unit})`, xLog: true, yLog: true,
    series: [
      { name: 'measured = fitted', points: [[lo, lo], [hi, hi]], style: 'dashed', key: 'reference' },
      { name: what, ...(f.parameter === 'Ds' ? { key: f.compoundId } : {}), points: pts, style: 'points' },
    ],
  };
}

/**
 * The report's calibration section with the kinetic fits added (their table, the
 * measured-against-fitted figures and warnings); the section is created when only kinetic fits exist.
 */
export function withKineticCalibration(section: ReportSection | undefined, r: PipelineResult): ReportSection | undefined {
  const rows = kineticCalibrationRows(r);
  if (rows.length === 0) return section;
  const sec: ReportSection = section ?? { id: 'calibration', heading: 'Calibration to jar tests', paragraphs: [], tables: [], plots: [], warnings: [] };
  let n = 0;
  const plots = r.carbons.flatMap((cr) => (cr.kineticCalibration?.fits ?? []).flatMap((f) => kineticCalibrationPlot(cr.carbon.name, f, `kinetic-calibration-${++n}`) ?? []));
  return {
    ...sec,
    heading: section ? 'Calibration to jar tests and kinetic jar tests' : 'Calibration to kinetic jar tests',
    paragraphs: [...(sec.paragraphs ?? []), 'Surface diffusivities fitted to kinetic jar tests (concentration against time at known doses) with the PAC batch model: homogeneous surface diffusion in the particle with film transfer (kf = DL/R, Sh = 2, common practice) and IAST at the particle surface (Crittenden & Weber 1978; Radke & Prausnitz 1972), least squares on ln c with a 95 % interval from the Jacobian. The fitted values replace the ones given for the carbon in every dose under the plant\'s contact conditions; the DOC components\' Ds is fitted first and used in the targets\' fits.'],
    tables: [...(sec.tables ?? []), { caption: 'Fitted surface diffusivities (m2/s)', columns: ['carbon', 'fitted for', 'model', 'Ds (m2/s)', '95 % interval', 'given value replaced', 'RMSE of ln c', 'points'], rows }],
    plots: [...(sec.plots ?? []), ...plots],
    warnings: [...(sec.warnings ?? []), ...r.carbons.flatMap((cr) => (cr.kineticCalibration?.fits ?? []).flatMap((f) => f.warnings.map((w) => `${cr.carbon.name}, ${f.parameter === 'doc_Ds' ? 'doc_Ds' : `Ds of ${f.compoundId}`}: ${w}`)))],
  };
}
