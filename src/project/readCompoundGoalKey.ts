/**
 * The optional "goal" key of a project compound (capability 21): `"goal": "none"` marks a
 * report-only compound, modelled and reported beside the others but never governing the dose
 * (src/design/compoundGoal.ts). Without the key the compound has the project's removal goal or
 * its effluent limit.
 * @throws InputError naming the JSON path: any other value, or a limit given as well
 */
import { InputError } from '../core/errors.js';
import { describeValue } from '../scenario/jsonChecks.js';

/** True for a report-only compound. @param path JSON path of the compound, e.g. `compounds[3]` */
export function readReportOnly(compound: Record<string, unknown>, path: string): boolean {
  const v = compound.goal;
  if (v === undefined) return false;
  if (v !== 'none') throw new InputError(`expected "none" (a report-only compound that never governs the dose), got ${describeValue(v)}; leave the key out for the project's removal goal, or give "limit" for an effluent limit`, { path: `${path}.goal` });
  if (compound.limit !== undefined) throw new InputError('a report-only compound ("goal": "none") cannot also have an effluent limit; remove one of the two', { path: `${path}.limit` });
  return true;
}
