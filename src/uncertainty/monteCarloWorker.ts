/**
 * Worker-thread entry of `parallelMonteCarlo`: compiles the problem, runs the chunks it was
 * given (each from its own seeded stream) and posts each chunk's values back. Errors are posted
 * as plain data so the main thread can rethrow the same error type.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { workerErrorMessage, type WorkerErrorMessage } from './workerError.js';
import { compileDrawModel, runChunk } from './monteCarloDraw.js';
import type { MonteCarloProblem } from './monteCarloProblem.js';

export interface WorkerInput {
  problem: MonteCarloProblem;
  seed: number;
  chunks: Array<{ chunk: number; count: number }>;
}

export type WorkerMessage =
  | { type: 'chunk'; chunk: number; count: number; values: Float64Array; governing: Int32Array }
  | { type: 'done' }
  | WorkerErrorMessage;

const port = parentPort;
if (port) {
  const input = workerData as WorkerInput;
  try {
    const model = compileDrawModel(input.problem);
    for (const { chunk, count } of input.chunks) {
      const r = runChunk(model, input.seed, chunk, count);
      const msg: WorkerMessage = { type: 'chunk', chunk: r.chunk, count: r.count, values: r.values, governing: r.governing };
      port.postMessage(msg, [r.values.buffer as ArrayBuffer, r.governing.buffer as ArrayBuffer]);
    }
    port.postMessage({ type: 'done' } satisfies WorkerMessage);
  } catch (e) {
    port.postMessage(workerErrorMessage(e) satisfies WorkerMessage);
  }
}
