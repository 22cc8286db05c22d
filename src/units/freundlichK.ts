/**
 * Freundlich K in the internal unit pair (mg/g)/(mg/L)^(1/n).
 *
 *   K' = K · f_q / f_c^(1/n)
 *
 * with f_q the factor from the given loading unit to mg/g and f_c from the given concentration
 * unit to mg/L (Chen, Xing & McGill 1999, J. Environ. Qual. 28(5):1422–1428: the factor
 * A^(1 − 1/n) when one amount unit changes on both axes). Molar units (mmol/g, umol/L, …) are
 * converted with the molar mass M in g/mol (1 mmol = M mg).
 *
 * Worked value (CHECKS.md): 28.0 (mg/g)(L/mg)^0.62 = 386.51 (µg/g)(L/µg)^0.62
 * = 4.3864 (mmol/g)(L/mmol)^0.62 for M = 131.39 g/mol.
 */
import { InputError } from '../core/errors.js';
import { kindOfUnit, unitFactor } from './unitFactor.js';

export interface KUnit {
  /** Loading unit, e.g. "mg/g", "ug/mg", "mmol/g". Default mg/g. */
  q?: string;
  /** Concentration unit, e.g. "mg/L", "ug/L", "umol/L". Default mg/L. */
  c?: string;
}

/** Factor from a loading unit (mass- or molar-based) to mg/g. */
export function loadingFactorToMgPerG(qUnit: string, molarMassGPerMol?: number): number {
  const kind = kindOfUnit(qUnit, ['massLoading', 'molarLoading']);
  if (kind === 'massLoading') return unitFactor(qUnit, kind);
  if (kind === 'molarLoading') return unitFactor(qUnit, kind) * requireMolarMass(molarMassGPerMol, qUnit);
  throw new InputError(`unit "${qUnit}" is not a loading; expected mass or moles per carbon mass such as mg/g, ug/mg or mmol/g`);
}

/** Factor from a concentration unit (mass- or molar-based) to mg/L. */
export function concentrationFactorToMgPerL(cUnit: string, molarMassGPerMol?: number): number {
  const kind = kindOfUnit(cUnit, ['massConcentration', 'molarConcentration']);
  if (kind === 'massConcentration') return unitFactor(cUnit, kind);
  if (kind === 'molarConcentration') return unitFactor(cUnit, kind) * requireMolarMass(molarMassGPerMol, cUnit);
  throw new InputError(`unit "${cUnit}" is not a concentration; expected e.g. ng/L, ug/L, mg/L or umol/L`);
}

function requireMolarMass(m: number | undefined, unit: string): number {
  if (m === undefined) throw new InputError(`unit "${unit}" is molar: give "molar_mass" in g/mol`);
  if (!(m > 0) || !Number.isFinite(m)) throw new InputError(`molar_mass must be a positive number in g/mol, got ${m}`);
  return m;
}

/**
 * Convert K from (q unit)/(c unit)^(1/n) to (mg/g)/(mg/L)^(1/n).
 * @param K           Freundlich K in the given unit pair (≥ 0; 0 means non-adsorbable)
 * @param oneOverN    Freundlich exponent 1/n (> 0)
 * @param unit        the unit pair; each defaults to mg/g and mg/L
 * @param molarMassGPerMol needed only when a unit is molar
 */
export function freundlichKToInternal(K: number, oneOverN: number, unit: KUnit = {}, molarMassGPerMol?: number): number {
  if (unit.q === undefined && unit.c === undefined) return K; // already (mg/g)/(mg/L)^(1/n): f_q = f_c = 1
  const fq = loadingFactorToMgPerG(unit.q ?? 'mg/g', molarMassGPerMol);
  const fc = concentrationFactorToMgPerL(unit.c ?? 'mg/L', molarMassGPerMol);
  return (K * fq) / Math.pow(fc, oneOverN); // Chen et al. 1999: K' = K · f_q / f_c^(1/n)
}

/** The inverse: K in (mg/g)/(mg/L)^(1/n) expressed in another unit pair. */
export function freundlichKFromInternal(Kinternal: number, oneOverN: number, unit: KUnit = {}, molarMassGPerMol?: number): number {
  const fq = loadingFactorToMgPerG(unit.q ?? 'mg/g', molarMassGPerMol);
  const fc = concentrationFactorToMgPerL(unit.c ?? 'mg/L', molarMassGPerMol);
  return (Kinternal * Math.pow(fc, oneOverN)) / fq;
}
