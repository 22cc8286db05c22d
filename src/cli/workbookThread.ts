/**
 * results.xlsx made on a worker thread (node:worker_threads) while this thread makes the report
 * and run.json: a long series' workbook (73,000 daily rows) costs about as much as the other
 * outputs together, and a second core does it at the same time. The bytes are those of
 * `resultsWorkbook` in this thread (the same function on the same texts). Small workbooks, and
 * runs from the TypeScript sources (tests), are made in this thread: a worker's start-up would
 * not pay. A run whose tables will be long starts the worker when it begins
 * (`workbookThreadAhead`, `startWorkbookThread`): the worker boots and loads its modules while
 * the pipeline runs (measured: about 40 ms of CPU), then waits for its tables. (Warming its code
 * up on an invented table while it waits cost more CPU than it saved: measured 70 ms for 45.)
 * Outputs stay whole or nothing: the caller writes only once every file is made, a failure in the
 * worker is an error of the run, and a worker started ahead is ended when the run fails
 * (`release`).
 */
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { resultsWorkbook } from '../report/resultsWorkbook.js';
import type { PipelineInput } from '../pipeline/pipelineTypes.js';

/** Workbooks from CSV texts of at least this many characters are made on a worker thread. */
export const WORKBOOK_THREAD_MIN_CHARS = 1_000_000;

/**
 * Daily rows (days of the DOC series × PAC carbons) from which the worker is started when the run
 * begins: a row of daily_doses.csv has 64 characters or more (date, carbon, six numbers, the
 * governing goal, the currency), so the tables then pass WORKBOOK_THREAD_MIN_CHARS.
 */
export const WORKBOOK_THREAD_AHEAD_MIN_ROWS = Math.ceil(WORKBOOK_THREAD_MIN_CHARS / 64);

interface WorkbookJob { kind: 'sorbshare results.xlsx'; tables: Record<string, string>; created: string }
interface AheadData { kind: 'sorbshare results.xlsx ahead' }
type WorkbookReply = { ok: true; bytes: Uint8Array } | { ok: false; message: string };

/** A workbook worker started ahead of its tables (startWorkbookThread). */
export interface StartedWorkbookThread {
  /** End the worker unless it has handed back its workbook (a failed run, or tables never given); resolves once it has stopped. */
  release(): Promise<void>;
}

/** The worker behind a StartedWorkbookThread (only resultsWorkbookThreaded hands it its job). */
class AheadWorker implements StartedWorkbookThread {
  /** The worker failed or stopped before it was given its job. */
  dead = false;
  /** Its job was given (a worker makes one workbook). */
  taken = false;
  /** Its reply arrived. */
  replied = false;
  constructor(readonly worker: Worker) {
    worker.unref(); // waiting, it does not keep the process alive
    // a worker that fails before its job leaves the workbook to resultsWorkbookThreaded's other ways
    worker.on('error', () => { this.dead = true; });
    worker.on('exit', () => { this.dead = true; });
  }
  async release(): Promise<void> {
    if (this.replied || this.dead) return;
    this.taken = true;
    await this.worker.terminate();
  }
}

// workers inherit the parent's node flags; --input-type (node --input-type=module -e …) is not valid for a file
const workerExecArgv = (): string[] => process.execArgv.filter((a) => !a.startsWith('--input-type'));

/** Will the run's tables be long enough for the workbook worker to be started when the run begins? (WORKBOOK_THREAD_AHEAD_MIN_ROWS) */
export function workbookThreadAhead(input: PipelineInput): boolean {
  const days = input.series?.dates.length ?? 0;
  return days * input.project.carbons.filter((c) => c.type === 'PAC').length >= WORKBOOK_THREAD_AHEAD_MIN_ROWS;
}

/**
 * Start a workbook worker now, to be handed its tables later (`resultsWorkbookThreaded(…, started)`),
 * so that its start-up runs beside the pipeline. It does not keep the process alive while it
 * waits. Undefined when running from the TypeScript sources (no compiled worker file).
 */
export function startWorkbookThread(): StartedWorkbookThread | undefined {
  if (!import.meta.url.endsWith('.js')) return undefined;
  return new AheadWorker(new Worker(new URL(import.meta.url), { workerData: { kind: 'sorbshare results.xlsx ahead' } satisfies AheadData, execArgv: workerExecArgv() }));
}

/**
 * The workbook's bytes: on the worker `started` ahead if it is there and alive, otherwise on a new
 * worker thread when the tables are large (see above), otherwise in this thread.
 * @throws Error when the worker fails or stops before it hands the workbook back
 */
export function resultsWorkbookThreaded(tables: Record<string, string>, created: Date, started?: StartedWorkbookThread): Promise<Uint8Array> {
  const job: WorkbookJob = { kind: 'sorbshare results.xlsx', tables, created: created.toISOString() };
  const ahead = started instanceof AheadWorker ? started : undefined;
  if (ahead && !ahead.dead && !ahead.taken) {
    ahead.taken = true;
    ahead.worker.ref();
    const reply = workerReply(ahead.worker, () => { ahead.replied = true; });
    ahead.worker.postMessage(job);
    return reply;
  }
  const chars = Object.values(tables).reduce((n, t) => n + t.length, 0);
  if (chars < WORKBOOK_THREAD_MIN_CHARS || !import.meta.url.endsWith('.js')) return resultsWorkbook(tables, { created });
  return workerReply(new Worker(new URL(import.meta.url), { workerData: job, execArgv: workerExecArgv() }));
}

/** The workbook a worker hands back; rejects on its error, or if it stops first. */
function workerReply(worker: Worker, onReply?: () => void): Promise<Uint8Array> {
  return new Promise((resolve, reject) => {
    let settled = false;
    worker.once('message', (m: WorkbookReply) => {
      settled = true;
      onReply?.();
      if (m.ok) resolve(m.bytes);
      else reject(new Error(`results.xlsx: ${m.message}`));
    });
    worker.once('error', (e) => { if (!settled) { settled = true; reject(e); } });
    worker.once('exit', (code) => { if (!settled) { settled = true; reject(new Error(`results.xlsx: the worker thread stopped (exit code ${code}) before the workbook was made`)); } });
  });
}

// the worker's side: make the workbook and hand its bytes back (moved, not copied)
function makeAndReply(port: NonNullable<typeof parentPort>, job: WorkbookJob): void {
  resultsWorkbook(job.tables, { created: new Date(job.created) }).then(
    (bytes) => port.postMessage({ ok: true, bytes } satisfies WorkbookReply, [bytes.buffer as ArrayBuffer]),
    (e: unknown) => port.postMessage({ ok: false, message: e instanceof Error ? e.message : String(e) } satisfies WorkbookReply),
  );
}
const data = workerData as WorkbookJob | AheadData | undefined;
if (!isMainThread && parentPort && data?.kind === 'sorbshare results.xlsx') makeAndReply(parentPort, data);
if (!isMainThread && parentPort && data?.kind === 'sorbshare results.xlsx ahead') {
  const port = parentPort;
  port.once('message', (job: WorkbookJob) => makeAndReply(port, job));
}
