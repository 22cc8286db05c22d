/**
 * Kinetic calibration in the whole job (capability 17): the PAC carbon's kinetic jar tests
 * (`carbons[i].kinetics.kinetic_tests`, src/project/readKineticTests.ts) fitted with the PAC batch
 * model (src/calibration/kineticCalibration.ts: HSDM with film transfer and IAST at the particle
 * surface, Ds by least squares on ln c with a 95 % interval), and the carbon's kinetic data with the
 * fitted values in place of the given ones.
 *
 *   - `doc_Ds` (DOC against time): the one Ds of the fictive DOC components of this carbon
 *     (surface-diffusion-doc), fitted first;
 *   - `Ds.<id>` (target against time): the target's Ds (surface-diffusion) beside this carbon's
 *     competitors of that compound (the same competition system as the run: fictive components
 *     with a calibrated target K, or an EBC), with the background's doc_Ds (fitted or given).
 * The tests are taken at the site's design DOC, unless a DOC test has a DOC0 column (then its
 * background is scaled to it); this is said in a warning. Film: kf = DL/R (Sh = 2, common
 * practice) with the carbon's DL of the target and its doc_DL for the background.
 *
 * Units: Ds, DL m²/s; times s; concentrations mg/L.
 * @throws InputError naming the project JSON path of a missing kinetic quantity, or the file, row
 *         and column of a bad table; ComputationError when a fit fails.
 */
import { InputError } from '../core/errors.js';
import { calibrateKinetics, type KineticCalibrationModel, type KineticCalibrationResult } from '../calibration/kineticCalibration.js';
import type { CsvTable } from '../tables/csvTable.js';
import type { KineticSolverOptions } from '../kinetics/pacBatch.js';
import type { CarbonKinetics } from '../project/readCarbonKinetics.js';
import type { CarbonSpec } from '../project/projectTypes.js';
import type { CompoundSystem } from '../design/competitionSystem.js';

/** The kinetic test tables of one carbon, as read by src/io/loadProject.ts. */
export interface CarbonKineticTables {
  /** Target tests by compound id. */
  ds: Record<string, CsvTable>;
  /** DOC test. */
  docDs?: CsvTable;
}

/** One fitted diffusivity. */
export interface KineticFit {
  /** The project key the fit replaces: `Ds` (a target's) or `doc_Ds`. */
  parameter: 'Ds' | 'doc_Ds';
  /** Compound id, or "DOC" for doc_Ds. */
  compoundId: string;
  model: KineticCalibrationModel;
  /** The value given in the project before the fit, m²/s (absent when none was given). */
  givenM2PerS?: number;
  /** The fit as `sorbshare calibrate --model surface-diffusion[-doc] --json` prints it. */
  result: KineticCalibrationResult;
  /** The table's file as the project names it (relative to the project file; errors name the full path). */
  file?: string;
  warnings: string[];
}

/** The kinetic calibration of one carbon. */
export interface CarbonKineticCalibration {
  fits: KineticFit[];
  /** The carbon's kinetic data with the fitted values in place (the run's contact model uses these). */
  kinetics: CarbonKinetics;
}

/** A bad table's InputError (file, row, column) with the project JSON path that named the table added. */
function named<T>(path: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.location.path === undefined) throw e.at({ path });
    throw e;
  }
}

/**
 * Fit the kinetic tests of one PAC carbon; undefined when it has none.
 * @param carbonIndex position of the carbon in the project (for JSON paths)
 * @param systems     the carbon's competition systems (project order)
 * @param docMgPerL   the site's design DOC, mg/L
 */
export function kineticCalibrationStep(carbon: CarbonSpec, carbonIndex: number, systems: readonly CompoundSystem[], docMgPerL: number, tables: CarbonKineticTables | undefined, options: KineticSolverOptions = {}): CarbonKineticCalibration | undefined {
  const k = carbon.kinetics;
  if (!k?.tests || !tables) return undefined;
  const path = `carbons[${carbonIndex}].kinetics`;
  const missing = (key: string, what: string) => new InputError(`the kinetic jar tests of carbon "${carbon.name}" need ${what}`, { path: `${path}.${key}` });
  if (k.particleRadiusM === undefined) throw missing('particle_radius', 'the particle radius, e.g. "12 um"');
  if (k.particleDensityGPerL === undefined) throw missing('particle_density', 'the particle density, e.g. "650 kg/m3"');
  if (k.docDlM2PerS === undefined) throw missing('doc_DL', 'the liquid diffusivity of the background (film coefficient kf = DL/R), e.g. "4e-10 m2/s"');
  const particle = { radiusM: k.particleRadiusM, densityGPerL: k.particleDensityGPerL };
  const grid = options.interiorPoints !== undefined ? { interiorPoints: options.interiorPoints } : {};
  const fits: KineticFit[] = [];
  const kinetics: CarbonKinetics = { ...k, dsM2PerS: { ...k.dsM2PerS } };
  const atDoc = `they are taken to be at the site's design DOC of ${docMgPerL} mg/L (the background scaled to it)`;

  if (k.tests.docDs !== undefined && tables.docDs) {
    const table = tables.docDs;
    const fictive = systems.find((s) => s.competition === 'fictive');
    if (!fictive) throw new InputError(`a DOC kinetic test fits the Ds of the fictive DOC components, but no compound on carbon "${carbon.name}" competes with them (EBC background or EBC calibrations)`, { path: `${path}.kinetic_tests.doc_Ds` });
    const result = named(`${path}.kinetic_tests.doc_Ds`, () => calibrateKinetics(table, {
      model: 'surface-diffusion-doc', background: fictive.background(docMgPerL), docMgPerL, particle, dlM2PerS: k.docDlM2PerS, ...(table.file !== undefined ? { file: table.file } : {}), ...grid,
    }));
    const warnings = [...(table.columns.c0 ? [] : [`the DOC kinetic test has no DOC0 column; ${atDoc}`]), ...result.warnings];
    fits.push({ parameter: 'doc_Ds', compoundId: 'DOC', model: 'surface-diffusion-doc', ...(k.docDsM2PerS !== undefined ? { givenM2PerS: k.docDsM2PerS } : {}), result, file: k.tests.docDs, warnings });
    kinetics.docDsM2PerS = result.parameters.Ds_m2_per_s;
  }
  for (const [id, table] of Object.entries(tables.ds)) {
    if (k.tests.ds[id] === undefined) continue;
    const sys = systems.find((s) => s.compoundId === id);
    if (!sys) throw new InputError(`"${id}" is not a compound of this project`, { path: `${path}.kinetic_tests.Ds.${id}` });
    const dl = k.dlM2PerS[id];
    if (dl === undefined) throw missing(`DL.${id}`, `the liquid diffusivity DL of "${id}" (film coefficient kf = DL/R), e.g. "7e-10 m2/s"`);
    if (kinetics.docDsM2PerS === undefined) throw missing('doc_Ds', `the surface diffusivity of the background (doc_Ds, or a DOC kinetic test in kinetic_tests.doc_Ds) to fit the Ds of "${id}"`);
    const result = named(`${path}.kinetic_tests.Ds.${id}`, () => calibrateKinetics(table, {
      model: 'surface-diffusion',
      target: { id, c0MgPerL: 0, K: sys.inMixture.K, oneOverN: sys.inMixture.oneOverN, dlM2PerS: dl },
      background: sys.background(docMgPerL), docMgPerL, particle, backgroundDsM2PerS: kinetics.docDsM2PerS, dlM2PerS: k.docDlM2PerS,
      ...(table.file !== undefined ? { file: table.file } : {}), ...grid,
    }));
    const given = k.dsM2PerS[id];
    fits.push({ parameter: 'Ds', compoundId: id, model: 'surface-diffusion', ...(given !== undefined ? { givenM2PerS: given } : {}), result, file: k.tests.ds[id], warnings: [`the target kinetic tests have no DOC column; ${atDoc}`, ...result.warnings] });
    kinetics.dsM2PerS[id] = result.parameters.Ds_m2_per_s;
  }
  return { fits, kinetics };
}
