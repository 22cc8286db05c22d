/**
 * Carbon demand over the site's DOC series on one carbon. For each day the background is scaled
 * to that day's DOC (fictive fractions and EBC concentrations proportional to DOC; support:
 * Zietzschmann et al. 2016, Water Research 102:190, CHECKS.md) and the required dose is solved
 * anew; then
 *   carbon mass, kg/d = dose (mg/L = g/m³) × flow (m³/d) / 1000,
 *   carbon cost per day = mass × price per kg,
 * with totals as plain sums over the days, and median and 90th percentile (Hyndman & Fan 1996,
 * definition 7) of the daily dose and mass. Days with the same DOC share one solve.
 */
import type { SiteSeries } from '../siteSeries/siteSeries.js';
import { summarise, type SeriesSummary } from '../siteSeries/seriesStats.js';
import type { DayDose } from './dayDose.js';

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
  dose: SeriesSummary | null;
  carbonKgPerD: SeriesSummary | null;
  /** How many different DOC values were solved. */
  distinctDoc: number;
}

/**
 * @param required  the required dose at one DOC (called once per distinct DOC value; `near` is
 *                  the previous day's answer, for starting guesses)
 * @param onDay     progress callback (days done, total)
 */
export function dailyDoses(
  carbon: { name: string; currency: string; pricePerKg: number },
  series: SiteSeries,
  required: (docMgPerL: number, near?: DayDose) => DayDose,
  onDay?: (done: number, total: number) => void,
): DailyDoses {
  const cache = new Map<number, DayDose>();
  let previous: DayDose | undefined;
  const rows: DailyRow[] = series.dates.map((date, k) => {
    const doc = series.docMgPerL[k]!;
    const flow = series.flowM3PerD[k]!;
    let r = cache.get(doc);
    if (!r) { r = required(doc, previous); cache.set(doc, r); }
    previous = r;
    onDay?.(k + 1, series.dates.length);
    const dose = r.doseMgPerL;
    const kg = dose === null ? null : (dose * flow) / 1000; // g/m³ × m³/d / 1000 = kg/d
    return { date, docMgPerL: doc, flowM3PerD: flow, doseMgPerL: dose, governedBy: r.governedBy, carbonKgPerD: kg, cost: kg === null ? null : kg * carbon.pricePerKg };
  });
  const dosed = rows.filter((r) => r.doseMgPerL !== null);
  const totalKg = dosed.reduce((s, r) => s + r.carbonKgPerD!, 0);
  const totalCost = dosed.reduce((s, r) => s + r.cost!, 0);
  const scale = rows.length > 0 ? 365 / rows.length : 0;
  const fullYear = rows.length === 365 || rows.length === 366;
  return {
    carbonName: carbon.name,
    currency: carbon.currency,
    pricePerKg: carbon.pricePerKg,
    rows,
    daysWithDose: dosed.length,
    totalCarbonKg: totalKg,
    totalCost,
    yearlyCarbonKg: fullYear ? totalKg : totalKg * scale,
    yearlyCost: fullYear ? totalCost : totalCost * scale,
    dose: dosed.length ? summarise(dosed.map((r) => r.doseMgPerL!)) : null,
    carbonKgPerD: dosed.length ? summarise(dosed.map((r) => r.carbonKgPerD!)) : null,
    distinctDoc: cache.size,
  };
}
