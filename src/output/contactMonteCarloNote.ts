/**
 * What the Monte Carlo does under the plant's PAC contact conditions, in words for the report:
 * the number of draws of each contact carbon (uncertainty.contact_draws, fewer than the equilibrium
 * draws because every draw solves the kinetic model) and that the surface diffusivities are
 * sampled (src/pipeline/contactUncertainty.ts).
 */
import type { PipelineResult } from '../pipeline/pipelineTypes.js';

/** One sentence per carbon whose draws used the contact model; empty otherwise. */
export function contactMonteCarloNote(r: PipelineResult): string[] {
  return r.carbons.flatMap((cr) => {
    const u = cr.uncertainty;
    if (!u?.problem.kinetics || !cr.contact) return [];
    const ds = u.parameters.filter((p) => p.parameter.startsWith('Ds ')).map((p) => `${p.parameter} (${p.basis})`);
    return [`${cr.carbon.name}: under the plant's contact conditions every draw designs the carbon with the contact model (${cr.contact.model}), so this carbon ran ${u.result.draws} draws (uncertainty.contact_draws; kinetic solves are slow). The surface diffusivities are sampled too: ${ds.length ? ds.join('; ') : 'none (relative SD 0)'}. The point estimates are the run's figures under contact.`];
  });
}
