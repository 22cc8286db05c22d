/**
 * Independent reference computations for the tests: plain bisection on textbook equations,
 * written without the solver's formulation so that agreement means something.
 */

/** Bisection for an increasing function on [lo, hi] to machine precision. */
export function bisectIncreasing(f: (x: number) => number, lo: number, hi: number): number {
  for (let k = 0; k < 2000; k++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) return mid;
    if (f(mid) > 0) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/** Single-solute Freundlich batch: c + D·K·c^β = c0 (c, c0 mg/L; D g/L). Returns c. */
export function freundlichBatchC(c0: number, K: number, beta: number, D: number): number {
  // in ln c: g(l) = ln(e^l + D K e^(β l)) − ln c0, increasing
  return Math.exp(bisectIncreasing((l) => Math.log(Math.exp(l) + D * K * Math.exp(beta * l)) - Math.log(c0), Math.log(c0) - 800, Math.log(c0)));
}

/**
 * IAST residuals computed from the outputs only (Radke & Prausnitz 1972): with z_i = q_i/Σq,
 * c°_i = c_i/z_i, ψ_i = K_i·c°_i^β_i/β_i must be equal for all i, and 1/q_T = Σ z_i/q°_i with
 * q°_i = K_i·c°_i^β_i. Returns the largest relative deviations.
 */
export function iastResiduals(
  comps: Array<{ K: number; oneOverN: number; c0MgPerL: number }>,
  c: ArrayLike<number>,
  q: ArrayLike<number>,
  doseGPerL: number,
): { massBalance: number; psiSpread: number; qTotal: number } {
  let massBalance = 0;
  const idx: number[] = [];
  comps.forEach((cp, i) => {
    const bal = Math.abs(cp.c0MgPerL - c[i]! - doseGPerL * q[i]!) / Math.max(cp.c0MgPerL, Number.MIN_VALUE);
    massBalance = Math.max(massBalance, cp.c0MgPerL > 0 ? bal : Math.abs(c[i]!));
    if (cp.K > 0 && cp.c0MgPerL > 0) idx.push(i);
  });
  if (idx.length === 0) return { massBalance, psiSpread: 0, qTotal: 0 };
  const qT = idx.reduce((s, i) => s + q[i]!, 0);
  const lnPsi: number[] = [];
  let invQ = 0;
  for (const i of idx) {
    const cp = comps[i]!;
    const z = q[i]! / qT;
    const lnc0 = Math.log(c[i]!) - Math.log(z);
    const lnqo = Math.log(cp.K) + cp.oneOverN * lnc0;
    lnPsi.push(lnqo - Math.log(cp.oneOverN));
    invQ += z / Math.exp(lnqo);
  }
  const mx = Math.max(...lnPsi), mn = Math.min(...lnPsi);
  return { massBalance, psiSpread: Math.expm1(mx - mn), qTotal: Math.abs(invQ * qT - 1) };
}
