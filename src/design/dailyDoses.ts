/**
 * Carbon demand over the site's DOC series on one carbon. The background is scaled to each day's
 * DOC (fictive fractions and EBC concentrations proportional to DOC; support: Zietzschmann et al.
 * 2016, Water Research 102:190); each day's required dose is read from the dose table
 * (doseTable.ts: exact designs at a few DOC nodes, linear in DOC between them, with a checked error
 * bound); then (carbonCost.ts)
 *   carbon mass, kg/d = dose (mg/L = g/m³) × flow (m³/d) / 1000,
 *   carbon cost per day = mass × price per kg,
 * with totals as sums over the days with a dose (the same segment sums the Monte Carlo uses, so
 * its point estimate is this figure), annualised (× 365/days, and said so) when the series is not
 * one whole year, and median and 90th percentile (Hyndman & Fan 1996, definition 7) of the daily
 * dose and mass. Each day's governing goal is that of the nearer node.
 */
import type { SiteSeries } from '../siteSeries/siteSeries.js';
import { summarise, type SeriesSummary } from '../siteSeries/seriesStats.js';
import { carbonCost, carbonKgPerD } from './carbonCost.js';
import { interpolateDose, segmentOf, seriesCarbon, seriesSegments, type DoseTable } from './doseTable.js';

export interface DailyRow {
  date: string;
  docMgPerL: number;
  flowM3PerD: number;
  /** Required dose, mg/L (null when no goal is reachable that day). */
  doseMgPerL: number | null;
  governedBy: string;
  /** Carbon mass, kg/d. */
  carbonKgPerD: number | null;
  /** Carbon cost that day, in the carbon's currency. */
  cost: number | null;
}

export interface DailyDoses {
  carbonName: string;
  currency: string;
  pricePerKg: number;
  rows: DailyRow[];
  /** Days with a dose. */
  daysWithDose: number;
  /** Σ kg over the days with a dose. */
  totalCarbonKg: number;
  totalCost: number;
  /** Totals for a year: the totals themselves for a 365- or 366-day series, else scaled to 365 days. */
  yearlyCarbonKg: number;
  yearlyCost: number;
  /** True when the yearly figures are scaled from a series that is not one whole year. */
  annualised: boolean;
  dose: SeriesSummary | null;
  carbonKgPerD: SeriesSummary | null;
  /** DOC nodes at which the design was solved exactly, and the checked interpolation error. */
  table: { docMgPerL: number[]; midpointErrorRel: number; toleranceRel: number };
}

/**
 * The yearly carbon and cost over the series alone (the segment sums of dailyDoses, without the
 * daily rows): for callers that need only the totals, such as the sensitivity of the yearly cost.
 */
export function seriesYearly(pricePerKg: number, series: SiteSeries, table: DoseTable): { daysWithDose: number; yearlyCarbonKg: number; yearlyCost: number } {
  const sums = seriesCarbon(seriesSegments(table.docMgPerL, series.docMgPerL, series.flowM3PerD), table.nodes.map((d) => d.doseMgPerL));
  return { daysWithDose: sums.daysWithDose, yearlyCarbonKg: sums.yearlyKg, yearlyCost: carbonCost(sums.yearlyKg, pricePerKg) };
}

/**
 * @param table the dose table of the carbon over the series' DOC range
 */
export function dailyDoses(carbon: { name: string; currency: string; pricePerKg: number }, series: SiteSeries, table: DoseTable): DailyDoses {
  const nodes = table.docMgPerL;
  const nodeDoses = table.nodes.map((d) => d.doseMgPerL);
  const rows: DailyRow[] = series.dates.map((date, k) => {
    const doc = series.docMgPerL[k]!;
    const flow = series.flowM3PerD[k]!;
    const dose = interpolateDose(nodes, nodeDoses, doc);
    const { k: seg, t } = segmentOf(nodes, doc);
    const near = table.nodes[nodes.length === 1 ? 0 : t <= 0.5 ? seg : seg + 1]!;
    const kg = dose === null ? null : carbonKgPerD(dose, flow);
    return { date, docMgPerL: doc, flowM3PerD: flow, doseMgPerL: dose, governedBy: dose === null ? 'nothing reachable' : near.governedBy, carbonKgPerD: kg, cost: kg === null ? null : carbonCost(kg, carbon.pricePerKg) };
  });
  const dosed = rows.filter((r) => r.doseMgPerL !== null);
  const sums = seriesCarbon(seriesSegments(nodes, series.docMgPerL, series.flowM3PerD), nodeDoses);
  return {
    carbonName: carbon.name,
    currency: carbon.currency,
    pricePerKg: carbon.pricePerKg,
    rows,
    daysWithDose: sums.daysWithDose,
    totalCarbonKg: sums.totalKg,
    totalCost: carbonCost(sums.totalKg, carbon.pricePerKg),
    yearlyCarbonKg: sums.yearlyKg,
    yearlyCost: carbonCost(sums.yearlyKg, carbon.pricePerKg),
    annualised: sums.annualised,
    dose: dosed.length ? summarise(dosed.map((r) => r.doseMgPerL!)) : null,
    carbonKgPerD: dosed.length ? summarise(dosed.map((r) => r.carbonKgPerD!)) : null,
    table: { docMgPerL: nodes.slice(), midpointErrorRel: table.midpointErrorRel, toleranceRel: table.toleranceRel },
  };
}
