/**
 * Removal against dose for every compound on one carbon: batch IAST at log-spaced doses, each
 * solve warm-started from the previous dose.
 */
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { logSpacedDoses } from '../api/equilibriumApi.js';
import { prepareSystem, type CompoundSystem } from './competitionSystem.js';

export interface RemovalCurves {
  carbonName: string;
  dosesMgPerL: number[];
  /** Removal in percent by compound id, one value per dose. */
  removalPercent: Record<string, number[]>;
}

export function removalCurves(carbonName: string, systems: readonly CompoundSystem[], docMgPerL: number, sweep: { fromMgPerL: number; toMgPerL: number; points: number }): RemovalCurves {
  const doses = logSpacedDoses(sweep.fromMgPerL, sweep.toMgPerL, sweep.points);
  const removalPercent: Record<string, number[]> = {};
  for (const sys of systems) {
    const pm = prepareSystem(sys, docMgPerL);
    let warm: { u: number; theta: number } | undefined;
    removalPercent[sys.compoundId] = doses.map((d) => {
      const s = solveBatchPrepared(pm, d / 1000, warm);
      warm = s.state;
      return 100 * (1 - s.cMgPerL[0]! / sys.c0MgPerL);
    });
  }
  return { carbonName, dosesMgPerL: doses, removalPercent };
}
