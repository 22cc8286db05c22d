/**
 * Monte Carlo propagation of isotherm, background and DOC uncertainty to carbon doses, the UV254
 * set-point and the yearly carbon cost (in this thread; `parallelMonteCarlo` spreads the same
 * chunks over worker threads and gives identical results).
 *
 * Draws are split into chunks of CHUNK_SIZE; chunk k uses its own stream chunkRng(seed, k), so
 * the result depends only on (problem, draws, seed). Output: the point estimate (all deviations
 * zero) and the 10th, 50th and 90th percentiles of each quantity, Hyndman & Fan (1996) type 7.
 */
import { InputError } from '../core/errors.js';
import { compileDrawModel, evaluateDraw, runChunk, sampleParameters, type ChunkResult, type DrawModel } from './monteCarloDraw.js';
import type { MonteCarloProblem } from './monteCarloProblem.js';
import { PERCENTILE_METHOD, percentileSorted } from '../numerics/percentile.js';

/** Draws per chunk (each chunk has its own random stream). */
export const CHUNK_SIZE = 250;
/** Largest number of Monte Carlo draws accepted. */
export const MAX_DRAWS = 10_000_000;

export const SAMPLING_NOTE =
  'positive parameters with a relative SD are lognormal with the point value as median; covariance parameters (ln K, fraction, 1/n) jointly normal; ' +
  'background fractions renormalised to sum to 1 in every draw; generator xoshiro128** seeded by SplitMix64 per chunk of draws';

export interface MonteCarloOptions {
  /** Number of draws (1 … 10 000 000). */
  draws: number;
  /** Master seed, integer 0 … 2^32 − 1. */
  seed: number;
  /** Called after each chunk with (draws done, total). */
  onProgress?: (done: number, total: number) => void;
  /** Keep every draw's values in the result (`samples`). */
  keepSamples?: boolean;
}

export interface QuantitySummary {
  key: string;
  label: string;
  unit: string;
  /** Value with every deviation zero. */
  pointEstimate: number;
  p10: number;
  p50: number;
  p90: number;
  /** Draws in which the goal was not reached by any dose up to 5 g/L (value +Infinity). */
  unreachableDraws: number;
}

export interface MonteCarloResult {
  draws: number;
  seed: number;
  chunkSize: number;
  percentileMethod: string;
  sampling: string;
  quantities: QuantitySummary[];
  /** Share of draws in which each target governs (needs the largest dose). */
  governingShare: Array<{ id: string; share: number }>;
  samples?: Record<string, Float64Array>;
  execution: { mode: 'in-thread' | 'workers'; workers: number; note?: string };
}

export function checkOptions(o: MonteCarloOptions): void {
  if (!Number.isInteger(o.draws) || o.draws < 1 || o.draws > MAX_DRAWS) throw new InputError(`expected the number of draws as an integer from 1 to ${MAX_DRAWS}, got ${o.draws}`, { path: 'draws' });
  if (!Number.isInteger(o.seed) || o.seed < 0 || o.seed > 0xffffffff) throw new InputError(`expected the seed as an integer from 0 to 4294967295, got ${o.seed}`, { path: 'seed' });
}

/** The chunks of a run: consecutive blocks of CHUNK_SIZE draws (the last may be shorter). */
export function planChunks(draws: number): Array<{ chunk: number; count: number }> {
  const out: Array<{ chunk: number; count: number }> = [];
  for (let start = 0, k = 0; start < draws; start += CHUNK_SIZE, k++) out.push({ chunk: k, count: Math.min(CHUNK_SIZE, draws - start) });
  return out;
}

/** Point estimate of every quantity (all deviations zero, same arithmetic as the draws). */
export function pointEstimate(model: DrawModel): Float64Array {
  const row = new Float64Array(model.quantities.length);
  evaluateDraw(model, sampleParameters(model, undefined), row);
  return row;
}

/** Percentiles and shares from the chunk results (in chunk order). */
export function summarise(model: DrawModel, chunks: ChunkResult[], options: MonteCarloOptions, execution: MonteCarloResult['execution']): MonteCarloResult {
  const ordered = [...chunks].sort((a, b) => a.chunk - b.chunk);
  const nq = model.quantities.length;
  const draws = ordered.reduce((s, c) => s + c.count, 0);
  const point = pointEstimate(model);
  const T = model.problem.targets.length;
  const counts = new Array<number>(T + 1).fill(0);
  const columns = model.quantities.map(() => new Float64Array(draws));
  let i = 0;
  for (const c of ordered) {
    for (let k = 0; k < c.count; k++, i++) {
      for (let q = 0; q < nq; q++) columns[q]![i] = c.values[k * nq + q]!;
      const g = c.governing[k]!;
      if (g >= 0) counts[g]!++;
    }
  }
  const samples: Record<string, Float64Array> = {};
  const quantities = model.quantities.map((def, q): QuantitySummary => {
    const col = columns[q]!;
    if (options.keepSamples) samples[def.key] = Float64Array.from(col);
    col.sort();
    let unreachable = 0;
    for (let k = col.length - 1; k >= 0 && col[k] === Infinity; k--) unreachable++;
    return {
      ...def,
      pointEstimate: point[q]!,
      p10: percentileSorted(col, 0.1),
      p50: percentileSorted(col, 0.5),
      p90: percentileSorted(col, 0.9),
      unreachableDraws: unreachable,
    };
  });
  const result: MonteCarloResult = {
    draws,
    seed: options.seed,
    chunkSize: CHUNK_SIZE,
    percentileMethod: PERCENTILE_METHOD,
    sampling: SAMPLING_NOTE,
    quantities,
    governingShare: [...model.problem.targets.map((t, k) => ({ id: t.id, share: counts[k]! / draws })), ...(model.problem.indicator ? [{ id: 'indicator mean', share: counts[T]! / draws }] : [])],
    execution,
  };
  if (options.keepSamples) result.samples = samples;
  return result;
}

/**
 * Monte Carlo over the problem's uncertain parameters, in this thread (`compiled`: the problem's
 * compiled model when the caller has it).
 * @throws InputError for an invalid problem or options; ComputationError if a solve fails.
 */
export function monteCarlo(problem: MonteCarloProblem, options: MonteCarloOptions, compiled?: DrawModel): MonteCarloResult {
  checkOptions(options);
  const model = compiled && compiled.problem === problem ? compiled : compileDrawModel(problem); // the caller's compiled model saves compiling twice
  const chunks: ChunkResult[] = [];
  let done = 0;
  for (const { chunk, count } of planChunks(options.draws)) {
    chunks.push(runChunk(model, options.seed, chunk, count));
    done += count;
    options.onProgress?.(done, options.draws);
  }
  return summarise(model, chunks, options, { mode: 'in-thread', workers: 0 });
}
