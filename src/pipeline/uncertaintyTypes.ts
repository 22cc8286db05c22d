/**
 * Types of the Monte Carlo step's results (kept apart from the step so that the pipeline's result
 * types and the step do not import each other).
 */
import type { UncertaintySpec } from '../project/projectTypes.js';
import type { MonteCarloProblem } from '../uncertainty/monteCarloProblem.js';
import type { MonteCarloResult } from '../uncertainty/monteCarlo.js';

export interface UncertaintySettings extends UncertaintySpec {
  /** Where draws and seed came from. */
  source: string;
}

export interface UncertainParameter {
  parameter: string;
  distribution: 'lognormal' | 'normal';
  /** Relative SD (lognormal) or SD (normal; fractions as fractions of the DOC, ln K for K). */
  sd: number;
  basis: string;
}

export interface CarbonUncertainty {
  carbonName: string;
  parameters: UncertainParameter[];
  /** Compounds left out of the Monte Carlo, with the reason. */
  excluded: string[];
  problem: MonteCarloProblem;
  result: MonteCarloResult;
  /** P10–P90 band of the governing compound's removal against dose (percent). */
  governingCurve?: { compoundId: string; draws: number; dosesMgPerL: number[]; p10Percent: number[]; p50Percent: number[]; p90Percent: number[] };
  /** P10 and P90 of (governing dose of a draw)/(point estimate): the relative spread of the dose. */
  governingDoseRatio?: { p10: number; p90: number };
}

