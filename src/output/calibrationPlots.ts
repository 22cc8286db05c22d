/**
 * The calibration figure of one compound: measured against fitted concentration after the jar
 * tests (log axes, 1:1 line), with the fit statistics in the title (RMSE of ln c, points,
 * parameters). Presentation only: every value comes from the calibration result.
 */
import type { XYPlotSpec } from './reportModel.js';
import type { CompoundCalibration } from '../pipeline/calibrationStep.js';
import { fmtNumber as fn } from './formatting.js';

export function calibrationPlot(c: CompoundCalibration, index: number): XYPlotSpec | undefined {
  const rows = c.result.table;
  const pts = rows.filter((x) => x.c_measured_mg_per_L > 0 && x.c_predicted_mg_per_L > 0).map((x) => [x.c_measured_mg_per_L * 1e6, x.c_predicted_mg_per_L * 1e6] as [number, number]);
  if (pts.length === 0) return undefined;
  const all = pts.flat();
  const lo = Math.min(...all) / 1.4;
  const hi = Math.max(...all) * 1.4;
  const f = c.result.fit;
  const params = Object.entries(c.result.parameters).map(([k, v]) => {
    const ci = c.result.ci95[k];
    return `${k} = ${fn(v, 3)}${ci ? ` (95 % interval ${fn(ci[0], 3)}–${fn(ci[1], 3)})` : ''}`;
  });
  return {
    kind: 'xy', id: `calibration-${index + 1}`,
    title: `Jar tests of ${c.compoundId}, measured against fitted concentration (model ${c.model}; ${params.join(', ')}; RMSE of ln c ${fn(f.rmse, 3)} over ${f.points} points, ${f.parameters} parameter${f.parameters === 1 ? '' : 's'})`,
    xLabel: 'measured c after the jar test (ng/L)', yLabel: 'fitted c (ng/L)', xLog: true, yLog: true,
    series: [
      { name: 'measured = fitted', points: [[lo, lo], [hi, hi]], style: 'dashed', key: 'reference' },
      { name: c.compoundId, key: c.compoundId, points: pts, style: 'points' },
    ],
  };
}
