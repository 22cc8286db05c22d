/**
 * The goal of one compound: its effluent limit when it has one, otherwise the project's removal
 * goal (default 80 %, common practice; docs/references.md). A limit becomes the removal fraction
 * R = 1 − limit/c0; a limit at or above c0 needs no carbon. A report-only compound (project
 * `"goal": "none"`) has kind 'none': it is modelled and reported but never governs the dose
 * (compoundDose gives it the status 'report only').
 */
export interface CompoundGoal {
  kind: 'removal' | 'limit' | 'none';
  /** Removal fraction to reach (0–1); ≤ 0 when a limit is already met without carbon; 0 for kind 'none' (not used). */
  removalFraction: number;
  /** Effluent limit, mg/L (limit goals only). */
  limitMgPerL?: number;
  /** "80 % removal" or "limit 500 ng/L". */
  text: string;
}

/**
 * @param compound     feed concentration and optional limit, mg/L
 * @param removalPercent the project's removal goal, percent
 * @param fmtConc      formats a concentration in mg/L for the goal's text
 */
export function compoundGoal(compound: { c0MgPerL: number; limitMgPerL?: number | undefined; reportOnly?: boolean | undefined }, removalPercent: number, fmtConc: (mgPerL: number) => string): CompoundGoal {
  if (compound.reportOnly) return REPORT_ONLY_GOAL;
  if (compound.limitMgPerL !== undefined) {
    return { kind: 'limit', removalFraction: 1 - compound.limitMgPerL / compound.c0MgPerL, limitMgPerL: compound.limitMgPerL, text: `effluent limit ${fmtConc(compound.limitMgPerL)}` };
  }
  return { kind: 'removal', removalFraction: removalPercent / 100, text: `${removalPercent} % removal` };
}

/** The goal of a report-only compound: none (modelled and reported, never governing). */
export const REPORT_ONLY_GOAL: CompoundGoal = Object.freeze({ kind: 'none', removalFraction: 0, text: 'report only (no goal)' });
