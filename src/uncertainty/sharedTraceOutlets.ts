/**
 * The outlets of many trace targets against one stored fixed-bed background (TraceBed), shared
 * between this thread and one worker thread (node:worker_threads): both claim the next target
 * from one counter in shared memory (Atomics), so the worker can begin while this thread does
 * other work (the PAC draws) and the two split what is left. Each outlet is a pure function of
 * its target, so the results, put back in target order, are identical to computing them all in
 * this thread. Without a worker (one core, workers 0, fewer than SHARED_MIN_TARGETS targets, or no worker file:
 * src/uncertainty/workerEntry.ts) everything runs in this thread; a worker that fails to start
 * leaves its unfinished targets to this thread. A worker started ahead of the work
 * (startTraceOutletWorker, while this thread runs the pipeline) is used from
 * SHARED_MIN_TARGETS_STARTED targets on.
 * @throws InputError / ComputationError from an outlet (from either thread, rethrown as such)
 */
import { availableParallelism, loadavg } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { TraceBed } from '../kinetics/fixedBed.js';
import type { FixedBedComponent } from '../kinetics/fixedBedInput.js';
import type { TraceOutletWorkerCommand, TraceOutletWorkerInput, TraceOutletWorkerMessage } from './traceOutletWorker.js';
import { workerEntry } from './workerEntry.js';
import { firstIdleReading, idleReading } from './idleReading.js';
import { errorFromWorker } from './workerError.js';

/**
 * Fewest targets for which a worker is started (ours). An outlet of the demo's compounds costs
 * 20–50 ms of CPU in a warm thread, but the worker starts cold: measured on the 2-core machine
 * under a load of about 9, the demo's 45 drawn outlets took 1.7–1.9 s of CPU in this thread
 * (warm from the run) and 3.5–3.7 s on a worker alone (JIT warm-up in a fresh isolate), about
 * 1.8 s more. With the worker from 8 targets on, `sorbshare demo` (45 outlets) was no faster at a
 * load of 1 (3.98 against 3.96 s) and slower at a load of 2.7 (7.9 against 5.4 s wall, 7.2 against
 * 5.2 s of CPU). The worker takes about half the outlets, so it pays once that half costs more
 * than its warm-up: from about 150 outlets at 25 ms each; 200 keeps a margin.
 */
export const SHARED_MIN_TARGETS = 200;

/**
 * Fewest targets for which a worker started ahead of the work (startTraceOutletWorker) is used
 * (ours): it has booted and loaded its modules while this thread ran the pipeline, so only its
 * JIT warm-up is left against its share of the outlets.
 */
export const SHARED_MIN_TARGETS_STARTED = 20;

/** A worker thread started ahead of its work (it waits for its targets); see startTraceOutletWorker. */
export interface StartedTraceWorker {
  readonly worker: Worker;
  /** Taken by a sharedTraceOutlets run (a worker serves one run). */
  taken: boolean;
  /** End the worker if no run took it. */
  release(): Promise<void>;
}

/**
 * Is a core free for a worker started ahead? At least two cores, and since the first idle reading
 * (src/uncertainty/idleReading.ts: the CLI's start-up) the machine's idle time was at least 0.6 of
 * a core; within the first 50 ms, a 1-minute load average at most one below the number of cores. Ours: on a machine already
 * busy, a worker's start-up and JIT warm-up cost more than its share of the outlets saves
 * (measured on 2 cores, the demo with its 45 GAC outlets took 4.2 s with the worker against 5.1 s
 * without on an idle machine, and 6.1–6.4 s against 4.9–5.3 s at a load of 4.4). Speed only: the
 * outlets are the same either way.
 */
export function spareCore(): boolean {
  const cores = availableParallelism();
  if (cores < 2) return false;
  const now = idleReading();
  const wallMs = now.atMs - firstIdleReading.atMs;
  if (wallMs >= 50) return (now.idleMs - firstIdleReading.idleMs) / wallMs >= 0.6;
  return loadavg()[0]! <= cores - 1;
}

/**
 * Start a trace-outlet worker now, to be handed its targets later (`sharedTraceOutlets(…, { started })`),
 * so that its start-up (a fresh isolate loading its modules) runs beside this thread's work;
 * undefined on one core or without a worker file.
 */
export function startTraceOutletWorker(): StartedTraceWorker | undefined {
  if (availableParallelism() < 2) return undefined;
  const entry = workerEntry('traceOutletWorker');
  if (!entry) return undefined;
  const execArgv = process.execArgv.filter((a) => !a.startsWith('--input-type'));
  const pending = { pending: true };
  const worker = entry.kind === 'file' ? new Worker(entry.url, { workerData: pending, execArgv }) : new Worker(entry.code, { eval: true, workerData: pending, execArgv });
  worker.unref();
  worker.on('error', () => undefined); // a worker that fails leaves its targets to this thread (sharedTraceOutlets)
  const started: StartedTraceWorker = {
    worker,
    taken: false,
    async release() { if (!started.taken) { started.taken = true; await worker.terminate(); } },
  };
  return started;
}

export interface SharedTraceOutlets {
  /** Worker threads started (0 or 1). */
  readonly workers: number;
  /** Outlets the worker computed (known after finish). */
  readonly byWorker: number;
  /** Compute the unclaimed targets in this thread, wait for the worker, and return every outlet c/c0 (0 first) in target order. */
  finish(): Promise<number[][]>;
  /** Stop: no more targets are claimed and the worker is ended (after a failure elsewhere). */
  cancel(): Promise<void>;
}

/** Start the outlets of `targets` against `tb` (see the file comment); `workers` 0 keeps them in this thread. */
export function sharedTraceOutlets(tb: TraceBed, targets: readonly FixedBedComponent[], options: {
  workers?: number;
  /** Leave every target to the worker (tests; default false). */
  workerOnly?: boolean;
  /** A worker started ahead (startTraceOutletWorker): used from SHARED_MIN_TARGETS_STARTED targets, if no run took it yet. */
  started?: StartedTraceWorker;
} = {}): SharedTraceOutlets {
  const n = targets.length;
  const next = new Int32Array(new SharedArrayBuffer(4));
  const results: Array<number[] | undefined> = new Array(n);
  const wanted = Math.min(1, options.workers ?? 1);
  const pre = options.started;
  const usePre = wanted > 0 && pre !== undefined && !pre.taken && (n >= SHARED_MIN_TARGETS_STARTED || (options.workerOnly === true && n >= 1));
  const entry = !usePre && wanted > 0 && (n >= SHARED_MIN_TARGETS || (options.workerOnly && n >= 1)) && availableParallelism() >= 2 ? workerEntry('traceOutletWorker') : undefined;
  let worker: Worker | undefined;
  let byWorker = 0;
  let settled: Promise<Error | undefined> = Promise.resolve(undefined);
  if (usePre || entry) {
    const input: TraceOutletWorkerInput = { bed: tb.data(), targets: targets.map((t) => ({ ...t })), next: next.buffer as SharedArrayBuffer };
    let w: Worker;
    if (usePre) {
      pre.taken = true;
      w = pre.worker;
      w.ref();
      w.postMessage({ type: 'input', input } satisfies TraceOutletWorkerCommand);
    } else {
      const execArgv = process.execArgv.filter((a) => !a.startsWith('--input-type'));
      w = entry!.kind === 'file' ? new Worker(entry!.url, { workerData: input, execArgv }) : new Worker(entry!.code, { eval: true, workerData: input, execArgv });
    }
    worker = w;
    // resolves with the worker's input or computation error (to rethrow), undefined otherwise
    // (done, or failed in another way: its unfinished targets are then computed here)
    settled = new Promise((resolve) => {
      let finished = false;
      w.on('message', (m: TraceOutletWorkerMessage) => {
        if (m.type === 'outlet') { results[m.index] = Array.from(m.cOverC0); byWorker++; }
        else if (m.type === 'done') { finished = true; resolve(undefined); }
        else {
          finished = true;
          resolve(errorFromWorker(m));
        }
      });
      w.on('error', () => { finished = true; resolve(undefined); });
      w.on('exit', () => { if (!finished) resolve(undefined); });
    });
  }
  const allDone = () => { for (let i = 0; i < n; i++) if (results[i] === undefined) return false; return true; };
  const stop = async () => {
    Atomics.store(next, 0, n);
    if (worker) await worker.terminate();
  };
  return {
    workers: worker ? 1 : 0,
    get byWorker() { return byWorker; },
    async finish() {
      try {
        for (;;) {
          if (worker && options.workerOnly) break;
          const i = Atomics.add(next, 0, 1);
          if (i >= n) break;
          results[i] = tb.outlet(targets[i]!).cOverC0;
        }
      } catch (e) {
        await stop();
        throw e;
      }
      // every target done here (the worker still starting, or it claimed none): no need to wait for it
      const err = allDone() ? undefined : await settled;
      if (worker) await worker.terminate();
      if (err) throw err;
      // a worker that stopped early leaves targets it had claimed
      for (let i = 0; i < n; i++) if (!results[i]) results[i] = tb.outlet(targets[i]!).cOverC0;
      return results as number[][];
    },
    cancel: stop,
  };
}
