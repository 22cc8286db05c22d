/**
 * The contact-conditions figures of a PAC carbon in the run record (run.json) and in the
 * `run --json` summary: the required dose under the plant's contact conditions (the run's
 * `required_dose_mg_per_L`), the equilibrium dose beside it and their ratio, and the contact time
 * and carbon age in s. Absent (no key) with equilibrium contact, so such runs are unchanged.
 */
import type { CarbonResult } from '../pipeline/pipelineTypes.js';

export interface ContactSummaryJson {
  equilibrium_dose_mg_per_L: number | null;
  dose_ratio_contact_to_equilibrium: number | null;
  contact: { contact_time_s: number; carbon_age_s: number; reactor: string; model: string };
}

/** The `run --json` keys of one carbon ({} with equilibrium contact). */
export function contactSummary(cr: CarbonResult): Partial<ContactSummaryJson> {
  const c = cr.contact;
  if (!c) return {};
  return {
    equilibrium_dose_mg_per_L: c.equilibriumDoseMgPerL,
    dose_ratio_contact_to_equilibrium: c.doseRatio,
    contact: { contact_time_s: c.contactTimeS, carbon_age_s: c.carbonAgeS, reactor: c.reactor, model: c.model },
  };
}

/** The run.json `contact` entry of one carbon (null with equilibrium contact). */
export function contactRecord(cr: CarbonResult): (ContactSummaryJson & { equilibrium_design: unknown; kinetic_inputs: unknown }) | null {
  const c = cr.contact;
  if (!c) return null;
  const k = cr.carbon.kinetics;
  const kinetic_inputs = k ? {
    particle_radius_m: k.particleRadiusM ?? null, particle_density_g_per_L: k.particleDensityGPerL ?? null,
    Ds_m2_per_s: k.dsM2PerS, DL_m2_per_s: k.dlM2PerS, doc_Ds_m2_per_s: k.docDsM2PerS ?? null, doc_DL_m2_per_s: k.docDlM2PerS ?? null,
  } : null;
  return { ...(contactSummary(cr) as ContactSummaryJson), equilibrium_design: c.equilibrium, kinetic_inputs };
}
