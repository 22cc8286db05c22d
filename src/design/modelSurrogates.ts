/**
 * DOC and UV254 of the site water at a dose from a removal model's fictive background
 * (`backgroundRemaining`), for models other than equilibrium (the PAC contact model): the same
 * quantities as backgroundSurrogatesAt (src/surrogates/surrogateCurve.ts) for batch IAST.
 *   DOC(D) = Σ c_i(D); UV254(D) = Σ a_i·c_i(D) (a_i in 1/m per mg/L); reduction = 1 − value(D)/value(0).
 * Units: dose mg/L, DOC mg/L, UV254 1/m.
 * @throws InputError when the model has no fractionated background; ComputationError from the model
 */
import { InputError } from '../core/errors.js';
import type { RemovalModel } from './removalModel.js';
import type { SurrogatePoint } from '../surrogates/surrogateCurve.js';

export type BackgroundPointAt = (doseMgPerL: number) => Omit<SurrogatePoint, 'removal'>;

export function modelBackgroundPoint(model: RemovalModel, uv254AbsorbancePerM?: readonly number[]): BackgroundPointAt {
  const c0 = model.backgroundC0MgPerL;
  if (!c0 || !model.backgroundRemaining) throw new InputError(`the removal model "${model.kind}" has no fractionated background for the DOC/UV254 surrogates`);
  const remaining = model.backgroundRemaining.bind(model);
  return (doseMgPerL) => {
    const c = doseMgPerL > 0 ? remaining(doseMgPerL / 1000).cMgPerL : c0;
    let doc0 = 0, doc = 0, uv0 = 0, uv = 0;
    for (let i = 0; i < c0.length; i++) {
      doc0 += c0[i]!;
      doc += c[i]!;
      if (uv254AbsorbancePerM) { uv0 += uv254AbsorbancePerM[i]! * c0[i]!; uv += uv254AbsorbancePerM[i]! * c[i]!; }
    }
    const point: Omit<SurrogatePoint, 'removal'> = { doseMgPerL, docMgPerL: doc, docReduction: doc0 > 0 ? 1 - doc / doc0 : 0 };
    if (uv254AbsorbancePerM && uv0 > 0) { point.uv254PerM = uv; point.uv254Reduction = 1 - uv / uv0; }
    return point;
  };
}
