/**
 * PAC contact kinetics (HSDM with film transfer and IAST at the particle surface): checks against
 * Crank (1975) with a linear isotherm, the exact batch balance, the batch IAST limit, grid
 * refinement, the trace argument (Knappe et al. 1998) and the stirred contact reactor.
 */
import { describe, expect, it } from 'vitest';
import { prepareKinetics, type KineticComponent } from '../../src/kinetics/kineticMixture.js';
import { DEFAULT_INTERIOR_POINTS, pacBatch } from '../../src/kinetics/pacBatch.js';
import { hsdmParticleSystem } from '../../src/kinetics/hsdmParticleSystem.js';
import { sphereCollocation } from '../../src/kinetics/sphereCollocation.js';
import { integrateImplicit } from '../../src/kinetics/implicitIntegrator.js';
import { LONG_AGE_NUMBER, stirredGridPoints, stirredReactor, stirredReactorFrom } from '../../src/kinetics/stirredReactor.js';
import { prepareMixture } from '../../src/equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { brentRoot } from '../../src/numerics/brent.js';
import { InputError } from '../../src/core/errors.js';

const R = 1e-5; // m
const RHO = 650; // g/L
const particle = { radiusM: R, densityGPerL: RHO };

/** Crank (1975) eq. 6.30: fractional uptake of a sphere in a stirred solution of limited volume,
 *  roots of tan q = 3q/(3 + αq²); 400 terms (the series is summed far past its 1e-12 tail). */
function crank630(alpha: number): (tau: number) => number {
  const roots: number[] = [];
  for (let n = 1; n <= 400; n++) roots.push(brentRoot((q) => (3 + alpha * q * q) * Math.sin(q) - 3 * q * Math.cos(q), n * Math.PI + 1e-9, (n + 1) * Math.PI - 1e-9).x);
  return (tau) => 1 - roots.reduce((s, q) => s + (6 * alpha * (alpha + 1) * Math.exp(-q * q * tau)) / (9 + 9 * alpha + q * q * alpha * alpha), 0);
}

/** Crank (1975) eq. 6.20: sphere at constant surface concentration. */
function crank620(tau: number): number {
  let s = 0;
  for (let n = 1; n <= 2000; n++) s += Math.exp(-n * n * Math.PI * Math.PI * tau) / (n * n);
  return 1 - (6 / (Math.PI * Math.PI)) * s;
}

/** The invented 6-component water of the speed target: non-adsorbable, 4 fictive DOC, one trace target. */
function water(targetC0 = 1e-4): KineticComponent[] {
  const doc = { oneOverN: 0.2, dsM2PerS: 5e-17, dlM2PerS: 5e-10 };
  return [
    { id: 'N', c0MgPerL: 1, K: 0, oneOverN: 1 },
    { id: 'F1', c0MgPerL: 1, K: 5, ...doc },
    { id: 'F2', c0MgPerL: 1.5, K: 20, ...doc },
    { id: 'F3', c0MgPerL: 1, K: 60, ...doc },
    { id: 'F4', c0MgPerL: 0.5, K: 150, ...doc },
    { id: 'T', c0MgPerL: targetC0, K: 200, oneOverN: 0.4, dsM2PerS: 2e-16, dlM2PerS: 7e-10 },
  ];
}

describe('linear isotherm, very large kf: Crank (1975)', () => {
  const Ds = 1e-15, K = 100;
  const taus = [0.005, 0.02, 0.05, 0.1, 0.3, 1];
  for (const dose of [0.01, 0.003]) {
    it(`eq. 6.30 (limited volume, α = 1/(D·K) = ${1 / (dose * K)}): fractional uptake within 1e-4`, () => {
      const alpha = 1 / (dose * K);
      const ref = crank630(alpha);
      const pk = prepareKinetics([{ id: 'a', c0MgPerL: 1, K, oneOverN: 1, dsM2PerS: Ds, kfMPerS: 10 }], particle);
      const r = pacBatch(pk, dose, taus.map((t) => (t * R * R) / Ds));
      const qInf = 1 / (1 + alpha); // fraction of the solute on the carbon at equilibrium
      taus.forEach((tau, k) => expect(Math.abs((1 - r.cMgPerL[k]![0]!) / qInf - ref(tau))).toBeLessThan(1e-4));
    });
  }

  it('eq. 6.20 (constant surface concentration): q̄/(K·c) within 1e-4', () => {
    const pk = prepareKinetics([{ id: 'a', c0MgPerL: 1, K, oneOverN: 1, dsM2PerS: Ds, kfMPerS: 10 }], particle);
    const c = 0.4;
    const sys = hsdmParticleSystem(pk, 0.01, sphereCollocation(16), { kind: 'fixed', cMgPerL: Float64Array.of(c), meanAgeS: 1e30 });
    const run = integrateImplicit(sys, 0, sys.initialState(), taus.map((t) => (t * R * R) / Ds), { rtol: 1e-5, atol: 1e-8 });
    taus.forEach((tau, k) => expect(Math.abs(sys.meanLoading(run.states[k]!, 0) / (K * c) - crank620(tau))).toBeLessThan(1e-4));
  });
});

describe('batch contact of the 6-component water', () => {
  const times = [60, 300, 900, 1800, 3600, 86400];
  const pk = prepareKinetics(water(), particle);
  const r = pacBatch(pk, 0.02, times);

  it('mass balance c0 = c + D·q̄ at every output time within 1e-8 relative, all components (exact by construction)', () => {
    r.cMgPerL.forEach((c, k) => {
      water().forEach((comp, i) => {
        expect(Math.abs(c[i]! + 0.02 * r.qMeanMgPerG[k]![i]! - comp.c0MgPerL)).toBeLessThanOrEqual(1e-8 * comp.c0MgPerL);
      });
    });
  });

  it('non-adsorbable component stays at c0; removal of the target and the strongest DOC rises with time', () => {
    r.cMgPerL.forEach((c) => expect(c[0]).toBe(1));
    for (const i of [4, 5]) for (let k = 1; k < times.length; k++) expect(r.cMgPerL[k]![i]!).toBeLessThan(r.cMgPerL[k - 1]![i]!);
  });

  it('doubling the particle grid (16 → 32 interior points) changes removals by < 1e-4 from 5 min on', () => {
    const fine = pacBatch(pk, 0.02, times, { interiorPoints: 32, rtol: 1e-6 });
    water().forEach((comp, i) => {
      if (!(comp.K > 0)) return;
      for (let k = 1; k < times.length; k++) {
        expect(Math.abs(r.cMgPerL[k]![i]! - fine.cMgPerL[k]![i]!) / comp.c0MgPerL).toBeLessThan(1e-4);
      }
    });
  });

  it('trace target: the fraction removed at a given time does not depend on its C0 (Knappe et al. 1998, carried to kinetics)', () => {
    const a = pacBatch(prepareKinetics(water(1e-4), particle), 0.02, times);
    const b = pacBatch(prepareKinetics(water(1e-6), particle), 0.02, times);
    times.forEach((_, k) => expect(Math.abs(a.cMgPerL[k]![5]! / 1e-4 - b.cMgPerL[k]![5]! / 1e-6)).toBeLessThan(1e-10));
  });

  it('tends to the batch IAST equilibrium (src/equilibrium) at long times within 1e-6 (every component coupled)', () => {
    const comps = water(0.05);
    const all = prepareKinetics(comps, particle, { traceRatio: 0 });
    const late = pacBatch(all, 0.02, [1e3 * R * R / 5e-17]);
    const eq = solveBatchPrepared(prepareMixture(comps), 0.02);
    comps.forEach((comp, i) => expect(Math.abs(late.cMgPerL[0]![i]! - eq.cMgPerL[i]!) / comp.c0MgPerL).toBeLessThan(1e-6));
  });

  it('names the component and field of a missing kinetic input', () => {
    const comps = water();
    delete comps[2]!.dsM2PerS;
    expect(() => prepareKinetics(comps, particle)).toThrow(InputError);
    expect(() => prepareKinetics(comps, particle)).toThrow(/components\[2\]\.Ds.*"F2" has no surface diffusivity Ds/);
    const noFilm = water();
    delete noFilm[5]!.dlM2PerS;
    expect(() => prepareKinetics(noFilm, particle)).toThrow(/"T" has neither a liquid diffusivity DL nor a film coefficient kf/);
    expect(() => prepareKinetics(water(), undefined)).toThrow(/field carbon/);
  });
});

describe('stirred contact reactor at steady state', () => {
  it('linear isotherm, large kf: matches Crank eq. 6.20 averaged over exp(−t/θ)/θ within 1e-4 (closed form)', () => {
    // ∫ q̄ E dt = K·c·(1 − (6/π²) Σ 1/(n²(1 + n²π²·Ds·θ/R²))), so c_out = c0/(1 + D·K·F(θ))
    const Ds = 1e-15, K = 100, D = 0.01;
    const pk = prepareKinetics([{ id: 'a', c0MgPerL: 1, K, oneOverN: 1, dsM2PerS: Ds, kfMPerS: 10 }], particle);
    for (const thetaTau of [0.01, 0.1, 1]) {
      const theta = (thetaTau * R * R) / Ds;
      let s = 0;
      for (let n = 1; n <= 20000; n++) s += 1 / (n * n * (1 + n * n * Math.PI * Math.PI * thetaTau));
      const F = 1 - (6 / (Math.PI * Math.PI)) * s;
      const r = stirredReactor(pk, D, Math.min(theta, 1800), theta);
      expect(Math.abs(r.cMgPerL[0]! - 1 / (1 + D * K * F))).toBeLessThan(1e-4);
    }
  });

  const small: KineticComponent[] = [
    { id: 'N', c0MgPerL: 1, K: 0, oneOverN: 1 },
    { id: 'F1', c0MgPerL: 2, K: 20, oneOverN: 0.2, dsM2PerS: 5e-17, dlM2PerS: 5e-10 },
    { id: 'F2', c0MgPerL: 1, K: 80, oneOverN: 0.2, dsM2PerS: 5e-17, dlM2PerS: 5e-10 },
    { id: 'T', c0MgPerL: 1e-4, K: 150, oneOverN: 0.35, dsM2PerS: 2e-16, dlM2PerS: 7e-10 },
  ];
  const pk = prepareKinetics(small, particle);
  const tau = 1800;
  const ages = [tau, 86400, 10 * 86400, 1e3 * R * R / 5e-17];
  const results = ages.map((a) => stirredReactor(pk, 0.015, tau, a));
  // equilibrium of the same water with the trace target left out of the competition (trace form)
  const eqBg = solveBatchPrepared(prepareMixture(small.slice(0, 3)), 0.015);

  it('removal rises with the carbon age; with θ = τ it stays below the equilibrium removal', () => {
    for (const i of [2, 3]) for (let k = 1; k < ages.length; k++) expect(results[k]!.cMgPerL[i]!).toBeLessThan(results[k - 1]!.cMgPerL[i]!);
    expect(results[0]!.cMgPerL[2]!).toBeGreaterThan(eqBg.cMgPerL[2]!);
  });

  it('tends to the batch equilibrium at the same dose as the carbon age grows: within 1e-6 of c0 at θ = 1e5·R²/Ds, the gap falling as 1/θ', () => {
    const gaps = results.map((r) => Math.abs(r.cMgPerL[2]! - eqBg.cMgPerL[2]!));
    for (let k = 1; k < gaps.length; k++) expect(gaps[k]!).toBeLessThan(gaps[k - 1]!);
    // the deficit of a particle averaged over exp(−t/θ)/θ falls as 1/θ (for a linear particle
    // (6/π²)Σ1/(n²(1 + n²π²x)) → 1/(15x), x = Ds·θ/R²; closed form): 100 × θ, gap / ~100
    const far = [1e3, 1e5].map((f) => stirredReactor(pk, 0.015, tau, (f * R * R) / 5e-17));
    for (const i of [1, 2]) expect(Math.abs(far[1]!.cMgPerL[i]! - eqBg.cMgPerL[i]!) / small[i]!.c0MgPerL).toBeLessThan(1e-6);
    const g3 = Math.abs(far[0]!.cMgPerL[2]! - eqBg.cMgPerL[2]!), g5 = Math.abs(far[1]!.cMgPerL[2]! - eqBg.cMgPerL[2]!);
    expect(g3 / g5).toBeGreaterThan(50);
    expect(g3 / g5).toBeLessThan(200);
  });

  it('reports the carbon held D·θ/τ and closes every balance c0 − c_out = D·∫q̄E', () => {
    results.forEach((r, k) => {
      expect(r.carbonHeldGPerL).toBeCloseTo((0.015 * ages[k]!) / tau, 12);
      small.forEach((comp, i) => expect(Math.abs(comp.c0MgPerL - r.cMgPerL[i]! - 0.015 * r.qMeanMgPerG[i]!)).toBeLessThan(1e-6 * comp.c0MgPerL));
    });
  });

  it('default grid (8 points from Ds·θ/R² = 0.1 on, stirredGridPoints): doubling it changes c/c0 by < 1e-4 at the switch (the issue\'s grid criterion)', () => {
    const theta = (LONG_AGE_NUMBER * R * R) / 5e-17; // the smallest Ds of `small`
    expect(stirredGridPoints(pk, theta)).toBe(8);
    expect(stirredGridPoints(pk, 0.99 * theta)).toBe(DEFAULT_INTERIOR_POINTS);
    for (const dose of [0.015, 0.05]) {
      const coarse = stirredReactor(pk, dose, tau, theta);
      const doubled = stirredReactor(pk, dose, tau, theta, { interiorPoints: 16 });
      small.forEach((comp, i) => { if (comp.K > 0) expect(Math.abs(coarse.cMgPerL[i]! - doubled.cMgPerL[i]!) / comp.c0MgPerL, `${comp.id} at ${dose * 1000} mg/L`).toBeLessThan(1e-4); });
    }
  });

  it('hardly depends on the start: warm from a solve at another dose (stirredReactorFrom), c/c0 within 5e-8 of the cold solve (the final run closes the balance within a quarter of its 1e-7)', () => {
    for (const theta of [tau, 86400, 10 * 86400]) for (const [dose, near] of [[0.015, 0.02], [0.015, 0.009]] as const) {
      const cold = stirredReactor(pk, dose, tau, theta);
      const from = stirredReactor(pk, near, tau, theta);
      const warm = stirredReactorFrom(pk, dose, tau, theta, {}, Float64Array.from(pk.coupled, (i) => from.cMgPerL[i]! / small[i]!.c0MgPerL), from.balanceJacobian, near);
      small.forEach((comp, i) => expect(Math.abs(warm.cMgPerL[i]! - cold.cMgPerL[i]!) / comp.c0MgPerL, `${comp.id}, θ = ${theta} s, from ${near * 1000} mg/L`).toBeLessThan(5e-8));
    }
  });

  it('rejects a carbon age below the contact time naming --carbon-age', () => {
    expect(() => stirredReactor(pk, 0.015, 1800, 600)).toThrow(/option --carbon-age: the mean carbon age \(600 s\) cannot be below the contact time/);
  });
});
