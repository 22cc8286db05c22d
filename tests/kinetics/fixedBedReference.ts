/**
 * Reference solutions of the linear fixed-bed problem (linear isotherm q = K·c, surface diffusion
 * in spherical grains, film transfer, plug flow, clean bed, step feed), in the dimensionless form
 * of src/kinetics/fixedBedModel.ts: time τ in bed volumes, u = c/c0 at the outlet.
 *
 * Laplace transform (closed form, derived from the same equations; the classical result):
 *   û(s) = (1/s)·exp(−ε·s − X·H(σ)/(1 + ν·H(σ))),   H(σ) = σ·coth σ − 1,   σ = √(s/Dτ)
 * with Dτ = Ds·EBCT/R², X = 3·Dτ·ρ_bed·K (bed-length parameter), ν = Ds·ρp·K/(R·kf) (film
 * parameter). Its real inversion along the imaginary axis is Rosen's solution (Rosen 1952,
 * J. Chem. Phys. 20:387, from memory):
 *   u = ½ + (2/π)·∫₀^∞ exp(−X·Φ₁(λ))·sin(Y·λ² − X·Φ₂(λ)) dλ/λ,   Y = 2·Dτ·(τ − ε),
 *   Φ₁ = (H₁ + ν(H₁² + H₂²))/((1 + νH₁)² + (νH₂)²),  Φ₂ = H₂/((1 + νH₁)² + (νH₂)²),
 *   H₁ = λ(sinh 2λ + sin 2λ)/(cosh 2λ − cos 2λ) − 1,   H₂ = λ(sinh 2λ − sin 2λ)/(cosh 2λ − cos 2λ)
 * (H = H₁ + iH₂ at σ = λ(1 + i)). The integral is evaluated by Gauss–Legendre panels shorter than
 * a tenth of the local oscillation period, up to where X·Φ₁ > 36 (X/ν > 40 is required, so that
 * the film tail exp(−X/ν) is negligible).
 * Independent check: the fixed Talbot inversion of û (Talbot 1979, J. Inst. Math. Appl. 23:97;
 * Abate & Valkó 2004, Int. J. Numer. Meth. Eng. 60:979), M = 24 nodes.
 */

export interface LinearBed {
  porosity: number;
  /** Dτ = Ds·EBCT/R², per bed volume. */
  dTau: number;
  /** X = 3·Dτ·ρ_bed·K. */
  X: number;
  /** ν = Ds·ρp·K/(R·kf). */
  nu: number;
}

function hParts(l: number): [number, number] {
  if (l < 1e-3) { const l2 = l * l; return [(4 / 45) * l2 * l2, (2 / 3) * l2]; } // σ²/3 − σ⁴/45 with σ² = 2iλ²
  const t = 2 * l;
  if (t > 40) return [l - 1, l];
  const den = Math.cosh(t) - Math.cos(t);
  return [(l * (Math.sinh(t) + Math.sin(t))) / den - 1, (l * (Math.sinh(t) - Math.sin(t))) / den];
}

/** Rosen's integral at bed volumes τ. */
export function rosenBreakthrough(b: LinearBed, tau: number): number {
  const Y = 2 * b.dTau * (tau - b.porosity);
  if (Y <= 0) return 0;
  if (b.X / Math.max(b.nu, 1e-300) < 40) throw new Error('film tail not negligible; choose X/ν > 40');
  const phi = (l: number): [number, number] => {
    const [h1, h2] = hParts(l);
    const d = (1 + b.nu * h1) ** 2 + (b.nu * h2) ** 2;
    return [(h1 + b.nu * (h1 * h1 + h2 * h2)) / d, h2 / d];
  };
  const f = (l: number) => { const [p1, p2] = phi(l); return (Math.exp(-b.X * p1) * Math.sin(Y * l * l - b.X * p2)) / l; };
  // Gauss–Legendre 8 points on [−1, 1]
  const gx = [0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363];
  const gw = [0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];
  let s = 0;
  let a = 0;
  for (let guard = 0; guard < 2_000_000; guard++) {
    const period = Math.PI / (Y * Math.max(a, 1e-3) + 1);
    const h = Math.min(0.02, period / 10);
    const m = a + h / 2;
    for (let k = 0; k < 4; k++) s += (h / 2) * gw[k]! * (f(m + (h / 2) * gx[k]!) + f(m - (h / 2) * gx[k]!));
    a += h;
    if (b.X * phi(a)[0] > 36) break; // exp(−36) < 3e-16
  }
  return 0.5 + (2 / Math.PI) * s;
}

type C = [number, number];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => { const d = b[0] * b[0] + b[1] * b[1]; return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d]; };
const cexp = (a: C): C => { const e = Math.exp(a[0]); return [e * Math.cos(a[1]), e * Math.sin(a[1])]; };
const csqrt = (a: C): C => { const r = Math.hypot(a[0], a[1]); const re = Math.sqrt((r + a[0]) / 2); const im = Math.sign(a[1] || 1) * Math.sqrt((r - a[0]) / 2); return [re, im]; };
/** σ·coth σ − 1 for complex σ with Re σ > 0. */
function hComplex(sig: C): C {
  // coth σ = (1 + e^{−2σ})/(1 − e^{−2σ})
  const e = cexp([-2 * sig[0], -2 * sig[1]]);
  const coth = div([1 + e[0], e[1]], [1 - e[0], -e[1]]);
  if (Math.hypot(sig[0], sig[1]) < 1e-3) { const s2 = mul(sig, sig); return [s2[0] / 3, s2[1] / 3]; }
  const v = mul(sig, coth);
  return [v[0] - 1, v[1]];
}

/** û(s) without the delay factor exp(−ε·s). */
function laplaceNoDelay(b: LinearBed, s: C): C {
  const sig = csqrt([s[0] / b.dTau, s[1] / b.dTau]);
  const H = hComplex(sig);
  const frac = div(H, [1 + b.nu * H[0], b.nu * H[1]]);
  return div(cexp([-b.X * frac[0], -b.X * frac[1]]), s);
}

/** Fixed Talbot inversion of û at bed volumes τ (the delay ε is a shift of the argument). */
export function talbotBreakthrough(b: LinearBed, tau: number, M = 24): number {
  const t = tau - b.porosity;
  if (t <= 0) return 0;
  const r = (2 * M) / (5 * t);
  let sum = 0.5 * laplaceNoDelay(b, [r, 0])[0] * Math.exp(r * t);
  for (let k = 1; k < M; k++) {
    const th = (k * Math.PI) / M;
    const cot = Math.cos(th) / Math.sin(th);
    const S: C = [r * th * cot, r * th];
    const sigma = th + (th * cot - 1) * cot;
    const term = mul(mul(cexp([t * S[0], t * S[1]]), laplaceNoDelay(b, S)), [1, sigma]);
    sum += term[0];
  }
  return (r / M) * sum;
}
