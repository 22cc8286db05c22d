/**
 * results.xlsx of a large run is made on a worker thread (the compiled module, as the CLI runs
 * it): the bytes are those of resultsWorkbook in this thread (the reference), and a small
 * workbook stays in this thread. A worker started ahead (startWorkbookThread) gives the same
 * bytes, is ended by release when it was not used or the run failed, and a released one leaves
 * the workbook to the other ways. Invented table contents.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { requireBuild } from '../helpers/cliHarness.js';
import { resultsWorkbook } from '../../src/report/resultsWorkbook.js';

interface Started { release(): Promise<void> }
type Threaded = {
  resultsWorkbookThreaded: (t: Record<string, string>, d: Date, started?: Started) => Promise<Uint8Array>;
  startWorkbookThread: () => Started | undefined;
  workbookThreadAhead: (input: unknown) => boolean;
  WORKBOOK_THREAD_MIN_CHARS: number;
  WORKBOOK_THREAD_AHEAD_MIN_ROWS: number;
};
let mod: Threaded;

beforeAll(async () => {
  requireBuild();
  mod = (await import(pathToFileURL(join(process.cwd(), 'dist/cli/workbookThread.js')).href)) as Threaded;
});

function tables(rows: number): Record<string, string> {
  const lines = ['date,carbon,dose (mg/L),governed by'];
  for (let k = 0; k < rows; k++) lines.push(`2000-01-${String(1 + (k % 28)).padStart(2, '0')},Invented PAC,${(10 + (k % 97) / 7).toPrecision(8)},compound X${k % 3}`);
  return { 'daily_doses.csv': lines.join('\n') + '\n', 'carbons.csv': 'carbon,price per kg\nInvented PAC,2.5\n' };
}

describe('results.xlsx on a worker thread', () => {
  it('gives the same bytes as in this thread for a large workbook', async () => {
    const t = tables(30_000);
    expect(Object.values(t).reduce((n, s) => n + s.length, 0)).toBeGreaterThan(mod.WORKBOOK_THREAD_MIN_CHARS);
    const when = new Date(Date.UTC(2026, 0, 2, 3, 4, 5));
    const [threaded, here] = await Promise.all([mod.resultsWorkbookThreaded(t, when), resultsWorkbook(t, { created: when })]);
    expect(Buffer.from(threaded).equals(Buffer.from(here))).toBe(true);
  });

  it('gives the same bytes for a small workbook (made in this thread)', async () => {
    const t = tables(10);
    const when = new Date(Date.UTC(2026, 0, 2));
    expect(Buffer.from(await mod.resultsWorkbookThreaded(t, when)).equals(Buffer.from(await resultsWorkbook(t, { created: when })))).toBe(true);
  });

  it('gives the same bytes on a worker started ahead, for a large and a small workbook', async () => {
    const when = new Date(Date.UTC(2026, 0, 2, 3, 4, 5));
    for (const rows of [30_000, 10]) {
      const t = tables(rows);
      const started = mod.startWorkbookThread()!;
      expect(started).toBeDefined();
      await new Promise((r) => setTimeout(r, 50)); // it boots meanwhile
      const threaded = await mod.resultsWorkbookThreaded(t, when, started);
      expect(Buffer.from(threaded).equals(Buffer.from(await resultsWorkbook(t, { created: when }))), `${rows} rows`).toBe(true);
      await started.release(); // after its reply: nothing to end
    }
  });

  it('release ends a worker started ahead that was not used; the workbook is then made the other ways', async () => {
    const started = mod.startWorkbookThread()!;
    await started.release();
    await started.release(); // twice is fine
    const t = tables(10);
    const when = new Date(Date.UTC(2026, 0, 2));
    expect(Buffer.from(await mod.resultsWorkbookThreaded(t, when, started)).equals(Buffer.from(await resultsWorkbook(t, { created: when })))).toBe(true);
  });

  it('release during the job (a failure elsewhere) ends the worker: the workbook fails with a message, nothing hangs', async () => {
    const started = mod.startWorkbookThread()!;
    const workbook = mod.resultsWorkbookThreaded(tables(30_000), new Date(Date.UTC(2026, 0, 2)), started);
    await started.release();
    await expect(workbook).rejects.toThrow(/results\.xlsx: the worker thread stopped/);
  });

  it('is started ahead from WORKBOOK_THREAD_AHEAD_MIN_ROWS daily rows (days × PAC carbons) on', () => {
    const input = (days: number, types: string[]) => ({ series: days ? { dates: new Array<string>(days).fill('2000-01-01') } : undefined, project: { carbons: types.map((type) => ({ type })) } });
    const n = mod.WORKBOOK_THREAD_AHEAD_MIN_ROWS;
    expect(n * 64).toBeGreaterThanOrEqual(mod.WORKBOOK_THREAD_MIN_CHARS);
    expect(mod.workbookThreadAhead(input(Math.ceil(n / 2), ['PAC', 'PAC', 'GAC']))).toBe(true);
    expect(mod.workbookThreadAhead(input(Math.ceil(n / 2) - 1, ['PAC', 'PAC', 'GAC']))).toBe(false);
    expect(mod.workbookThreadAhead(input(n, ['GAC']))).toBe(false);
    expect(mod.workbookThreadAhead(input(0, ['PAC']))).toBe(false);
    expect(mod.workbookThreadAhead(input(365, ['PAC', 'PAC', 'GAC']))).toBe(false); // the demo
  });
});
