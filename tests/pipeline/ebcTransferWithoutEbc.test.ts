/**
 * EBC background with a calibration transfer (issue 11, capability 21): with
 * `calibration_transfer` set to "mean" or a compound id, the compounds without jar tests take the
 * transferred EBC (simplified-EBC rule: the compound's own isotherm, c0_EBC = (c0_EBC/DOC of the
 * calibrated compounds) × DOC) and need no EBC of their own in the project's background; without
 * a transfer (or with "none") a missing EBC is still an input error at background.ebc.<id>.
 * Expected doses are computed by hand from the transferred ratio with the library's public
 * `doseFor` (one batch IAST of the compound beside its EBC), so the run must reproduce them to the
 * dose search's tolerance.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { copyFileSync, existsSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { validateProject } from '../../src/project/validateProject.js';
import { InputError } from '../../src/core/errors.js';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { doseFor } from '../../src/api/equilibriumApi.js';
import { compoundsCsv } from '../../src/output/outputTables.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';
import { runBin, scratchDir } from '../helpers/cliHarness.js';

const root = join(__dirname, '../..');
const src = join(root, 'fixtures/project/ebc-background');
const now = { now: new Date('2026-01-01T00:00:00Z') };
const scratch = scratchDir('sorbshare-ebc-transfer-');
const UNTESTED = ['DCF', 'MET', 'VEN', 'HCT', 'BTZ', 'CAN', 'SUC'];

/** The EBC fixture (CBZ calibrated with model "sebc") with no EBC of its own for any compound. */
function noEbcs(transfer?: unknown): any {
  const p = JSON.parse(readFileSync(join(src, 'project.json'), 'utf8'));
  delete p.$schema;
  p.background.ebc = {};
  if (transfer !== undefined) p.calibration_transfer = transfer;
  return p;
}

const results: Record<string, PipelineResult> = {};
beforeAll(() => {
  copyFileSync(join(src, 'jar_tests_cbz.csv'), join(scratch.dir, 'jar_tests_cbz.csv'));
  for (const t of ['mean', 'CBZ']) results[t] = runPipeline(loadProject(scratch.write(`project-${t}.json`, noEbcs(t))), now);
}, 120_000);
afterAll(() => rmSync(scratch.dir, { recursive: true, force: true }));

describe('validation: an EBC background with a transfer needs no EBC for the untested compounds', () => {
  it('"mean" and "CBZ" validate with an empty EBC table', () => {
    expect(validateProject(noEbcs('mean')).calibrationTransfer).toEqual({ kind: 'mean' });
    expect(validateProject(noEbcs('CBZ')).calibrationTransfer).toEqual({ kind: 'compound', compoundId: 'CBZ' });
  });

  for (const t of [undefined, 'none']) {
    it(`${t === undefined ? 'without the key' : '"none"'}: the first untested compound's missing EBC is an input error at background.ebc.DCF`, () => {
      let err: unknown;
      try { validateProject(noEbcs(t)); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).location.path).toBe('background.ebc.DCF');
      expect((err as InputError).message).toMatch(/missing the EBC of compound "DCF"; expected .* or a "calibration_transfer" from a compound with jar tests/);
    });
  }
});

describe('the run: untested compounds take the transferred EBC, flagged "transferred from CBZ"', () => {
  for (const t of ['mean', 'CBZ']) {
    it(`calibration_transfer "${t}": doses by hand with doseFor from the transferred ratio (to 1e-6 relative) on the PAC carbon`, () => {
      const r = results[t]!;
      const cal = r.calibrations[0]!;
      expect(cal.compoundId).toBe('CBZ');
      const ratio = cal.ebc!.c0MgPerL / cal.ebc!.docMgPerL;
      // one calibrated compound: the geometric mean is its own ratio (closed form)
      expect(r.calibrationTransfer!.ebcC0PerDoc!).toBeCloseTo(ratio, 14);
      expect(r.calibrationTransfer!.label).toBe('transferred from CBZ');
      expect(r.calibrationTransfer!.toIds).toEqual(UNTESTED);
      const doc = r.project.site.docMgPerL;
      const cr = r.carbons.find((c) => c.required)!;
      for (const id of UNTESTED) {
        const comp = r.project.compounds.find((c) => c.id === id)!;
        const sys = cr.systems.find((s) => s.compoundId === id)!;
        expect(sys.calibration).toBe('transferred from CBZ');
        expect(sys.description).toMatch(/^EBC transferred from CBZ \(simplified-EBC rule/);
        const got = cr.required!.compounds.find((c) => c.compoundId === id)!;
        if (comp.limitMgPerL !== undefined && comp.limitMgPerL >= comp.c0MgPerL) { expect(got.status).toBe('met without carbon'); continue; }
        const hand = doseFor({ components: [
          { id, c0: comp.c0MgPerL, K: comp.K, one_over_n: comp.oneOverN },
          { id: 'EBC', c0: ratio * doc, K: comp.K, one_over_n: comp.oneOverN },
        ] }, id, { removal: 80 });
        expect(got.status).toBe('met');
        expect(Math.abs(got.doseMgPerL! / hand.dose_mg_per_L - 1)).toBeLessThan(1e-6);
      }
      const csv = compoundsCsv(r).split('\n');
      for (const id of UNTESTED) for (const l of csv.filter((x) => x.includes(`,${id},`))) expect(l.endsWith(',transferred from CBZ')).toBe(true);
    });
  }

  it('sorbshare run: exit 0, compounds.csv and the summary flag the transfer', () => {
    const out = join(scratch.dir, 'out');
    const r = runBin('run', scratch.write('project-cli.json', noEbcs('mean')), '--out', out);
    expect(r.code).toBe(0);
    expect(existsSync(join(out, 'run.json'))).toBe(true);
    expect(readFileSync(join(out, 'compounds.csv'), 'utf8')).toContain('transferred from CBZ');
    expect(readFileSync(join(out, 'summary.md'), 'utf8')).toContain('transferred from CBZ');
  }, 120_000);
});

describe('a transferred EBC over a compound\'s own EBC', () => {
  it('the run warns, naming the compounds whose project EBC the transfer replaces; without own EBCs it does not', () => {
    const p = JSON.parse(readFileSync(join(src, 'project.json'), 'utf8'));
    delete p.$schema;
    p.calibration_transfer = 'CBZ';
    const r = runPipeline(loadProject(scratch.write('project-own-ebcs.json', p)), now);
    const w = r.warnings.filter((x) => /replaces the project's own EBC/.test(x));
    expect(w).toHaveLength(1);
    expect(w[0]).toContain(`transferred from CBZ: the transferred EBC replaces the project's own EBC of ${UNTESTED.join(', ')} (background.ebc)`);
    // the transfer does win: DCF's competitor is the transferred EBC, not the project's
    const dcf = r.carbons[0]!.systems.find((s) => s.compoundId === 'DCF')!;
    expect(dcf.calibration).toBe('transferred from CBZ');
    for (const t of ['mean', 'CBZ']) expect(results[t]!.warnings.some((x) => /replaces the project's own EBC/.test(x))).toBe(false);
  });
});
