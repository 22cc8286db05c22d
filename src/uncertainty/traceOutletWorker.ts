/**
 * Worker-thread entry of `sharedTraceOutlets`: rebuilds the stored background (TraceBed data),
 * then claims target indices from the shared counter (Atomics) and posts each outlet c/c0 back,
 * until every index is claimed. Errors are posted as plain data so the main thread can rethrow
 * the same error type. Its input comes as workerData, or, for a worker started ahead of its work
 * (`startTraceOutletWorker`, workerData `{ pending: true }`), as the first message
 * `{ type: 'input', input }`; a pending worker that receives `{ type: 'stop' }` ends.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { workerErrorMessage, type WorkerErrorMessage } from './workerError.js';
import { traceBedFromData, type TraceBedData } from '../kinetics/fixedBed.js';
import type { FixedBedComponent } from '../kinetics/fixedBedInput.js';

export interface TraceOutletWorkerInput {
  bed: TraceBedData;
  targets: FixedBedComponent[];
  /** Int32Array[1] over a SharedArrayBuffer: the next unclaimed target index. */
  next: SharedArrayBuffer;
}

/** Messages to a worker started ahead of its work. */
export type TraceOutletWorkerCommand = { type: 'input'; input: TraceOutletWorkerInput } | { type: 'stop' };

export type TraceOutletWorkerMessage =
  | { type: 'outlet'; index: number; cOverC0: Float64Array }
  | { type: 'done' }
  | WorkerErrorMessage;

const port = parentPort;
if (port) {
  const data = workerData as TraceOutletWorkerInput | { pending: true };
  if ('pending' in data) {
    port.once('message', (m: TraceOutletWorkerCommand) => { if (m.type === 'input') run(m.input); else port.close(); });
  } else run(data);
}

/** Claim targets and post their outlets until none is left (see the file comment). */
function run(input: TraceOutletWorkerInput): void {
  const out = parentPort!;
  const next = new Int32Array(input.next);
  try {
    const tb = traceBedFromData(input.bed);
    for (;;) {
      const i = Atomics.add(next, 0, 1);
      if (i >= input.targets.length) break;
      const c = Float64Array.from(tb.outlet(input.targets[i]!).cOverC0);
      out.postMessage({ type: 'outlet', index: i, cOverC0: c } satisfies TraceOutletWorkerMessage, [c.buffer as ArrayBuffer]);
    }
    out.postMessage({ type: 'done' } satisfies TraceOutletWorkerMessage);
  } catch (e) {
    out.postMessage(workerErrorMessage(e) satisfies TraceOutletWorkerMessage);
  }
}
