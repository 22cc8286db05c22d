/**
 * A GAC carbon's fixed-bed inputs (carbons[i].kinetics) in project validation: the hand validator
 * (src/project/readGacKinetics.ts) names the JSON path of every missing or bad quantity, and the
 * schema (schema/project.schema.json, checked with Ajv) rejects what JSON Schema can express.
 * Expected values: the project's own rules (closed form: bed density ρ_bed = ρp·(1 − ε)).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from './jsonSchemaCheck.js';

const root = join(__dirname, '../..');
const schema = JSON.parse(readFileSync(join(root, 'schema/project.schema.json'), 'utf8'));
const demo = JSON.parse(readFileSync(join(root, 'fixtures/demo/project.json'), 'utf8'));
const clone = (): any => JSON.parse(JSON.stringify(demo));
const GAC = 2; // the demo's GAC carbon

describe('GAC fixed-bed inputs in a project', () => {
  it('the demo reads into internal units, with the grain density from the bed density and porosity', () => {
    const k = validateProject(demo).carbons[GAC]!.bedKinetics!;
    expect(k.bedDepthM).toBe(2.5);
    expect(k.particleRadiusM).toBeCloseTo(5e-4, 15); // "0.5 mm"
    expect(k.particleDensityKgPerM3).toBeCloseTo(450 / (1 - 0.4), 9); // ρp = ρ_bed/(1 − ε)
    expect(k.filters).toBe(4);
    expect(k.doc).toEqual({ dsM2PerS: 2e-15, dlM2PerS: 4e-10 });
    expect(k.compounds.CBZ).toEqual({ dsM2PerS: 1e-14, dlM2PerS: 7e-10 });
    expect(validateAgainstSchema(schema, demo)).toEqual([]);
  });

  it('defaults: porosity 0.4, one filter, 12 °C (common practice)', () => {
    const p = clone();
    delete p.carbons[GAC].kinetics.porosity; delete p.carbons[GAC].kinetics.filters; delete p.carbons[GAC].kinetics.temperature_c;
    const k = validateProject(p).carbons[GAC]!.bedKinetics!;
    expect([k.porosity, k.filters, k.temperatureC]).toEqual([0.4, 1, 12]);
  });

  const BAD: Array<[string, (k: any) => void, string, RegExp, boolean]> = [
    ['missing bed depth', (k) => { delete k.bed_depth; }, 'carbons[2].kinetics.bed_depth', /missing "bed_depth"/, true],
    ['missing grain radius', (k) => { delete k.particle_radius; }, 'carbons[2].kinetics.particle_radius', /missing "particle_radius"/, true],
    ['missing Ds of one compound', (k) => { delete k.Ds.CBZ; }, 'carbons[2].kinetics.Ds.CBZ', /surface diffusivity of "CBZ"/, false],
    ['missing DL of one compound', (k) => { delete k.DL.CBZ; }, 'carbons[2].kinetics.DL.CBZ', /liquid diffusivity of "CBZ"/, false],
    ['missing DOC Ds', (k) => { delete k.doc_Ds; }, 'carbons[2].kinetics.doc_Ds', /missing "doc_Ds"/, true],
    ['missing DOC DL and kf', (k) => { delete k.doc_DL; }, 'carbons[2].kinetics.doc_DL', /liquid diffusivity of the DOC components/, true],
    ['Ds with a wrong unit', (k) => { k.Ds.CBZ = '1e-14 m/s'; }, 'carbons[2].kinetics.Ds.CBZ', /diffusivity/, false],
    ['zero bed depth', (k) => { k.bed_depth = 0; }, 'carbons[2].kinetics.bed_depth', /positive/, true],
    ['porosity of 1', (k) => { k.porosity = 1; }, 'carbons[2].kinetics.porosity', /porosity between 0 and 1/, true],
    ['half a filter', (k) => { k.filters = 2.5; }, 'carbons[2].kinetics.filters', /whole number of filters/, true],
    ['grain density against bed density', (k) => { k.particle_density = '1000 kg/m3'; }, 'carbons[2].kinetics.particle_density', /disagrees with the bed density/, false],
    ['Ds of an unknown compound', (k) => { k.Ds.XYZ = '1e-14 m2/s'; }, 'carbons[2].kinetics.Ds.XYZ', /not a compound id/, false],
    ['unknown key', (k) => { k.bed_dept = '2 m'; }, 'carbons[2].kinetics.bed_dept', /unknown key|bed_dept/, true],
  ];
  for (const [what, mutate, path, words, schemaCan] of BAD) {
    it(`${what}: InputError at ${path}`, () => {
      const p = clone();
      mutate(p.carbons[GAC].kinetics);
      let err: unknown;
      try { validateProject(p); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).location.path).toBe(path);
      expect((err as InputError).message).toMatch(words);
      // units, cross-references and consistency are the hand validator's alone
      if (schemaCan) expect(validateAgainstSchema(schema, p).length).toBeGreaterThan(0);
    });
  }

  it('fixed-bed inputs on a PAC carbon are read as its particle data: the bed keys are unknown there and named', () => {
    const p = clone();
    p.carbons[0].kinetics = p.carbons[GAC].kinetics;
    expect(() => validateProject(p)).toThrow(/unknown key "bed_depth"/);
    try { validateProject(p); } catch (e) { expect((e as InputError).location.path).toBe('carbons[0].kinetics.bed_depth'); }
  });
});
