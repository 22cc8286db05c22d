/**
 * The removal model of a PAC carbon under the plant's contact conditions (project key site.pac_contact):
 * a factory of `ContactRemoval` (src/kinetics/contactRemoval.ts: HSDM with IAST at the particle
 * surface, in a plug-flow or stirred contact tank with carbon age) whose components carry the
 * carbon's kinetic data: each target its own Ds and DL, every background competitor (fictive DOC
 * components or an EBC) the shared doc_Ds and doc_DL. Film coefficient kf = DL/R (Sh = 2, common
 * practice for fine suspended particles). `undefined` with equilibrium contact (today's
 * behaviour: the design layer's EquilibriumRemoval).
 *
 * Units: m, g/L, m²/s, s.
 * @throws InputError naming the carbon, component and field when a kinetic quantity is missing
 */
import { InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import type { CompetitionSet, RemovalModelFactory } from '../design/removalModel.js';
import { ContactRemoval, type ContactConditions } from './contactRemoval.js';
import { ContactSolveStore } from './sharedBackground.js';
import type { CarbonParticle, KineticComponent } from './kineticMixture.js';
import type { KineticSolverOptions } from './pacBatch.js';

/**
 * What the contact model needs of a PAC carbon (the project's carbon spec has this shape): its name
 * for messages, its particle radius (m) and density (g/L), Ds and DL by compound id and the shared
 * doc_Ds/doc_DL of the background competitors (m²/s).
 */
export interface PacCarbonKinetics {
  name: string;
  kinetics?: {
    particleRadiusM?: number;
    particleDensityGPerL?: number;
    dsM2PerS: Record<string, number>;
    dlM2PerS: Record<string, number>;
    docDsM2PerS?: number;
    docDlM2PerS?: number;
  };
}

/**
 * The contact model factory of a carbon, or undefined for equilibrium contact. Its models share
 * their solves through `store` (ContactSolveStore: the same background in the design, the daily
 * doses and the sensitivity cases that change a target); a caller that makes factories of one
 * carbon under other conditions (the sensitivity cases on the contact time and carbon age) may
 * give them the same store, whose keys hold the conditions.
 */
export function contactFactory(contact: ContactConditions | undefined, carbon: PacCarbonKinetics, options: KineticSolverOptions = {}, store: ContactSolveStore = new ContactSolveStore()): RemovalModelFactory | undefined {
  if (!contact) return undefined;
  const { particle, target, competitor } = kineticParts(carbon);
  return (sets: readonly CompetitionSet[], docMgPerL: number, background?: readonly FreundlichComponent[]) => new ContactRemoval(
    sets.map((s) => ({ target: target(s.target), competitors: s.competitors.map(competitor) })),
    docMgPerL,
    particle,
    contact,
    background?.map(competitor),
    options,
    true,
    undefined,
    store,
  );
}

/** One competition set with the carbon's kinetic data: [target, ...competitors] and the particle. */
export function kineticMixture(set: CompetitionSet, carbon: PacCarbonKinetics): { components: KineticComponent[]; particle: CarbonParticle } {
  const { particle, target, competitor } = kineticParts(carbon);
  return { components: [target(set.target), ...set.competitors.map(competitor)], particle };
}

function kineticParts(carbon: PacCarbonKinetics): { particle: CarbonParticle; target: (c: FreundlichComponent) => KineticComponent; competitor: (c: FreundlichComponent) => KineticComponent } {
  const k = carbon.kinetics;
  const where = `carbon "${carbon.name}"`;
  if (!k || k.particleRadiusM === undefined || k.particleDensityGPerL === undefined) {
    throw new InputError(`${where} has no particle radius and density; the plant's PAC contact conditions ask for a kinetic dose`, { path: 'carbons[].kinetics' });
  }
  const particle = { radiusM: k.particleRadiusM, densityGPerL: k.particleDensityGPerL };
  const target = (c: FreundlichComponent): KineticComponent => {
    const ds = k.dsM2PerS[c.id];
    const dl = k.dlM2PerS[c.id];
    if (ds === undefined) throw new InputError(`component "${c.id}" has no surface diffusivity Ds on ${where}`, { path: `carbons[].kinetics.Ds.${c.id}` });
    if (dl === undefined) throw new InputError(`component "${c.id}" has no liquid diffusivity DL on ${where}`, { path: `carbons[].kinetics.DL.${c.id}` });
    return { ...c, dsM2PerS: ds, dlM2PerS: dl };
  };
  const competitor = (c: FreundlichComponent): KineticComponent => {
    if (k.docDsM2PerS === undefined || k.docDlM2PerS === undefined) throw new InputError(`the background component "${c.id}" has no ${k.docDsM2PerS === undefined ? 'surface diffusivity (doc_Ds)' : 'liquid diffusivity (doc_DL)'} on ${where}`, { path: `carbons[].kinetics.${k.docDsM2PerS === undefined ? 'doc_Ds' : 'doc_DL'}` });
    return { ...c, dsM2PerS: k.docDsM2PerS, dlM2PerS: k.docDlM2PerS };
  };
  return { particle, target, competitor };
}
