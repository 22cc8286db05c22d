/**
 * The implicit integrator (TR-BDF2) against closed forms: the one-step amplification of
 * y' = λy (the error constant of Bank et al. 1985), a stiff linear system with known
 * exponentials, the Prothero–Robinson problem (exact solution g(t)), Robertson's stiff kinetics
 * (a linear invariant and self-convergence), and the failure reasons.
 */
import { describe, expect, it } from 'vitest';
import { integrateImplicit, TRBDF2_ERROR_CONSTANT, type StiffSystem } from '../../src/kinetics/implicitIntegrator.js';
import { denseLu } from '../../src/kinetics/denseLu.js';
import { ComputationError } from '../../src/core/errors.js';

/** A dense linear or nonlinear system with an analytic Jacobian, for the tests. */
function denseSystem(size: number, rhs: StiffSystem['rhs'], jac: (t: number, y: Float64Array, J: Float64Array) => void): StiffSystem {
  return {
    size,
    rhs,
    factor(t, y, gammaH) {
      const J = new Float64Array(size * size);
      jac(t, y, J);
      const M = new Float64Array(size * size);
      for (let i = 0; i < size * size; i++) M[i] = -gammaH * J[i]!;
      for (let i = 0; i < size; i++) M[i * size + i] = M[i * size + i]! + 1;
      const lu = denseLu(M, size);
      return (b) => lu.solve(b);
    },
  };
}

describe('TR-BDF2 step', () => {
  it('has the local error constant of Bank et al. (1985): |R(z) − e^z| ≈ |k|·z³ (closed form)', () => {
    // one step on y' = y with h = z, forced by a single output time and a first step of h
    for (const z of [1e-2, 2e-3]) {
      const sys = denseSystem(1, (_t, y, f) => { f[0] = y[0]!; }, (_t, _y, J) => { J[0] = 1; });
      const r = integrateImplicit(sys, 0, Float64Array.of(1), [z], { initialStep: z, rtol: 1, atol: 1 });
      expect(r.stats.steps).toBe(1);
      const ratio = (r.states[0]![0]! - Math.exp(z)) / z ** 3;
      // third-order term of the expansion; the next term is O(z) relative
      expect(Math.abs(ratio)).toBeCloseTo(Math.abs(TRBDF2_ERROR_CONSTANT), 2);
      expect(Math.abs(Math.abs(ratio) / Math.abs(TRBDF2_ERROR_CONSTANT) - 1)).toBeLessThan(2 * z);
    }
  });
});

describe('stiff linear system with known exponentials (closed form)', () => {
  // y' = A y with A = P·diag(−1, −1e3, −1e6)·P⁻¹, P a fixed well-conditioned matrix
  const lambdas = [-1, -1e3, -1e6];
  const P = [[1, 0.5, 0.2], [0.3, 1, -0.4], [-0.2, 0.1, 1]];
  const Pinv = invert3(P);
  const A = new Float64Array(9);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
    let s = 0;
    for (let k = 0; k < 3; k++) s += P[i]![k]! * lambdas[k]! * Pinv[k]![j]!;
    A[i * 3 + j] = s;
  }
  const exact = (t: number, y0: number[]) => {
    const c = [0, 1, 2].map((k) => Pinv[k]![0]! * y0[0]! + Pinv[k]![1]! * y0[1]! + Pinv[k]![2]! * y0[2]!);
    return [0, 1, 2].map((i) => P[i]![0]! * c[0]! * Math.exp(lambdas[0]! * t) + P[i]![1]! * c[1]! * Math.exp(lambdas[1]! * t) + P[i]![2]! * c[2]! * Math.exp(lambdas[2]! * t));
  };
  const sys = denseSystem(3, (_t, y, f) => {
    for (let i = 0; i < 3; i++) f[i] = A[i * 3]! * y[0]! + A[i * 3 + 1]! * y[1]! + A[i * 3 + 2]! * y[2]!;
  }, (_t, _y, J) => J.set(A));

  it('matches exp(At)·y0 at the output times within 1e-5 relative at rtol 1e-8 (per-step control: global error ≈ 10–100·rtol)', () => {
    const y0 = [1, 2, -1];
    const outs = [1e-4, 1e-2, 0.5, 1, 3, 10];
    const r = integrateImplicit(sys, 0, Float64Array.from(y0), outs, { rtol: 1e-8, atol: 1e-12 });
    r.states.forEach((s, k) => {
      const e = exact(outs[k]!, y0);
      for (let i = 0; i < 3; i++) expect(Math.abs(s[i]! - e[i]!)).toBeLessThan(1e-5 * Math.max(1e-3, Math.abs(e[i]!)));
    });
    // an explicit method would need ~1e7 steps for stability over t = 10 at λ = −1e6
    expect(r.stats.steps).toBeLessThan(10_000);
    expect(r.times).toEqual(outs);
  });

  it('converges at second order: tightening rtol by 100 cuts the error at least 20-fold', () => {
    const y0 = [1, 2, -1];
    const err = (rtol: number) => {
      const r = integrateImplicit(sys, 0, Float64Array.from(y0), [2], { rtol, atol: rtol * 1e-3 });
      const e = exact(2, y0);
      return Math.max(...[0, 1, 2].map((i) => Math.abs(r.states[0]![i]! - e[i]!)));
    };
    expect(err(1e-8)).toBeLessThan(err(1e-6) / 20);
  });
});

describe('Prothero–Robinson problem y\' = λ(y − g) + g\', exact solution y = g (closed form)', () => {
  for (const lambda of [-1e2, -1e6, -1e10]) {
    it(`λ = ${lambda}: y(t) = sin t within 1e-6`, () => {
      const sys = denseSystem(1, (t, y, f) => { f[0] = lambda * (y[0]! - Math.sin(t)) + Math.cos(t); }, (_t, _y, J) => { J[0] = lambda; });
      const outs = [0.5, 1, 2, 5];
      const r = integrateImplicit(sys, 0, Float64Array.of(0), outs, { rtol: 1e-8, atol: 1e-10 });
      r.states.forEach((s, k) => expect(Math.abs(s[0]! - Math.sin(outs[k]!))).toBeLessThan(1e-6));
    });
  }
});

describe('Robertson chemical kinetics (stiff, Robertson 1966; Hairer & Wanner 1996, §IV.1)', () => {
  const sys = denseSystem(3, (_t, y, f) => {
    const [a, b, c] = [y[0]!, y[1]!, y[2]!];
    f[0] = -0.04 * a + 1e4 * b * c;
    f[1] = 0.04 * a - 1e4 * b * c - 3e7 * b * b;
    f[2] = 3e7 * b * b;
  }, (_t, y, J) => {
    const [b, c] = [y[1]!, y[2]!];
    J.set([-0.04, 1e4 * c, 1e4 * b, 0.04, -1e4 * c - 6e7 * b, -1e4 * b, 0, 6e7 * b, 0]);
  });
  const outs = [0.4, 4, 40, 400, 4e4, 4e6];
  const run = (rtol: number) => integrateImplicit(sys, 0, Float64Array.of(1, 0, 0), outs, { rtol, atol: Float64Array.of(1e-12, 1e-16, 1e-12) });

  it('keeps the linear invariant y1 + y2 + y3 = 1 (each Newton stage preserves linear invariants)', () => {
    const r = run(1e-7);
    for (const s of r.states) expect(Math.abs(s[0]! + s[1]! + s[2]! - 1)).toBeLessThan(1e-12);
  });

  it('agrees with itself at a 100-fold tighter tolerance (self-convergence) within 1e-4 relative', () => {
    const a = run(1e-7), b = run(1e-9);
    a.states.forEach((s, k) => {
      for (let i = 0; i < 3; i++) expect(Math.abs(s[i]! - b.states[k]![i]!)).toBeLessThanOrEqual(1e-4 * Math.abs(b.states[k]![i]!) + 1e-16);
    });
    // y1(40) ≈ 0.7158 (Hairer & Wanner 1996, Table IV.10.1; from memory, a range only)
    expect(b.states[2]![0]).toBeGreaterThan(0.715);
    expect(b.states[2]![0]).toBeLessThan(0.717);
    expect(a.stats.steps).toBeLessThan(2000);
  });
});

describe('failure reasons', () => {
  it('throws ComputationError naming the time when the derivative becomes non-finite (blow-up y\' = y²)', () => {
    const sys = denseSystem(1, (_t, y, f) => { f[0] = y[0]! * y[0]!; }, (_t, y, J) => { J[0] = 2 * y[0]!; });
    expect(() => integrateImplicit(sys, 0, Float64Array.of(1), [2], { rtol: 1e-6 })).toThrow(ComputationError);
    expect(() => integrateImplicit(sys, 0, Float64Array.of(1), [2], { rtol: 1e-6 })).toThrow(/step size underflow|steps before|not finite/);
  });

  it('throws on a step budget that is too small', () => {
    const sys = denseSystem(1, (t, y, f) => { f[0] = -1e3 * (y[0]! - Math.sin(100 * t)); }, (_t, _y, J) => { J[0] = -1e3; });
    expect(() => integrateImplicit(sys, 0, Float64Array.of(0), [100], { rtol: 1e-8, maxSteps: 20 })).toThrow(/more than 20 steps/);
  });

  it('rejects output times that decrease', () => {
    const sys = denseSystem(1, (_t, y, f) => { f[0] = -y[0]!; }, (_t, _y, J) => { J[0] = -1; });
    expect(() => integrateImplicit(sys, 0, Float64Array.of(1), [2, 1])).toThrow(/increasing/);
  });

  it('returns y0 for an output time equal to the start, and reports statistics', () => {
    const sys = denseSystem(1, (_t, y, f) => { f[0] = -y[0]!; }, (_t, _y, J) => { J[0] = -1; });
    const r = integrateImplicit(sys, 0, Float64Array.of(1), [0, 1], { rtol: 1e-9, atol: 1e-14 });
    expect(r.states[0]![0]).toBe(1);
    expect(Math.abs(r.states[1]![0]! - Math.exp(-1))).toBeLessThan(1e-6 * Math.exp(-1)); // ≈ 100·rtol
    expect(r.stats.factorizations).toBeGreaterThan(0);
    expect(r.stats.maxAcceptedError).toBeLessThanOrEqual(1);
  });
});

function invert3(m: number[][]): number[][] {
  const [a, b, c] = m[0]!, [d, e, f] = m[1]!, [g, h, i] = m[2]!;
  const A = e! * i! - f! * h!, B = -(d! * i! - f! * g!), C = d! * h! - e! * g!;
  const det = a! * A + b! * B + c! * C;
  return [
    [A / det, -(b! * i! - c! * h!) / det, (b! * f! - c! * e!) / det],
    [B / det, (a! * i! - c! * g!) / det, -(a! * f! - c! * d!) / det],
    [C / det, -(a! * h! - b! * g!) / det, (a! * e! - b! * d!) / det],
  ];
}
