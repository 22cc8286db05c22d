/**
 * A validated project (the project file of DESIGN.md, capability 8–10) in internal units:
 * concentrations mg/L, flows m³/d, K in (mg/g)/(mg/L)^(1/n), prices per kg of carbon.
 * File references stay as written (paths relative to the project file); `loadProject` reads them.
 */
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import type { IndicatorCategory } from '../indicators/indicatorRule.js';

export interface SiteSpec {
  name: string;
  /** Design flow, m³/d. */
  flowM3PerD: number;
  /** Effluent DOC of the site water (design value), mg/L. */
  docMgPerL: number;
  /** UV254 of the site water, 1/m (optional). */
  uv254PerM?: number;
  /** CSV of date, DOC and (optionally) flow, relative to the project file. */
  seriesFile?: string;
}

export interface FractionationOptionsSpec {
  /** Number of adsorbable fictive components (2–5). */
  components?: number;
  /** Common Freundlich exponent 1/n of the fictive components. */
  exponent?: number;
  /** Fit the K values instead of a fixed K grid. */
  fitK?: boolean;
}

export type BackgroundSpec =
  /** Fractionate a DOC isotherm (CSV) with the given options. */
  | { kind: 'isotherm'; file: string; options: FractionationOptionsSpec }
  /** A background file (the output of `sorbshare fractionate`). */
  | { kind: 'file'; file: string }
  /** One equivalent background compound per target compound, valid at `docMgPerL`. */
  | { kind: 'ebc'; docMgPerL: number; ebc: Record<string, FreundlichComponent> };

export interface CarbonIsotherm {
  /** K in (mg/g)/(mg/L)^(1/n). */
  K: number;
  oneOverN: number;
}

export interface CarbonSpec {
  name: string;
  type: 'PAC' | 'GAC';
  /** Carbon price per kg, in `currency`. */
  pricePerKg: number;
  currency: string;
  /** Factor on the reference K of every compound and of the background (1 = reference carbon). */
  kFactor: number;
  /** Per-compound single-solute isotherms on this carbon (replace the reference values). */
  isotherms: Record<string, CarbonIsotherm>;
  /** GAC only: bed density, kg/m³. */
  bedDensityKgPerM3?: number;
  /** GAC only: empty-bed contact time, min. */
  ebctMin?: number;
}

export type CalibrationModelName = 'ebc' | 'sebc' | 'fictive-k';

export interface CompoundSpec {
  id: string;
  name: string;
  /** Single-solute Freundlich K on the reference carbon, (mg/g)/(mg/L)^(1/n). */
  K: number;
  oneOverN: number;
  /** Concentration in the site water before carbon, mg/L. */
  c0MgPerL: number;
  molarMassGPerMol?: number;
  jarTests?: { file: string; model: CalibrationModelName };
  /** Effluent limit, mg/L (from the compound or from goals.limits). */
  limitMgPerL?: number;
  indicatorCategory?: IndicatorCategory;
}

export interface GoalsSpec {
  /** Removal goal for every compound without a limit, percent. */
  removalPercent: number;
  indicator?: {
    /** Goal for the mean removal of the indicator set, percent. */
    meanRemovalPercent: number;
    /** Chosen indicator set (ids); absent = all compounds with a category. */
    compounds?: string[];
  };
  /** Dose at which reduced loadings and the indicator check are reported, mg/L (default: the required dose). */
  designDoseMgPerL?: number;
  /** Removal-against-dose sweep, mg/L. */
  sweep: { fromMgPerL: number; toMgPerL: number; points: number };
}

export interface ProjectSpec {
  name: string;
  note?: string;
  site: SiteSpec;
  background: BackgroundSpec;
  carbons: CarbonSpec[];
  compounds: CompoundSpec[];
  goals: GoalsSpec;
}

/** Defaults (common practice, CHECKS.md "Regulation and practice"). */
export const DEFAULT_REMOVAL_PERCENT = 80;
export const DEFAULT_SWEEP = { fromMgPerL: 0.5, toMgPerL: 100, points: 40 } as const;
