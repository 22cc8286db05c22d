/**
 * The description of a Monte Carlo run over isotherm and background parameters (plain data, so
 * it can be sent to worker threads), and its validation.
 *
 * Units: concentrations mg/L, K in (mg/g)/(mg/L)^(1/n) (internal units), absorbances 1/m per
 * (mg/L), flows m³/d, price per kg of carbon (any currency). Relative standard deviations are
 * fractions (0.2 = 20 %).
 */
import { InputError } from '../core/errors.js';
import { REMOVAL_MODELS } from '../design/removalModels.js';
import { validateUncertainKinetics, type UncertainKinetics } from './kineticUncertainty.js';

export interface UncertainTarget {
  id: string;
  /** Freundlich K, (mg/g)/(mg/L)^(1/n). */
  K: number;
  oneOverN: number;
  /** Feed concentration, mg/L (trace removal does not depend on it; it sets the limit goal). */
  c0MgPerL: number;
  /** Removal goal as a fraction (R < 1; R ≤ 0 is met without carbon); or give `limitMgPerL`. */
  removalGoal?: number;
  /** Effluent limit, mg/L: the goal becomes R = 1 − limit/c0 (≤ 0 when the limit is at or above c0). */
  limitMgPerL?: number;
  /** A report-only compound (no goal, never governing): its quantity is its removal at the required dose. */
  reportOnly?: boolean;
  /** Relative SD of K (lognormal, median K). Default 0. */
  KRelSd?: number;
  /** Relative SD of 1/n (lognormal, median 1/n). Default 0. */
  oneOverNRelSd?: number;
}

export interface UncertainBackgroundComponent {
  id: string;
  /** K = 0 marks the non-adsorbable component. */
  K: number;
  oneOverN: number;
  /** Fraction of the DOC (the fractions are renormalised to sum to 1 in every draw). */
  fraction: number;
  KRelSd?: number;
  fractionRelSd?: number;
}

/**
 * Covariance of fitted parameters (e.g. from the fractionation fit). Parameter names:
 * `lnK:<id>` (natural log of K, so its SD is roughly a relative SD of K), `fraction:<id>` and
 * `one_over_n:<id>`, for background components or targets. Named parameters are drawn jointly
 * normal around their point values and override the relative SDs of the same parameters;
 * fractions drawn below 0 are set to 0 and exponents below 0.01 to 0.01.
 */
export interface ParameterCovariance {
  parameters: string[];
  matrix: number[][];
}

export interface YearlyCostInput {
  /** DOC of each day (or each sample) of the series, mg/L. */
  docSeriesMgPerL: number[];
  /** Flow of each day, m³/d, or one flow for all days. */
  flowM3PerD: number[] | number;
  /** Carbon price per kg (currency of the project). */
  carbonPricePerKg: number;
  /** DOC nodes of the dose table, mg/L ascending (the run's; default: tabulated at the point estimate). */
  docNodesMgPerL?: number[];
}

export interface MonteCarloProblem {
  targets: UncertainTarget[];
  background: UncertainBackgroundComponent[];
  covariance?: ParameterCovariance;
  /** Design DOC, mg/L. */
  docMgPerL: number;
  /** Relative SD of the DOC (lognormal; applied to the design DOC and to the whole series). */
  docRelSd?: number;
  /** Specific UV254 absorbance of each background component, 1/m per (mg/L), in background order. */
  uv254AbsorbancePerM?: number[];
  yearly?: YearlyCostInput;
  /** The indicator goal: members by target index with their category, the chosen set, the goal in percent. */
  indicator?: { members: Array<{ index: number; category: 1 | 2 }>; chosen?: string[]; goalPercent: number };
  /** Carbon price per kg (cost per m³; default the yearly price). */
  carbonPricePerKg?: number;
  /** Removal model by name (src/design/removalModels.ts; default "equilibrium"). */
  model?: string;
  /** PAC contact kinetics: the draws use the contact model with these (sampled) diffusivities instead of `model`. */
  kinetics?: UncertainKinetics;
}

function finiteNonNeg(v: unknown, path: string, what: string): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) throw new InputError(`expected ${what} as a finite number ≥ 0, got ${JSON.stringify(v)}`, { path });
  return v;
}

function positive(v: unknown, path: string, what: string): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) throw new InputError(`expected ${what} as a finite number > 0, got ${JSON.stringify(v)}`, { path });
  return v;
}

/** The removal goal of a target as a fraction. @throws InputError when absent or out of range. */
export function targetGoal(t: UncertainTarget, path: string): number {
  if (t.reportOnly === true) return 0;
  if (t.removalGoal !== undefined) {
    if (!(t.removalGoal < 1) || !Number.isFinite(t.removalGoal)) throw new InputError(`expected a removal goal below 1 (≤ 0 = met without carbon), got ${t.removalGoal}`, { path: `${path}.removalGoal` });
    return t.removalGoal;
  }
  if (t.limitMgPerL !== undefined) {
    const lim = positive(t.limitMgPerL, `${path}.limitMgPerL`, 'an effluent limit in mg/L');
    return 1 - lim / t.c0MgPerL;
  }
  throw new InputError('expected a removal goal (removalGoal) or an effluent limit (limitMgPerL)', { path });
}

/** Check every field; @throws InputError naming the JSON path of the first bad value. */
export function validateMonteCarloProblem(p: MonteCarloProblem): void {
  if (!Array.isArray(p.targets) || p.targets.length === 0) throw new InputError('expected at least one target compound', { path: 'targets' });
  if (!Array.isArray(p.background) || p.background.length === 0) throw new InputError('expected at least one background component', { path: 'background' });
  const ids = new Set<string>();
  const addId = (id: unknown, path: string) => {
    if (typeof id !== 'string' || id === '') throw new InputError('expected a non-empty id', { path });
    if (ids.has(id)) throw new InputError(`duplicate id "${id}"; targets and background components need distinct ids`, { path });
    ids.add(id);
  };
  p.targets.forEach((t, i) => {
    const path = `targets[${i}]`;
    addId(t.id, `${path}.id`);
    positive(t.K, `${path}.K`, 'K');
    positive(t.oneOverN, `${path}.oneOverN`, 'the exponent 1/n');
    positive(t.c0MgPerL, `${path}.c0MgPerL`, 'the feed concentration in mg/L');
    targetGoal(t, path);
    finiteNonNeg(t.KRelSd ?? 0, `${path}.KRelSd`, 'a relative SD');
    finiteNonNeg(t.oneOverNRelSd ?? 0, `${path}.oneOverNRelSd`, 'a relative SD');
  });
  let adsorbable = 0;
  let fractionSum = 0;
  p.background.forEach((b, i) => {
    const path = `background[${i}]`;
    addId(b.id, `${path}.id`);
    finiteNonNeg(b.K, `${path}.K`, 'K (0 = non-adsorbable)');
    if (b.K > 0) { positive(b.oneOverN, `${path}.oneOverN`, 'the exponent 1/n'); adsorbable++; }
    fractionSum += finiteNonNeg(b.fraction, `${path}.fraction`, 'a fraction of the DOC');
    finiteNonNeg(b.KRelSd ?? 0, `${path}.KRelSd`, 'a relative SD');
    finiteNonNeg(b.fractionRelSd ?? 0, `${path}.fractionRelSd`, 'a relative SD');
  });
  if (!(fractionSum > 0)) throw new InputError('expected background fractions that sum to more than 0', { path: 'background' });
  if (adsorbable === 0) throw new InputError('expected at least one adsorbable background component (K > 0)', { path: 'background' });
  positive(p.docMgPerL, 'docMgPerL', 'the DOC in mg/L');
  finiteNonNeg(p.docRelSd ?? 0, 'docRelSd', 'a relative SD');
  if (p.uv254AbsorbancePerM !== undefined) {
    if (!Array.isArray(p.uv254AbsorbancePerM) || p.uv254AbsorbancePerM.length !== p.background.length) {
      throw new InputError(`expected one UV254 absorbance per background component (${p.background.length})`, { path: 'uv254AbsorbancePerM' });
    }
    p.uv254AbsorbancePerM.forEach((a, i) => finiteNonNeg(a, `uv254AbsorbancePerM[${i}]`, 'a specific absorbance in 1/m per (mg/L)'));
    if (!(p.uv254AbsorbancePerM.reduce((s, a, i) => s + a * p.background[i]!.fraction, 0) > 0)) {
      throw new InputError('expected UV254 absorbances that give a UV254 above 0', { path: 'uv254AbsorbancePerM' });
    }
  }
  if (p.yearly) {
    const y = p.yearly;
    if (!Array.isArray(y.docSeriesMgPerL) || y.docSeriesMgPerL.length === 0) throw new InputError('expected a non-empty DOC series', { path: 'yearly.docSeriesMgPerL' });
    y.docSeriesMgPerL.forEach((d, i) => positive(d, `yearly.docSeriesMgPerL[${i}]`, 'a DOC in mg/L'));
    if (Array.isArray(y.flowM3PerD)) {
      if (y.flowM3PerD.length !== y.docSeriesMgPerL.length) throw new InputError(`expected one flow per DOC value (${y.docSeriesMgPerL.length})`, { path: 'yearly.flowM3PerD' });
      y.flowM3PerD.forEach((f, i) => finiteNonNeg(f, `yearly.flowM3PerD[${i}]`, 'a flow in m³/d'));
    } else positive(y.flowM3PerD, 'yearly.flowM3PerD', 'a flow in m³/d');
    finiteNonNeg(y.carbonPricePerKg, 'yearly.carbonPricePerKg', 'a carbon price per kg');
    if (y.docNodesMgPerL !== undefined) {
      if (!Array.isArray(y.docNodesMgPerL) || y.docNodesMgPerL.length === 0) throw new InputError('expected a non-empty list of DOC nodes', { path: 'yearly.docNodesMgPerL' });
      y.docNodesMgPerL.forEach((d, i) => {
        positive(d, `yearly.docNodesMgPerL[${i}]`, 'a DOC node in mg/L');
        if (i > 0 && !(d > y.docNodesMgPerL![i - 1]!)) throw new InputError('expected ascending DOC nodes', { path: `yearly.docNodesMgPerL[${i}]` });
      });
    }
  }
  if (p.carbonPricePerKg !== undefined) finiteNonNeg(p.carbonPricePerKg, 'carbonPricePerKg', 'a carbon price per kg');
  if (p.kinetics !== undefined) validateUncertainKinetics(p.kinetics, p.targets.length);
  if (p.model !== undefined && !(p.model in REMOVAL_MODELS)) throw new InputError(`expected a removal model among ${Object.keys(REMOVAL_MODELS).join(', ')}, got "${p.model}"`, { path: 'model' });
  if (p.indicator) {
    const ind = p.indicator;
    if (!Array.isArray(ind.members) || ind.members.length === 0) throw new InputError('expected indicator members', { path: 'indicator.members' });
    ind.members.forEach((m, i) => {
      if (!Number.isInteger(m.index) || m.index < 0 || m.index >= p.targets.length) throw new InputError(`expected a target index from 0 to ${p.targets.length - 1}, got ${m.index}`, { path: `indicator.members[${i}].index` });
      if (m.category !== 1 && m.category !== 2) throw new InputError(`expected category 1 or 2, got ${String(m.category)}`, { path: `indicator.members[${i}].category` });
    });
    if (!(ind.goalPercent > 0 && ind.goalPercent < 100)) throw new InputError(`expected an indicator goal between 0 and 100 %, got ${ind.goalPercent}`, { path: 'indicator.goalPercent' });
  }
  if (p.covariance) {
    const c = p.covariance;
    if (!Array.isArray(c.parameters) || !Array.isArray(c.matrix) || c.matrix.length !== c.parameters.length) {
      throw new InputError('expected covariance.parameters and a square covariance.matrix of the same size', { path: 'covariance' });
    }
    const seen = new Set<string>();
    c.parameters.forEach((name, i) => {
      const m = /^(lnK|fraction|one_over_n):(.+)$/.exec(name);
      const path = `covariance.parameters[${i}]`;
      if (!m) throw new InputError(`expected a parameter name "lnK:<id>", "fraction:<id>" or "one_over_n:<id>", got "${name}"`, { path });
      if (!ids.has(m[2]!)) throw new InputError(`unknown component id "${m[2]}" in covariance parameter "${name}"`, { path });
      const isTarget = p.targets.some((t) => t.id === m[2]);
      if (m[1] === 'fraction' && isTarget) throw new InputError(`targets have no DOC fraction; "${name}" is not a parameter`, { path });
      const bg = p.background.find((b) => b.id === m[2]);
      if (bg && bg.K === 0 && m[1] !== 'fraction') throw new InputError(`component "${m[2]}" is non-adsorbable; only its fraction is uncertain`, { path });
      if (seen.has(name)) throw new InputError(`duplicate covariance parameter "${name}"`, { path });
      seen.add(name);
    });
  }
}
