/**
 * The shared CSV reader: units from headers, conversion to internal units, and errors that name
 * file, row (header = row 1, as a spreadsheet counts) and column. Conversion factors come from
 * the exact SI definitions (1 ng = 1e-9 g; 1 m = 100 cm), so the expected values are exact.
 */
import { describe, expect, it } from 'vitest';
import { readCsvTable, type CsvColumnSpec } from '../../src/tables/csvTable.js';
import { InputError } from '../../src/core/errors.js';

const SPECS: CsvColumnSpec[] = [
  { key: 'c0', names: ['C0'], kind: 'massConcentration', required: true, description: 'initial concentration' },
  { key: 'dose', names: ['dose'], kind: 'massConcentration', required: true, description: 'carbon dose' },
  { key: 'uv', names: ['UV254'], kind: 'absorbance', required: false, allowBlank: true, description: 'UV254' },
];

function errorOf(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

describe('readCsvTable', () => {
  it('converts header units to internal units (exact SI factors) and keeps spreadsheet row numbers', () => {
    const t = readCsvTable('C0 (ng/L),dose (g/m3),UV254 (1/cm),note\n# a comment line\n500,10,0.125,first\n\n2000,20,,second\n', SPECS, 'jar.csv');
    expect(t.file).toBe('jar.csv');
    expect(t.rowNumbers).toEqual([3, 5]);
    expect(t.columns.c0!.values).toEqual([500e-6, 2000e-6]); // 1 ng/L = 1e-6 mg/L
    expect(t.columns.dose!.values).toEqual([10, 20]); // 1 g/m³ = 1 mg/L
    expect(t.columns.uv!.values[0]).toBeCloseTo(12.5, 12); // 1/cm = 100 1/m
    expect(t.columns.uv!.blank).toEqual([false, true]);
    expect(t.columns.c0!.header).toBe('C0 (ng/L)');
    expect(t.columns.note).toBeUndefined();
  });

  it('matches headers case-insensitively and ignores spaces and underscores', () => {
    const t = readCsvTable('c0 [ug/L] , Dose (mg/L)\n1,2\n', SPECS);
    expect(t.columns.c0!.values).toEqual([1e-3]);
  });

  it('a header without a unit names file, row 1 and the column', () => {
    const e = errorOf(() => readCsvTable('C0,dose (mg/L)\n1,2\n', SPECS, 'jar.csv'));
    expect(e.message).toMatch(/^jar\.csv, row 1, column "C0": header without a unit/);
  });

  it('an unknown unit names the column', () => {
    const e = errorOf(() => readCsvTable('C0 (furlongs),dose (mg/L)\n1,2\n', SPECS, 'jar.csv'));
    expect(e.message).toMatch(/jar\.csv, row 1, column "C0 \(furlongs\)": unknown unit "furlongs"/);
    const u = errorOf(() => readCsvTable('C0 (ng/L),dose (mg/L),UV254 (mg/L)\n1,2,3\n', SPECS, 'jar.csv'));
    expect(u.message).toMatch(/column "UV254 \(mg\/L\)": unknown unit "mg\/L"; expected an absorbance/);
  });

  it('a non-numeric cell names file, row and column', () => {
    const e = errorOf(() => readCsvTable('C0 (ng/L),dose (mg/L)\n1,2\n3,abc\n', SPECS, 'jar.csv'));
    expect(e.message).toMatch(/^jar\.csv, row 3, column "dose \(mg\/L\)": "abc" is not a number; expected a number in mg\/L/);
  });

  it('a negative value names file, row and column', () => {
    const e = errorOf(() => readCsvTable('C0 (ng/L),dose (mg/L)\n-1,2\n', SPECS, 'jar.csv'));
    expect(e.message).toMatch(/^jar\.csv, row 2, column "C0 \(ng\/L\)": negative value -1/);
  });

  it('a blank cell is an error unless the column allows it', () => {
    const e = errorOf(() => readCsvTable('C0 (ng/L),dose (mg/L)\n1,\n', SPECS, 'jar.csv'));
    expect(e.message).toMatch(/row 2, column "dose \(mg\/L\)": empty cell/);
  });

  it('a missing required column and a table without data rows are errors', () => {
    expect(errorOf(() => readCsvTable('C0 (ng/L)\n1\n', SPECS, 'jar.csv')).message).toMatch(/jar\.csv, row 1, column "dose": missing column for the carbon dose/);
    expect(errorOf(() => readCsvTable('C0 (ng/L),dose (mg/L)\n', SPECS, 'jar.csv')).message).toMatch(/row 2.*no data rows/);
    expect(errorOf(() => readCsvTable('', SPECS, 'jar.csv')).message).toMatch(/empty table/);
  });

  it('a row with the wrong number of cells names its line', () => {
    const e = errorOf(() => readCsvTable('C0 (ng/L),dose (mg/L)\n1,2\n3,4,5\n', SPECS, 'jar.csv'));
    expect(e.message).toMatch(/^jar\.csv, row 3: malformed CSV/);
  });

  it('a column given twice is an error', () => {
    expect(errorOf(() => readCsvTable('C0 (ng/L),dose (mg/L),C0 (ug/L)\n1,2,3\n', SPECS, 'jar.csv')).message).toMatch(/appears twice/);
  });
});
