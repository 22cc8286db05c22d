/**
 * run.json: every input resolved to internal units (with the unit in each key), the referenced
 * files with their SHA-256, the tool and Node versions, the date, and all results — enough to
 * reproduce and audit the run. Functions (the systems' background builders) are written out as
 * their components at the design DOC.
 */
import { systemComponents } from '../design/competitionSystem.js';
import type { PipelineResult } from '../pipeline/pipelineTypes.js';
import { CI_TO_SD_NOTE } from '../pipeline/uncertaintyStep.js';
import { gacKineticRecord } from './gacRunJson.js';
import type { ProjectSpec } from '../project/projectTypes.js';
import { contactRecord } from './contactRecord.js';
import { carbonBackgroundInputRecord, carbonBackgroundRecord } from './carbonBackgroundRecord.js';
import { kineticCalibrationRecord } from './kineticCalibrationRecord.js';
import { columnCalibrationRecord } from './columnCalibrationRecord.js';
import { toSnakeCaseJson, userIdMap } from './snakeCaseJson.js';

export interface RunEnvironment {
  toolVersion: string;
  nodeVersion: string;
  platform?: string;
}

function resolvedInputs(p: ProjectSpec): Record<string, unknown> {
  const bg = p.background;
  return {
    name: p.name,
    note: p.note ?? null,
    site: { name: p.site.name, flow_m3_per_d: p.site.flowM3PerD, doc_mg_per_L: p.site.docMgPerL, uv254_per_m: p.site.uv254PerM ?? null, series_file: p.site.seriesFile ?? null },
    background: bg.kind === 'isotherm'
      ? { kind: 'isotherm', file: bg.file, fractionation: { components: bg.options.components ?? null, exponent: bg.options.exponent ?? null, fit_k: bg.options.fitK ?? null } }
      : bg.kind === 'file'
        ? { kind: 'file', file: bg.file }
        : { kind: 'ebc', doc_mg_per_L: bg.docMgPerL, ebc: userIdMap(Object.fromEntries(Object.entries(bg.ebc).map(([id, e]) => [id, { K_mg_per_g_per_mg_per_L_pow_1_over_n: e.K, one_over_n: e.oneOverN, c0_mg_per_L: e.c0MgPerL }]))) },
    carbons: p.carbons.map((c) => ({
      name: c.name, type: c.type, price_per_kg: c.pricePerKg, currency: c.currency, K_factor: c.kFactor,
      isotherms: userIdMap(Object.fromEntries(Object.entries(c.isotherms).map(([id, i]) => [id, { K_mg_per_g_per_mg_per_L_pow_1_over_n: i.K, one_over_n: i.oneOverN }]))),
      bed_density_kg_per_m3: c.bedDensityKgPerM3 ?? null, ebct_min: c.ebctMin ?? null,
      background: c.background ? carbonBackgroundInputRecord(c.background) : null,
    })),
    pilot: p.pilot ? { file: p.pilot.file, band_percent: p.pilot.bandPercent, carbon: p.pilot.carbon ?? null } : null,
    uncertainty: p.uncertainty ? {
      draws: p.uncertainty.draws, seed: p.uncertainty.seed, K_rel_sd: p.uncertainty.KRelSd, one_over_n_rel_sd: p.uncertainty.oneOverNRelSd,
      doc_rel_sd: p.uncertainty.docRelSd, fraction_rel_sd: p.uncertainty.fractionRelSd, background_K_rel_sd: p.uncertainty.backgroundKRelSd,
      ...(p.uncertainty.dsRelSd !== undefined ? { Ds_rel_sd: p.uncertainty.dsRelSd } : {}), ...(p.uncertainty.contactDraws !== undefined ? { contact_draws: p.uncertainty.contactDraws } : {}), ...(p.uncertainty.gacDraws !== undefined ? { gac_draws: p.uncertainty.gacDraws } : {}),
    } : null,
    compounds: p.compounds.map((c) => ({
      id: c.id, name: c.name, K_mg_per_g_per_mg_per_L_pow_1_over_n: c.K, one_over_n: c.oneOverN, c0_mg_per_L: c.c0MgPerL,
      molar_mass_g_per_mol: c.molarMassGPerMol ?? null, jar_tests: c.jarTests ?? null, limit_mg_per_L: c.limitMgPerL ?? null, indicator_category: c.indicatorCategory ?? null,
    })),
    goals: {
      removal_percent: p.goals.removalPercent,
      indicator: p.goals.indicator ? { mean_removal_percent: p.goals.indicator.meanRemovalPercent, compounds: p.goals.indicator.compounds ?? null } : null,
      design_dose_mg_per_L: p.goals.designDoseMgPerL ?? null,
      sweep: { from_mg_per_L: p.goals.sweep.fromMgPerL, to_mg_per_L: p.goals.sweep.toMgPerL, points: p.goals.sweep.points },
    },
  };
}

/** The run record as a plain JSON-ready object, snake_case throughout (src/output/snakeCaseJson.ts). */
export function runRecord(r: PipelineResult, env: RunEnvironment): Record<string, unknown> {
  return toSnakeCaseJson(runRecordSource(r, env)) as Record<string, unknown>;
}

/**
 * The run record before the snake_case conversion (core results still camelCase, user-id maps
 * marked): run.json is `snakeCaseJsonText(runRecordSource(…))`, converted while it is written
 * (no renamed copy of a long series' per-day rows).
 */
export function runRecordSource(r: PipelineResult, env: RunEnvironment): Record<string, unknown> {
  const doc = r.project.site.docMgPerL;
  return {
    tool: { name: 'sorbshare', version: env.toolVersion },
    node: env.nodeVersion,
    platform: env.platform ?? null,
    date: r.generatedAt,
    demo: r.provenance.demo ?? false,
    input_files: r.provenance.files,
    inputs: resolvedInputs(r.project),
    units: { concentration: 'mg/L', dose: 'mg/L', loading: 'mg/g', K: '(mg/g)/(mg/L)^(1/n)', flow: 'm3/d', carbon_mass: 'kg', uv254: '1/m' },
    results: {
      background: { source: r.background.source, background: r.background.background ?? null, warnings: r.background.warnings },
      calibrations: r.calibrations.map((c) => ({ compound: c.compoundId, model: c.model, target_K_factor: c.targetKFactor ?? null, ebc: c.ebc ?? null, result: c.result, warnings: c.warnings })),
      goals: userIdMap(r.goals),
      carbons: r.carbons.map((cr) => ({
        carbon: cr.carbon.name,
        type: cr.carbon.type,
        background: cr.background ? carbonBackgroundRecord(cr.background) : null,
        systems_at_design_doc: cr.systems.map((s) => ({
          compound: s.compoundId, competition: s.competition, description: s.description,
          single: s.single, in_mixture: s.inMixture,
          components: systemComponents(s, doc).map((c) => ({ id: c.id, c0_mg_per_L: c.c0MgPerL, K: c.K, one_over_n: c.oneOverN })),
        })),
        required_dose: cr.required ?? null,
        design_dose_mg_per_L: cr.designDoseMgPerL ?? null,
        design_dose_source: cr.designDoseSource ?? null,
        reduced_loadings: cr.reducedLoadings ?? null,
        indicator_check: cr.indicator ?? null,
        cost_per_m3: cr.costPerM3 ?? null,
        carbon_kg_per_d_at_design_flow: cr.carbonKgPerDAtDesign ?? null,
        yearly: cr.yearly ?? null,
        daily_summary: cr.daily ? {
          days: cr.daily.rows.length, days_with_dose: cr.daily.daysWithDose, annualised: cr.daily.annualised, dose_table: { doc_nodes_mg_per_L: cr.daily.table.docMgPerL, midpoint_error_rel: cr.daily.table.midpointErrorRel, tolerance_rel: cr.daily.table.toleranceRel },
          total_carbon_kg: cr.daily.totalCarbonKg, total_cost: cr.daily.totalCost, dose_mg_per_L: cr.daily.dose, carbon_kg_per_d: cr.daily.carbonKgPerD,
        } : null,
        daily: cr.daily?.rows ?? null,
        removal_curves: cr.curves ?? null,
        surrogates: cr.surrogates ? {
          has_uv254: cr.surrogates.hasUv254,
          background_at_design_doc: cr.surrogates.model,
          curve: cr.surrogates.curve,
          set_points: cr.surrogates.setPoints,
          governing_set_point: cr.surrogates.governing ?? null,
          at_required_dose: cr.surrogates.atRequiredDose ?? null,
        } : null,
        gac: cr.gac ?? null,
        ...(cr.contact ? { contact: contactRecord(cr) } : {}),
        ...(cr.kineticCalibration ? { kinetic_calibration: kineticCalibrationRecord(cr.kineticCalibration) } : {}),
        ...(cr.columnCalibration ? { column_calibration: columnCalibrationRecord(cr.columnCalibration) } : {}),
        gac_kinetic: gacKineticRecord(cr),
        monte_carlo: cr.uncertainty ? {
          parameters: cr.uncertainty.parameters, excluded: cr.uncertainty.excluded, ci_to_sd: CI_TO_SD_NOTE,
          result: cr.uncertainty.result, governing_removal_band: cr.uncertainty.governingCurve ?? null, governing_dose_ratio: cr.uncertainty.governingDoseRatio ?? null,
          problem: cr.uncertainty.problem,
        } : null,
        warnings: cr.warnings,
      })),
      pilot_check: r.pilot ? { carbon: r.pilot.carbonName, file: r.pilot.file ?? null, band_percent: r.pilot.bandPercent, relation_model: r.pilot.relationModel, check: r.pilot.check } : null,
      monte_carlo_settings: r.uncertainty ?? null,
      warnings: r.warnings,
    },
    timing_ms: userIdMap(r.timingMs),
  };
}
