/**
 * `sorbshare run` with PAC contact conditions, end to end (the real binary; `npm run build`
 * first): bad kinetic inputs exit 2 naming the path, component and field, with nothing written;
 * the run writes the contact figures in run.json, the --json summary and the report. The kinetic
 * model runs with the library defaults here (16 collocation points), so this run takes tens of
 * seconds until the kinetic core is made faster.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runBin } from '../helpers/cliHarness.js';

const FIXTURE = join(process.cwd(), 'fixtures/project/pac-contact/project.json');
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const project = (): any => JSON.parse(readFileSync(FIXTURE, 'utf8'));

function withProject(mutate: (p: ReturnType<typeof project>) => void, f: (path: string, out: string) => void): void {
  const dir = mkdtempSync(join(tmpdir(), 'sorbshare-contact-'));
  try {
    const p = project();
    mutate(p);
    delete p.$schema;
    const path = join(dir, 'project.json');
    writeFileSync(path, JSON.stringify(p));
    f(path, join(dir, 'out'));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe('sorbshare run with PAC contact conditions', () => {
  const bad: Array<[string, (p: ReturnType<typeof project>) => void, string]> = [
    ['missing Ds', (p) => { delete p.carbons[0].kinetics.Ds.CBZ; }, 'carbons[0].kinetics.Ds.CBZ: component "CBZ" has no surface diffusivity Ds'],
    ['carbon age below the contact time', (p) => { p.site.pac_contact = { contact_time: '30 min', carbon_age: '20 min' }; }, 'site.pac_contact.carbon_age: the carbon age (1200 s) is below the contact time (1800 s)'],
    ['non-positive contact time', (p) => { p.site.pac_contact.contact_time = '0 min'; }, 'site.pac_contact.contact_time: expected a positive contact time'],
  ];
  for (const [what, mutate, message] of bad) {
    it(`${what}: exit 2, the path and field named, nothing written`, () => {
      withProject(mutate, (path, out) => {
        const r = runBin('run', path, '--out', out, '--json');
        expect(r.code).toBe(2);
        expect(r.err).toContain(message);
        expect(r.out).toBe('');
        expect(existsSync(out)).toBe(false);
      });
    });
  }

  it('the run: required dose ≥ equilibrium dose, their ratio and the contact time and carbon age in --json and run.json; the report has the figures', () => {
    withProject((p) => { p.site.pac_contact = { contact_time: '30 min', reactor: 'plug-flow' }; }, (path, out) => {
      const r = runBin('run', path, '--out', out, '--json');
      expect(r.code).toBe(0);
      const c = JSON.parse(r.out).carbons[0];
      expect(c.required_dose_mg_per_L).toBeGreaterThanOrEqual(c.equilibrium_dose_mg_per_L);
      expect(c.dose_ratio_contact_to_equilibrium).toBeCloseTo(c.required_dose_mg_per_L / c.equilibrium_dose_mg_per_L, 12);
      expect(c.contact).toMatchObject({ contact_time_s: 1800, carbon_age_s: 1800, reactor: 'plug-flow' });
      const rec = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
      const rc = rec.results.carbons[0];
      expect(rc.contact.equilibrium_dose_mg_per_L).toBe(c.equilibrium_dose_mg_per_L);
      expect(rc.contact.dose_ratio_contact_to_equilibrium).toBe(c.dose_ratio_contact_to_equilibrium);
      expect(rc.required_dose.dose_mg_per_L).toBe(c.required_dose_mg_per_L);
      const html = readFileSync(join(out, 'report.html'), 'utf8');
      for (const id of ['contact-time-1', 'contact-dose-1', 'carbon-age-1']) expect(html).toContain(id);
      expect(html).toContain('PAC contact conditions');
    });
  }, 600_000);
});
