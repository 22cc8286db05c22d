/**
 * The PAC contact-kinetics part of a Monte Carlo problem (src/uncertainty/kineticUncertainty.ts):
 * lognormal Ds around the point value, drawn after every other parameter so the isotherm and
 * background draws of a seed are unchanged, and validation naming the field.
 */
import { describe, expect, it } from 'vitest';
import { compileDrawModel, sampleParameters } from '../../src/uncertainty/monteCarloDraw.js';
import { sampleKinetics, type UncertainKinetics } from '../../src/uncertainty/kineticUncertainty.js';
import { validateMonteCarloProblem, type MonteCarloProblem } from '../../src/uncertainty/monteCarloProblem.js';
import { NormalSampler } from '../../src/uncertainty/distributions.js';
import { chunkRng } from '../../src/uncertainty/prng.js';
import { InputError } from '../../src/core/errors.js';

const KINETICS: UncertainKinetics = {
  particle: { radiusM: 12e-6, densityGPerL: 650 },
  contact: { kind: 'plug-flow', contactTimeS: 1800 },
  targets: [{ dsM2PerS: 3e-15, dlM2PerS: 7e-10, dsLnSd: 0.3 }],
  background: { dsM2PerS: 1e-15, dlM2PerS: 4e-10, dsLnSd: 0.2 },
  solver: { interiorPoints: 6, rtol: 1e-6 },
};

function problem(kinetics?: UncertainKinetics): MonteCarloProblem {
  return {
    targets: [{ id: 'CBZ', K: 150, oneOverN: 0.3, c0MgPerL: 4.5e-4, removalGoal: 0.8, KRelSd: 0.2 }],
    background: [
      { id: 'N', K: 0, oneOverN: 1, fraction: 0.14 },
      { id: 'W', K: 2, oneOverN: 0.2, fraction: 0.34, fractionRelSd: 0.1 },
      { id: 'S', K: 40, oneOverN: 0.2, fraction: 0.52, fractionRelSd: 0.1 },
    ],
    docMgPerL: 8,
    docRelSd: 0.05,
    ...(kinetics ? { kinetics } : {}),
  };
}

describe('kinetic part of the Monte Carlo problem', () => {
  it('leaves the isotherm, background and DOC draws of a seed unchanged (the Ds normals come last)', () => {
    const eq = compileDrawModel(problem());
    const kin = compileDrawModel(problem(KINETICS));
    const a = new NormalSampler(chunkRng(11, 0));
    const b = new NormalSampler(chunkRng(11, 0));
    for (let i = 0; i < 20; i++) {
      const pa = sampleParameters(eq, a);
      const pb = sampleParameters(kin, b);
      expect(pb.targets).toEqual(pa.targets);
      expect(pb.background).toEqual(pa.background);
      expect(pb.docMgPerL).toBe(pa.docMgPerL);
      expect(pa.kinetics).toBeUndefined();
      expect(pb.kinetics!.targetDs[0]).toBeGreaterThan(0);
      a.next(); a.next(); // the two normals the kinetic draw used (one target, the background)
    }
    // with every deviation zero the draw is the point value exactly
    expect(sampleParameters(kin, undefined).kinetics).toEqual({ targetDs: [3e-15], backgroundDs: 1e-15 });
  }, 120_000);

  it('draws ln Ds normal around ln of the point value with the given SD', () => {
    const normal = new NormalSampler(chunkRng(2026, 0));
    const n = 4000;
    const ln: number[] = [];
    for (let i = 0; i < n; i++) ln.push(Math.log(sampleKinetics(KINETICS, () => normal.next()).targetDs[0]! / 3e-15));
    const mean = ln.reduce((s, x) => s + x, 0) / n;
    const sd = Math.sqrt(ln.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1));
    // standard errors of a normal sample (closed form): mean σ/√n = 0.0047, SD σ/√(2(n−1)) = 0.0034; 5 of each
    expect(Math.abs(mean)).toBeLessThan(5 * 0.3 / Math.sqrt(n));
    expect(Math.abs(sd - 0.3)).toBeLessThan(5 * 0.3 / Math.sqrt(2 * (n - 1)));
  });

  it('refuses a kinetic part that does not match the targets or has a bad value, naming the field', () => {
    const refused = (k: UncertainKinetics, path: string) => {
      let err: unknown;
      try { validateMonteCarloProblem(problem(k)); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).location.path).toBe(path);
    };
    refused({ ...KINETICS, targets: [] }, 'kinetics.targets');
    refused({ ...KINETICS, targets: [{ dsM2PerS: -1, dlM2PerS: 7e-10 }] }, 'kinetics.targets[0].dsM2PerS');
    refused({ ...KINETICS, background: { dsM2PerS: 1e-15, dlM2PerS: 4e-10, dsLnSd: -0.1 } }, 'kinetics.background.dsLnSd');
    refused({ ...KINETICS, particle: { radiusM: 0, densityGPerL: 650 } }, 'kinetics.particle.radiusM');
  });
});
