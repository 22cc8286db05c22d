import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { validateAgainstSchema } from './jsonSchemaCheck.js';

const root = join(__dirname, '../..');
const schema = JSON.parse(readFileSync(join(root, 'schema/project.schema.json'), 'utf8'));
const demo = JSON.parse(readFileSync(join(root, 'fixtures/demo/project.json'), 'utf8'));
const fixtureProjects = readdirSync(join(root, 'fixtures/project'))
  .map((d) => join(root, 'fixtures/project', d, 'project.json'))
  .filter((p) => existsSync(p));

function clone<T>(x: T): T { return JSON.parse(JSON.stringify(x)) as T; }

describe('project files validate against the hand-written validator and the shipped JSON Schema', () => {
  for (const p of [join(root, 'fixtures/demo/project.json'), ...fixtureProjects]) {
    it(p.slice(root.length + 1), () => {
      const raw = JSON.parse(readFileSync(p, 'utf8'));
      expect(() => validateProject(raw)).not.toThrow();
      expect(validateAgainstSchema(schema, raw)).toEqual([]);
    });
  }

  it('converts quantities to internal units (flow m³/d, concentrations mg/L, K (mg/g)/(mg/L)^(1/n))', () => {
    const p = validateProject(demo);
    expect(p.site.flowM3PerD).toBe(15000);
    expect(p.site.uv254PerM).toBeCloseTo(18.3, 12);
    const dcf = p.compounds.find((c) => c.id === 'DCF')!;
    expect(dcf.c0MgPerL).toBeCloseTo(1.5e-3, 15);
    // Chen et al. 1999: K' = K·f_q/f_c^(1/n) = 18.4·1/(1e-3)^0.33
    expect(dcf.K).toBeCloseTo(18.4 / Math.pow(1e-3, 0.33), 9);
    const ebc = validateProject(JSON.parse(readFileSync(join(root, 'fixtures/project/ebc-background/project.json'), 'utf8')));
    expect(ebc.site.flowM3PerD).toBeCloseTo(250 * 86.4, 9); // 250 L/s
    expect(ebc.compounds.find((c) => c.id === 'SUC')!.limitMgPerL).toBeCloseTo(0.02, 15);
  });
});

// Each bad project: [description, mutation, JSON path the message must name, words of what was expected]
const BAD: Array<[string, (p: any) => void, string, RegExp]> = [
  ['missing site', (p) => { delete p.site; }, 'site', /missing "site"/],
  ['flow without a flow unit', (p) => { p.site.flow = '12000 mg/L'; }, 'site.flow', /flow/],
  ['negative DOC', (p) => { p.site.doc = -3; }, 'site.doc', /non-negative|positive/],
  ['typo in a site key', (p) => { p.site.flwo = 1; }, 'site.flwo', /unknown key "flwo"/],
  ['compounds not an array', (p) => { p.compounds = {}; }, 'compounds', /array/],
  ['exponent as text', (p) => { p.compounds[2].one_over_n = 'a'; }, 'compounds[2].one_over_n', /one_over_n as a number/],
  ['missing K', (p) => { delete p.compounds[1].K; }, 'compounds[1].K', /missing "K"/],
  ['K = 0 for a target', (p) => { p.compounds[0].K = 0; }, 'compounds[0].K', /K > 0/],
  ['duplicate compound id', (p) => { p.compounds[3].id = 'CBZ'; }, 'compounds[3].id', /duplicate compound id "CBZ"/],
  ['unknown K unit', (p) => { p.compounds[1].K_unit.q = 'furlong'; }, 'compounds[1].K_unit', /unknown unit "furlong"|not a loading/],
  ['c0 with a flow unit', (p) => { p.compounds[4].c0 = '3 m3/d'; }, 'compounds[4].c0', /concentration/],
  ['indicator category 3', (p) => { p.compounds[0].indicator_category = 3; }, 'compounds[0].indicator_category', /category 1 or 2/],
  ['unknown calibration model', (p) => { p.compounds[0].jar_tests.model = 'magic'; }, 'compounds[0].jar_tests.model', /"ebc", "sebc" or "fictive-k"/],
  ['two background modes', (p) => { p.background.file = 'x.json'; }, 'background', /exactly one of/],
  ['components out of range', (p) => { p.background.fractionation.components = 9; }, 'background.fractionation.components', /2 to 5/],
  ['carbon type', (p) => { p.carbons[0].type = 'BAC'; }, 'carbons[0].type', /"PAC" or "GAC"/],
  ['price as text', (p) => { p.carbons[1].price_per_kg = '1.7 EUR'; }, 'carbons[1].price_per_kg', /price per kg/],
  ['GAC without bed density', (p) => { p.carbons[0].type = 'GAC'; p.carbons[0].ebct_min = 15; }, 'carbons[0].bed_density_kg_per_m3', /bed density/],
  ['isotherm for an unknown compound', (p) => { p.carbons[1].isotherms.XYZ = { K: 1, one_over_n: 0.3 }; }, 'carbons[1].isotherms.XYZ', /not a compound id/],
  ['removal goal of 100 %', (p) => { p.goals.removal_percent = 100; }, 'goals.removal_percent', /between 0 and 100/],
  ['limit for an unknown compound', (p) => { p.goals.limits = { NOPE: '1 ng/L' }; }, 'goals.limits.NOPE', /not a compound id/],
  ['indicator goal without mean', (p) => { p.goals.indicator = {}; }, 'goals.indicator.mean_removal_percent', /missing "mean_removal_percent"/],
  ['sweep with 1 point', (p) => { p.goals.sweep.points = 1; }, 'goals.sweep.points', /whole number of doses/],
  ['pilot without a file', (p) => { delete p.pilot.file; }, 'pilot.file', /missing "file"/],
  ['pilot band of 100', (p) => { p.pilot.band_percent = 100; }, 'pilot.band_percent', /between 0 and 100/],
  ['pilot carbon unknown', (p) => { p.pilot.carbon = 'Carbon Z'; }, 'pilot.carbon', /not a carbon name/],
  ['pilot key typo', (p) => { p.pilot.band = 5; }, 'pilot.band', /unknown key "band"/],
  ['uncertainty not an object', (p) => { p.uncertainty = 500; }, 'uncertainty', /Monte Carlo settings/],
  ['negative draws', (p) => { p.uncertainty.draws = -3; }, 'uncertainty.draws', /whole number of draws/],
  ['seed as text', (p) => { p.uncertainty.seed = 'abc'; }, 'uncertainty.seed', /whole-number seed/],
  ['seed above 2^32 − 1', (p) => { p.uncertainty.seed = 4294967296; }, 'uncertainty.seed', /whole-number seed/],
  ['relative SD of 3', (p) => { p.uncertainty.doc_rel_sd = 3; }, 'uncertainty.doc_rel_sd', /relative standard deviation of the DOC/],
  ['retired doc_levels', (p) => { p.uncertainty.doc_levels = 4; }, 'uncertainty.doc_levels', /the key "doc_levels" is retired and no longer does anything: .*DOC nodes of the design layer's dose table.*remove the key/],
];

describe('bad project files name the JSON path and what was expected', () => {
  for (const [what, mutate, path, words] of BAD) {
    it(what, () => {
      const p = clone(demo);
      mutate(p);
      let err: unknown;
      try { validateProject(p); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      const e = err as InputError;
      expect(e.location.path).toBe(path);
      expect(e.message).toContain(`field ${path}`);
      expect(e.message).toMatch(words);
      // The schema rejects it too, where JSON Schema can express the rule (units, ranges of
      // converted quantities and cross-references are the hand validator's alone).
      const schemaCan = !['pilot carbon unknown', 'flow without a flow unit', 'unknown K unit', 'c0 with a flow unit', 'isotherm for an unknown compound', 'limit for an unknown compound', 'duplicate compound id'].includes(what);
      if (schemaCan) expect(validateAgainstSchema(schema, p).length).toBeGreaterThan(0);
    });
  }

  it('a wrong fixture project also fails the schema (typo keys)', () => {
    const p = clone(demo);
    p.goals.indicatr = {};
    expect(validateAgainstSchema(schema, p)).toContain('$.goals.indicatr: additional property');
  });

  it('EBC background needs an EBC or ebc/sebc jar tests for every compound', () => {
    const p = JSON.parse(readFileSync(join(root, 'fixtures/project/ebc-background/project.json'), 'utf8'));
    delete p.background.ebc.DCF;
    expect(() => validateProject(p)).toThrow(/field background\.ebc\.DCF: missing the EBC of compound "DCF"/);
    const q = JSON.parse(readFileSync(join(root, 'fixtures/project/ebc-background/project.json'), 'utf8'));
    q.compounds[0].jar_tests.model = 'fictive-k';
    expect(() => validateProject(q)).toThrow(/field compounds\[0\]\.jar_tests\.model: the model "fictive-k" needs a fractionated background/);
  });

  it('reads the pilot and uncertainty sections with their defaults (band 10 percentage points; relative SDs 0)', () => {
    const p = validateProject(demo);
    expect(p.pilot).toEqual({ file: 'pilot_pairs.csv', bandPercent: 10, carbon: 'Carbon A (coal-based)' });
    expect(p.uncertainty).toMatchObject({ seed: 2026, KRelSd: 0.2, oneOverNRelSd: 0.05, docRelSd: 0.05, fractionRelSd: 0.1, backgroundKRelSd: 0 });
    const q = clone(demo);
    q.pilot = { file: 'x.csv' };
    q.uncertainty = {};
    const v = validateProject(q);
    expect(v.pilot!.bandPercent).toBe(10);
    expect(v.uncertainty).toEqual({ draws: 1000, seed: 1, KRelSd: 0, oneOverNRelSd: 0, docRelSd: 0, fractionRelSd: 0, backgroundKRelSd: 0 });
  });

  it('a chosen indicator compound must have a category', () => {
    const p = JSON.parse(readFileSync(join(root, 'fixtures/project/ebc-background/project.json'), 'utf8'));
    p.goals.indicator.compounds.push('SUC');
    expect(() => validateProject(p)).toThrow(/field goals\.indicator\.compounds\[6\]: compound "SUC" has no indicator_category/);
  });
});
