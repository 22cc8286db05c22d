/**
 * The kinetic jar tests and the column breakthrough data (calibrate --model surface-diffusion,
 * surface-diffusion-doc, column) are read through src/io/readTableFile.ts like the jar tests:
 * the fixtures converted to semicolon/decimal-comma CSV and to .xlsx sheets give the same series
 * (exactly) and the same calibration as the originals; gaps reject the row with its place.
 * The fixtures are invented; this is a self-consistency check.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { readTableFile } from '../../src/io/readTableFile.js';
import { KINETIC_DOC_COLUMNS, KINETIC_TARGET_COLUMNS, readKineticTests } from '../../src/calibration/kineticTestData.js';
import { BREAKTHROUGH_COLUMNS, readBreakthroughData } from '../../src/calibration/breakthroughData.js';
import { InputError } from '../../src/core/errors.js';
import { requireBuild, runBin } from '../helpers/cliHarness.js';

const root = process.cwd();
const FILES = {
  target: join(root, 'fixtures/kinetics/target-kinetics.csv'),
  doc: join(root, 'fixtures/kinetics/doc-kinetics.csv'),
  column: join(root, 'fixtures/column/small-column.csv'),
};
const NUMBER = /^-?\d+(?:\.\d+)?$/;
const text = (f: string) => readFileSync(f, 'utf8');

function toEuropean(t: string): string {
  return t.split('\n').map((line) => (line.startsWith('#') || line.trim() === '' ? line : line.split(',').map((c) => (NUMBER.test(c) ? c.replace('.', ',') : c)).join(';'))).join('\n');
}

async function toXlsx(t: string, file: string, sheet: string): Promise<void> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet(sheet);
  for (const line of t.split('\n')) {
    if (line.trim() === '') continue;
    ws.addRow(line.startsWith('#') ? [line] : line.split(',').map((c) => (NUMBER.test(c) ? Number(c) : c)));
  }
  await wb.xlsx.writeFile(file);
}

let dir: string;
const eu: Record<string, string> = {};
const xlsx: Record<string, string> = {};
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'sorbshare-kinetic-formats-'));
  for (const [k, f] of Object.entries(FILES)) {
    eu[k] = join(dir, `${k}-eu.csv`);
    writeFileSync(eu[k]!, toEuropean(text(f)));
    xlsx[k] = join(dir, `${k}.xlsx`);
    await toXlsx(text(f), xlsx[k]!, 'Data');
  }
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const strip = <T extends object>(x: T): T => JSON.parse(JSON.stringify(x, (k, v) => (k === 'file' ? undefined : v))) as T;

describe('kinetic tests and breakthrough data in other spreadsheet formats', () => {
  it('target kinetic tests: semicolon/decimal-comma CSV and an .xlsx sheet give the same series as the original CSV', () => {
    const original = readKineticTests(text(FILES.target), 'target', FILES.target);
    expect(original.length).toBeGreaterThan(1);
    for (const f of [eu.target!, `${xlsx.target}#Data`]) {
      const { table } = readTableFile(f, KINETIC_TARGET_COLUMNS, 'kinetic test file');
      expect(readKineticTests(table, 'target')).toEqual(original);
    }
    expect(readTableFile(eu.target!, KINETIC_TARGET_COLUMNS, 'kinetic test file').table.notes!.join('\n')).toMatch(/semicolon-separated with decimal commas/);
  });

  it('DOC kinetic tests: the same series from every format', () => {
    const original = readKineticTests(text(FILES.doc), 'doc', FILES.doc);
    for (const f of [eu.doc!, `${xlsx.doc}#Data`]) expect(readKineticTests(readTableFile(f, KINETIC_DOC_COLUMNS, 'kinetic test file').table, 'doc')).toEqual(original);
  });

  it('breakthrough data: the same bed volumes and c/c0 from every format', () => {
    const original = strip(readBreakthroughData(text(FILES.column), { file: FILES.column }));
    for (const f of [eu.column!, `${xlsx.column}#Data`]) expect(strip(readBreakthroughData(readTableFile(f, BREAKTHROUGH_COLUMNS, 'breakthrough file').table))).toEqual(original);
  });

  it('a gap (empty, n.a., -) in a kinetic or breakthrough row rejects the row, naming file, row and column', () => {
    const lines = text(FILES.target).split('\n');
    for (const gap of ['', 'n.a.', '-']) {
      const bad = lines.map((l, i) => (i === 3 ? l.replace(/,[^,]*$/, `,${gap}`) : l)).join('\n');
      const f = join(dir, `gap${gap.length}.csv`);
      writeFileSync(f, bad);
      expect(() => readKineticTests(readTableFile(f, KINETIC_TARGET_COLUMNS, 'kinetic test file').table, 'target')).toThrow(InputError);
      expect(() => readTableFile(f, KINETIC_TARGET_COLUMNS, 'kinetic test file')).toThrow(new RegExp(`gap${gap.length}\\.csv, row 4, column "c \\(ng/L\\)"`));
    }
    const bt = text(FILES.column).split('\n').map((l, i) => (i === 2 ? l.replace(/^[^,]*,/, 'n.a.,') : l)).join('\n');
    writeFileSync(join(dir, 'bt-gap.csv'), bt);
    expect(() => readTableFile(join(dir, 'bt-gap.csv'), BREAKTHROUGH_COLUMNS, 'breakthrough file')).toThrow(/bt-gap\.csv, row 3, column "bed volumes \(-\)"/);
  });
});

describe('calibrate reads them through the table reader (binary)', () => {
  beforeAll(() => requireBuild());
  const KIN = ['--particle-radius', '12 um', '--particle-density', '700 kg/m3', '--dl', '5e-10 m2/s'];
  const BED = ['--ebct', '1 min', '--bed-depth', '0.1 m', '--grain-radius', '0.1 mm', '--grain-density', '800 kg/m3'];
  const without = (j: Record<string, unknown>) => JSON.parse(JSON.stringify(j, (k, v) => (k === 'file' ? undefined : v)));

  // one other format per model through the binary (each fit takes seconds); the in-process checks
  // above show every format gives the same series
  it('surface-diffusion-doc on the decimal-comma CSV gives the JSON of the original (same Ds to the last digit)', () => {
    const args = (f: string) => ['calibrate', f, '--model', 'surface-diffusion-doc', '--background', 'fixtures/kinetics/background.json', ...KIN, '--json'];
    const o = runBin(...args(FILES.doc));
    expect(o.code).toBe(0);
    for (const f of [eu.doc!]) {
      const r = runBin(...args(f));
      expect(r.code).toBe(0);
      expect(without(JSON.parse(r.out))).toEqual(without(JSON.parse(o.out)));
    }
  }, 120_000);

  it('column on the .xlsx sheet gives the JSON of the original', () => {
    const args = (f: string) => ['calibrate', f, '--model', 'column', '--compound', 'fixtures/column/target-compound.json', ...BED, '--json'];
    const o = runBin(...args(FILES.column));
    expect(o.code).toBe(0);
    for (const f of [`${xlsx.column}#Data`]) {
      const r = runBin(...args(f));
      expect(r.code).toBe(0);
      expect(without(JSON.parse(r.out))).toEqual(without(JSON.parse(o.out)));
    }
  }, 120_000);
});
