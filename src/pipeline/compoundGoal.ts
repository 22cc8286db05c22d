/**
 * The goal of one compound: its effluent limit when it has one, otherwise the project's removal
 * goal (default 80 %, CHECKS.md "Regulation and practice"). A limit becomes the removal fraction
 * R = 1 − limit/c0; a limit at or above c0 needs no carbon.
 */
import type { CompoundSpec, GoalsSpec } from '../project/projectTypes.js';

export interface CompoundGoal {
  kind: 'removal' | 'limit';
  /** Removal fraction to reach (0–1); ≤ 0 when a limit is already met without carbon. */
  removalFraction: number;
  /** Effluent limit, mg/L (limit goals only). */
  limitMgPerL?: number;
  /** "80 % removal" or "limit 500 ng/L". */
  text: string;
}

export function compoundGoal(compound: CompoundSpec, goals: GoalsSpec, fmtConc: (mgPerL: number) => string): CompoundGoal {
  if (compound.limitMgPerL !== undefined) {
    return { kind: 'limit', removalFraction: 1 - compound.limitMgPerL / compound.c0MgPerL, limitMgPerL: compound.limitMgPerL, text: `effluent limit ${fmtConc(compound.limitMgPerL)}` };
  }
  return { kind: 'removal', removalFraction: goals.removalPercent / 100, text: `${goals.removalPercent} % removal` };
}
