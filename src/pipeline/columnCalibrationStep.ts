/**
 * Column calibration in the whole job (capability 19): the GAC carbon's pilot or small-column
 * breakthrough tests (`carbons[i].kinetics.column_tests`, src/project/readColumnTests.ts) fitted
 * with the fixed-bed model (src/calibration/columnFit.ts, the fit of `sorbshare calibrate --model
 * column`: film, surface diffusion in the grains, reverse IAST at the grain surface, Ds by least
 * squares on c/c0 with a 95 % interval), and the carbon's fixed-bed inputs with the fitted Ds in
 * place of the given ones, before the kinetic run length (gacKineticStep) is computed.
 *
 *   background  the carbon's fictive DOC components at the site's design DOC (K times the carbon's
 *               K factor) with its doc_Ds and doc_DL or doc_kf (gacDocComponents)
 *   target      c0 from the table (a C0 column) or the project's c0; K and 1/n of the run's
 *               competition system; DL or kf of the carbon
 *   bed         the test's EBCT, depth, grain radius and porosity (default the carbon's); the
 *               carbon's grain density and water temperature
 *   scale-up    Ds_LC = Ds_SC·(R_LC/R_SC)^X, X = 0 constant, 1 proportional diffusivity
 *               (Crittenden, Berrigan & Hand 1986; from memory; src/kinetics/smallColumnScaling.ts),
 *               the interval scaled with it.
 * The tests are taken to be at the site's design DOC (said in a warning).
 * Units: Ds m²/s, EBCT s, lengths m, concentrations mg/L.
 * @throws InputError naming the JSON path of the test (bad table: file, row, column);
 *   ComputationError when a fit fails
 */
import { InputError } from '../core/errors.js';
import { readBreakthroughData } from '../calibration/breakthroughData.js';
import { fitColumn, type ColumnFitResult } from '../calibration/columnFit.js';
import type { BackgroundFile } from '../fractionation/backgroundFile.js';
import type { FixedBedComponent } from '../kinetics/fixedBedInput.js';
import { largeGrainDs } from '../kinetics/smallColumnScaling.js';
import type { CarbonSpec } from '../project/projectTypes.js';
import type { ColumnTestSpec } from '../project/readColumnTests.js';
import type { GacKineticsSpec } from '../project/readGacKinetics.js';
import type { CsvTable } from '../tables/csvTable.js';
import type { CompoundSystem } from '../design/competitionSystem.js';
import { fractionatedBackground, gacDocComponents } from './gacKineticStep.js';

/** The column-test tables of one carbon by compound id, as read by src/io/loadProject.ts. */
export interface CarbonColumnTables {
  ds: Record<string, CsvTable>;
}

/** One fitted Ds of a target. */
export interface ColumnFit {
  compoundId: string;
  /** The test as the project gives it (file relative to the project file, EBCT s, lengths m). */
  test: ColumnTestSpec;
  /** The value given in the project before the fit, m²/s (absent when none was given). */
  givenM2PerS?: number;
  /** The fit on the test's grains, as `sorbshare calibrate --model column --json` prints it. */
  result: ColumnFitResult;
  /** Ds of the carbon's grains (the fitted value, scaled when the test's grains differ), m²/s. */
  dsM2PerS: number;
  /** 95 % interval of dsM2PerS, m²/s (null when the data do not determine it). */
  ci95M2PerS: [number, number] | null;
  warnings: string[];
}

/** The column calibration of one carbon. */
export interface CarbonColumnCalibration {
  fits: ColumnFit[];
  /** The carbon's fixed-bed inputs with the fitted Ds in place (the run length uses these). */
  bedKinetics: GacKineticsSpec;
}

function named<T>(path: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof InputError && e.location.path === undefined) throw e.at({ path });
    throw e;
  }
}

/**
 * Fit the column tests of one GAC carbon; undefined when it has none.
 * @param carbon      the carbon, with the K factor of its background (as gacKineticStep takes it)
 * @param systems     the carbon's competition systems (project order)
 * @param background  the carbon's fractionated background
 * @param docMgPerL   the site's design DOC, mg/L
 */
export function columnCalibrationStep(carbon: CarbonSpec, carbonIndex: number, systems: readonly CompoundSystem[], background: BackgroundFile | undefined, docMgPerL: number, tables: CarbonColumnTables | undefined): CarbonColumnCalibration | undefined {
  const k = carbon.bedKinetics;
  if (!k?.columnTests) return undefined;
  const path = `carbons[${carbonIndex}].kinetics.column_tests.Ds`;
  for (const id of Object.keys(k.columnTests.ds)) {
    if (!tables?.ds[id] && k.compounds[id]?.dsM2PerS === undefined) throw new InputError(`the column test of "${id}" was not read (no table) and no Ds is given; load the project with loadProject or give Ds`, { path: `${path}.${id}.file` });
  }
  if (!tables) return undefined;
  const bg = gacDocComponents(fractionatedBackground(background, carbonIndex), docMgPerL, carbon.kFactor, k.doc);
  const compounds = { ...k.compounds };
  const fits: ColumnFit[] = [];
  for (const [id, test] of Object.entries(k.columnTests.ds)) {
    const table = tables.ds[id];
    if (!table) continue;
    const p = `${path}.${id}`;
    const sys = systems.find((s) => s.compoundId === id);
    if (!sys) throw new InputError(`"${id}" is not a compound of this project`, { path: p });
    const data = named(`${p}.file`, () => readBreakthroughData(table, { c0MgPerL: sys.c0MgPerL }));
    const c0 = data.c0MgPerL ?? sys.c0MgPerL;
    const { dsM2PerS: given, ...film } = k.compounds[id]!;
    const target: FixedBedComponent = { id, c0MgPerL: c0, K: sys.inMixture.K, oneOverN: sys.inMixture.oneOverN, ...film };
    const radius = test.particleRadiusM ?? k.particleRadiusM;
    const bed = { ebctS: test.ebctS, bedDepthM: test.bedDepthM, porosity: test.porosity ?? k.porosity, particleRadiusM: radius, particleDensityKgPerM3: k.particleDensityKgPerM3, temperatureC: k.temperatureC };
    const result = named(p, () => fitColumn({ data, target, background: bg, bed }));
    const scale = (ds: number) => (test.scaleUp === undefined ? ds : largeGrainDs({ smallGrainSize: radius, largeGrainSize: k.particleRadiusM, scaling: test.scaleUp }, ds));
    const ci = result.ci95.Ds_m2_per_s;
    const warnings = [`the column test is taken to be at the site's design DOC of ${docMgPerL} mg/L (the background scaled to it)`, ...result.warnings];
    if (test.scaleUp !== undefined) warnings.push(`Ds fitted on grains of radius ${radius} m, scaled to the carbon's ${k.particleRadiusM} m with ${test.scaleUp} diffusivity (Crittenden, Berrigan & Hand 1986); confirm with a pilot column`);
    const ds = scale(result.parameters.Ds_m2_per_s);
    fits.push({ compoundId: id, test, ...(given !== undefined ? { givenM2PerS: given } : {}), result, dsM2PerS: ds, ci95M2PerS: ci ? [scale(ci[0]), scale(ci[1])] : null, warnings });
    compounds[id] = { ...k.compounds[id]!, dsM2PerS: ds };
  }
  return { fits, bedKinetics: { ...k, compounds } };
}
