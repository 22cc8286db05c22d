/**
 * The new project keys of the kinetic calibration and of the Monte Carlo under contact:
 * `carbons[i].kinetics.kinetic_tests` (src/project/readKineticTests.ts), `uncertainty.Ds_rel_sd`
 * and `uncertainty.contact_draws` (src/project/readUncertaintySpec.ts). Read into the spec; every
 * bad value an InputError naming the JSON path, also refused by the JSON Schema where it can say
 * so; a missing table names the field that referenced it (src/io/loadProject.ts).
 */
import { describe, expect, it } from 'vitest';
import { cpSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from './jsonSchemaCheck.js';
import { scratchDir } from '../helpers/cliHarness.js';

const root = join(__dirname, '../..');
const FIXTURE_DIR = join(root, 'fixtures/project/pac-kinetic-tests');
const schema = JSON.parse(readFileSync(join(root, 'schema/project.schema.json'), 'utf8'));
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const fixture = (): any => JSON.parse(readFileSync(join(FIXTURE_DIR, 'project.json'), 'utf8'));

/** The InputError of a whole run of a project file (thrown before any kinetic solve). */
function refusedRun(file: string): InputError {
  try { runPipeline(loadProject(file)); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

function refusedAt(p: unknown, path: string, message: RegExp): void {
  let err: unknown;
  try { validateProject(p); } catch (e) { err = e; }
  expect(err).toBeInstanceOf(InputError);
  expect((err as InputError).location.path).toBe(path);
  expect((err as InputError).message).toMatch(message);
}

describe('kinetic_tests, Ds_rel_sd and contact_draws in a project file', () => {
  it('reads the fixture (schema and validator agree)', () => {
    expect(validateAgainstSchema(schema, fixture())).toEqual([]);
    const p = validateProject(fixture());
    expect(p.carbons[0]!.kinetics!.tests).toEqual({ ds: { CBZ: 'kinetic_tests_cbz.csv' }, docDs: 'kinetic_tests_doc.csv' });
    expect(p.uncertainty!.dsRelSd).toBe(0.3);
    expect(p.uncertainty!.contactDraws).toBe(4);
  });

  it('refuses an unknown key, a compound that is not in the project, an empty entry and a non-text file name', () => {
    const unknown = fixture();
    unknown.carbons[0].kinetics.kinetic_tests.Dl = {};
    refusedAt(unknown, 'carbons[0].kinetics.kinetic_tests.Dl', /unknown key/i);
    expect(validateAgainstSchema(schema, unknown).join()).toMatch(/kinetic_tests\.Dl: additional property/);
    const notCompound = fixture();
    notCompound.carbons[0].kinetics.kinetic_tests.Ds = { XYZ: 'a.csv' };
    refusedAt(notCompound, 'carbons[0].kinetics.kinetic_tests.Ds.XYZ', /"XYZ" is not a compound id/);
    const empty = fixture();
    empty.carbons[0].kinetics.kinetic_tests = {};
    refusedAt(empty, 'carbons[0].kinetics.kinetic_tests', /at least one kinetic test/);
    expect(validateAgainstSchema(schema, empty).length).toBeGreaterThan(0);
    const number = fixture();
    number.carbons[0].kinetics.kinetic_tests.doc_Ds = 12;
    refusedAt(number, 'carbons[0].kinetics.kinetic_tests.doc_Ds', /file name of a kinetic test table/);
    expect(validateAgainstSchema(schema, number).length).toBeGreaterThan(0);
  });

  it('a Ds or doc_Ds that a kinetic test fits need not be given, also under contact conditions', () => {
    const p = fixture();
    delete p.carbons[0].kinetics.Ds;
    delete p.carbons[0].kinetics.doc_Ds;
    expect(validateAgainstSchema(schema, p)).toEqual([]);
    expect(validateProject(p).carbons[0]!.kinetics!.dsM2PerS).toEqual({});
    delete p.carbons[0].kinetics.kinetic_tests.Ds;
    refusedAt(p, 'carbons[0].kinetics.Ds.CBZ', /no surface diffusivity Ds/);
  });

  it('refuses Ds_rel_sd outside 0–2 and contact_draws that are not whole numbers ≥ 0', () => {
    for (const [key, v, msg] of [['Ds_rel_sd', 3, /relative standard deviation of the given surface diffusivities/], ['Ds_rel_sd', -0.1, /from 0 to 2/], ['contact_draws', 2.5, /whole number of draws under PAC contact/], ['contact_draws', -1, /whole number/]] as const) {
      const p = fixture();
      p.uncertainty[key] = v;
      refusedAt(p, `uncertainty.${key}`, msg);
      expect(validateAgainstSchema(schema, p).length).toBeGreaterThan(0);
    }
  });

  it('a missing table names the JSON path that referenced it; a table with times not increasing names file, row and column', () => {
    const { dir } = scratchDir('sorbshare-kintests-');
    cpSync(FIXTURE_DIR, dir, { recursive: true });
    const p = fixture();
    p.carbons[0].kinetics.kinetic_tests.Ds.CBZ = 'missing.csv';
    writeFileSync(join(dir, 'project.json'), JSON.stringify(p));
    expect(() => loadProject(join(dir, 'project.json'))).toThrow(/referenced as "missing\.csv" by field carbons\[0\]\.kinetics\.kinetic_tests\.Ds\.CBZ/);
    // times within a series must increase: row 4 (10 min) after row 3 (20 min) at the same dose;
    // the run fits the table (the DOC test is left out so that this fit comes first)
    writeFileSync(join(dir, 'kinetic_tests_cbz.csv'), 'time (min),dose (mg/L),C0 (ng/L),c (ng/L)\n5,10,500,450\n20,10,500,420\n10,10,500,430\n');
    const onlyTarget = fixture();
    delete onlyTarget.carbons[0].kinetics.kinetic_tests.doc_Ds;
    writeFileSync(join(dir, 'project.json'), JSON.stringify(onlyTarget));
    const err = refusedRun(join(dir, 'project.json'));
    expect(err.location.file).toBe(join(dir, 'kinetic_tests_cbz.csv'));
    expect(err.location.row).toBe(4);
    expect(err.location.column).toBe('time (min)');
    expect(err.location.path).toBe('carbons[0].kinetics.kinetic_tests.Ds.CBZ');
    expect(err.message).toMatch(/times must increase within a series/);
    // a cell that is not a number is refused when the table is read, also naming the field
    writeFileSync(join(dir, 'kinetic_tests_cbz.csv'), 'time (min),dose (mg/L),C0 (ng/L),c (ng/L)\n5,10,500,abc\n');
    let bad: unknown;
    try { loadProject(join(dir, 'project.json')); } catch (e) { bad = e; }
    expect(bad).toBeInstanceOf(InputError);
    expect((bad as InputError).location).toMatchObject({ file: join(dir, 'kinetic_tests_cbz.csv'), row: 2, path: 'carbons[0].kinetics.kinetic_tests.Ds.CBZ' });
  });

  it('a target test without the target\'s DL (film coefficient) names carbons[i].kinetics.DL.<id>', () => {
    const { dir } = scratchDir('sorbshare-kintests-');
    cpSync(FIXTURE_DIR, dir, { recursive: true });
    const p = fixture();
    delete p.carbons[0].kinetics.kinetic_tests.doc_Ds;
    delete p.carbons[0].kinetics.DL;
    delete p.site.pac_contact; // the tests are fitted under equilibrium contact too; this is the fit's own check
    writeFileSync(join(dir, 'project.json'), JSON.stringify(p));
    const err = refusedRun(join(dir, 'project.json'));
    expect(err.location.path).toBe('carbons[0].kinetics.DL.CBZ');
    expect(err.message).toMatch(/liquid diffusivity DL of "CBZ"/);
  });
});
