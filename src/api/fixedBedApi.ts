/**
 * `column`: the fixed-bed breakthrough of a mixture file's components — the library entry point
 * behind `sorbshare column`; returns exactly what `--json` prints:
 *
 *   { "bed_volumes": [ … ], "components": [ { "id", "c_over_c0": [ … ], "breakthrough":
 *     [ { "c_over_c0": 0.1, "bed_volumes": N or null }, … ], "run_averaged_removal",
 *     "mass_balance_error", "trace" } ], "mass_balance_error", "bed", "grid", "films", "warnings" }
 *
 * The mixture is a mixture file read with its kinetic keys (carbon.particle_radius,
 * carbon.particle_density; per component Ds and DL or kf), in internal units. Model and units:
 * src/kinetics/fixedBed.ts. Trace components (below 1e-3 of the adsorbable feed) are integrated
 * each on its own against the background solved once (the trace shortcut, `storedBackground`),
 * as the project run does; equal to the coupled solve within the integrator's tolerances
 * (tests/kinetics/fixedBedTrace.test.ts).
 * @throws InputError naming the JSON path (carbon.particle_radius, components[i].Ds, …) or the
 *   argument (ebctS, bedDepthM, porosity, toBedVolumes); ComputationError when the model fails
 */
import { InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { DEFAULT_BREAKTHROUGH_LEVELS, simulateFixedBed, type FixedBedOptions } from '../kinetics/fixedBed.js';
import type { FixedBedComponent } from '../kinetics/fixedBedInput.js';

/** A mixture with kinetic inputs (internal units), as read from a mixture file. */
export interface ColumnMixture {
  components: ReadonlyArray<FreundlichComponent & { dsM2PerS?: number; dlM2PerS?: number; kfMPerS?: number }>;
  particle?: { radiusM: number; densityGPerL: number };
}

export interface ColumnOptions {
  ebctS: number;
  bedDepthM: number;
  porosity: number;
  toBedVolumes: number;
  temperatureC?: number;
  points?: number;
  levels?: readonly number[];
  grid?: { cells: number; interiorPoints: number };
}

export interface ColumnJson {
  bed_volumes: number[];
  components: Array<{
    id: string;
    c0_mg_per_L: number;
    c_over_c0: number[];
    breakthrough: Array<{ c_over_c0: number; bed_volumes: number | null }>;
    run_averaged_removal: number;
    mass_balance_error: number;
    trace: boolean;
  }>;
  mass_balance_error: number;
  bed: { ebct_s: number; bed_depth_m: number; porosity: number; particle_radius_m: number; particle_density_kg_per_m3: number; bed_density_kg_per_m3: number; temperature_c: number };
  grid: { cells: number; interior_points: number };
  films: Array<{ id: string; kf_m_per_s: number; source: string; reynolds?: number }>;
  warnings: string[];
}

/** Breakthrough of every component of `mixture` in a bed of `options`; see the file comment. */
export function column(mixture: ColumnMixture, options: ColumnOptions): ColumnJson {
  const p = mixture.particle;
  if (!p) throw new InputError('missing the carbon grains; expected "carbon": { "particle_radius": "0.5 mm", "particle_density": "750 kg/m3" }', { path: 'carbon' });
  const components: FixedBedComponent[] = mixture.components.map((c) => {
    const out: FixedBedComponent = { id: c.id, c0MgPerL: c.c0MgPerL, K: c.K, oneOverN: c.oneOverN };
    if (c.dsM2PerS !== undefined) out.dsM2PerS = c.dsM2PerS;
    if (c.dlM2PerS !== undefined) out.dlM2PerS = c.dlM2PerS;
    if (c.kfMPerS !== undefined) out.kfMPerS = c.kfMPerS;
    return out;
  });
  const temperatureC = options.temperatureC ?? 12;
  const bed = { ebctS: options.ebctS, bedDepthM: options.bedDepthM, porosity: options.porosity, particleRadiusM: p.radiusM, particleDensityKgPerM3: p.densityGPerL, temperatureC };
  const opts: FixedBedOptions = { toBedVolumes: options.toBedVolumes, levels: options.levels ?? DEFAULT_BREAKTHROUGH_LEVELS, storedBackground: true };
  if (options.points !== undefined) opts.points = options.points;
  if (options.grid) { opts.cells = options.grid.cells; opts.interiorPoints = options.grid.interiorPoints; }
  const r = simulateFixedBed({ components, bed }, opts);
  return {
    bed_volumes: r.bedVolumes,
    components: r.components.map((c) => ({
      id: c.id,
      c0_mg_per_L: c.c0MgPerL,
      c_over_c0: c.cOverC0,
      breakthrough: c.breakthrough.map((b) => ({ c_over_c0: b.cOverC0, bed_volumes: b.bedVolumes })),
      run_averaged_removal: c.runAveragedRemoval,
      mass_balance_error: c.massBalanceError,
      trace: c.trace,
    })),
    mass_balance_error: r.massBalanceError,
    bed: { ebct_s: bed.ebctS, bed_depth_m: bed.bedDepthM, porosity: bed.porosity, particle_radius_m: p.radiusM, particle_density_kg_per_m3: p.densityGPerL, bed_density_kg_per_m3: p.densityGPerL * (1 - bed.porosity), temperature_c: temperatureC },
    grid: { cells: r.grid.cells, interior_points: r.grid.interiorPoints },
    films: r.films.map((f) => ({ id: f.id, kf_m_per_s: f.kfMPerS, source: f.source, ...(f.reynolds !== undefined ? { reynolds: f.reynolds } : {}) })),
    warnings: r.warnings,
  };
}
