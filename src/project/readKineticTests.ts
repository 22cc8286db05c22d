/**
 * The kinetic jar tests of a PAC carbon in a project file, `carbons[i].kinetics.kinetic_tests`:
 *   { "Ds": { "CBZ": "kinetic_tests_cbz.csv" }, "doc_Ds": "kinetic_tests_doc.csv" }
 * Each entry names a table (CSV, or an .xlsx sheet `file.xlsx#Sheet`, relative to the project file)
 * whose fit replaces the quantity of the same key: `Ds.<id>` a target's surface diffusivity
 * (columns time, dose, C0, c with units; `sorbshare calibrate --model surface-diffusion`), `doc_Ds`
 * the one surface diffusivity of the fictive DOC components (columns time, dose, DOC and an
 * optional DOC0; `--model surface-diffusion-doc`). src/io/loadProject.ts reads the tables,
 * src/pipeline/kineticCalibrationStep.ts fits them.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { describeValue, expectObject, join, onlyKeys } from '../scenario/jsonChecks.js';

/** File references (as written, relative to the project file) of a carbon's kinetic jar tests. */
export interface KineticTestsSpec {
  /** Target kinetic tests by compound id (surface-diffusion fit of that compound's Ds). */
  ds: Record<string, string>;
  /** DOC kinetic test (surface-diffusion-doc fit of doc_Ds). */
  docDs?: string;
}

function fileName(v: unknown, path: string): string {
  if (typeof v !== 'string' || v.trim() === '') throw new InputError(`expected the file name of a kinetic test table such as "kinetic_tests.csv" (or "tests.xlsx#Sheet1"), got ${describeValue(v)}`, { path });
  return v;
}

/** Read `carbons[i].kinetics.kinetic_tests`. */
export function readKineticTests(raw: unknown, path: string, compoundIds: readonly string[]): KineticTestsSpec {
  const o = expectObject(raw, path, 'the kinetic jar tests { "Ds": { "<compound id>": "file.csv" }, "doc_Ds": "file.csv" }');
  onlyKeys(o, ['Ds', 'doc_Ds', 'note'], path);
  const spec: KineticTestsSpec = { ds: {} };
  if (o.Ds !== undefined) {
    const p = `${path}.Ds`;
    const ds = expectObject(o.Ds, p, `kinetic test files by compound id, e.g. { "${compoundIds[0] ?? 'CBZ'}": "kinetic_tests.csv" }`);
    for (const [id, v] of Object.entries(ds)) {
      if (!compoundIds.includes(id)) throw new InputError(`"${id}" is not a compound id; expected one of ${compoundIds.map((x) => `"${x}"`).join(', ')}`, { path: join(p, id) });
      spec.ds[id] = fileName(v, join(p, id));
    }
  }
  if (o.doc_Ds !== undefined) spec.docDs = fileName(o.doc_Ds, `${path}.doc_Ds`);
  if (Object.keys(spec.ds).length === 0 && spec.docDs === undefined) throw new InputError('expected at least one kinetic test ("Ds" by compound id or "doc_Ds"); remove "kinetic_tests" otherwise', { path });
  return spec;
}
