import { beforeAll, describe, expect, it } from 'vitest';
import { simulateFixedBed, type FixedBedResult } from '../../src/kinetics/fixedBed.js';
import { gacEstimate } from '../../src/gac/gacEstimate.js';
import { curveIntegral } from '../../src/kinetics/breakthroughCurve.js';
import { ComputationError, InputError } from '../../src/core/errors.js';
import { rosenBreakthrough, talbotBreakthrough, type LinearBed } from './fixedBedReference.js';
import { BED, TARGET, background, siteWater } from './fixedBedCases.js';

describe('fixed bed: linear isotherm against the analytic solution', () => {
  // Invented bed: ε = 0.4, R = 0.5 mm, ρp = 800 g/L, K = 20 L/g, Ds = 2e-13 m²/s, kf = 4e-5 m/s, EBCT 10 min
  const eps = 0.4, R = 0.5e-3, rhoP = 800, K = 20, Ds = 2e-13, kf = 4e-5, ebct = 600;
  const dTau = (Ds * ebct) / (R * R);
  const ref: LinearBed = { porosity: eps, dTau, X: 3 * dTau * rhoP * (1 - eps) * K, nu: (Ds * rhoP * K) / (R * kf) };

  it('Rosen (1952) integral and the Talbot inversion of the Laplace closed form agree (reference self-check)', () => {
    for (const tau of [3000, 6000, 9600, 14000, 20000]) {
      expect(Math.abs(rosenBreakthrough(ref, tau) - talbotBreakthrough(ref, tau))).toBeLessThan(1e-6);
    }
    // centre of mass of the curve: ε + ρ_bed·K (a mass balance); the curve passes 0.5 near it
    expect(rosenBreakthrough(ref, eps + rhoP * (1 - eps) * K)).toBeGreaterThan(0.45);
  });

  it('the model reproduces Rosen (1952) within 0.01 in c/c0 over the whole curve (60 cells, 5 grain points)', () => {
    const r = simulateFixedBed({ components: [{ id: 'A', c0MgPerL: 1, K, oneOverN: 1, dsM2PerS: Ds, kfMPerS: kf }], bed: { ebctS: ebct, bedDepthM: 1, porosity: eps, particleRadiusM: R, particleDensityKgPerM3: rhoP } }, { toBedVolumes: 30000, points: 61, cells: 60, interiorPoints: 5 });
    let worst = 0;
    r.bedVolumes.forEach((bv, k) => { if (bv > 0) worst = Math.max(worst, Math.abs(r.components[0]!.cOverC0[k]! - rosenBreakthrough(ref, bv))); });
    expect(worst).toBeLessThan(0.01);
    expect(r.components[0]!.cOverC0.at(-1)!).toBeGreaterThan(0.999); // the run covers the whole curve
    expect(r.massBalanceError).toBeLessThan(1e-10);
  });
});

describe('fixed bed: mass balances', () => {
  it('single solute (Freundlich 1/n = 0.3): ∫(1 − c/c0) dBV over the whole curve = ε + ρ_bed·q(c0)/c0 within 1e-3', () => {
    // fixed bed, single solute: a mass balance, exact for any kinetics (closed form)
    const comp = { id: 'S', c0MgPerL: 0.5, K: 40, oneOverN: 0.3, dsM2PerS: 5e-14, kfMPerS: 3e-5 };
    const expected = BED.porosity + (BED.particleDensityKgPerM3 * (1 - BED.porosity) * comp.K * Math.pow(comp.c0MgPerL, comp.oneOverN)) / comp.c0MgPerL;
    const r = simulateFixedBed({ components: [comp], bed: BED }, { toBedVolumes: 2.5 * expected, points: 1001 });
    const c = r.components[0]!;
    const end = r.bedVolumes.at(-1)!;
    expect(c.cOverC0.at(-1)!).toBeGreaterThan(0.9999);
    const area = end - curveIntegral({ bedVolumes: r.bedVolumes, cOverC0: c.cOverC0 }, end);
    expect(Math.abs(area - expected) / expected).toBeLessThan(1e-3);
    expect(r.massBalanceError).toBeLessThan(1e-5);
  });
});

describe('fixed bed: DOC preloading, grids, mass balance in the site water', () => {
  let site4: FixedBedResult, site6: FixedBedResult, alone: FixedBedResult, fine4: FixedBedResult;
  const run = { toBedVolumes: 45000, points: 226 };
  beforeAll(() => {
    site4 = simulateFixedBed(siteWater(4), run);
    site6 = simulateFixedBed(siteWater(6), run);
    alone = simulateFixedBed({ components: [TARGET], bed: BED }, run);
    fine4 = simulateFixedBed(siteWater(4), { ...run, cells: 120, interiorPoints: 10 });
  });
  const bv = (r: FixedBedResult, id: string, level: number) => r.components.find((c) => c.id === id)!.breakthrough.find((b) => b.cOverC0 === level)!.bedVolumes;

  it('fed − left = held in the pores and on the carbon, within 1e-5 relative, for every component', () => {
    for (const r of [site4, site6, alone, fine4]) {
      expect(r.massBalanceError).toBeLessThan(1e-5);
      for (const c of r.components) expect(c.massBalanceError).toBeLessThan(1e-5);
    }
  });

  it('the target breaks through far earlier than alone, earlier as DOC rises, and not after the equilibrium bound', () => {
    const t4 = bv(site4, 'T', 0.1)!, t6 = bv(site6, 'T', 0.1)!;
    expect(t4).toBeGreaterThan(0);
    expect(t6).toBeLessThan(0.8 * t4);
    // alone: nothing leaves the bed within the whole run (its own bound is ρ_bed·K·c0^(1/n)/c0 ≈ 6.6e6 BV)
    expect(Math.max(...alone.components[0]!.cOverC0)).toBeLessThan(1e-6);
    for (const [doc, r] of [[4, site4], [6, site6]] as const) {
      const bound = gacEstimate({
        targets: [{ id: 'T', c0MgPerL: TARGET.c0MgPerL, K: TARGET.K, oneOverN: TARGET.oneOverN }],
        background: background(doc).map((c) => ({ id: c.id, c0MgPerL: c.c0MgPerL, K: c.K, oneOverN: c.oneOverN })),
        bedDensityKgPerM3: BED.particleDensityKgPerM3 * (1 - BED.porosity),
      }).targets[0]!.bedVolumes;
      expect(bv(r, 'T', 0.1)!).toBeLessThan(bound);
      expect(bv(r, 'T', 0.2)!).toBeLessThan(bound);
    }
  });

  it('twice the axial cells and grain points change the bed volumes at c/c0 = 0.1 and 0.5 by < 0.5 %', () => {
    for (const id of ['T', 'F2']) for (const level of [0.1, 0.5]) {
      const a = bv(site4, id, level)!, b = bv(fine4, id, level)!;
      expect(Math.abs(a - b) / b).toBeLessThan(0.005);
    }
    expect(site4.grid).toEqual({ cells: 60, interiorPoints: 5 });
    expect(fine4.grid).toEqual({ cells: 120, interiorPoints: 10 });
  });

  it('DOC and UV254 outlets are the c0- and absorbance-weighted sums of the components (Beer–Lambert additivity)', () => {
    const comps = siteWater(4).components;
    const k = 100;
    const doc = comps.filter((c) => c.doc).reduce((s, c, i) => s + c.c0MgPerL * site4.components[i]!.cOverC0[k]!, 0) / 4;
    expect(site4.doc!.doc0MgPerL).toBeCloseTo(4, 12);
    expect(site4.doc!.cOverC0[k]).toBeCloseTo(doc, 12);
    const uv0 = comps.reduce((s, c) => s + (c.uv254PerMgPerL ?? 0) * c.c0MgPerL, 0);
    const uv = comps.reduce((s, c, i) => s + (c.uv254PerMgPerL ?? 0) * c.c0MgPerL * site4.components[i]!.cOverC0[k]!, 0);
    expect(site4.uv254!.ratio[k]).toBeCloseTo(uv / uv0, 12);
    // the non-adsorbable part arrives after one pore volume (plug flow)
    expect(bv(site4, 'N', 0.5)).toBe(BED.porosity);
  });
});

describe('fixed bed: inputs', () => {
  const base = siteWater(4);
  it('names the component and field of a missing Ds, DL/kf, grain size; rejects a non-positive EBCT', () => {
    const noDs = { ...base, components: base.components.map((c) => (c.id === 'T' ? { ...c, dsM2PerS: undefined } : c)) };
    expect(() => simulateFixedBed(noDs, { toBedVolumes: 10 })).toThrow(/components\[3\]\.Ds.*"T" has no surface diffusivity/);
    const noFilm = { ...base, components: base.components.map((c) => (c.id === 'T' ? { ...c, kfMPerS: undefined } : c)) };
    expect(() => simulateFixedBed(noFilm, { toBedVolumes: 10 })).toThrow(/components\[3\]\.DL/);
    expect(() => simulateFixedBed({ ...base, bed: { ...BED, particleRadiusM: undefined as unknown as number } }, { toBedVolumes: 10 })).toThrow(/carbon\.particle_radius/);
    expect(() => simulateFixedBed({ ...base, bed: { ...BED, ebctS: 0 } }, { toBedVolumes: 10 })).toThrow(InputError);
    expect(() => simulateFixedBed(base, { toBedVolumes: -1 })).toThrow(InputError);
  });
  it('a grid below 3 cells is a ComputationError with the reason', () => {
    expect(() => simulateFixedBed(base, { toBedVolumes: 10, cells: 2 })).toThrow(ComputationError);
  });
});
