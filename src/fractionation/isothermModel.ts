/**
 * The DOC isotherm predicted by fictive components: for every row (dose D, initial DOC0), the
 * components start at c0_i = φ_i·DOC0 and reach batch IAST equilibrium (Crittenden et al. 1985,
 * Environ. Sci. Technol. 19(11):1037–1043); the predicted DOC is Σ c_i. This is the forward
 * model of the adsorption analysis (Worch 2012, from memory).
 *
 * Units: DOC and c in mg/L, dose in mg/L (converted to g/L for the solver), K in
 * (mg/g)/(mg/L)^(1/n). Component 0 is conventionally the non-adsorbable one (K = 0).
 * Equilibria of one DOC0 series are solved in dose order with warm starts; the states are kept
 * between calls, so successive evaluations at nearby parameters are fast.
 * @throws ComputationError when an equilibrium does not converge
 */
import { prepareMixture, type FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';

export interface IsothermModelRow {
  doseMgPerL: number;
  doc0MgPerL: number;
}

export interface IsothermPrediction {
  /** Predicted DOC per row, mg/L. */
  doc: Float64Array;
  /** Component concentrations per row, mg/L (component order as given). */
  c: Float64Array[];
}

export interface IsothermModel {
  predict(fractions: ArrayLike<number>, K: ArrayLike<number>): IsothermPrediction;
  readonly rows: readonly IsothermModelRow[];
}

/** Build the forward model for the given rows and common exponent β = 1/n. */
export function makeIsothermModel(rows: readonly IsothermModelRow[], oneOverN: number): IsothermModel {
  const groups = new Map<number, number[]>();
  rows.forEach((r, i) => groups.set(r.doc0MgPerL, [...(groups.get(r.doc0MgPerL) ?? []), i]));
  for (const idx of groups.values()) idx.sort((a, b) => rows[a]!.doseMgPerL - rows[b]!.doseMgPerL);
  const states: Array<{ u: number; theta: number } | undefined> = rows.map(() => undefined);
  return {
    rows,
    predict(fractions, K) {
      const m = fractions.length;
      const doc = new Float64Array(rows.length);
      const c: Float64Array[] = new Array(rows.length);
      for (const [doc0, idx] of groups) {
        const comps: FreundlichComponent[] = [];
        for (let j = 0; j < m; j++) comps.push({ id: `F${j}`, c0MgPerL: Math.max(0, fractions[j]!) * doc0, K: K[j]!, oneOverN });
        const pm = prepareMixture(comps);
        let prev: { u: number; theta: number } | undefined;
        for (const i of idx) {
          const dose = rows[i]!.doseMgPerL;
          if (dose === 0) {
            c[i] = Float64Array.from(comps, (x) => x.c0MgPerL);
          } else {
            const sol = solveBatchPrepared(pm, dose / 1000, states[i] ?? prev);
            states[i] = sol.state;
            prev = sol.state;
            c[i] = sol.cMgPerL;
          }
          let s = 0;
          for (let j = 0; j < m; j++) s += c[i]![j]!;
          doc[i] = s;
        }
      }
      return { doc, c };
    },
  };
}
