/**
 * The variable-order NDF integrator (bdfIntegrator) against closed forms: a stiff linear system
 * with known exponentials, the Prothero–Robinson problem (exact solution g(t)), Robertson's stiff
 * kinetics (a linear invariant and self-convergence), outputs between steps, the replay (same
 * steps and orders: identical results, smooth in a parameter), and the failure reasons.
 */
import { describe, expect, it } from 'vitest';
import { integrateBdf } from '../../src/kinetics/bdfIntegrator.js';
import { integrateImplicit, type StiffSystem } from '../../src/kinetics/implicitIntegrator.js';
import { denseLu } from '../../src/kinetics/denseLu.js';
import { logTime, logTimeSystem } from '../../src/kinetics/logTimeSystem.js';
import { ComputationError } from '../../src/core/errors.js';

/** A dense system with an analytic Jacobian, for the tests. */
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

// y' = A y with A = P·diag(−1, −1e3, −1e6)·P⁻¹ (closed form exp(At)·y0)
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
const linear = denseSystem(3, (_t, y, f) => {
  for (let i = 0; i < 3; i++) f[i] = A[i * 3]! * y[0]! + A[i * 3 + 1]! * y[1]! + A[i * 3 + 2]! * y[2]!;
}, (_t, _y, J) => J.set(A));

describe('stiff linear system with known exponentials (closed form)', () => {
  const y0 = [1, 2, -1];
  const outs = [1e-4, 1e-2, 0.5, 1, 3, 10];

  it('matches exp(At)·y0 at the output times (between steps: the interpolating polynomial) within 1e-5 relative at rtol 1e-8', () => {
    const r = integrateBdf(linear, 0, Float64Array.from(y0), outs, { rtol: 1e-8, atol: 1e-12 });
    r.states.forEach((s, k) => {
      const e = exact(outs[k]!, y0);
      for (let i = 0; i < 3; i++) expect(Math.abs(s[i]! - e[i]!)).toBeLessThan(1e-5 * Math.max(1e-3, Math.abs(e[i]!)));
    });
    expect(r.times).toEqual(outs);
    // the last output is stepped onto; the others fall between steps
    expect(r.stepTimes[r.stepTimes.length - 1]).toBe(10);
  });

  it('raises the order to 5 and needs several times fewer steps than the second-order TR-BDF2 at rtol 1e-8', () => {
    const r = integrateBdf(linear, 0, Float64Array.from(y0), [10], { rtol: 1e-8, atol: 1e-12 });
    const tr = integrateImplicit(linear, 0, Float64Array.from(y0), [10], { rtol: 1e-8, atol: 1e-12 });
    expect(Math.max(...r.stepOrders)).toBe(5);
    expect(r.stats.steps * 3).toBeLessThan(tr.stats.steps);
    // the Newton matrix is kept across steps: fewer factorisations than steps
    expect(r.stats.factorizations).toBeLessThan(r.stats.steps);
  });

  it('converges: the error at t = 2 stays within rtol·max|y| at rtol 1e-6 and 1e-8, and falls at least 4-fold between them', () => {
    const err = (rtol: number) => {
      const r = integrateBdf(linear, 0, Float64Array.from(y0), [2], { rtol, atol: rtol * 1e-3 });
      const e = exact(2, y0);
      return Math.max(...[0, 1, 2].map((i) => Math.abs(r.states[0]![i]! - e[i]!)));
    };
    const coarse = err(1e-6), fine = err(1e-8);
    expect(coarse).toBeLessThan(1e-6 * 2.5);
    expect(fine).toBeLessThan(1e-8 * 2.5);
    expect(fine).toBeLessThan(coarse / 4);
  });
});

describe('Prothero–Robinson problem y\' = λ(y − g) + g\', exact solution y = g (closed form)', () => {
  for (const lambda of [-1e2, -1e6, -1e10]) {
    it(`λ = ${lambda}: y(t) = sin t within 1e-6`, () => {
      const sys = denseSystem(1, (t, y, f) => { f[0] = lambda * (y[0]! - Math.sin(t)) + Math.cos(t); }, (_t, _y, J) => { J[0] = lambda; });
      const outs = [0.5, 1, 2, 5];
      const r = integrateBdf(sys, 0, Float64Array.of(0), outs, { rtol: 1e-8, atol: 1e-10 });
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
  const run = (rtol: number) => integrateBdf(sys, 0, Float64Array.of(1, 0, 0), outs, { rtol, atol: Float64Array.of(1e-12, 1e-16, 1e-12) });

  it('keeps the linear invariant y1 + y2 + y3 = 1 (the corrector and the interpolation preserve linear invariants)', () => {
    for (const s of run(1e-7).states) expect(Math.abs(s[0]! + s[1]! + s[2]! - 1)).toBeLessThan(1e-12);
  });

  it('agrees with itself at a 100-fold tighter tolerance (self-convergence) within 1e-4 relative', () => {
    const a = run(1e-7), b = run(1e-9);
    a.states.forEach((s, k) => {
      for (let i = 0; i < 3; i++) expect(Math.abs(s[i]! - b.states[k]![i]!)).toBeLessThanOrEqual(1e-4 * Math.abs(b.states[k]![i]!) + 1e-16);
    });
    // y1(40) ≈ 0.7158 (Hairer & Wanner 1996, Table IV.10.1; from memory, a range only)
    expect(b.states[2]![0]).toBeGreaterThan(0.715);
    expect(b.states[2]![0]).toBeLessThan(0.717);
  });
});

describe('replay', () => {
  const decay = (k: number) => denseSystem(1, (_t, y, f) => { f[0] = -k * y[0]!; }, (_t, _y, J) => { J[0] = -k; });

  it('the same steps and orders give the same result within the corrector tolerance', () => {
    const r = integrateBdf(decay(1), 0, Float64Array.of(1), [0.5, 3], { rtol: 1e-6, atol: 1e-12 });
    const again = integrateBdf(decay(1), 0, Float64Array.of(1), [0.5, 3], { stepTimes: r.stepTimes, stepOrders: r.stepOrders });
    expect(again.stepTimes).toEqual(r.stepTimes);
    expect(again.stepOrders).toEqual(r.stepOrders);
    again.states.forEach((s, k) => expect(Math.abs(s[0]! - r.states[k]![0]!)).toBeLessThan(1e-8));
  });

  it('is smooth in a parameter: the difference quotient of y(3) in k matches d/dk e^(−3k) = −3e^(−3k) within 1e-4 relative (closed form)', () => {
    const r = integrateBdf(decay(1), 0, Float64Array.of(1), [3], { rtol: 1e-8, atol: 1e-14 });
    const at = (k: number) => integrateBdf(decay(k), 0, Float64Array.of(1), [3], { stepTimes: r.stepTimes, stepOrders: r.stepOrders }).states[0]![0]!;
    const h = 1e-5;
    const dq = (at(1 + h) - at(1 - h)) / (2 * h);
    expect(Math.abs(dq / (-3 * Math.exp(-3)) - 1)).toBeLessThan(1e-4);
  });

  it('replayTolerance loosens the replayed corrector (y\' = −y², y = 1/(1 + t)): within 1e-8 of the default replay (the closed form within 1e-5, the integration error at rtol 1e-6)', () => {
    const square = denseSystem(1, (_t, y, f) => { f[0] = -y[0]! * y[0]!; }, (_t, y, J) => { J[0] = -2 * y[0]!; });
    const r = integrateBdf(square, 0, Float64Array.of(1), [1, 10], { rtol: 1e-6, atol: 1e-12 });
    const replay = (replayTolerance?: number) => integrateBdf(square, 0, Float64Array.of(1), [1, 10], { stepTimes: r.stepTimes, stepOrders: r.stepOrders, rtol: 1e-6, atol: 1e-12, ...(replayTolerance ? { replayTolerance } : {}) });
    const tight = replay(), loose = replay(1e-3);
    expect(loose.stats.newtonIterations).toBeLessThanOrEqual(tight.stats.newtonIterations);
    loose.states.forEach((s, k) => {
      expect(Math.abs(s[0]! - tight.states[k]![0]!)).toBeLessThan(1e-8);
      expect(Math.abs(s[0]! - 1 / (1 + loose.times[k]!))).toBeLessThan(1e-5);
    });
  });

  it('replayFactorEveryStep refactorises at every replayed step (y\' = −y²): within 1e-8 of the default replay, with no more corrector iterations', () => {
    const square = denseSystem(1, (_t, y, f) => { f[0] = -y[0]! * y[0]!; }, (_t, y, J) => { J[0] = -2 * y[0]!; });
    const r = integrateBdf(square, 0, Float64Array.of(1), [1, 10], { rtol: 1e-6, atol: 1e-12 });
    const opts = { stepTimes: r.stepTimes, stepOrders: r.stepOrders, rtol: 1e-6, atol: 1e-12 };
    const onChange = integrateBdf(square, 0, Float64Array.of(1), [1, 10], opts);
    const every = integrateBdf(square, 0, Float64Array.of(1), [1, 10], { ...opts, replayFactorEveryStep: true });
    expect(every.stats.factorizations).toBe(r.stepTimes.length);
    expect(every.stats.newtonIterations).toBeLessThanOrEqual(onChange.stats.newtonIterations);
    every.states.forEach((s, k) => expect(Math.abs(s[0]! - onChange.states[k]![0]!)).toBeLessThan(1e-8));
  });

  it('rejects a replay without one order per step; stretches steps that end elsewhere to the last output', () => {
    expect(() => integrateBdf(decay(1), 0, Float64Array.of(1), [1], { stepTimes: [0.5, 1] })).toThrow(/one order per step/);
    const r = integrateBdf(decay(1), 0, Float64Array.of(1), [1], { stepTimes: [0.25, 0.5], stepOrders: [1, 2] });
    expect(r.stepTimes).toEqual([0.5, 1]);
  });
});

describe('logarithmic time (logTimeSystem)', () => {
  it('y\' = −y in s = ln(1 + t/t_c) gives y(t) = e^(−t) at t = 0.1, 1, 10 within 1e-6 (closed form)', () => {
    const sys = denseSystem(1, (_t, y, f) => { f[0] = -y[0]!; }, (_t, _y, J) => { J[0] = -1; });
    const outs = [0.1, 1, 10];
    const r = integrateBdf(logTimeSystem(sys, 0.01), 0, Float64Array.of(1), outs.map((t) => logTime(t, 0.01)), { rtol: 1e-9, atol: 1e-14 });
    r.states.forEach((s, k) => expect(Math.abs(s[0]! - Math.exp(-outs[k]!))).toBeLessThan(1e-6));
  });
});

describe('failure reasons', () => {
  it('throws ComputationError when the solution blows up (y\' = y², y(0) = 1, pole at t = 1)', () => {
    const sys = denseSystem(1, (_t, y, f) => { f[0] = y[0]! * y[0]!; }, (_t, y, J) => { J[0] = 2 * y[0]!; });
    expect(() => integrateBdf(sys, 0, Float64Array.of(1), [2], { rtol: 1e-6 })).toThrow(ComputationError);
    expect(() => integrateBdf(sys, 0, Float64Array.of(1), [2], { rtol: 1e-6 })).toThrow(/step size underflow|steps before|not finite/);
  });

  it('throws on a step budget that is too small, and rejects decreasing output times', () => {
    const sys = denseSystem(1, (t, y, f) => { f[0] = -1e3 * (y[0]! - Math.sin(100 * t)); }, (_t, _y, J) => { J[0] = -1e3; });
    expect(() => integrateBdf(sys, 0, Float64Array.of(0), [100], { rtol: 1e-8, maxSteps: 20 })).toThrow(/more than 20 steps/);
    expect(() => integrateBdf(sys, 0, Float64Array.of(0), [2, 1])).toThrow(/increasing/);
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
