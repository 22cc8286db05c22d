/**
 * The PAC contact results in the JSON shapes of the `contact` and `dose --contact-time` commands
 * (snake_case keys with units, doses in mg/L, times in s), from a mixture read with its kinetic
 * inputs (src/scenario/readKineticInputs.ts).
 *
 *   contactOverTime   → { dose_mg_per_L, times_s, components: [ { id, c_mg_per_L[], removal_fraction[] } ] }
 *   contactSteadyState→ { dose_mg_per_L, components: [ { id, c0_mg_per_L, c_mg_per_L, q_mg_per_g,
 *                          removal_fraction } ], contact_time_s, carbon_age_s, carbon_held_mg_per_L }
 *   contactDose       → { target, dose_mg_per_L, removal_fraction, equilibrium_dose_mg_per_L,
 *                          contact_time_s, carbon_age_s }
 * @throws InputError (missing kinetic inputs named by component and field, bad dose or times),
 *         ComputationError when a kinetic solve fails.
 */
import { InputError } from '../core/errors.js';
import type { KineticMixture } from '../scenario/readKineticInputs.js';
import { prepareKinetics } from '../kinetics/kineticMixture.js';
import { pacBatch, type KineticSolverOptions } from '../kinetics/pacBatch.js';
import { stirredReactor } from '../kinetics/stirredReactor.js';
import { doseUnderContact } from '../kinetics/contactRemoval.js';

export interface ContactOverTimeResult {
  dose_mg_per_L: number;
  times_s: number[];
  components: { id: string; c_mg_per_L: number[]; removal_fraction: number[] }[];
}

export interface ContactSteadyStateResult {
  dose_mg_per_L: number;
  components: { id: string; c0_mg_per_L: number; c_mg_per_L: number; q_mg_per_g: number; removal_fraction: number }[];
  contact_time_s: number;
  carbon_age_s: number;
  carbon_held_mg_per_L: number;
}

export interface ContactDoseResult {
  target: string;
  dose_mg_per_L: number;
  removal_fraction: number;
  equilibrium_dose_mg_per_L: number;
  contact_time_s: number;
  carbon_age_s: number;
}

function doseOf(mixture: KineticMixture, doseMgPerL?: number): number {
  const d = doseMgPerL ?? mixture.doseMgPerL;
  if (d === undefined) throw new InputError('no carbon dose: give --dose or "dose" in the mixture file', { option: '--dose' });
  if (!(d > 0) || !Number.isFinite(d)) throw new InputError(`expected a positive carbon dose, got ${d} mg/L`, { option: '--dose' });
  return d;
}

const removal = (c0: number, c: number) => (c0 > 0 ? 1 - c / c0 : 0);

/** Removal of every component over time in a batch (jar test, plug-flow contact tank). */
export function contactOverTime(mixture: KineticMixture, timesS: readonly number[], doseMgPerL?: number, options: KineticSolverOptions = {}): ContactOverTimeResult {
  const dose = doseOf(mixture, doseMgPerL);
  const pk = prepareKinetics(mixture.components, mixture.particle);
  const r = pacBatch(pk, dose / 1000, timesS, options);
  return {
    dose_mg_per_L: dose,
    times_s: [...timesS],
    components: mixture.components.map((comp, i) => ({
      id: comp.id,
      c_mg_per_L: r.cMgPerL.map((c) => c[i]!),
      removal_fraction: r.cMgPerL.map((c) => removal(comp.c0MgPerL, c[i]!)),
    })),
  };
}

/** The stirred contact reactor at steady state (carbon age defaults to the contact time). */
export function contactSteadyState(mixture: KineticMixture, contactTimeS: number, carbonAgeS?: number, doseMgPerL?: number, options: KineticSolverOptions = {}): ContactSteadyStateResult {
  const dose = doseOf(mixture, doseMgPerL);
  const pk = prepareKinetics(mixture.components, mixture.particle);
  const r = stirredReactor(pk, dose / 1000, contactTimeS, carbonAgeS ?? contactTimeS, options);
  return {
    dose_mg_per_L: dose,
    components: mixture.components.map((comp, i) => ({
      id: comp.id,
      c0_mg_per_L: comp.c0MgPerL,
      c_mg_per_L: r.cMgPerL[i]!,
      q_mg_per_g: r.qMeanMgPerG[i]!,
      removal_fraction: removal(comp.c0MgPerL, r.cMgPerL[i]!),
    })),
    contact_time_s: contactTimeS,
    carbon_age_s: r.carbonAgeS,
    carbon_held_mg_per_L: r.carbonHeldGPerL * 1000,
  };
}

/** Dose for a removal fraction of one target in the stirred contact reactor at steady state. */
export function contactDose(mixture: KineticMixture, targetId: string, removalFraction: number, contactTimeS: number, carbonAgeS?: number, options: KineticSolverOptions = {}): ContactDoseResult {
  const idx = mixture.components.findIndex((c) => c.id === targetId);
  if (idx < 0) throw new InputError(`target "${targetId}" is not in the mixture; its ids are ${mixture.components.map((c) => `"${c.id}"`).join(', ')}`, { option: '--target' });
  const comp = mixture.components[idx]!;
  if (!(comp.K > 0)) throw new InputError(`component "${targetId}" is non-adsorbable (K = 0); no carbon dose removes it`, { option: '--target' });
  if (!(comp.c0MgPerL > 0)) throw new InputError(`component "${targetId}" has c0 = 0; there is nothing to remove`, { option: '--target' });
  const pk = prepareKinetics(mixture.components, mixture.particle);
  const age = carbonAgeS ?? contactTimeS;
  const r = doseUnderContact(pk, idx, removalFraction, { kind: 'stirred', contactTimeS, carbonAgeS: age }, options);
  return {
    target: targetId,
    dose_mg_per_L: r.doseGPerL * 1000,
    removal_fraction: r.removalFraction,
    equilibrium_dose_mg_per_L: r.equilibriumDoseGPerL * 1000,
    contact_time_s: contactTimeS,
    carbon_age_s: age,
  };
}
