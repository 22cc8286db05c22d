/**
 * Output formats of `run`/`demo`: results.xlsx (one sheet per CSV table, numbers as numbers, the
 * same values as the CSV files; read back with exceljs) and `--pdf` (A4 pages printed by the
 * installed Chromium, the text holding the headline figures; text extracted with poppler's
 * pdftotext). Without a browser, `--pdf` fails with exit 1 and the reason, and writes nothing.
 * The workbook is read from the worker's shared demo run (`sharedDemoRun`: the demo with its
 * draws, read only); the failing `--pdf` runs a small fixture project, since it fails the same way
 * after any run.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { BIN, requireBuild, scratchDir } from '../helpers/cliHarness.js';
import { sharedDemoRun } from '../helpers/sharedDemo.js';
import { CHROMIUM, HAVE_CHROMIUM, IN_CI } from './browserHarness.js';
import { parseCsv, cellValue } from '../../src/report/resultsWorkbook.js';

const which = (cmd: string) => spawnSync('which', [cmd]).status === 0;
const HAVE_PDFTOTEXT = which('pdftotext') && which('pdfinfo');

function run(args: string[], env: NodeJS.ProcessEnv = {}) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', env: { ...process.env, ...env } });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

let outDir = '';
interface Summary { carbons: Array<{ carbon: string; required_dose_mg_per_L: number | null; yearly_cost: number | null; currency: string }> }

describe('results.xlsx', () => {
  beforeAll(() => {
    const r = sharedDemoRun(); // sorbshare demo --out DIR --json
    expect(r.code, r.err).toBe(0);
    outDir = r.outDir;
  }, 120_000);

  it('holds one sheet per CSV table with the same header and the same numbers, numbers as numbers', async () => {
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile(join(outDir, 'results.xlsx'));
    const csvs = readdirSync(outDir).filter((f) => f.endsWith('.csv')).sort();
    expect(wb.worksheets.map((w) => w.name).sort()).toEqual(csvs.map((f) => f.replace(/\.csv$/, '')));
    let numbers = 0;
    for (const f of csvs) {
      const rows = parseCsv(readFileSync(join(outDir, f), 'utf8'));
      const ws = wb.getWorksheet(f.replace(/\.csv$/, ''))!;
      expect(ws.rowCount, f).toBe(rows.length);
      rows.forEach((row, i) => {
        const got = ws.getRow(i + 1);
        row.forEach((text, j) => {
          const v = got.getCell(j + 1).value;
          if (i === 0) { expect(v, `${f} header ${j}`).toBe(text); return; }
          const want = cellValue(text);
          if (typeof want === 'number') { numbers++; expect(typeof v, `${f} row ${i + 1} col ${j + 1}`).toBe('number'); expect(v).toBe(want); }
          else expect(v ?? null, `${f} row ${i + 1} col ${j + 1}`).toBe(want);
        });
      });
    }
    expect(numbers).toBeGreaterThan(1000);
    // units stay in the headers
    const carbons = wb.getWorksheet('carbons')!;
    expect(carbons.getRow(1).values).toContain('required dose (mg/L)');
  });
});

describe('--pdf', () => {
  it.runIf(IN_CI && (!HAVE_CHROMIUM || !HAVE_PDFTOTEXT))('needs chromium and poppler-utils in CI', () => {
    expect.fail(`CI must install chromium (${CHROMIUM}) and poppler-utils (pdftotext): see .ci/run`);
  });

  it.skipIf(!HAVE_CHROMIUM || !HAVE_PDFTOTEXT)('writes an A4 report.pdf of several pages whose text holds the headline figures', () => {
    requireBuild();
    const dir = join(scratchDir('sorbshare-pdf-').dir, 'out');
    const r = run(['demo', '--draws', '0', '--out', dir, '--pdf', '--json']);
    expect(r.code, r.err).toBe(0);
    const pdf = join(dir, 'report.pdf');
    expect(readFileSync(pdf).subarray(0, 5).toString()).toBe('%PDF-');
    const info = execFileSync('pdfinfo', [pdf], { encoding: 'utf8' });
    expect(Number(/Pages:\s+(\d+)/.exec(info)![1])).toBeGreaterThanOrEqual(5);
    expect(info).toMatch(/\(A4\)/);
    const text = execFileSync('pdftotext', [pdf, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    const s = JSON.parse(r.out) as Summary;
    for (const c of s.carbons.filter((x) => x.required_dose_mg_per_L !== null)) {
      expect(text).toContain(`${Number(c.required_dose_mg_per_L!.toPrecision(3))} mg/L`);
      expect(text).toContain(`${Math.round(c.yearly_cost!).toLocaleString('en-US')} ${c.currency}`);
    }
    expect(text).toContain('all goals met');
    expect(text).toContain('Lowest yearly carbon cost (EUR)');
    expect(text).toContain('References');
    expect(text).toContain('licensed engineer');
    expect(text).not.toMatch(/from memory/i);
  }, 180_000);

  it('without Chromium: exit 1 with the reason before the run starts (no progress of the run), nothing written', () => {
    requireBuild();
    for (const [cmd, ...args] of [['run', join(process.cwd(), 'fixtures/project/surrogates-gac-mc/project.json'), '--draws', '0'], ['demo', '--contact', '--draws', '0']]) {
      const dir = join(scratchDir('sorbshare-nopdf-').dir, 'out');
      const r = run([cmd!, ...args, '--out', dir, '--pdf'], { SORBSHARE_CHROMIUM: '/nonexistent/chromium' });
      expect(r.code, cmd).toBe(1);
      expect(r.err).toMatch(/--pdf needs Chromium.*none was found.*SORBSHARE_CHROMIUM=\/nonexistent\/chromium/);
      // the contact demo prints its long steps' progress on stderr while it runs (and runs for a
      // minute): only the error is there
      expect(r.err.trim().split('\n'), cmd).toHaveLength(1);
      expect(r.out).toBe('');
      expect(existsSync(dir)).toBe(false);
    }
  }, 120_000);
});
