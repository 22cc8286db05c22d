/**
 * Surrogate curves: predicted DOC reduction and UV254 reduction against carbon dose from the
 * fictive background components, beside each target's removal.
 *
 *   DOC(D)   = Σ c_i(D) over the background components (batch IAST, Crittenden et al. 1985,
 *              Environ. Sci. Technol. 19(11):1037–1043), mg/L
 *   UV254(D) = Σ a_i·c_i(D)  (Beer–Lambert additivity over components), 1/m, with a_i the specific
 *              absorbance of component i in 1/m per (mg/L)
 *   DOC reduction = 1 − DOC(D)/DOC(0);  UV254 reduction = 1 − UV254(D)/UV254(0)
 *   removal of target T = 1 − c_T(D)/c0_T, solved with target + background in one IAST.
 *
 * DOC and UV254 are functions of the background alone (a trace target changes them by ~c0_T/DOC,
 * negligible); each target is solved with the background (trace targets do not compete with each
 * other measurably). Units: doses mg/L, concentrations mg/L.
 */
import { InputError } from '../core/errors.js';
import { prepareMixture, type FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';

export interface SurrogateModel {
  /** Fictive DOC components at the site DOC (K = 0 for the non-adsorbable one). */
  background: readonly FreundlichComponent[];
  /** Specific UV254 absorbance of each background component, 1/m per (mg/L), same order. */
  uv254AbsorbancePerM?: readonly number[];
}

export interface SurrogatePoint {
  doseMgPerL: number;
  docMgPerL: number;
  docReduction: number;
  /** UV254 in 1/m (when absorbances are given). */
  uv254PerM?: number;
  uv254Reduction?: number;
  /** Removal fraction of each target, by id. */
  removal: Record<string, number>;
}

export interface SurrogateCurve {
  doc0MgPerL: number;
  uv254_0PerM?: number;
  points: SurrogatePoint[];
}

/** Check the absorbance list against the background. @throws InputError */
export function checkAbsorbances(model: SurrogateModel): void {
  const a = model.uv254AbsorbancePerM;
  if (!a) return;
  if (a.length !== model.background.length) throw new InputError(`expected one UV254 absorbance per background component (${model.background.length}), got ${a.length}`, { path: 'uv254AbsorbancePerM' });
  a.forEach((v, i) => {
    if (!(v >= 0) || !Number.isFinite(v)) throw new InputError(`expected a specific absorbance ≥ 0 in 1/m per (mg/L), got ${v}`, { path: `uv254AbsorbancePerM[${i}]` });
  });
  if (!(uv254PerM(model.background.map((c) => c.c0MgPerL), a) > 0)) throw new InputError('expected absorbances that give a UV254 above 0 before dosing', { path: 'uv254AbsorbancePerM' });
}

/** UV254 = Σ a_i·c_i (Beer–Lambert additivity), 1/m, from c in mg/L and a in 1/m per (mg/L). */
export function uv254PerM(cMgPerL: ArrayLike<number>, absorbancePerM: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < absorbancePerM.length; i++) s += absorbancePerM[i]! * cMgPerL[i]!;
  return s;
}

/** DOC and UV254 (and their reductions) of the background at one dose (mg/L). */
export function backgroundSurrogatesAt(model: SurrogateModel, doseMgPerL: number, warm?: { u: number; theta: number }): { point: Omit<SurrogatePoint, 'removal'>; state: { u: number; theta: number } } {
  const pm = prepareMixture(model.background);
  const s = solveBatchPrepared(pm, doseMgPerL / 1000, warm);
  let doc0 = 0, doc = 0;
  model.background.forEach((c, i) => { doc0 += c.c0MgPerL; doc += s.cMgPerL[i]!; });
  const point: Omit<SurrogatePoint, 'removal'> = { doseMgPerL, docMgPerL: doc, docReduction: doc0 > 0 ? 1 - doc / doc0 : 0 };
  const a = model.uv254AbsorbancePerM;
  if (a) {
    const uv0 = uv254PerM(model.background.map((c) => c.c0MgPerL), a);
    const uv = uv254PerM(s.cMgPerL, a);
    point.uv254PerM = uv;
    point.uv254Reduction = 1 - uv / uv0;
  }
  return { point, state: s.state };
}

/**
 * DOC reduction, UV254 reduction and each target's removal at each dose.
 * @param doses doses in mg/L (≥ 0)
 * @throws InputError for invalid components, absorbances or doses; ComputationError if IAST fails
 */
export function surrogateCurve(model: SurrogateModel, targets: readonly FreundlichComponent[], dosesMgPerL: readonly number[]): SurrogateCurve {
  checkAbsorbances(model);
  dosesMgPerL.forEach((d, i) => {
    if (!(d >= 0) || !Number.isFinite(d)) throw new InputError(`expected a dose ≥ 0 mg/L, got ${d}`, { path: `doses[${i}]` });
  });
  targets.forEach((t, i) => {
    if (!(t.c0MgPerL > 0)) throw new InputError(`target "${t.id}" needs a feed concentration > 0 mg/L, got ${t.c0MgPerL}`, { path: `targets[${i}].c0` });
  });
  const doc0 = model.background.reduce((s, c) => s + c.c0MgPerL, 0);
  const out: SurrogateCurve = { doc0MgPerL: doc0, points: [] };
  if (model.uv254AbsorbancePerM) out.uv254_0PerM = uv254PerM(model.background.map((c) => c.c0MgPerL), model.uv254AbsorbancePerM);
  const pmT = targets.map((t) => prepareMixture([t, ...model.background]));
  let warmBg: { u: number; theta: number } | undefined;
  const warmT: Array<{ u: number; theta: number } | undefined> = targets.map(() => undefined);
  for (const dose of dosesMgPerL) {
    const bg = backgroundSurrogatesAt(model, dose, dose > 0 ? warmBg : undefined);
    if (dose > 0) warmBg = bg.state;
    const removal: Record<string, number> = {};
    targets.forEach((t, k) => {
      const s = solveBatchPrepared(pmT[k]!, dose / 1000, dose > 0 ? warmT[k] : undefined);
      if (dose > 0) warmT[k] = s.state;
      removal[t.id] = 1 - s.cMgPerL[0]! / t.c0MgPerL;
    });
    out.points.push({ ...bg.point, removal });
  }
  return out;
}
