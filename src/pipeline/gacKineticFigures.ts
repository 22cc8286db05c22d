/**
 * The figures a GAC carbon with a kinetic run length shares with PAC carbons in the result:
 * cost per m³ and the yearly carbon mass and cost at the design flow (from the carbon use at the
 * run length of the staggered filters, src/kinetics/staggeredFiltersCarbon.ts), and the warnings
 * the run needs (no run meets the goals; the run outlasts the simulated curves).
 * Mutates `res` (the carbon result being assembled by runPipeline); returns the warnings.
 */
import { yearlyLabel } from '../design/annualised.js';
import type { GacKineticResult } from './gacKineticStep.js';
import type { CarbonResult } from './pipelineTypes.js';

export function gacKineticFigures(res: CarbonResult, kin: GacKineticResult): string[] {
  const warnings: string[] = [];
  const use = kin.use;
  if (!use) {
    warnings.push(`GAC breakthrough: no run of the ${kin.filters} staggered filter(s) meets every goal (governed by ${kin.run.governedBy}); no carbon use or cost`);
    return warnings;
  }
  if (use.costPerM3 !== undefined) res.costPerM3 = use.costPerM3;
  if (use.yearlyCarbonKg !== undefined && use.yearlyCost !== undefined) {
    res.yearly = { carbonKg: use.yearlyCarbonKg, cost: use.yearlyCost, basis: yearlyLabel('GAC run length at the design DOC and flow', 1), annualised: true };
    res.carbonKgPerDAtDesign = use.yearlyCarbonKg / 365;
  }
  if (kin.run.atCurveEnd) warnings.push(`GAC breakthrough: every goal still holds at the end of the simulated ${Math.round(kin.toBedVolumes)} bed volumes; the run length is at least that (carbon use and cost are upper bounds)`);
  if (kin.simulation.warnings.length) warnings.push(...kin.simulation.warnings.map((w) => `GAC breakthrough: ${w}`));
  return warnings;
}
