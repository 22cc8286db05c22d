/**
 * The `gac` object of a GAC carbon in `run --json` and the `gac_kinetic` record of run.json.
 * With fixed-bed inputs ("kinetics") the headline is the kinetic run length of the staggered
 * filters with the equilibrium estimate beside it as a reference (`upper_bound: false`: the run
 * length is the model's estimate, not a bound); without them the equilibrium estimate alone
 * (`upper_bound: true`, the documented key; the text calls it a reference, GAC_UPPER_BOUND_CAUTION).
 * Presentation only: every number comes from gacStep and gacKineticStep.
 */
import type { CarbonResult } from '../pipeline/pipelineTypes.js';
import { GAC_NOT_SAMPLED } from '../pipeline/gacUncertainty.js';

export type GacSummaryJson =
  | { governing_compound: string; bed_volumes: number; life_days: number | null; carbon_usage_g_per_m3: number; upper_bound: true }
  | {
    run_bed_volumes: number | null; run_days: number | null; carbon_usage_g_per_m3: number | null; governed_by: string;
    filters: number; at_curve_end: boolean; simulated_bed_volumes: number;
    equilibrium_bed_volumes: number; equilibrium_governing_compound: string; upper_bound: false;
    /** Monte Carlo draws of the GAC run length (0 when the Monte Carlo is off or uncertainty.gac_draws is 0). */
    monte_carlo_draws: number;
    /** P10 and P90 of the run length over the draws (null without draws). */
    run_bed_volumes_p10: number | null; run_bed_volumes_p90: number | null;
  };

/** The `gac` object of `run --json` (null for PAC carbons). */
export function gacSummaryJson(c: CarbonResult): GacSummaryJson | null {
  if (!c.gac) return null;
  const g = c.gac.governing;
  const k = c.gacKinetic;
  const runQ = c.gacUncertainty?.quantities.find((q) => q.key === 'run_bed_volumes');
  if (!k) return { governing_compound: g.id, bed_volumes: g.bedVolumes, life_days: g.lifeDays ?? null, carbon_usage_g_per_m3: g.carbonUsageGPerM3, upper_bound: true };
  return {
    run_bed_volumes: k.run.runBedVolumes, run_days: k.use?.filterLifeDays ?? null, carbon_usage_g_per_m3: k.use?.carbonUsageGPerM3 ?? null, governed_by: k.run.governedBy,
    filters: k.filters, at_curve_end: k.run.atCurveEnd, simulated_bed_volumes: k.toBedVolumes,
    equilibrium_bed_volumes: k.equilibriumBedVolumes, equilibrium_governing_compound: g.id, upper_bound: false, monte_carlo_draws: c.gacUncertainty?.draws ?? 0,
    run_bed_volumes_p10: runQ?.p10 ?? null, run_bed_volumes_p90: runQ?.p90 ?? null,
  };
}

/** run.json's record of the kinetic run: the summary, the goals, each compound's run length and the simulation's checks. */
export function gacKineticRecord(c: CarbonResult): Record<string, unknown> | null {
  const k = c.gacKinetic;
  if (!k) return null;
  const s = k.simulation;
  return {
    summary: gacSummaryJson(c),
    allowed_c_over_c0: k.goals,
    compounds: k.run.compounds.map((x) => ({ id: x.id, allowed_c_over_c0: x.maxCOverC0, run_bed_volumes: x.bedVolumes, at_curve_end: x.atCurveEnd })),
    indicator: k.run.indicator ? { run_bed_volumes: k.run.indicator.bedVolumes, at_curve_end: k.run.indicator.atCurveEnd } : null,
    carbon_use: k.use ? { carbon_usage_g_per_m3: k.use.carbonUsageGPerM3, filter_life_days: k.use.filterLifeDays ?? null, yearly_carbon_kg: k.use.yearlyCarbonKg ?? null, yearly_cost: k.use.yearlyCost ?? null, cost_per_m3: k.use.costPerM3 ?? null } : null,
    breakthrough: s.components.map((x) => ({ id: x.id, c0_mg_per_L: x.c0MgPerL, trace: x.trace, breakthrough: x.breakthrough.map((b) => ({ c_over_c0: b.cOverC0, bed_volumes: b.bedVolumes })), run_averaged_removal: x.runAveragedRemoval, mass_balance_error: x.massBalanceError })),
    curves: { bed_volumes: s.bedVolumes, c_over_c0: Object.fromEntries(s.components.map((x) => [x.id, x.cOverC0])), doc_c_over_c0: s.doc?.cOverC0 ?? null, uv254_ratio: s.uv254?.ratio ?? null },
    mass_balance_error: s.massBalanceError,
    grid: { cells: s.grid.cells, interior_points: s.grid.interiorPoints },
    films: s.films.map((f) => ({ id: f.id, kf_m_per_s: f.kfMPerS, source: f.source, reynolds: f.reynolds ?? null })),
    integrator: s.stats,
    monte_carlo_draws: c.gacUncertainty?.draws ?? 0,
    monte_carlo: c.gacUncertainty ? {
      draws: c.gacUncertainty.draws, seed: c.gacUncertainty.seed, parameters: c.gacUncertainty.parameters, not_sampled: c.gacUncertainty.notSampled,
      quantities: c.gacUncertainty.quantities.map((q) => ({ key: q.key, label: q.label, unit: q.unit, point_estimate: q.pointEstimate, p10: q.p10, p50: q.p50, p90: q.p90 })),
      at_curve_end_draws: c.gacUncertainty.atCurveEndDraws, no_run_draws: c.gacUncertainty.noRunDraws,
    } : null,
    monte_carlo_note: c.gacUncertainty ? `run length and carbon use sampled over ${c.gacUncertainty.draws} draws; ${GAC_NOT_SAMPLED}` : 'no Monte Carlo of the GAC run length in this run (the Monte Carlo is off or uncertainty.gac_draws is 0)',
  };
}

function sig3(x: number): string {
  return Number(x.toPrecision(3)).toLocaleString('en-US');
}

/** One line of `run`'s text summary for a GAC carbon. */
export function gacSummaryLine(carbon: string, g: GacSummaryJson): string {
  if (g.upper_bound) return `${carbon}: GAC ${sig3(g.bed_volumes)} bed volumes${g.life_days !== null ? ` (${sig3(g.life_days)} days)` : ''} for ${g.governing_compound} — equilibrium estimate (a reference, not a bound)`;
  const run = g.run_bed_volumes === null ? 'no run meets every goal' : `run ${g.at_curve_end ? '≥ ' : ''}${sig3(g.run_bed_volumes)} bed volumes${g.run_days !== null ? ` (${sig3(g.run_days)} days)` : ''}`;
  return `${carbon}: GAC ${run} with ${g.filters} staggered filter(s), governed by ${g.governed_by} (fixed-bed model)${g.run_bed_volumes_p10 !== null && g.run_bed_volumes_p90 !== null ? `, P10–P90 ${sig3(g.run_bed_volumes_p10)}–${sig3(g.run_bed_volumes_p90)} bed volumes (${g.monte_carlo_draws} draws)` : ''}; equilibrium reference ${sig3(g.equilibrium_bed_volumes)} bed volumes for ${g.equilibrium_governing_compound}`;
}
