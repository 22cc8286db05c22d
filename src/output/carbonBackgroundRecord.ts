/**
 * run.json records of a carbon's background (capability 21): the resolved input
 * (`inputs.carbons[i].background`) and the background the carbon used
 * (`results.carbons[i].background`: own fictive components or the reference carbon's with the
 * carbon's K factor), in snake_case.
 */
import type { CarbonBackgroundSpec } from '../project/projectTypes.js';
import type { CarbonBackground } from '../pipeline/carbonBackgroundStep.js';

export function carbonBackgroundInputRecord(b: CarbonBackgroundSpec): Record<string, unknown> {
  return b.kind === 'isotherm'
    ? { kind: 'isotherm', file: b.file, fractionation: { components: b.options.components ?? null, exponent: b.options.exponent ?? null, fit_k: b.options.fitK ?? null } }
    : { kind: 'file', file: b.file };
}

export function carbonBackgroundRecord(cb: CarbonBackground): Record<string, unknown> {
  const own = cb.source !== 'K factor';
  return {
    source: cb.source,
    description: cb.description,
    background_K_factor: cb.backgroundKFactor,
    // the carbon's own fictive components; the reference carbon's are in results.background
    background: own ? cb.background ?? null : null,
    warnings: cb.warnings,
  };
}
