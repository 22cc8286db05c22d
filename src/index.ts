/**
 * sorbshare as a library: `import { equilibrium, doseFor, … } from 'sorbshare'`.
 * The core is pure (no file access, console or process); the CLI lives in src/cli.
 */
export { VERSION } from './version.js';
export { InputError, ComputationError, SorbshareError, type InputLocation } from './core/errors.js';

// ── units (capability 1)
export * from './units/index.js';

// ── IAST core (capabilities 2, 3, 9)
export { prepareMixture, type FreundlichComponent, type PreparedMixture } from './equilibrium/preparedMixture.js';
export { solveBatchPrepared, type BatchSolution } from './equilibrium/iastBatch.js';
export { directIastPrepared, type DirectSolution } from './equilibrium/iastDirect.js';
export { doseForRemoval, MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L, type DoseResult } from './design/doseForRemoval.js';
// ── design layer: the removal-at-dose model interface and the one dose search
export { EquilibriumRemoval, equilibriumRemoval } from './design/equilibriumRemoval.js';
export { searchDose, DEFAULT_DOSE_HINT_G_PER_L, type DoseSearchOutcome, type DoseSearchOptions, type DoseSearchStatus } from './design/doseSearch.js';
export type { RemovalModel, RemovalModelFactory, CompetitionSet, WarmStart, RemainingAtDose, BackgroundAtDose } from './design/removalModel.js';
export { readMixture, readComponent, parseConcentration, parseDose, type MixtureInput, type ComponentInput, type ParsedMixture } from './scenario/readMixture.js';
export {
  equilibrium, equilibriumCurve, doseFor, loadingsAt, logSpacedDoses, goalToRemovalFraction, formatSolution,
  type EquilibriumResult, type EquilibriumComponentResult, type DoseSearchResult, type DoseGoal, type LoadingResult,
} from './api/equilibriumApi.js';

// ── background characterisation (capabilities 4–7) — add exports below this line
export { readCsvTable, csvUnitFactor, type CsvTable, type CsvColumn, type CsvColumnSpec, type CsvKind, type CsvHeaderRow, type CsvColumnSpecs } from './tables/csvTable.js';
export { fractionate, readIsotherm, DEFAULT_EXPONENT, DEFAULT_COMPONENTS, type FractionateOptions, type FractionateResult, type IsothermInput, type ModelAlternative } from './fractionation/fractionate.js';
export { readBackground, type BackgroundFile, type BackgroundComponentRecord, type BackgroundFit } from './fractionation/backgroundFile.js';
export { backgroundComponents, predictDoc, predictUv254, predictUv254Reduction } from './fractionation/backgroundPrediction.js';
export { defaultKGrid, DEFAULT_K_GRIDS } from './fractionation/defaultKGrid.js';
export { ISOTHERM_COLUMNS, checkIsotherm, type IsothermPoint, type IsothermData } from './fractionation/isothermData.js';
export { makeIsothermModel, type IsothermModel } from './fractionation/isothermModel.js';
export { calibrate, POOR_FIT_RMSE_LN, type CalibrateOptions, type CalibrationResult, type CalibrationModel, type CalibrationRow } from './calibration/calibrate.js';
export { ebcComponent } from './calibration/ebcComponent.js';
export { readJarTests, JAR_TEST_COLUMNS, type JarTestInput, type JarTestPoint, type JarTestData } from './calibration/jarTestData.js';
export { fitLeastSquares, type LeastSquaresProblem, type LeastSquaresFit } from './numerics/leastSquares.js';
export { nnls, type NnlsResult } from './numerics/nnls.js';
export { studentTQuantile, studentTCdf } from './numerics/studentT.js';

// ── project, pipeline, report (capabilities 8–10, 14, 15) — add exports below this line
export { loadProject } from './io/loadProject.js';
export { validateProject, DEFAULT_REMOVAL_PERCENT, DEFAULT_SWEEP, type ProjectSpec, type SiteSpec, type BackgroundSpec, type CarbonSpec, type CompoundSpec, type GoalsSpec, type CalibrationModelName } from './project/index.js';
export { evaluateIndicatorSet, indicatorMean, admissibleRange, ruleViolation, MIN_INDICATOR_SUBSTANCES, CATEGORY_RATIO, type IndicatorValue, type IndicatorCategory, type IndicatorEvaluation, type AdmissibleRange } from './indicators/index.js';
export { parseSiteSeries, quantile as seriesQuantile, median as seriesMedian, summarise as summariseSeries, type SiteSeries, type SeriesSummary } from './siteSeries/index.js';
export { runPipeline, runPipelineWithUncertainty, indicatorPlan, surrogateStep, surrogateModel, pilotStep, gacStep, uncertaintyStep, uncertaintyProblem, resolveUncertaintySettings, reducedLoading, buildSystems, systemComponents, prepareSystem, type PipelineInput, type PipelineOptions, type UncertaintyRunOptions, type SurrogateResult, type SetPointRow, type PilotStepResult, type GacStepResult, type CarbonUncertainty, type UncertaintySettings, type PipelineResult, type CarbonResult, type ProgressEvent, type CompoundSystem, type ReducedLoading, type CompoundCalibration, designProblem, carbonModel, competitionSets } from './pipeline/index.js';
// outputs: CSV tables, the run record, the report model, number formatting; and every output file
export { surrogatesCsv, setpointsCsv, pilotCheckCsv, gacCsv, uncertaintyCsv, buildReportModel, runRecord, CAUTIONS, type RunEnvironment } from './output/index.js';
export { pipelineOutputs, OUTPUT_FILES } from './outputFiles/pipelineOutputs.js';
// the design of a carbon at a DOC (doses, governing goal, cost, surrogate set-point, daily doses)
export {
  compoundGoal, compoundDose, designDose, surrogatesAt, indicatorCheckAt, indicatorDose, indicatorValuesAt, selectIndicatorSet, removalCurves, dailyDoses,
  doseTable, interpolateDose, seriesSegments, seriesCarbon, carbonKgPerD, costPerM3, carbonCost, requiredDoseAt, REMOVAL_MODELS,
  uv254SetPoint, governingSetPoint, doseForUv254Reduction, annualisedNote, isAnnualised, yearlyLabel,
  type RequiredAtDoc, type SetPointGoal, type Uv254SetPoint, type GoverningSetPoint,
  type CompoundGoal, type CompoundDose, type CompoundDoseStatus, type Design, type DesignProblem, type SurrogateSetPoint, type IndicatorGoal, type IndicatorMember,
  type IndicatorCheck, type IndicatorDose, type IndicatorDoseStatus, type RemovalCurves, type DailyDoses, type DailyRow, type DoseTable, type SeriesSegments, type SeriesCarbon,
} from './design/index.js';
export { readCheckCase, runCheckCase, CHECK_KINDS, type CheckCase, type CheckOutcome, type CheckKind } from './checks/index.js';
export { renderHtmlReport, renderMarkdownSummary, reportPlotIds, renderPlot } from './report/index.js';

// ── surrogates, GAC, uncertainty (capabilities 11–13) — add exports below this line
export * from './surrogates/index.js';
export { readPilotCsv } from './io/readPilotCsv.js';
export * from './gac/index.js';
export * from './uncertainty/index.js';

// ── GAC fixed bed, staggered filters, column calibration and scale-up (capabilities 18, 19)
export { simulateFixedBed, DEFAULT_BREAKTHROUGH_LEVELS, DEFAULT_FIXED_BED_GRID, type FixedBedOptions, type FixedBedResult, type FixedBedComponentResult, type BreakthroughPoint } from './kinetics/fixedBed.js';
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

// ── PAC contact kinetics (capabilities 16–17) — issue 9, branch pac
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
