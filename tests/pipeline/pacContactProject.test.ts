/**
 * The plant's PAC contact conditions (site.pac_contact) and each PAC carbon's kinetic data
 * (carbons[i].kinetics) in a project file: read into internal units, and every bad input an
 * InputError naming the JSON path, the component and the field, also rejected by the JSON Schema
 * where the schema can express the rule.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from '../project/jsonSchemaCheck.js';

const root = join(__dirname, '../..');
const schema = JSON.parse(readFileSync(join(root, 'schema/project.schema.json'), 'utf8'));
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const fixture = (): any => JSON.parse(readFileSync(join(root, 'fixtures/project/pac-contact/project.json'), 'utf8'));

describe('contact conditions and kinetic data in a project file', () => {
  it('reads the fixture: times in s, radius m, density g/L, diffusivities m²/s (exact SI factors)', () => {
    const p = validateProject(fixture());
    expect(validateAgainstSchema(schema, fixture())).toEqual([]);
    expect(p.site.pacContact).toEqual({ kind: 'plug-flow', contactTimeS: 1800 }); // 30 min × 60 s/min
    const k = p.carbons[0]!.kinetics!;
    expect(k.particleRadiusM).toBeCloseTo(1e-5, 18); // 10 µm
    expect(k.particleDensityGPerL).toBeCloseTo(650, 9); // 650 kg/m³ = 650 g/L
    expect(k.dsM2PerS.CBZ).toBeCloseTo(2e-15, 28);
    expect(k.dlM2PerS.BTZ).toBeCloseTo(9e-10, 22);
    expect(k.docDsM2PerS).toBeCloseTo(1e-15, 28);
  });

  it('a stirred tank with a carbon age; without carbon_age the age is the contact time (no recirculation)', () => {
    const p = fixture();
    p.site.pac_contact = { contact_time: '30 min', carbon_age: '3 d' };
    expect(validateProject(p).site.pacContact).toEqual({ kind: 'stirred', contactTimeS: 1800, carbonAgeS: 3 * 86400 });
    expect(validateAgainstSchema(schema, p)).toEqual([]);
    p.site.pac_contact = { contact_time: 1200 };
    expect(validateProject(p).site.pacContact).toEqual({ kind: 'stirred', contactTimeS: 1200, carbonAgeS: 1200 });
  });

  it('"equilibrium" and no pac_contact are the same project (today\'s behaviour), kinetic data then unused', () => {
    const p = fixture();
    p.site.pac_contact = 'equilibrium';
    const a = validateProject(p);
    delete p.site.pac_contact;
    delete p.carbons[0].kinetics.Ds;
    const b = validateProject(p);
    expect(a.site.pacContact).toBeUndefined();
    expect(b.site.pacContact).toBeUndefined();
    expect(validateAgainstSchema(schema, p)).toEqual([]);
  });
});

describe('the demo variant with contact conditions (fixtures/demo/project-contact.json, invented)', () => {
  const variant = JSON.parse(readFileSync(join(root, 'fixtures/demo/project-contact.json'), 'utf8'));
  const demo = JSON.parse(readFileSync(join(root, 'fixtures/demo/project.json'), 'utf8'));

  it('validates: a 30-minute stirred tank, carbon age 3 d, kinetic data on both PAC carbons', () => {
    expect(validateAgainstSchema(schema, variant)).toEqual([]);
    const p = validateProject(variant);
    expect(p.site.pacContact).toEqual({ kind: 'stirred', contactTimeS: 1800, carbonAgeS: 3 * 86400 });
    for (const c of p.carbons.filter((x) => x.type === 'PAC')) expect(Object.keys(c.kinetics!.dsM2PerS).sort()).toEqual(p.compounds.map((x) => x.id).sort());
  });

  it('is the demo plus contact conditions and kinetic data (kept in step with the demo)', () => {
    const strip = (p: any) => { // eslint-disable-line @typescript-eslint/no-explicit-any
      const q = JSON.parse(JSON.stringify(p));
      delete q.name; delete q.note; delete q.uncertainty; delete q.site.pac_contact;
      for (const c of q.carbons) delete c.kinetics;
      return q;
    };
    expect(strip(variant)).toEqual(strip(demo));
    expect(variant.carbons[2].kinetics).toEqual(demo.carbons[2].kinetics); // GAC C: the same fixed-bed inputs and pilot-column test
  });
});

// [description, mutation, JSON path the message must name, words the message must contain, schema can tell]
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const BAD: Array<[string, (p: any) => void, string, RegExp, boolean]> = [
  ['missing Ds of a compound', (p) => { delete p.carbons[0].kinetics.Ds.BTZ; }, 'carbons[0].kinetics.Ds.BTZ', /component "BTZ" has no surface diffusivity Ds on carbon "Test PAC \(invented\)"/, false],
  ['missing DL of a compound', (p) => { delete p.carbons[0].kinetics.DL.CBZ; }, 'carbons[0].kinetics.DL.CBZ', /component "CBZ" has no liquid diffusivity DL/, false],
  ['missing doc_Ds', (p) => { delete p.carbons[0].kinetics.doc_Ds; }, 'carbons[0].kinetics.doc_Ds', /background \(DOC\) components have no surface diffusivity/, false],
  ['missing particle radius', (p) => { delete p.carbons[0].kinetics.particle_radius; }, 'carbons[0].kinetics.particle_radius', /no particle radius/, false],
  ['no kinetics on a PAC carbon', (p) => { delete p.carbons[0].kinetics; }, 'carbons[0].kinetics', /has no kinetic data/, false],
  ['carbon age below the contact time', (p) => { p.site.pac_contact = { contact_time: '30 min', carbon_age: '10 min' }; }, 'site.pac_contact.carbon_age', /carbon age \(600 s\) is below the contact time \(1800 s\)/, false],
  ['carbon age with a plug-flow contact', (p) => { p.site.pac_contact.carbon_age = '3 d'; }, 'site.pac_contact.carbon_age', /plug-flow contact .* has no carbon age/, true],
  ['zero contact time', (p) => { p.site.pac_contact.contact_time = 0; }, 'site.pac_contact.contact_time', /positive contact time/, true],
  ['contact time without a time unit', (p) => { p.site.pac_contact.contact_time = '30 mg/L'; }, 'site.pac_contact.contact_time', /time/, false],
  ['unknown reactor', (p) => { p.site.pac_contact.reactor = 'batch'; }, 'site.pac_contact.reactor', /"stirred" or "plug-flow"/, true],
  ['pac_contact as another word', (p) => { p.site.pac_contact = 'equilibrum'; }, 'site.pac_contact', /"equilibrium" or the contact conditions/, true],
  ['unknown key in pac_contact', (p) => { p.site.pac_contact.age = '3 d'; }, 'site.pac_contact.age', /unknown key "age"/, true],
  ['unknown key in kinetics', (p) => { p.carbons[0].kinetics.Dss = {}; }, 'carbons[0].kinetics.Dss', /unknown key "Dss"/, true],
  ['Ds for an unknown compound', (p) => { p.carbons[0].kinetics.Ds.XYZ = '1e-15 m2/s'; }, 'carbons[0].kinetics.Ds.XYZ', /not a compound id/, false],
  ['negative Ds', (p) => { p.carbons[0].kinetics.Ds.CBZ = -1e-15; }, 'carbons[0].kinetics.Ds.CBZ', /expected a non-negative value, got -1e-15/, true],
  ['Ds with a length unit', (p) => { p.carbons[0].kinetics.Ds.CBZ = '2e-15 m'; }, 'carbons[0].kinetics.Ds.CBZ', /diffusivity/, false],
  ['kinetics on a GAC carbon are its fixed-bed inputs, which then need every compound', (p) => { p.carbons.push({ name: 'G', type: 'GAC', price_per_kg: 1, currency: 'CHF', bed_density_kg_per_m3: 450, ebct_min: 20, kinetics: { bed_depth: '2.5 m', particle_radius: '0.5 mm' } }); }, 'carbons[1].kinetics.Ds.CBZ', /missing the surface diffusivity of "CBZ"/, false],
];

describe('bad contact conditions and kinetic data name the JSON path, component and field', () => {
  for (const [what, mutate, path, words, schemaCan] of BAD) {
    it(what, () => {
      const p = fixture();
      mutate(p);
      let err: unknown;
      try { validateProject(p); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      const e = err as InputError;
      expect(e.location.path).toBe(path);
      expect(e.message).toMatch(words);
      if (schemaCan) expect(validateAgainstSchema(schema, p).length).toBeGreaterThan(0);
    });
  }
});
