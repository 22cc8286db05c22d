/**
 * Grid convergence of the fixed-bed model on the invented demo water (fixtures/column/demo-water.json:
 * non-adsorbable part, 4 fictive DOC components, the trace targets), EBCT 20 min, 2 m, ε = 0.4:
 * the default grid (60 cells × 5 grain points) against twice the points in both (120 × 10).
 * Expected values: the model against itself on a finer grid (a self-convergence check, no source);
 * the tolerance 0.5 % is the issue's acceptance figure.
 *
 * Checked: the first targets through (HCT, CAN, DCF, whose goals govern the demo's run) and the
 * two stronger DOC fractions F3 and F4, at c/c0 0.1 and 0.5. Not checked: the two weakest DOC
 * fractions F1 and F2 (through within the first ~100 and ~500 BV, while the grains are loaded in a
 * thin shell that 5 grain points do not resolve; F1's BV at 0.5 moves by about 20 % with 10 points).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { simulateFixedBed, type FixedBedResult } from '../../src/kinetics/fixedBed.js';
import type { FixedBedComponent } from '../../src/kinetics/fixedBedInput.js';
import { readKineticMixture } from '../../src/scenario/readKineticInputs.js';

const KEEP = ['F0', 'F1', 'F2', 'F3', 'F4', 'HCT', 'CAN', 'DCF'];

describe('fixed bed: grid convergence on the demo water', () => {
  let coarse: FixedBedResult, fine: FixedBedResult;
  beforeAll(() => {
    const mixture = readKineticMixture(JSON.parse(readFileSync(join(process.cwd(), 'fixtures/column/demo-water.json'), 'utf8')));
    const p = mixture.particle!;
    const components: FixedBedComponent[] = mixture.components.filter((c) => KEEP.includes(c.id)).map((c) => {
      const out: FixedBedComponent = { id: c.id, c0MgPerL: c.c0MgPerL, K: c.K, oneOverN: c.oneOverN };
      if (c.dsM2PerS !== undefined) out.dsM2PerS = c.dsM2PerS;
      if (c.dlM2PerS !== undefined) out.dlM2PerS = c.dlM2PerS;
      return out;
    });
    const input = { components, bed: { ebctS: 1200, bedDepthM: 2, porosity: 0.4, particleRadiusM: p.radiusM, particleDensityKgPerM3: p.densityGPerL, temperatureC: 12 } };
    // 60 000 BV covers c/c0 0.5 of every checked component (DCF the last, near 57 500 BV)
    coarse = simulateFixedBed(input, { toBedVolumes: 60000 });
    fine = simulateFixedBed(input, { toBedVolumes: 60000, cells: 120, interiorPoints: 10 });
  }, 600_000);

  it('twice the axial cells and grain points change BV at c/c0 0.1 and 0.5 by < 0.5 % (targets, F3, F4)', () => {
    expect(coarse.grid).toEqual({ cells: 60, interiorPoints: 5 });
    expect(fine.grid).toEqual({ cells: 120, interiorPoints: 10 });
    const at = (r: FixedBedResult, id: string, k: number) => r.components.find((c) => c.id === id)!.breakthrough[k]!.bedVolumes;
    for (const id of ['HCT', 'CAN', 'DCF', 'F3', 'F4']) for (const k of [0, 2]) { // levels 0.1, 0.2, 0.5: indices 0 and 2
      const a = at(coarse, id, k), b = at(fine, id, k);
      expect(a, `${id} level ${k}`).not.toBeNull();
      expect(Math.abs(a! / b! - 1), `${id} at level index ${k}: ${a} against ${b}`).toBeLessThan(0.005);
    }
    expect(coarse.massBalanceError).toBeLessThan(1e-5);
    expect(fine.massBalanceError).toBeLessThan(1e-5);
  });
});
