/**
 * Read a project file and everything it references (I/O lives here, not in the pipeline):
 * the JSON is validated (validateProject), then the DOC isotherm, background file, jar tests and
 * site series and pilot pairs are read relative to the project file's folder and parsed into tables.
 *
 * @throws InputError naming the project file and JSON path, or the referenced file (with the JSON
 *   path that referenced it when it is missing), row and column.
 */
import { createHash } from 'node:crypto';
import { dirname, resolve } from 'node:path';
import { InputError } from '../core/errors.js';
import { parseJsonText, readTextFile } from './readFiles.js';
import { readCsvTable } from '../tables/csvTable.js';
import { ISOTHERM_COLUMNS } from '../fractionation/isothermData.js';
import { readBackground } from '../fractionation/backgroundFile.js';
import { parseSiteSeries } from '../siteSeries/siteSeries.js';
import type { InputFileRecord, PipelineInput } from '../pipeline/pipelineTypes.js';
import { JAR_TEST_COLUMNS } from '../calibration/jarTestData.js';
import { validateProject } from '../project/validateProject.js';
import { parsePilotCsv } from '../surrogates/pilotCsv.js';

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

export function sha256(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

/**
 * Load a project file from disk.
 * @param projectPath path of the project JSON
 * @param options.demo mark the run as the built-in demo (run.json says so)
 */
export function loadProject(projectPath: string, options: { demo?: boolean } = {}): PipelineInput {
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
    const f = readReferenced(baseDir, bg.file, 'background.isotherm', 'DOC isotherm CSV', files, 'DOC isotherm');
    input.isotherm = readCsvTable(f.text, ISOTHERM_COLUMNS, f.file);
  } else if (bg.kind === 'file') {
    const f = readReferenced(baseDir, bg.file, 'background.file', 'background file', files, 'background file');
    try {
      input.backgroundFile = readBackground(parseJsonText(f.text, f.file));
    } catch (e) {
      if (e instanceof InputError && !e.location.file) throw e.at({ file: f.file });
      throw e;
    }
  }
  project.compounds.forEach((c, i) => {
    if (!c.jarTests) return;
    const f = readReferenced(baseDir, c.jarTests.file, `compounds[${i}].jar_tests.file`, 'jar-test CSV', files, `jar tests ${c.id}`);
    input.jarTests[c.id] = readCsvTable(f.text, JAR_TEST_COLUMNS, f.file);
  });
  if (project.site.seriesFile) {
    const f = readReferenced(baseDir, project.site.seriesFile, 'site.series', 'site DOC series CSV', files, 'site DOC series');
    input.series = parseSiteSeries(f.text, project.site.flowM3PerD, f.file);
  }
  if (project.pilot) {
    const f = readReferenced(baseDir, project.pilot.file, 'pilot.file', 'pilot CSV', files, 'pilot pairs');
    input.pilot = parsePilotCsv(f.text, f.file, project.compounds.map((c) => c.id));
  }
  return input;
}
