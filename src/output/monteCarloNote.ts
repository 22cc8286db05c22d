/**
 * Why the Monte Carlo median of the governing dose exceeds its point estimate, in words, from the
 * percentiles of one carbon. Each draw's governing dose is the largest of that draw's compound
 * doses; the maximum is a convex function, so its expected value is at least the maximum of the
 * expected values (Jensen's inequality), and with several compounds of similar dose the largest
 * of them is pushed upwards even when every single compound's median sits at its point estimate.
 */
import { fmtNumber as fn } from './formatting.js';
import type { CarbonResult } from '../pipeline/pipelineTypes.js';

/** One sentence per carbon with a Monte Carlo; empty when the median does not exceed the point estimate. */
export function monteCarloNote(cr: CarbonResult): string[] {
  const q = cr.uncertainty?.result.quantities;
  const gov = q?.find((x) => x.key === 'governing_dose');
  if (!q || !gov || !Number.isFinite(gov.p50) || !(gov.pointEstimate > 0) || gov.p50 <= gov.pointEstimate) return [];
  const doses = q.filter((x) => x.key.startsWith('dose:') && Number.isFinite(x.pointEstimate) && x.pointEstimate > 0);
  const near = doses.filter((x) => x.pointEstimate >= 0.7 * gov.pointEstimate);
  const own = doses.reduce<typeof doses[number] | undefined>((a, b) => (!a || b.pointEstimate > a.pointEstimate ? b : a), undefined);
  const up = (100 * (gov.p50 - gov.pointEstimate)) / gov.pointEstimate;
  const ownText = own && Number.isFinite(own.p50) ? ` The governing compound alone (${own.key.slice(5)}) has a median of ${fn(own.p50, 3)} mg/L against its point estimate of ${fn(own.pointEstimate, 3)} mg/L.` : '';
  return [
    `${cr.carbon.name}: the median governing dose (${fn(gov.p50, 3)} mg/L) is ${fn(up, 2)} % above the point estimate (${fn(gov.pointEstimate, 3)} mg/L). In each draw the governing dose is the largest of the compound doses, and ${near.length > 1 ? `${near.length} compounds need within 30 % of the governing dose` : 'the compound doses vary together'}; the largest of several uncertain doses lies above the largest of their central values (the maximum is convex: Jensen's inequality), so the median of the governing dose exceeds the point estimate.${ownText}`,
  ];
}
