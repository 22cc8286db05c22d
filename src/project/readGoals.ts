/**
 * The "goals" entry of a project file: removal goal (default 80 %), effluent limits by compound,
 * the indicator goal (SR 814.201.231), an optional design dose and the dose sweep.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { at, expectArray, expectNumber, expectObject, expectString, join, onlyKeys, required } from '../scenario/jsonChecks.js';
import { DEFAULT_REMOVAL_PERCENT, DEFAULT_SWEEP, type CompoundSpec, type GoalsSpec } from './projectTypes.js';
import { positive, readLimit } from './quantities.js';

export function readGoals(raw: unknown, compounds: CompoundSpec[]): GoalsSpec {
  const p = 'goals';
  const goals: GoalsSpec = { removalPercent: DEFAULT_REMOVAL_PERCENT, sweep: { ...DEFAULT_SWEEP } };
  if (raw === undefined) return goals;
  const o = expectObject(raw, p, 'the goals { removal_percent, limits, indicator }');
  onlyKeys(o, ['removal_percent', 'limits', 'indicator', 'design_dose', 'sweep', 'note'], p);
  if (o.removal_percent !== undefined) goals.removalPercent = expectNumber(o.removal_percent, `${p}.removal_percent`, 'a removal goal in percent between 0 and 100 (exclusive)', (x) => x > 0 && x < 100);
  if (o.limits !== undefined) {
    const lp = `${p}.limits`;
    const lim = expectObject(o.limits, lp, 'effluent limits by compound id, e.g. { "DCF": "50 ng/L" }');
    for (const [id, v] of Object.entries(lim)) {
      const comp = compounds.find((c) => c.id === id);
      if (!comp) throw new InputError(`"${id}" is not a compound id; expected one of ${compounds.map((c) => `"${c.id}"`).join(', ')}`, { path: join(lp, id) });
      if (comp.reportOnly) throw new InputError(`"${id}" is a report-only compound ("goal": "none"); it cannot have a limit`, { path: join(lp, id) });
      if (comp.limitMgPerL !== undefined) throw new InputError(`the limit of "${id}" is also given in its compound entry; give it once`, { path: join(lp, id) });
      comp.limitMgPerL = readLimit(v, join(lp, id));
    }
  }
  if (o.indicator !== undefined) {
    const ip = `${p}.indicator`;
    const ind = expectObject(o.indicator, ip, 'the indicator goal { mean_removal_percent, compounds }');
    onlyKeys(ind, ['mean_removal_percent', 'compounds', 'note'], ip);
    const mean = expectNumber(required(ind, 'mean_removal_percent', ip, 'the goal for the mean removal in percent, e.g. 80'), `${ip}.mean_removal_percent`, 'a mean-removal goal in percent between 0 and 100 (exclusive)', (x) => x > 0 && x < 100);
    goals.indicator = { meanRemovalPercent: mean };
    if (ind.compounds !== undefined) {
      const cp = `${ip}.compounds`;
      const ids = expectArray(ind.compounds, cp, 'the ids of the chosen indicator compounds', 1).map((v, k) => {
        const id = expectString(v, `${cp}[${k}]`, 'a compound id');
        const comp = compounds.find((c) => c.id === id);
        if (!comp) throw new InputError(`"${id}" is not a compound id; expected one of ${compounds.map((c) => `"${c.id}"`).join(', ')}`, { path: `${cp}[${k}]` });
        if (comp.indicatorCategory === undefined) throw new InputError(`compound "${id}" has no indicator_category; give it 1 or 2 in its compound entry`, { path: `${cp}[${k}]` });
        return id;
      });
      const dup = ids.find((id, k) => ids.indexOf(id) !== k);
      if (dup) throw new InputError(`"${dup}" is listed twice; each indicator counts once`, { path: cp });
      goals.indicator.compounds = ids;
    } else if (!compounds.some((c) => c.indicatorCategory !== undefined)) {
      throw new InputError('an indicator goal needs compounds with "indicator_category" 1 or 2; none has one', { path: ip });
    }
  }
  if (o.design_dose !== undefined) goals.designDoseMgPerL = positive(at(`${p}.design_dose`, () => parseQuantity(o.design_dose, 'massConcentration')), `${p}.design_dose`, 'a positive carbon dose such as "15 mg/L"');
  if (o.sweep !== undefined) {
    const sp = `${p}.sweep`;
    const s = expectObject(o.sweep, sp, 'a dose sweep { from, to, points }');
    onlyKeys(s, ['from', 'to', 'points'], sp);
    if (s.from !== undefined) goals.sweep.fromMgPerL = positive(at(`${sp}.from`, () => parseQuantity(s.from, 'massConcentration')), `${sp}.from`, 'a positive dose such as "0.5 mg/L"');
    if (s.to !== undefined) goals.sweep.toMgPerL = positive(at(`${sp}.to`, () => parseQuantity(s.to, 'massConcentration')), `${sp}.to`, 'a positive dose such as "100 mg/L"');
    if (s.points !== undefined) goals.sweep.points = expectNumber(s.points, `${sp}.points`, 'a whole number of doses from 2 to 1000', (x) => Number.isInteger(x) && x >= 2 && x <= 1000);
    if (!(goals.sweep.toMgPerL > goals.sweep.fromMgPerL)) throw new InputError(`expected "to" above "from" (${goals.sweep.fromMgPerL} mg/L)`, { path: `${sp}.to` });
  }
  return goals;
}

