/**
 * The headline figure of a GAC carbon: with fixed-bed inputs the kinetic run length of the
 * staggered filters (what governs it, the carbon use) with the equilibrium bed volumes beside it
 * for reference; without them the equilibrium estimate alone (GAC_UPPER_BOUND_CAUTION says what
 * it is). Presentation only: the numbers come from gacStep and gacKineticStep.
 */
import type { CarbonResult } from '../pipeline/pipelineTypes.js';
import type { KeyFigure } from './reportModel.js';
import { fmtNumber as fn, fmtWhole } from './formatting.js';

export function gacHeadline(cr: CarbonResult): KeyFigure | undefined {
  const g = cr.gac?.governing;
  if (!g) return undefined;
  const eq = `equilibrium estimate ${fmtWhole(g.bedVolumes)} bed volumes${g.lifeDays !== undefined ? ` (${fn(g.lifeDays, 3)} d)` : ''} for ${g.id}, a reference, not a bound`;
  const k = cr.gacKinetic;
  if (!k) return { label: `${cr.carbon.name}: bed life`, value: g.lifeDays !== undefined ? `${fn(g.lifeDays, 3)} d` : `${fmtWhole(g.bedVolumes)} BV`, note: `${eq}; preloading by DOC and kinetics usually shorten real runs (no fixed-bed inputs given)` };
  const bv = k.run.runBedVolumes;
  const days = k.use?.filterLifeDays;
  const value = bv === null ? 'no run meets the goals' : `${k.run.atCurveEnd ? '≥ ' : ''}${days !== undefined ? `${fn(days, 3)} d` : `${fmtWhole(bv)} BV`}`;
  const use = k.use ? `; carbon use ${fn(k.use.carbonUsageGPerM3, 3)} g/m³` : '';
  return { label: `${cr.carbon.name}: run length`, value, note: `${bv === null ? '' : `${fmtWhole(bv)} bed volumes per filter, `}${k.filters} staggered filter(s), governed by ${k.run.governedBy} (fixed-bed model with DOC preloading)${use}; ${eq}${band(cr)}` };
}

/** "; P10–P90 … bed volumes (N draws)" of the GAC Monte Carlo, or nothing. */
function band(cr: CarbonResult): string {
  const q = cr.gacUncertainty?.quantities.find((x) => x.key === 'run_bed_volumes');
  return q ? `; P10–P90 ${fmtWhole(q.p10)}–${fmtWhole(q.p90)} bed volumes (${cr.gacUncertainty!.draws} draws, Monte Carlo)` : '';
}
