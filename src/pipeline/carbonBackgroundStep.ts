/**
 * The background (competing DOC) of one carbon (capability 21). A carbon with its own DOC (and
 * UV254) isotherm in the project (`carbons[i].background`) has it fractionated for itself
 * (adsorption analysis, src/fractionation, the same step as the project's background) and its
 * fictive components are used as fitted; every other carbon uses the project's background with
 * its K factor f on every background K (src/design/competitionSystem.ts: the reference carbon at f times the
 * dose). The competition systems, the DOC/UV254 surrogates and set-points, the doses, the Monte
 * Carlo and the GAC fixed bed of the carbon all take their background from here.
 *
 * Units: K in (mg/g)/(mg/L)^(1/n); DOC mg/L.
 */
import { InputError } from '../core/errors.js';
import type { BackgroundFile } from '../fractionation/backgroundFile.js';
import type { FractionateResult } from '../fractionation/fractionate.js';
import type { CarbonSpec } from '../project/projectTypes.js';
import type { CsvTable } from '../tables/csvTable.js';
import { backgroundStep, type BackgroundStep } from './backgroundStep.js';

export interface CarbonBackground {
  /** 'own isotherm' / 'own file': the carbon's own; 'K factor': the project's background times the carbon's K factor. */
  source: 'own isotherm' | 'own file' | 'K factor';
  /** The fictive components (absent with an EBC project background). */
  background?: BackgroundFile;
  /** Factor on the K of `background` for this carbon: the carbon's K factor, or 1 for its own. */
  backgroundKFactor: number;
  /** The carbon's own fractionation with its fit details (own isotherm only). */
  fractionation?: FractionateResult;
  /** Plain words for the report: which background the carbon uses. */
  description: string;
  warnings: string[];
}

/** The tables a carbon's own background was read from (by carbon name; src/io/loadProject.ts). */
export interface CarbonBackgroundInput {
  isotherm?: CsvTable;
  backgroundFile?: BackgroundFile;
}

/**
 * @param carbonIndex index of the carbon in the project (for the JSON path of errors)
 * @param reference   the project's background step
 * @param own         the carbon's own isotherm table or background file, when it has one
 * @throws InputError when the carbon's own table was not loaded or its data are bad; ComputationError if its fit fails
 */
export function carbonBackground(carbon: CarbonSpec, carbonIndex: number, reference: BackgroundStep, own?: CarbonBackgroundInput): CarbonBackground {
  const spec = carbon.background;
  if (!spec) {
    const f = carbon.kFactor;
    const description = reference.background
      ? (f === 1 ? "the project's background (reference carbon, K factor 1)" : `K factor ${f} on the reference carbon's background`)
      : `the project's EBCs${f === 1 ? '' : ` with K factor ${f}`}`;
    const out: CarbonBackground = { source: 'K factor', backgroundKFactor: f, description, warnings: [] };
    if (reference.background) out.background = reference.background;
    return out;
  }
  const path = `carbons[${carbonIndex}].background.${spec.kind}`;
  if (spec.kind === 'isotherm' ? !own?.isotherm : !own?.backgroundFile) throw new InputError(`the carbon's own ${spec.kind === 'isotherm' ? 'DOC isotherm table' : 'background file'} was not loaded`, { path });
  const step = backgroundStep(spec, own?.isotherm, own?.backgroundFile);
  const b = step.background!;
  const adsorbable = b.components.filter((c) => c.K > 0).length;
  const description = spec.kind === 'isotherm'
    ? `its own DOC isotherm (${spec.file}), fractionated into ${adsorbable} adsorbable fictive components`
    : `its own background file (${spec.file}), ${adsorbable} adsorbable fictive components`;
  const out: CarbonBackground = { source: spec.kind === 'isotherm' ? 'own isotherm' : 'own file', background: b, backgroundKFactor: 1, description, warnings: step.warnings };
  if (step.fractionation) out.fractionation = step.fractionation;
  return out;
}
