import type { ReportModel } from '../output/reportModel.js';

/** The ids of all plots of the report, in document order. */
export function reportPlotIds(model: ReportModel): string[] {
  return model.sections.flatMap((s) => (s.plots ?? []).map((p) => p.id));
}
