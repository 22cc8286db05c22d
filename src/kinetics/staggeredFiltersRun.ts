/**
 * The run length of a GAC stage of N staggered filters from the breakthrough curves of one
 * filter: the shortest of the run lengths that keep the blended effluent within each compound's
 * goal (removal or limit) and, when an indicator set is given, the indicator-mean rule
 * (SR 814.201.231 Art. 3; src/kinetics/staggeredFilters.ts). The governing goal is named.
 *
 * Units: bed volumes of one filter; c/c0 and removals as fractions, the indicator goal in percent.
 * @throws InputError when no goal is given, a goal's compound has no curve, or the indicator set
 *   is not admissible
 */
import { InputError } from '../core/errors.js';
import type { IndicatorCategory } from '../indicators/indicatorRule.js';
import type { BreakthroughCurve } from './breakthroughCurve.js';
import { runLengthForCompound, runLengthForIndicators, type RunLength } from './staggeredFilters.js';

export interface StaggeredRunInput {
  /** The single filter's outlet curve of each compound, by id. */
  curves: Readonly<Record<string, BreakthroughCurve>>;
  /** Allowed blended c/c0 per compound id (1 − removal goal, or limit/c0). */
  goals: Readonly<Record<string, number>>;
  /** Indicator rule: the substances (ids with categories) and the goal for their mean removal, percent. */
  indicator?: { substances: ReadonlyArray<{ id: string; category: IndicatorCategory }>; goalPercent: number };
  filters: number;
}

export interface StaggeredRun {
  /** Longest run meeting every goal, BV of one filter (null when some goal fails from the start). */
  runBedVolumes: number | null;
  /** True when every goal still holds at the end of the simulated curves (the run is at least that long). */
  atCurveEnd: boolean;
  /** Compound id, or "indicator mean", that limits the run. */
  governedBy: string;
  compounds: Array<{ id: string; maxCOverC0: number } & RunLength>;
  indicator?: RunLength;
}

/** Run length of N staggered filters against every goal; see the file comment. */
export function staggeredRun(input: StaggeredRunInput): StaggeredRun {
  const ids = Object.keys(input.goals);
  if (ids.length === 0 && !input.indicator) throw new InputError('expected at least one compound goal or the indicator rule', { path: 'goals' });
  const curveOf = (id: string, path: string) => {
    const c = input.curves[id];
    if (!c) throw new InputError(`no breakthrough curve for "${id}"`, { path });
    return c;
  };
  const compounds = ids.map((id) => ({ id, maxCOverC0: input.goals[id]!, ...runLengthForCompound(curveOf(id, `goals.${id}`), input.filters, input.goals[id]!) }));
  const limits: Array<{ by: string; r: RunLength }> = compounds.map((c) => ({ by: c.id, r: c }));
  let indicator: RunLength | undefined;
  if (input.indicator) {
    indicator = runLengthForIndicators(input.indicator.substances.map((s, i) => ({ id: s.id, category: s.category, curve: curveOf(s.id, `indicator.substances[${i}]`) })), input.filters, input.indicator.goalPercent);
    limits.push({ by: 'indicator mean', r: indicator });
  }
  const len = (r: RunLength) => (r.bedVolumes === null ? -1 : r.bedVolumes);
  let gov = limits[0]!;
  for (const l of limits) if (len(l.r) < len(gov.r)) gov = l;
  const out: StaggeredRun = { runBedVolumes: gov.r.bedVolumes, atCurveEnd: limits.every((l) => l.r.atCurveEnd), governedBy: gov.by, compounds };
  if (indicator) out.indicator = indicator;
  return out;
}
