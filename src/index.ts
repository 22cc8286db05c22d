/**
 * sorbshare as a library: `import { equilibrium, doseFor, … } from 'sorbshare'`.
 * The public API: the command-line computations as functions, the models beneath them, the whole
 * job from a project file and its output files. Internal steps and helpers are not exported.
 * Every export carries a doc comment where it is defined (units, sources, what it throws).
 * The core is pure (no file access, console or process); `loadProject` and `readPilotCsv` read
 * files; the CLI lives in src/cli.
 */
export { VERSION } from './version.js';
export { InputError, ComputationError, SorbshareError, type InputLocation } from './core/errors.js';

// ── units (capability 1): quantities with units, Freundlich K in any unit pair
export * from './units/index.js';

// ── mixtures and the IAST core (capabilities 2, 3, 9): the `equilibrium` and `dose` commands as functions
export { readMixture, readComponent, parseConcentration, parseDose, type MixtureInput, type ComponentInput, type ParsedMixture } from './scenario/readMixture.js';
export {
  equilibrium, equilibriumCurve, doseFor, loadingsAt, logSpacedDoses, goalToRemovalFraction,
  type EquilibriumResult, type EquilibriumComponentResult, type DoseSearchResult, type DoseGoal, type LoadingResult,
} from './api/equilibriumApi.js';
export { prepareMixture, type FreundlichComponent, type PreparedMixture } from './equilibrium/preparedMixture.js';
export { solveBatchPrepared, type BatchSolution } from './equilibrium/iastBatch.js';
export { directIastPrepared, type DirectSolution } from './equilibrium/iastDirect.js';
export { doseForRemoval, MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L, type DoseResult } from './design/doseForRemoval.js';
// the removal-at-dose model interface (to add a model) and the one dose search
export { EquilibriumRemoval, equilibriumRemoval } from './design/equilibriumRemoval.js';
export { searchDose, DEFAULT_DOSE_HINT_G_PER_L, type DoseSearchOutcome, type DoseSearchOptions, type DoseSearchStatus } from './design/doseSearch.js';
export type { RemovalModel, RemovalModelFactory, CompetitionSet, WarmStart, RemainingAtDose, BackgroundAtDose } from './design/removalModel.js';

// ── background and calibration (capabilities 4–7): the `fractionate` and `calibrate` commands as functions
export { readCsvTable, type CsvTable, type CsvColumn, type CsvColumnSpec, type CsvKind, type CsvHeaderRow, type CsvColumnSpecs } from './tables/csvTable.js';
export { fractionate, readIsotherm, DEFAULT_EXPONENT, DEFAULT_COMPONENTS, type FractionateOptions, type FractionateResult, type IsothermInput, type ModelAlternative } from './fractionation/fractionate.js';
export { readBackground, type BackgroundFile, type BackgroundComponentRecord, type BackgroundFit } from './fractionation/backgroundFile.js';
export { backgroundComponents, predictDoc, predictUv254, predictUv254Reduction } from './fractionation/backgroundPrediction.js';
export { ISOTHERM_COLUMNS, type IsothermPoint, type IsothermData } from './fractionation/isothermData.js';
export { calibrate, type CalibrateOptions, type CalibrationResult, type CalibrationModel, type CalibrationRow } from './calibration/calibrate.js';
export { ebcComponent } from './calibration/ebcComponent.js';
export { readJarTests, JAR_TEST_COLUMNS, type JarTestInput, type JarTestPoint, type JarTestData } from './calibration/jarTestData.js';

// ── the whole job (capabilities 8–15): project file → result → output files
export { loadProject } from './io/loadProject.js';
export { validateProject, type ProjectSpec, type SiteSpec, type BackgroundSpec, type CarbonSpec, type CompoundSpec, type GoalsSpec, type CalibrationModelName } from './project/index.js';
export { runPipeline } from './pipeline/runPipeline.js';
export { runPipelineWithUncertainty } from './pipeline/runWithUncertainty.js';
export type { PipelineInput, PipelineOptions, UncertaintyRunOptions, PipelineResult, CarbonResult, ProgressEvent } from './pipeline/pipelineTypes.js';
export { pipelineOutputs, OUTPUT_FILES } from './outputFiles/pipelineOutputs.js';
export { buildReportModel, CAUTIONS, type RunEnvironment } from './output/index.js';
export { renderHtmlReport, renderMarkdownSummary } from './report/index.js';
export { readCheckCase, runCheckCase, CHECK_KINDS, type CheckCase, type CheckOutcome, type CheckKind } from './checks/index.js';
// the design of a carbon at a DOC, for scripting one step of the job
export { designDose, type Design, type DesignProblem, type CompoundGoal, type CompoundDose, type CompoundDoseStatus } from './design/index.js';
// indicator rule (SR 814.201.231) and site DOC series
export { evaluateIndicatorSet, indicatorMean, MIN_INDICATOR_SUBSTANCES, CATEGORY_RATIO, type IndicatorValue, type IndicatorCategory, type IndicatorEvaluation } from './indicators/index.js';
export { parseSiteSeries, summarise as summariseSeries, type SiteSeries, type SeriesSummary } from './siteSeries/index.js';

// ── surrogates, GAC estimate, uncertainty (capabilities 11–13)
export { surrogateCurve, type SurrogateCurve, type SurrogatePoint } from './surrogates/surrogateCurve.js';
export { fitSiteCurve, siteCurveRemoval, type SiteCurveFit } from './surrogates/siteCurveFit.js';
export { checkPilotPairs, type PilotPair, type PilotCheckResult, type PilotCompoundCheck, type PilotResidual } from './surrogates/pilotCheck.js';
export { readPilotCsv } from './io/readPilotCsv.js';
export { gacEstimate, GAC_UPPER_BOUND_CAUTION, type GacInput, type GacEstimate, type GacTargetEstimate } from './gac/gacEstimate.js';
export { monteCarlo, MAX_DRAWS, type MonteCarloOptions, type MonteCarloResult, type QuantitySummary } from './uncertainty/monteCarlo.js';
export { parallelMonteCarlo, type ParallelOptions } from './uncertainty/parallelMonteCarlo.js';
export type { MonteCarloProblem, UncertainTarget, UncertainBackgroundComponent, ParameterCovariance, YearlyCostInput } from './uncertainty/monteCarloProblem.js';

// ── GAC fixed bed, staggered filters, column calibration and scale-up (capabilities 18, 19)
export { simulateFixedBed, traceBed, DEFAULT_BREAKTHROUGH_LEVELS, DEFAULT_FIXED_BED_GRID, type FixedBedOptions, type FixedBedResult, type FixedBedComponentResult, type BreakthroughPoint, type TraceBed, type TraceBedOptions, type TraceOutlet } from './kinetics/fixedBed.js';
export { DEFAULT_BED_POROSITY, filmCoefficients, type FixedBedComponent, type FixedBedSpec, type FixedBedInput, type ComponentFilm } from './kinetics/fixedBedInput.js';
export { column, type ColumnMixture, type ColumnOptions, type ColumnJson } from './api/fixedBedApi.js';
export { wilsonGeankoplisKf, WILSON_GEANKOPLIS_RE_RANGE, type FilmInput, type FilmCoefficient } from './kinetics/filmCorrelation.js';
export { waterProperties, DEFAULT_WATER_TEMPERATURE_C, type WaterProperties } from './kinetics/waterProperties.js';
export { curveAt, curveIntegral, firstCrossing, type BreakthroughCurve } from './kinetics/breakthroughCurve.js';
export { filterAges, blendedOutlet, blendOverCycle, worstBlend, runAveragedRemoval, runLengthForCompound, runLengthForIndicators, worstIndicatorMean, allowedCOverC0, PHASES_PER_CYCLE, type RunLength, type IndicatorCurve } from './kinetics/staggeredFilters.js';
export { gacCarbonUse, type CarbonUseInput, type CarbonUse } from './kinetics/staggeredFiltersCarbon.js';
export { ebctRatio, smallColumnEbctMin, largeBedEbctMin, largeGrainDs, scalingExponent, type ColumnScale, type DiffusivityScaling } from './kinetics/smallColumnScaling.js';
export { fitColumn, type ColumnFitInput, type ColumnFitResult, type ColumnFitRow } from './calibration/columnFit.js';
export { readBreakthroughData, BREAKTHROUGH_COLUMNS, MAX_DATA_C_OVER_C0, type BreakthroughData } from './calibration/breakthroughData.js';
export { staggeredRun, type StaggeredRunInput, type StaggeredRun } from './kinetics/staggeredFiltersRun.js';

// ── PAC contact kinetics (capabilities 16–17)
export { integrateImplicit, TRBDF2_ERROR_CONSTANT, type StiffSystem, type NewtonSolve, type IntegratorOptions, type IntegratorStats, type IntegrationResult } from './kinetics/implicitIntegrator.js';
export { denseLu, type DenseLu } from './kinetics/denseLu.js';
export { sphereCollocation, type SphereCollocation } from './kinetics/sphereCollocation.js';
export { reverseIast, traceSurfaceFactor, type SurfaceIsotherms, type ReverseIastState } from './kinetics/reverseIast.js';
export { prepareKinetics, filmCoefficientSh2, DEFAULT_TRACE_RATIO, type KineticComponent, type CarbonParticle, type PreparedKinetics } from './kinetics/kineticMixture.js';
export { hsdmParticleSystem, type ParticleSystem, type LiquidSpec } from './kinetics/hsdmParticleSystem.js';
export { pacBatch, DEFAULT_INTERIOR_POINTS, DEFAULT_KINETIC_RTOL, type PacBatchResult, type KineticSolverOptions } from './kinetics/pacBatch.js';
export { stirredReactor, checkContactConditions, type StirredReactorResult } from './kinetics/stirredReactor.js';
export { ContactRemoval, remainingUnderContact, doseUnderContact, checkConditions, type ContactConditions, type ContactDoseResult as ContactDoseSearchResult } from './kinetics/contactRemoval.js';
export { contactOverTime, contactSteadyState, contactDose, type ContactOverTimeResult, type ContactSteadyStateResult, type ContactDoseResult } from './api/contactApi.js';
export { readKineticMixture, readCarbonParticle, readComponentKinetics, COMPONENT_KINETIC_KEYS, type KineticMixture } from './scenario/readKineticInputs.js';
export { calibrateKinetics, type KineticCalibrationModel, type KineticCalibrateOptions, type KineticCalibrationResult, type KineticCalibrationRow } from './calibration/kineticCalibration.js';
export { readKineticTests, KINETIC_TARGET_COLUMNS, KINETIC_DOC_COLUMNS, type KineticSeries, type KineticTestKind } from './calibration/kineticTestData.js';
