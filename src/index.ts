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
export { doseForRemoval, MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L, type DoseResult } from './dose/doseSearch.js';
export { readMixture, readComponent, parseConcentration, parseDose, type MixtureInput, type ComponentInput, type ParsedMixture } from './scenario/readMixture.js';
export {
  equilibrium, equilibriumCurve, doseFor, loadingsAt, logSpacedDoses, goalToRemovalFraction, formatSolution,
  type EquilibriumResult, type EquilibriumComponentResult, type DoseSearchResult, type DoseGoal, type LoadingResult,
} from './api/equilibriumApi.js';

// ── background characterisation (capabilities 4–7) — add exports below this line

// ── project, pipeline, report (capabilities 8–10, 14, 15) — add exports below this line

// ── surrogates, GAC, uncertainty (capabilities 11–13) — add exports below this line
