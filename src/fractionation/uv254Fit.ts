/**
 * Specific UV254 absorbance of each fictive DOC component.
 *
 * Beer–Lambert additivity: UV254 = Σ_i a_i·c_i, with c_i the component concentrations (mg/L)
 * predicted by the fitted background at each row and a_i ≥ 0 the specific absorbance
 * (1/m per mg/L). The a_i are fitted by non-negative least squares (Lawson & Hanson 1974) to all
 * UV254 values: equilibrium rows (dose > 0), dose-0 rows and UV254_0 values (c_i = φ_i·DOC0).
 * Units: UV254 in 1/m.
 */
import { nnls } from '../numerics/nnls.js';

export interface Uv254Observation {
  row: number;
  /** Component concentrations, mg/L. */
  c: ArrayLike<number>;
  uv254PerM: number;
}

export interface Uv254Fit {
  /** Specific absorbance per component, 1/m per mg/L. */
  specific: number[];
  predicted: number[];
  rmsePerM: number;
  maxRelativeError: number;
  points: number;
}

export function fitUv254(obs: readonly Uv254Observation[], components: number): Uv254Fit {
  const A = obs.map((o) => Array.from({ length: components }, (_, j) => o.c[j]!));
  const b = obs.map((o) => o.uv254PerM);
  const { x } = nnls(A, b);
  const predicted = A.map((row) => row.reduce((s, v, j) => s + v * x[j]!, 0));
  let sse = 0, maxRel = 0;
  predicted.forEach((p, i) => {
    const r = p - b[i]!;
    sse += r * r;
    if (b[i]! > 0) maxRel = Math.max(maxRel, Math.abs(r) / b[i]!);
  });
  return { specific: x, predicted, rmsePerM: Math.sqrt(sse / Math.max(1, obs.length)), maxRelativeError: maxRel, points: obs.length };
}
