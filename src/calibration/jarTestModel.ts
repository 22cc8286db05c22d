/**
 * The target's equilibrium concentration in a jar test predicted by batch IAST (Crittenden et al.
 * 1985, Environ. Sci. Technol. 19(11):1037–1043) with the target and a background — an
 * equivalent background compound (Najm, Snoeyink & Richard 1991, J. AWWA 83(8):65–76) or the
 * fictive DOC components.
 *
 * Rows sharing C0 and DOC share one mixture, solved in dose order with warm starts; states are
 * kept between calls. Units: mg/L; dose mg/L → g/L for the solver.
 * @throws ComputationError when an equilibrium does not converge
 */
import { prepareMixture, type FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import type { JarTestRow } from './jarTestData.js';

/** Builds the mixture of one row: the target first, then the background. */
export type MixtureBuilder = (c0MgPerL: number, docMgPerL: number | undefined) => FreundlichComponent[];

export interface JarTestModel {
  /** Predicted target concentration (mg/L) per row. */
  predict(build: MixtureBuilder): Float64Array;
}

export function makeJarTestModel(rows: readonly JarTestRow[]): JarTestModel {
  const groups = new Map<string, number[]>();
  rows.forEach((r, i) => {
    const key = `${r.c0MgPerL}|${r.docMgPerL ?? ''}`;
    groups.set(key, [...(groups.get(key) ?? []), i]);
  });
  for (const idx of groups.values()) idx.sort((a, b) => rows[a]!.doseMgPerL - rows[b]!.doseMgPerL);
  const states: Array<{ u: number; theta: number } | undefined> = rows.map(() => undefined);
  return {
    predict(build) {
      const out = new Float64Array(rows.length);
      for (const idx of groups.values()) {
        const first = rows[idx[0]!]!;
        const pm = prepareMixture(build(first.c0MgPerL, first.docMgPerL));
        let prev: { u: number; theta: number } | undefined;
        for (const i of idx) {
          const r = rows[i]!;
          if (r.doseMgPerL === 0) { out[i] = r.c0MgPerL; continue; }
          const sol = solveBatchPrepared(pm, r.doseMgPerL / 1000, states[i] ?? prev);
          states[i] = sol.state;
          prev = sol.state;
          out[i] = sol.cMgPerL[0]!;
        }
      }
      return out;
    },
  };
}
