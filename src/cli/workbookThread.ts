/**
 * results.xlsx made on a worker thread (node:worker_threads) while this thread makes the report
 * and run.json: a long series' workbook (73,000 daily rows) costs about as much as the other
 * outputs together, and a second core does it at the same time. The bytes are those of
 * `resultsWorkbook` in this thread (the same function on the same texts). Small workbooks, and
 * runs from the TypeScript sources (tests), are made in this thread: a worker's start-up would
 * not pay. Outputs stay whole or nothing: the caller writes only once every file is made, and a
 * failure in the worker is an error of the run.
 */
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { resultsWorkbook } from '../report/resultsWorkbook.js';

/** Workbooks from CSV texts of at least this many characters are made on a worker thread. */
export const WORKBOOK_THREAD_MIN_CHARS = 1_000_000;

interface WorkbookJob { kind: 'sorbshare results.xlsx'; tables: Record<string, string>; created: string }
type WorkbookReply = { ok: true; bytes: Uint8Array } | { ok: false; message: string };

/** The workbook's bytes, made on a worker thread when the tables are large (see above). */
export function resultsWorkbookThreaded(tables: Record<string, string>, created: Date): Promise<Uint8Array> {
  const chars = Object.values(tables).reduce((n, t) => n + t.length, 0);
  if (chars < WORKBOOK_THREAD_MIN_CHARS || !import.meta.url.endsWith('.js')) return resultsWorkbook(tables, { created });
  const job: WorkbookJob = { kind: 'sorbshare results.xlsx', tables, created: created.toISOString() };
  // workers inherit the parent's node flags; --input-type (node --input-type=module -e …) is not valid for a file
  const execArgv = process.execArgv.filter((a) => !a.startsWith('--input-type'));
  return new Promise((resolve, reject) => {
    const worker = new Worker(new URL(import.meta.url), { workerData: job, execArgv });
    let settled = false;
    worker.once('message', (m: WorkbookReply) => {
      settled = true;
      if (m.ok) resolve(m.bytes);
      else reject(new Error(`results.xlsx: ${m.message}`));
    });
    worker.once('error', (e) => { settled = true; reject(e); });
    worker.once('exit', (code) => { if (!settled) reject(new Error(`results.xlsx: the worker thread stopped (exit code ${code}) before the workbook was made`)); });
  });
}

// the worker's side: make the workbook and hand its bytes back (moved, not copied)
const job = workerData as WorkbookJob | undefined;
if (!isMainThread && parentPort && job?.kind === 'sorbshare results.xlsx') {
  const port = parentPort;
  resultsWorkbook(job.tables, { created: new Date(job.created) }).then(
    (bytes) => port.postMessage({ ok: true, bytes } satisfies WorkbookReply, [bytes.buffer as ArrayBuffer]),
    (e: unknown) => port.postMessage({ ok: false, message: e instanceof Error ? e.message : String(e) } satisfies WorkbookReply),
  );
}
