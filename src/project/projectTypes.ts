/**
 * A validated project (the project file, capabilities 8–10) in internal units:
 * concentrations mg/L, flows m³/d, K in (mg/g)/(mg/L)^(1/n), prices per kg of carbon.
 * File references stay as written (paths relative to the project file); `loadProject` reads them.
 */
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import type { GacKineticsSpec } from './readGacKinetics.js';
import type { IndicatorCategory } from '../indicators/indicatorRule.js';
import type { PacContactSpec } from './readPacContact.js';
import type { CarbonKinetics } from './readCarbonKinetics.js';

export interface SiteSpec {
  name: string;
  /** Design flow, m³/d. */
  flowM3PerD: number;
  /** Effluent DOC of the site water (design value), mg/L. */
  docMgPerL: number;
  /** UV254 of the site water, 1/m (optional). */
  uv254PerM?: number;
  /** CSV of date, DOC and (optionally) flow, relative to the project file. */
  seriesFile?: string;
  /** PAC contact conditions (readPacContact.ts); absent = equilibrium. */
  pacContact?: PacContactSpec;
}

export interface FractionationOptionsSpec {
  /** Number of adsorbable fictive components (2–5). */
  components?: number;
  /** Common Freundlich exponent 1/n of the fictive components. */
  exponent?: number;
  /** Fit the K values instead of a fixed K grid. */
  fitK?: boolean;
}

export type BackgroundSpec =
  /** Fractionate a DOC isotherm (CSV) with the given options. */
  | { kind: 'isotherm'; file: string; options: FractionationOptionsSpec }
  /** A background file (the output of `sorbshare fractionate`). */
  | { kind: 'file'; file: string }
  /** One equivalent background compound per target compound, valid at `docMgPerL`. */
  | { kind: 'ebc'; docMgPerL: number; ebc: Record<string, FreundlichComponent> };

/**
 * A carbon's own background (src/project/readCarbonBackground.ts): its own DOC (and UV254)
 * isotherm to fractionate, or a background file; the same kinds as the project's background.
 * After validation the isotherm's options are the project's fractionation options overridden by
 * the carbon's own.
 */
export type CarbonBackgroundSpec = Extract<BackgroundSpec, { kind: 'isotherm' | 'file' }>;

export interface CarbonIsotherm {
  /** K in (mg/g)/(mg/L)^(1/n). */
  K: number;
  oneOverN: number;
}

export interface CarbonSpec {
  name: string;
  type: 'PAC' | 'GAC';
  /** Carbon price per kg, in `currency`. */
  pricePerKg: number;
  currency: string;
  /** Factor on the reference K of every compound and of the background (1 = reference carbon); with its own background, of the compounds only. */
  kFactor: number;
  /** Per-compound single-solute isotherms on this carbon (replace the reference values). */
  isotherms: Record<string, CarbonIsotherm>;
  /** The carbon's own DOC background (absent = the project's background with `kFactor` on its K). */
  background?: CarbonBackgroundSpec;
  /** GAC only: bed density, kg/m³. */
  bedDensityKgPerM3?: number;
  /** GAC only: empty-bed contact time, min. */
  ebctMin?: number;
  /** PAC only: particle data and diffusivities (readCarbonKinetics.ts). */
  kinetics?: CarbonKinetics;
  /** GAC only: fixed-bed inputs for the kinetic run length, from the carbon's "kinetics" (src/project/readGacKinetics.ts). */
  bedKinetics?: GacKineticsSpec;
}

export type CalibrationModelName = 'ebc' | 'sebc' | 'fictive-k';

export interface CompoundSpec {
  id: string;
  name: string;
  /** Single-solute Freundlich K on the reference carbon, (mg/g)/(mg/L)^(1/n). */
  K: number;
  oneOverN: number;
  /** Concentration in the site water before carbon, mg/L. */
  c0MgPerL: number;
  molarMassGPerMol?: number;
  jarTests?: { file: string; model: CalibrationModelName };
  /** Effluent limit, mg/L (from the compound or from goals.limits). */
  limitMgPerL?: number;
  indicatorCategory?: IndicatorCategory;
  /** Report-only compound (project `"goal": "none"`): modelled and reported, never governing. */
  reportOnly?: boolean;
}

/** How compounds without jar tests take the site's correction (src/project/readCalibrationTransfer.ts). */
export type CalibrationTransferSpec = { kind: 'none' } | { kind: 'mean' } | { kind: 'compound'; compoundId: string };

export interface GoalsSpec {
  /** Removal goal for every compound without a limit, percent. */
  removalPercent: number;
  indicator?: {
    /** Goal for the mean removal of the indicator set, percent. */
    meanRemovalPercent: number;
    /** Chosen indicator set (ids); absent = all compounds with a category. */
    compounds?: string[];
  };
  /** Dose at which reduced loadings and the indicator check are reported, mg/L (default: the required dose). */
  designDoseMgPerL?: number;
  /** Removal-against-dose sweep, mg/L. */
  sweep: { fromMgPerL: number; toMgPerL: number; points: number };
}

/** Pilot pairs (UV254 reduction, measured removal) to check the predicted relation against. */
export interface PilotSpec {
  /** Pilot CSV, relative to the project file (src/surrogates/pilotCsv.ts describes the columns). */
  file: string;
  /** Half-width of the acceptance band, percentage points (default 10, common practice). */
  bandPercent: number;
  /** Name of the carbon the pilot ran with (default: the first PAC carbon). */
  carbon?: string;
}

/**
 * Monte Carlo over isotherm and background parameters (capability 13). Relative standard
 * deviations are fractions (0.2 = 20 %); fitted parameters with a confidence interval use the fit
 * instead (95 % interval converted to a standard deviation).
 */
export interface UncertaintySpec {
  /** Number of draws (0 switches the Monte Carlo off). */
  draws: number;
  /** Seed of the random streams (integer 0 … 4294967295). */
  seed: number;
  /** Relative SD of each compound's Freundlich K. */
  KRelSd: number;
  /** Relative SD of each compound's exponent 1/n. */
  oneOverNRelSd: number;
  /** Relative SD of the DOC (design value and the whole series together). */
  docRelSd: number;
  /** Relative SD of the background fractions without a fitted interval. */
  fractionRelSd: number;
  /** Relative SD of the background K values without a fitted interval. */
  backgroundKRelSd: number;
  /** Relative SD of each given (not fitted) surface diffusivity under PAC contact (default: src/pipeline/contactUncertainty.ts). */
  dsRelSd?: number;
  /** Draws of a PAC carbon under contact conditions (at most `draws`; default: src/pipeline/contactUncertainty.ts). */
  contactDraws?: number;
  /** Draws of a GAC carbon's kinetic run length (at most `draws`; default: src/pipeline/gacUncertainty.ts). */
  gacDraws?: number;
}

/** Cover block of the report (all optional project-file keys). */
export interface ProjectCover {
  client?: string;
  projectNumber?: string;
  author?: string;
  checker?: string;
  revision?: string;
  /** Date of the issue, ISO YYYY-MM-DD. */
  date?: string;
}

export interface ProjectSpec {
  name: string;
  note?: string;
  /** Client, project number, author, checker, revision and date for the report's cover. */
  cover?: ProjectCover;
  site: SiteSpec;
  background: BackgroundSpec;
  carbons: CarbonSpec[];
  compounds: CompoundSpec[];
  goals: GoalsSpec;
  pilot?: PilotSpec;
  uncertainty?: UncertaintySpec;
  /** Transfer of the jar-test calibration to untested compounds (absent = none). */
  calibrationTransfer?: CalibrationTransferSpec;
}

/** Defaults (common practice). */
export const DEFAULT_REMOVAL_PERCENT = 80;
export const DEFAULT_SWEEP = { fromMgPerL: 0.5, toMgPerL: 100, points: 40 } as const;
/** Pilot acceptance band, ± percentage points (common practice; see src/surrogates/pilotCheck.ts). */
export const DEFAULT_PILOT_BAND_PERCENT = 10;
/** Monte Carlo defaults when the section is present but a field is not (common practice). */
export const DEFAULT_UNCERTAINTY: UncertaintySpec = { draws: 1000, seed: 1, KRelSd: 0, oneOverNRelSd: 0, docRelSd: 0, fractionRelSd: 0, backgroundKRelSd: 0 };
/** Largest number of draws a project or --draws may ask for. */
export const MAX_PROJECT_DRAWS = 1_000_000;
