/**
 * The report's account of each carbon's background (capability 21): which background each carbon
 * uses (its own fractionated DOC isotherm or background file, or the K factor on the reference
 * carbon's background), and the fictive components of every carbon with its own. Shown in the
 * background section when at least one carbon has its own background.
 */
import type { PipelineResult } from '../pipeline/pipelineTypes.js';
import type { ReportTable } from './reportModel.js';
import { fmtNumber as fn } from './formatting.js';

/** Paragraphs, tables and warnings for the background section; empty when no carbon has its own background. */
export function carbonBackgroundParts(r: PipelineResult): { paragraphs: string[]; tables: ReportTable[]; warnings: string[] } {
  const own = r.carbons.filter((c) => c.background && c.background.source !== 'K factor');
  if (own.length === 0) return { paragraphs: [], tables: [], warnings: [] };
  const paragraphs = [
    "Background per carbon: a carbon with its own DOC (and UV254) isotherm competes with its own fictive components, fractionated for it; every other carbon uses the project's background with its K factor on every background K. Competition, doses, DOC/UV254 set-points and the Monte Carlo of each carbon use its own background. A target-K factor calibrated to jar tests was fitted beside the project's background and is applied unchanged on a carbon with its own (an assumption).",
  ];
  const tables: ReportTable[] = [{
    caption: 'Background of each carbon',
    columns: ['carbon', 'type', 'background', 'factor on the background K'],
    rows: r.carbons.map((c) => [c.carbon.name, c.carbon.type, c.background ? c.background.description : '—', c.background ? fn(c.background.backgroundKFactor, 4) : '—']),
  }];
  for (const c of own) {
    const b = c.background!.background!;
    tables.push({
      caption: `Fictive components of ${c.carbon.name} (its own, at DOC0 = ${fn(b.doc0_mg_per_L, 3)} mg/L; fit RMSE ${fn(b.fit.rmse_mg_per_L, 3)} mg/L over ${b.fit.points} points)`,
      columns: ['component', 'K ((mg/g)/(mg/L)^(1/n))', '1/n', 'share of DOC', 'c0 (mg/L)', 'specific UV254 (1/m per mg/L)'],
      rows: b.components.map((x) => [x.id, x.K === 0 ? '0 (non-adsorbable)' : fn(x.K, 4), x.K === 0 ? '—' : fn(x.one_over_n, 3), `${fn(x.fraction * 100, 4)} %`, fn(x.c0_mg_per_L, 3), x.specific_uv254_per_m_per_mg_per_L === undefined ? '—' : fn(x.specific_uv254_per_m_per_mg_per_L, 4)]),
    });
  }
  const warnings = own.flatMap((c) => c.background!.warnings.map((w) => `${c.carbon.name}: ${w}`));
  return { paragraphs, tables, warnings };
}
