/**
 * results.xlsx of a large run is made on a worker thread (the compiled module, as the CLI runs
 * it): the bytes are those of resultsWorkbook in this thread (the reference), and a small
 * workbook stays in this thread. Invented table contents.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { requireBuild } from '../helpers/cliHarness.js';
import { resultsWorkbook } from '../../src/report/resultsWorkbook.js';

type Threaded = { resultsWorkbookThreaded: (t: Record<string, string>, d: Date) => Promise<Uint8Array>; WORKBOOK_THREAD_MIN_CHARS: number };
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
});
