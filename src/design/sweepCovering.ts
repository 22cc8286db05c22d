/**
 * The removal-curve sweep widened so that it covers the required dose with margin: the last
 * dose is at least twice the required dose (so the governing curve reaches its goal well inside
 * the figure). Presentation range only (common practice for a readable figure); the doses
 * themselves are solved exactly elsewhere.
 */
export interface DoseSweep {
  fromMgPerL: number;
  toMgPerL: number;
  points: number;
}

/** Factor between the last swept dose and the required dose (common practice, for the figure). */
export const SWEEP_MARGIN = 2;

export function sweepCovering(sweep: DoseSweep, requiredDoseMgPerL: number | null): DoseSweep {
  if (requiredDoseMgPerL === null || !(requiredDoseMgPerL * SWEEP_MARGIN > sweep.toMgPerL)) return { ...sweep };
  const to = requiredDoseMgPerL * SWEEP_MARGIN;
  // keep the density of the sweep (points per decade) when it grows
  const perDecade = (sweep.points - 1) / Math.log10(sweep.toMgPerL / sweep.fromMgPerL);
  return { fromMgPerL: sweep.fromMgPerL, toMgPerL: to, points: Math.max(sweep.points, Math.ceil(perDecade * Math.log10(to / sweep.fromMgPerL)) + 1) };
}
