/**
 * The trace shortcut (src/kinetics/fixedBedBackground.ts, traceBed in src/kinetics/fixedBed.ts):
 * the background solved once and each trace target integrated alone against its stored surface
 * history equals the coupled solve of every component at once (simulateFixedBed). Expected values:
 * the model against itself (no source); the tolerances are those the grid tests use (0.5 % on the
 * bed volumes at c/c0 0.1 and 0.5, the acceptance figure) and 1e-3 in c/c0 pointwise
 * (the coupled solve's own integration error at its tolerances is of that order).
 */
import { describe, expect, it } from 'vitest';
import { simulateFixedBed, traceBed } from '../../src/kinetics/fixedBed.js';
import { firstCrossing } from '../../src/kinetics/breakthroughCurve.js';
import { InputError } from '../../src/core/errors.js';
import { BED, TARGET, background } from './fixedBedCases.js';

describe('fixed bed: trace targets against a stored background', () => {
  const grid = { cells: 30, interiorPoints: 4 };
  const bvs = Array.from({ length: 60 }, (_, k) => 1500 * (k + 1)); // to 90 000 BV: the whole front of both targets
  const targets = [TARGET, { ...TARGET, id: 'T2', c0MgPerL: 2e-4, K: 40, oneOverN: 0.45, dsM2PerS: 4e-14, kfMPerS: undefined, dlM2PerS: 8e-10 }];
  const coupled = simulateFixedBed({ components: [...background(4), ...targets], bed: BED }, { toBedVolumes: bvs[bvs.length - 1]!, outputBedVolumes: bvs, ...grid });
  const traced = traceBed({ components: background(4), bed: BED }, { outputBedVolumes: bvs, ...grid });

  it('each target alone equals the coupled solve: c/c0 within 1e-3, BV at c/c0 0.1 and 0.5 within 0.5 %', () => {
    for (const t of targets) {
      const full = coupled.components.find((c) => c.id === t.id)!;
      expect(full.trace).toBe(true);
      const alone = traced.outlet(t);
      expect(alone.cOverC0.length).toBe(full.cOverC0.length);
      alone.cOverC0.forEach((v, k) => expect(Math.abs(v - full.cOverC0[k]!), `${t.id} at ${coupled.bedVolumes[k]} BV`).toBeLessThan(1e-3));
      for (const level of [0.1, 0.5]) {
        const a = firstCrossing({ bedVolumes: coupled.bedVolumes, cOverC0: alone.cOverC0 }, level);
        const b = firstCrossing({ bedVolumes: coupled.bedVolumes, cOverC0: full.cOverC0 }, level);
        expect(a, `${t.id} reaches ${level}`).not.toBeNull();
        expect(Math.abs(a! / b! - 1), `${t.id} at ${level}: ${a} against ${b}`).toBeLessThan(0.005);
      }
      expect(alone.massBalanceError).toBeLessThan(1e-5);
    }
  });

  it('simulateFixedBed with storedBackground (background first, each trace alone) equals the coupled solve, also when stopped early, and hands its background on', () => {
    const inputs = { components: [...background(4), ...targets], bed: BED };
    const split = simulateFixedBed(inputs, { toBedVolumes: bvs[bvs.length - 1]!, outputBedVolumes: bvs, ...grid, storedBackground: true });
    expect(split.components.map((c) => c.id)).toEqual(coupled.components.map((c) => c.id));
    split.components.forEach((c, i) => c.cOverC0.forEach((v, k) => expect(Math.abs(v - coupled.components[i]!.cOverC0[k]!), `${c.id} at ${bvs[k - 1]} BV`).toBeLessThan(1e-3)));
    expect(split.massBalanceError).toBeLessThan(1e-5);
    expect(split.stepTimes).toBeUndefined();
    // the stored background is the one traceBed solves (the same model, tolerances and grid)
    const again = split.storedBackground!.outlet(TARGET);
    traced.outlet(TARGET).cOverC0.forEach((v, k) => expect(again.cOverC0[k]).toBe(v));
    // stopped early (segments of the background, then of each trace): the curves agree with the whole split run
    const stopped = simulateFixedBed(inputs, { toBedVolumes: bvs[bvs.length - 1]!, outputBedVolumes: bvs, ...grid, storedBackground: true, stopWhen: (bv) => bv[bv.length - 1]! >= 30000 });
    const n = stopped.bedVolumes.length;
    expect(n).toBeLessThan(split.bedVolumes.length);
    stopped.components.forEach((c, i) => c.cOverC0.forEach((v, k) => expect(Math.abs(v - split.components[i]!.cOverC0[k]!)).toBeLessThan(1e-3)));
    expect(stopped.storedBackground!.bedVolumes.length).toBe(n);
    expect(stopped.massBalanceError).toBeLessThan(1e-5);
  });

  it('a replay of the steps gives the same outlet, and a target that is not a trace is refused', () => {
    const first = traced.outlet(TARGET);
    const again = traced.outlet(TARGET, { stepTimes: first.stepTimes });
    again.cOverC0.forEach((v, k) => expect(Math.abs(v - first.cOverC0[k]!)).toBeLessThan(1e-6));
    expect(() => traced.outlet({ ...TARGET, c0MgPerL: 0.5 })).toThrow(InputError);
  });
});
