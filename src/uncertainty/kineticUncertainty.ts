/**
 * The PAC contact-kinetics part of a Monte Carlo problem (plain data, so it travels to worker
 * threads): the particle, the contact conditions, each target's surface and liquid diffusivity,
 * the ones shared by the background (fictive DOC) components, and the spread of every Ds.
 *
 * Sampling: every Ds is lognormal with the given value as median, ln Ds = ln Ds_point + σ·z, σ
 * the SD of ln Ds (from a fitted 95 % interval, σ = ln(hi/lo)/(2·1.96), or from a relative SD,
 * σ = √(ln(1 + cv²))). One normal per target and one for the background are drawn in every draw,
 * after the isotherm and background parameters (so the equilibrium streams are unchanged); with
 * every σ zero the draw is the point estimate exactly. DL (the film, kf = DL/R, Sh = 2, common
 * practice) and the particle are not sampled.
 *
 * Units: m, g/L (= kg/m³), m²/s, s.
 */
import { InputError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import type { CompetitionSet, RemovalModelFactory } from '../design/removalModel.js';
import { ContactRemoval, type ContactConditions } from '../kinetics/contactRemoval.js';
import type { KineticComponent } from '../kinetics/kineticMixture.js';

export interface UncertainDiffusivity {
  /** Surface diffusivity (point value, the median of the draws), m²/s. */
  dsM2PerS: number;
  /** Liquid diffusivity (film coefficient kf = DL/R), m²/s; not sampled. */
  dlM2PerS: number;
  /** SD of ln Ds (0 or absent: not sampled). */
  dsLnSd?: number;
}

export interface UncertainKinetics {
  particle: { radiusM: number; densityGPerL: number };
  contact: ContactConditions;
  /** One per target of the problem, in the same order. */
  targets: UncertainDiffusivity[];
  /** Shared by every background component. */
  background: UncertainDiffusivity;
  /** Kinetic solver settings (collocation points, tolerance); the run's, so the point draw is the run. */
  solver?: { interiorPoints?: number; rtol?: number };
}

/** Ds of one draw: each target's (problem order) and the background's, m²/s. */
export interface DrawnKinetics {
  targetDs: number[];
  backgroundDs: number;
}

function positive(v: unknown, path: string, what: string): void {
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) throw new InputError(`expected ${what} as a finite number > 0, got ${JSON.stringify(v)}`, { path });
}

function checkDiffusivity(d: UncertainDiffusivity, path: string): void {
  positive(d.dsM2PerS, `${path}.dsM2PerS`, 'a surface diffusivity in m²/s');
  positive(d.dlM2PerS, `${path}.dlM2PerS`, 'a liquid diffusivity in m²/s');
  const s = d.dsLnSd ?? 0;
  if (typeof s !== 'number' || !Number.isFinite(s) || s < 0) throw new InputError(`expected the SD of ln Ds as a finite number ≥ 0, got ${JSON.stringify(s)}`, { path: `${path}.dsLnSd` });
}

/** @throws InputError naming the path (`kinetics.…`) of the first bad value */
export function validateUncertainKinetics(k: UncertainKinetics, targetCount: number): void {
  positive(k.particle?.radiusM, 'kinetics.particle.radiusM', 'the particle radius in m');
  positive(k.particle?.densityGPerL, 'kinetics.particle.densityGPerL', 'the particle density in g/L');
  if (!k.contact || (k.contact.kind !== 'plug-flow' && k.contact.kind !== 'stirred')) throw new InputError('expected contact conditions of kind "plug-flow" or "stirred"', { path: 'kinetics.contact' });
  if (!Array.isArray(k.targets) || k.targets.length !== targetCount) throw new InputError(`expected one kinetic entry per target (${targetCount})`, { path: 'kinetics.targets' });
  k.targets.forEach((t, i) => checkDiffusivity(t, `kinetics.targets[${i}]`));
  checkDiffusivity(k.background, 'kinetics.background');
}

/** Ds of one draw; `z` gives standard normals (targets first, then the background). */
export function sampleKinetics(k: UncertainKinetics, z: () => number): DrawnKinetics {
  const draw = (d: UncertainDiffusivity) => { const zi = z(); const s = d.dsLnSd ?? 0; return s === 0 ? d.dsM2PerS : d.dsM2PerS * Math.exp(s * zi); };
  const targetDs = k.targets.map(draw);
  return { targetDs, backgroundDs: draw(k.background) };
}

/** The point values (every deviation zero). */
export function pointKinetics(k: UncertainKinetics): DrawnKinetics {
  return { targetDs: k.targets.map((t) => t.dsM2PerS), backgroundDs: k.background.dsM2PerS };
}

/**
 * The contact removal model (src/kinetics/contactRemoval.ts) of one draw: each target with its
 * drawn Ds, the competitors and the background with the drawn background Ds.
 * @param targetIds the problem's target ids in order (the sets are matched by id)
 */
export function kineticDrawFactory(k: UncertainKinetics, targetIds: readonly string[], d: DrawnKinetics): RemovalModelFactory {
  const bg = (c: FreundlichComponent): KineticComponent => ({ ...c, dsM2PerS: d.backgroundDs, dlM2PerS: k.background.dlM2PerS });
  const target = (c: FreundlichComponent): KineticComponent => {
    const i = targetIds.indexOf(c.id);
    if (i < 0) throw new InputError(`"${c.id}" is not a target of the Monte Carlo problem`, { path: 'kinetics.targets' });
    return { ...c, dsM2PerS: d.targetDs[i]!, dlM2PerS: k.targets[i]!.dlM2PerS };
  };
  const solver = { ...(k.solver?.interiorPoints !== undefined ? { interiorPoints: k.solver.interiorPoints } : {}), ...(k.solver?.rtol !== undefined ? { rtol: k.solver.rtol } : {}) };
  return (sets: readonly CompetitionSet[], docMgPerL: number, background?: readonly FreundlichComponent[]) => new ContactRemoval(
    sets.map((s) => ({ target: target(s.target), competitors: s.competitors.map(bg) })),
    docMgPerL, k.particle, k.contact, background?.map(bg), solver,
  );
}
