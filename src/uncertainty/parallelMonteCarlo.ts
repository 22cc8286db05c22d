/**
 * The Monte Carlo run spread over worker threads (node:worker_threads). The draws are cut into
 * the same seeded chunks as in `monteCarlo` (chunk k uses chunkRng(seed, k)); chunks are dealt
 * to workers round-robin and reassembled in chunk order, so the percentiles are identical to the
 * in-thread run whatever the number of workers.
 *
 * Which file the workers load: from the compiled library (`dist/uncertainty/*.js`) the worker is
 * the sibling `monteCarloWorker.js`. From the TypeScript sources (vitest, tsx) it is the sibling
 * `monteCarloWorker.ts`, loaded by a bootstrap that registers tsx's ESM loader when tsx resolves;
 * otherwise the run falls back to this thread (the result is the same, `execution` says so).
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { ComputationError, InputError } from '../core/errors.js';
import { compileDrawModel, type ChunkResult } from './monteCarloDraw.js';
import { checkOptions, monteCarlo, planChunks, summarise, type MonteCarloOptions, type MonteCarloResult } from './monteCarlo.js';
import type { MonteCarloProblem } from './monteCarloProblem.js';
import type { WorkerInput, WorkerMessage } from './monteCarloWorker.js';
import { workerEntry, type WorkerEntry } from './workerEntry.js';
import { errorFromWorker } from './workerError.js';

/**
 * Below this many dose searches (draws × targets × (1 + DOC levels when a yearly cost is asked))
 * the workers' start-up and JIT warm-up do not pay; the run stays in this thread. Measured on the
 * 2-core machine from dist: 10,000 single-target draws took 0.33 s in-thread and 0.53 s on 2
 * workers; 50,000 took 1.37 s and 1.10 s (break-even near 30,000 at about 30 µs per search).
 * Since a dose comes from the model's inverse and the checks from bounded estimates, a search
 * costs about 5 times less (the demo's 500 draws: 45,000 searches, about 0.2 s of CPU per carbon,
 * while starting two workers cost about 0.5 s of wall time on the loaded 2-core machine), so the
 * break-even moved up in proportion.
 */
export const PARALLEL_MIN_SEARCHES = 150_000;

export interface ParallelOptions extends MonteCarloOptions {
  /** Number of worker threads (default: available cores, at most 8). 0 forces in-thread. */
  workers?: number;
  /** Use workers even below PARALLEL_MIN_SEARCHES (for tests). */
  force?: boolean;
}

/** Locate the Monte Carlo worker file for the way this module is running; undefined when none can run. */
export function resolveWorkerEntry(): WorkerEntry | undefined {
  return workerEntry('monteCarloWorker');
}

function rebuildError(m: Extract<WorkerMessage, { type: 'error' }>): Error {
  return errorFromWorker(m) ?? new Error(`Monte Carlo worker failed: ${m.message}`);
}

function runWorker(entry: WorkerEntry, input: WorkerInput, onChunk: (c: ChunkResult) => void): { done: Promise<void>; worker: Worker } {
  // Workers inherit the parent's node flags; --input-type (from `node --input-type=module -e …`)
  // is refused for a file entry, so it is dropped.
  const execArgv = process.execArgv.filter((a) => !a.startsWith('--input-type'));
  const worker = entry.kind === 'file' ? new Worker(entry.url, { workerData: input, execArgv }) : new Worker(entry.code, { eval: true, workerData: input, execArgv });
  const done = new Promise<void>((resolve, reject) => {
    let finished = false;
    worker.on('message', (m: WorkerMessage) => {
      if (m.type === 'chunk') onChunk({ chunk: m.chunk, count: m.count, values: m.values, governing: m.governing });
      else if (m.type === 'done') { finished = true; resolve(); }
      else { finished = true; reject(rebuildError(m)); }
    });
    worker.on('error', (e) => { finished = true; reject(e); });
    worker.on('exit', (code) => {
      if (!finished) reject(new ComputationError(`Monte Carlo worker stopped (exit code ${code}) before finishing`));
    });
  });
  return { done, worker };
}

/**
 * Monte Carlo over worker threads; same result as `monteCarlo(problem, options)`.
 * @throws InputError for an invalid problem or options; ComputationError if a solve fails.
 */
export async function parallelMonteCarlo(problem: MonteCarloProblem, options: ParallelOptions): Promise<MonteCarloResult> {
  checkOptions(options);
  const model = compileDrawModel(problem); // validates before any worker starts
  const cores = Math.max(1, Math.min(8, availableParallelism()));
  const requested = options.workers ?? cores;
  if (!Number.isInteger(requested) || requested < 0) throw new InputError(`expected the number of workers as an integer ≥ 0, got ${requested}`, { path: 'workers' });
  const plan = planChunks(options.draws);
  const nWorkers = Math.min(requested, plan.length);
  const inThread = (note: string): MonteCarloResult => {
    const r = monteCarlo(problem, options, model);
    r.execution.note = note;
    return r;
  };
  if (nWorkers === 0) return inThread('workers = 0');
  const searches = options.draws * problem.targets.length * (1 + (problem.yearly ? problem.yearly.docNodesMgPerL?.length ?? 5 : 0));
  if (!options.force && (searches < PARALLEL_MIN_SEARCHES || nWorkers < 2)) return inThread(nWorkers < 2 ? 'one core or one chunk' : `fewer than ${PARALLEL_MIN_SEARCHES} dose searches; workers would not pay`);
  const entry = resolveWorkerEntry();
  if (!entry) return inThread('worker file not found (run from the built library for parallel runs)');

  const chunks: ChunkResult[] = [];
  let done = 0;
  const assignments = Array.from({ length: nWorkers }, (_, w) => plan.filter((_, k) => k % nWorkers === w));
  const running = assignments.map((ch) =>
    runWorker(entry, { problem, seed: options.seed, chunks: ch }, (c) => {
      chunks.push(c);
      done += c.count;
      options.onProgress?.(done, options.draws);
    }),
  );
  try {
    await Promise.all(running.map((r) => r.done));
  } catch (e) {
    await Promise.all(running.map((r) => r.worker.terminate()));
    throw e;
  }
  return summarise(model, chunks, options, { mode: 'workers', workers: nWorkers });
}
