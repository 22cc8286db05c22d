/** Shared inputs of the fixed-bed tests (invented beds and waters; only the equations are checked). */
import type { FixedBedComponent, FixedBedInput, FixedBedSpec } from '../../src/kinetics/fixedBedInput.js';

/** An invented GAC bed: EBCT 10 min, 1 m deep, ε = 0.4, grains 0.5 mm radius, 800 kg/m³. */
export const BED: FixedBedSpec = { ebctS: 600, bedDepthM: 1, porosity: 0.4, particleRadiusM: 0.5e-3, particleDensityKgPerM3: 800 };

/** Invented background: 2 fictive DOC components (1/n = 0.2) and a non-adsorbable part, scaled to DOC. */
export function background(docMgPerL: number): FixedBedComponent[] {
  return [
    { id: 'N', c0MgPerL: 0.4 * docMgPerL, K: 0, oneOverN: 1, doc: true, uv254PerMgPerL: 1 },
    { id: 'F1', c0MgPerL: 0.35 * docMgPerL, K: 15, oneOverN: 0.2, dsM2PerS: 2e-15, kfMPerS: 2e-5, doc: true, uv254PerMgPerL: 2.5 },
    { id: 'F2', c0MgPerL: 0.25 * docMgPerL, K: 80, oneOverN: 0.2, dsM2PerS: 2e-15, kfMPerS: 2e-5, doc: true, uv254PerMgPerL: 3 },
  ];
}

/** An invented trace target at 1 µg/L. */
export const TARGET: FixedBedComponent = { id: 'T', c0MgPerL: 1e-3, K: 110, oneOverN: 0.3, dsM2PerS: 1e-14, kfMPerS: 3e-5 };

export function siteWater(docMgPerL: number, target: FixedBedComponent = TARGET): FixedBedInput {
  return { components: [...background(docMgPerL), target], bed: BED };
}
