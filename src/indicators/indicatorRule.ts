/**
 * The indicator-substance averaging rule of the Swiss DETEC ordinance SR 814.201.231
 * (in force 1 Dec 2016), Art. 2–3 (docs/references.md):
 *
 *   - at least 6 substances,
 *   - category 1 and category 2 substances in the ratio 2:1,
 *   - the result is the arithmetic mean of their percentage removals:
 *       mean = (Σ R_i) / N   over the chosen substances (R_i in %).
 *
 * Example, computed from the rule: category 1 at 90, 85, 88, 92 % and category 2 at 70, 75 % give
 * 83.33 %.
 *
 * Pure functions on percentages; they do not know about carbon or doses.
 */
import { InputError } from '../core/errors.js';

/** Indicator category of the ordinance: 1 (eight named substances) or 2 (four named substances). */
export type IndicatorCategory = 1 | 2;

export interface IndicatorValue {
  id: string;
  category: IndicatorCategory;
  /** Removal of the substance, percent (may be negative for a measured increase). */
  removalPercent: number;
}

/** Smallest number of substances (SR 814.201.231, Art. 3). */
export const MIN_INDICATOR_SUBSTANCES = 6;
/** Category 1 substances per category 2 substance (SR 814.201.231, Art. 3). */
export const CATEGORY_RATIO = 2;

export interface IndicatorEvaluation {
  /** True when the set follows the rule (≥ 6 substances, ratio 2:1). */
  admissible: boolean;
  /** Why the set is not admissible (absent when admissible). */
  reason?: string;
  /** Arithmetic mean of the percentage removals of the set, percent. */
  meanRemovalPercent: number;
  category1: number;
  category2: number;
  /** Ids of the substances in the set. */
  ids: string[];
}

/** Why a set with n1 category 1 and n2 category 2 substances breaks the rule, or undefined. */
export function ruleViolation(n1: number, n2: number): string | undefined {
  const n = n1 + n2;
  if (n < MIN_INDICATOR_SUBSTANCES) return `${n} substance${n === 1 ? '' : 's'} given; the rule needs at least ${MIN_INDICATOR_SUBSTANCES} (SR 814.201.231 Art. 3)`;
  if (n1 !== CATEGORY_RATIO * n2) return `${n1} of category 1 and ${n2} of category 2; the rule needs them in the ratio 2:1 (SR 814.201.231 Art. 3)`;
  return undefined;
}

/**
 * Evaluate one set of substances: admissibility and the arithmetic mean of the removals.
 * @throws InputError on an empty set, duplicate ids, a category other than 1 or 2, or a
 *   removal that is not a finite number.
 */
export function evaluateIndicatorSet(values: readonly IndicatorValue[]): IndicatorEvaluation {
  checkValues(values);
  if (values.length === 0) throw new InputError('no indicator substances given; expected at least 6 (SR 814.201.231 Art. 3)', { path: 'indicators' });
  const n1 = values.filter((v) => v.category === 1).length;
  const n2 = values.length - n1;
  const sum = values.reduce((s, v) => s + v.removalPercent, 0);
  const out: IndicatorEvaluation = {
    admissible: true,
    meanRemovalPercent: sum / values.length, // SR 814.201.231 Art. 3: arithmetic mean
    category1: n1,
    category2: n2,
    ids: values.map((v) => v.id),
  };
  const why = ruleViolation(n1, n2);
  if (why) { out.admissible = false; out.reason = why; }
  return out;
}

/**
 * The mean removal of an admissible set.
 * @throws InputError naming the broken rule when the set is not admissible.
 */
export function indicatorMean(values: readonly IndicatorValue[]): number {
  const ev = evaluateIndicatorSet(values);
  if (!ev.admissible) throw new InputError(`indicator set not admissible: ${ev.reason}`, { path: 'indicators' });
  return ev.meanRemovalPercent;
}

export interface AdmissibleRange {
  /** The admissible subset with the highest mean. */
  best: IndicatorEvaluation;
  /** The admissible subset with the lowest mean. */
  worst: IndicatorEvaluation;
  /** Number of admissible subset sizes (k1 = 2·k2, k1 + k2 ≥ 6) available. */
  sizes: Array<{ category1: number; category2: number }>;
}

/**
 * Best and worst admissible subsets when more substances are available than the rule needs.
 * For each admissible size (k2 category 2 and k1 = 2·k2 category 1, k1 + k2 ≥ 6) the best
 * subset takes the k1 and k2 highest removals of each category and the worst the lowest (the
 * mean is a sum, so sorting each category is exact); then the best and worst over the sizes.
 * @throws InputError when no admissible subset exists (fewer than 4 category 1 or 2 category 2).
 */
export function admissibleRange(values: readonly IndicatorValue[]): AdmissibleRange {
  checkValues(values);
  const c1 = values.filter((v) => v.category === 1).sort(byRemovalDesc);
  const c2 = values.filter((v) => v.category === 2).sort(byRemovalDesc);
  const sizes: AdmissibleRange['sizes'] = [];
  for (let k2 = 1; k2 <= c2.length && CATEGORY_RATIO * k2 <= c1.length; k2++) {
    const k1 = CATEGORY_RATIO * k2;
    if (k1 + k2 >= MIN_INDICATOR_SUBSTANCES) sizes.push({ category1: k1, category2: k2 });
  }
  if (sizes.length === 0) {
    throw new InputError(`no admissible indicator set: ${c1.length} substance${c1.length === 1 ? '' : 's'} of category 1 and ${c2.length} of category 2 available; the rule needs at least 4 of category 1 and 2 of category 2 (6 substances, ratio 2:1, SR 814.201.231 Art. 3)`, { path: 'indicators' });
  }
  let best: IndicatorEvaluation | undefined;
  let worst: IndicatorEvaluation | undefined;
  for (const s of sizes) {
    const hi = evaluateIndicatorSet([...c1.slice(0, s.category1), ...c2.slice(0, s.category2)]);
    const lo = evaluateIndicatorSet([...c1.slice(c1.length - s.category1), ...c2.slice(c2.length - s.category2)]);
    if (!best || hi.meanRemovalPercent > best.meanRemovalPercent) best = hi;
    if (!worst || lo.meanRemovalPercent < worst.meanRemovalPercent) worst = lo;
  }
  return { best: best!, worst: worst!, sizes };
}

function byRemovalDesc(a: IndicatorValue, b: IndicatorValue): number {
  return b.removalPercent - a.removalPercent || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
}

function checkValues(values: readonly IndicatorValue[]): void {
  const seen = new Set<string>();
  values.forEach((v, i) => {
    if (seen.has(v.id)) throw new InputError(`substance "${v.id}" appears twice; each counts once`, { path: `indicators[${i}].id` });
    seen.add(v.id);
    if (v.category !== 1 && v.category !== 2) throw new InputError(`expected indicator category 1 or 2, got ${JSON.stringify(v.category)}`, { path: `indicators[${i}].category` });
    if (!Number.isFinite(v.removalPercent)) throw new InputError(`expected a finite removal in percent, got ${v.removalPercent}`, { path: `indicators[${i}].removal` });
  });
}
