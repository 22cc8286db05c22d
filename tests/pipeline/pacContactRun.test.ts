/**
 * The whole job under the plant's PAC contact conditions, in process with small kinetic settings
 * (4 interior collocation points, rtol 1e-4: the kinetic core is being made faster on another
 * branch; these settings keep the test to seconds). Checks: the required dose under contact is at
 * least the equilibrium dose (contact leaves less removal at every dose than equilibrium; in the kinetic model
 * the long-time limit is the batch equilibrium), the ratio is reported, run.json carries
 * the contact figures, and `equilibrium` contact leaves the run exactly as before.
 */
import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { carbonModel } from '../../src/design/carbonModel.js';
import { runRecord } from '../../src/output/runRecord.js';
import { contactSummary } from '../../src/output/contactRecord.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import type { PipelineInput } from '../../src/pipeline/pipelineTypes.js';

const FIXTURE = join(process.cwd(), 'fixtures/project/pac-contact/project.json');
const FAST = { kinetic: { interiorPoints: 4, rtol: 1e-4 } };
const NOW = new Date('2026-01-01T00:00:00Z');

function withoutContact(input: PipelineInput): PipelineInput {
  const site = { ...input.project.site };
  delete site.pacContact;
  return { ...input, project: { ...input.project, site } };
}

describe('run under PAC contact conditions', () => {
  const input = loadProject(FIXTURE);
  const r = runPipeline(input, { ...FAST, now: NOW });
  const cr = r.carbons[0]!;

  it('required dose under contact ≥ equilibrium dose, ratio = their quotient, both reached', () => {
    const req = cr.required!.doseMgPerL!;
    const eq = cr.contact!.equilibriumDoseMgPerL!;
    expect(req).toBeGreaterThan(0);
    expect(eq).toBeGreaterThan(0);
    expect(req).toBeGreaterThanOrEqual(eq);
    expect(cr.contact!.doseRatio).toBeCloseTo(req / eq, 12); // definition of the ratio
    // every compound's dose under contact is at least its equilibrium dose (same goal)
    cr.required!.compounds.forEach((c, i) => {
      const e = cr.contact!.equilibrium.compounds[i]!;
      expect(c.status).toBe('met');
      expect(c.doseMgPerL!).toBeGreaterThanOrEqual(e.doseMgPerL!);
    });
    expect(cr.contact!.contactTimeS).toBe(1800); // 30 min
    expect(cr.contact!.carbonAgeS).toBe(1800); // plug flow: every particle stays the contact time
    expect(cr.contact!.model).toMatch(/plug flow/);
  });

  it('sensitivity under contact: contact time is a case (longer contact, less carbon); the high bar equals a run with a 36-minute tank', () => {
    const s = cr.sensitivity!;
    const row = s.rows.find((x) => x.key === 'contact_time')!;
    expect(row).toBeDefined();
    expect(row.doseHighMgPerL!).toBeLessThan(row.doseLowMgPerL!); // 36 min needs less carbon than 24 min
    expect(s.notModelled).toEqual(['carbon age (plug-flow contact)']);
    // recomputed through the whole run with the contact time raised by 20 % (not through the sensitivity step)
    const site = { ...input.project.site, pacContact: { kind: 'plug-flow' as const, contactTimeS: 1800 * 1.2 } };
    const longer = runPipeline({ ...input, project: { ...input.project, site } }, { ...FAST, now: NOW });
    expect(longer.carbons[0]!.required!.doseMgPerL!).toBeCloseTo(row.doseHighMgPerL!, 9);
  });

  it('the equilibrium dose is the one of the run without contact conditions (same design layer)', () => {
    const plain = runPipeline(withoutContact(input), { now: NOW });
    expect(cr.contact!.equilibriumDoseMgPerL).toBe(plain.carbons[0]!.required!.doseMgPerL);
  });

  it('cost, yearly carbon and curves follow the dose under contact (cost ∝ dose, carbonCost.ts)', () => {
    const plain = runPipeline(withoutContact(input), { now: NOW }).carbons[0]!;
    const ratio = cr.contact!.doseRatio!;
    expect(cr.costPerM3! / plain.costPerM3!).toBeCloseTo(ratio, 9);
    expect(cr.yearly!.carbonKg / plain.yearly!.carbonKg).toBeCloseTo(ratio, 9);
    // the removal curves come from the contact model: at every swept dose each compound's removal
    // is below its equilibrium removal (contact removes less than equilibrium at the same dose)
    const eqModel = carbonModel(cr.systems, input.project.site.docMgPerL);
    const curve = cr.curves!;
    eqModel.compoundIds.forEach((id, i) => {
      curve.dosesMgPerL.forEach((d, j) => {
        const eqPercent = (1 - eqModel.remaining(i, d / 1000).remainingFraction) * 100;
        expect(curve.removalPercent[id]![j]!).toBeLessThan(eqPercent);
      });
    });
  });

  it('run.json and the --json summary carry the equilibrium dose, the ratio and the contact time and carbon age', () => {
    const rec = runRecord(r, { toolVersion: 'test', nodeVersion: 'test', platform: 'test' }) as { results: { carbons: Array<Record<string, unknown>> } };
    const c = rec.results.carbons[0]! as { contact: { equilibrium_dose_mg_per_L: number; dose_ratio_contact_to_equilibrium: number; contact: { contact_time_s: number; carbon_age_s: number } } };
    expect(c.contact.equilibrium_dose_mg_per_L).toBe(cr.contact!.equilibriumDoseMgPerL);
    expect(c.contact.dose_ratio_contact_to_equilibrium).toBe(cr.contact!.doseRatio);
    expect(c.contact.contact).toMatchObject({ contact_time_s: 1800, carbon_age_s: 1800 });
    const s = contactSummary(cr);
    expect(s).toMatchObject({ equilibrium_dose_mg_per_L: cr.contact!.equilibriumDoseMgPerL, contact: { contact_time_s: 1800, carbon_age_s: 1800 } });
  });

  it('the contact curves: removal rises with contact time and with carbon age; contact below equilibrium at every dose', () => {
    const k = cr.contact!.curves!;
    expect(k.compoundId).toBe(cr.required!.governing!.compoundId);
    expect(k.requiredDoseMgPerL).toBe(cr.required!.doseMgPerL);
    const rising = (xs: number[]) => xs.every((x, i) => i === 0 || x >= xs[i - 1]! - 1e-6);
    expect(rising(k.time.removalPercent)).toBe(true); // removal rises with contact time
    expect(rising(k.carbonAge.removalPercent)).toBe(true); // and with carbon age
    expect(k.carbonAge.carbonAgesS[0]).toBe(1800); // from θ = τ (no recirculation)
    // at the plant's 30 min the batch curve gives the goal (80 %) at the required dose, within the solver's tolerance (rtol 1e-4)
    const at30 = k.time.removalPercent[k.time.timesS.indexOf(1800)]!;
    expect(at30).toBeGreaterThanOrEqual(80 - 0.05);
    k.dose.dosesMgPerL.forEach((_, i) => expect(k.dose.contactPercent[i]!).toBeLessThan(k.dose.equilibriumPercent[i]!));
  });

  it('the report has the contact section: dose table and the three figures', () => {
    const m = buildReportModel(r, 'test');
    const sec = m.sections.find((x) => x.id === 'contact-conditions')!;
    expect(sec).toBeDefined();
    expect(sec.tables![0]!.rows).toHaveLength(1);
    expect(sec.plots!.map((p) => p.id)).toEqual(['contact-time-1', 'contact-dose-1', 'carbon-age-1']);
    for (const p of sec.plots!) {
      if (p.kind !== 'xy') throw new Error('expected xy plots');
      expect(p.series.every((s) => s.points.length > 1 && s.points.every(([x, y]) => Number.isFinite(x) && Number.isFinite(y)))).toBe(true);
    }
    // the plant's own values are marked: contact time (min), required dose (mg/L), carbon age (h; a stirred tank)
    const cr = r.carbons.find((c) => c.contact)!;
    const lines = sec.plots!.map((p) => (p.kind === 'xy' ? p.vLines ?? [] : []));
    expect(lines[0]).toEqual([{ x: cr.contact!.contactTimeS / 60, label: 'plant contact time' }]);
    expect(lines[1]).toEqual([{ x: cr.contact!.curves!.requiredDoseMgPerL, label: 'required dose' }]);
    expect(cr.contact!.reactor).toBe('plug-flow');
    expect(lines[2]).toEqual([]); // no carbon age of the plant's own to mark (its stirred-tank case below)
    const plain = buildReportModel(runPipeline(withoutContact(input), { now: NOW }), 'test');
    expect(plain.sections.some((x) => x.id === 'contact-conditions')).toBe(false);
    // the decision figures say which model gave the doses, and what the sensitivity left out
    const decisions = (model: typeof m) => {
      const d = model.sections.find((x) => x.id === 'decisions')!;
      const fig = d.plots!.find((p) => p.id === 'dose-against-doc-1')!;
      return { text: d.paragraphs!.join('\n'), legend: fig.kind === 'xy' ? fig.series[0]!.name : '' };
    };
    const contact = decisions(m);
    expect(contact.legend).toBe("required dose (contact model at the plant's contact conditions, background scaled with DOC)");
    expect(contact.text).toContain("and the carbon price; under the plant's PAC contact conditions also the contact time. Not modelled in this run: carbon age (plug-flow contact).");
    // the carbon's own section gives its dose as a dose under contact, beside the equilibrium dose
    const carbonText = m.sections.find((x) => x.id === 'carbon-1')!.paragraphs!.join('\n');
    expect(carbonText).toContain(`under the plant's PAC contact conditions (plug-flow contact of 30.0 min; ${cr.contact!.equilibriumDoseMgPerL!.toPrecision(3)} mg/L at equilibrium: see the section on PAC contact conditions)`);
    expect(carbonText).toContain("the mean loading a compound reaches on the carbon in the site water under the plant's contact conditions");
    expect(plain.sections.find((x) => x.id === 'carbon-1')!.paragraphs!.join('\n')).toContain('(batch IAST beside the background)');
    const card = m.keyFigures.find((x) => x.label === `${cr.carbon.name}: dose`)!;
    expect(card.note).toContain(`required at DOC 7.00 mg/L under the plant's PAC contact conditions (${cr.contact!.equilibriumDoseMgPerL!.toPrecision(3)} mg/L at equilibrium), governed by`);
    const equilibrium = decisions(plain);
    expect(equilibrium.legend).toBe('required dose (IAST, background scaled with DOC)');
    expect(equilibrium.text).toContain('and the carbon price. Not modelled in this equilibrium run: contact time and carbon age.');
  });

  it('"equilibrium" contact leaves the run unchanged: no contact figures, same doses, same run.json', () => {
    const a = runPipeline(withoutContact(input), { now: NOW });
    expect(a.carbons[0]!.contact).toBeUndefined();
    expect(contactSummary(a.carbons[0]!)).toEqual({});
    const rec = runRecord(a, { toolVersion: 'test', nodeVersion: 'test', platform: 'test' }) as { results: { carbons: Array<Record<string, unknown>> } };
    expect('contact' in rec.results.carbons[0]!).toBe(false);
  });
});

describe('run in a stirred contact tank: what recirculation buys', () => {
  it('carbon age 3 d needs less carbon than θ = τ (no recirculation); both at least the equilibrium dose', () => {
    const input = loadProject(FIXTURE);
    const dose = (carbonAgeS: number) => {
      const project = { ...input.project, site: { ...input.project.site, pacContact: { kind: 'stirred' as const, contactTimeS: 1800, carbonAgeS } } };
      const res = runPipeline({ ...input, project }, { ...FAST, now: NOW });
      const c = res.carbons[0]!;
      expect(c.contact!.carbonAgeS).toBe(carbonAgeS);
      return { req: c.required!.doseMgPerL!, eq: c.contact!.equilibriumDoseMgPerL!, res };
    };
    const noRecirculation = dose(1800);
    const threeDays = dose(3 * 86400);
    // the report's carbon-age figure marks the plant's carbon age (72 h)
    const agePlot = buildReportModel(threeDays.res, 'test').sections.find((x) => x.id === 'contact-conditions')!.plots!.find((p) => p.id === 'carbon-age-1')!;
    expect(agePlot.kind === 'xy' ? agePlot.vLines : undefined).toEqual([{ x: 72, label: 'plant carbon age' }]);
    // a stirred tank: contact time and carbon age are both cases, nothing is listed as not modelled
    const sensitivityText = buildReportModel(threeDays.res, 'test').sections.find((x) => x.id === 'decisions')!.paragraphs!.find((x) => x.startsWith('Sensitivity:'))!;
    expect(sensitivityText).toMatch(/also the contact time and the carbon age \(never below the contact time\)\.$/);
    expect(sensitivityText).not.toContain('Not modelled');
    // removal rises with carbon age at every dose, so the dose for the goal falls
    expect(threeDays.req).toBeLessThan(noRecirculation.req);
    // contact never removes more than equilibrium (the stirred reactor tends to it as θ grows)
    expect(threeDays.req).toBeGreaterThanOrEqual(threeDays.eq);
    expect(noRecirculation.req).toBeGreaterThanOrEqual(noRecirculation.eq);
  }, 600_000);
});
