/**
 * Reading a table input from a file: a CSV file (any separator and decimal mark the CSV reader
 * accepts) or a sheet of an .xlsx workbook (`data.xlsx#Sheet1`; the first sheet without `#`).
 * Every command and the project loader read tables through here.
 */
import { readCsvTable, readTableRecords, type CsvColumnSpecs, type CsvTable } from '../tables/csvTable.js';
import type { CsvFormatOptions } from '../tables/csvFormat.js';
import { readTextFile } from './readFiles.js';
import { isXlsxPath, readXlsxSheet, splitSheetPath } from './xlsxSheet.js';

/** The text and identity of a table file, for run records (the sheet's rows as CSV-like text for .xlsx). */
export interface TableFileRead {
  table: CsvTable;
  /** The file's bytes as text (CSV), or a canonical JSON of the sheet's rows (.xlsx), for hashes. */
  text: string;
}

/**
 * Read a table file. @param what what the file is, for messages ("jar-test CSV")
 * @throws InputError naming file, row and column
 */
export function readTableFile(path: string, specs: CsvColumnSpecs, what: string, format: CsvFormatOptions = {}): TableFileRead {
  if (isXlsxPath(path)) {
    const { file } = splitSheetPath(path);
    readTextFile(file, what); // same not-found and not-a-file messages as CSV
    const sheet = readXlsxSheet(path);
    const name = `${sheet.file}#${sheet.sheet}`;
    const table = readTableRecords(sheet.rows, specs, name, '.');
    table.notes = [];
    return { table, text: JSON.stringify(sheet.rows) };
  }
  const text = readTextFile(path, what);
  return { table: readCsvTable(text, specs, path, format), text };
}
