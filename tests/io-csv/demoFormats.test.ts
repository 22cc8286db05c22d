/**
 * The demo's inputs converted to European spreadsheet CSV (semicolons, decimal commas,
 * day.month.year dates) and to one .xlsx workbook (numbers as numbers, dates as dates, comment
 * rows kept so row numbers match) give the same results as the originals: every CSV table of the
 * run is identical, byte for byte. The demo data are invented; this is a self-consistency check.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { pipelineOutputs } from '../../src/outputFiles/pipelineOutputs.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';
import { DEMO_NOW, sharedDemoPipeline } from '../helpers/sharedDemoPipeline.js';

const DEMO = join(process.cwd(), 'fixtures/demo');
const TABLES = { isotherm: 'doc_isotherm.csv', series: 'site_series.csv', jar: 'jar_tests_cbz.csv', pilot: 'pilot_pairs.csv' } as const;
const NUMBER = /^-?\d+(?:\.\d+)?$/;

/** A comma/point CSV as a European export: `;` separators, decimal commas, DD.MM.YYYY dates. */
function toEuropean(text: string): string {
  return text.split('\n').map((line) => {
    if (line.startsWith('#') || line.trim() === '') return line;
    return line.split(',').map((cell) => {
      const iso = /^(\d{4})-(\d{2})-(\d{2})$/.exec(cell);
      if (iso) return `${iso[3]}.${iso[2]}.${iso[1]}`;
      return NUMBER.test(cell) ? cell.replace('.', ',') : cell;
    }).join(';');
  }).join('\n');
}

function csvTables(result: PipelineResult): Record<string, string> {
  const files = pipelineOutputs(result, { toolVersion: 'test', nodeVersion: 'test' });
  return Object.fromEntries(Object.entries(files).filter(([n]) => n.endsWith('.csv')));
}
const tables = (projectFile: string) => csvTables(runPipeline(loadProject(projectFile), { now: DEMO_NOW }));

let dir: string;
let original: Record<string, string>;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sorbshare-formats-'));
  original = csvTables(sharedDemoPipeline()); // the worker's shared plain run of the original demo (read only)
}, 120_000);
afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

describe('the demo in other spreadsheet formats', () => {
  it('semicolon CSV with decimal commas and day.month.year dates gives the same tables', () => {
    const d = join(dir, 'eu');
    cpSync(DEMO, d, { recursive: true });
    for (const f of Object.values(TABLES)) writeFileSync(join(d, f), toEuropean(readFileSync(join(DEMO, f), 'utf8')));
    expect(readFileSync(join(d, TABLES.series), 'utf8')).toMatch(/\n01\.01\.2025;\d+,\d+;/);
    const input = loadProject(join(d, 'project.json'));
    expect(input.provenance.notes!.join('\n')).toMatch(/read as semicolon-separated with decimal commas \(detected/);
    expect(tables(join(d, 'project.json'))).toEqual(original);
  }, 120_000);

  it('one .xlsx workbook (a sheet per table, referenced as file.xlsx#Sheet) gives the same tables', async () => {
    const d = join(dir, 'xlsx');
    cpSync(DEMO, d, { recursive: true });
    const wb = new ExcelJS.Workbook();
    for (const [sheet, f] of Object.entries(TABLES)) {
      const ws = wb.addWorksheet(sheet);
      for (const line of readFileSync(join(DEMO, f), 'utf8').split('\n')) {
        if (line.trim() === '') continue;
        if (line.startsWith('#')) { ws.addRow([line]); continue; } // comment rows keep the row numbers of the CSV
        ws.addRow(line.split(',').map((cell) => {
          const iso = /^(\d{4})-(\d{2})-(\d{2})$/.exec(cell);
          if (iso) return new Date(Date.UTC(Number(iso[1]), Number(iso[2]) - 1, Number(iso[3])));
          return NUMBER.test(cell) ? Number(cell) : cell;
        }));
      }
    }
    await wb.xlsx.writeFile(join(d, 'inputs.xlsx'));
    const p = JSON.parse(readFileSync(join(d, 'project.json'), 'utf8'));
    p.background.isotherm = 'inputs.xlsx#isotherm';
    p.site.series = 'inputs.xlsx#series';
    p.compounds[0].jar_tests.file = 'inputs.xlsx#jar';
    p.pilot.file = 'inputs.xlsx#pilot';
    writeFileSync(join(d, 'project.json'), JSON.stringify(p, null, 2));
    expect(tables(join(d, 'project.json'))).toEqual(original);
  }, 180_000);
});
