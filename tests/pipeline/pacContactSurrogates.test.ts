/**
 * The DOC/UV254 surrogates under PAC contact conditions: with a fractionated background the
 * set-points come from the contact model's background (the fictive DOC components with the
 * shared doc_Ds and doc_DL), not from equilibrium. Small kinetic settings (4 interior points,
 * rtol 1e-4) keep the run to seconds; the DOC series is left out for the same reason.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { surrogatesAtDose } from '../../src/pipeline/surrogateStep.js';
import type { CarbonKinetics } from '../../src/project/readCarbonKinetics.js';

const FIXTURE = join(process.cwd(), 'fixtures/project/background-file/project.json');
const NOW = new Date('2026-01-01T00:00:00Z');
// invented kinetic data (orders of magnitude common for PAC), as in fixtures/project/pac-contact
const KINETICS: CarbonKinetics = {
  particleRadiusM: 10e-6, particleDensityGPerL: 650,
  dsM2PerS: { CBZ: 2e-15, DCF: 2e-15, BTZ: 3e-15 }, dlM2PerS: { CBZ: 7e-10, DCF: 6.5e-10, BTZ: 9e-10 },
  docDsM2PerS: 1e-15, docDlM2PerS: 5e-10,
};

describe('surrogates under contact conditions', () => {
  it('the DOC reduction at the required dose is below the equilibrium DOC reduction at the same dose', () => {
    const loaded = loadProject(FIXTURE);
    const base = { ...loaded };
    delete base.series;
    const plain = runPipeline(base, { now: NOW });
    const project = {
      ...loaded.project,
      site: { ...loaded.project.site, pacContact: { kind: 'plug-flow' as const, contactTimeS: 1800 } },
      carbons: loaded.project.carbons.map((c) => ({ ...c, kinetics: KINETICS })),
    };
    const r = runPipeline({ ...base, project }, { now: NOW, kinetic: { interiorPoints: 4, rtol: 1e-4 } });
    r.carbons.forEach((cr, i) => {
      const s = cr.surrogates!.atRequiredDose!;
      expect(s.doseMgPerL).toBe(cr.required!.doseMgPerL);
      expect(cr.required!.doseMgPerL!).toBeGreaterThanOrEqual(cr.contact!.equilibriumDoseMgPerL!);
      expect(cr.contact!.equilibriumDoseMgPerL).toBe(plain.carbons[i]!.required!.doseMgPerL);
      // the equilibrium DOC and UV254 reduction at the same dose (batch IAST of the same background):
      // contact leaves more DOC in the water at a dose than equilibrium
      const eq = surrogatesAtDose(cr.surrogates!.model, s.doseMgPerL);
      expect(s.docReduction).toBeGreaterThan(0);
      expect(s.docReduction).toBeLessThan(eq.docReduction);
      expect(s.uv254Reduction!).toBeLessThan(eq.uv254Reduction!);
      // the surrogate curve comes from the contact model too, point by point
      cr.surrogates!.curve.points.forEach((p) => expect(p.docReduction).toBeLessThan(surrogatesAtDose(cr.surrogates!.model, p.doseMgPerL).docReduction));
    });
  }, 600_000);
});
