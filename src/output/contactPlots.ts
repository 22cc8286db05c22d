/**
 * The report's section on PAC contact conditions: per PAC carbon the required dose under the
 * plant's contact conditions beside the equilibrium dose and their ratio, and three figures for
 * the governing compound: removal against contact time at the required dose, removal against
 * dose at equilibrium and at the plant's conditions, and removal against carbon age (what
 * recirculation of the settled carbon buys). Presentation only: every value comes from the
 * pipeline (contactStep.ts, contactCurvesStep.ts). Absent with equilibrium contact.
 */
import type { CarbonResult, PipelineResult } from '../pipeline/pipelineTypes.js';
import type { ContactCurves } from '../pipeline/contactCurvesStep.js';
import type { ReportSection, XYPlotSpec } from './reportModel.js';
import { fmtNumber as fn } from './formatting.js';

const MIN = 60;
const DAY = 86400;

/** The plant's contact conditions in words, e.g. "stirred contact tank, residence 30 min, mean carbon age 3 d". */
export function describeConditions(c: NonNullable<CarbonResult['contact']>): string {
  return c.reactor === 'plug-flow'
    ? `plug-flow contact of ${fn(c.contactTimeS / MIN, 3)} min`
    : `stirred contact tank, residence ${fn(c.contactTimeS / MIN, 3)} min, mean carbon age ${fn(c.carbonAgeS / DAY, 3)} d`;
}

/** Removal against time in contact at the required dose (batch). */
export function contactTimePlot(carbon: string, k: ContactCurves, index: number): XYPlotSpec {
  return {
    kind: 'xy', id: `contact-time-${index + 1}`,
    title: `${carbon}: removal of ${k.compoundId} against time in contact at the required dose ${fn(k.requiredDoseMgPerL, 3)} mg/L (every particle in contact for the time shown: jar test or plug-flow tank)`,
    xLabel: 'time in contact (min)', yLabel: `removal of ${k.compoundId} (%)`, xLog: true, yRange: [0, 100],
    series: [{ name: k.compoundId, key: k.compoundId, points: k.time.timesS.map((t, i) => [t / MIN, k.time.removalPercent[i]!]), emphasis: true }],
    vLines: [{ x: k.contactTimeS / MIN, label: 'plant contact time' }],
  };
}

/** Removal against dose at equilibrium and under the plant's contact conditions. */
export function contactDosePlot(carbon: string, k: ContactCurves, conditions: string, index: number): XYPlotSpec {
  const pts = (ys: number[]) => k.dose.dosesMgPerL.map((d, i) => [d, ys[i]!] as [number, number]);
  return {
    kind: 'xy', id: `contact-dose-${index + 1}`,
    title: `${carbon}: removal of ${k.compoundId} against dose at equilibrium and under the plant's conditions (${conditions})`,
    xLabel: 'PAC dose (mg/L)', yLabel: `removal of ${k.compoundId} (%)`, xLog: true, yRange: [0, 100],
    series: [
      { name: 'equilibrium (batch IAST)', points: pts(k.dose.equilibriumPercent), style: 'dashed', key: 'equilibrium' },
      { name: 'plant contact conditions', points: pts(k.dose.contactPercent), key: k.compoundId, emphasis: true },
    ],
    vLines: [{ x: k.requiredDoseMgPerL, label: 'required dose' }],
  };
}

/**
 * Removal against mean carbon age at the required dose (stirred tank of the plant's residence
 * time), with the plant's own carbon age marked when its tank is stirred (`plantCarbonAgeS`).
 */
export function carbonAgePlot(carbon: string, k: ContactCurves, index: number, plantCarbonAgeS?: number): XYPlotSpec {
  return {
    kind: 'xy', id: `carbon-age-${index + 1}`,
    title: `${carbon}: removal of ${k.compoundId} against mean carbon age at ${fn(k.requiredDoseMgPerL, 3)} mg/L in a stirred tank of residence ${fn(k.contactTimeS / MIN, 3)} min (carbon age = residence time without recirculation)`,
    xLabel: 'mean carbon age (h)', yLabel: `removal of ${k.compoundId} (%)`, xLog: true, yRange: [0, 100],
    series: [{ name: k.compoundId, key: k.compoundId, points: k.carbonAge.carbonAgesS.map((a, i) => [a / 3600, k.carbonAge.removalPercent[i]!]), emphasis: true }],
    ...(plantCarbonAgeS !== undefined ? { vLines: [{ x: plantCarbonAgeS / 3600, label: 'plant carbon age' }] } : {}),
  };
}

export function contactSection(r: PipelineResult): ReportSection | undefined {
  const withContact = r.carbons.filter((c) => c.contact);
  if (withContact.length === 0) return undefined;
  const plots: XYPlotSpec[] = [];
  withContact.forEach((cr, i) => {
    const k = cr.contact!.curves;
    if (!k) return;
    plots.push(contactTimePlot(cr.carbon.name, k, i), contactDosePlot(cr.carbon.name, k, describeConditions(cr.contact!), i), carbonAgePlot(cr.carbon.name, k, i, cr.contact!.reactor === 'stirred' ? cr.contact!.carbonAgeS : undefined));
  });
  const c0 = withContact[0]!.contact!;
  return {
    id: 'contact-conditions',
    heading: 'PAC contact conditions',
    paragraphs: [
      `Doses are for the plant's contact conditions (${describeConditions(c0)}): the homogeneous surface diffusion model with IAST at the particle surface (Crittenden & Weber 1978; Radke & Prausnitz 1972), film coefficient from Sh = 2 (common practice for fine suspended particles). The equilibrium dose (batch IAST) is shown beside it: contact leaves less removal at a dose, so the dose under contact is the higher one.`,
      'Particle size, density and diffusivities decide these doses; confirm them with kinetic jar tests and pilot tests at the plant\'s contact time.',
    ],
    tables: [{
      caption: 'Required dose under the contact conditions and at equilibrium',
      columns: ['carbon', 'contact conditions', 'required dose (mg/L)', 'equilibrium dose (mg/L)', 'ratio'],
      rows: withContact.map((cr) => [
        cr.carbon.name, describeConditions(cr.contact!),
        cr.required?.doseMgPerL == null ? '—' : fn(cr.required.doseMgPerL, 3),
        cr.contact!.equilibriumDoseMgPerL === null ? '—' : fn(cr.contact!.equilibriumDoseMgPerL, 3),
        cr.contact!.doseRatio === null ? '—' : fn(cr.contact!.doseRatio, 3),
      ]),
    }],
    plots,
  };
}
