/**
 * Inputs and results of the whole job (`sorbshare run`). The pipeline is pure: it receives the
 * validated project and the already-read tables; src/project/loadProject.ts reads the files.
 */
import type { CsvTable } from '../tables/csvTable.js';
import type { BackgroundFile } from '../fractionation/backgroundFile.js';
import type { CarbonSpec, ProjectSpec } from '../project/projectTypes.js';
import type { SiteSeries } from '../siteSeries/siteSeries.js';
import type { PilotData } from '../surrogates/pilotCsv.js';
import type { BackgroundStep } from './backgroundStep.js';
import type { CompoundCalibration } from './calibrationStep.js';
import type { TransferredCalibration } from './calibrationTransferStep.js';
import type { CompoundSystem } from '../design/competitionSystem.js';
import type { CarbonBackground, CarbonBackgroundInput } from './carbonBackgroundStep.js';
import type { CompoundGoal } from '../design/compoundGoal.js';
import type { DailyDoses } from '../design/dailyDoses.js';
import type { IndicatorCheck } from '../design/indicatorGoal.js';
import type { ReducedLoading } from '../design/reducedLoading.js';
import type { RemovalCurves } from '../design/removalCurves.js';
import type { Design } from '../design/designDose.js';
import type { SurrogateResult } from './surrogateStep.js';
import type { PilotStepResult } from './pilotStep.js';
import type { GacStepResult } from './gacStep.js';
import type { GacKineticResult } from './gacKineticStep.js';
import type { GacUncertainty } from './gacUncertainty.js';
import type { DoseAgainstDoc } from './doseAgainstDocStep.js';
import type { Sensitivity } from './sensitivityStep.js';
import type { CarbonUncertainty, UncertaintySettings } from './uncertaintyTypes.js';
import type { ContactFigures } from './contactStep.js';
import type { KineticSolverOptions } from '../kinetics/pacBatch.js';
import type { CarbonKineticCalibration, CarbonKineticTables } from './kineticCalibrationStep.js';
import type { CarbonColumnCalibration, CarbonColumnTables } from './columnCalibrationStep.js';

/** A file the project referenced, for run.json. */
export interface InputFileRecord {
  role: string;
  /** Path as written in the project. */
  path: string;
  /** Resolved absolute path. */
  resolved: string;
  bytes: number;
  sha256: string;
}

export interface PipelineInput {
  project: ProjectSpec;
  /** The DOC isotherm (background.kind 'isotherm'). */
  isotherm?: CsvTable;
  /** The checked background file (background.kind 'file'). */
  backgroundFile?: BackgroundFile;
  /** Jar-test tables by compound id. */
  jarTests: Record<string, CsvTable>;
  /** Each carbon's own DOC isotherm table or background file, by carbon name (carbons[i].background). */
  carbonBackgrounds?: Record<string, CarbonBackgroundInput>;
  /** The site's DOC series, if the project has one. */
  series?: SiteSeries;
  /** Pilot pairs (project field `pilot`). */
  pilot?: PilotData;
  /** Kinetic jar-test tables of PAC carbons by carbon name (carbons[i].kinetics.kinetic_tests). */
  kineticTests?: Record<string, CarbonKineticTables>;
  /** Column-test tables of GAC carbons by carbon name (carbons[i].kinetics.column_tests). */
  columnTests?: Record<string, CarbonColumnTables>;
  /** Where the inputs came from (for run.json). */
  /** `notes`: how input tables were read and what was left out (gaps); the run's warnings repeat them. */
  provenance: { projectFile?: string; files: InputFileRecord[]; demo?: boolean; notes?: string[] };
}

export interface ProgressEvent {
  step: string;
  done: number;
  total: number;
}

export interface PipelineOptions {
  onProgress?: (e: ProgressEvent) => void;
  /** Time stamp of the run (default now). */
  now?: Date;
  /** Kinetic solver settings of the contact model (collocation points, tolerance; defaults of src/kinetics). */
  kinetic?: KineticSolverOptions;
}

/** Options of the run with the Monte Carlo step (runPipelineWithUncertainty). */
export interface UncertaintyRunOptions extends PipelineOptions {
  /** Overrides of the project's uncertainty section (command line --draws, --seed); draws 0 = off. */
  draws?: number;
  seed?: number;
  /** Monte Carlo progress: draws done and total over all carbons. */
  onMonteCarloProgress?: (done: number, total: number) => void;
  /** Worker threads for the Monte Carlo (default: parallelMonteCarlo decides; the GAC draws take one worker beside the PAC draws); 0 keeps both in this thread. */
  workers?: number;
}

export interface CarbonResult {
  carbon: CarbonSpec;
  /** The carbon's background: its own fractionated DOC or the project's with its K factor (carbonBackgroundStep.ts). */
  background?: CarbonBackground;
  /** Systems of the compounds on this carbon (project order); PAC only. */
  systems: CompoundSystem[];
  /** Required dose at the site's design DOC (PAC only). */
  required?: Design;
  /** Dose the reduced loadings and the indicator check are reported at, mg/L. */
  designDoseMgPerL?: number;
  designDoseSource?: 'required dose' | 'goals.design_dose';
  reducedLoadings?: ReducedLoading[];
  indicator?: IndicatorCheck;
  curves?: RemovalCurves;
  /** Carbon cost per m³ treated at the required dose, in the carbon's currency. */
  costPerM3?: number;
  /** Carbon mass at the required dose and the design flow, kg/d. */
  carbonKgPerDAtDesign?: number;
  daily?: DailyDoses;
  /** Yearly carbon and cost: from the DOC series, or design dose × design flow × 365. */
  /** Yearly carbon and cost; `basis` says where from and, when annualised, from how many days (src/design/annualised.ts). */
  yearly?: { carbonKg: number; cost: number; basis: string; annualised: boolean };
  /** DOC/UV254 reduction beside removal and the UV254 set-points (PAC with a fractionated background). */
  surrogates?: SurrogateResult;
  /** GAC equilibrium estimate (GAC carbons; a reference, not a bound). */
  gac?: GacStepResult;
  /** GAC kinetic run length of the staggered filters (GAC carbons with "kinetics"). */
  gacKinetic?: GacKineticResult;
  /** Monte Carlo percentiles (PAC; runPipelineWithUncertainty only). */
  uncertainty?: CarbonUncertainty;
  /** Monte Carlo of the GAC kinetic run length (GAC carbons with a run length; runPipelineWithUncertainty only). */
  gacUncertainty?: GacUncertainty;
  /** Required dose against DOC beside the constant-specific-dose rule (PAC with a reachable dose). */
  doseAgainstDoc?: DoseAgainstDoc;
  /** Dose and yearly cost for each main input ±20 % (PAC with a reachable dose). */
  sensitivity?: Sensitivity;
  /** Under the plant's PAC contact conditions: the equilibrium dose beside the required dose and their ratio. */
  contact?: ContactFigures;
  /** Ds fitted to the carbon's kinetic jar tests (they replace the given values in `carbon.kinetics`). */
  kineticCalibration?: CarbonKineticCalibration;
  /** GAC: Ds fitted to the carbon's column tests (they replace the given values in `carbon.bedKinetics`). */
  columnCalibration?: CarbonColumnCalibration;
  warnings: string[];
}

export interface PipelineResult {
  project: ProjectSpec;
  generatedAt: string;
  background: BackgroundStep;
  calibrations: CompoundCalibration[];
  /** The calibration transferred to compounds without jar tests (project key calibration_transfer). */
  calibrationTransfer?: TransferredCalibration;
  goals: Record<string, CompoundGoal>;
  carbons: CarbonResult[];
  series?: SiteSeries;
  /** Pilot pairs checked against the prediction (project field `pilot`). */
  pilot?: PilotStepResult;
  /** The Monte Carlo settings used (absent when it did not run). */
  uncertainty?: UncertaintySettings;
  provenance: PipelineInput['provenance'];
  warnings: string[];
  /** Wall time of each step, ms. */
  timingMs: Record<string, number>;
}
