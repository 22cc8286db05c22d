/**
 * Stopping a fixed-bed run early (`stopWhen`, used by the whole job to stop at the run end): the
 * run ends at the first segment boundary where the predicate holds, and the curves up to there
 * agree with an uninterrupted run (the segments continue from the last state; only the step
 * sequence differs, so the agreement is to the integrator's tolerance, rtol 1e-4: 1e-3 in c/c0).
 * Invented bed and water (tests/kinetics/fixedBedCases.ts); no source values.
 */
import { describe, expect, it } from 'vitest';
import { simulateFixedBed, STOP_CHECK_POINTS } from '../../src/kinetics/fixedBed.js';
import { siteWater } from './fixedBedCases.js';

describe('fixed bed: stopWhen', () => {
  it('ends at the first segment boundary where the predicate holds; the curves agree with the whole run', () => {
    const opts = { toBedVolumes: 30000, points: 61 };
    const whole = simulateFixedBed(siteWater(4), opts);
    const asked: number[] = [];
    const stopped = simulateFixedBed(siteWater(4), { ...opts, stopWhen: (bv, byId) => {
      asked.push(bv.length);
      expect(Object.keys(byId)).toEqual(['N', 'F1', 'F2', 'T']);
      expect(byId.T!.length).toBe(bv.length);
      return bv[bv.length - 1]! >= 12000;
    } });
    // asked after every STOP_CHECK_POINTS output points (the first point, BV 0, is the start)
    asked.forEach((n, i) => expect(n).toBe(1 + (i + 1) * STOP_CHECK_POINTS));
    const n = stopped.bedVolumes.length;
    expect(n).toBe(asked.at(-1));
    expect(stopped.bedVolumes[n - 1]).toBeGreaterThanOrEqual(12000);
    expect(stopped.bedVolumes[n - 1 - STOP_CHECK_POINTS]).toBeLessThan(12000);
    expect(stopped.bedVolumes).toEqual(whole.bedVolumes.slice(0, n));
    for (const [k, c] of stopped.components.entries()) {
      expect(c.cOverC0.length).toBe(n);
      c.cOverC0.forEach((v, i) => expect(Math.abs(v - whole.components[k]!.cOverC0[i]!)).toBeLessThan(1e-3));
    }
    expect(stopped.massBalanceError).toBeLessThan(1e-5);
  });
});
