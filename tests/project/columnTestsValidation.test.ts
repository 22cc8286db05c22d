/**
 * A GAC carbon's column tests (carbons[i].kinetics.column_tests, src/project/readColumnTests.ts) in
 * project validation: the hand validator reads them into internal units and names the JSON path of
 * every bad entry; the schema (schema/project.schema.json, checked with Ajv) accepts the fixture and
 * rejects what JSON Schema can express. Expected values: unit definitions (2 min = 120 s,
 * 0.1 mm = 1e-4 m) and the project's own rules.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from './jsonSchemaCheck.js';
import { columnCalibrationStep } from '../../src/pipeline/columnCalibrationStep.js';

const root = join(__dirname, '../..');
const schema = JSON.parse(readFileSync(join(root, 'schema/project.schema.json'), 'utf8'));
const fixture = JSON.parse(readFileSync(join(root, 'fixtures/project/gac-column-test/project.json'), 'utf8'));
const clone = (): any => JSON.parse(JSON.stringify(fixture));
const P = 'carbons[0].kinetics.column_tests';

describe('GAC column tests in a project', () => {
  it('the fixture reads into internal units, and the schema accepts it', () => {
    const t = validateProject(fixture).carbons[0]!.bedKinetics!.columnTests!;
    expect(Object.keys(t.ds)).toEqual(['CBZ']);
    const c = t.ds.CBZ!;
    expect(c.file).toBe('breakthrough_cbz.csv');
    expect(c.ebctS).toBeCloseTo(120, 9); // "2 min" (unit definition)
    expect(c.bedDepthM).toBeCloseTo(0.2, 12);
    expect(c.particleRadiusM).toBeCloseTo(1e-4, 15); // "0.1 mm"
    expect(c.porosity).toBeUndefined(); // the carbon's 0.4 is used
    expect(c.scaleUp).toBe('proportional');
    expect(validateAgainstSchema(schema, fixture)).toEqual([]);
  });

  it('a test on the carbon\'s own grains needs no scale-up', () => {
    const p = clone();
    const t = p.carbons[0].kinetics.column_tests.Ds.CBZ;
    delete t.particle_radius; delete t.scale_up;
    const c = validateProject(p).carbons[0]!.bedKinetics!.columnTests!.ds.CBZ!;
    expect(c.particleRadiusM).toBeUndefined();
    expect(c.scaleUp).toBeUndefined();
    expect(validateAgainstSchema(schema, p)).toEqual([]);
  });

  it('a tested compound needs no given Ds (the fit supplies it); an untested one still does', () => {
    const p = clone();
    delete p.carbons[0].kinetics.Ds;
    const k = validateProject(p).carbons[0]!.bedKinetics!;
    expect(k.compounds.CBZ).toEqual({ dlM2PerS: 7e-10 });
    expect(validateAgainstSchema(schema, p)).toEqual([]);
    delete p.carbons[0].kinetics.column_tests;
    let err: unknown;
    try { validateProject(p); } catch (e) { err = e; }
    expect((err as InputError).location.path).toBe('carbons[0].kinetics.Ds.CBZ');
    expect((err as InputError).message).toMatch(/surface diffusivity of "CBZ"/);
  });

  it('a column test whose table was not read, with no Ds given, is an InputError naming the test (library callers without loadProject)', () => {
    const p = clone();
    delete p.carbons[0].kinetics.Ds;
    const carbon = validateProject(p).carbons[0]!;
    let err: unknown;
    try { columnCalibrationStep(carbon, 0, [], undefined, 8, undefined); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).location.path).toBe(`${P}.Ds.CBZ.file`);
  });

  const BAD: Array<[string, (t: any) => void, string, RegExp, boolean]> = [
    ['zero EBCT', (k) => { k.column_tests.Ds.CBZ.ebct = 0; }, `${P}.Ds.CBZ.ebct`, /positive/, true],
    ['negative EBCT', (k) => { k.column_tests.Ds.CBZ.ebct = '-2 min'; }, `${P}.Ds.CBZ.ebct`, /positive|expected/, true],
    ['EBCT with a length unit', (k) => { k.column_tests.Ds.CBZ.ebct = '2 m'; }, `${P}.Ds.CBZ.ebct`, /time|unit/, false],
    ['missing EBCT', (k) => { delete k.column_tests.Ds.CBZ.ebct; }, `${P}.Ds.CBZ.ebct`, /missing "ebct"/, true],
    ['missing bed depth', (k) => { delete k.column_tests.Ds.CBZ.bed_depth; }, `${P}.Ds.CBZ.bed_depth`, /missing "bed_depth"/, true],
    ['missing file', (k) => { delete k.column_tests.Ds.CBZ.file; }, `${P}.Ds.CBZ.file`, /file name of a breakthrough table/, true],
    ['other grains without scale-up', (k) => { delete k.column_tests.Ds.CBZ.scale_up; }, `${P}.Ds.CBZ.scale_up`, /differs from the carbon's/, false],
    ['unknown scale-up', (k) => { k.column_tests.Ds.CBZ.scale_up = 'linear'; }, `${P}.Ds.CBZ.scale_up`, /"constant" or "proportional"/, true],
    ['porosity of 1', (k) => { k.column_tests.Ds.CBZ.porosity = 1; }, `${P}.Ds.CBZ.porosity`, /porosity between 0 and 1/, true],
    ['test of an unknown compound', (k) => { k.column_tests.Ds.XYZ = k.column_tests.Ds.CBZ; }, `${P}.Ds.XYZ`, /not a compound id/, false],
    ['unknown key in a test', (k) => { k.column_tests.Ds.CBZ.ebtc = '2 min'; }, `${P}.Ds.CBZ.ebtc`, /unknown key|ebtc/, true],
    ['no test', (k) => { k.column_tests.Ds = {}; }, `${P}.Ds`, /at least one column test/, true],
  ];
  for (const [what, mutate, path, words, schemaCan] of BAD) {
    it(`${what}: InputError at ${path}`, () => {
      const p = clone();
      mutate(p.carbons[0].kinetics);
      let err: unknown;
      try { validateProject(p); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).location.path).toBe(path);
      expect((err as InputError).message).toMatch(words);
      if (schemaCan) expect(validateAgainstSchema(schema, p).length).toBeGreaterThan(0);
    });
  }

  it('column tests on a PAC carbon are an unknown key there, named', () => {
    const p = clone();
    p.carbons[0].type = 'PAC';
    delete p.carbons[0].bed_density_kg_per_m3; delete p.carbons[0].ebct_min;
    p.carbons[0].kinetics = { column_tests: fixture.carbons[0].kinetics.column_tests };
    expect(() => validateProject(p)).toThrow(InputError);
    try { validateProject(p); } catch (e) { expect((e as InputError).location.path).toBe('carbons[0].kinetics.column_tests'); }
  });
});
