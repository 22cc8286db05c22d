/**
 * The shared CSV reader's text, percent and fraction columns, blank cells and value ranges.
 * Percent to fraction uses 1 % = 0.01 (the definition of the percent sign, ISO 80000-1:2009,
 * from memory); 50 % → 0.5 and 100 % → 1 come out exact in doubles, 18.5 % is compared to 12
 * digits (one rounding of the product).
 */
import { describe, expect, it } from 'vitest';
import { readCsvTable, csvUnitFactor, type CsvColumnSpec } from '../../src/tables/csvTable.js';
import { InputError } from '../../src/core/errors.js';

const PILOT: CsvColumnSpec[] = [
  { key: 'sample', names: ['sample', 'sample id'], kind: 'text', required: true, description: 'sample name' },
  { key: 'uv', names: ['UV254 reduction'], kind: 'fraction', required: true, description: 'UV254 reduction' },
  { key: 'cbz', names: ['removal CBZ'], kind: 'fraction', required: false, allowBlank: true, min: -1, max: 1, description: 'removal of CBZ' },
  { key: 'note', names: ['note'], kind: 'text', required: false, allowBlank: true, description: 'note' },
];
const HEADER = 'sample,UV254 reduction (%),removal CBZ (fraction),note\n';

describe('readCsvTable: text columns', () => {
  it('keeps text cells as written (trimmed), needs no unit, and has no numbers', () => {
    const t = readCsvTable(HEADER + ' P1 ,50,0.25,first run\nP 2,25,0.5,\n', PILOT, 'pilot.csv');
    expect(t.columns.sample!.cells).toEqual(['P1', 'P 2']);
    expect(t.columns.sample!.values).toEqual([]);
    expect(t.columns.sample!.unit).toBe('');
    expect(t.columns.note!.cells).toEqual(['first run', '']);
    expect(t.columns.note!.blank).toEqual([false, true]);
  });

  it('a text header may carry a bracket, kept as its unit text', () => {
    const t = readCsvTable('sample id (lab),UV254 reduction (%)\nA7,10\n', PILOT);
    expect(t.columns.sample!.cells).toEqual(['A7']);
    expect(t.columns.sample!.unit).toBe('lab');
  });

  it('a blank text cell is an error unless the column allows it', () => {
    expect(() => readCsvTable(HEADER + ',50,0.25,x\n', PILOT, 'pilot.csv')).toThrow(/^pilot\.csv, row 2, column "sample": empty cell; expected the sample name$/);
  });

  it('a missing text column asks for its header without a unit', () => {
    expect(() => readCsvTable('UV254 reduction (%)\n10\n', PILOT, 'pilot.csv')).toThrow(/^pilot\.csv, row 1, column "sample": missing column for the sample name; expected a header such as "sample"$/);
  });
});

describe('readCsvTable: percent and fraction columns', () => {
  it('converts % to fractions (1 % = 0.01) and keeps fractions as they are', () => {
    const t = readCsvTable(HEADER + 'P1,50,0.25,\nP2,18.5,-0.05,\nP3,100,1,\n', PILOT);
    expect(t.columns.uv!.values[0]).toBe(0.5);
    expect(t.columns.uv!.values[1]).toBeCloseTo(0.185, 12);
    expect(t.columns.uv!.values[2]).toBe(1);
    expect(t.columns.cbz!.values).toEqual([0.25, -0.05, 1]);
    expect(t.columns.uv!.cells).toEqual(['50', '18.5', '100']);
  });

  it('accepts the unit spellings %, percent, fraction, - and 1', () => {
    expect(['%', 'percent', ' Percent ', 'fraction', '-', '1'].map((u) => csvUnitFactor(u, 'fraction'))).toEqual([0.01, 0.01, 0.01, 1, 1, 1]);
    expect(() => csvUnitFactor('ppm', 'fraction')).toThrow(/unknown unit "ppm"; expected % or fraction/);
  });

  it('a percentage above 100 % or below 0 % names file, row, column and the range in the header unit', () => {
    expect(() => readCsvTable(HEADER + 'P1,50,0.2,\nP2,120,0.3,\n', PILOT, 'pilot.csv')).toThrow(/^pilot\.csv, row 3, column "UV254 reduction \(%\)": UV254 reduction 120 is outside 0–100 %; expected a value from 0 to 100 %$/);
    expect(() => readCsvTable(HEADER + 'P1,-0.5,0.2,\n', PILOT, 'pilot.csv')).toThrow(/row 2, column "UV254 reduction \(%\)": UV254 reduction -0\.5 is outside 0–100 %/);
    expect(() => readCsvTable('sample,UV254 reduction (fraction)\nP1,1.5\n', PILOT, 'pilot.csv')).toThrow(/column "UV254 reduction \(fraction\)": UV254 reduction 1\.5 is outside 0–1; expected a value from 0 to 1$/);
  });

  it('a column range set by the caller (removal −100 … 100 %) is checked in the internal unit', () => {
    expect(() => readCsvTable(HEADER + 'P1,50,-1.2,\n', PILOT, 'pilot.csv')).toThrow(/row 2, column "removal CBZ \(fraction\)": removal of CBZ -1\.2 is outside -1 … 1; expected a value from -1 to 1/);
    const spec: CsvColumnSpec = { key: 'r', names: ['removal'], kind: 'fraction', required: true, min: -1, max: 1, description: 'removal' };
    expect(() => readCsvTable('removal (%)\n-101\n', [spec], 'p.csv')).toThrow(/removal -101 is outside -100 … 100 %/);
    expect(readCsvTable('removal (%)\n-100\n', [spec]).columns.r!.values).toEqual([-1]);
  });

  it('a percent header without a unit, or with another unit, is an error at the header', () => {
    expect(() => readCsvTable('sample,UV254 reduction\nP1,5\n', PILOT, 'pilot.csv')).toThrow(/^pilot\.csv, row 1, column "UV254 reduction": header without a unit; expected e\.g\. "UV254 reduction \(%\)" with % or fraction$/);
    expect(() => readCsvTable('sample,UV254 reduction (mg/L)\nP1,5\n', PILOT, 'pilot.csv')).toThrow(/row 1, column "UV254 reduction \(mg\/L\)": unknown unit "mg\/L"/);
  });
});

describe('readCsvTable: blank cells', () => {
  it('blank = not measured where allowed: flagged, value 0, cell ""', () => {
    const t = readCsvTable('# invented\nsample,UV254 reduction (%),removal CBZ (%)\nP1,30,\n\nP2,40,55\n', PILOT);
    expect(t.rowNumbers).toEqual([3, 5]);
    expect(t.columns.cbz!.blank).toEqual([true, false]);
    expect(t.columns.cbz!.values).toEqual([0, 0.55]);
    expect(t.columns.cbz!.cells).toEqual(['', '55']);
  });

  it('a blank cell where not allowed names the row as a spreadsheet counts it', () => {
    expect(() => readCsvTable('# invented\nsample,UV254 reduction (%)\nP1,30\nP2,\n', PILOT, 'pilot.csv')).toThrow(/^pilot\.csv, row 4, column "UV254 reduction \(%\)": empty cell; expected a number in % \(this table needs a value in every row: leave the row out instead\)$/);
  });
});

describe('readCsvTable: columns declared from the header', () => {
  const removalFamily = (cells: readonly string[]): CsvColumnSpec[] =>
    cells.filter((h) => h.startsWith('removal ')).map((h) => {
      const id = h.replace(/^removal\s+/, '').replace(/\s*\(.*$/, '');
      return { key: id, names: [`removal ${id}`], kind: 'fraction', required: false, allowBlank: true, description: `removal of ${id}` };
    });

  it('reads one column per header of a family, in header order', () => {
    const t = readCsvTable('# c\nremoval CBZ (%),note,removal DCF (fraction)\n40,x,0.3\n', (h) => {
      expect(h.row).toBe(2);
      return removalFamily(h.cells);
    });
    expect(Object.keys(t.columns)).toEqual(['CBZ', 'DCF']);
    expect(t.columns.CBZ!.values).toEqual([0.4]);
    expect(t.columns.DCF!.values).toEqual([0.3]);
  });

  it('an InputError thrown for the header gets the file name', () => {
    const f = () => readCsvTable('note\nx\n', (h) => {
      throw new InputError('no removal columns; expected a header such as "removal CBZ (%)"', { row: h.row });
    }, 'pilot.csv');
    expect(f).toThrow(InputError);
    expect(f).toThrow(/^pilot\.csv, row 1: no removal columns/);
  });
});
