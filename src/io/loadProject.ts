/**
 * Read a project file and everything it references (I/O lives here, not in the pipeline):
 * the JSON is validated (validateProject), then the DOC isotherm, background file, jar tests and
 * site series and pilot pairs are read relative to the project file's folder and parsed into tables.
 * Tables may be CSV (`,` or `;` separators, `.` or `,` decimals, detected unless `format` sets them)
 * or .xlsx sheets (`data.xlsx#Sheet1`); notices on how they were read go to `provenance.notes`.
 *
 * @throws InputError naming the project file and JSON path, or the referenced file (with the JSON
 *   path that referenced it when it is missing), row and column.
 */
import { createHash } from 'node:crypto';
import { dirname, resolve } from 'node:path';
import { InputError } from '../core/errors.js';
import { parseJsonText, readTextFile } from './readFiles.js';
import { readTableFile } from './readTableFile.js';
import type { CsvColumnSpecs, CsvTable } from '../tables/csvTable.js';
import type { CsvFormatOptions } from '../tables/csvFormat.js';
import { splitSheetPath } from './xlsxSheet.js';
import { ISOTHERM_COLUMNS } from '../fractionation/isothermData.js';
import { readBackground, type BackgroundFile } from '../fractionation/backgroundFile.js';
import { SITE_SERIES_COLUMNS, siteSeriesFromTable } from '../siteSeries/siteSeries.js';
import type { InputFileRecord, PipelineInput } from '../pipeline/pipelineTypes.js';
import { JAR_TEST_COLUMNS } from '../calibration/jarTestData.js';
import { KINETIC_DOC_COLUMNS, KINETIC_TARGET_COLUMNS } from '../calibration/kineticTestData.js';
import { BREAKTHROUGH_COLUMNS } from '../calibration/breakthroughData.js';
import { validateProject } from '../project/validateProject.js';
import { componentWarnings, docWarnings, traceC0Warnings } from '../scenario/plausibility.js';
import { pilotColumnSpecs, pilotFromTable } from '../surrogates/pilotCsv.js';

/** Read a referenced file; a missing file names the JSON path that referenced it. */
function readReferenced(baseDir: string, relPath: string, jsonPath: string, what: string, files: InputFileRecord[], role: string): { text: string; file: string } {
  const resolved = resolve(baseDir, relPath);
  let text: string;
  try {
    text = readTextFile(resolved, what);
  } catch (e) {
    if (e instanceof InputError) throw new InputError(`${e.expected} (referenced as "${relPath}" by field ${jsonPath}, relative to the project file)`, { file: resolved });
    throw e;
  }
  files.push({ role, path: relPath, resolved, bytes: Buffer.byteLength(text), sha256: sha256(text) });
  return { text, file: resolved };
}

/** Read a referenced table (CSV or an .xlsx sheet); a missing file names the JSON path that referenced it. */
function readReferencedTable(baseDir: string, relPath: string, jsonPath: string, what: string, files: InputFileRecord[], role: string, specs: CsvColumnSpecs, format: CsvFormatOptions, notes: string[]): CsvTable {
  const resolved = resolve(baseDir, relPath);
  let read;
  try {
    read = readTableFile(resolved, specs, what, format);
  } catch (e) {
    if (e instanceof InputError && /not found|is not a file/.test(e.expected) && !e.location.row) throw new InputError(`${e.expected} (referenced as "${relPath}" by field ${jsonPath}, relative to the project file)`, { file: splitSheetPath(resolved).file });
    throw e;
  }
  files.push({ role, path: relPath, resolved, bytes: Buffer.byteLength(read.text), sha256: sha256(read.text) });
  notes.push(...(read.table.notes ?? []));
  return read.table;
}

/** A background file's text checked (src/fractionation/backgroundFile.ts); errors name the file. */
function readBackgroundFileAt(f: { text: string; file: string }): BackgroundFile {
  try {
    return readBackground(parseJsonText(f.text, f.file));
  } catch (e) {
    if (e instanceof InputError && !e.location.file) throw e.at({ file: f.file });
    throw e;
  }
}

export function sha256(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

/**
 * Load a project file from disk.
 * @param projectPath path of the project JSON
 * @param options.demo mark the run as the built-in demo (run.json says so)
 * @param options.format separator and decimal mark of the CSV tables (detected when absent)
 */
export function loadProject(projectPath: string, options: { demo?: boolean; format?: CsvFormatOptions } = {}): PipelineInput {
  const format = options.format ?? {};
  const notes: string[] = [];
  const projectFile = resolve(projectPath);
  const text = readTextFile(projectFile, 'project file');
  const raw = parseJsonText(text, projectFile);
  let project;
  try {
    project = validateProject(raw);
  } catch (e) {
    if (e instanceof InputError && !e.location.file) throw e.at({ file: projectFile });
    throw e;
  }
  const baseDir = dirname(projectFile);
  const files: InputFileRecord[] = [{ role: 'project', path: projectPath, resolved: projectFile, bytes: Buffer.byteLength(text), sha256: sha256(text) }];
  const input: PipelineInput = { project, jarTests: {}, provenance: { projectFile, files } };
  if (options.demo) input.provenance.demo = true;

  const bg = project.background;
  if (bg.kind === 'isotherm') {
    input.isotherm = readReferencedTable(baseDir, bg.file, 'background.isotherm', 'DOC isotherm CSV', files, 'DOC isotherm', ISOTHERM_COLUMNS, format, notes);
  } else if (bg.kind === 'file') {
    input.backgroundFile = readBackgroundFileAt(readReferenced(baseDir, bg.file, 'background.file', 'background file', files, 'background file'));
  }
  project.carbons.forEach((c, i) => {
    const own = c.background;
    if (!own) return;
    const jp = `carbons[${i}].background.${own.kind}`;
    const entry: NonNullable<PipelineInput['carbonBackgrounds']>[string] = {};
    if (own.kind === 'isotherm') entry.isotherm = readReferencedTable(baseDir, own.file, jp, 'DOC isotherm CSV', files, `DOC isotherm ${c.name}`, ISOTHERM_COLUMNS, format, notes);
    else entry.backgroundFile = readBackgroundFileAt(readReferenced(baseDir, own.file, jp, 'background file', files, `background file ${c.name}`));
    (input.carbonBackgrounds ??= {})[c.name] = entry;
  });
  project.compounds.forEach((c, i) => {
    if (!c.jarTests) return;
    input.jarTests[c.id] = readReferencedTable(baseDir, c.jarTests.file, `compounds[${i}].jar_tests.file`, 'jar-test CSV', files, `jar tests ${c.id}`, JAR_TEST_COLUMNS, format, notes);
  });
  project.carbons.forEach((c, i) => {
    const tests = c.kinetics?.tests;
    if (!tests) return;
    const p = `carbons[${i}].kinetics.kinetic_tests`;
    const t: NonNullable<PipelineInput['kineticTests']>[string] = { ds: {} };
    // a bad table names its file, row and column and the field that referenced it
    const table = (f: string, jsonPath: string, what: string, role: string, specs: CsvColumnSpecs) => {
      try { return readReferencedTable(baseDir, f, jsonPath, what, files, role, specs, format, notes); } catch (e) { throw e instanceof InputError && !e.location.path && e.location.row !== undefined ? e.at({ path: jsonPath }) : e; }
    };
    if (tests.docDs !== undefined) t.docDs = table(tests.docDs, `${p}.doc_Ds`, 'DOC kinetic test table', `DOC kinetic tests (${c.name})`, KINETIC_DOC_COLUMNS);
    for (const [id, f] of Object.entries(tests.ds)) t.ds[id] = table(f, `${p}.Ds.${id}`, 'kinetic test table', `kinetic tests ${id} (${c.name})`, KINETIC_TARGET_COLUMNS);
    (input.kineticTests ??= {})[c.name] = t;
  });
  project.carbons.forEach((c, i) => {
    const tests = c.bedKinetics?.columnTests;
    if (!tests) return;
    const t: NonNullable<PipelineInput['columnTests']>[string] = { ds: {} };
    for (const [id, test] of Object.entries(tests.ds)) {
      const jsonPath = `carbons[${i}].kinetics.column_tests.Ds.${id}.file`;
      try { t.ds[id] = readReferencedTable(baseDir, test.file, jsonPath, 'breakthrough table', files, `column test ${id} (${c.name})`, BREAKTHROUGH_COLUMNS, format, notes); } catch (e) { throw e instanceof InputError && !e.location.path && e.location.row !== undefined ? e.at({ path: jsonPath }) : e; }
    }
    (input.columnTests ??= {})[c.name] = t;
  });
  if (project.site.seriesFile) {
    const t = readReferencedTable(baseDir, project.site.seriesFile, 'site.series', 'site DOC series CSV', files, 'site DOC series', SITE_SERIES_COLUMNS, format, []);
    input.series = siteSeriesFromTable(t, project.site.flowM3PerD);
    notes.push(...(input.series.warnings ?? []));
  }
  if (project.pilot) {
    input.pilot = pilotFromTable(readReferencedTable(baseDir, project.pilot.file, 'pilot.file', 'pilot CSV', files, 'pilot pairs', pilotColumnSpecs(project.compounds.map((c) => c.id)), format, notes));
  }
  notes.push(...componentWarnings(project.compounds, 'compounds'), ...traceC0Warnings(project.compounds, 'compounds'), ...docWarnings(project.site.docMgPerL));
  if (notes.length) input.provenance.notes = notes;
  return input;
}
