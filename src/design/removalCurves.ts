/**
 * Removal against dose for every compound of a removal model, at log-spaced doses, each solve
 * warm-started from the previous dose. Units: doses mg/L, removal percent.
 */
import { logSpaced } from '../numerics/logSpace.js';
import type { RemovalModel, WarmStart } from './removalModel.js';

export interface RemovalCurves {
  carbonName: string;
  dosesMgPerL: number[];
  /** Removal in percent by compound id, one value per dose. */
  removalPercent: Record<string, number[]>;
}

/** @throws InputError for an invalid sweep; ComputationError if a solve fails */
export function removalCurves(carbonName: string, model: RemovalModel, sweep: { fromMgPerL: number; toMgPerL: number; points: number }): RemovalCurves {
  const doses = logSpaced(sweep.fromMgPerL, sweep.toMgPerL, sweep.points, 'sweep');
  const removalPercent: Record<string, number[]> = {};
  model.compoundIds.forEach((id, i) => {
    let warm: WarmStart;
    removalPercent[id] = doses.map((d) => {
      const r = model.remaining(i, d / 1000, warm);
      warm = r.warm;
      return 100 * (1 - r.remainingFraction);
    });
  });
  return { carbonName, dosesMgPerL: doses, removalPercent };
}
