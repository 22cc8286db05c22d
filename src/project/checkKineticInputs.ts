/**
 * Every kinetic quantity the plant's PAC contact conditions need, present on every PAC carbon:
 * particle radius and density, Ds and DL of every compound, and the Ds and DL shared by the
 * background competitors. Nothing is needed with `equilibrium` contact. A Ds that a kinetic jar test
 * fits (`kinetics.kinetic_tests`) need not be given.
 * @throws InputError naming the carbon, the component and the field (its JSON path)
 */
import { InputError } from '../core/errors.js';
import type { CarbonSpec, CompoundSpec } from './projectTypes.js';
import type { PacContactSpec } from './readPacContact.js';

export function checkKineticInputs(contact: PacContactSpec | undefined, carbons: readonly CarbonSpec[], compounds: readonly CompoundSpec[]): void {
  if (!contact) return;
  const why = 'the plant\'s PAC contact conditions (site.pac_contact) ask for a kinetic dose';
  carbons.forEach((c, i) => {
    if (c.type !== 'PAC') return;
    const p = `carbons[${i}].kinetics`;
    const k = c.kinetics;
    if (!k) throw new InputError(`carbon "${c.name}" has no kinetic data; ${why}: give "kinetics": { "particle_radius", "particle_density", "Ds", "DL", "doc_Ds", "doc_DL" }`, { path: p });
    if (k.particleRadiusM === undefined) throw new InputError(`carbon "${c.name}" has no particle radius; ${why} (e.g. "particle_radius": "10 um")`, { path: `${p}.particle_radius` });
    if (k.particleDensityGPerL === undefined) throw new InputError(`carbon "${c.name}" has no particle density; ${why} (e.g. "particle_density": "650 kg/m3")`, { path: `${p}.particle_density` });
    for (const comp of compounds) {
      if (k.dsM2PerS[comp.id] === undefined && k.tests?.ds[comp.id] === undefined) throw new InputError(`component "${comp.id}" has no surface diffusivity Ds on carbon "${c.name}"; ${why} (e.g. "Ds": { "${comp.id}": "2e-17 m2/s" })`, { path: `${p}.Ds.${comp.id}` });
      if (k.dlM2PerS[comp.id] === undefined) throw new InputError(`component "${comp.id}" has no liquid diffusivity DL on carbon "${c.name}"; ${why} (e.g. "DL": { "${comp.id}": "7e-10 m2/s" })`, { path: `${p}.DL.${comp.id}` });
    }
    if (k.docDsM2PerS === undefined && k.tests?.docDs === undefined) throw new InputError(`the background (DOC) components have no surface diffusivity on carbon "${c.name}"; ${why} (e.g. "doc_Ds": "5e-18 m2/s")`, { path: `${p}.doc_Ds` });
    if (k.docDlM2PerS === undefined) throw new InputError(`the background (DOC) components have no liquid diffusivity on carbon "${c.name}"; ${why} (e.g. "doc_DL": "5e-10 m2/s")`, { path: `${p}.doc_DL` });
  });
}
